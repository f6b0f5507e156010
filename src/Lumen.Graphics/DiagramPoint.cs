using Lumen.Colorimetry;

namespace Lumen.Graphics;

/// <summary>A measured point to plot.</summary>
/// <param name="Label">Name (shown for few points).</param>
/// <param name="Chromaticity">Its CIE 1931 2° chromaticity.</param>
/// <param name="Status">Pass/fail marking.</param>
public sealed record DiagramPoint(string Label, Chromaticity Chromaticity, PointStatus Status);
