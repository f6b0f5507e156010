using Lumen.Blackbody;
using Lumen.Colorimetry;

namespace Lumen.Temperature;

/// <summary>Façade: CCT and Duv from a chromaticity, and the inverse.</summary>
/// <remarks>CCT is defined on the CIE 1931 2° observer's (u, v) (CIE 15); pass a 2° chromaticity.</remarks>
public static class CctSolver
{
    /// <summary>CCT and Duv of a CIE 1931 2° chromaticity.</summary>
    /// <param name="chromaticity">The chromaticity (2° observer).</param>
    /// <param name="options">Method and c2 convention; null for defaults.</param>
    /// <returns>The result and its conditions.</returns>
    public static CctResult Solve(Chromaticity chromaticity, CctOptions? options = null)
    {
        options ??= CctOptions.Default;
        if (!chromaticity.IsDefined) return CctResult.Undefined(options.Method);
        return options.Method switch
        {
            CctMethod.Robertson1968 => Robertson1968.Solve(chromaticity.U, chromaticity.V),
            _ => NearestPlanckianPoint.Solve(chromaticity.U, chromaticity.V, PlanckianLocus.For(options.C2)),
        };
    }

    /// <summary>The chromaticity at a given CCT and Duv (the inverse).</summary>
    /// <param name="cctKelvin">CCT in K, 500 to 10⁶.</param>
    /// <param name="duv">Duv, positive above the locus.</param>
    /// <param name="c2">The c2 convention.</param>
    /// <returns>The chromaticity: the locus point offset by Duv along the locus normal (docs/methods/cct.md §6,
    /// with the analytic tangent instead of a finite difference).</returns>
    /// <exception cref="ArgumentOutOfRangeException">CCT outside 500–10⁶ K or non-finite Duv.</exception>
    public static Chromaticity ToChromaticity(double cctKelvin, double duv, C2Convention c2 = C2Convention.Cie15Its90)
    {
        if (!(cctKelvin >= 500 && cctKelvin <= 1e6)) throw new ArgumentOutOfRangeException(nameof(cctKelvin), "CCT must be within 500–1000000 K.");
        if (!double.IsFinite(duv)) throw new ArgumentOutOfRangeException(nameof(duv));
        var p = PlanckianLocus.For(c2).At(cctKelvin);
        double len = Math.Sqrt(p.DuDm * p.DuDm + p.DvDm * p.DvDm);
        double tu = p.DuDm / len, tv = p.DvDm / len;
        return Chromaticity.FromUv(p.U - duv * tv, p.V + duv * tu);
    }
}
