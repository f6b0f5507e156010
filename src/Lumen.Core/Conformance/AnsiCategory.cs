using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>One ANSI C78.377 nominal CCT category.</summary>
/// <param name="NominalCctKelvin">Nominal CCT, K (e.g. 3000).</param>
/// <param name="TargetCctKelvin">Target CCT of the category, K (e.g. 3045 for the 3000 K category).</param>
/// <param name="CctToleranceKelvin">CCT tolerance ±, K.</param>
/// <param name="PublishedCentre">Centre (x, y) as published (null for flexible categories).</param>
/// <param name="Flexible">True for a flexible-CCT category (tolerance interpolated — a stop-gap, see remarks of <see cref="AnsiC78377"/>).</param>
/// <param name="Edition">The edition whose construction applies.</param>
/// <param name="TabulatedDuv">The category's tabulated target Duv (2008 edition), or null.</param>
public sealed record AnsiCategory(int NominalCctKelvin, double TargetCctKelvin, double CctToleranceKelvin, Chromaticity? PublishedCentre, bool Flexible,
    AnsiEdition Edition = AnsiEdition.Ed2017, double? TabulatedDuv = null)
{
    /// <summary>Target Duv at the target CCT (tabulated for 2008, flexible-CCT formula otherwise).</summary>
    public double TargetDuv => TabulatedDuv ?? AnsiC78377.TargetDuv(TargetCctKelvin);

    /// <summary>Centre computed from the target CCT and Duv.</summary>
    public Chromaticity Centre
    {
        get
        {
            return CctSolver.ToChromaticity(TargetCctKelvin, TargetDuv);
        }
    }

    /// <summary>The quadrangle: T_target ∓ ΔT with Duv_T(T) ± 0.006 (2017) or the tabulated Duv ± 0.006 (2008).</summary>
    public Quadrangle Quadrangle => TabulatedDuv is { } duv
        ? AnsiC78377.BuildQuadrangle(TargetCctKelvin - CctToleranceKelvin, TargetCctKelvin + CctToleranceKelvin, _ => duv)
        : AnsiC78377.BuildQuadrangle(TargetCctKelvin - CctToleranceKelvin, TargetCctKelvin + CctToleranceKelvin, AnsiC78377.TargetDuv);
}
