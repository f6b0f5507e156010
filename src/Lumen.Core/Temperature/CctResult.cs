namespace Lumen.Temperature;

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
    /// <param name="method">The CCT method whose result this would have been.</param>
    /// <returns>For example "nearest point on the exact Planckian locus (CIE 15), Newton refinement".</returns>
    public static string Describe(CctMethod method) => method switch
    {
        CctMethod.NearestPlanckianPoint => "nearest point on the exact Planckian locus in CIE 1960 uv (CIE 15 definition), Newton refinement",
        CctMethod.Robertson1968 => "Robertson (1968) isotemperature lines",
        _ => method.ToString(),
    };
}
