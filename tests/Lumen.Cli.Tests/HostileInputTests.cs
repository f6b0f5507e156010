using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Lumen.Cli.Tests;

/// <summary>
/// The hostile corpus of the hardening issue: each case gives a correct result or a one-line error naming the input
/// (file:line:column where it applies) with its documented exit code — never a stack trace, a hang or a lost record.
/// Inputs are made here, so the tests run in a clean clone with nothing beside it.
/// </summary>
public sealed class HostileInputTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-hostile-{Guid.NewGuid():N}");

    public HostileInputTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private string Write(string name, string text)
    {
        var p = Path.Combine(_dir, name);
        File.WriteAllText(p, text);
        return p;
    }

    private static string Gaussian(double scale, int step = 5) =>
        "nm,A\n" + string.Join("\n", Enumerable.Range(0, 400 / step + 1).Select(i =>
        {
            int w = 380 + step * i;
            return string.Create(CultureInfo.InvariantCulture, $"{w},{(scale * Math.Exp(-Math.Pow((w - 560) / 60.0, 2) / 2)):R}");
        })) + "\n";

    private static string RowFile(int rows, Func<int, string>? id = null, string? header = null)
    {
        var sb = new StringBuilder(header ?? "id," + string.Join(',', Enumerable.Range(0, 81).Select(i => 380 + 5 * i)));
        sb.Append('\n');
        for (int r = 0; r < rows; r++)
        {
            sb.Append(id?.Invoke(r) ?? $"U{r}");
            for (int i = 0; i < 81; i++) sb.Append(',').Append((Math.Exp(-Math.Pow((5 * i - 180) / 60.0, 2) / 2) + 0.001 * r).ToString("R", CultureInfo.InvariantCulture));
            sb.Append('\n');
        }
        return sb.ToString();
    }

    private static void NoTrace(string stderr) => Assert.DoesNotContain("   at ", stderr, StringComparison.Ordinal);

    [Theory]
    [InlineData("analyze", "--threads", "x", "e.g. 4")]
    [InlineData("analyze", "--threads", "-2", "e.g. 4")]
    [InlineData("batch", "--threads", "2.5", "e.g. 4")]
    [InlineData("analyze", "--nominal-cct", "3000.5", "e.g. 3000")]
    [InlineData("analyze", "--draws", "1e4", "e.g. 10000")]
    [InlineData("batch", "--subgroup-size", "five", "e.g. 5")]
    public void A_bad_whole_number_option_is_a_usage_error_in_our_words(string verb, string option, string value, string example)
    {
        var file = Path.Combine(CliTests.RepoRoot, "examples", "foyer-panel-4000K.tsv");
        var (code, _, err) = CliTests.Run("", [verb, file, option, value]);
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains($"{option}: '{value}' is not a whole number", err, StringComparison.Ordinal);
        Assert.Contains(example, err, StringComparison.Ordinal);
        Assert.DoesNotContain("System.", err, StringComparison.Ordinal); // no .NET type names reach a user
    }

    [InlineData(1e308)]
    [Theory]
    [InlineData(1e-310)] // subnormal: crashed CIECAM02 before
    [InlineData(1e305)]  // near the top of the double range
    public void Extreme_scales_give_the_same_relative_results_as_ordinary_ones(double scale)
    {
        var (code, json, err) = CliTests.Run("", "analyze", Write("x.csv", Gaussian(scale)), "--format", "json");
        var (_, reference, _) = CliTests.Run("", "analyze", Write("n.csv", Gaussian(1)), "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        NoTrace(err);
        using var a = JsonDocument.Parse(json);
        using var b = JsonDocument.Parse(reference);
        foreach (var (group, field) in new[] { ("chromaticity", "x"), ("cct", "kelvin"), ("cct", "duv"), ("cri", "ra"), ("fidelity", "rf") })
            Assert.Equal(b.RootElement[0].GetProperty(group).GetProperty(field).GetDouble(), a.RootElement[0].GetProperty(group).GetProperty(field).GetDouble(), 6);
    }

    [Fact]
    public void Absolute_values_beyond_double_range_are_null_with_one_warning()
    {
        var (code, json, _) = CliTests.Run("", "analyze", Write("x.csv", Gaussian(1e307)), "--format", "json", "--unit", "W/m2/nm");
        Assert.Equal(ExitCodes.Success, code);
        using var doc = JsonDocument.Parse(json);
        var r = doc.RootElement[0];
        Assert.False(r.TryGetProperty("tristimulusAbsolute", out _));
        Assert.Equal(JsonValueKind.Null, r.GetProperty("photometry").GetProperty("illuminanceLux").ValueKind);
        Assert.Single(r.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("double precision", StringComparison.Ordinal));
        Assert.True(double.IsFinite(r.GetProperty("cct").GetProperty("kelvin").GetDouble()));
    }

    [Fact]
    public void A_subnormal_row_in_a_batch_loses_no_record()
    {
        var rows = RowFile(600).Split('\n').ToList();
        rows[301] = "TINY," + string.Join(',', Enumerable.Range(0, 81).Select(i => (1e-310 * Math.Exp(-Math.Pow((5 * i - 180) / 60.0, 2) / 2)).ToString("R", CultureInfo.InvariantCulture)));
        var input = Write("lot.csv", string.Join('\n', rows));
        var spec = Write("s.json", """{"name": "s", "limits": [{"field": "cri.ra", "min": 0}]}""");
        var results = Path.Combine(_dir, "r.csv");
        var (code, _, err) = CliTests.Run("", "batch", input, "--spec", spec, "-o", results);
        NoTrace(err);
        Assert.True(code is ExitCodes.Success or ExitCodes.SpecificationFailed, $"exit {code}: {err}");
        Assert.Equal(601, File.ReadAllLines(results).Length);
        Assert.Contains(File.ReadAllLines(results), l => l.StartsWith("TINY,", StringComparison.Ordinal) && !l.Contains(",error,", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("380,1\n1e9,2\n2e9,3\n", "outside 100–100000 nm")]                 // grew to 12 GB before
    [InlineData("380,1\n1e300,2\n2e300,3\n", "outside 100–100000 nm")]             // looped forever in plots before
    [InlineData("3.8e11,1\n5e11,2\n7.8e11,3\n", "outside 100–100000 nm")]          // IndexOutOfRange before
    [InlineData("0.38,1\n0.40,2\n0.42,3\n0.44,4\n", "micrometres")]                  // µm taken as nm before
    [InlineData("3.8e-7,1\n4e-7,2\n4.2e-7,3\n", "metres")]
    [InlineData("380,1\n380.001,2\n380.002,3\n", "closer than 0.01 nm")]
    public void Implausible_wavelength_grids_are_errors_with_a_unit_hint(string rows, string expected)
    {
        var clock = Stopwatch.StartNew();
        var (code, _, err) = CliTests.Run("", "analyze", Write("w.csv", "nm,a\n" + rows));
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains(expected, err, StringComparison.Ordinal);
        Assert.Contains("w.csv:", err, StringComparison.Ordinal);
        NoTrace(err);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(30), "no hang");
    }

    [Fact]
    public void A_line_longer_than_the_limit_is_an_error_at_that_line_without_reading_it_whole()
    {
        var path = Path.Combine(_dir, "long.csv");
        using (var w = new StreamWriter(path))
        {
            w.Write("nm,a\n380,1\n390,2\n400,");
            w.Write(new string('7', 5 * 1024 * 1024));
            w.Write("\n");
        }
        var (code, _, err) = CliTests.Run("", "analyze", path);
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains("long.csv:4:1: line 4 is longer than", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Symlink_loops_are_followed_once_and_read_every_file_once()
    {
        Directory.CreateDirectory(Path.Combine(_dir, "a"));
        File.Copy(Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv"), Path.Combine(_dir, "a", "d.csv"));
        Directory.CreateSymbolicLink(Path.Combine(_dir, "a", "loop"), _dir);
        var (code, csv, _) = CliTests.Run("", "analyze", _dir, "--format", "csv");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal(7, csv.TrimEnd().Split('\n').Length); // header + the 6 downlights, once
    }

    [Fact]
    public void Results_written_into_an_input_folder_are_not_read_as_spectra_next_time()
    {
        var folder = Path.Combine(_dir, "lot");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "lot.csv"), RowFile(20));
        var spec = Write("s.json", """{"name": "s", "limits": [{"field": "cri.ra", "min": 0}]}""");
        var results = Path.Combine(folder, "results.csv");
        for (int run = 0; run < 2; run++)
        {
            var (code, _, err) = CliTests.Run("", "batch", folder, "--spec", spec, "-o", results, "--summary", Path.Combine(folder, "summary.txt"));
            Assert.Equal(ExitCodes.Success, code);
            Assert.Equal(21, File.ReadAllLines(results).Length);
            Assert.Equal("", err);
        }
    }

    [Fact]
    public void An_interrupted_batch_keeps_the_previous_results_and_writes_a_parsable_partial_file()
    {
        var input = Write("lot.csv", RowFile(50));
        var spec = Write("s.json", """{"name": "s", "limits": [{"field": "cri.ra", "min": 0}]}""");
        foreach (var ext in new[] { ".csv", ".json" })
        {
            var results = Path.Combine(_dir, "r" + ext);
            File.WriteAllText(results, "previous complete results");
            var o = new StringWriter();
            var e = new StringWriter();
            using var cts = new CancellationTokenSource();
            cts.Cancel(); // the signal arrives before the first record is read
            int code = LumenApp.Run(["batch", input, "--spec", spec, "-o", results], TextReader.Null, o, e, false, cts.Token);
            Assert.Equal(ExitCodes.Interrupted, code);
            Assert.Equal("previous complete results", File.ReadAllText(results));
            var partial = File.ReadAllText(results + ".partial");
            if (ext == ".json") JsonDocument.Parse(partial).Dispose();
            else Assert.StartsWith("id,location,status", partial, StringComparison.Ordinal);
            Assert.Contains(".partial", e.ToString(), StringComparison.Ordinal);
        }
    }

    [Fact]
    public void An_interrupted_analysis_keeps_the_previous_results_and_writes_a_parsable_partial_file()
    {
        var input = Write("many.csv", RowFile(50));
        foreach (var ext in new[] { ".csv", ".json" })
        {
            var results = Path.Combine(_dir, "a" + ext);
            File.WriteAllText(results, "previous complete results");
            var e = new StringWriter();
            using var cts = new CancellationTokenSource();
            cts.Cancel(); // the signal arrives before the first record is read
            int code = LumenApp.Run(["analyze", input, "--format", ext[1..], "-o", results], TextReader.Null, new StringWriter(), e, false, cts.Token);
            Assert.Equal(ExitCodes.Interrupted, code);
            Assert.Equal("previous complete results", File.ReadAllText(results));
            var partial = File.ReadAllText(results + ".partial");
            if (ext == ".json") JsonDocument.Parse(partial).Dispose();
            else Assert.StartsWith("name,source,column,status", partial, StringComparison.Ordinal);
            Assert.Contains("interrupted", e.ToString(), StringComparison.Ordinal);
        }
    }

    [Fact]
    public void A_typo_in_a_row_layout_header_is_an_error_at_its_column()
    {
        var header = "id," + string.Join(',', Enumerable.Range(0, 81).Select(i => i == 24 ? "5OO" : (380 + 5 * i).ToString(CultureInfo.InvariantCulture)));
        var (code, _, err) = CliTests.Run("", "analyze", Write("typo.csv", RowFile(5, header: header)));
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains("typo.csv:1:26: header cell 26 breaks the wavelength grid: '5OO'", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Ids_starting_with_a_hash_are_records_not_comments()
    {
        var (code, csv, _) = CliTests.Run("", "analyze", Write("hash.csv", "# a comment before the header\n" + RowFile(10, r => r % 2 == 0 ? $"#U{r}" : $"U{r}")), "--format", "csv");
        Assert.Equal(ExitCodes.Success, code);
        var lines = csv.TrimEnd().Split('\n');
        Assert.Equal(11, lines.Length);
        Assert.Contains(lines, l => l.StartsWith("#U4,", StringComparison.Ordinal));
    }

    [Fact]
    public void A_column_file_whose_header_names_spectra_by_numbers_stays_a_column_file()
    {
        var text = "nm," + string.Join(',', Enumerable.Range(0, 12).Select(i => 1000 + 400 * i)) + "\n"
            + string.Join("\n", Enumerable.Range(0, 81).Select(i => $"{380 + 5 * i}," + string.Join(',', Enumerable.Repeat("1", 12))));
        var (code, csv, _) = CliTests.Run("", "analyze", Write("serials.csv", text), "--format", "csv");
        Assert.Equal(ExitCodes.Success, code);
        var lines = csv.TrimEnd().Split('\n');
        Assert.Equal(13, lines.Length); // 12 spectra, named by their serial numbers
        Assert.StartsWith("1000,", lines[1], StringComparison.Ordinal);
    }

    [Fact]
    public void Standard_input_is_read_once_and_streams_in_the_row_layout()
    {
        var (code, csv, _) = CliTests.Run(RowFile(300), "analyze", "-", "--format", "csv");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal(301, csv.TrimEnd().Split('\n').Length);
    }

    [Theory]
    [InlineData("{\"na\\u00ffme\": 1}", null, "not valid UTF-8")]
    [InlineData("{\"name\": \"x\", \"limits\": [{\"field\": \"cri.ra\", \"min\": 80}],\n \"limits\": []}", null, "2:2: duplicate key 'limits'")]
    [InlineData("{\"name\": \"x\", \"limits\": [{\"field\": \"cri.ra\", \"min\": 1e400}]}", null, "beyond the range of double precision")]
    [InlineData("{\"name\": 5, \"limits\": [{\"field\": \"cri.ra\", \"min\": 80}]}", null, "name must be a text")]
    [InlineData("{}", null, "checks nothing")]
    [InlineData("{\"name\": \"x\", \"limits\": [{\"field\": \"cri.ra\", \"min\": \"80\"}]}", null, "min must be a number")]
    public void Hostile_specifications_are_errors_with_line_and_column(string json, string? unused, string expected)
    {
        _ = unused;
        var specPath = Path.Combine(_dir, "bad.json");
        var bytes = Encoding.UTF8.GetBytes(json);
        if (json.Contains("\\u00ff", StringComparison.Ordinal)) bytes = [.. "{\"na"u8, 0xFF, .. "me\":1}"u8];
        File.WriteAllBytes(specPath, bytes);
        var (code, _, err) = CliTests.Run("", "batch", Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv"), "--spec", specPath, "-o", Path.Combine(_dir, "r.csv"));
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains("bad.json:", err, StringComparison.Ordinal);
        Assert.Contains(expected, err, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(_dir, "r.csv")));
    }

    [Theory]
    [InlineData("3000,5")]
    [InlineData("1e400")]
    [InlineData("3 000")]
    public void Numbers_on_the_command_line_are_invariant_and_finite(string value)
    {
        var (code, _, err) = CliTests.Run("", "blackbody", value);
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains("is not a number", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Usage_mistakes_have_their_own_exit_code()
    {
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "analyze", "--bogus", Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv")).Code);
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "batch", Path.Combine(CliTests.RepoRoot, "examples"), "--spec", _dir).Code);
        var empty = Path.Combine(_dir, "empty");
        Directory.CreateDirectory(empty);
        var (code, _, err) = CliTests.Run("", "analyze", empty);
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains("holds no .csv, .tsv, .txt or .spdx file", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_full_standard_output_exits_4_with_one_line()
    {
        var e = new StringWriter();
        int code = LumenApp.Run(["analyze", Path.Combine(CliTests.RepoRoot, "examples", "marrowby-stage-halogen.csv")], TextReader.Null, new FullWriter(), e);
        Assert.Equal(ExitCodes.OutputError, code);
        Assert.StartsWith("lumen: cannot write standard output", e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Compare_and_mix_with_a_dark_spectrum_warn_instead_of_failing()
    {
        var text = "nm,dark,led,narrow\n" + string.Join("\n", Enumerable.Range(0, 81).Select(i =>
        {
            int w = 380 + 5 * i;
            return string.Create(CultureInfo.InvariantCulture, $"{w},0,{Math.Exp(-Math.Pow((w - 560) / 60.0, 2) / 2):R},{Math.Exp(-Math.Pow((w - 520) / 8.0, 2) / 2):R}");
        }));
        var path = Write("dark.csv", text);
        var (code, _, err) = CliTests.Run("", "compare", path);
        Assert.Equal(ExitCodes.Success, code);
        NoTrace(err);
        var (mixCode, mixText, mixErr) = CliTests.Run("", "mix", path, "--cct", "3000");
        Assert.Equal(ExitCodes.Success, mixCode);
        NoTrace(mixErr);
        Assert.Contains("Channel 'dark' has no visible power", mixText, StringComparison.Ordinal);
        Assert.DoesNotContain("NaN", mixText, StringComparison.Ordinal);
    }

    /// <summary>
    /// A named pipe read by batch: every row arrives, as from the file itself. batch reads each file's metadata names
    /// before the real read; on a pipe that first read took the header and the first rows (a process substitution lost
    /// them, then reported the rest as ragged), and opening a named pipe a second time could hang the real read.
    /// </summary>
    [Fact]
    public async Task A_named_pipe_loses_nothing()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return; // named pipes as files are a Unix thing
        string file = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv"), pipe = Path.Combine(_dir, "pipe.csv");
        using (var mk = Process.Start(new ProcessStartInfo("mkfifo", [pipe]) { UseShellExecute = false })!) mk.WaitForExit();
        var writer = Task.Run(() => File.WriteAllBytes(pipe, File.ReadAllBytes(file))); // blocks until the batch opens the pipe
        string fromPipe = Path.Combine(_dir, "pipe.out.csv"), fromFile = Path.Combine(_dir, "file.out.csv");
        var run = Task.Run(() => CliTests.Run("", "batch", pipe, "--nominal-cct", "3000", "--steps", "3", "-o", fromPipe, "--summary", fromPipe + ".txt"));
        var result = await run.WaitAsync(TimeSpan.FromSeconds(60)); // throws TimeoutException if the batch hangs on the pipe
        await writer.WaitAsync(TimeSpan.FromSeconds(10)); // the writer was read to its end
        var direct = CliTests.Run("", "batch", file, "--nominal-cct", "3000", "--steps", "3", "-o", fromFile, "--summary", fromFile + ".txt");
        Assert.Equal(direct.Code, result.Code);
        static string[] WithoutLocation(string path) => [.. File.ReadAllLines(path).Select(l => string.Join(',', l.Split(',').Where((_, i) => i != 1)))];
        Assert.Equal(WithoutLocation(fromFile), WithoutLocation(fromPipe));
    }

    [NotRootFact]
    public void An_unreadable_file_is_an_error_record_not_a_crash()
    {
        var path = Write("secret.csv", Gaussian(1));
        if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(path, UnixFileMode.None);
        var (code, _, err) = CliTests.Run("", "analyze", path);
        Assert.Equal(ExitCodes.InputErrors, code);
        Assert.Contains("secret.csv: cannot read", err, StringComparison.Ordinal);
    }

    private sealed class FullWriter : TextWriter
    {
        public override Encoding Encoding => Encoding.UTF8;

        public override void Write(char value) => throw new IOException("No space left on device");

        public override void Write(string? value) => throw new IOException("No space left on device");

        public override void Flush() => throw new IOException("No space left on device");
    }
}

/// <summary>A fact that needs file permissions to bite: skipped (with the reason) when the tests run as root.</summary>
public sealed class NotRootFactAttribute : FactAttribute
{
    /// <summary>Sets Skip for root.</summary>
    public NotRootFactAttribute()
    {
        if (Environment.UserName == "root" || Environment.GetEnvironmentVariable("USER") == "root")
            Skip = "running as root, which reads files whatever their permissions; the unreadable-file case cannot be made here.";
    }
}
