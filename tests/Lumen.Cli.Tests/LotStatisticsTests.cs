using System.Text.Json;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>Lot statistics end to end: metadata carried into results, per-row outlier flags, --group-by, Cpk (issue 13).</summary>
public sealed class LotStatisticsTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-lot-{Guid.NewGuid():N}");
    private static readonly string Lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");
    private static readonly string Spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");

    public LotStatisticsTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private static string[] Cells(string line) => line.Split(',');

    [Fact]
    public void Metadata_columns_and_the_preamble_are_carried_into_csv_and_json_rows()
    {
        // The example lot with a station preamble line: lot (a column) and station (the preamble) reach every row.
        var input = Path.Combine(_dir, "lot.csv");
        File.WriteAllText(input, "# station: EOL-2\n" + File.ReadAllText(Lot));
        string csv = Path.Combine(_dir, "r.csv"), json = Path.Combine(_dir, "r.json");
        CliTests.Run("", "batch", input, "--spec", Spec, "-o", csv);
        CliTests.Run("", "batch", input, "--spec", Spec, "-o", json);
        var lines = File.ReadAllLines(csv);
        var header = Cells(lines[0]);
        int station = Array.IndexOf(header, "station"), lot = Array.IndexOf(header, "lot");
        Assert.True(station > 0 && lot > 0);
        Assert.Equal(241, lines.Length); // every record, errors included, has its metadata
        for (int r = 1; r <= 240; r++)
        {
            var cells = Cells(lines[r]);
            Assert.Equal("EOL-2", cells[station]);
            Assert.Equal(r % 10 == 3 ? "B" : "A", cells[lot]); // the example's lot B is every tenth unit from unit 3
        }
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var rows = doc.RootElement.EnumerateArray().ToList();
        Assert.Equal(240, rows.Count);
        Assert.Equal("B", rows[2].GetProperty("metadata").GetProperty("lot").GetString());
        Assert.Equal("EOL-2", rows[6].GetProperty("metadata").GetProperty("station").GetString()); // an error row too
    }

    [Fact]
    public void Every_row_has_its_robust_z_and_the_flagged_rows_are_the_summary_outliers()
    {
        string csv = Path.Combine(_dir, "r.csv"), json = Path.Combine(_dir, "r.json"), summary = Path.Combine(_dir, "s.json");
        CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", csv, "--summary", summary);
        CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", json);
        var lines = File.ReadAllLines(csv);
        var header = Cells(lines[0]);
        Assert.Equal(["robust_z", "outlier"], header[^2..]);
        using var s = JsonDocument.Parse(File.ReadAllText(summary));
        var listed = s.RootElement.GetProperty("outliers").EnumerateArray().ToDictionary(o => o.GetProperty("id").GetString()!, o => o.GetProperty("robustZ").GetDouble());
        var flagged = new HashSet<string>();
        foreach (var line in lines.Skip(1))
        {
            var cells = Cells(line);
            if (cells[3] == "error") { Assert.Equal("", cells[^1]); Assert.Equal("", cells[^2]); continue; }
            double z = double.Parse(cells[^2], System.Globalization.CultureInfo.InvariantCulture);
            if (cells[^1] == "yes") { flagged.Add(cells[0]); Assert.Equal(listed[cells[0]], z, 2); }
            else Assert.Equal("no", cells[^1]);
        }
        Assert.Equal(listed.Keys.ToHashSet(), flagged);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var jsonFlagged = doc.RootElement.EnumerateArray()
            .Where(r => r.GetProperty("outlier").ValueKind == JsonValueKind.Object && r.GetProperty("outlier").GetProperty("flag").GetBoolean())
            .Select(r => r.GetProperty("id").GetString()!).ToHashSet();
        Assert.Equal(flagged, jsonFlagged);
    }

    [Fact]
    public void Group_summaries_equal_the_groups_run_separately()
    {
        // Split the lot by its lot column into two files (same preamble and header), run each alone, and compare with
        // the groups of one run with --group-by lot: every count, statistic, outlier and capability must be equal.
        var all = File.ReadAllLines(Lot);
        int headerAt = Array.FindIndex(all, l => l.StartsWith("unit_id", StringComparison.Ordinal));
        var files = new Dictionary<string, string>();
        foreach (var lot in new[] { "A", "B" })
        {
            var path = Path.Combine(_dir, $"lot-{lot}.csv");
            File.WriteAllLines(path, all.Take(headerAt + 1).Concat(all.Skip(headerAt + 1).Where(l => Cells(l)[1] == lot)));
            files[lot] = path;
        }
        string grouped = Path.Combine(_dir, "g.json");
        var (code, _, _) = CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", Path.Combine(_dir, "g.csv"), "--summary", grouped, "--group-by", "lot", "--subgroup-size", "5");
        Assert.Equal(ExitCodes.InputErrors, code);
        using var g = JsonDocument.Parse(File.ReadAllText(grouped));
        Assert.Equal("lot", g.RootElement.GetProperty("groupedBy").GetString());
        var groups = g.RootElement.GetProperty("groups").EnumerateArray().ToList();
        Assert.Equal(["A", "B"], groups.Select(x => x.GetProperty("value").GetString()));
        foreach (var group in groups)
        {
            string lot = group.GetProperty("value").GetString()!, alone = Path.Combine(_dir, $"alone-{lot}.json");
            CliTests.Run("", "batch", files[lot], "--spec", Spec, "-o", Path.Combine(_dir, $"alone-{lot}.csv"), "--summary", alone, "--subgroup-size", "5");
            using var a = JsonDocument.Parse(File.ReadAllText(alone));
            foreach (var p in group.EnumerateObject().Where(p => p.Name != "value"))
                Assert.Equal(JsonSerializer.Serialize(a.RootElement.GetProperty(p.Name)), JsonSerializer.Serialize(p.Value));
        }
        // The lot's capability rows carry Cpk from the within-subgroup SD, with its interval.
        var ra = g.RootElement.GetProperty("capability").EnumerateArray().Single(c => c.GetProperty("field").GetString() == "cri.ra");
        var within = ra.GetProperty("within");
        Assert.Equal(48, within.GetProperty("subgroups").GetInt32()); // 236 results in subgroups of 5
        Assert.True(within.GetProperty("cpkLower95").GetDouble() < within.GetProperty("cpk").GetDouble());
        Assert.Contains("consecutive subgroups of 5", g.RootElement.GetProperty("subgroups").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Group_by_an_unknown_column_and_a_subgroup_of_one_are_usage_errors()
    {
        var (code, _, err) = CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", "-", "--group-by", "bin");
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains("they have: lot", err, StringComparison.Ordinal);
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", "-", "--subgroup-size", "1").Code);
    }

    [Fact]
    public void The_text_summary_says_why_there_is_no_cpk_and_names_the_subgroups_when_there_is()
    {
        var (_, _, err) = CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", Path.Combine(_dir, "r.csv"), "--summary", Path.Combine(_dir, "s.txt"));
        var text = File.ReadAllText(Path.Combine(_dir, "s.txt"));
        Assert.Contains("No Cpk", text, StringComparison.Ordinal);
        CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", Path.Combine(_dir, "r.csv"), "--summary", Path.Combine(_dir, "s.txt"), "--group-by", "lot");
        text = File.ReadAllText(Path.Combine(_dir, "s.txt"));
        Assert.Contains("subgroups by 'lot'", text, StringComparison.Ordinal);
        Assert.Contains("By 'lot' (2 groups", text, StringComparison.Ordinal);
        Assert.NotNull(err);
    }
}

/// <summary>The batch computes what the spec needs, and more only when asked (issue 16).</summary>
public class BatchMetricsTests
{
    private static readonly string Lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");

    [Fact]
    public void A_chromaticity_only_spec_computes_only_colorimetry_unless_asked()
    {
        var (_, csv, err) = CliTests.Run("", "batch", Lot, "--nominal-cct", "3000", "--steps", "3", "-o", "-");
        var header = csv.Split('\n')[0].Split(',');
        int ra = Array.IndexOf(header, "cri.ra");
        var first = csv.Split('\n')[1].Split(',');
        Assert.Equal("", first[ra]); // not computed
        Assert.Contains("not computed: the spec does not limit them", err, StringComparison.Ordinal);
        var (_, all, _) = CliTests.Run("", "batch", Lot, "--nominal-cct", "3000", "--steps", "3", "--metrics", "all", "-o", "-");
        Assert.NotEqual("", all.Split('\n')[1].Split(',')[ra]);
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "batch", Lot, "--nominal-cct", "3000", "--steps", "3", "--metrics", "colour").Code);
    }
}
