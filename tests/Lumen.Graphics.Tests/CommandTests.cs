using System.Diagnostics;
using System.Xml.Linq;
using Lumen.Cli;

namespace Lumen.Graphics.Tests;

/// <summary>`lumen plot` and `lumen report` end to end, and the report in a real browser.</summary>
public class CommandTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter(); var e = new StringWriter();
        int code = LumenApp.Run(args, TextReader.Null, o, e);
        return (code, o.ToString(), e.ToString());
    }

    private static string Ex(string f) => Path.Combine(GraphicsTests.Root, "examples", f);

    [Theory]
    [InlineData("swatch", ".png")]
    [InlineData("locus", ".png")]
    [InlineData("spectrum", ".svg")]
    [InlineData("vector", ".svg")]
    public void Plot_writes_each_kind(string kind, string ext)
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-plot-{Guid.NewGuid():N}{ext}");
        try
        {
            var (code, _, err) = Run("plot", kind, Ex("quillfern-downlights-3000K.csv"), "--out", path, "--spec", Ex("batch/spec-dl30.json"));
            Assert.Equal(0, code);
            if (kind != "locus") Assert.Contains("first of 6", err, StringComparison.Ordinal);
            if (ext == ".svg") XDocument.Parse(File.ReadAllText(path));
            else using (var bmp = SkiaSharp.SKBitmap.Decode(path)) Assert.True(bmp.Width == 1200);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Plot_rejects_bad_size_extension_and_unknown_name()
    {
        Assert.Equal(2, Run("plot", "locus", Ex("quillfern-downlights-3000K.csv"), "--out", "x.gif").Code);
        Assert.Equal(2, Run("plot", "locus", Ex("quillfern-downlights-3000K.csv"), "--out", Path.Combine(Path.GetTempPath(), "x.png"), "--size", "10x10").Code);
        Assert.Equal(2, Run("plot", "spectrum", Ex("quillfern-downlights-3000K.csv"), "--out", Path.Combine(Path.GetTempPath(), "x.png"), "--name", "nope").Code);
    }

    [Fact]
    public void Batch_report_has_summary_spread_histograms_outliers_and_details()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-report-{Guid.NewGuid():N}.html");
        try
        {
            var (code, _, _) = Run("report", Ex("batch"), "--spec", Ex("batch/spec-dl30.json"), "--out", path);
            Assert.Equal(Lumen.Cli.ExitCodes.InputErrors, code); // the lot has four unreadable rows, reported and kept
            var html = File.ReadAllText(path);
            foreach (var id in new[] { "id=\"summary\"", "id=\"locus\"", "id=\"units\"", "id=\"outliers\"", "id=\"hist-cri-ra\"", "id=\"unit-3\"", "not a certification" })
                Assert.Contains(id, html, StringComparison.Ordinal);
            Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
            Assert.DoesNotContain("id=\"unit-1\"", html, StringComparison.Ordinal); // unit 1 passes: the details show failures first
            // The lot's 23 shifted lot-B units are outliers: the table shows the largest 20 and counts the rest.
            var table = html[html.IndexOf("id=\"outliers\"", StringComparison.Ordinal)..];
            table = table[..table.IndexOf("</table>", StringComparison.Ordinal)];
            Assert.Equal(Lumen.Graphics.HtmlReport.OutlierTableLimit + 1, table.Split("<tr>").Length - 1);
            Assert.Contains("The 20 largest of 23 outliers; 3 more", html, StringComparison.Ordinal);
            // Histograms for R9 and the steps from the target too, each with the spec's limit lines
            // (spec-dl30.json: Ra ≥ 80, R9 ≥ 0, Rf ≥ 80, |Duv| ≤ 0.006, 3-step ellipse).
            foreach (var id in new[] { "id=\"hist-cri-r9\"", "id=\"hist-steps-from-target\"" }) Assert.Contains(id, html, StringComparison.Ordinal);
            string Panel(string id) { var p = html[html.IndexOf(id, StringComparison.Ordinal)..]; return p[..p.IndexOf("</svg>", StringComparison.Ordinal)]; }
            Assert.Contains("max 3 steps", Panel("id=\"hist-steps-from-target\""), StringComparison.Ordinal);
            Assert.Contains("min 80", Panel("id=\"hist-cri-ra\""), StringComparison.Ordinal);
            Assert.Contains("max 0.006", Panel("id=\"hist-cct-duv\""), StringComparison.Ordinal);
            Assert.DoesNotContain("min", Panel("id=\"hist-cct-kelvin\""), StringComparison.Ordinal);
        }
        finally { File.Delete(path); }
    }

    [Theory]
    [InlineData("locus")]
    [InlineData("spectrum")]
    [InlineData("swatch")]
    public void Plot_compare_draws_every_source(string kind)
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-compare-{Guid.NewGuid():N}.svg");
        try
        {
            var (code, _, err) = Run("plot", kind, Ex("compare/film-night-sources.csv"), "--compare", "-o", path);
            Assert.Equal(0, code);
            Assert.Equal("", err);
            var svg = File.ReadAllText(path);
            XDocument.Parse(svg);
            foreach (var name in new[] { "key-tungsten-3150K", "fill-led-panel", "foyer-window-daylight" }) Assert.Contains(name, svg, StringComparison.Ordinal);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Compare_report_has_the_table_the_plots_and_escapes_names()
    {
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-cmp-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            var input = Path.Combine(dir, "s.csv");
            File.WriteAllText(input, File.ReadAllText(Ex("compare/film-night-sources.csv")).Replace("fill-led-panel", "<b>fill</b>", StringComparison.Ordinal));
            var html = Path.Combine(dir, "r.html");
            Assert.Equal(0, Run("report", input, "--compare", "--filter", Ex("compare/filters"), "-o", html).Code);
            var text = File.ReadAllText(html);
            foreach (var id in new[] { "id=\"comparison\"", "id=\"locus\"", "id=\"spectra\"", "id=\"swatches\"", "warm-full" }) Assert.Contains(id, text, StringComparison.Ordinal);
            Assert.DoesNotContain("<b>fill</b>", text, StringComparison.Ordinal);
            Assert.Contains("&lt;b&gt;fill&lt;/b&gt;", text, StringComparison.Ordinal);
        }
        finally { Directory.Delete(dir, true); }
    }

    [BrowserFact]
    public void Report_renders_in_a_headless_browser_with_the_key_elements_visible()
    {
        var chromium = BrowserFactAttribute.Chromium;
        Assert.True(chromium is not null, "CI=true but chromium is not installed (.ci/run should install it).");
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-browser-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            var html = Path.Combine(dir, "report.html");
            Assert.Equal(0, Run("report", Ex("quillfern-downlights-3000K.csv"), "--out", html).Code);
            string dom = RunChromium(chromium, dir, $"--dump-dom file://{html}", out string log);
            Assert.Contains("id=\"summary\"", dom, StringComparison.Ordinal);
            Assert.Contains("id=\"locus\"", dom, StringComparison.Ordinal);
            Assert.DoesNotContain("CONSOLE", log, StringComparison.Ordinal);
            var shot = Path.Combine(dir, "shot.png");
            RunChromium(chromium, dir, $"--window-size=1280,1600 --screenshot={shot} file://{html}", out _);
            using var bmp = SkiaSharp.SKBitmap.Decode(shot);
            Assert.Equal(1280, bmp.Width);
            // The summary table (dark text near the top) and the chromaticity plot (coloured wash) are visible.
            int dark = 0, warm = 0;
            for (int y = 150; y < 400; y += 2) for (int x = 20; x < 1000; x += 2) if (bmp.GetPixel(x, y).Red < 80) dark++;
            for (int y = 500; y < 1400; y += 4) for (int x = 100; x < 1200; x += 4) { var c = bmp.GetPixel(x, y); if (c.Red > 240 && c.Blue < 225 && c.Green > 180) warm++; }
            Assert.True(dark > 200, $"summary text not visible ({dark})");
            Assert.True(warm > 500, $"chromaticity diagram not visible ({warm})");
        }
        finally { Directory.Delete(dir, true); }
    }

    private static string RunChromium(string chromium, string dir, string args, out string log)
    {
        var psi = new ProcessStartInfo(chromium, $"--headless=new --no-sandbox --disable-gpu --hide-scrollbars --user-data-dir={dir}/profile --enable-logging=stderr --v=0 {args}")
        { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(120_000)) { p.Kill(true); throw new TimeoutException("chromium did not finish in 120 s"); }
        log = stderr.Result;
        return stdout.Result;
    }
}

/// <summary>
/// A fact that needs Debian's chromium. Where it is absent the test is reported as skipped, with the reason — except in CI
/// (<c>CI=true</c>, which .ci/run sets and where it installs chromium), where it runs and fails, so a missing browser is never a pass.
/// </summary>
public sealed class BrowserFactAttribute : FactAttribute
{
    /// <summary>The chromium executable, or null.</summary>
    public static string? Chromium { get; } = new[] { "/usr/bin/chromium", "/usr/bin/chromium-browser" }.FirstOrDefault(File.Exists);

    /// <summary>Sets <see cref="FactAttribute.Skip"/> when chromium is missing outside CI.</summary>
    public BrowserFactAttribute()
    {
        if (Chromium is null && Environment.GetEnvironmentVariable("CI") != "true")
            Skip = "chromium is not installed (apt-get install chromium; .ci/run installs it): the browser check is skipped.";
    }
}
