using System.Diagnostics;
using System.Globalization;
using System.Text;
using Lumen.Analysis;
using Lumen.Formats;

namespace Lumen.Fuzz;

/// <summary>
/// Mutation fuzzing of every reader Lumen has (column layout, row layout, the layout detector with the line reader, the
/// specification parser), and of the assessment of whatever spectra the mutated files still hold. A crash is any
/// exception escaping a reader or the assessment; a hang is an input that takes longer than the time limit. Seeded, so a
/// run can be repeated exactly.
/// Usage: dotnet run -c Release --project tools/Lumen.Fuzz -- [--inputs N] [--assess-every K] [--seed S] [--out bench/results/fuzz.md]
/// </summary>
public static class Program
{
    private static readonly byte[] Interesting = ",;\t\n\r#\"-.e0123456789 "u8.ToArray().Concat(new byte[] { 0, 0xFF, 0xC3, 0xEF, 0xBB, 0xBF }).ToArray();
    private static readonly string[] ExtremeNumbers = ["1e308", "-1e308", "1e-320", "5e-324", "-0", "NaN", "Infinity", "-Infinity", "1e400", "99999999999999999999999", "0x10", "1,5", "", "  ", "3.8e11", "1e300", "0.38", "1e9"];

    public static int Main(string[] args)
    {
        long inputs = Arg(args, "--inputs", 1_000_000);
        long assessEvery = Arg(args, "--assess-every", 50);
        int seed = (int)Arg(args, "--seed", 20261202);
        string outPath = args.SkipWhile(a => a != "--out").Skip(1).FirstOrDefault() ?? Path.Combine("bench", "results", "fuzz.md");
        double hangSeconds = 5;
        var seeds = Seeds();
        var targets = new (string Name, Func<byte[], int> Run)[]
        {
            ("column layout (DelimitedSpectrumReader)", b => Drain(DelimitedSpectrumReader.Read(new StringReader(Text(b)), "fuzz.csv", "fuzz"))),
            ("row layout (RowSpectrumReader)", b => Drain(RowSpectrumReader.Read(new StringReader(Text(b)), "fuzz.csv", "fuzz"))),
            ("layout detection + line reader (SpectrumFiles path)", b => Drain(Detected(b))),
            ("tolerance specification (SpecReader)", b => SpecReader.Read(b, "fuzz.json", out var e) is null ? e.Count : 1),
        };
        var report = new StringBuilder();
        report.AppendLine("# Fuzzing record");
        report.AppendLine();
        report.AppendLine(CultureInfo.InvariantCulture, $"Written by `tools/Lumen.Fuzz` on {DateTime.UtcNow:yyyy-MM-dd} (UTC); seed {seed}; {Environment.ProcessorCount} cores; .NET {Environment.Version}.");
        report.AppendLine(CultureInfo.InvariantCulture, $"Mutations of {seeds.Count} seed files (the examples and a hostile corpus): byte flips, inserted delimiters and control bytes, deleted ranges, duplicated and swapped lines, numbers replaced by extreme values, truncation and splicing. A crash is any exception escaping the reader (or the assessment of every {assessEvery}th input's spectra); a hang is one input taking more than {hangSeconds} s. The four targets ran in parallel on the cores available, so each rate is per target, not per core.");
        report.AppendLine();
        report.AppendLine("| target | inputs | crashes | hangs | first input, cold (ms) | slowest later input (ms) | inputs/s | spectra assessed |");
        report.AppendLine("|---|---:|---:|---:|---:|---:|---:|---:|");
        int totalFailures = 0;
        var rows = new string[targets.Length];
        Parallel.For(0, targets.Length, t =>
        {
            var (name, run) = targets[t];
            var rowText = new StringBuilder();
            var rng = new Random(seed);
            long crashes = 0, hangs = 0, assessed = 0;
            double slowest = 0, first = 0;
            var clock = Stopwatch.StartNew();
            var failures = new List<string>();
            for (long i = 0; i < inputs; i++)
            {
                var input = Mutate(seeds[rng.Next(seeds.Count)], seeds[rng.Next(seeds.Count)], rng);
                long start = Stopwatch.GetTimestamp();
                try
                {
                    run(input);
                    if (assessEvery > 0 && i % assessEvery == 0 && !name.StartsWith("tolerance", StringComparison.Ordinal))
                        assessed += Assess(input);
                }
                catch (Exception ex)
                {
                    crashes++;
                    if (failures.Count < 5) failures.Add($"{ex.GetType().Name}: {ex.Message}");
                    Save(outPath, name, i, input);
                }
                double ms = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
                // The first input pays for compiling the code and building the CIE tables; it is reported on its own.
                if (i == 0) first = ms; else slowest = Math.Max(slowest, ms);
                if (ms > hangSeconds * 1000) { hangs++; Save(outPath, name + " (slow)", i, input); }
                if ((i + 1) % 100_000 == 0) Console.Error.WriteLine($"{name}: {i + 1:N0} inputs, {crashes} crashes, {hangs} hangs, {clock.Elapsed:mm\\:ss}");
            }
            double rate = inputs / Math.Max(1e-9, clock.Elapsed.TotalSeconds);
            rowText.AppendLine(CultureInfo.InvariantCulture, $"| {name} | {inputs:N0} | {crashes} | {hangs} | {first:0.0} | {slowest:0.0} | {rate:N0} | {assessed:N0} |");
            foreach (var f in failures) rowText.AppendLine(CultureInfo.InvariantCulture, $"|   first failures: {f.Replace('|', '/')} | | | | | | |");
            Interlocked.Add(ref totalFailures, (int)Math.Min(int.MaxValue, crashes + hangs));
            rows[t] = rowText.ToString();
        });
        foreach (var r in rows) report.Append(r);
        report.AppendLine();
        report.AppendLine("Reproduce: `dotnet run -c Release --project tools/Lumen.Fuzz -- --inputs 1000000`. Failing inputs are saved beside this file in `fuzz-failures/`.");
        Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(outPath))!);
        File.WriteAllText(outPath, report.ToString());
        Console.WriteLine(report.ToString());
        return totalFailures == 0 ? 0 : 1;
    }

    private static long Arg(string[] args, string name, long fallback)
    {
        int i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length && long.TryParse(args[i + 1], NumberStyles.Integer, CultureInfo.InvariantCulture, out long v) ? v : fallback;
    }

    private static string Text(byte[] b) => Encoding.UTF8.GetString(b);

    private static int Drain(IEnumerable<InputRecord> records)
    {
        int n = 0;
        foreach (var r in records)
        {
            if (r is not (SpectrumRecord or ErrorRecord)) throw new InvalidOperationException("a record of no known kind");
            n++;
        }
        if (n == 0) throw new InvalidOperationException("an input produced no record at all (something was lost)");
        return n;
    }

    private static IEnumerable<InputRecord> Detected(byte[] input)
    {
        // As a file is read: UTF-8 rows stay bytes until parsed (LineReader.Open); rows are also read as characters,
        // and both must give the same records.
        List<InputRecord> Read(LineReader lines)
        {
            var layout = lines.PeekFirstDataLine() is { } first ? RowSpectrumReader.DetectLayout(first) : TableLayout.Columns;
            var records = layout == TableLayout.Rows ? RowSpectrumReader.Read(lines, "fuzz.csv", "fuzz") : DelimitedSpectrumReader.Read(lines, "fuzz.csv", "fuzz");
            return records.ToList();
        }
        using var bytes = LineReader.Open(new MemoryStream(input));
        using var characters = new LineReader(new StreamReader(new MemoryStream(input), Encoding.UTF8, true));
        var fromBytes = Read(bytes);
        var fromCharacters = Read(characters);
        if (!fromBytes.Select(Describe).SequenceEqual(fromCharacters.Select(Describe)))
            throw new InvalidOperationException("the UTF-8 reader and the character reader disagree");
        return fromBytes;
    }

    private static string Describe(InputRecord r) => r switch
    {
        SpectrumRecord s => $"{s.Location}|{s.Name}|{string.Join(';', s.Metadata)}|{string.Join(',', s.Spectrum.Values.ToArray())}",
        ErrorRecord e => $"{e.Location}|{e.Name}|{string.Join(';', e.Metadata)}|{e.Error}",
        _ => "?",
    };

    private static int Assess(byte[] input)
    {
        int n = 0;
        foreach (var r in DelimitedSpectrumReader.Read(new StringReader(Text(input)), "fuzz.csv", "fuzz").Concat(RowSpectrumReader.Read(new StringReader(Text(input)), "fuzz.csv", "fuzz")))
        {
            var o = RecordOutcome.Of(r, AssessmentOptions.Default);
            if (o.Error is { } e && e.Message.StartsWith("could not compute", StringComparison.Ordinal)) throw new InvalidOperationException("assessment failed: " + e.Message);
            n += o.Assessment is null ? 0 : 1;
        }
        return n;
    }

    private static void Save(string outPath, string target, long index, byte[] input)
    {
        var dir = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(outPath))!, "fuzz-failures");
        Directory.CreateDirectory(dir);
        File.WriteAllBytes(Path.Combine(dir, $"{new string(target.Where(char.IsLetterOrDigit).Take(20).ToArray())}-{index}.bin"), input);
    }

    private static List<byte[]> Seeds()
    {
        var seeds = new List<byte[]>();
        foreach (var dir in new[] { "examples", Path.Combine("examples", "batch") })
            if (Directory.Exists(dir))
                foreach (var f in Directory.GetFiles(dir).Where(f => f.EndsWith(".csv", StringComparison.Ordinal) || f.EndsWith(".tsv", StringComparison.Ordinal) || f.EndsWith(".json", StringComparison.Ordinal)))
                {
                    var bytes = File.ReadAllBytes(f);
                    seeds.Add(bytes.Length > 20_000 ? bytes[..20_000] : bytes); // keep inputs small: many of them matter more than big ones
                }
        var inv = CultureInfo.InvariantCulture;
        string Col(Func<int, double> f, int step = 5) => "nm,a,b\n" + string.Join("\n", Enumerable.Range(0, 400 / step + 1).Select(i => string.Create(inv, $"{380 + step * i},{f(380 + step * i):R},{f(380 + step * i) * 2:R}")));
        seeds.Add(Encoding.UTF8.GetBytes(Col(w => Math.Exp(-Math.Pow((w - 560) / 60.0, 2)))));
        seeds.Add(Encoding.UTF8.GetBytes(Col(w => 1e-310 * Math.Exp(-Math.Pow((w - 560) / 60.0, 2)))));
        seeds.Add(Encoding.UTF8.GetBytes(Col(w => 1e307 * Math.Exp(-Math.Pow((w - 450) / 20.0, 2)), 1)));
        seeds.Add(Encoding.UTF8.GetBytes("# unit: W/m2/nm\nnm;a\n380;1,5\n385;2,5\n390;3\n"));
        seeds.Add(Encoding.UTF8.GetBytes("id,lot," + string.Join(',', Enumerable.Range(0, 41).Select(i => 380 + 10 * i)) + "\n#U1,A," + string.Join(',', Enumerable.Repeat("0.5", 41)) + "\nU2,B," + string.Join(',', Enumerable.Repeat("1", 41)) + "\n"));
        seeds.Add("""{"name": "x", "target": {"nominalCct": 3000}, "chromaticity": {"ellipseSteps": 3}, "limits": [{"field": "cri.ra", "min": 80}, {"field": "cct.duv", "min": -0.006, "max": 0.006}]}"""u8.ToArray());
        seeds.Add("""{"target": {"x": 0.4338, "y": 0.4030}, "chromaticity": {"duvRadius": 0.003}}"""u8.ToArray());
        return seeds;
    }

    private static byte[] Mutate(byte[] a, byte[] b, Random rng)
    {
        var data = new List<byte>(a);
        int rounds = 1 + rng.Next(6);
        for (int r = 0; r < rounds; r++)
        {
            int n = data.Count;
            switch (rng.Next(9))
            {
                case 0 when n > 0: data[rng.Next(n)] ^= (byte)(1 << rng.Next(8)); break;
                case 1: data.Insert(rng.Next(n + 1), Interesting[rng.Next(Interesting.Length)]); break;
                case 2 when n > 1: { int at = rng.Next(n), len = Math.Min(n - at, 1 + rng.Next(64)); data.RemoveRange(at, len); break; }
                case 3: // duplicate a line
                {
                    var lines = Split(data);
                    if (lines.Count > 0) { int i = rng.Next(lines.Count); lines.Insert(i, lines[i]); data = Join(lines); }
                    break;
                }
                case 4: // swap two lines
                {
                    var lines = Split(data);
                    if (lines.Count > 1) { int i = rng.Next(lines.Count), j = rng.Next(lines.Count); (lines[i], lines[j]) = (lines[j], lines[i]); data = Join(lines); }
                    break;
                }
                case 5: // replace a number by an extreme value
                {
                    var s = Encoding.UTF8.GetString(data.ToArray());
                    var m = System.Text.RegularExpressions.Regex.Matches(s, @"-?\d+(\.\d+)?(e-?\d+)?");
                    if (m.Count > 0)
                    {
                        var x = m[rng.Next(m.Count)];
                        s = s[..x.Index] + ExtremeNumbers[rng.Next(ExtremeNumbers.Length)] + s[(x.Index + x.Length)..];
                        data = new List<byte>(Encoding.UTF8.GetBytes(s));
                    }
                    break;
                }
                case 6 when n > 0: { int cut = rng.Next(n); data.RemoveRange(cut, n - cut); break; } // truncate
                case 7: // splice with another seed
                {
                    int cut = rng.Next(data.Count + 1), from = rng.Next(b.Length + 1);
                    data = data.Take(cut).Concat(b.Skip(from).Take(2000)).ToList();
                    break;
                }
                default: // a long run of one byte (long lines, many columns)
                    data.InsertRange(rng.Next(n + 1), Enumerable.Repeat(Interesting[rng.Next(Interesting.Length)], 1 + rng.Next(4000)));
                    break;
            }
        }
        return data.ToArray();
    }

    private static List<List<byte>> Split(List<byte> data)
    {
        var lines = new List<List<byte>> { new() };
        foreach (var c in data)
        {
            lines[^1].Add(c);
            if (c == (byte)'\n') lines.Add([]);
        }
        return lines;
    }

    private static List<byte> Join(List<List<byte>> lines) => lines.SelectMany(l => l).ToList();
}
