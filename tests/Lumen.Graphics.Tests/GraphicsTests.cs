using System.Diagnostics;
using System.Xml.Linq;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Conformance;
using Lumen.Formats;
using Lumen.Spectra;
using SkiaSharp;
using Lumen.Synthetic;

namespace Lumen.Graphics.Tests;

public class GraphicsTests
{
    internal static string Root { get; } = FindRoot();

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (!File.Exists(Path.Combine(d!.FullName, "Lumen.sln"))) d = d.Parent;
        return d.FullName;
    }

    private static SKBitmap Decode(byte[] png) => SKBitmap.Decode(png);

    [Fact]
    public void Planckian_locus_at_2856_K_is_drawn_where_the_axis_mapping_puts_it()
    {
        // CIE 15: illuminant A / 2856 K lies at (0.4476, 0.4074) in CIE 1931 xy. The locus is drawn in pure black
        // (2 px); the pixel at the mapped position (or its 1-px neighbourhood) must be (near) black.
        var a = Chromaticity.FromXy(0.4476, 0.4074);
        var options = new DiagramOptions(DiagramSpace.Xy, [new DiagramPoint("far", Chromaticity.FromXy(0.46, 0.38), PointStatus.None), new DiagramPoint("far2", Chromaticity.FromXy(0.43, 0.43), PointStatus.None)]);
        var size = new SKSize(1200, 900);
        var png = Render.Png(1200, 900, (c, z) => ChromaticityDiagram.Draw(c, z, options));
        var map = ChromaticityDiagram.Layout(options, size);
        using var bmp = Decode(png);
        int px = (int)Math.Round(map.Px(a.SmallX)), py = (int)Math.Round(map.Py(a.SmallY));
        bool dark = false;
        for (int dx = -1; dx <= 1; dx++)
            for (int dy = -1; dy <= 1; dy++)
            {
                var c = bmp.GetPixel(px + dx, py + dy);
                if (c.Red < 60 && c.Green < 60 && c.Blue < 60) dark = true;
            }
        Assert.True(dark, $"no locus pixel near ({px}, {py})");
        // And 12 px off the locus (perpendicular-ish, straight up) the pixel is not the locus colour.
        var off = bmp.GetPixel(px, py - 12);
        Assert.False(off.Red < 60 && off.Green < 60 && off.Blue < 60);
    }

    [Fact]
    public void D65_light_and_a_neutral_sample_under_D65_render_neutral()
    {
        // IEC 61966-2-1: D65 is the sRGB white, so its swatch colour is neutral (R = G = B).
        var d65 = Srgb.LightColor(Chromaticity.FromXy(0.3127, 0.3290));
        Assert.Equal(d65.R, d65.G);
        Assert.Equal(d65.G, d65.B);
        Assert.Equal(255, d65.R);
        // A flat 50 % grey under D65 (adapted from D65 to D65): neutral.
        var grey = Srgb.ToRgb8(Srgb.AdaptToD65(new Tristimulus(0.5 * 0.950456, 0.5, 0.5 * 1.089058), Srgb.D65White));
        Assert.InRange(Math.Abs(grey.R - grey.G) + Math.Abs(grey.G - grey.B), 0, 1);
    }

    [Fact]
    public void Srgb_matrix_maps_the_sRGB_primaries()
    {
        // IEC 61966-2-1 (common practice): the red primary x = 0.64, y = 0.33 at Y = 0.2126 is linear (1, 0, 0).
        var red = Tristimulus.FromChromaticity(Chromaticity.FromXy(0.64, 0.33), 0.2126);
        var (r, g, b) = Srgb.Linear(red);
        Assert.Equal(1.0, r, 2);
        Assert.Equal(0.0, g, 2);
        Assert.Equal(0.0, b, 2);
    }

    [Fact]
    public void Swatch_of_D65_shows_a_neutral_patch_for_the_light()
    {
        var d65 = CieTables.IlluminantD65.ToSpectrum("D65");
        var a = Assessor.Assess(d65);
        using var bmp = Decode(Render.Png(1200, 520, (c, z) => SwatchPlot.Draw(c, z, d65, a)));
        var patch = bmp.GetPixel(130, 140);
        Assert.InRange(Math.Abs(patch.Red - patch.Green), 0, 3);
        Assert.InRange(Math.Abs(patch.Green - patch.Blue), 0, 6);
        Assert.True(patch.Red > 240);
    }

    [Fact]
    public void Svg_locus_parses_as_XML_and_has_one_marker_per_point()
    {
        var pts = Enumerable.Range(0, 37).Select(i => new DiagramPoint($"p{i}", Chromaticity.FromXy(0.43 + 0.0003 * i, 0.40 + 0.0002 * (i % 5)), PointStatus.Pass)).ToList();
        var svg = Render.Svg(1200, 900, (c, z) => ChromaticityDiagram.Draw(c, z, new DiagramOptions(DiagramSpace.Xy, pts)));
        var doc = XDocument.Parse(svg);
        XNamespace ns = "http://www.w3.org/2000/svg";
        // Pass points are filled ellipses in the pass colour (#1f6f8b); the legend adds one more.
        int markers = doc.Descendants(ns + "ellipse").Count(e => (string?)e.Attribute("fill") == "#1F6F8B" || (string?)e.Attribute("fill") == "#1f6f8b");
        Assert.Equal(pts.Count + 1, markers);
    }

    [Fact]
    public void Text_renders_with_the_shipped_font()
    {
        using var bmp = Decode(Render.Png(300, 100, (c, z) => { using var f = new SKFont(Typefaces.Regular, 40); using var p = new SKPaint { Color = SKColors.Black }; c.DrawText("Lumen", 10, 60, f, p); }));
        int dark = 0;
        for (int x = 0; x < 300; x++) for (int y = 0; y < 100; y++) if (bmp.GetPixel(x, y).Red < 100) dark++;
        Assert.InRange(dark, 300, 8000);
        Assert.Equal("DejaVu Sans", Typefaces.Regular.FamilyName);
    }

    [Fact]
    public void Spectrum_vector_and_swatch_render_without_error_in_both_formats()
    {
        var fl2 = CieTables.FluorescentIlluminants5Nm.ToSpectrum("FL2");
        var a = Assessor.Assess(fl2);
        foreach (var fmt in new[] { true, false })
        {
            Action<SKCanvas, SKSize>[] draws =
            [
                (c, z) => SpectrumPlot.Draw(c, z, fl2, a.Fidelity?.Reference),
                (c, z) => VectorGraphic.Draw(c, z, a.Fidelity!, "FL2"),
                (c, z) => SwatchPlot.Draw(c, z, fl2, a),
            ];
            foreach (var d in draws)
            {
                if (fmt) Assert.True(Render.Png(800, 600, d).Length > 1000);
                else XDocument.Parse(Render.Svg(800, 600, d));
            }
        }
    }

    [Fact]
    public void Dark_spectrum_plots_and_reports_without_hanging_or_throwing()
    {
        var grid = SyntheticSpectra.Grid(380, 780, 5);
        var dark = new Spectrum(grid, new double[grid.Length], SpectralUnit.Relative, "dark", SpectrumOrigin.Generated("t"));
        var a = Assessor.Assess(dark);
        Assert.True(Render.Png(800, 600, (c, z) => SpectrumPlot.Draw(c, z, dark, a.Fidelity?.Reference)).Length > 100);
        Assert.True(Render.Png(800, 600, (c, z) => SwatchPlot.Draw(c, z, dark, a)).Length > 100);
        var html = HtmlReport.Single([RecordOutcome.Of(new SpectrumRecord("d.csv", 2, "dark", dark), AssessmentOptions.Default)], null);
        Assert.Contains("undefined", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_escapes_names_everywhere()
    {
        var grid = SyntheticSpectra.Grid(380, 780, 5);
        var s = SyntheticSpectra.Blackbody(3000, grid, "<script>alert(1)</script>");
        var rec = new SpectrumRecord("x.csv", 2, s.Name, s);
        var html = HtmlReport.Single([RecordOutcome.Of(rec, AssessmentOptions.Default)], null);
        Assert.DoesNotContain("<script>", html, StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("http://", html.Replace("http://www.w3.org", "", StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);
        Assert.Contains("id=\"summary\"", html, StringComparison.Ordinal);
        Assert.Contains("id=\"locus\"", html, StringComparison.Ordinal);
    }
}
