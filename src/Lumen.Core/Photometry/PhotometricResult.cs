namespace Lumen.Photometry;

/// <summary>Photometric and radiometric results of one spectrum.</summary>
/// <param name="LerLumensPerWatt">Luminous efficacy of radiation K = K_m·ΣSVΔλ / ΣSΔλ, lm/W (denominator over the measured band).</param>
/// <param name="SpRatio">Scotopic/photopic ratio K′_m·ΣSV′Δλ / (K_m·ΣSVΔλ).</param>
/// <param name="BandFirstNm">First wavelength of the radiant-power band, nm.</param>
/// <param name="BandLastNm">Last wavelength of the radiant-power band, nm.</param>
/// <param name="Photometric">Photopic quantity (lx, cd/m², cd or lm) when the unit is absolute; else null.</param>
/// <param name="Scotopic">Scotopic quantity in the same kind of unit when absolute; else null.</param>
/// <param name="Radiometric">Radiometric total over the band (W/m², W/(sr·m²), W/sr or W) when absolute; else null.</param>
/// <param name="Quantity">Which photometric quantity: illuminance, luminance, intensity or flux; null when relative.</param>
public sealed record PhotometricResult(
    double LerLumensPerWatt, double SpRatio, double BandFirstNm, double BandLastNm,
    double? Photometric, double? Scotopic, double? Radiometric, PhotometricQuantity? Quantity);
