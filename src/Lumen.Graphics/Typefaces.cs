using System.Reflection;
using SkiaSharp;

namespace Lumen.Graphics;

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
