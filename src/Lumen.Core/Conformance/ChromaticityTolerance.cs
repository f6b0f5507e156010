namespace Lumen.Conformance;

/// <summary>A chromaticity tolerance.</summary>
/// <param name="Kind">Quadrangle, ellipse steps, Δu′v′ radius, or none.</param>
/// <param name="Value">Steps or radius (unused for quadrangles).</param>
public sealed record ChromaticityTolerance(ToleranceKind Kind, double Value);
