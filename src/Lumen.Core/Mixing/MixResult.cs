using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Mixing;

/// <summary>The channel levels found for a target, and what the mix gives.</summary>
/// <param name="Channels">Channel names, in order.</param>
/// <param name="Levels">Level of each channel, 0–1 (a channel's full output = 1).</param>
/// <param name="Target">The target chromaticity (CIE 1931 2°).</param>
/// <param name="Chromaticity">Chromaticity of the mix (CIE 1931 2°).</param>
/// <param name="Cct">CCT and Duv of the mix.</param>
/// <param name="DeltaUPrimeVPrime">Δu′v′ of the mix to the target.</param>
/// <param name="Reachable">True when the target lies inside the channels' gamut (within the tolerance).</param>
/// <param name="Objective">The objective optimised.</param>
/// <param name="ObjectiveValue">Its value at the mix (NaN when it could not be computed).</param>
/// <param name="Metrics">The mix's results: Ra, R9, Rf, Rg, LER (lm/W), relative output (0–1), melanopic DER, SSI to a matched spectrum.</param>
/// <param name="Method">How the levels were found, in words.</param>
/// <param name="Iterations">Objective evaluations used by the optimiser (0 for an exact solution).</param>
/// <param name="Warnings">Plain-language warnings.</param>
public sealed record MixResult(IReadOnlyList<string> Channels, IReadOnlyList<double> Levels, Chromaticity Target, Chromaticity Chromaticity, CctResult Cct,
    double DeltaUPrimeVPrime, bool Reachable, MixObjective Objective, double ObjectiveValue, MixMetrics Metrics, string Method, int Iterations, IReadOnlyList<string> Warnings);
