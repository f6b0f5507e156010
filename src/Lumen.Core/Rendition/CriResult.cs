namespace Lumen.Rendition;

/// <summary>CIE 13.3 colour rendering result.</summary>
/// <param name="Ra">General colour rendering index Ra (mean of R1–R8).</param>
/// <param name="R">Special indices R1–R14 (index 0 is R1; R9 at index 8).</param>
/// <param name="Reference">The reference illuminant used.</param>
/// <param name="Dc">Chromaticity distance between test and reference in CIE 1960 uv.</param>
public sealed record CriResult(double Ra, IReadOnlyList<double> R, ReferenceIlluminant Reference, double Dc)
{
    /// <summary>The CIE 13.3 validity limit on <see cref="Dc"/>: 5.4 × 10⁻³.</summary>
    public const double DcLimit = 5.4e-3;

    /// <summary>True when DC is within the CIE 13.3 limit.</summary>
    public bool DcValid => Dc < DcLimit;

    /// <summary>R9, the saturated-red index practitioners specify.</summary>
    public double R9 => R[8];
}
