using System.Collections.Concurrent;
using Lumen.Cie;
using Lumen.Spectra;

namespace Lumen.Colorimetry;

/// <summary>CIE tristimulus integration (CIE 15 summation).</summary>
public static class Colorimeter
{
    /// <summary>Maximum luminous efficacy for photopic vision, K_m = 683.002 lm/W (CIE ILV 17-730; docs/methods/colorimetry.md §1.2).</summary>
    public const double KmLumensPerWatt = 683.002;

    /// <summary>Raw sums Σ S·x̄·Δλ, Σ S·ȳ·Δλ, Σ S·z̄·Δλ (k = 1) of samples on a regular grid.</summary>
    /// <param name="samples">Spectrum on a regular whole-nm grid.</param>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer.</param>
    /// <returns>The unnormalised tristimulus values.</returns>
    public static Tristimulus RawSums(RegularSamples samples, Observer observer)
    {
        ArgumentNullException.ThrowIfNull(samples);
        var w = CmfWeights(observer, samples.StartNm, samples.StepNm, samples.Values.Length);
        return new Tristimulus(
            SpectralSum.Dot(samples.Values, w.Weights[0]),
            SpectralSum.Dot(samples.Values, w.Weights[1]),
            SpectralSum.Dot(samples.Values, w.Weights[2]));
    }

    private static readonly ConcurrentDictionary<(Observer, int, int, int), SpectralWeights> CmfCache = new();

    /// <summary>Colour-matching-function weights (x̄Δλ, ȳΔλ, z̄Δλ) of an observer on a grid, cached without allocation per call.</summary>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer.</param>
    /// <param name="startNm">First wavelength of the grid.</param>
    /// <param name="stepNm">Grid step, whole nm (1 or 5).</param>
    /// <param name="count">Number of points.</param>
    /// <returns>Three weight arrays.</returns>
    internal static SpectralWeights CmfWeights(Observer observer, int startNm, int stepNm, int count)
    {
        if (CmfCache.TryGetValue((observer, startNm, stepNm, count), out var w)) return w;
        var (x, y, z) = CieTables.CmfColumns(observer);
        w = SpectralWeights.For(CieTables.ColorMatchingFunctions(observer), [x, y, z], startNm, stepNm, count);
        CmfCache[(observer, startNm, stepNm, count)] = w;
        return w;
    }

    /// <summary>Relative tristimulus values, normalised so that Y = 100 (CIE 15, k = 100/ΣSȳΔλ).</summary>
    /// <param name="samples">Spectrum on a regular whole-nm grid.</param>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer.</param>
    /// <returns>X, Y = 100, Z; NaN components for a spectrum with ΣSȳ = 0.</returns>
    public static Tristimulus Relative(RegularSamples samples, Observer observer)
    {
        var raw = RawSums(samples, observer);
        return raw.Y == 0 ? new Tristimulus(double.NaN, double.NaN, double.NaN) : raw.NormalisedToY(100);
    }

    /// <summary>Relative tristimulus values (Y = 100) of any spectrum, resampled by the project's one policy.</summary>
    /// <param name="spectrum">The measured spectrum (any grid the resampler accepts).</param>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer.</param>
    /// <returns>X, Y = 100, Z.</returns>
    public static Tristimulus Relative(Spectrum spectrum, Observer observer) => Relative(Resampler.ForCieSums(spectrum), observer);
}
