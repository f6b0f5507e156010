using Lumen.Mixing;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>A channel-mix sweep: each channel's level against CCT (top) and Rf and Rg against CCT (bottom).</summary>
public static class MixSweepPlot
{
    /// <summary>Draws the sweep.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size, pixels.</param>
    /// <param name="sweep">The results, one per CCT, in CCT order.</param>
    public static void Draw(SKCanvas canvas, SKSize size, IReadOnlyList<MixResult> sweep)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(sweep);
        if (sweep.Count == 0) return;
        float s = Style.Scale(size);
        double t0 = sweep.Min(r => r.Cct.CctKelvin), t1 = sweep.Max(r => r.Cct.CctKelvin);
        if (!(t1 > t0)) { t0 -= 100; t1 += 100; }
        float mid = size.Height * 0.55f;
        var top = new AxisMapping(new SKRect(90 * s, 60 * s, size.Width - 200 * s, mid - 40 * s), t0, t1, 0, 1.05);
        var bottom = new AxisMapping(new SKRect(90 * s, mid + 20 * s, size.Width - 200 * s, size.Height - 70 * s), t0, t1,
            Math.Max(0, Math.Floor(sweep.SelectMany(r => new[] { r.Metrics.Rf, r.Metrics.Rg }).Where(double.IsFinite).DefaultIfEmpty(50).Min() / 10) * 10 - 5),
            Math.Ceiling(sweep.SelectMany(r => new[] { r.Metrics.Rf, r.Metrics.Rg }).Where(double.IsFinite).DefaultIfEmpty(100).Max() / 10) * 10 + 5);
        top.DrawAxes(canvas, "", "level (0–1)", s, "0", "0.0");
        bottom.DrawAxes(canvas, "CCT of the target (K)", "Rf, Rg", s, "0", "0");
        Style.Text(canvas, "Channel levels and colour rendition across the sweep", 90 * s, 36 * s, 20 * s, Style.Ink, bold: true);
        var channels = sweep[0].Channels;
        for (int c = 0; c < channels.Count; c++)
        {
            var pts = sweep.Select(r => new SKPoint(top.Px(r.Cct.CctKelvin), top.Py(r.Levels[c]))).ToArray();
            using var pen = Style.Stroke(Style.Series[c % Style.Series.Length], 2.4f * s);
            using (var path = new SKPath()) { path.AddPoly(pts, false); canvas.DrawPath(path, pen); }
            Style.Text(canvas, channels[c], size.Width - 190 * s, top.Plot.Top + (16 + 20 * c) * s, 13 * s, Style.Series[c % Style.Series.Length], bold: true);
        }
        foreach (var (pick, label, color) in new (Func<MixResult, double>, string, SKColor)[] { (r => r.Metrics.Rf, "Rf", Style.Ink), (r => r.Metrics.Rg, "Rg", Style.Accent) })
        {
            var pts = sweep.Where(r => double.IsFinite(pick(r))).Select(r => new SKPoint(bottom.Px(r.Cct.CctKelvin), bottom.Py(pick(r)))).ToArray();
            if (pts.Length < 2) continue;
            using var pen = Style.Stroke(color, 2.4f * s);
            if (label == "Rf") { using var path = new SKPath(); path.AddPoly(pts, false); canvas.DrawPath(path, pen); }
            else Style.DashedPolyline(canvas, pts, pen, 8 * s, 5 * s);
            Style.Text(canvas, label, size.Width - 190 * s, bottom.Plot.Top + (label == "Rf" ? 16 : 36) * s, 13 * s, color, bold: true);
        }
    }
}
