namespace Lumen.Graphics;

/// <summary>Image formats Lumen writes.</summary>
public enum ImageFormat
{
    /// <summary>PNG raster.</summary>
    Png,

    /// <summary>SVG vector.</summary>
    Svg,
}
