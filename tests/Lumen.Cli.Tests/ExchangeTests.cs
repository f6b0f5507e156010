using System.Text.Json;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>Open exchange: IES TM-27 in and out through the commands (issue 15).</summary>
public sealed class ExchangeTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-x-{Guid.NewGuid():N}");

    public ExchangeTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private static JsonElement First(string json) => JsonDocument.Parse(json).RootElement[0];

    [Fact]
    public void A_tm27_file_and_a_csv_of_the_same_spectrum_give_identical_results()
    {
        // Export the example downlights to TM-27, then analyze both: every result field is equal.
        var csv = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");
        var folder = Path.Combine(_dir, "tm27");
        Assert.Equal(ExitCodes.Success, CliTests.Run("", "export", csv, "-o", folder).Code);
        var files = Directory.GetFiles(folder, "*.spdx").Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(6, files.Length);
        var fromCsv = JsonDocument.Parse(CliTests.Run("", "analyze", csv, "--format", "json").Out).RootElement;
        var fromXml = JsonDocument.Parse(CliTests.Run("", "analyze", folder, "--format", "json").Out).RootElement;
        Assert.Equal(6, fromXml.GetArrayLength());
        for (int i = 0; i < 6; i++)
        {
            var a = fromCsv[i];
            var b = fromXml.EnumerateArray().Single(x => x.GetProperty("name").GetString() == a.GetProperty("name").GetString());
            foreach (var group in new[] { "tristimulus", "chromaticity", "cct", "cri", "fidelity", "photometry" })
                Assert.Equal(Strip(a.GetProperty(group)), Strip(b.GetProperty(group)));
        }
    }

    private static string Strip(JsonElement e) => JsonSerializer.Serialize(e);

    [Fact]
    public void Export_keeps_tm27_header_fields_and_blackbody_writes_tm27()
    {
        var spdx = Path.Combine(_dir, "bb.spdx");
        Assert.Equal(ExitCodes.Success, CliTests.Run("", "blackbody", "2856", "--export", spdx).Code);
        var again = Path.Combine(_dir, "again.spdx");
        Assert.Equal(ExitCodes.Success, CliTests.Run("", "export", spdx, "-o", again).Code);
        var text = File.ReadAllText(again);
        Assert.Contains("Planck's law, T = 2856 K", text, StringComparison.Ordinal); // the comment survived the round trip
        Assert.Contains("<SpectralQuantity>radiance</SpectralQuantity>", text, StringComparison.Ordinal);
        var a = First(CliTests.Run("", "analyze", spdx, "--format", "json").Out);
        // A Planckian radiator's CCT is its temperature (CIE 15: illuminant A is one at 2856 K); ±1 K for the 1 nm sampling.
        Assert.InRange(a.GetProperty("cct").GetProperty("kelvin").GetDouble(), 2855, 2857);
        Assert.Equal("radiance", a.GetProperty("metadata").GetProperty("spectralQuantity").GetString());
        // The same spectrum exported as CSV reads back to the same results.
        var csvOut = Path.Combine(_dir, "bb.csv");
        Assert.Equal(ExitCodes.Success, CliTests.Run("", "export", spdx, "--format", "csv", "-o", csvOut).Code);
        var c = First(CliTests.Run("", "analyze", csvOut, "--format", "json").Out);
        Assert.Equal(JsonSerializer.Serialize(a.GetProperty("cct")), JsonSerializer.Serialize(c.GetProperty("cct")));
        // Several spectra need a folder.
        var csv = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "export", csv, "-o", Path.Combine(_dir, "one.spdx")).Code);
    }

    [Fact]
    public void A_mix_exports_as_tm27_and_reads_back_at_its_target()
    {
        var spdx = Path.Combine(_dir, "mix.spdx");
        var channels = Path.Combine(CliTests.RepoRoot, "examples", "mix", "quillfern-tw5-channels.csv");
        var (code, json, _) = CliTests.Run("", "mix", channels, "--cct", "3200", "--format", "json", "--export", spdx);
        Assert.Equal(ExitCodes.Success, code);
        var mix = JsonDocument.Parse(json).RootElement;
        var a = First(CliTests.Run("", "analyze", spdx, "--format", "json").Out);
        Assert.InRange(a.GetProperty("cct").GetProperty("kelvin").GetDouble(), 3198, 3202); // the mix's target
        Assert.Equal(mix.GetProperty("metrics").GetProperty("fidelity.rf").GetDouble(), a.GetProperty("fidelity").GetProperty("rf").GetDouble(), 6);
        Assert.Contains("not a measurement", a.GetProperty("metadata").GetProperty("comments").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Tm27_header_fields_reach_batch_results()
    {
        var folder = Path.Combine(_dir, "tm27");
        var csv = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");
        CliTests.Run("", "export", csv, "-o", folder);
        var results = Path.Combine(_dir, "r.csv");
        CliTests.Run("", "batch", folder, "--nominal-cct", "3000", "--steps", "7", "-o", results);
        var header = File.ReadLines(results).First().Split(',');
        Assert.Contains("documentCreator", header);
        Assert.Contains("spectralQuantity", header);
    }
}

/// <summary>JSON Lines for the next tool in the chain (issue 15).</summary>
public sealed class JsonLinesTests
{
    private static readonly string Lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");
    private static readonly string Spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");

    [Fact]
    public void Analyze_jsonl_lines_each_parse_and_equal_the_json_array()
    {
        var downlights = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");
        var lines = CliTests.Run("", "analyze", downlights, "--format", "jsonl").Out.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var array = JsonDocument.Parse(CliTests.Run("", "analyze", downlights, "--format", "json").Out).RootElement;
        Assert.Equal(array.GetArrayLength(), lines.Length);
        for (int i = 0; i < lines.Length; i++)
            Assert.Equal(JsonSerializer.Serialize(array[i]), JsonSerializer.Serialize(JsonDocument.Parse(lines[i]).RootElement));
    }

    [Fact]
    public void Batch_jsonl_has_one_object_per_record_equal_to_the_json_rows()
    {
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-jl-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            string jl = Path.Combine(dir, "r.jsonl"), js = Path.Combine(dir, "r.json");
            CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", jl);
            CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", js);
            var lines = File.ReadAllLines(jl);
            var array = JsonDocument.Parse(File.ReadAllText(js)).RootElement;
            Assert.Equal(240, lines.Length); // every record, errors included
            for (int i = 0; i < lines.Length; i++)
                Assert.Equal(JsonSerializer.Serialize(array[i]), JsonSerializer.Serialize(JsonDocument.Parse(lines[i]).RootElement));
            // --format wins over the name, and works on standard output.
            var (_, stdout, _) = CliTests.Run("", "batch", Lot, "--spec", Spec, "--format", "jsonl");
            Assert.Equal(240, stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length);
        }
        finally { Directory.Delete(dir, true); }
    }
}

