using System.Text.Json;

namespace Lumen.Cli.Tests;

/// <summary><c>lumen compare</c> end to end on the bundled film-night example (invented sources and filters).</summary>
public class CompareCliTests
{
    private static string Ex(string f) => Path.Combine(CliTests.RepoRoot, "examples", "compare", f);

    [Fact]
    public void Json_has_the_documented_contract_for_every_other_source()
    {
        var (code, json, err) = CliTests.Run("", "compare", Ex("film-night-sources.csv"), "--filter", Ex("filters"), "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("", err);
        using var doc = JsonDocument.Parse(json);
        Assert.Equal(2, doc.RootElement.GetArrayLength());
        var c = doc.RootElement[0];
        Assert.Equal("key-tungsten-3150K", c.GetProperty("reference").GetString());
        Assert.Equal("fill-led-panel", c.GetProperty("source").GetString());
        foreach (var f in new[] { "deltaUPrimeVPrime", "cct", "duv", "correction", "sampleShift", "ssi", "warnings", "provenance" }) Assert.True(c.TryGetProperty(f, out _), f);
        foreach (var f in new[] { "reference", "source", "deltaKelvin", "deltaMired" }) Assert.True(c.GetProperty("cct").TryGetProperty(f, out _), f);
        foreach (var f in new[] { "reference", "source", "delta" }) Assert.True(c.GetProperty("duv").TryGetProperty(f, out _), f);
        foreach (var f in new[] { "miredShift", "duvShift", "description", "filters" }) Assert.True(c.GetProperty("correction").TryGetProperty(f, out _), f);
        foreach (var f in new[] { "method", "meanDeltaE00", "maxDeltaE00", "worst", "tcs13DeltaE00" }) Assert.True(c.GetProperty("sampleShift").TryGetProperty(f, out _), f);
        foreach (var f in new[] { "value", "unrounded", "sourceToDefaultReference", "referenceToDefaultReference" }) Assert.True(c.GetProperty("ssi").TryGetProperty(f, out _), f);
        // The key light is warmer than the fill: the fill needs warming (positive mired shift), and its mired is lower.
        Assert.True(c.GetProperty("correction").GetProperty("miredShift").GetDouble() > 100);
        Assert.Equal(-c.GetProperty("cct").GetProperty("deltaMired").GetDouble(), c.GetProperty("correction").GetProperty("miredShift").GetDouble(), 9);
        Assert.Contains("warming", c.GetProperty("correction").GetProperty("description").GetString()!, StringComparison.Ordinal);
        // Ten filters: ten singles and 45 stacks of two, best first; the percent file is detected.
        var filters = c.GetProperty("correction").GetProperty("filters");
        Assert.Equal(55, filters.GetArrayLength());
        var residuals = filters.EnumerateArray().Select(f => f.GetProperty("residualDeltaUPrimeVPrime").GetDouble()).ToArray();
        Assert.Equal(residuals.Order().ToArray(), residuals);
        Assert.Contains(filters.EnumerateArray(), f => f.GetProperty("name").GetString() == "warm-three-quarter-pct" && f.GetProperty("transmittanceScale").GetString() == "percent");
        Assert.True(residuals[0] < c.GetProperty("deltaUPrimeVPrime").GetDouble());
    }

    [Fact]
    public void The_reference_can_be_picked_by_name_and_text_gives_the_correction_in_words()
    {
        var (code, text, _) = CliTests.Run("", "compare", Ex("film-night-sources.csv"), "--reference", "foyer-window-daylight");
        Assert.Equal(ExitCodes.Success, code);
        Assert.StartsWith("Reference: foyer-window-daylight", text, StringComparison.Ordinal);
        Assert.Contains("key-tungsten-3150K: needs about", text, StringComparison.Ordinal);
        Assert.Contains("of cooling", text, StringComparison.Ordinal); // the tungsten key must be cooled to match daylight
    }

    [Fact]
    public void Csv_has_one_row_per_other_source()
    {
        var (code, csv, _) = CliTests.Run("", "compare", Ex("film-night-sources.csv"), "--format", "csv");
        Assert.Equal(ExitCodes.Success, code);
        var lines = csv.TrimEnd().Split('\n');
        Assert.Equal(3, lines.Length);
        Assert.StartsWith("reference,source,delta_u_prime_v_prime,", lines[0], StringComparison.Ordinal);
    }

    [Fact]
    public void One_spectrum_or_an_unknown_reference_is_a_usage_error()
    {
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "compare", Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv")).Code);
        var (code, _, err) = CliTests.Run("", "compare", Ex("film-night-sources.csv"), "--reference", "nope");
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains("no spectrum named 'nope'", err, StringComparison.Ordinal);
    }
}
