namespace Lumen.Mixing;

/// <summary>Results of a mix spectrum (NaN or null where not computable).</summary>
/// <param name="Ra">CIE 13.3 Ra.</param>
/// <param name="R9">CIE 13.3 R9.</param>
/// <param name="Rf">CIE 224 Rf.</param>
/// <param name="Rg">ANSI/IES TM-30 Rg.</param>
/// <param name="LerLumensPerWatt">Luminous efficacy of radiation, lm/W (of the relative channel spectra as given).</param>
/// <param name="RelativeOutput">Luminous flux of the mix relative to all channels at full, 0–1.</param>
/// <param name="MelanopicDer">CIE S 026 melanopic daylight efficacy ratio.</param>
/// <param name="Ssi">Spectral Similarity Index to the matched spectrum, when matching one.</param>
public sealed record MixMetrics(double Ra, double R9, double Rf, double Rg, double LerLumensPerWatt, double RelativeOutput, double MelanopicDer, int? Ssi);
