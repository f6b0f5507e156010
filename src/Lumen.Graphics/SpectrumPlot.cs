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
    /// <param name="referenceIlluminant">The reference illuminant the CIE 224 calculation used (drawn scaled to the same
    /// luminance), or null for none.</param>
    /// <param name="normalise">Normalise to a peak of 1 (else absolute, in the spectrum's unit).</param>
    public static void Draw(SKCanvas canvas, SKSize size, Spectrum spectrum, ReferenceIlluminant? referenceIlluminant, bool normalise = true)
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
        if (referenceIlluminant is { } r)
        {
            var samples = Resampler.ForCieSums(spectrum);
            double k = Colorimeter.RawSums(samples, Observer.Cie1931TwoDegree).Y / Colorimeter.RawSums(r.Samples, Observer.Cie1931TwoDegree).Y * scale;
            reference = r.Samples.Values.Select(x => x * k).ToArray();
            refStart = r.Samples.StartNm;
            refStep = r.Samples.StepNm;
            if (double.IsFinite(k) && k > 0) yMax = Math.Max(yMax, reference.Max() * 1.05);
            else reference = null;
        }
        var plot = new SKRect(90 * s, 60 * s, size.Width - 30 * s, size.Height - 110 * s);
        var m = new AxisMapping(plot, x0, x1, 0, yMax);
        m.DrawAxes(canvas, "wavelength (nm)", normalise ? "relative spectral power (peak = 1)" : $"spectral power ({spectrum.Unit.Symbol()})", s, "0", normalise ? "0.0#" : "G3");
        // Hue band under the axis.
        for (int wl = (int)Math.Ceiling(x0); wl < x1; wl++)
        {
            var c = WavelengthColor(wl);
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
            var c = WavelengthColor(0.5 * (w[i] + w[i1]));
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
            Style.Text(canvas, string.Create(CultureInfo.InvariantCulture, $"CIE 224 reference at {referenceIlluminant!.CctKelvin:0} K, same luminance"), lx + 34 * s, ly + 20 * s, 13 * s, Style.Ink);
        }
    }

    /// <summary>
    /// Several spectra overlaid for comparison, each scaled to the same luminance (equal Σ S·ȳ, CIE 1931 2°) and then all by
    /// one factor so the highest peak is 1; each in its own colour and dash pattern, with a legend.
    /// </summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size, pixels.</param>
    /// <param name="spectra">The spectra, the reference first (drawn solid).</param>
    public static void DrawMany(SKCanvas canvas, SKSize size, IReadOnlyList<Spectrum> spectra)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(spectra);
        float s = Style.Scale(size);
        var scales = spectra.Select(sp => Colorimeter.RawSums(Resampler.ForCieSums(sp), Observer.Cie1931TwoDegree).Y is var y && y > 0 && double.IsFinite(y) ? 1 / y : 0).ToArray();
        double top = spectra.Select((sp, i) => sp.Values.ToArray().DefaultIfEmpty(0).Max() * scales[i]).DefaultIfEmpty(0).Max();
        if (!(top > 0)) top = 1;
        for (int i = 0; i < scales.Length; i++) scales[i] /= top;
        double x0 = Math.Min(380, spectra.Min(sp => sp.FirstNm)), x1 = Math.Max(780, spectra.Max(sp => sp.LastNm));
        var plot = new SKRect(90 * s, 60 * s, size.Width - 30 * s, size.Height - 110 * s);
        var m = new AxisMapping(plot, x0, x1, 0, 1.1);
        m.DrawAxes(canvas, "wavelength (nm)", "relative spectral power (equal luminance)", s, "0", "0.0#");
        for (int wl = (int)Math.Ceiling(x0); wl < x1; wl++)
        {
            using var p = Style.Fill(WavelengthColor(wl));
            canvas.DrawRect(new SKRect(m.Px(wl), plot.Bottom + 52 * s, m.Px(wl + 1) + 0.5f, plot.Bottom + 66 * s), p);
        }
        float[][] dashes = [[], [10, 5], [3, 4], [12, 4, 3, 4]];
        canvas.Save();
        canvas.ClipRect(plot);
        for (int i = 0; i < spectra.Count; i++)
        {
            var sp = spectra[i];
            var pts = new SKPoint[sp.Count];
            for (int k = 0; k < sp.Count; k++) pts[k] = new SKPoint(m.Px(sp.WavelengthsNm[k]), m.Py(sp.Values[k] * scales[i]));
            using var pen = Style.Stroke(Style.Series[i % Style.Series.Length], (i == 0 ? 2.6f : 2f) * s);
            var d = dashes[i % dashes.Length];
            if (d.Length == 0)
            {
                using var path = new SKPath();
                path.AddPoly(pts, false);
                canvas.DrawPath(path, pen);
            }
            else Style.DashedPolyline(canvas, pts, pen, d[0] * s, d[1] * s);
        }
        canvas.Restore();
        Style.Text(canvas, spectra.Count == 2 ? $"Spectra — {spectra[0].Name} and {spectra[1].Name}" : $"Spectra — {spectra.Count} sources", plot.Left, 36 * s, 20 * s, Style.Ink, bold: true);
        float lx = plot.Right - 330 * s, ly = plot.Top + 22 * s;
        for (int i = 0; i < spectra.Count; i++)
        {
            using var pen = Style.Stroke(Style.Series[i % Style.Series.Length], 2.4f * s);
            var d = dashes[i % dashes.Length];
            var a = new SKPoint(lx, ly + i * 20 * s - 4 * s);
            var b = new SKPoint(lx + 30 * s, ly + i * 20 * s - 4 * s);
            if (d.Length == 0) canvas.DrawLine(a, b, pen); else Style.DashedLine(canvas, a, b, pen, d[0] * s, d[1] * s);
            Style.Text(canvas, spectra[i].Name + (i == 0 ? " (reference)" : ""), lx + 38 * s, ly + i * 20 * s, 13 * s, Style.Ink);
        }
    }

    /// <summary>A display colour for a wavelength: the spectrum-locus chromaticity at full brightness, dimmed at the ends by V(λ).</summary>
    /// <param name="nm">Wavelength.</param>
    /// <returns>The colour.</returns>
    public static SKColor WavelengthColor(double nm)
    {
        int wl = (int)Math.Round(Math.Clamp(nm, 360, 830));
        var cmf = CieTables.ColorMatchingFunctions(Observer.Cie1931TwoDegree);
        var t = new Tristimulus(cmf.At("x_bar", wl), cmf.At("y_bar", wl), cmf.At("z_bar", wl));
        var rgb = Srgb.LightColor(t.Chromaticity);
        double dim = Math.Clamp(0.25 + 3 * cmf.At("y_bar", wl) + (wl < 450 ? 0.4 * cmf.At("z_bar", wl) : 0), 0, 1);
        return new SKColor((byte)(rgb.R * dim), (byte)(rgb.G * dim), (byte)(rgb.B * dim));
    }
}
