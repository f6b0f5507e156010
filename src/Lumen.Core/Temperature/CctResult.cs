namespace Lumen.Temperature;

/// <summary>Methods Lumen offers to find CCT and Duv.</summary>
public enum CctMethod
{
    /// <summary>
    /// Nearest point of the exact Planckian locus in (u, v) (the CIE 15 definition), found by a coarse scan
    /// and a safeguarded Newton solution of the orthogonality condition on a quintic-Hermite locus table.
    /// </summary>
    LocusNewton,

    /// <summary>Robertson (1968) isotemperature-line interpolation (31-line table; historical, for comparison).</summary>
    Robertson1968,
}

/// <summary>Conditions that limit the meaning of a CCT result.</summary>
[Flags]
public enum CctConditions
{
    /// <summary>None: a CCT within 1000–100000 K and |Duv| ≤ 0.05.</summary>
    None = 0,

    /// <summary>|Duv| &gt; 0.05: CIE 15 says CCT is not meaningful so far from the locus.</summary>
    FarFromLocus = 1,

    /// <summary>CCT outside 1000–100000 K, the range Lumen validates.</summary>
    OutsideValidatedRange = 2,

    /// <summary>The nearest locus point is at the end of the tabulated locus (500 K or 10⁶ K): clamped.</summary>
    BeyondLocus = 4,

    /// <summary>The chromaticity is undefined (a black or empty spectrum): no CCT.</summary>
    Undefined = 8,
}

/// <summary>A correlated colour temperature and Duv.</summary>
/// <param name="CctKelvin">Correlated colour temperature, K.</param>
/// <param name="Duv">Signed distance from the Planckian locus in (u, v′·2/3), positive above (greenish).</param>
/// <param name="Method">How it was found.</param>
/// <param name="Conditions">Limits on its meaning.</param>
public readonly record struct CctResult(double CctKelvin, double Duv, CctMethod Method, CctConditions Conditions)
{
    /// <summary>Mired value 10⁶/CCT, MK⁻¹.</summary>
    public double Mired => 1e6 / CctKelvin;

    /// <summary>A result for an undefined chromaticity.</summary>
    /// <param name="method">The method asked for.</param>
    /// <returns>NaN values flagged <see cref="CctConditions.Undefined"/>.</returns>
    public static CctResult Undefined(CctMethod method) => new(double.NaN, double.NaN, method, CctConditions.Undefined);

    /// <summary>Readable name of the method with its source.</summary>
    /// <param name="method">The method.</param>
    /// <returns>For example "nearest point on the exact Planckian locus (CIE 15), Newton refinement".</returns>
    public static string Describe(CctMethod method) => method switch
    {
        CctMethod.LocusNewton => "nearest point on the exact Planckian locus in CIE 1960 uv (CIE 15 definition), Newton refinement",
        CctMethod.Robertson1968 => "Robertson (1968) isotemperature lines",
        _ => method.ToString(),
    };
}
