using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Descriptors;
using Lumen.Photometry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Analysis;

/// <summary>Everything Lumen computed for one spectrum; every writer, plot and report reads this.</summary>
/// <param name="Name">Spectrum name: header text, row ID or <c>stem#k</c>.</param>
/// <param name="Origin">Source and column.</param>
/// <param name="Unit">Unit of the input values.</param>
/// <param name="Observer">Observer of <see cref="Tristimulus"/> and <see cref="Chromaticity"/>.</param>
/// <param name="Tristimulus">Relative tristimulus values, Y = 100.</param>
/// <param name="AbsoluteTristimulus">Absolute tristimulus values (k = K_m = 683.002 lm/W; Y in lx, cd/m², cd or lm as the unit gives) when the unit is absolute; else null.</param>
/// <param name="Chromaticity">Chromaticity for <see cref="Observer"/>.</param>
/// <param name="Chromaticity2Degree">CIE 1931 2° chromaticity (what CCT and Duv use).</param>
/// <param name="Cct">CCT (K) and Duv from the CIE 1931 2° chromaticity, with the method and its conditions.</param>
/// <param name="Cri">CIE 13.3 colour rendering, when asked for and computable.</param>
/// <param name="Fidelity">CIE 224 / TM-30 results, when asked for and computable.</param>
/// <param name="Photometry">Photometric results, when asked for.</param>
/// <param name="NonVisual">CIE S 026 α-opic results (melanopic first), when asked for.</param>
/// <param name="Spectral">Spectral descriptors, when asked for.</param>
/// <param name="Warnings">Plain-language warnings a practitioner needs.</param>
/// <param name="Provenance">Methods, standards, constants, ranges.</param>
public sealed record Assessment(
    string Name,
    SpectrumOrigin Origin,
    SpectralUnit Unit,
    Observer Observer,
    Tristimulus Tristimulus,
    Tristimulus? AbsoluteTristimulus,
    Chromaticity Chromaticity,
    Chromaticity Chromaticity2Degree,
    CctResult Cct,
    CriResult? Cri,
    FidelityResult? Fidelity,
    PhotometricResult? Photometry,
    IReadOnlyList<AlphaOpicResult>? NonVisual,
    SpectralDescriptorResult? Spectral,
    IReadOnlyList<string> Warnings,
    Provenance Provenance);
