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

    /// <summary>Colours for several sources drawn together (distinct in hue and lightness; our own choice).</summary>
    public static readonly SKColor[] Series =
    [
        new(0x1f, 0x3a, 0x93), new(0xd9, 0x5f, 0x02), new(0x1b, 0x9e, 0x77), new(0x9c, 0x27, 0xb0),
        new(0x66, 0x66, 0x00), new(0xe6, 0x00, 0x7a), new(0x00, 0x83, 0x8f), new(0x7a, 0x4a, 0x1f),
    ];

    /// <summary>Draws marker shape <paramref name="shape"/> (0 circle, 1 square, 2 triangle, 3 diamond, repeating).</summary>
    public static void Marker(SKCanvas canvas, int shape, float x, float y, float r, SKColor color, float s)
    {
        using var fill = Fill(color);
        using var edge = Stroke(SKColors.White, 1.2f * s);
        using var path = new SKPath();
        switch (shape % 4)
        {
            case 0: canvas.DrawCircle(x, y, r, fill); canvas.DrawCircle(x, y, r, edge); return;
            case 1: path.AddRect(new SKRect(x - r, y - r, x + r, y + r)); break;
            case 2: path.MoveTo(x, y - 1.2f * r); path.LineTo(x + 1.1f * r, y + 0.8f * r); path.LineTo(x - 1.1f * r, y + 0.8f * r); path.Close(); break;
            default: path.MoveTo(x, y - 1.3f * r); path.LineTo(x + 1.3f * r, y); path.LineTo(x, y + 1.3f * r); path.LineTo(x - 1.3f * r, y); path.Close(); break;
        }
        canvas.DrawPath(path, fill);
        canvas.DrawPath(path, edge);
    }

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
