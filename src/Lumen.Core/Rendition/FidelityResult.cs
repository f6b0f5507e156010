namespace Lumen.Rendition;

/// <summary>CIE 224:2017 and IES TM-30-20 results.</summary>
/// <param name="Rf">Fidelity index Rf (CIE 224 Rf = TM-30-18/-20 Rf).</param>
/// <param name="Rg">TM-30 gamut index Rg.</param>
/// <param name="RfCes">Rf,i of the 99 colour evaluation samples (CES1 first).</param>
/// <param name="HueBins">The 16 hue bins.</param>
/// <param name="Reference">The reference illuminant.</param>
/// <param name="CesBins">Hue bin (1–16) of each CES under the reference, CES1 first.</param>
public sealed record FidelityResult(double Rf, double Rg, IReadOnlyList<double> RfCes, IReadOnlyList<HueBin> HueBins, ReferenceIlluminant Reference, IReadOnlyList<int> CesBins);
