using Lumen.Colorimetry;
using Lumen.Conformance;

namespace Lumen.Graphics;

/// <summary>What a chromaticity diagram shows.</summary>
/// <param name="Space">xy or u′v′.</param>
/// <param name="Points">Measured points.</param>
/// <param name="Spec">Optional specification whose quadrangle, ellipse or circle is drawn.</param>
/// <param name="Title">Title.</param>
public sealed record DiagramOptions(DiagramSpace Space, IReadOnlyList<DiagramPoint> Points, PreparedSpec? Spec = null, string Title = "Chromaticity")
{
    /// <summary>
    /// Draw each point as its own source: its own colour and marker shape, every point labelled (labels moved apart, with
    /// leader lines where they had to move), and the legend naming each source. For comparisons.
    /// </summary>
    public bool DistinctSources { get; init; }

    /// <summary>Arrows to draw, e.g. the correction from a source to the reference (from, to).</summary>
    public IReadOnlyList<(Chromaticity From, Chromaticity To)> Arrows { get; init; } = [];
}
