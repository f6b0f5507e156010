using System.Reflection;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>Image formats Lumen writes.</summary>
public enum ImageFormat
{
    /// <summary>PNG raster.</summary>
    Png,

    /// <summary>SVG vector.</summary>
    Svg,
}

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

    /// <summary>Writes a drawing to a file, the format chosen by the extension (.svg or .png).</summary>
    /// <param name="path">Path.</param>
    /// <param name="width">Width.</param>
    /// <param name="height">Height.</param>
    /// <param name="draw">Drawing code.</param>
    public static void ToFile(string path, int width, int height, Action<SKCanvas, SKSize> draw)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (path.EndsWith(".svg", StringComparison.OrdinalIgnoreCase)) File.WriteAllText(path, Svg(width, height, draw));
        else File.WriteAllBytes(path, Png(width, height, draw));
    }
}

/// <summary>The fonts Lumen ships (DejaVu Sans, Bitstream Vera licence; see Fonts/LICENSE-DejaVu.txt), so text
/// renders the same on any machine, with or without system fonts.</summary>
public static class Typefaces
{
    private static readonly Lazy<SKTypeface> RegularFace = new(() => Load("DejaVuSans.ttf"));
    private static readonly Lazy<SKTypeface> BoldFace = new(() => Load("DejaVuSans-Bold.ttf"));

    /// <summary>Regular weight.</summary>
    public static SKTypeface Regular => RegularFace.Value;

    /// <summary>Bold weight.</summary>
    public static SKTypeface Bold => BoldFace.Value;

    private static SKTypeface Load(string file)
    {
        var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream("fonts/" + file)
            ?? throw new InvalidOperationException($"Embedded font {file} missing.");
        return SKTypeface.FromStream(stream) ?? throw new InvalidOperationException($"Embedded font {file} could not be read.");
    }
}

/// <summary>Lumen's own palette and text helpers.</summary>
internal static class Style
{
    public static readonly SKColor Ink = new(0x22, 0x26, 0x2b);
    public static readonly SKColor Muted = new(0x6b, 0x72, 0x7a);
    public static readonly SKColor Grid = new(0xe3, 0xe6, 0xea);
    public static readonly SKColor Panel = new(0xfb, 0xfb, 0xfc);
    public static readonly SKColor Locus = new(0x00, 0x00, 0x00);
    public static readonly SKColor Pass = new(0x1f, 0x6f, 0x8b);
    public static readonly SKColor Fail = new(0xc2, 0x41, 0x0c);
    public static readonly SKColor Neutral = new(0x3b, 0x3f, 0x9a);
    public static readonly SKColor Accent = new(0x8a, 0x2b, 0x6e);

    public static SKPaint Stroke(SKColor c, float width) =>
        new() { Color = c, StrokeWidth = width, Style = SKPaintStyle.Stroke, IsAntialias = true, StrokeCap = SKStrokeCap.Round };

    /// <summary>
    /// Draws a polyline as dashes (on, off lengths in pixels). Dashes are made here rather than with a Skia path
    /// effect because the SVG back end does not support path effects (it would outline every dash).
    /// </summary>
    public static void DashedPolyline(SKCanvas canvas, IReadOnlyList<SKPoint> points, SKPaint paint, float on, float off)
    {
        float phase = 0;
        bool drawing = true;
        using var path = new SKPath();
        for (int i = 1; i < points.Count; i++)
        {
            var a = points[i - 1]; var b = points[i];
            float len = SKPoint.Distance(a, b), pos = 0;
            if (len <= 0) continue;
            if (drawing && phase == 0) path.MoveTo(a);
            while (pos < len)
            {
                float left = (drawing ? on : off) - phase;
                float step = Math.Min(left, len - pos);
                pos += step; phase += step;
                var p = new SKPoint(a.X + (b.X - a.X) * pos / len, a.Y + (b.Y - a.Y) * pos / len);
                if (drawing) path.LineTo(p);
                if (phase >= (drawing ? on : off) - 1e-4f)
                {
                    drawing = !drawing; phase = 0;
                    if (drawing) path.MoveTo(p);
                }
            }
        }
        canvas.DrawPath(path, paint);
    }

    /// <summary>A dashed straight line.</summary>
    public static void DashedLine(SKCanvas canvas, SKPoint a, SKPoint b, SKPaint paint, float on, float off) =>
        DashedPolyline(canvas, [a, b], paint, on, off);

    public static SKPaint Fill(SKColor c) => new() { Color = c, Style = SKPaintStyle.Fill, IsAntialias = true };

