namespace Lumen.Conformance;

/// <summary>Kinds of chromaticity tolerance.</summary>
public enum ToleranceKind
{
    /// <summary>No chromaticity criterion.</summary>
    None,

    /// <summary>Inside the ANSI C78.377 quadrangle of the nominal category.</summary>
    Quadrangle,

    /// <summary>Within n steps of the target (standard lamp-colour ellipse metric).</summary>
    EllipseSteps,

    /// <summary>Within a Δu′v′ radius of the target (CIE TN 001 circle).</summary>
    UPrimeVPrimeRadius,
}
