using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Conformance;
using Lumen.Temperature;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>What a chromaticity diagram shows.</summary>
/// <param name="Space">xy or u′v′.</param>
/// <param name="Points">Measured points.</param>
/// <param name="Spec">Optional specification whose quadrangle, ellipse or circle is drawn.</param>
/// <param name="Title">Title.</param>
public sealed record DiagramOptions(DiagramSpace Space, IReadOnlyList<DiagramPoint> Points, PreparedSpec? Spec = null, string Title = "Chromaticity");
