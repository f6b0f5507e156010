namespace Lumen.Descriptors;

/// <summary>Dominant (or complementary) wavelength and purity of a chromaticity.</summary>
/// <param name="WavelengthNm">Dominant wavelength (positive) or complementary wavelength (negative), nm.</param>
/// <param name="ExcitationPurity">Excitation purity |NS|/|ND| (distance white→sample over white→locus), 0–1.</param>
/// <param name="IsComplementary">True for purple stimuli (the ray meets the purple line).</param>
/// <param name="IntersectionX">x of the intersection point D.</param>
/// <param name="IntersectionY">CIE 1931 y of the point D where the ray meets the spectrum locus or purple line.</param>
internal readonly record struct DominantWavelengthResult(double WavelengthNm, double ExcitationPurity, bool IsComplementary, double IntersectionX, double IntersectionY);