/// <summary>Instrument exports as they come: preamble, unit cells, µm/Å columns, transposed (issue 15).</summary>
public sealed class InstrumentExportTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-ie-{Guid.NewGuid():N}");

    public InstrumentExportTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    /// <summary>A smooth invented spectrum at 5 nm, 380–780 nm (test data of our own making).</summary>
    private static (double Nm, double V)[] Data() =>
        Enumerable.Range(0, 81).Select(i => (380.0 + 5 * i, Math.Round(0.2 + Math.Exp(-Math.Pow((380 + 5 * i - 560) / 90.0, 2)) + 0.6 * Math.Exp(-Math.Pow((380 + 5 * i - 450) / 12.0, 2)), 6))).ToArray();

    private static string F(double x) => x.ToString("R", System.Globalization.CultureInfo.InvariantCulture);

    private JsonElement Analyze(string name, string text)
    {
        var path = Path.Combine(_dir, name);
        File.WriteAllText(path, text);
        var (code, json, err) = CliTests.Run("", "analyze", path, "--format", "json");
        Assert.True(code == ExitCodes.Success, err);
        return JsonDocument.Parse(json).RootElement[0];
    }

    private static void AssertSameResults(JsonElement a, JsonElement b)
    {
        foreach (var group in new[] { "tristimulus", "chromaticity", "cct", "cri", "fidelity" })
            Assert.Equal(JsonSerializer.Serialize(a.GetProperty(group)), JsonSerializer.Serialize(b.GetProperty(group)));
    }

    [Fact]
    public void Preamble_unit_cells_micrometres_and_transposed_files_read_like_the_clean_csv()
    {
        var d = Data();
        var clean = Analyze("clean.csv", "# unit: W/m2/nm\nnm,lamp\n" + string.Join('\n', d.Select(p => $"{F(p.Nm)},{F(p.V)}")) + "\n");

        // A meter's export: key/value preamble in three styles, a line that is neither, a header, unit-bearing cells.
        var meter = Analyze("meter.csv",
            "Instrument: SR-Example (invented)\nIntegration time,100 ms\nOperator\tQA bench 2\n=== spectral data ===\nWavelength,lamp\n"
            + string.Join('\n', d.Select(p => $"{F(p.Nm)}nm,{F(p.V)} W/m²/nm")) + "\n");
        AssertSameResults(clean, meter);
        Assert.Equal("SR-Example (invented)", meter.GetProperty("metadata").GetProperty("Instrument").GetString());
        Assert.Equal("100 ms", meter.GetProperty("metadata").GetProperty("Integration time").GetString());
        Assert.Equal("QA bench 2", meter.GetProperty("metadata").GetProperty("Operator").GetString());
        var layout = meter.GetProperty("provenance").GetProperty("inputLayout").GetString();
        Assert.Contains("3 preamble lines kept as metadata", layout, StringComparison.Ordinal);
        Assert.Contains("1 preamble line skipped (line 4)", layout, StringComparison.Ordinal);

        // Wavelengths in µm, declared by the header.
        var um = Analyze("um.csv", "# unit: W/m2/nm\nWavelength (µm),lamp\n" + string.Join('\n', d.Select(p => $"{F(p.Nm / 1000)},{F(p.V)}")) + "\n");
        AssertSameResults(clean, um);
        // Transposed: wavelengths across the first row, one spectrum per row.
        var tr = Analyze("transposed.csv", "# unit: W/m2/nm\nnm," + string.Join(',', d.Select(p => F(p.Nm))) + "\nlamp," + string.Join(',', d.Select(p => F(p.V))) + "\n");
        AssertSameResults(clean, tr);
    }

    [Fact]
    public void A_cell_unit_that_contradicts_the_file_is_an_error_at_that_cell()
    {
        var d = Data();
        var path = Path.Combine(_dir, "mixed.csv");
        File.WriteAllText(path, "# unit: W/m2/nm\nnm,lamp\n" + string.Join('\n', d.Select((p, i) => $"{F(p.Nm)},{F(p.V)}{(i == 3 ? " W/sr/nm" : "")}")) + "\n");
        var (code, _, err) = CliTests.Run("", "analyze", path);
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains("mixed.csv:6:2:", err, StringComparison.Ordinal);
        Assert.Contains("differs from the file's unit", err, StringComparison.Ordinal);
    }
}
