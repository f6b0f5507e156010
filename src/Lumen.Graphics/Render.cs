using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>Renders a drawing to PNG bytes or SVG text with the same drawing code.</summary>
public static class Render
{
    /// <summary>Renders to PNG.</summary>
    /// <param name="width">Width in pixels.</param>
    /// <param name="height">Height in pixels.</param>
    /// <param name="draw">Drawing code.</param>
    /// <returns>PNG bytes.</returns>
    public static byte[] Png(int width, int height, Action<SKCanvas, SKSize> draw)
    {
        ArgumentNullException.ThrowIfNull(draw);
        using var bitmap = new SKBitmap(new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul));
        using (var canvas = new SKCanvas(bitmap))
        {
            canvas.Clear(SKColors.White);
            draw(canvas, new SKSize(width, height));
        }
        using var image = SKImage.FromBitmap(bitmap);
        using var data = image.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    /// <summary>Renders to SVG (an XML document with width and height in pixels).</summary>
    /// <param name="width">Width.</param>
    /// <param name="height">Height.</param>
    /// <param name="draw">Drawing code.</param>
    /// <returns>SVG text.</returns>
    public static string Svg(int width, int height, Action<SKCanvas, SKSize> draw)
    {
        ArgumentNullException.ThrowIfNull(draw);
        using var ms = new MemoryStream();
        using (var canvas = SKSvgCanvas.Create(new SKRect(0, 0, width, height), ms))
        {
            using var bg = new SKPaint { Color = SKColors.White };
            canvas.DrawRect(0, 0, width, height, bg);
            draw(canvas, new SKSize(width, height));
        }
        return System.Text.Encoding.UTF8.GetString(ms.ToArray());
    }
}
