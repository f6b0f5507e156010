using System.Globalization;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>The IES TM-30 colour vector graphic and the 16 hue-bin bars (local chroma shift and fidelity).</summary>
public static class VectorGraphic
{
    /// <summary>Draws the graphic.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="fidelity">CIE 224 / TM-30 result.</param>
    /// <param name="name">Source name.</param>
    public static void Draw(SKCanvas canvas, SKSize size, FidelityResult fidelity, string name)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(fidelity);
        float s = Style.Scale(size);
        Style.Text(canvas, $"Colour vector graphic and hue bins — {name}", 30 * s, 36 * s, 20 * s, Style.Ink, bold: true);
        float r = Math.Min(size.Height - 150 * s, size.Width * 0.45f) / 2 / 1.35f;
        float cx = 30 * s + 1.35f * r, cy = 80 * s + 1.35f * r;
        var bins = fidelity.HueBins;
        var colours = BinColors(fidelity);
        // Sectors.
        for (int j = 0; j < 16; j++)
        {
            using var path = new SKPath();
            path.MoveTo(cx, cy);
            path.ArcTo(new SKRect(cx - 1.3f * r, cy - 1.3f * r, cx + 1.3f * r, cy + 1.3f * r), -(j + 1) * 22.5f, 22.5f, false);
            path.Close();
            using var fill = Style.Fill(colours[j].WithAlpha(60));
            canvas.DrawPath(path, fill);
        }
        using (var guide = Style.Stroke(Style.Muted, 1 * s))
            foreach (float k in new[] { 0.8f, 0.9f, 1.1f, 1.2f })
                Style.DashedPolyline(canvas, Enumerable.Range(0, 181).Select(i => new SKPoint(cx + k * r * MathF.Cos(i * MathF.PI / 90), cy + k * r * MathF.Sin(i * MathF.PI / 90))).ToArray(), guide, 4 * s, 4 * s);
        using (var unit = Style.Stroke(Style.Ink, 2 * s)) canvas.DrawCircle(cx, cy, r, unit);
        var pts = new List<SKPoint>(16);
        for (int j = 0; j < 16; j++)
        {
            var b = bins[j];
            if (b.SampleCount == 0) continue; // an empty bin (not possible with the 99 CES and a normal reference) is skipped
            double phi = Math.Atan2(b.ReferenceB, b.ReferenceA);
            double cr = Math.Sqrt(b.ReferenceA * b.ReferenceA + b.ReferenceB * b.ReferenceB);
            double tx = Math.Cos(phi) + (b.TestA - b.ReferenceA) / cr, ty = Math.Sin(phi) + (b.TestB - b.ReferenceB) / cr;
            var from = new SKPoint(cx + (float)Math.Cos(phi) * r, cy - (float)Math.Sin(phi) * r);
            var to = new SKPoint(cx + (float)tx * r, cy - (float)ty * r);
            pts.Add(to);
            using var arrow = Style.Stroke(colours[j].WithAlpha(255), 2.2f * s);
            canvas.DrawLine(from, to, arrow);
            using var dot = Style.Fill(colours[j]);
            canvas.DrawCircle(to, 3.5f * s, dot);
        }
        using (var poly = new SKPath())
        {
            poly.AddPoly(pts.ToArray(), true);
            using var pen = Style.Stroke(Style.Accent, 2.5f * s);
            canvas.DrawPath(poly, pen);
        }
        Style.Text(canvas, string.Create(CultureInfo.InvariantCulture, $"Rf {fidelity.Rf:0}   Rg {fidelity.Rg:0}"), cx, cy + 6 * s, 18 * s, Style.Ink, SKTextAlign.Center, bold: true);
        Style.Text(canvas, "circle = reference; polygon = test (bin averages); arrows per hue bin; dashed: ±10 %, ±20 % chroma", 30 * s, size.Height - 18 * s, 12 * s, Style.Muted);

