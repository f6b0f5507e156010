using System.Globalization;
using System.Text;
using System.Text.Json;
using Lumen.Cli;
using Lumen.Spectra;
using Lumen.Synthetic;

namespace Lumen.Cli.Tests;

/// <summary>End-to-end `lumen batch`: faults reported, nothing lost, summary, exit codes.</summary>
public class BatchCliTests
{
    private static string Example(string f) => Path.Combine(CliTests.RepoRoot, "examples", f.EndsWith("3000K.csv", StringComparison.Ordinal) ? "" : "batch", f);

    private static string TempDir()
    {
        var d = Path.Combine(Path.GetTempPath(), $"lumen-batch-{Guid.NewGuid():N}");
        Directory.CreateDirectory(d);
        return d;
    }

    [Theory]
    [InlineData("results")]
    [InlineData("/dev/full")]
    public void The_rows_scratch_file_is_gone_when_the_process_ends(string output)
    {
        // Rows stream to a scratch file in the temporary folder (TMPDIR), removed on another thread beside the output's
        // flush (issue 16): it is gone when the process ends, after a written batch and after a failed write (exit 4).
        var dir = TempDir();
        var temp = Directory.CreateDirectory(Path.Combine(dir, "tmp")).FullName;
        try
        {
            string results = output == "results" ? Path.Combine(dir, "r.csv") : output;
            if (output != "results" && !File.Exists(output)) return; // no /dev/full on this system
            var (code, _, err) = CultureTests.RunProcess(null, new Dictionary<string, string> { ["TMPDIR"] = temp },
                "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "-o", results, "--summary", Path.Combine(dir, "s.txt"));
            Assert.Equal(output == "results" ? ExitCodes.InputErrors : ExitCodes.OutputError, code);
            Assert.DoesNotContain("scratch", err, StringComparison.Ordinal);
            Assert.Empty(Directory.EnumerateFileSystemEntries(temp));
            if (output == "results") Assert.Equal(241, File.ReadAllLines(results).Length);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Faulty_lot_reports_every_fault_and_loses_no_record()
    {
        // examples/quillfern-dl30-lot-A17.csv: 240 units, faults injected at data rows 7, 19, 33, 58 (file lines
        // 10, 22, 36, 61: text, NaN, empty cell, short row), lot B every tenth unit from unit 3 runs ~370 K cooler-white.
        var dir = TempDir();
        try
        {
            string results = Path.Combine(dir, "r.csv"), summary = Path.Combine(dir, "s.json");
            var (code, _, stderr) = CliTests.Run("", "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "--out", results, "--summary", summary);
            Assert.Equal(ExitCodes.InputErrors, code);
            foreach (var loc in new[] { ":10:23:", ":22:33:", ":36:43:", ":61:" }) Assert.Contains(loc, stderr, StringComparison.Ordinal);
            var lines = File.ReadAllLines(results);
            Assert.Equal(241, lines.Length);
            Assert.Equal(4, lines.Skip(1).Count(l => l.Contains(",error,", StringComparison.Ordinal)));
            for (int i = 1; i <= 240; i++) Assert.StartsWith($"DL30-{i:0000000},", lines[i], StringComparison.Ordinal);
            using var doc = JsonDocument.Parse(File.ReadAllText(summary));
            var s = doc.RootElement;
            Assert.Equal(240, s.GetProperty("recordsRead").GetInt32());
            Assert.Equal(s.GetProperty("recordsRead").GetInt32(), s.GetProperty("results").GetInt32() + s.GetProperty("errors").GetInt32());
            Assert.Equal(4, s.GetProperty("errors").GetInt32());
            // The shifted lot-B subgroup is what the robust outlier test finds (unit 33 is a fault row).
            var outliers = s.GetProperty("outliers").EnumerateArray().Select(o => o.GetProperty("id").GetString()!).ToHashSet();
            var lotB = Enumerable.Range(1, 240).Where(r => r % 10 == 3 && r != 33).Select(r => $"DL30-{r:0000000}").ToHashSet();
            Assert.Subset(lotB, outliers);
            Assert.Superset(lotB, outliers);
            Assert.Contains("not a certification", s.GetProperty("caution").GetString(), StringComparison.Ordinal);
            // Four limited fields plus the chromaticity row (steps from target, one-sided) under the ellipse tolerance.
            var caps = s.GetProperty("capability").EnumerateArray().ToList();
            Assert.Equal(5, caps.Count);
            var steps = caps.Single(c => c.GetProperty("field").GetString() == "steps_from_target");
            Assert.False(steps.TryGetProperty("min", out _));
            Assert.True(steps.GetProperty("ppkLower95").GetDouble() < steps.GetProperty("ppk").GetDouble());
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Clean_passing_batch_exits_0_and_failing_exits_1()
    {
        var dir = TempDir();
        try
        {
            var grid = SyntheticSpectra.Grid(380, 780, 5);
            var sb = new StringBuilder("id," + string.Join(",", grid.Select(g => g.ToString(CultureInfo.InvariantCulture))) + "\n");
            for (int i = 0; i < 12; i++)
            {
                var bb = SyntheticSpectra.Blackbody(2900 + i, grid, "b");
                sb.Append("BB" + i.ToString(CultureInfo.InvariantCulture) + "," + string.Join(",", bb.Values.ToArray().Select(v => v.ToString("R", CultureInfo.InvariantCulture)))).Append('\n');
            }
            var sub = Path.Combine(dir, "sub");
            Directory.CreateDirectory(sub);
            File.WriteAllText(Path.Combine(sub, "bb.csv"), sb.ToString());
            File.WriteAllText(Path.Combine(dir, "pass.json"), """{"name": "bb", "target": {"cct": 2905, "duv": 0}, "chromaticity": {"uPrimeVPrimeRadius": 0.003}, "limits": [{"field": "cri.ra", "min": 95}]}""");
            File.WriteAllText(Path.Combine(dir, "fail.json"), """{"name": "bb", "target": {"nominalCct": 4000}, "chromaticity": {"quadrangle": true}}""");
            var (ok, stdout, _) = CliTests.Run("", "batch", dir, "--spec", Path.Combine(dir, "pass.json"));
            Assert.Equal(ExitCodes.Success, ok);
            Assert.Equal(13, stdout.Trim().Split('\n').Length);
            var (bad, _, _) = CliTests.Run("", "batch", dir, "--spec", Path.Combine(dir, "fail.json"), "--out", Path.Combine(dir, "r.json"));
            Assert.Equal(ExitCodes.SpecificationFailed, bad);
            using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "r.json")));
            Assert.Equal(12, doc.RootElement.GetArrayLength());
            Assert.Equal("fail", doc.RootElement[0].GetProperty("status").GetString());
            Assert.Contains("quadrangle", doc.RootElement[0].GetProperty("verdict").GetProperty("criteria")[0].GetProperty("criterion").GetString(), StringComparison.Ordinal);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Bad_spec_exits_2_naming_the_line()
    {
        var dir = TempDir();
        try
        {
            File.WriteAllText(Path.Combine(dir, "s.json"), "{\n \"limits\": [\n  {\"field\": \"cri.rx\", \"min\": 1}\n ]\n}");
            var (code, _, stderr) = CliTests.Run("", "batch", Example("quillfern-downlights-3000K.csv"), "--spec", Path.Combine(dir, "s.json"));
            Assert.Equal(2, code);
            Assert.Contains("s.json:3:", stderr, StringComparison.Ordinal);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Column_layout_files_work_in_a_batch_too()
    {
        var (code, stdout, _) = CliTests.Run("", "batch", Example("quillfern-downlights-3000K.csv"), "--spec", Example("spec-dl30.json"));
        Assert.Equal(ExitCodes.SpecificationFailed, code); // DL-30-005 drifted (examples/README.md)
        var rows = stdout.Trim().Split('\n');
        Assert.Equal(7, rows.Length);
        Assert.Contains(rows, r => r.StartsWith("DL-30-005,", StringComparison.Ordinal) && r.Contains(",fail,", StringComparison.Ordinal));
    }
}

/// <summary>Property: the parallel batch gives exactly the one-by-one results, in input order.</summary>
public class BatchEqualsOneByOneTests
{
    [Fact]
    public void Batch_rows_equal_individual_assessments()
    {
        string lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");
        string dir = Path.Combine(Path.GetTempPath(), $"lumen-eq-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            string results = Path.Combine(dir, "r.json");
            CliTests.Run("", "batch", lot, "--spec", Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json"), "--out", results, "--threads", "2");
            using var doc = JsonDocument.Parse(File.ReadAllText(results));
            var records = Lumen.Formats.SpectrumFiles.Read(lot).ToList();
            Assert.Equal(records.Count, doc.RootElement.GetArrayLength());
            for (int i = 0; i < records.Count; i++)
            {
                var row = doc.RootElement[i];
                Assert.Equal(records[i].Name, row.GetProperty("id").GetString());
                if (records[i].Spectrum is null) { Assert.Equal("error", row.GetProperty("status").GetString()); continue; }
                var a = Lumen.Analysis.Assessor.Assess(records[i].Spectrum!);
                Assert.Equal(a.Cct.CctKelvin, row.GetProperty("result").GetProperty("cct").GetProperty("kelvin").GetDouble());
                Assert.Equal(a.Cri!.Ra, row.GetProperty("result").GetProperty("cri").GetProperty("ra").GetDouble());
            }
        }
        finally { Directory.Delete(dir, true); }
    }
}

/// <summary>Every verdict output shows the target the verdict used (a trap found in review: the centre was never shown).</summary>
public class TargetShownTests
{
    private static string Example(string f) => Path.Combine(CliTests.RepoRoot, "examples", "batch", f);

    [Fact]
    public void A_device_as_output_is_written_in_place_never_replaced()
    {
        // Found in review: as root, the atomic rename replaced /dev/full with a plain file. A device target is written
        // in place: /dev/full reports a full disk (exit 4) and stays a device; /dev/null gets no sidecar beside it.
        if (!File.Exists("/dev/full") || OperatingSystem.IsWindows()) return;
        var (code, _, stderr) = CliTests.Run("", "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "-o", "/dev/full", "--summary", "/dev/null");
        Assert.Equal(ExitCodes.OutputError, code);
        Assert.Contains("cannot write '/dev/full'", stderr, StringComparison.Ordinal);
        Assert.Equal(0, new FileInfo("/dev/full").Length); // a plain file would hold the rows
        Assert.Throws<IOException>(() => File.WriteAllText("/dev/full", "x"));
        Assert.Equal(ExitCodes.InputErrors, CliTests.Run("", "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "-o", "/dev/null", "--summary", "/dev/null").Code);
        Assert.False(File.Exists("/dev/null.target.json"));
    }

    [Fact]
    public void A_csv_of_verdicts_gets_a_target_sidecar_equal_to_the_summarys_target()
    {
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-sidecar-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            string results = Path.Combine(dir, "r.csv"), summary = Path.Combine(dir, "s.json");
            CliTests.Run("", "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "-o", results, "--summary", summary);
            string sidecar = results + ".target.json";
            Assert.True(File.Exists(sidecar), "the CSV's target sidecar is written beside it");
            using var side = JsonDocument.Parse(File.ReadAllText(sidecar));
            using var sum = JsonDocument.Parse(File.ReadAllText(summary));
            Assert.Equal("r.csv", side.RootElement.GetProperty("results").GetString());
            var t = side.RootElement.GetProperty("target");
            var st = sum.RootElement.GetProperty("target");
            foreach (var k in new[] { "x", "y", "uPrime", "vPrime", "cct", "duv" }) Assert.Equal(st.GetProperty(k).GetDouble(), t.GetProperty(k).GetDouble(), 12);
            foreach (var k in new[] { "a", "b", "thetaDeg" }) Assert.Equal(st.GetProperty("ellipse").GetProperty(k).GetDouble(), t.GetProperty("ellipse").GetProperty(k).GetDouble(), 12);
            Assert.Equal(st.GetProperty("cautions").GetRawText(), t.GetProperty("cautions").GetRawText());
            Assert.Empty(Directory.GetFiles(dir, "*lumen-tmp*", SearchOption.AllDirectories));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void The_printed_ellipse_reproduces_each_units_steps()
    {
        var dir = Path.Combine(Path.GetTempPath(), $"lumen-target-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            var results = Path.Combine(dir, "r.json");
            CliTests.Run("", "batch", Example("quillfern-dl30-lot-A17.csv"), "--spec", Example("spec-dl30.json"), "-o", results, "--summary", Path.Combine(dir, "s.txt"));
            using var doc = System.Text.Json.JsonDocument.Parse(File.ReadAllText(results));
            int checkedUnits = 0;
            foreach (var row in doc.RootElement.EnumerateArray().Where(r => r.GetProperty("status").GetString() != "error").Take(25))
            {
                var v = row.GetProperty("verdict");
                var t = v.GetProperty("target");
                var e = t.GetProperty("ellipse");
                double a = e.GetProperty("a").GetDouble(), b = e.GetProperty("b").GetDouble(), th = e.GetProperty("thetaDeg").GetDouble() * Math.PI / 180;
                double dx = row.GetProperty("result").GetProperty("chromaticity").GetProperty("x").GetDouble() - t.GetProperty("x").GetDouble();
                double dy = row.GetProperty("result").GetProperty("chromaticity").GetProperty("y").GetDouble() - t.GetProperty("y").GetDouble();
                // The metric of the printed ellipse (docs/methods/conformance.md §2.1).
                double g11 = Math.Cos(th) * Math.Cos(th) / (a * a) + Math.Sin(th) * Math.Sin(th) / (b * b);
                double g12 = Math.Sin(th) * Math.Cos(th) * (1 / (a * a) - 1 / (b * b));
                double g22 = Math.Sin(th) * Math.Sin(th) / (a * a) + Math.Cos(th) * Math.Cos(th) / (b * b);
                double steps = Math.Sqrt(g11 * dx * dx + 2 * g12 * dx * dy + g22 * dy * dy);
                Assert.Equal(v.GetProperty("stepsFromTarget").GetDouble(), steps, 9);
                Assert.Contains(t.GetProperty("cautions").EnumerateArray(), c => c.GetString()!.Contains("recalled", StringComparison.Ordinal));
                checkedUnits++;
            }
            Assert.Equal(25, checkedUnits);
            var summary = File.ReadAllText(Path.Combine(dir, "s.txt"));
            Assert.Contains("Target: centre x 0.43", summary, StringComparison.Ordinal);
            Assert.Contains("1-step ellipse a 0.00278, b 0.00136, θ 53.22°", summary, StringComparison.Ordinal);
            Assert.Contains("recalled values", summary, StringComparison.Ordinal);
        }
        finally { Directory.Delete(dir, true); }
    }
}
