using System.Text.Json;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>End-to-end tests of photometry output, `lumen blackbody` and `lumen fit`.</summary>
public class ToolkitCliTests
{
    private static string Temp(string ext) => Path.Combine(Path.GetTempPath(), $"lumen-{Guid.NewGuid():N}{ext}");

    [Fact]
    public void Absolute_irradiance_file_gives_illuminance_and_melanopic_EDI()
    {
        var (code, stdout, _) = CliTests.Run("", "analyze", "--format", "json", Path.Combine(CliTests.RepoRoot, "examples", "foyer-panel-4000K.tsv"));
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        var a = doc.RootElement[0];
        Assert.Equal("W/m2/nm", a.GetProperty("unit").GetString());
        double lux = a.GetProperty("photometry").GetProperty("illuminanceLux").GetDouble();
        Assert.InRange(lux, 100, 5000);
        var mel = a.GetProperty("nonVisual").GetProperty("melanopic");
        // EDI = DER × illuminance (CIE S 026 definition).
        Assert.Equal(mel.GetProperty("der").GetDouble() * lux, mel.GetProperty("edi").GetDouble(), 6);
        foreach (var k in new[] { "sConeOpic", "mConeOpic", "lConeOpic", "rhodopic" }) Assert.True(a.GetProperty("nonVisual").TryGetProperty(k, out _));
        foreach (var k in new[] { "peakNm", "centroidNm", "fwhmNm", "dominantNm", "purity" }) Assert.True(a.GetProperty("spectral").TryGetProperty(k, out _));
    }

    [Fact]
    public void C2_option_changes_the_cct_by_16_ppm_and_states_it()
    {
        // Source: methods note planck.md §2.2: CCT(c2 = 1.4388e-2) / CCT(CODATA) = 1.0000161.
        var file = Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv");
        using var a = JsonDocument.Parse(CliTests.Run("", "analyze", "--format", "json", file).Out);
        using var b = JsonDocument.Parse(CliTests.Run("", "analyze", "--format", "json", "--c2", "codata", file).Out);
        double ta = a.RootElement[0].GetProperty("cct").GetProperty("kelvin").GetDouble(), tb = b.RootElement[0].GetProperty("cct").GetProperty("kelvin").GetDouble();
        Assert.Equal(1.0000161, ta / tb, 7);
        Assert.InRange(b.RootElement[0].GetProperty("provenance").GetProperty("c2MetreKelvin").GetDouble(), 0.014387768765, 0.014387768775 + 1e-11); // CODATA 2018: 1.438776877e-2 m·K
    }

    [Fact]
    public void Absolute_file_reports_absolute_tristimulus_values()
    {
        using var doc = JsonDocument.Parse(CliTests.Run("", "analyze", "--format", "json", Path.Combine(CliTests.RepoRoot, "examples", "foyer-panel-4000K.tsv")).Out);
        var a = doc.RootElement[0];
        // Y (2°) with k = K_m equals the illuminance in lux (CIE 15, CIE 018).
        Assert.Equal(a.GetProperty("photometry").GetProperty("illuminanceLux").GetDouble(), a.GetProperty("tristimulusAbsolute").GetProperty("Y").GetDouble(), 6);
    }

