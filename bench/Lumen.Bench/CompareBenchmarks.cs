using BenchmarkDotNet.Attributes;
using Lumen.Cie;
using Lumen.Comparison;
using Lumen.Spectra;

namespace Lumen.Bench;

/// <summary>
/// One source compared with a reference with every result (Δu′v′, CCT/mired/Duv, correction, object-colour shift over
/// the 99 CES and TCS13, SSI against the reference and both default references), 1 nm spectra, single thread
/// (issue target ≥ 5,000 pairs/s on one core). One operation = one pair.
/// </summary>
[MemoryDiagnoser]
public class CompareBenchmarks
{
    private Spectrum _reference = null!, _other = null!;

    [GlobalSetup]
    public void Setup()
    {
        _reference = CieTables.IlluminantD65.ToSpectrum("D65");
        _other = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL11");
        Pair();
    }

    [Benchmark(Description = "compare: one pair, all results")]
    public double Pair() => SourceComparer.Compare(_reference, _other, []).DeltaUPrimeVPrime;
}