    public static void Text(SKCanvas canvas, string text, float x, float y, float size, SKColor colour, SKTextAlign align = SKTextAlign.Left, bool bold = false)
    {
        using var font = new SKFont(bold ? Typefaces.Bold : Typefaces.Regular, size);
        using var paint = new SKPaint { Color = colour, IsAntialias = true };
        canvas.DrawText(text, x, y, align, font, paint);
    }

    public static float Scale(SKSize size) => Math.Max(0.6f, Math.Min(size.Width / 1200f, size.Height / 900f));
}

/// <summary>A linear mapping from data coordinates to a pixel rectangle (y up in data, down in pixels).</summary>
/// <param name="Plot">The plot rectangle in pixels.</param>
/// <param name="XMin">Data x at the left edge.</param>
/// <param name="XMax">Data x at the right edge.</param>
/// <param name="YMin">Data y at the bottom edge.</param>
/// <param name="YMax">Data y at the top edge.</param>
public sealed record AxisMapping(SKRect Plot, double XMin, double XMax, double YMin, double YMax)
{
    /// <summary>Pixel x of a data x.</summary>
    /// <param name="x">Data x.</param>
    /// <returns>Pixel x.</returns>
    public float Px(double x) => (float)(Plot.Left + (x - XMin) / (XMax - XMin) * Plot.Width);

    /// <summary>Pixel y of a data y.</summary>
    /// <param name="y">Data y.</param>
    /// <returns>Pixel y.</returns>
    public float Py(double y) => (float)(Plot.Bottom - (y - YMin) / (YMax - YMin) * Plot.Height);

    /// <summary>Data x of a pixel x.</summary>
    /// <param name="px">Pixel x.</param>
    /// <returns>Data x.</returns>
    public double X(float px) => XMin + (px - Plot.Left) / Plot.Width * (XMax - XMin);

    /// <summary>Data y of a pixel y.</summary>
    /// <param name="py">Pixel y.</param>
    /// <returns>Data y.</returns>
    public double Y(float py) => YMin + (Plot.Bottom - py) / Plot.Height * (YMax - YMin);

    /// <summary>Draws the panel, grid, ticks, tick labels and axis titles.</summary>
    internal void DrawAxes(SKCanvas canvas, string xTitle, string yTitle, float s, string xFormat = "0.###", string yFormat = "0.###")
    {
        using var panel = Style.Fill(Style.Panel);
        canvas.DrawRect(Plot, panel);
        using var grid = Style.Stroke(Style.Grid, 1 * s);
        using var frame = Style.Stroke(Style.Muted, 1.2f * s);
        foreach (var x in Ticks(XMin, XMax, 8))
        {
            float px = Px(x);
            canvas.DrawLine(px, Plot.Top, px, Plot.Bottom, grid);
            canvas.DrawLine(px, Plot.Bottom, px, Plot.Bottom + 5 * s, frame);
            Style.Text(canvas, x.ToString(xFormat, System.Globalization.CultureInfo.InvariantCulture), px, Plot.Bottom + 20 * s, 13 * s, Style.Ink, SKTextAlign.Center);
        }
        foreach (var y in Ticks(YMin, YMax, 7))
        {
            float py = Py(y);
            canvas.DrawLine(Plot.Left, py, Plot.Right, py, grid);
            canvas.DrawLine(Plot.Left - 5 * s, py, Plot.Left, py, frame);
            Style.Text(canvas, y.ToString(yFormat, System.Globalization.CultureInfo.InvariantCulture), Plot.Left - 8 * s, py + 4.5f * s, 13 * s, Style.Ink, SKTextAlign.Right);
        }
        canvas.DrawRect(Plot, frame);
        Style.Text(canvas, xTitle, Plot.MidX, Plot.Bottom + 44 * s, 15 * s, Style.Ink, SKTextAlign.Center);
        canvas.Save();
        canvas.RotateDegrees(-90, Plot.Left - 58 * s, Plot.MidY);
        Style.Text(canvas, yTitle, Plot.Left - 58 * s, Plot.MidY, 15 * s, Style.Ink, SKTextAlign.Center);
        canvas.Restore();
    }

    /// <summary>"Nice" tick values covering [min, max].</summary>
    internal static IEnumerable<double> Ticks(double min, double max, int target)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max) || !(max > min)) yield break;
        double raw = (max - min) / target;
        double mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1, 2, 2.5, 5, 10 }.Select(m => m * mag).First(v => v >= raw);
        for (double v = Math.Ceiling(min / step) * step; v <= max + step * 1e-9; v += step)
        {
            double t = Math.Round(v / step) * step;
            yield return t == 0 ? 0 : t; // no "-0" labels
        }
    }
}