    [Fact]
    public void Unit_option_makes_a_relative_file_absolute()
    {
        var (code, stdout, _) = CliTests.Run("", "analyze", "--format", "json", "--unit", "W/sr/m2/nm", Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv"));
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        Assert.True(doc.RootElement[0].GetProperty("photometry").TryGetProperty("luminanceCdPerM2", out _));
        var (bad, _, err) = CliTests.Run("", "analyze", "--unit", "furlongs", Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv"));
        Assert.Equal(2, bad);
        Assert.Contains("furlongs", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Blackbody_json_has_the_documented_fields_and_CODATA_values()
    {
        var (code, stdout, _) = CliTests.Run("", "blackbody", "5772", "--area", "2", "--format", "json");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        var r = doc.RootElement;
        Assert.Equal(5772, r.GetProperty("temperatureK").GetDouble());
        // Source: CODATA 2018 Wien constant: 2.897771955e-3 m·K / 5772 K = 502.04 nm.
        Assert.Equal(2.897771955e-3 / 5772 * 1e9, r.GetProperty("wienPeakNm").GetDouble(), 6);
        Assert.Equal(5.670374419e-8 * Math.Pow(5772, 4), r.GetProperty("exitanceWPerM2").GetDouble(), 0);
        Assert.True(r.TryGetProperty("netPowerW", out _));
        Assert.Equal(5772, r.GetProperty("cct").GetProperty("kelvin").GetDouble(), 1);
        Assert.Equal(0, r.GetProperty("cct").GetProperty("duv").GetDouble(), 8);
        Assert.True(r.GetProperty("chromaticity").TryGetProperty("vPrime", out _));
        Assert.Contains("burn", r.GetProperty("caution").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Blackbody_export_is_read_back_by_analyze_with_CCT_equal_to_T()
    {
        var path = Temp(".csv");
        try
        {
            var (code, _, _) = CliTests.Run("", "blackbody", "3000", "--export", path, "--from", "360", "--to", "830", "--step", "1");
            Assert.Equal(0, code);
            var (code2, stdout, _) = CliTests.Run("", "analyze", "--format", "json", path);
            Assert.Equal(0, code2);
            using var doc = JsonDocument.Parse(stdout);
            Assert.Equal(3000, doc.RootElement[0].GetProperty("cct").GetProperty("kelvin").GetDouble(), 0);
            Assert.True(doc.RootElement[0].GetProperty("photometry").TryGetProperty("luminanceCdPerM2", out _));
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Blackbody_export_with_wien_adds_the_relative_error_column()
    {
        var path = Temp(".csv");
        try
        {
            Assert.Equal(0, CliTests.Run("", "blackbody", "6500", "--export", path, "--approximation", "wien", "--from", "780", "--to", "781", "--step", "0.5").Code);
            var lines = File.ReadAllLines(path);
            Assert.Contains("wien_relative_error", lines[2], StringComparison.Ordinal);
            double err = double.Parse(lines[3].Split(',')[3], System.Globalization.CultureInfo.InvariantCulture);
            // Source: methods note planck.md §5: Wien at 6500 K, 780 nm is 5.9 % low.
            Assert.InRange(err, -0.0590, -0.0580);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Blackbody_rejects_bad_values_with_exit_code_2()
    {
        Assert.Equal(2, CliTests.Run("", "blackbody", "-5").Code);
        Assert.Equal(2, CliTests.Run("", "blackbody", "3000", "--emissivity", "1.5").Code);
        Assert.Equal(2, CliTests.Run("", "blackbody", "3000", "--export", Temp(".csv"), "--from", "500", "--to", "501", "--step", "1").Code);
    }

    [Fact]
    public void Fit_json_reports_thermal_halogen_and_non_thermal_LEDs()
    {
        var (code, stdout, _) = CliTests.Run("", "fit", "--format", "json",
            Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv"), Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv"));
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(stdout);
        var halogen = doc.RootElement[0];
        foreach (var k in new[] { "temperatureK", "temperatureLowK", "temperatureHighK", "residual", "thermal" }) Assert.True(halogen.TryGetProperty(k, out _), k);
        Assert.True(halogen.GetProperty("thermal").GetBoolean());
        // The example halogen is a 2900 K Planckian radiator with noise (tools/Lumen.Examples).
        Assert.InRange(2900, halogen.GetProperty("temperatureLowK").GetDouble() - 5, halogen.GetProperty("temperatureHighK").GetDouble() + 5);
        Assert.False(doc.RootElement[1].GetProperty("thermal").GetBoolean());
        Assert.Contains("NOT a thermal source", doc.RootElement[1].GetProperty("message").GetString(), StringComparison.Ordinal);
    }
}
