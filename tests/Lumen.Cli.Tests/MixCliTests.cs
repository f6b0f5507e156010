using System.Globalization;
using System.Text.Json;

namespace Lumen.Cli.Tests;

/// <summary><c>lumen mix</c> end to end on the bundled five-channel example (invented channels).</summary>
public class MixCliTests
{
    private static string Channels => Path.Combine(CliTests.RepoRoot, "examples", "mix", "quillfern-tw5-channels.csv");

    [Fact]
    public void Json_has_the_documented_fields_and_hits_the_target()
    {
        var (code, json, err) = CliTests.Run("", "mix", Channels, "--cct", "3000", "--duv", "0.001", "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("", err);
        using var doc = JsonDocument.Parse(json);
        var r = doc.RootElement;
        foreach (var f in new[] { "levels", "chromaticity", "cct", "target", "deltaUPrimeVPrime", "reachable", "objective", "metrics", "method", "warnings" }) Assert.True(r.TryGetProperty(f, out _), f);
        Assert.Equal(["red", "green", "blue", "amber", "lime"], r.GetProperty("levels").EnumerateObject().Select(p => p.Name).ToArray());
        Assert.All(r.GetProperty("levels").EnumerateObject(), p => Assert.InRange(p.Value.GetDouble(), 0, 1));
        Assert.True(r.GetProperty("reachable").GetBoolean());
        Assert.True(r.GetProperty("deltaUPrimeVPrime").GetDouble() <= 0.0005);
        Assert.Equal(3000, r.GetProperty("cct").GetProperty("kelvin").GetDouble(), 0);
        Assert.Equal("maximize rf", r.GetProperty("objective").GetProperty("name").GetString());
        Assert.Contains(r.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("linearly", StringComparison.Ordinal));
    }

    [Fact]
    public void A_sweep_gives_one_row_per_CCT_and_a_plot()
    {
        var plot = Path.Combine(Path.GetTempPath(), $"lumen-sweep-{Guid.NewGuid():N}.svg");
        try
        {
            var (code, csv, _) = CliTests.Run("", "mix", Channels, "--cct-range", "2700:3300:300", "--format", "csv", "--plot", plot);
            Assert.Equal(ExitCodes.Success, code);
            var lines = csv.TrimEnd().Split('\n');
            Assert.Equal(4, lines.Length);
            Assert.Contains("level_red", lines[0], StringComparison.Ordinal);
            int cct = Array.IndexOf(lines[0].Split(','), "cct.kelvin");
            Assert.Equal(3300, double.Parse(lines[3].Split(',')[cct], CultureInfo.InvariantCulture), 0);
            Assert.Contains("<svg", File.ReadAllText(plot), StringComparison.Ordinal);
        }
        finally { File.Delete(plot); }
    }

    [Fact]
    public void Matching_a_measured_source_can_maximise_the_SSI()
    {
        var daylight = Path.Combine(CliTests.RepoRoot, "examples", "compare", "film-night-sources.csv") + ":foyer-window-daylight";
        var (code, json, _) = CliTests.Run("", "mix", Channels, "--match", daylight, "--maximize", "ssi", "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        using var doc = JsonDocument.Parse(json);
        var ssi = doc.RootElement.GetProperty("metrics").GetProperty("ssi").GetInt32();
        var (_, rfJson, _) = CliTests.Run("", "mix", Channels, "--match", daylight, "--format", "json");
        using var rf = JsonDocument.Parse(rfJson);
        Assert.True(ssi >= rf.RootElement.GetProperty("metrics").GetProperty("ssi").GetInt32());
    }

    [Fact]
    public void An_unreachable_target_is_said_plainly()
    {
        var (code, text, err) = CliTests.Run("", "mix", Channels, "--xy", "0.05,0.6"); // beyond the green channel (and the spectrum locus)
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("NOT reachable", text, StringComparison.Ordinal);
        Assert.Contains("outside the channels' gamut", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--cct", "3000", "--xy", "0.4,0.4")]
    [InlineData("--xy", "0,4;0,4", "--duv", "0")]
    [InlineData("--cct-range", "2700:6500", "--duv", "0")]
    public void Bad_targets_are_usage_errors(string a, string b, string c, string d)
    {
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "mix", Channels, a, b, c, d).Code);
    }
}
