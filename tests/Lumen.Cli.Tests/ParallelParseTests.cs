using Lumen.Cli;
using Lumen.Formats;

namespace Lumen.Cli.Tests;

/// <summary>Rows parsed on the compute threads give the same bytes and diagnostics as parsing on one (issue 16).</summary>
public sealed class ParallelParseTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-pp-{Guid.NewGuid():N}");

    public ParallelParseTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private static readonly string[] Numbers =
    [
        "1.5E-03", "1e+2", "2E5", "-6.02e+2", "1.e5", ".5e1", ".5", "5.", "+.5", "-0.0e0", "007", "0.000000000000000000001",
        "9007199254740991", "9007199254740993", "12345678901234567890", "1e22", "1e23", "1e-22", "1.5e-23", "1e00001", "1e-400",
        "1e", "e5", "1e5.0", "1.2.3", "--1", "1E+", " 1.5e2", "1.5e2 ", "0x10", "1_000",
    ];

    /// <summary>A hostile corpus of our own making: faults of every kind a row file can have.</summary>
    private string[] Corpus()
    {
        string wl = string.Join(',', Enumerable.Range(0, 81).Select(i => 380 + 5 * i));
        string Row(Func<int, string> cell) => string.Join(',', Enumerable.Range(0, 81).Select(cell));
        var files = new Dictionary<string, string>
        {
            ["hash-ids.csv"] = $"id,{wl}\n#1,{Row(i => "1")}\n#2,{Row(i => (1 + i * 0.01).ToString(System.Globalization.CultureInfo.InvariantCulture))}\n",
            ["faults.csv"] = $"# station: EOL-9\nid,bin,{wl}\nA,x,{Row(i => i == 4 ? "n/a" : "1")}\nB,y,{Row(i => i == 9 ? "" : "2")}\nC,z,{Row(i => "3")},9\nD,w,{Row(i => "1e-320")}\nE,v,{Row(i => "1e300")}\nF,u,{Row(i => "0")}\n",
            ["header-typo.csv"] = $"id,{wl.Replace("500", "5OO", StringComparison.Ordinal)}\nA,{Row(i => "1")}\n",
            ["header-only.csv"] = $"id,{wl}\n",
            ["empty.csv"] = "",
            // Cases the span parser must treat exactly as the per-cell one (issue 16).
            ["trailing.csv"] = $"id,{wl},\nA,{Row(i => "1")},\nB,{Row(i => "2")},,\nC,{Row(i => "3")}\n",
            ["quoted.csv"] = $"\"id\",{wl}\n\" A \",{Row(i => i % 3 == 0 ? "\" 1.5 \"" : " 2 ")}\n\"\",{Row(i => "1")}\n,{Row(i => "1")}\n",
            ["spaces.txt"] = $"id {wl.Replace(',', ' ')}\nA\t{Row(i => "1,5").Replace(',', ' ').Replace("1 5", "1,5", StringComparison.Ordinal)}  \n  B  {Row(i => i == 7 ? "\"" : "2").Replace(',', ' ')}\nC {Row(i => "3").Replace(',', ' ')} \"\"\n",
            ["semicolon.csv"] = $"id;{wl.Replace(',', ';')}\nA;{Row(i => "1,25").Replace(',', ';').Replace("1;25", "1,25", StringComparison.Ordinal)}\nB;{Row(i => i == 2 ? "1,2,3" : i == 3 ? new string('1', 70) + ",5" : "1")}\n".Replace("1,2,3;", "1,2,3;", StringComparison.Ordinal),
            ["extra-cell.csv"] = $"id,{wl}\nA,{Row(i => "1")},x\nB,{Row(i => "1")},,\nC,{Row(i => "+1.0E0")}\nD,{Row(i => "NaN")}\nE,{Row(i => "-0")}\n",
            // Every form of number the one-pass cell reader takes, and the near misses it must hand to the general path.
            ["numbers.csv"] = $"id,{wl}\n" + string.Join('\n', Numbers.Select((n, k) => $"N{k},{Row(i => i % 2 == 0 ? n : "0.5")}")) + $"\nL,{Row(i => Numbers[i % Numbers.Length])}\n",
            ["numbers.tsv"] = $"id\t{wl.Replace(',', '\t')}\nT,{Row(i => Numbers[(i * 7) % Numbers.Length])}\n".Replace(',', '\t'),
            // Units from about 3900 K to 5400 K, most in the CIE 224 blend (4000–5000 K), whose reference appearance comes from tables built per (M1, M2)
            // pair and cell as units arrive: the results must not depend on which thread met a cell first.
            ["blend.csv"] = $"id,{wl}\n" + string.Join('\n', Enumerable.Range(0, 48).Select(k => $"B{k},{Row(i => BlendValue(4200 + 31.3 * k, 380 + 5 * i))}")) + "\n",
        };
        foreach (var (name, text) in files) File.WriteAllText(Path.Combine(_dir, name), text);
        // Bytes the UTF-8 row path (issue 16) must read exactly as a StreamReader's characters: encoding marks, CR LF,
        // padding that only Unicode calls white space, characters beyond ASCII in IDs and cells, malformed bytes.
        byte[] U(string text) => System.Text.Encoding.UTF8.GetBytes(text);
        var raw = new Dictionary<string, byte[]>
        {
            ["utf8-mark.csv"] = [0xEF, 0xBB, 0xBF, .. U($"id,lot,{wl}\r\nA,ü,{Row(i => "1.5")}\r\n\r\nB,€,{Row(i => "2")}\r\n")],
            ["utf16.csv"] = [.. System.Text.Encoding.Unicode.GetPreamble(), .. System.Text.Encoding.Unicode.GetBytes($"id,lot,{wl}\r\nA,ü,{Row(i => "1.5")}\r\nB,x,{Row(i => i == 3 ? "x" : "2")}\r\n")],
            ["unicode-space.csv"] = U($"id,{wl}\n\u00A0A,{Row(i => "1")}\u2003\n\u00A0\n\u3000\nB,{Row(i => "2")}\u00A0\nC\u00A0,{Row(i => i == 80 ? "3\u00A0" : "3")}\nD,{Row(i => i == 0 ? "\u00A04" : "4")}\n"),
            ["malformed.csv"] = [.. U($"id,{wl}\nA"), 0xFF, 0xC3, .. U($",{Row(i => "1")}\nB,"), .. U(Row(i => "2"))[..40], 0xE2, 0x82, .. U(Row(i => "2"))[40..], .. U($"\nC,{Row(i => "3")}"), 0xC3, .. U("\r")],
            ["no-final-newline.csv"] = U($"id,{wl}\nA,{Row(i => "1")}\r\nB,{Row(i => "2")}\r"),
        };
        foreach (var (name, bytes) in raw) File.WriteAllBytes(Path.Combine(_dir, name), bytes);
        return [.. files.Keys.Concat(raw.Keys).Select(n => Path.Combine(_dir, n)), Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv"),
            Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv")];
    }

    /// <summary>A Planckian radiator's relative radiance with a gentle ripple, as text (the test's own made-up source).</summary>
    private static string BlendValue(double kelvin, double nm) =>
        (1e20 / Math.Pow(nm, 5) / (Math.Exp(1.4388e7 / (nm * kelvin)) - 1) * (1 + 0.15 * Math.Sin(nm / 23.0))).ToString("R", System.Globalization.CultureInfo.InvariantCulture);

    [Fact]
    public void Batch_output_and_diagnostics_are_byte_identical_on_one_and_four_threads()
    {
        var inputs = Corpus();
        string one = Path.Combine(_dir, "one.csv"), four = Path.Combine(_dir, "four.csv");
        var a = CliTests.Run("", ["batch", .. inputs, "--nominal-cct", "3000", "--steps", "5", "--min", "ra=80", "--threads", "1", "-o", one, "--summary", one + ".json"]);
        var b = CliTests.Run("", ["batch", .. inputs, "--nominal-cct", "3000", "--steps", "5", "--min", "ra=80", "--threads", "4", "-o", four, "--summary", four + ".json"]);
        Assert.Equal(a.Code, b.Code);
        Assert.Equal(ExitCodes.InputErrors, a.Code);
        Assert.Equal(File.ReadAllBytes(one), File.ReadAllBytes(four));
        Assert.Equal(File.ReadAllBytes(one + ".json"), File.ReadAllBytes(four + ".json"));
        Assert.Equal(a.Err, b.Err);
        Assert.Contains(":1:", a.Err, StringComparison.Ordinal); // the header typo, located
    }

    [Theory]
    [InlineData("csv")]
    [InlineData("json")]
    [InlineData("text")]
    public void Analyze_output_and_diagnostics_are_byte_identical_on_one_and_four_threads(string format)
    {
        var inputs = Corpus();
        var a = CliTests.Run("", ["analyze", .. inputs, "--format", format, "--nominal-cct", "3000", "--steps", "5", "--min", "ra=80", "--threads", "1"]);
        var b = CliTests.Run("", ["analyze", .. inputs, "--format", format, "--nominal-cct", "3000", "--steps", "5", "--min", "ra=80", "--threads", "4"]);
        Assert.Equal(ExitCodes.InputErrors, a.Code);
        Assert.Equal(a.Code, b.Code);
        Assert.Equal(a.Out, b.Out);
        Assert.Equal(a.Err, b.Err);
        Assert.True(a.Out.Length > 10000);
    }

    [Fact]
    public void Deferred_rows_parsed_in_any_order_equal_the_streamed_records()
    {
        foreach (var file in Corpus())
        {
            var streamed = SpectrumFiles.Read(file).Select(Describe).ToList();
            var deferred = SpectrumFiles.ReadDeferred(file).ToList();
            var parsed = new string[deferred.Count];
            Parallel.For(0, deferred.Count, i => parsed[deferred.Count - 1 - i] = Describe(deferred[deferred.Count - 1 - i]()));
            Assert.Equal(streamed, parsed);
        }
    }

    [Fact]
    public void The_span_and_utf8_parsers_equal_the_per_cell_parser_on_every_corpus_file()
    {
        int spectra = 0;
        foreach (var file in Corpus())
        {
            string stem = Path.GetFileNameWithoutExtension(file);
            List<string> Parse(bool spans)
            {
                using var reader = new StreamReader(file);
                return Lumen.Formats.RowSpectrumReader.ReadDeferred(reader, file, stem, null, spans).Select(p => Describe(p())).ToList();
            }
            List<string> ParseUtf8()
            {
                using var reader = LineReader.Open(File.OpenRead(file)); // rows kept as UTF-8 bytes until parsed
                return Lumen.Formats.RowSpectrumReader.ReadDeferred(reader, file, stem, null, true).Select(p => Describe(p())).ToList();
            }
            var fast = Parse(true);
            var perCell = Parse(false);
            Assert.Equal(perCell, fast);
            Assert.Equal(perCell, ParseUtf8());
            spectra += fast.Count(d => !d.Contains("Error", StringComparison.Ordinal) && !d.Contains(": ", StringComparison.Ordinal));
        }
        Assert.True(spectra > 200, $"only {spectra} spectra compared");
    }

    private static string Describe(Lumen.Analysis.InputRecord r) => r switch
    {
        Lumen.Analysis.SpectrumRecord s => $"{s.Location}|{s.Name}|{string.Join(';', s.Metadata)}|{string.Join(',', s.Spectrum.Values.ToArray())}|{s.Spectrum.Unit}",
        Lumen.Analysis.ErrorRecord e => $"{e.Location}|{e.Name}|{string.Join(';', e.Metadata)}|{e.Error}",
        _ => "?",
    };
}
