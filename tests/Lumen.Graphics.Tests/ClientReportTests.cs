using System.Diagnostics;
using System.Security.Cryptography;
using System.Text.RegularExpressions;
using Lumen.Cli;

namespace Lumen.Graphics.Tests;

/// <summary>A report a client accepts (issue 13): who, when, with what, from which files (SHA-256), against which
/// specification; failures first; one rounding rule; the chosen diagram; print layout checked in headless Chromium.</summary>
public sealed partial class ClientReportTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-client-{Guid.NewGuid():N}");
    private static readonly string Lot = Path.Combine(GraphicsTests.Root, "examples", "batch", "quillfern-dl30-lot-A17.csv");
    private static readonly string Spec = Path.Combine(GraphicsTests.Root, "examples", "batch", "spec-dl30.json");
    private static readonly string Downlights = Path.Combine(GraphicsTests.Root, "examples", "quillfern-downlights-3000K.csv");

    public ClientReportTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private static int Run(params string[] args) => LumenApp.Run(args, TextReader.Null, new StringWriter(), new StringWriter());

    private static string Sha256(string path) => Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path)));

    // Left out of the check: plots (SVG coordinates), the spec as written, hashes, and the target row, which states the
    // target centre as defined (to 5 decimals, as every verdict output prints it), not a measured value.
    [GeneratedRegex("<svg.*?</svg>|<pre.*?</pre>|<code class=\"hash\">.*?</code>|<tr><th>Target</th>.*?</tr>", RegexOptions.Singleline)]
    private static partial Regex NotTables();

    [GeneratedRegex(@"\d\.\d{5,}")]
    private static partial Regex LongDecimal();

    private string Report(string input, params string[] extra)
    {
        var html = Path.Combine(_dir, $"r-{Guid.NewGuid():N}.html");
        Run(["report", input, "--spec", Spec, "-o", html, .. extra]);
        return html;
    }

    [Fact]
    public void The_head_names_project_client_preparer_date_version_and_the_verdict()
    {
        var text = File.ReadAllText(Report(Lot));
        foreach (var s in new[] { "Marrowby Civic Hall relighting (fictional)", "Marrowby Borough Estates (fictional)", "Tamsin Oakridge, lighting QA (fictional)", "Lumen " + LumenApp.Version, "id=\"verdict\"", "Not all units pass" })
            Assert.Contains(s, text, StringComparison.Ordinal);
        Assert.Matches(@"<th>Date</th><td class=""t"">\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC</td>", text);
        Assert.DoesNotContain("planckianLocus", text, StringComparison.Ordinal); // provenance in words, not JSON keys
        Assert.Contains("Planckian locus", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_input_appears_with_its_sha256_and_the_spec_as_written()
    {
        var text = File.ReadAllText(Report(Lot));
        Assert.Contains(Sha256(Lot), text, StringComparison.Ordinal);
        Assert.Contains("id=\"spec-text\"", text, StringComparison.Ordinal);
        Assert.Contains("&quot;ellipseSteps&quot;: 3", text, StringComparison.Ordinal); // escaped, verbatim
        // Two inputs: both hashes.
        var html = Path.Combine(_dir, "two.html");
        Run("report", Lot, Downlights, "--spec", Spec, "-o", html);
        var two = File.ReadAllText(html);
        Assert.Contains(Sha256(Lot), two, StringComparison.Ordinal);
        Assert.Contains(Sha256(Downlights), two, StringComparison.Ordinal);
    }

    [Fact]
    public void Failures_come_first_in_the_unit_table_and_the_failure_summary_heads_the_report()
    {
        var text = File.ReadAllText(Report(Lot));
        var table = text[text.IndexOf("id=\"units\"", StringComparison.Ordinal)..];
        table = table[..table.IndexOf("</table>", StringComparison.Ordinal)];
        var statuses = Regex.Matches(table, "<td class=\"t (pass|fail|error)\">").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(240, statuses.Count);
        int lastFail = statuses.LastIndexOf("fail"), firstPass = statuses.IndexOf("pass"), lastError = statuses.LastIndexOf("error");
        Assert.True(lastFail < statuses.IndexOf("error") && lastError < firstPass, "failures, then errors, then passes");
        Assert.True(text.IndexOf("id=\"failures\"", StringComparison.Ordinal) < text.IndexOf("<h2>Summary", StringComparison.Ordinal));
    }

    [Fact]
    public void One_rounding_rule_no_table_prints_more_than_four_decimals()
    {
        foreach (var input in new[] { Lot, Downlights })
        {
            var tables = NotTables().Replace(File.ReadAllText(Report(input)), "");
            var m = LongDecimal().Match(tables);
            Assert.False(m.Success, $"{Path.GetFileName(input)}: '{(m.Success ? tables.Substring(Math.Max(0, m.Index - 60), 80) : "")}'");
        }
    }

    [Fact]
    public void Single_and_batch_reports_draw_the_same_diagram_space_which_the_user_can_choose()
    {
        foreach (var input in new[] { Lot, Downlights })
        {
            Assert.Contains("CIE 1976 u′, v′", File.ReadAllText(Report(input)), StringComparison.Ordinal);
            Assert.Contains("CIE 1931 x, y", File.ReadAllText(Report(input, "--diagram", "xy")), StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Print_css_follows_the_paper_option()
    {
        Assert.Contains("@page{size:A4", File.ReadAllText(Report(Downlights)), StringComparison.Ordinal);
        Assert.Contains("@page{size:letter", File.ReadAllText(Report(Downlights, "--paper", "letter")), StringComparison.Ordinal);
    }

    [Fact]
    public void The_batch_report_has_run_charts_with_limits_and_cpk_when_subgrouped()
    {
        var text = File.ReadAllText(Report(Lot, "--group-by", "lot"));
        foreach (var id in new[] { "run-cct-kelvin", "run-cri-r9", "run-steps-from-target", "hist-cri-r9", "id=\"groups\"" })
            Assert.Contains(id, text, StringComparison.Ordinal);
        Assert.Contains("<th>Cpk</th>", text, StringComparison.Ordinal);
        Assert.Contains("subgroups by &#39;lot&#39;", text, StringComparison.Ordinal);
    }

    [BrowserFact]
    public void Chromium_prints_the_batch_report_on_the_chosen_paper_within_the_expected_page_range()
    {
        var chromium = BrowserFactAttribute.Chromium;
        Assert.True(chromium is not null, "CI=true but chromium is not installed (.ci/run should install it).");
        foreach (var (paper, width, height) in new[] { ("a4", 595.0, 842.0), ("letter", 612.0, 792.0) })
        {
            var html = Report(Lot, "--paper", paper);
            var pdf = Path.Combine(_dir, paper + ".pdf");
            string dom = Chromium(chromium, $"--dump-dom file://{html}");
            Assert.Contains(Sha256(Lot), dom, StringComparison.Ordinal); // rendered, hash visible
            Chromium(chromium, $"--no-pdf-header-footer --print-to-pdf={pdf} file://{html}");
            var bytes = System.Text.Encoding.Latin1.GetString(File.ReadAllBytes(pdf));
            int pages = Regex.Matches(bytes, @"/Type\s*/Page[^s]").Count;
            // Measured 46 A4 pages for this 240-unit lot (summary, plots, 240-row unit table, 20 unit details): a range,
            // so font metrics of another Chromium build do not break the test, while a broken print layout does.
            Assert.InRange(pages, 25, 80);
            var box = Regex.Match(bytes, @"/MediaBox\s*\[\s*0\s+0\s+([\d.]+)\s+([\d.]+)\s*\]");
            Assert.True(box.Success, "no MediaBox in the PDF");
            Assert.Equal(width, double.Parse(box.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture), 0);
            Assert.Equal(height, double.Parse(box.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture), 0);
        }
    }

    private string Chromium(string chromium, string args)
    {
        var psi = new ProcessStartInfo(chromium, $"--headless=new --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --no-first-run --hide-scrollbars --user-data-dir={_dir}/profile {args}")
        { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        _ = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(180_000)) { p.Kill(true); throw new TimeoutException("chromium did not finish in 180 s"); }
        return stdout.Result;
    }
}
