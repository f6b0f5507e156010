using System.Text.Json;
using Lumen.Analysis;

namespace Lumen.Cli.Tests;

/// <summary>One name per quantity: every output names a result field by the path a spec's limits use (issue 13).</summary>
public class FieldNameTests
{
    // Columns that are not result fields (identity, labels, verdict bookkeeping, errors).
    private static readonly HashSet<string> NotFields = new(StringComparer.Ordinal)
    {
        "name", "source", "column", "status", "observer", "cct_method", "cri_reference", "fidelity_reference",
        "photometric_value", "photometric_unit", "radiometric_value", "radiometric_unit", "warnings",
        "error_line", "error_column", "error", "id", "location", "failed", "verdict",
        "steps_from_target", "delta_uv_from_target", "robust_z", "outlier",
        "lot", // the example lot's metadata column, carried into batch results
    };

    private static readonly string[] CriterionSuffixes = ["_value", "_limit", "_margin", "_pass"];

    private static void AssertHeaderUsesFieldPaths(string header, string output)
    {
        foreach (var h in header.Split(','))
        {
            Assert.False(h.IndexOfAny(['[', ']', ':', '"', ' ']) >= 0, $"{output}: header '{h}' needs quoting");
            if (NotFields.Contains(h) || ResultFields.IsKnown(h)) continue;
            var suffix = CriterionSuffixes.FirstOrDefault(s => h.EndsWith(s, StringComparison.Ordinal));
            Assert.True(suffix is not null, $"{output}: column '{h}' is neither a result-field path nor a documented non-field column");
            var field = h[..^suffix!.Length];
            Assert.True(field == "chromaticity" || ResultFields.IsKnown(field), $"{output}: criterion column '{h}' does not name a field");
        }
    }

    [Fact]
    public void Every_output_names_R9_as_cri_r9_and_no_output_uses_index_syntax()
    {
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-names-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            string lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");
            string spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");
            string example = Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv");
            var (_, analyzeCsv, _) = CliTests.Run("", "analyze", "--format", "csv", example);
            var (_, analyzeJson, _) = CliTests.Run("", "analyze", "--format", "json", example);
            string rCsv = Path.Combine(dir, "r.csv"), rJson = Path.Combine(dir, "r.json"), sTxt = Path.Combine(dir, "s.txt"), sJson = Path.Combine(dir, "s.json");
            CliTests.Run("", "batch", lot, "--spec", spec, "-o", rCsv, "--summary", sTxt);
            CliTests.Run("", "batch", lot, "--spec", spec, "-o", rJson, "--summary", sJson);

            var outputs = new Dictionary<string, string>
            {
                ["analyze csv"] = analyzeCsv, ["analyze json"] = analyzeJson, ["batch csv"] = File.ReadAllText(rCsv),
                ["batch json"] = File.ReadAllText(rJson), ["summary text"] = File.ReadAllText(sTxt), ["summary json"] = File.ReadAllText(sJson),
            };
            foreach (var (what, text) in outputs)
            {
                Assert.DoesNotContain("cri.r[", text, StringComparison.Ordinal);
                Assert.DoesNotContain("hueBins[", text, StringComparison.Ordinal);
            }
            // CSV headers: result fields by path (cri.r9, fidelity.hueBin1.rcs, …), no quoting needed.
            AssertHeaderUsesFieldPaths(analyzeCsv.Split('\n')[0].TrimEnd('\r'), "analyze csv");
            AssertHeaderUsesFieldPaths(outputs["batch csv"].Split('\n')[0].TrimEnd('\r'), "batch csv");
            Assert.Contains("cri.r9", analyzeCsv.Split('\n')[0].Split(','));
            Assert.Contains("cri.r9", outputs["batch csv"].Split('\n')[0].Split(','));
            Assert.Contains("cri.r9_value", outputs["batch csv"].Split('\n')[0].Split(','));
            // Summaries name the limit's field the same way.
            Assert.Contains("cri.r9", outputs["summary text"], StringComparison.Ordinal);
            using var summary = JsonDocument.Parse(outputs["summary json"]);
            Assert.Contains(summary.RootElement.GetProperty("capability").EnumerateArray(), c => c.GetProperty("field").GetString() == "cri.r9");
            // JSON nests the same path: cri → r9 resolves, with the same value as the CSV's cri.r9 column.
            using var rows = JsonDocument.Parse(outputs["batch json"]);
            var first = rows.RootElement.EnumerateArray().First(r => r.TryGetProperty("result", out _));
            double jsonR9 = first.GetProperty("result").GetProperty("cri").GetProperty("r9").GetDouble();
            var header = outputs["batch csv"].Split('\n')[0].Split(',');
            var row = outputs["batch csv"].Split('\n')[1].Split(',');
            Assert.Equal(jsonR9, double.Parse(row[Array.IndexOf(header, "cri.r9")], System.Globalization.CultureInfo.InvariantCulture), 9);
        }
        finally { Directory.Delete(dir, true); }
    }
}
