namespace Lumen.Analysis;

/// <summary>How a result was obtained: methods, standards, constants and the data range used.</summary>
/// <param name="Methods">Method names keyed by quantity (e.g. "cct").</param>
/// <param name="Standards">Standards and editions followed.</param>
/// <param name="C2MetreKelvin">c2 used for the Planckian locus, m·K.</param>
/// <param name="MeasuredFirstNm">First measured wavelength, nm.</param>
/// <param name="MeasuredLastNm">Last measured wavelength, nm.</param>
/// <param name="IntegrationStartNm">First wavelength of the integration grid, nm.</param>
/// <param name="IntegrationEndNm">Last wavelength of the integration grid, nm.</param>
/// <param name="IntegrationStepNm">Integration step, nm.</param>
/// <param name="Sampling">How the spectrum was brought onto the integration grid.</param>
/// <param name="NegativeSamples">Number of input samples below zero (kept in the sums).</param>
public sealed record Provenance(
    IReadOnlyDictionary<string, string> Methods,
    IReadOnlyList<string> Standards,
    double C2MetreKelvin,
    double MeasuredFirstNm,
    double MeasuredLastNm,
    int IntegrationStartNm,
    int IntegrationEndNm,
    int IntegrationStepNm,
    string Sampling,
    int NegativeSamples)
{
    /// <summary>How the input file was laid out, as the reader detected it (or was told); null for spectra made in code.</summary>
    public string? InputLayout { get; init; }
}
