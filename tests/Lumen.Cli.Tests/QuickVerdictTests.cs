using System.Text.Json;

namespace Lumen.Cli.Tests;

/// <summary>Verdicts from the command line: analyze with a spec or with specification options, and --print-spec.</summary>
public class QuickVerdictTests
{
    private static string Downlights => Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");

    [Fact]
    public void Analyze_with_specification_options_prints_a_verdict_column_and_exits_1_on_a_failure()
    {
        var (code, text, _) = CliTests.Run("", "analyze", Downlights, "--nominal-cct", "3000", "--steps", "7", "--min", "ra=80,r9=20");
        Assert.Equal(ExitCodes.SpecificationFailed, code); // DL-30-005 drifted (examples/README.md)
        Assert.Contains("Verdict", text.Split('\n')[0], StringComparison.Ordinal);
        Assert.Contains("Target: centre x", text, StringComparison.Ordinal);
        var bad = text.Split('\n').Single(l => l.StartsWith("DL-30-005", StringComparison.Ordinal));
        Assert.Contains("fail", bad, StringComparison.Ordinal);
    }

    [Fact]
    public void Printed_spec_read_back_from_a_file_gives_the_same_verdicts_as_the_options()
    {
        string[] options = ["--nominal-cct", "3000", "--steps", "3", "--min", "ra=80,r9=0", "--max", "duv=0.006"];
        var (code, json, _) = CliTests.Run("", ["analyze", Downlights, .. options, "--print-spec"]);
        Assert.Equal(ExitCodes.Success, code);
        var spec = Path.Combine(Path.GetTempPath(), $"lumen-spec-{Guid.NewGuid():N}.json");
        try
        {
            File.WriteAllText(spec, json);
            var (_, fromOptions, _) = CliTests.Run("", ["analyze", Downlights, .. options, "--format", "json"]);
            var (_, fromFile, _) = CliTests.Run("", "analyze", Downlights, "--spec", spec, "--format", "json");
            using var a = JsonDocument.Parse(fromOptions);
            using var b = JsonDocument.Parse(fromFile);
            var va = a.RootElement.EnumerateArray().Select(r => r.GetProperty("verdict").GetProperty("pass").GetBoolean()).ToArray();
            var vb = b.RootElement.EnumerateArray().Select(r => r.GetProperty("verdict").GetProperty("pass").GetBoolean()).ToArray();
            Assert.Equal(va, vb);
            // Each analyze JSON row states the target its verdict used, the same from options and from the file.
            var ta = a.RootElement[0].GetProperty("verdict").GetProperty("target");
            var tb = b.RootElement[0].GetProperty("verdict").GetProperty("target");
            Assert.Equal(ta.GetRawText(), tb.GetRawText());
            Assert.True(ta.GetProperty("ellipse").GetProperty("a").GetDouble() > 0);
            Assert.Contains(false, va);
            Assert.Contains(true, va);
        }
        finally { File.Delete(spec); }
    }

    [Theory]
    [InlineData("--min", "ra=eighty")]
    [InlineData("--steps", "3", "--radius", "0.002")]
    [InlineData("--min", "r[8]=0")]
    public void Bad_specification_options_are_usage_errors(params string[] options)
    {
        var (code, _, err) = CliTests.Run("", ["analyze", Downlights, "--nominal-cct", "3000", .. options]);
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.StartsWith("lumen:", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_spec_file_and_options_together_are_refused()
    {
        var spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "analyze", Downlights, "--spec", spec, "--min", "ra=90").Code);
    }

    [Fact]
    public void Batch_accepts_specification_options()
    {
        var (code, csv, _) = CliTests.Run("", "batch", Downlights, "--nominal-cct", "3000", "--steps", "7", "--min", "ra=80", "-o", "-");
        Assert.Equal(ExitCodes.SpecificationFailed, code);
        Assert.StartsWith("id,location,status", csv, StringComparison.Ordinal);
    }
}

/// <summary>At a terminal, batch prints a readable verdict table, failures first; to a pipe or with -o, machine formats.</summary>
public class BatchTerminalTests
{
    [Fact]
    public void A_terminal_gets_a_table_with_failures_first_and_a_pipe_gets_CSV()
    {
        string lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv"), spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");
        var o = new StringWriter();
        var e = new StringWriter();
        int code = LumenApp.Run(["batch", lot, "--spec", spec], TextReader.Null, o, e, stdoutIsTerminal: true);
        Assert.Equal(ExitCodes.InputErrors, code); // the lot has four unreadable rows
        var lines = o.ToString().Split('\n');
        Assert.StartsWith("Unit", lines[0], StringComparison.Ordinal);
        Assert.Contains(" fail ", lines[2], StringComparison.Ordinal);
        Assert.Contains("more passing units", o.ToString(), StringComparison.Ordinal);
        Assert.Contains("Records read 240", o.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("0.43387000", o.ToString(), StringComparison.Ordinal); // rounded, not 17 digits
        var (_, csv, _) = CliTests.Run("", "batch", lot, "--spec", spec);
        Assert.StartsWith("id,location,lot,status", csv, StringComparison.Ordinal);
    }
}
