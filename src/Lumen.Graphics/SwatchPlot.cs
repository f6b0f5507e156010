using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;
using SkiaSharp;

namespace Lumen.Graphics;

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
    /// <param name="assessment">Its assessment: the TCS row uses the CIE 13.3 reference and the CES row the CIE 224 reference
    /// that the calculators used (never rebuilt here); a row is left out when its result was not computed.</param>
    public static void Draw(SKCanvas canvas, SKSize size, Spectrum spectrum, Assessment assessment)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(assessment);
        var chromaticity2Degree = assessment.Chromaticity2Degree;
        var cri = assessment.Cri;
        var fidelity = assessment.Fidelity;
        float s = Math.Max(0.5f, Math.Min(size.Width / 1200f, size.Height / 480f));
        Style.Text(canvas, $"Colour samples — {spectrum.Name}", 30 * s, 36 * s, 20 * s, Style.Ink, bold: true);
        Style.Text(canvas, "Each pair: top = under the test light, bottom = under the reference. sRGB display, samples adapted to D65 (Bradford), 2° observer.", 30 * s, 58 * s, 12.5f * s, Style.Muted);
        var own = chromaticity2Degree.IsDefined ? Srgb.LightColor(chromaticity2Degree) : new Rgb8(128, 128, 128, false);
        using (var p = Style.Fill(new SKColor(own.R, own.G, own.B))) canvas.DrawRoundRect(new SKRect(30 * s, 80 * s, 230 * s, 200 * s), 8 * s, 8 * s, p);
        Style.Text(canvas, "the light itself", 130 * s, 220 * s, 13 * s, Style.Ink, SKTextAlign.Center);
        Style.Text(canvas, "(chromaticity at full brightness)", 130 * s, 236 * s, 11 * s, Style.Muted, SKTextAlign.Center);
        if (cri is null && fidelity is null)
        {
            Style.Text(canvas, "No reference illuminant at this CCT: sample colours not shown.", 260 * s, 140 * s, 14 * s, Style.Fail);
            return;
        }
        var test = Resampler.ForCieSums(spectrum);
        float top = 80 * s;
        if (cri is not null)
        {
            var (tw, ts) = SampleColors.Under(test, SampleSet.CieTestColorSamples, Observer.Cie1931TwoDegree);
            var (rw, rs) = SampleColors.Under(cri.Reference.Samples, SampleSet.CieTestColorSamples, Observer.Cie1931TwoDegree);
            Style.Text(canvas, "CIE 13.3 test colour samples TCS01–TCS14", 260 * s, top - 6 * s, 13 * s, Style.Ink, bold: true);
            Row(canvas, s, 260 * s, top + 4 * s, size.Width - 290 * s, ts, tw, rs, rw, Enumerable.Range(1, 14).Select(i => $"R{i}").ToArray());
        }
        if (fidelity is not null)
        {
            var (ctw, cts) = SampleColors.Under(test, SampleSet.ColorEvaluationSamples, Observer.Cie1931TwoDegree);
            var (crw, crs) = SampleColors.Under(fidelity.Reference.Samples, SampleSet.ColorEvaluationSamples, Observer.Cie1931TwoDegree);
            var picks = Enumerable.Range(1, 16).Select(bin => Enumerable.Range(0, 99).Where(i => fidelity.CesBins[i] == bin).DefaultIfEmpty(-1).First()).Where(i => i >= 0).ToArray();
            float top2 = top + 200 * s;
            Style.Text(canvas, "CIE 224 colour evaluation samples, one per TM-30 hue bin", 30 * s, top2 - 6 * s, 13 * s, Style.Ink, bold: true);
            Row(canvas, s, 30 * s, top2 + 4 * s, size.Width - 60 * s, picks.Select(i => cts[i]).ToArray(), ctw, picks.Select(i => crs[i]).ToArray(), crw,
                picks.Select(i => $"CES{i + 1}").ToArray());
        }
    }

    /// <summary>
    /// Sample colours under a reference and under each other source, side by side, after white balance on each (CAT16 to
    /// D65, sRGB): the 14 CIE 13.3 test colour samples and one CIE 224 sample per TM-30 hue bin of the reference.
    /// </summary>
    /// <param name="canvas">Canvas.</param>
    /// <param name="size">Size, pixels.</param>
    /// <param name="reference">The reference source.</param>
    /// <param name="referenceFidelity">The reference's CIE 224 result (its hue bins pick one sample per bin), or null for every sixth sample.</param>
    /// <param name="others">The other sources (one row each).</param>
    public static void DrawComparison(SKCanvas canvas, SKSize size, Spectrum reference, FidelityResult? referenceFidelity, IReadOnlyList<Spectrum> others)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(reference);
        ArgumentNullException.ThrowIfNull(others);
        var sources = new[] { reference }.Concat(others).ToArray();
        float s = Math.Max(0.5f, Math.Min(size.Width / 1200f, size.Height / (180f + 70f * sources.Length * 2)));
        Style.Text(canvas, $"Colour samples after white balance — {reference.Name} (reference) and {others.Count} other source(s)", 30 * s, 34 * s, 18 * s, Style.Ink, bold: true);
        Style.Text(canvas, "Each row: the samples under one source, white-balanced to D65 by CAT16 (D = 1), sRGB display, 2° observer.", 30 * s, 56 * s, 12.5f * s, Style.Muted);
        var picks = referenceFidelity is { } f
            ? Enumerable.Range(1, 16).Select(bin => Enumerable.Range(0, 99).Where(i => f.CesBins[i] == bin).DefaultIfEmpty(-1).First()).Where(i => i >= 0).ToArray()
            : Enumerable.Range(0, 16).Select(i => i * 6).ToArray();
        var tcs = sources.Select(src => Lumen.Comparison.SampleShift.AdaptedXyz(Resampler.ForCieSums(src), SampleSet.CieTestColorSamples)).ToArray();
        var ces = sources.Select(src => Lumen.Comparison.SampleShift.AdaptedXyz(Resampler.ForCieSums(src), SampleSet.ColorEvaluationSamples)).ToArray();
        float nameWidth = 220 * s, left = 30 * s + nameWidth;
        void Block(string title, float top, IReadOnlyList<Tristimulus>[] colours, int[] indices, Func<int, string> label)
        {
            Style.Text(canvas, title, 30 * s, top - 8 * s, 13 * s, Style.Ink, bold: true);
            float cell = (size.Width - left - 30 * s) / indices.Length;
            for (int r = 0; r < colours.Length; r++)
            {
                float y = top + r * 40 * s;
                Style.Text(canvas, sources[r].Name + (r == 0 ? " (ref.)" : ""), 30 * s, y + 25 * s, 12 * s, r == 0 ? Style.Ink : Style.Muted, bold: r == 0);
                for (int k = 0; k < indices.Length; k++)
                {
                    var c = colours[r][indices[k]];
                    var rgb = Srgb.ToRgb8(new Tristimulus(c.X / 100, c.Y / 100, c.Z / 100));
                    using var p = Style.Fill(new SKColor(rgb.R, rgb.G, rgb.B));
                    canvas.DrawRect(new SKRect(left + k * cell, y, left + (k + 1) * cell - 3 * s, y + 36 * s), p);
                }
            }
            for (int k = 0; k < indices.Length; k++)
                Style.Text(canvas, label(indices[k]), left + (k + 0.5f) * cell, top + colours.Length * 40 * s + 14 * s, 11 * s, Style.Muted, SKTextAlign.Center);
        }
        float top1 = 90 * s;
        Block("CIE 13.3 test colour samples (TCS13 = complexion)", top1, tcs, Enumerable.Range(0, 14).ToArray(), i => $"TCS{i + 1}");
        float top2 = top1 + sources.Length * 40 * s + 60 * s;
        Block("CIE 224 colour evaluation samples, one per TM-30 hue bin of the reference", top2, ces, picks, i => $"CES{i + 1}");
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
