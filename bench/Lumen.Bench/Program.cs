using System.Globalization;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Reports;
using BenchmarkDotNet.Running;

namespace Lumen.Bench;

/// <summary>Runs the benchmarks and writes bench/results/ (BenchmarkDotNet reports plus a throughput summary).</summary>
public static class Program
{
    public static void Main(string[] args)
    {
        if (args.Length >= 1 && args[0] == "batch-scale")
        {
            // batch-scale [rows] [step nm] [--repeat N]
            int repeat = Array.IndexOf(args, "--repeat") is int r and > 0 && r + 1 < args.Length ? int.Parse(args[r + 1], CultureInfo.InvariantCulture) : 3;
            var plain = args.Skip(1).TakeWhile(a => a != "--repeat").ToArray();
            BatchScale.Run(plain.Length > 0 ? int.Parse(plain[0], CultureInfo.InvariantCulture) : 1_000_000, plain.Length > 1 ? int.Parse(plain[1], CultureInfo.InvariantCulture) : 5, Math.Max(1, repeat));
            return;
        }
        if (args.Length >= 1 && args[0] == "thread-scale")
        {
            // thread-scale [rows] [--rounds N]
            int rounds = Array.IndexOf(args, "--rounds") is int r and > 0 && r + 1 < args.Length ? int.Parse(args[r + 1], CultureInfo.InvariantCulture) : 15;
            var plain = args.Skip(1).TakeWhile(a => a != "--rounds").ToArray();
            ThreadScale.Run(plain.Length > 0 ? int.Parse(plain[0], CultureInfo.InvariantCulture) : 20_000, Math.Max(1, rounds));
            return;
        }
        if (args.Length >= 5 && args[0] == "batch-child") { BatchScale.Child(args[1], args[2], args[3], args[4]); return; }
        var results = Path.GetFullPath(Path.Combine(FindRoot(), "bench", "results"));
        var config = DefaultConfig.Instance
            .AddJob(Job.ShortRun)
            .WithArtifactsPath(Path.Combine(results, "artifacts"))
            .WithOptions(ConfigOptions.DisableOptimizationsValidator);
        var summaries = BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args, config);
        WriteThroughput(summaries, Path.Combine(results, "throughput.md"));
    }

    private static void WriteThroughput(IEnumerable<Summary> summaries, string path)
    {
        var lines = new List<string>
        {
            "# Lumen throughput (written by bench/Lumen.Bench)",
            "",
            $"Run: {DateTime.UtcNow:yyyy-MM-dd HH:mm} UTC, {Environment.ProcessorCount} logical cores; single-threaded except `lumen batch end to end`, which uses all cores.",
            "Machines are noisy: compare ratios within one run, not absolute figures across runs.",
            "",
            "| benchmark | mean per operation | spectra per operation | spectra per second (one core) |",
            "|---|---|---|---|",
        };
        foreach (var s in summaries)
        {
            foreach (var r in s.Reports)
            {
                if (r.ResultStatistics is null) continue;
                double ns = r.ResultStatistics.Mean;
                var type = r.BenchmarkCase.Descriptor.Type;
                int per = type == typeof(ColorimetryBenchmarks) ? ColorimetryBenchmarks.BatchSize
                    : type == typeof(RenditionBenchmarks) ? RenditionBenchmarks.BatchSize
                    : type == typeof(BatchBenchmarks) ? BatchBenchmarks.Rows
                    : type == typeof(UncertaintyBenchmarks) ? UncertaintyBenchmarks.Draws : 1; // compare: one pair per operation
                double rate = per / (ns * 1e-9);
                lines.Add(string.Create(CultureInfo.InvariantCulture,
                    $"| {r.BenchmarkCase.Descriptor.WorkloadMethodDisplayInfo} | {ns / 1000:0.0} µs | {per} | {rate:N0} |"));
            }
        }
        // A filtered run (--filter) keeps the rows of benchmarks it did not run, marked with the date of their own run.
        if (File.Exists(path))
        {
            var fresh = lines.Skip(7).Select(l => l.Split('|')[1].Trim()).ToHashSet(StringComparer.Ordinal);
            var old = File.ReadAllLines(path);
            var kept = new HashSet<string>(StringComparer.Ordinal);
            string oldRun = old.FirstOrDefault(l => l.StartsWith("Run: ", StringComparison.Ordinal)) is { } r0 ? r0[5..Math.Min(r0.Length, 25)].TrimEnd(',', ' ') : "an earlier run";
            foreach (var row in old.Where(l => l.StartsWith("| '", StringComparison.Ordinal) || l.StartsWith("| \"", StringComparison.Ordinal)))
            {
                var key = row.Split('|')[1].Trim();
                int from = key.IndexOf(" (from ", StringComparison.Ordinal);
                var name = from < 0 ? key : key[..from]; // a row kept from an earlier run is replaced when its benchmark ran again
                if (fresh.Contains(name) || !kept.Add(name)) continue; // one row per benchmark: the newest (listed first)
                lines.Add(from < 0 ? row.Replace($"| {key} |", $"| {key} (from {oldRun}) |", StringComparison.Ordinal) : row);
            }
        }
        File.WriteAllLines(path, lines);
        Console.WriteLine($"wrote {path}");
    }

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "Lumen.sln"))) d = d.Parent;
        return d?.FullName ?? Directory.GetCurrentDirectory();
    }
}
