using System.Globalization;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;
using SkiaSharp;

namespace Lumen.Graphics;

/// <summary>The spectral power distribution with a hue-coloured wavelength band and the reference illuminant.</summary>
public static class SpectrumPlot
{
    /// <summary>Draws the plot.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="spectrum">The measured spectrum.</param>
    /// <param name="cctKelvin">Its CCT (for the reference overlay), or NaN for none.</param>
    /// <param name="normalise">Normalise to a peak of 1 (else absolute, in the spectrum's unit).</param>
    public static void Draw(SKCanvas canvas, SKSize size, Spectrum spectrum, double cctKelvin, bool normalise = true)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(spectrum);
        float s = Style.Scale(size);
        var w = spectrum.WavelengthsNm.ToArray();
        var v = spectrum.Values.ToArray();
        double peak = v.Max();
        double scale = normalise && peak > 0 ? 1 / peak : 1;
        double x0 = Math.Min(380, w[0]), x1 = Math.Max(780, w[^1]);
        double yMax = v.Max() * scale * 1.1;
        if (!(yMax > 0)) yMax = 1; // a dark or negative spectrum still gets a usable axis
        // Reference at the same CCT, scaled to the same luminous (ȳ-weighted) sum.
        double[]? reference = null;
        int refStart = 0, refStep = 1;
        if (double.IsFinite(cctKelvin) && cctKelvin >= 1000 && cctKelvin <= 25000)
        {
            var samples = Resampler.ForCieSums(spectrum);
            var r = ReferenceIlluminants.ForCie224(cctKelvin, samples.StartNm, samples.StepNm, samples.Values.Length);
            var y = Colorimeter.CmfWeights(Observer.Cie1931TwoDegree, samples.StartNm, samples.StepNm, samples.Values.Length).Weights[1];
            double k = SpectralSum.Dot(samples.Values, y) / SpectralSum.Dot(r.Samples.Values, y) * scale;
            reference = r.Samples.Values.Select(x => x * k).ToArray();
            refStart = samples.StartNm;
            refStep = samples.StepNm;
            yMax = Math.Max(yMax, reference.Max() * 1.05);
        }
        var plot = new SKRect(90 * s, 60 * s, size.Width - 30 * s, size.Height - 110 * s);
        var m = new AxisMapping(plot, x0, x1, 0, yMax);
        m.DrawAxes(canvas, "wavelength (nm)", normalise ? "relative spectral power (peak = 1)" : $"spectral power ({spectrum.Unit.Symbol()})", s, "0", normalise ? "0.0#" : "G3");
        // Hue band under the axis.
        for (int wl = (int)Math.Ceiling(x0); wl < x1; wl++)
        {
            var c = WavelengthColour(wl);
            using var p = Style.Fill(c);
            canvas.DrawRect(new SKRect(m.Px(wl), plot.Bottom + 52 * s, m.Px(wl + 1) + 0.5f, plot.Bottom + 66 * s), p);
        }
        canvas.Save();
        canvas.ClipRect(plot);
        // Coloured fill under the curve, then the curve.
        int stride = Math.Max(1, w.Length / 160);
        for (int i0 = 0; i0 < w.Length - 1; i0 += stride)
        {
            int i = i0, i1 = Math.Min(w.Length - 1, i0 + stride);
            var c = WavelengthColour(0.5 * (w[i] + w[i1]));
            using var path = new SKPath();
            path.MoveTo(m.Px(w[i]), m.Py(0));
            for (int q = i; q <= i1; q++) path.LineTo(m.Px(w[q]), m.Py(Math.Max(0, v[q] * scale)));
            path.LineTo(m.Px(w[i1]), m.Py(0));
            path.Close();
            using var fill = Style.Fill(c.WithAlpha(110));
            canvas.DrawPath(path, fill);
        }
        using (var curve = new SKPath())
        {
            curve.MoveTo(m.Px(w[0]), m.Py(v[0] * scale));
            for (int i = 1; i < w.Length; i++) curve.LineTo(m.Px(w[i]), m.Py(v[i] * scale));
            using var pen = Style.Stroke(Style.Ink, 2f * s);
            canvas.DrawPath(curve, pen);
        }
        if (reference is not null)
        {
            var refPts = reference.Select((v, i) => new SKPoint(m.Px(refStart + i * refStep), m.Py(v))).ToArray();
            using var pen = Style.Stroke(Style.Accent, 2f * s);
            Style.DashedPolyline(canvas, refPts, pen, 8 * s, 5 * s);
        }
        canvas.Restore();
        Style.Text(canvas, $"Spectrum — {spectrum.Name}", plot.Left, 36 * s, 20 * s, Style.Ink, bold: true);
        float lx = plot.Right - 420 * s, ly = plot.Top + 24 * s;
        using (var pen = Style.Stroke(Style.Ink, 2 * s)) canvas.DrawLine(lx, ly - 4 * s, lx + 26 * s, ly - 4 * s, pen);
        Style.Text(canvas, "measured", lx + 34 * s, ly, 13 * s, Style.Ink);
        if (reference is not null)
        {
            using (var pen = Style.Stroke(Style.Accent, 2 * s)) Style.DashedLine(canvas, new SKPoint(lx, ly + 16 * s), new SKPoint(lx + 26 * s, ly + 16 * s), pen, 8 * s, 5 * s);
            Style.Text(canvas, string.Create(CultureInfo.InvariantCulture, $"CIE 224 reference at {cctKelvin:0} K, same luminance"), lx + 34 * s, ly + 20 * s, 13 * s, Style.Ink);
        }
    }

    /// <summary>A display colour for a wavelength: the spectrum-locus chromaticity at full brightness, dimmed at the ends by V(λ).</summary>
    /// <param name="nm">Wavelength.</param>
    /// <returns>The colour.</returns>
    public static SKColor WavelengthColour(double nm)
    {
        int wl = (int)Math.Round(Math.Clamp(nm, 360, 830));
        var cmf = CieTables.ColourMatchingFunctions(Observer.Cie1931TwoDegree);
        var t = new Tristimulus(cmf.At("x_bar", wl), cmf.At("y_bar", wl), cmf.At("z_bar", wl));
        var rgb = Srgb.LightColour(t.Chromaticity);
        double dim = Math.Clamp(0.25 + 3 * cmf.At("y_bar", wl) + (wl < 450 ? 0.4 * cmf.At("z_bar", wl) : 0), 0, 1);
        return new SKColor((byte)(rgb.R * dim), (byte)(rgb.G * dim), (byte)(rgb.B * dim));
    }
}

