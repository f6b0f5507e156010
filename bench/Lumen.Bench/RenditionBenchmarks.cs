using BenchmarkDotNet.Attributes;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Bench;

/// <summary>
/// Full rendition set (Ra + R1–R14 + Rf + Rg + hue bins) on 1 nm 380–780 nm spectra in memory, single thread
/// (issue 16 target ≥ 40,000 spectra/s/core). One operation = <see cref="BatchSize"/> spectra, CCT included.
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

    /// <summary>The same set computed as the batch does: blocks of 16 spectra through the blocked kernel (issue 16).</summary>
    [Benchmark(Description = "CCT+Ra+R1-R14+Rf+Rg, 100 spectra, blocks of 16")]
    public double AllRenditionBlocked()
    {
        double acc = 0;
        for (int from = 0; from < _samples.Length; from += 16)
        {
            var block = _samples[from..Math.Min(_samples.Length, from + 16)];
            var ccts = new double[block.Length];
            for (int i = 0; i < block.Length; i++) ccts[i] = CctSolver.Solve(Chromaticity.FromXyz(Colorimeter.RawSums(block[i], Observer.Cie1931TwoDegree))).CctKelvin;
            var cri = ColorRenderingIndex.ComputeMany(block, ccts);
            var fidelity = FidelityIndex.ComputeMany(block, ccts);
            for (int i = 0; i < block.Length; i++) acc += cri[i].Ra + fidelity[i].Rg;
        }
        return acc;
    }

    /// <summary>
    /// Ra + R1–R14 + Rf + Rg in blocks of 16 with every reference at one temperature, to show what each reference range
    /// costs (issue 16): 3000 K is Planckian (appearance interpolated), 4500 K the CIE 224 blend (appearance computed per
    /// spectrum), 6500 K CIE daylight (appearance kept per M1, M2 pair). The spectra are the same LEDs; only the
    /// reference is forced.
    /// </summary>
    [Benchmark(Description = "Ra+R1-R14+Rf+Rg, 100 spectra, blocks of 16, references at 3000 K")]
    public double BlockedAt3000() => BlockedAt(3000);

    [Benchmark(Description = "Ra+R1-R14+Rf+Rg, 100 spectra, blocks of 16, references at 4500 K")]
    public double BlockedAt4500() => BlockedAt(4500);

    [Benchmark(Description = "Ra+R1-R14+Rf+Rg, 100 spectra, blocks of 16, references at 6500 K")]
    public double BlockedAt6500() => BlockedAt(6500);

    private double BlockedAt(double cct)
    {
        double acc = 0;
        var ccts = Enumerable.Repeat(cct, 16).ToArray();
        for (int from = 0; from < _samples.Length; from += 16)
        {
            var block = _samples[from..Math.Min(_samples.Length, from + 16)];
            var k = ccts[..block.Length];
            var cri = ColorRenderingIndex.ComputeMany(block, k);
            var fidelity = FidelityIndex.ComputeMany(block, k);
            for (int i = 0; i < block.Length; i++) acc += cri[i].Ra + fidelity[i].Rg;
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
