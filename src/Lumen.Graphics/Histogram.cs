namespace Lumen.Graphics;

/// <summary>A simple histogram.</summary>
public static class Histogram
{
    /// <summary>Draws a histogram of values.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="values">Values.</param>
    /// <param name="title">Quantity name.</param>
    public static void Draw(SkiaSharp.SKCanvas canvas, SkiaSharp.SKSize size, IReadOnlyList<double> values, string title)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(values);
        float s = Math.Max(0.8f, Math.Min(size.Width / 700f, size.Height / 440f));
        Style.Text(canvas, title, 20 * s, 30 * s, 16 * s, Style.Ink, bold: true);
        if (values.Count == 0) { Style.Text(canvas, "no values", 20 * s, 60 * s, 13 * s, Style.Muted); return; }
        double min = values.Min(), max = values.Max();
        if (max - min < 1e-12) { min -= 0.5; max += 0.5; }
        int nb = Math.Clamp((int)Math.Sqrt(values.Count), 5, 40);
        var counts = new int[nb];
        foreach (var v in values) counts[Math.Min(nb - 1, (int)((v - min) / (max - min) * nb))]++;
        var m = new AxisMapping(new SkiaSharp.SKRect(80 * s, 45 * s, size.Width - 20 * s, size.Height - 60 * s), min, max, 0, counts.Max() * 1.1);
        m.DrawAxes(canvas, title, "count", s, "G5", "0");
        using var fill = Style.Fill(Style.Pass);
        for (int i = 0; i < nb; i++)
        {
            double a = min + i * (max - min) / nb, b = a + (max - min) / nb;
            canvas.DrawRect(new SkiaSharp.SKRect(m.Px(a) + 1, m.Py(counts[i]), m.Px(b) - 1, m.Py(0)), fill);
        }
    }
}
