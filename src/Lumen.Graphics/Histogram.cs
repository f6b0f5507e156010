namespace Lumen.Graphics;

/// <summary>A simple histogram.</summary>
public static class Histogram
{
    /// <summary>Draws a histogram of values.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="values">Values.</param>
    /// <param name="title">Quantity name.</param>
    /// <param name="limits">Specification limits to draw as dashed vertical lines (label, value); the axis is widened to
    /// show them, so the margin between the lot and each limit is visible.</param>
    public static void Draw(SkiaSharp.SKCanvas canvas, SkiaSharp.SKSize size, IReadOnlyList<double> values, string title, IReadOnlyList<(string Label, double Value)>? limits = null)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(values);
        float s = Math.Max(0.8f, Math.Min(size.Width / 700f, size.Height / 440f));
        Style.Text(canvas, title, 20 * s, 30 * s, 16 * s, Style.Ink, bold: true);
        if (values.Count == 0) { Style.Text(canvas, "no values", 20 * s, 60 * s, 13 * s, Style.Muted); return; }
        double min = values.Min(), max = values.Max();
        if (max - min < 1e-12) { min -= 0.5; max += 0.5; }
        limits ??= [];
        double lo = min, hi = max;
        foreach (var (_, v) in limits) if (double.IsFinite(v)) { lo = Math.Min(lo, v); hi = Math.Max(hi, v); }
        double pad = (hi - lo) * 0.04;
        int nb = Math.Clamp((int)Math.Sqrt(values.Count), 5, 40);
        var counts = new int[nb];
        foreach (var v in values) counts[Math.Min(nb - 1, (int)((v - min) / (max - min) * nb))]++;
        var m = limits.Count == 0
            ? new AxisMapping(new SkiaSharp.SKRect(80 * s, 45 * s, size.Width - 20 * s, size.Height - 60 * s), min, max, 0, counts.Max() * 1.1)
            : new AxisMapping(new SkiaSharp.SKRect(80 * s, 45 * s, size.Width - 20 * s, size.Height - 60 * s), lo - pad, hi + pad, 0, counts.Max() * 1.25);
        m.DrawAxes(canvas, title, "count", s, "G5", "0");
        using var fill = Style.Fill(Style.Pass);
        for (int i = 0; i < nb; i++)
        {
            double a = min + i * (max - min) / nb, b = a + (max - min) / nb;
            canvas.DrawRect(new SkiaSharp.SKRect(m.Px(a) + 1, m.Py(counts[i]), m.Px(b) - 1, m.Py(0)), fill);
        }
        using var line = Style.Stroke(Style.Fail, 2 * s);
        foreach (var (label, v) in limits)
        {
            if (!double.IsFinite(v)) continue;
            float x = m.Px(v);
            Style.DashedPolyline(canvas, [new SkiaSharp.SKPoint(x, m.Py(0)), new SkiaSharp.SKPoint(x, 45 * s)], line, 7 * s, 5 * s);
            bool right = x > (80 * s + size.Width - 20 * s) / 2; // labels point inward so they stay on the plot
            Style.Text(canvas, label, right ? x - 4 * s : x + 4 * s, 58 * s, 12 * s, Style.Fail, right ? SkiaSharp.SKTextAlign.Right : SkiaSharp.SKTextAlign.Left);
        }
    }
}
