using BenchmarkDotNet.Attributes;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Spectra;
using Lumen.Uncertainty;

namespace Lumen.Bench;

/// <summary>
/// Monte Carlo uncertainty of one 1 nm spectrum (CIE FL11), single thread, with every model component on
/// (issue 14 targets: 10,000 draws of XYZ+CCT+Duv ≤ 20 ms; 10,000 draws of the full metric set ≤ 1 s). One operation =
/// one spectrum's propagation of <see cref="Draws"/> draws.
/// </summary>
[MemoryDiagnoser]
public class UncertaintyBenchmarks
{
    /// <summary>Draws per operation.</summary>
    public const int Draws = 10_000;

    private Spectrum _spectrum = null!;
    private Assessment _colorimetry = null!, _full = null!;
    private static readonly AssessmentOptions Colorimetry = new(Metrics: MetricGroups.Colorimetry);
    private static readonly AssessmentOptions Rendition = new(Metrics: MetricGroups.Colorimetry | MetricGroups.Cri | MetricGroups.Fidelity);
    private static readonly UncertaintyModel Model = new(RelativeNoise: 0.003, AbsoluteNoise: 0, RelativeScale: 0.02, SmoothRelative: 0.01, CorrelationLengthNm: 60, WavelengthShiftNm: 0.2);

    [GlobalSetup]
    public void Setup()
    {
        _spectrum = CieTables.FluorescentIlluminants1Nm.ToSpectrum("FL11");
        _colorimetry = Assessor.Assess(_spectrum, Colorimetry);
        _full = Assessor.Assess(_spectrum, Rendition);
    }

    [Benchmark(Description = "uncertainty: 10,000 draws, XYZ+CCT+Duv")]
    public double ColorimetryDraws() => MonteCarlo.Run(_spectrum, _colorimetry, Colorimetry, Model, new MonteCarloOptions(Draws, 1)).Fields["cct.kelvin"].Standard;

    [Benchmark(Description = "uncertainty: 10,000 draws, CCT+Ra+R1-R14+Rf+Rg")]
    public double RenditionDraws() => MonteCarlo.Run(_spectrum, _full, Rendition, Model, new MonteCarloOptions(Draws, 1)).Fields["fidelity.rf"].Standard;
}
