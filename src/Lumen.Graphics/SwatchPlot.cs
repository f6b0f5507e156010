using System.Globalization;
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
