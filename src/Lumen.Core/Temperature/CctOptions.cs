using Lumen.Blackbody;

namespace Lumen.Temperature;

/// <summary>Options for CCT and Duv.</summary>
/// <param name="Method">The method (default: exact locus, Newton).</param>
/// <param name="C2">The c2 convention of the Planckian locus (default: CIE 15, 1.4388e-2 m·K).</param>
public sealed record CctOptions(CctMethod Method = CctMethod.NearestPlanckianPoint, C2Convention C2 = C2Convention.Cie15Its90)
{
    /// <summary>The defaults.</summary>
    public static CctOptions Default { get; } = new();
}