        // Hue-bin panel, an arrangement of our own: one row per hue bin (bin 1 at the top), a horizontal bar for the local
        // chroma shift Rcs,hj from a zero line, and the local fidelity Rf,hj written at the bar's end, with the bin's colour chip.
        float left = cx + 1.45f * r + 90 * s, right = size.Width - 70 * s, barTop = 90 * s, barBottom = size.Height - 90 * s;
        var m = new AxisMapping(new SKRect(left, barTop, right, barBottom), -40, 40, 0, 16);
        using (var grid = Style.Stroke(Style.Grid, 1 * s))
            foreach (var gx in new[] { -40, -30, -20, -10, 10, 20, 30, 40 }) canvas.DrawLine(m.Px(gx), m.Plot.Top, m.Px(gx), m.Plot.Bottom, grid);
        foreach (var gx in new[] { -40, -20, 0, 20, 40 })
            Style.Text(canvas, gx.ToString("+0;-0;0", CultureInfo.InvariantCulture), m.Px(gx), m.Plot.Bottom + 16 * s, 11 * s, Style.Muted, SKTextAlign.Center);
        Style.Text(canvas, "local chroma shift Rcs,hj (%) — bar;  local fidelity Rf,hj — number at its end", (m.Plot.Left + m.Plot.Right) / 2, m.Plot.Bottom + 36 * s, 12 * s, Style.Muted, SKTextAlign.Center);
        float rowH = m.Plot.Height / 16;
        for (int j = 0; j < 16; j++)
        {
            float yc = m.Plot.Top + (j + 0.5f) * rowH;
            using (var chip = Style.Fill(colours[j])) canvas.DrawRoundRect(new SKRect(m.Plot.Left - 84 * s, yc - 0.32f * rowH, m.Plot.Left - 66 * s, yc + 0.32f * rowH), 3 * s, 3 * s, chip);
            Style.Text(canvas, string.Create(CultureInfo.InvariantCulture, $"bin {j + 1}"), m.Plot.Left - 60 * s, yc + 4 * s, 11 * s, Style.Ink);
            double v = bins[j].Rcs * 100;
            if (!double.IsFinite(v)) { Style.Text(canvas, "no samples", m.Px(0) + 6 * s, yc + 4 * s, 11 * s, Style.Muted); continue; }
            float x0 = m.Px(0), x1 = m.Px(Math.Clamp(v, -40, 40));
            using var fill = Style.Fill(colours[j]);
            canvas.DrawRect(new SKRect(Math.Min(x0, x1), yc - 0.36f * rowH, Math.Max(x0, x1), yc + 0.36f * rowH), fill);
            string rf = bins[j].Rf.ToString("0", CultureInfo.InvariantCulture);
            if (v >= 0) Style.Text(canvas, rf, x1 + 5 * s, yc + 4 * s, 11 * s, Style.Ink);
            else Style.Text(canvas, rf, x1 - 5 * s, yc + 4 * s, 11 * s, Style.Ink, SKTextAlign.Right);
        }
        using (var zero = Style.Stroke(Style.Ink, 1.2f * s)) canvas.DrawLine(m.Px(0), m.Plot.Top, m.Px(0), m.Plot.Bottom, zero);
        Style.Text(canvas, "Hue bins", m.Plot.Left - 84 * s, m.Plot.Top - 10 * s, 13 * s, Style.Ink, bold: true);
    }

    /// <summary>Display colours of the 16 hue bins: the mean of each bin's colour evaluation samples under the
    /// reference illuminant (2°, Bradford to D65, sRGB), with its chroma doubled so neighbouring bins stay distinct.</summary>
    private static SKColor[] BinColors(FidelityResult f)
    {
        var r = f.Reference.Samples;
        var (white, samples) = SampleColors.Under(r, SampleSet.ColorEvaluationSamples, Observer.Cie1931TwoDegree);
        var colours = new SKColor[16];
        for (int j = 1; j <= 16; j++)
        {
            var idx = Enumerable.Range(0, 99).Where(i => f.CesBins[i] == j).ToArray();
            if (idx.Length == 0) { colours[j - 1] = SKColors.Gray; continue; }
            var mean = new Tristimulus(idx.Average(i => samples[i].X), idx.Average(i => samples[i].Y), idx.Average(i => samples[i].Z));
            var (lr, lg, lb) = Srgb.Linear(Srgb.AdaptToD65(mean, white));
            double grey = (lr + lg + lb) / 3;
            double Boost(double c) => Math.Clamp(grey + 2 * (c - grey), 0, 1);
            double max = Math.Max(1e-9, Math.Max(Boost(lr), Math.Max(Boost(lg), Boost(lb))));
            double k = Math.Min(1, 0.85 / max);
            colours[j - 1] = new SKColor((byte)(255 * Srgb.Encode(Boost(lr) * k)), (byte)(255 * Srgb.Encode(Boost(lg) * k)), (byte)(255 * Srgb.Encode(Boost(lb) * k)));
        }
        return colours;
    }
}
