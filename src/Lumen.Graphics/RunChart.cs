using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>
/// A run chart: each unit's value against its position in the batch (input order), with the batch mean as a centre line
/// and the specification limits as dashed lines, so drift, steps between lots and trends show where a histogram hides
/// them. Units outside a limit are drawn in the failure colour; gaps (errors, undefined values) are left empty.
/// </summary>
public static class RunChart
{
    /// <summary>Most points drawn; longer runs are thinned to every k-th unit (said in the subtitle).</summary>
    public const int MaxPoints = 5000;

    /// <summary>Draws the chart.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="values">One value per record, in input order; NaN for a record without one.</param>
    /// <param name="title">Quantity name.</param>
    /// <param name="limits">Specification limits (label, value) as dashed lines; may be null.</param>
    /// <param name="valueFormat">Number format of the value axis.</param>
    public static void Draw(SKCanvas canvas, SKSize size, IReadOnlyList<double> values, string title, IReadOnlyList<(string Label, double Value)>? limits = null, string valueFormat = "G5")
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(values);
        float s = Math.Max(0.8f, Math.Min(size.Width / 700f, size.Height / 440f));
        Style.Text(canvas, "Run chart: " + title, 20 * s, 30 * s, 16 * s, Style.Ink, bold: true);
        var finite = values.Where(double.IsFinite).ToArray();
        if (finite.Length == 0) { Style.Text(canvas, "no values", 20 * s, 60 * s, 13 * s, Style.Muted); return; }
        limits ??= [];
        double lo = finite.Min(), hi = finite.Max();
        foreach (var (_, v) in limits) if (double.IsFinite(v)) { lo = Math.Min(lo, v); hi = Math.Max(hi, v); }
        if (hi - lo < 1e-12) { lo -= 0.5; hi += 0.5; }
        double pad = (hi - lo) * 0.06;
        var m = new AxisMapping(new SKRect(80 * s, 45 * s, size.Width - 20 * s, size.Height - 60 * s), 1, Math.Max(2, values.Count), lo - pad, hi + pad);
        m.DrawAxes(canvas, "unit (input order)", title, s, "0", valueFormat);

        double mean = finite.Average();
        using var centre = Style.Stroke(Style.Neutral, 1.5f * s);
        canvas.DrawLine(m.Px(1), m.Py(mean), m.Px(Math.Max(2, values.Count)), m.Py(mean), centre);
        int step = Math.Max(1, (int)Math.Ceiling(values.Count / (double)MaxPoints));
        // The key sits above the plot, so it never covers a point.
        string key = "centre line: mean " + mean.ToString(valueFormat, System.Globalization.CultureInfo.InvariantCulture)
            + (step > 1 ? $"; every {step}th of {values.Count:N0} units shown" : "");
        Style.Text(canvas, key, m.Plot.Right, 30 * s, 12 * s, Style.Neutral, SKTextAlign.Right);

        using var limit = Style.Stroke(Style.Fail, 2 * s);
        foreach (var (label, v) in limits)
        {
            if (!double.IsFinite(v)) continue;
            float y = m.Py(v);
            Style.DashedLine(canvas, new SKPoint(m.Plot.Left, y), new SKPoint(m.Plot.Right, y), limit, 7 * s, 5 * s);
            Style.Text(canvas, label, m.Plot.Left + 6 * s, y - 5 * s, 12 * s, Style.Fail);
        }

        using var line = Style.Stroke(Style.Grid, 1 * s);
        using var pass = Style.Fill(Style.Pass);
        using var fail = Style.Fill(Style.Fail);
        SKPoint? previous = null;
        for (int i = 0; i < values.Count; i += step)
        {
            double v = values[i];
            if (!double.IsFinite(v)) { previous = null; continue; }
            var p = new SKPoint(m.Px(i + 1), m.Py(v));
            if (previous is { } q) canvas.DrawLine(q, p, line);
            previous = p;
        }
        for (int i = 0; i < values.Count; i += step)
        {
            double v = values[i];
            if (!double.IsFinite(v)) continue;
            bool outside = limits.Any(l => l.Label.StartsWith("min", StringComparison.Ordinal) ? v < l.Value : l.Label.StartsWith("max", StringComparison.Ordinal) && v > l.Value);
            canvas.DrawCircle(m.Px(i + 1), m.Py(v), 2.6f * s, outside ? fail : pass);
        }
    }
}
