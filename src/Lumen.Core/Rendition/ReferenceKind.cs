namespace Lumen.Rendition;

/// <summary>Which kind of reference illuminant a rendition method built.</summary>
public enum ReferenceKind
{
    /// <summary>A Planckian (blackbody) radiator at the test CCT.</summary>
    Planckian,

    /// <summary>CIE daylight (D-series, from S0, S1, S2) at the test CCT.</summary>
    CieDaylight,

    /// <summary>CIE 224 proportional blend of Planckian and CIE daylight (4000–5000 K).</summary>
    Blend,
}
