using BenchmarkDotNet.Attributes;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Bench;

/// <summary>
/// Full rendition set (Ra + R1–R14 + Rf + Rg + hue bins) on 1 nm 380–780 nm spectra in memory, single thread
/// (issue target ≥ 20,000 spectra/s/core). One operation = <see cref="BatchSize"/> spectra, CCT included.
/// </summary>
[MemoryDiagnoser]
public class RenditionBenchmarks
{
    public const int BatchSize = 100;
    private RegularSamples[] _samples = [];

    [GlobalSetup]
    public void Setup()
    {
        _samples = ColorimetryBenchmarks.LedSet(BatchSize);
        AllRendition();
    }

    [Benchmark(Description = "CCT+Ra+R1-R14+Rf+Rg, 100 spectra")]
    public double AllRendition()
    {
        double acc = 0;
        foreach (var s in _samples)
        {
            var cct = CctSolver.Solve(Chromaticity.FromXyz(Colorimeter.RawSums(s, Observer.Cie1931TwoDegree))).CctKelvin;
            acc += ColorRenderingIndex.Compute(s, cct).Ra + FidelityIndex.Compute(s, cct).Rg;
        }
        return acc;
    }

    [Benchmark(Description = "Ra+R1-R14 only, 100 spectra")]
    public double CriOnly()
    {
        double acc = 0;
        foreach (var s in _samples) acc += ColorRenderingIndex.Compute(s, 3000).Ra;
        return acc;
    }

    [Benchmark(Description = "Rf+Rg only, 100 spectra")]
    public double FidelityOnly()
    {
        double acc = 0;
        foreach (var s in _samples) acc += FidelityIndex.Compute(s, 3000).Rf;
        return acc;
    }
}