/// <summary>
/// Swatches: the light's own colour, and test-colour samples rendered under the test source beside the same
/// samples under the reference illuminant.
/// </summary>
/// <remarks>Display choices (stated on the image): samples are computed with the CIE 1931 2° observer, each
/// light normalised to Y = 1 for its white, adapted to D65 by Bradford and shown in sRGB; the light's own patch
/// is its chromaticity at full display brightness.</remarks>
public static class SwatchPlot
{
    /// <summary>Draws the swatches.</summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size.</param>
    /// <param name="spectrum">The light.</param>
    /// <param name="chromaticity2Degree">Its chromaticity.</param>
    /// <param name="cctKelvin">Its CCT (for the reference).</param>
    /// <param name="fidelity">CIE 224 result (its CES hue bins pick one CES per bin), or null.</param>
    public static void Draw(SKCanvas canvas, SKSize size, Spectrum spectrum, Chromaticity chromaticity2Degree, double cctKelvin, FidelityResult? fidelity)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(spectrum);
        float s = Math.Max(0.5f, Math.Min(size.Width / 1200f, size.Height / 480f));
        Style.Text(canvas, $"Colour samples — {spectrum.Name}", 30 * s, 36 * s, 20 * s, Style.Ink, bold: true);
        Style.Text(canvas, "Each pair: top = under the test light, bottom = under the reference. sRGB display, samples adapted to D65 (Bradford), 2° observer.", 30 * s, 58 * s, 12.5f * s, Style.Muted);
        var own = chromaticity2Degree.IsDefined ? Srgb.LightColour(chromaticity2Degree) : new Rgb8(128, 128, 128, false);
        using (var p = Style.Fill(new SKColor(own.R, own.G, own.B))) canvas.DrawRoundRect(new SKRect(30 * s, 80 * s, 230 * s, 200 * s), 8 * s, 8 * s, p);
        Style.Text(canvas, "the light itself", 130 * s, 220 * s, 13 * s, Style.Ink, SKTextAlign.Center);
        Style.Text(canvas, "(chromaticity at full brightness)", 130 * s, 236 * s, 11 * s, Style.Muted, SKTextAlign.Center);
        if (!double.IsFinite(cctKelvin) || cctKelvin < 1000 || cctKelvin > 25000)
        {
            Style.Text(canvas, "No reference illuminant at this CCT: sample colours not shown.", 260 * s, 140 * s, 14 * s, Style.Fail);
            return;
        }
        var test = Resampler.ForCieSums(spectrum);
        var reference = ReferenceIlluminants.ForCie13_3(cctKelvin, test.StartNm, test.StepNm, test.Values.Length).Samples;
        var (tw, ts) = SampleColours.Under(test, "cri_test_samples", Observer.Cie1931TwoDegree);
        var (rw, rs) = SampleColours.Under(reference, "cri_test_samples", Observer.Cie1931TwoDegree);
        float top = 80 * s;
        Style.Text(canvas, "CIE 13.3 test colour samples TCS01–TCS14", 260 * s, top - 6 * s, 13 * s, Style.Ink, bold: true);
        Row(canvas, s, 260 * s, top + 4 * s, size.Width - 290 * s, ts, tw, rs, rw, Enumerable.Range(1, 14).Select(i => $"R{i}").ToArray());
        if (fidelity is not null)
        {
            var (ctw, cts) = SampleColours.Under(test, test.StepNm == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm", Observer.Cie1931TwoDegree);
            var (crw, crs) = SampleColours.Under(reference, test.StepNm == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm", Observer.Cie1931TwoDegree);
            var picks = Enumerable.Range(1, 16).Select(bin => Enumerable.Range(0, 99).Where(i => fidelity.CesBins[i] == bin).DefaultIfEmpty(-1).First()).Where(i => i >= 0).ToArray();
            float top2 = top + 200 * s;
            Style.Text(canvas, "CIE 224 colour evaluation samples, one per TM-30 hue bin", 30 * s, top2 - 6 * s, 13 * s, Style.Ink, bold: true);
            Row(canvas, s, 30 * s, top2 + 4 * s, size.Width - 60 * s, picks.Select(i => cts[i]).ToArray(), ctw, picks.Select(i => crs[i]).ToArray(), crw,
                picks.Select(i => $"CES{i + 1}").ToArray());
        }
    }

    private static void Row(SKCanvas canvas, float s, float left, float top, float width, IReadOnlyList<Tristimulus> test, Tristimulus testWhite,
        IReadOnlyList<Tristimulus> reference, Tristimulus referenceWhite, string[] labels)
    {
        int n = test.Count;
        int perRow = Math.Min(n, Math.Max(1, (int)(width / (62 * s))));
        float cell = width / perRow;
        for (int i = 0; i < n; i++)
        {
            float x = left + (i % perRow) * cell, y = top + (i / perRow) * 150 * s;
            var a = Srgb.ToRgb8(Srgb.AdaptToD65(test[i], testWhite));
            var b = Srgb.ToRgb8(Srgb.AdaptToD65(reference[i], referenceWhite));
            using (var p = Style.Fill(new SKColor(a.R, a.G, a.B))) canvas.DrawRect(new SKRect(x, y, x + cell - 6 * s, y + 50 * s), p);
            using (var p = Style.Fill(new SKColor(b.R, b.G, b.B))) canvas.DrawRect(new SKRect(x, y + 50 * s, x + cell - 6 * s, y + 100 * s), p);
            Style.Text(canvas, labels[i], x + (cell - 6 * s) / 2, y + 116 * s, 11.5f * s, Style.Ink, SKTextAlign.Center);
        }
    }
}

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
        var colours = BinColours(fidelity);
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

