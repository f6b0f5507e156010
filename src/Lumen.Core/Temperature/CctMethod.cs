namespace Lumen.Temperature;

/// <summary>Methods Lumen offers to find CCT and Duv.</summary>
public enum CctMethod
{
    /// <summary>
    /// Nearest point of the exact Planckian locus in (u, v) (the CIE 15 definition), found by a coarse scan
    /// and a safeguarded Newton solution of the orthogonality condition on a quintic-Hermite locus table.
    /// </summary>
    NearestPlanckianPoint,

    /// <summary>Robertson (1968) isotemperature-line interpolation (31-line table; historical, for comparison).</summary>
    Robertson1968,
}
