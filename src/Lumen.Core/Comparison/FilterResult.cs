namespace Lumen.Comparison;

/// <summary>The other source seen through one filter or a stack of two.</summary>
/// <param name="Name">Filter name, or "A + B" for a stack.</param>
/// <param name="Filters">The names of the filters in the stack (one or two).</param>
/// <param name="ResidualDeltaUPrimeVPrime">Δu′v′ of the filtered source to the reference.</param>
/// <param name="CctKelvin">CCT of the filtered source, K.</param>
/// <param name="Duv">Duv of the filtered source.</param>
/// <param name="MiredShift">The filter's own shift on this source: M(filtered) − M(unfiltered), MK⁻¹ (positive = warming).</param>
/// <param name="Transmission">Luminous transmission of the filter on this source, 0–1 (Y filtered / Y unfiltered).</param>
/// <param name="Percent">True when a transmittance was given in percent (detected).</param>
public sealed record FilterResult(string Name, IReadOnlyList<string> Filters, double ResidualDeltaUPrimeVPrime, double CctKelvin, double Duv,
    double MiredShift, double Transmission, bool Percent);