        // Bars: Rcs,hj (local chroma shift, %) with Rf,hj above.
        float left = cx + 1.45f * r, right = size.Width - 30 * s, barTop = 90 * s, barBottom = size.Height - 90 * s;
        var m = new AxisMapping(new SKRect(left + 60 * s, barTop, right, barBottom), 0.5, 16.5, -40, 40);
        m.DrawAxes(canvas, "hue bin", "local chroma shift Rcs,hj (%)", s * 0.9f, "0", "0");
        for (int j = 0; j < 16; j++)
        {
            double v = bins[j].Rcs * 100;
            if (!double.IsFinite(v)) continue;
            float x0 = m.Px(j + 1 - 0.38), x1 = m.Px(j + 1 + 0.38);
            float y0 = m.Py(0), y1 = m.Py(Math.Clamp(v, -40, 40));
            using var fill = Style.Fill(colours[j]);
            canvas.DrawRect(new SKRect(x0, Math.Min(y0, y1), x1, Math.Max(y0, y1)), fill);
            Style.Text(canvas, bins[j].Rf.ToString("0", CultureInfo.InvariantCulture), (x0 + x1) / 2, m.Plot.Top + 16 * s, 11 * s, Style.Ink, SKTextAlign.Center);
        }
        using (var zero = Style.Stroke(Style.Ink, 1.2f * s)) canvas.DrawLine(m.Plot.Left, m.Py(0), m.Plot.Right, m.Py(0), zero);
        Style.Text(canvas, "numbers: local fidelity Rf,hj", m.Plot.Left + 4 * s, m.Plot.Top - 8 * s, 12 * s, Style.Muted);
    }

    /// <summary>Display colours of the 16 hue bins: the mean of each bin's colour evaluation samples under the
    /// reference illuminant (2°, Bradford to D65, sRGB), with its chroma doubled so neighbouring bins stay distinct.</summary>
    private static SKColor[] BinColours(FidelityResult f)
    {
        var r = f.Reference.Samples;
        var (white, samples) = SampleColours.Under(r, r.StepNm == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm", Observer.Cie1931TwoDegree);
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
