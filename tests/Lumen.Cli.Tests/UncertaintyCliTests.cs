using System.Text.Json;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>Measurement uncertainty from the command line: model files, outputs and decisions (issue 14).</summary>
public sealed class UncertaintyCliTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-unc-{Guid.NewGuid():N}");
    private static readonly string Model = Path.Combine(CliTests.RepoRoot, "examples", "uncertainty", "array-spectroradiometer.json");
    private static readonly string Downlights = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");

    public UncertaintyCliTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    [Fact]
    public void Json_gives_each_result_its_standard_uncertainty_interval_and_the_linear_check()
    {
        var (code, json, _) = CliTests.Run("", "analyze", Downlights, "--format", "json", "--uncertainty", Model, "--draws", "400", "--seed", "5", "--metrics", "colorimetry");
        Assert.Equal(ExitCodes.Success, code);
        using var doc = JsonDocument.Parse(json);
        var u = doc.RootElement[0].GetProperty("uncertainty");
        Assert.Equal(400, u.GetProperty("draws").GetInt32());
        Assert.Equal(5, u.GetProperty("seed").GetInt32());
        Assert.Equal(0.02, u.GetProperty("model").GetProperty("relativeScale").GetDouble());
        var cct = u.GetProperty("fields").GetProperty("cct.kelvin");
        Assert.True(cct.GetProperty("standard").GetDouble() > 0);
        Assert.True(cct.GetProperty("low").GetDouble() < cct.GetProperty("high").GetDouble());
        Assert.Equal(0.95, cct.GetProperty("coverage").GetDouble());
        Assert.True(cct.TryGetProperty("linear", out _));
        // The same seed gives the same bytes.
        Assert.Equal(json, CliTests.Run("", "analyze", Downlights, "--format", "json", "--uncertainty", Model, "--draws", "400", "--seed", "5", "--metrics", "colorimetry").Out);
    }

    [Fact]
    public void Csv_adds_u_low_and_high_beside_each_result_and_text_shows_plus_minus()
    {
        var (_, csv, _) = CliTests.Run("", "analyze", Downlights, "--format", "csv", "--uncertainty", Model, "--draws", "200", "--metrics", "colorimetry");
        var header = csv.Split('\n')[0].Split(',');
        int at = Array.IndexOf(header, "cct.kelvin");
        Assert.Equal(["cct.kelvin_u", "cct.kelvin_low", "cct.kelvin_high"], header[(at + 1)..(at + 4)]);
        var row = csv.Split('\n')[1].Split(',');
        Assert.True(double.Parse(row[at + 1], System.Globalization.CultureInfo.InvariantCulture) > 0);
        var (_, text, _) = CliTests.Run("", "analyze", Downlights, "--uncertainty", Model, "--draws", "200", "--metrics", "colorimetry");
        Assert.Contains(" ± ", text, StringComparison.Ordinal);
        Assert.Contains("relative noise 0.003", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Guarded_acceptance_makes_near_limit_units_inconclusive_and_says_so()
    {
        // DL-30-001 … 004 sit within a few steps of the 3000 K centre, DL-30-005 far off: with the example model's 2 %
        // scale, 1 % smooth responsivity and 0.2 nm shift, the near units are too close to the 3-step limit to call.
        string json = Path.Combine(_dir, "r.json");
        var (code, _, _) = CliTests.Run("", "analyze", Downlights, "--format", "json", "-o", json, "--uncertainty", Model, "--draws", "300",
            "--metrics", "colorimetry", "--nominal-cct", "3000", "--steps", "3", "--decision", "guarded");
        Assert.Equal(ExitCodes.SpecificationFailed, code); // DL-30-005 fails even with its uncertainty
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var decisions = doc.RootElement.EnumerateArray().Select(r => r.GetProperty("verdict").GetProperty("decision").GetString()).ToList();
        Assert.Equal("fail", decisions[4]);
        Assert.Contains("inconclusive", decisions);
        var v = doc.RootElement[0].GetProperty("verdict");
        Assert.Contains("guarded acceptance", v.GetProperty("rule").GetString(), StringComparison.Ordinal);
        Assert.True(v.GetProperty("criteria")[0].GetProperty("expandedUncertainty").GetDouble() > 0);
        // Under simple acceptance the same units pass or fail, and the rule is stated.
        var (_, simple, _) = CliTests.Run("", "analyze", Downlights, "--format", "json", "--metrics", "colorimetry", "--nominal-cct", "3000", "--steps", "3");
        using var s = JsonDocument.Parse(simple);
        Assert.DoesNotContain(s.RootElement.EnumerateArray(), r => r.GetProperty("verdict").GetProperty("decision").GetString() == "inconclusive");
        Assert.Contains("simple acceptance", s.RootElement[0].GetProperty("verdict").GetProperty("rule").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Batch_counts_inconclusive_units_and_states_the_rule()
    {
        string results = Path.Combine(_dir, "r.csv"), summary = Path.Combine(_dir, "s.json");
        var (code, _, _) = CliTests.Run("", "batch", Downlights, "--nominal-cct", "3000", "--steps", "3", "--uncertainty", Model, "--draws", "200", "--decision", "guarded", "-o", results, "--summary", summary);
        Assert.Equal(ExitCodes.SpecificationFailed, code);
        using var doc = JsonDocument.Parse(File.ReadAllText(summary));
        var r = doc.RootElement;
        Assert.True(r.GetProperty("inconclusive").GetInt32() > 0);
        Assert.Equal(r.GetProperty("results").GetInt32(), r.GetProperty("passed").GetInt32() + r.GetProperty("failed").GetInt32() + r.GetProperty("inconclusive").GetInt32());
        Assert.Contains("guarded acceptance", r.GetProperty("rule").GetString(), StringComparison.Ordinal);
        var lines = File.ReadAllLines(results);
        Assert.Contains("cct.kelvin_u", lines[0], StringComparison.Ordinal);
        Assert.Contains(lines.Skip(1), l => l.Contains(",inconclusive,", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("{\"relativeNoise\": 0.01, \"noise\": 1}", ":1:", "unknown field 'noise'")]
    [InlineData("{\n  \"relativeNoise\": -0.01\n}", ":2:", "≥ 0")]
    [InlineData("{\"smoothRelative\": {\"sigma\": 0.01}}", "", "correlationLengthNm must be > 0")]
    [InlineData("{}", "", "no uncertainty component")]
    public void A_bad_model_is_a_usage_error_naming_line_and_column(string json, string where, string message)
    {
        var path = Path.Combine(_dir, "m.json");
        File.WriteAllText(path, json);
        var (code, _, err) = CliTests.Run("", "analyze", Downlights, "--uncertainty", path);
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains(message, err, StringComparison.Ordinal);
        Assert.Contains("m.json" + where, err, StringComparison.Ordinal);
    }

    [Fact]
    public void Guarded_without_a_model_or_a_spec_is_a_usage_error()
    {
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "analyze", Downlights, "--nominal-cct", "3000", "--steps", "3", "--decision", "guarded").Code);
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "analyze", Downlights, "--uncertainty", Model, "--decision", "guarded").Code);
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "analyze", Downlights, "--uncertainty", Model, "--draws", "5").Code);
    }
}
