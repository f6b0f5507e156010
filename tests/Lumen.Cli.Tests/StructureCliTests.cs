using System.Text.Json;

namespace Lumen.Cli.Tests;

/// <summary>
/// The shared input and output rules of every verb: folders and '-' as inputs, '-o -' as standard output, atomic outputs,
/// and non-finite numbers written as null with a warning (never a crash). Regression tests for the structure issue.
/// </summary>
public class StructureCliTests
{
    private static string Example(string f) => Path.Combine(CliTests.RepoRoot, "examples", f);

    private static string TempDir()
    {
        var d = Path.Combine(Path.GetTempPath(), $"lumen-structure-{Guid.NewGuid():N}");
        Directory.CreateDirectory(d);
        return d;
    }

    private static string ZeroSpectrum() => "nm,dark\n" + string.Join("\n", Enumerable.Range(0, 81).Select(i => $"{380 + 5 * i},0")) + "\n";

    [Fact]
    public void Fit_of_an_all_zero_spectrum_writes_null_and_a_warning_in_JSON_and_no_NaN_in_text()
    {
        var (code, stdout, stderr) = CliTests.Run(ZeroSpectrum(), "fit", "-", "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        Assert.DoesNotContain("Exception", stderr, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(stdout);
        var r = doc.RootElement[0];
        Assert.Equal(JsonValueKind.Null, r.GetProperty("temperatureK").ValueKind);
        Assert.Equal(JsonValueKind.Null, r.GetProperty("temperatureLowK").ValueKind);
        Assert.Contains("no signal", r.GetProperty("warnings")[0].GetString()!, StringComparison.Ordinal);
        var (textCode, text, _) = CliTests.Run(ZeroSpectrum(), "fit", "-");
        Assert.Equal(ExitCodes.Success, textCode);
        Assert.DoesNotContain("NaN", text, StringComparison.Ordinal);
        Assert.Contains("no signal", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("1e100")]
    [InlineData("5e-324")]
    [InlineData("1e-300")]
    public void Blackbody_at_extreme_temperatures_never_crashes_and_writes_valid_JSON(string t)
    {
        var (code, stdout, stderr) = CliTests.Run("", "blackbody", t, "--format", "json", "--area", "1e308");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("", stderr);
        using var doc = JsonDocument.Parse(stdout);
        Assert.True(doc.RootElement.GetProperty("warnings").GetArrayLength() > 0);
    }

    [Fact]
    public void Blackbody_overflow_is_null_with_a_warning()
    {
        // σT⁴ overflows double range for T = 1e100 K (σ·1e400): the exitance is null, and a warning says why.
        var (_, stdout, _) = CliTests.Run("", "blackbody", "1e100", "--format", "json");
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("exitanceWPerM2").ValueKind);
        Assert.Contains(doc.RootElement.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("exitance", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("--ambient", "Infinity")]
    [InlineData("--area", "-1")]
    [InlineData("--emissivity", "NaN")]
    public void Blackbody_rejects_impossible_arguments_as_usage_errors(string option, string value)
    {
        var (code, _, stderr) = CliTests.Run("", "blackbody", "3000", option, value);
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains(option, stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Analyze_and_fit_accept_a_folder()
    {
        var (code, stdout, _) = CliTests.Run("", "analyze", Example("batch"), "--format", "csv");
        Assert.Equal(ExitCodes.InputErrors, code); // the lot holds four unreadable rows (examples/README.md)
        Assert.Equal(241, stdout.TrimEnd().Split('\n').Length); // header + 240 units
        var (fitCode, fitOut, _) = CliTests.Run("", "fit", Example("batch"), "--format", "csv");
        Assert.Equal(ExitCodes.InputErrors, fitCode);
        Assert.Equal(241, fitOut.TrimEnd().Split('\n').Length);
    }

    [Theory]
    [InlineData("analyze")]
    [InlineData("fit")]
    [InlineData("batch")]
    [InlineData("report")]
    [InlineData("plot")]
    [InlineData("blackbody")]
    public void Dash_o_dash_writes_to_standard_output_on_every_verb(string verb)
    {
        string[] args = verb switch
        {
            "batch" => ["batch", Example("quillfern-downlights-3000K.csv"), "--spec", Example("batch/spec-dl30.json"), "-o", "-"],
            "plot" => ["plot", "locus", Example("quillfern-downlights-3000K.csv"), "-o", "-"],
            "blackbody" => ["blackbody", "3000", "-o", "-"],
            _ => [verb, Example("quillfern-downlights-3000K.csv"), "-o", "-"],
        };
        var (code, stdout, _) = CliTests.Run("", args);
        Assert.True(code is ExitCodes.Success or ExitCodes.SpecificationFailed, $"exit {code}");
        Assert.True(stdout.Length > 100, stdout);
        string? start = verb switch { "plot" => "<?xml", "report" => "<!DOCTYPE", "batch" => "id,", "blackbody" => "Blackbody", "fit" => "DL-30", _ => "Name" };
        Assert.StartsWith(start, stdout.TrimStart(), StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Output_that_is_also_an_input_is_refused_and_the_input_kept()
    {
        var dir = TempDir();
        try
        {
            var input = Path.Combine(dir, "in.csv");
            File.Copy(Example("quillfern-downlights-3000K.csv"), input);
            var before = File.ReadAllBytes(input);
            var (code, _, stderr) = CliTests.Run("", "analyze", input, "-o", input);
            Assert.Equal(ExitCodes.UsageError, code);
            Assert.Contains("also an input", stderr, StringComparison.Ordinal);
            Assert.Equal(before, File.ReadAllBytes(input));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void An_unwritable_output_exits_4_and_leaves_no_temporary_file()
    {
        var dir = TempDir();
        try
        {
            var target = Path.Combine(dir, "no-such-folder", "out.csv");
            var (code, _, stderr) = CliTests.Run("", "analyze", Example("quillfern-downlights-3000K.csv"), "-o", target);
            Assert.Equal(ExitCodes.OutputError, code);
            Assert.Contains("cannot write", stderr, StringComparison.Ordinal);
            Assert.Empty(Directory.GetFiles(dir, "*", SearchOption.AllDirectories));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void A_file_output_is_complete_and_no_temporary_file_remains()
    {
        var dir = TempDir();
        try
        {
            var target = Path.Combine(dir, "out.json");
            File.WriteAllText(target, "previous");
            var (code, _, _) = CliTests.Run("", "analyze", Example("quillfern-downlights-3000K.csv"), "--format", "json", "-o", target);
            Assert.Equal(ExitCodes.Success, code);
            using var doc = JsonDocument.Parse(File.ReadAllText(target));
            Assert.Equal(6, doc.RootElement.GetArrayLength());
            Assert.Equal(["out.json"], Directory.GetFiles(dir).Select(f => Path.GetFileName(f)).ToArray());
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Deprecated_spec_key_warns_on_the_command_line()
    {
        var dir = TempDir();
        try
        {
            var spec = Path.Combine(dir, "s.json");
            File.WriteAllText(spec, """{"name": "c", "target": {"cct": 3000, "duv": 0}, "chromaticity": {"duvRadius": 0.01}}""");
            var (code, _, stderr) = CliTests.Run("", "batch", Example("quillfern-downlights-3000K.csv"), "--spec", spec, "-o", Path.Combine(dir, "r.csv"));
            Assert.True(code is ExitCodes.Success or ExitCodes.SpecificationFailed);
            Assert.Contains("warning", stderr, StringComparison.Ordinal);
            Assert.Contains("uPrimeVPrimeRadius", stderr, StringComparison.Ordinal);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void A_missing_native_library_is_an_installation_problem_not_an_internal_error()
    {
        // How a missing libSkiaSharp shows up: the first call into it fails in a type initializer, wrapping the load
        // failure. Found through the wrapping; anything else stays an internal error. (The native-build test in
        // PackageTests runs the real case: the binary alone in a folder.)
        var load = new DllNotFoundException("Unable to load shared library 'libSkiaSharp' or one of its dependencies.");
        Assert.Same(load, LumenApp.MissingNativeLibrary(new TypeInitializationException("SkiaSharp.SKImageInfo", load)));
        Assert.Same(load, LumenApp.MissingNativeLibrary(load));
        Assert.Null(LumenApp.MissingNativeLibrary(new TypeInitializationException("X", new InvalidOperationException("a bug"))));
        Assert.Null(LumenApp.MissingNativeLibrary(new IOException("disk")));
        Assert.Contains("8 incomplete installation", ExitCodes.Legend, StringComparison.Ordinal);
    }

    [Fact]
    public void An_output_that_is_a_spectrum_file_in_an_input_folder_is_refused_and_a_rerun_still_works()
    {
        // Found checking bad input: `batch FOLDER -o FOLDER/lot.csv` left lot.csv out of the scan (as a rerun's own
        // output) and then replaced the measurements with results. Now refused; writing results into the folder and
        // running again still reads only the lot.
        string dir = Path.Combine(Path.GetTempPath(), $"lumen-outin-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            string lot = Path.Combine(dir, "lot.csv"), spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");
            File.Copy(Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv"), lot);
            byte[] before = File.ReadAllBytes(lot);
            var (code, _, err) = CliTests.Run("", "batch", dir, "--spec", spec, "-o", lot, "--summary", Path.Combine(dir, "s.txt"));
            Assert.Equal(ExitCodes.UsageError, code);
            Assert.Contains("is a spectrum file in the input folder", err, StringComparison.Ordinal);
            Assert.Equal(before, File.ReadAllBytes(lot));
            string results = Path.Combine(dir, "results.csv");
            for (int run = 0; run < 2; run++)
            {
                (code, _, err) = CliTests.Run("", "batch", dir, "--spec", spec, "-o", results, "--summary", Path.Combine(dir, "s.txt"));
                Assert.Equal(ExitCodes.InputErrors, code); // the lot's four unreadable rows (examples/README.md)
                Assert.Equal(241, File.ReadAllLines(results).Length); // header + 240 records, the earlier results not read
            }
            Assert.Equal(before, File.ReadAllBytes(lot));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void A_file_written_with_early_flushes_has_exactly_the_bytes_written()
    {
        // Issue 16: outputs are flushed to disk while they grow; the bytes, their order, seeking (Parquet) and the final
        // flush must be as without it. 3 MB in uneven pieces, an early flush every 64 KB.
        var dir = TempDir();
        try
        {
            var rng = new Random(16);
            var expected = new byte[3 << 20];
            rng.NextBytes(expected);
            var path = Path.Combine(dir, "out.bin");
            int flushes;
            using (var file = new FileStream(path, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 16))
            using (var stream = new EarlyWriteback(file, every: 1 << 16))
            {
                int at = 0;
                while (at < expected.Length)
                {
                    int n = Math.Min(expected.Length - at, 1 + rng.Next(40_000));
                    stream.Write(expected, at, n);
                    at += n;
                }
                Assert.Equal(expected.Length, stream.Position);
                stream.Seek(10, SeekOrigin.Begin); // a writer that goes back to fill in a header
                stream.WriteByte(expected[10]);
                stream.Seek(0, SeekOrigin.End);
                stream.Complete();
                flushes = stream.EarlyFlushes;
            }
            Assert.True(flushes >= 1, $"no early flush in 3 MB ({flushes})");
            Assert.Equal(expected, File.ReadAllBytes(path));

            // The same through the atomic writer every verb uses: the target gets the bytes, no temporary file is left.
            var target = Path.Combine(dir, "target.bin");
            Assert.Null(OutputTarget.WriteFile(target, s => { for (int i = 0; i < expected.Length; i += 65_000) s.Write(expected, i, Math.Min(65_000, expected.Length - i)); }));
            Assert.Equal(expected, File.ReadAllBytes(target));
            Assert.Equal(["out.bin", "target.bin"], Directory.GetFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        }
        finally { Directory.Delete(dir, true); }
    }
}
