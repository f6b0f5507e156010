using System.Text.Json;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>End-to-end tests of the lumen command, in process with captured streams.</summary>
public class CliTests
{
    internal static string RepoRoot { get; } = FindRoot();

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "Lumen.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    internal static (int Code, string Out, string Err) Run(string stdin, params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = LumenApp.Run(args, new StringReader(stdin), o, e);
        return (code, o.ToString(), e.ToString());
    }

    internal static string[] ExampleFiles() =>
        Directory.GetFiles(Path.Combine(RepoRoot, "examples")).Where(f => f.EndsWith(".csv", StringComparison.Ordinal) || f.EndsWith(".tsv", StringComparison.Ordinal))
            .OrderBy(f => f, StringComparer.Ordinal).ToArray();

    [Fact]
    public void Readme_quick_start_analyze_on_bundled_examples_succeeds()
    {
        // The README's first command: lumen analyze examples/*.csv examples/*.tsv
        var (code, stdout, stderr) = Run("", ["analyze", .. ExampleFiles()]);
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("", stderr);
        Assert.Contains("DL-30-001", stdout, StringComparison.Ordinal);
        Assert.Contains("stage-halogen", stdout, StringComparison.Ordinal);
        Assert.Contains("CCT (K)", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_output_has_one_object_per_spectrum_in_input_order()
    {
        var (code, stdout, _) = Run("", ["analyze", "--format", "json", .. ExampleFiles()]);
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal(8, doc.RootElement.GetArrayLength());
        Assert.Equal("office-panel-4000K", doc.RootElement[0].GetProperty("name").GetString());
        Assert.Equal("DL-30-006", doc.RootElement[7].GetProperty("name").GetString());
        // The synthetic halogen is a 2900 K blackbody with noise (generator in tools/Lumen.Examples).
        Assert.InRange(doc.RootElement[1].GetProperty("cct").GetProperty("kelvin").GetDouble(), 2890, 2915);
    }

    [Fact]
    public void Json_has_cri_and_fidelity_objects_with_the_documented_fields()
    {
        var (code, stdout, _) = Run("", ["analyze", "--format", "json", .. ExampleFiles()]);
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        var dl = doc.RootElement[2];
        var cri = dl.GetProperty("cri");
        Assert.Equal(14, cri.GetProperty("r").GetArrayLength());
        foreach (var f in new[] { "ra", "reference", "dc" }) Assert.True(cri.TryGetProperty(f, out _), f);
        Assert.Equal("planckian", cri.GetProperty("reference").GetProperty("type").GetString());
        var fid = dl.GetProperty("fidelity");
        Assert.Equal(99, fid.GetProperty("rfCes").GetArrayLength());
        Assert.Equal(16, fid.GetProperty("hueBins").GetArrayLength());
        foreach (var f in new[] { "rf", "rcs", "rhs" }) Assert.True(fid.GetProperty("hueBins")[0].TryGetProperty(f, out _), f);
        foreach (var f in new[] { "rf", "rg", "reference" }) Assert.True(fid.TryGetProperty(f, out _), f);
    }

    [Fact]
    public void Metrics_option_limits_the_groups_and_rejects_unknown_names()
    {
        var (code, stdout, _) = Run("", ["analyze", "--format", "json", "--metrics", "colorimetry,cri", .. ExampleFiles()]);
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        Assert.True(doc.RootElement[2].TryGetProperty("cri", out _));
        Assert.False(doc.RootElement[2].TryGetProperty("fidelity", out _));
        var (bad, _, err) = Run("", ["analyze", "--metrics", "cri,sparkle", .. ExampleFiles()]);
        Assert.Equal(ExitCodes.UsageError, bad);
        Assert.Contains("sparkle", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Text_table_shows_Ra_R9_Rf_Rg_and_the_drifted_unit_warning()
    {
        var (_, stdout, _) = Run("", ["analyze", .. ExampleFiles()]);
        Assert.Contains("R9", stdout, StringComparison.Ordinal);
        Assert.Contains("Rg", stdout, StringComparison.Ordinal);
        Assert.Contains("DL-30-005: CIE 13.3", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Detail_option_prints_every_result_group()
    {
        var (code, stdout, _) = Run("", "analyze", "--detail", Path.Combine(RepoRoot, "examples", "foyer-panel-4000K.tsv"));
        Assert.Equal(0, code);
        foreach (var s in new[] { "CIE 13.3: Ra", "Rf,hj", "LER", "lx", "melanopic DER", "dominant", "not medical" })
            Assert.Contains(s, stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Stdin_dash_reads_standard_input()
    {
        var text = "wl,bb\n" + string.Join("\n", Enumerable.Range(380, 401).Select(w => $"{w},1"));
        var (code, stdout, _) = Run(text, "analyze", "-", "--format", "csv");
        Assert.Equal(0, code);
        Assert.Contains("bb,-,2,ok", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Observer_10_reports_10_degree_chromaticity_of_D65_like_input()
    {
        var (code, stdout, _) = Run("", "analyze", "--observer", "10", "--format", "json", Path.Combine(RepoRoot, "examples", "marrowby-stage-halogen.csv"));
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal("10", doc.RootElement[0].GetProperty("observer").GetString());
    }

    [Fact]
    public void Bad_input_exits_3_with_file_line_column_on_stderr_and_keeps_the_good_columns()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-bad-{Guid.NewGuid():N}.csv");
        File.WriteAllText(path, "wl,good,bad\n400,1,1\n410,2,abc\n420,3,3\n");
        try
        {
            var (code, stdout, stderr) = Run("", "analyze", path, "--format", "csv");
            Assert.Equal(ExitCodes.InputErrors, code);
            Assert.Contains($"{path}:3:3:", stderr, StringComparison.Ordinal);
            Assert.Contains("good,", stdout, StringComparison.Ordinal);
            Assert.Contains(",error,", stdout, StringComparison.Ordinal);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Unknown_option_value_is_a_usage_error_with_exit_code_2()
    {
        var (code, _, stderr) = Run("", "analyze", "--observer", "7", "x.csv");
        Assert.Equal(2, code);
        Assert.Contains("lumen:", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Output_option_writes_the_file()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-out-{Guid.NewGuid():N}.json");
        try
        {
            var (code, stdout, _) = Run("", ["analyze", "--format", "json", "--output", path, .. ExampleFiles()]);
            Assert.Equal(0, code);
            Assert.Equal("", stdout);
            using var doc = JsonDocument.Parse(File.ReadAllText(path));
            Assert.Equal(JsonValueKind.Array, doc.RootElement.ValueKind);
        }
        finally { File.Delete(path); }
    }
}
