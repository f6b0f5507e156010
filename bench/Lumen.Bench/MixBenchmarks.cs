using BenchmarkDotNet.Attributes;
using Lumen.Analysis;
using Lumen.Formats;
using Lumen.Mixing;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Bench;

/// <summary>
/// Channel mixing on the bundled five-channel example (examples/mix), Rf as the objective, single thread (issue targets:
/// one optimised mix ≤ 50 ms, a 39-step CCT sweep ≤ 2 s). One operation = one mix, or the whole sweep.
/// </summary>
[MemoryDiagnoser]
public class MixBenchmarks
{
    private Spectrum[] _channels = [];

    [GlobalSetup]
    public void Setup()
    {
        var path = Path.Combine(ThroughputRoot.Find(), "examples", "mix", "quillfern-tw5-channels.csv");
        _channels = SpectrumFiles.Read(path).OfType<SpectrumRecord>().Select(r => r.Spectrum).ToArray();
    }

    [Benchmark(Description = "mix: 5 channels, maximize Rf, one target")]
    public double One() => ChannelMixer.Solve(_channels, CctSolver.ToChromaticity(3000, 0)).Metrics.Rf;

    [Benchmark(Description = "mix: 5 channels, 39-step CCT sweep")]
    public double Sweep()
    {
        double acc = 0;
        for (int t = 2700; t <= 6500; t += 100) acc += ChannelMixer.Solve(_channels, CctSolver.ToChromaticity(t, 0)).Metrics.Rf;
        return acc;
    }
}

/// <summary>Finds the repository root from the benchmark's folder.</summary>
internal static class ThroughputRoot
{
    public static string Find()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "Lumen.sln"))) d = d.Parent;
        return d?.FullName ?? Directory.GetCurrentDirectory();
    }
}
