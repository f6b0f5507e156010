using BenchmarkDotNet.Attributes;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;
using Lumen.Temperature;
using Lumen.Synthetic;

namespace Lumen.Bench;

/// <summary>
/// XYZ + CCT + Duv on 1 nm 380–780 nm spectra already in memory, single thread (issue target:
/// ≥ 1,000,000 spectra/s/core). One operation = <see cref="BatchSize"/> spectra.
/// </summary>
[MemoryDiagnoser]
public class ColorimetryBenchmarks
{
    public const int BatchSize = 1000;
    private RegularSamples[] _samples = [];

    [GlobalSetup]
    public void Setup()
    {
        _samples = LedSet(BatchSize);
        Run(); // warm the weight and locus caches
    }

    /// <summary>Seeded white-LED spectra, 1 nm 380–780 nm, on their CIE grid (shared by the benchmarks).</summary>
    internal static RegularSamples[] LedSet(int count)
    {
        var grid = SyntheticSpectra.Grid(380, 780, 1);
        var rng = new Random(42);
        var samples = new RegularSamples[count];
        for (int i = 0; i < count; i++)
        {
            var m = new PhosphorLedModel(445 + 10 * rng.NextDouble(), 20, 0.5 + rng.NextDouble(), 550, 110, 625, 85, 0.3 + 0.6 * rng.NextDouble());
            samples[i] = Resampler.ForCieSums(SyntheticSpectra.PhosphorLed(m, grid, "b"));
        }
        return samples;
    }

    [Benchmark(Description = "XYZ+CCT+Duv, 1000 spectra")]
    public double Run()
    {
        double acc = 0;
        foreach (var s in _samples)
        {
            var raw = Colorimeter.RawSums(s, Observer.Cie1931TwoDegree);
            var r = CctSolver.Solve(Chromaticity.FromXyz(raw));
            acc += r.CctKelvin + r.Duv;
        }
        return acc;
    }

    [Benchmark(Description = "XYZ only, 1000 spectra")]
    public double XyzOnly()
    {
        double acc = 0;
        foreach (var s in _samples) acc += Colorimeter.RawSums(s, Observer.Cie1931TwoDegree).X;
        return acc;
    }
}
