namespace Lumen.Conformance;

/// <summary>How a chromaticity target is given.</summary>
public enum TargetKind
{
    /// <summary>An ANSI C78.377 nominal CCT category (fixed or flexible).</summary>
    NominalCct,

    /// <summary>A CIE 1931 (x, y) centre.</summary>
    Xy,

    /// <summary>A CIE 1976 (u′, v′) centre.</summary>
    UPrimeVPrime,

    /// <summary>A CCT and Duv.</summary>
    CctDuv,
}
