namespace Lumen.Descriptors;

/// <summary>Shape descriptors of a spectrum.</summary>
/// <param name="PeakNm">Wavelength of the maximum, nm.</param>
/// <param name="CentroidNm">Power-weighted mean wavelength ΣλS/ΣS over the measured range, nm.</param>
/// <param name="FwhmNm">Full width at half maximum of the dominant (highest) peak, nm (interpolated half-maximum crossings); null when the peak's half maximum is not crossed inside the data.</param>
/// <param name="DominantNm">Dominant wavelength, nm; negative for a complementary wavelength (purple stimuli), CIE 15 convention; null when undefined.</param>
/// <param name="Purity">Excitation purity p_e (0 at the white point, 1 on the spectrum locus).</param>
/// <param name="WhitePoint">The achromatic point used for dominant wavelength and purity.</param>
public sealed record SpectralDescriptorResult(double PeakNm, double CentroidNm, double? FwhmNm, double? DominantNm, double Purity, string WhitePoint);
