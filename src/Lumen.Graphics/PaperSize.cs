namespace Lumen.Graphics;

/// <summary>The page size a report is laid out for when printed.</summary>
public enum PaperSize
{
    /// <summary>ISO A4, 210 × 297 mm.</summary>
    A4,

    /// <summary>US Letter, 8.5 × 11 in.</summary>
    Letter,
}
