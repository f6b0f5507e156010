using Lumen.Analysis;
using Lumen.Colorimetry;
using Lumen.Cie;
using Lumen.Conformance;
using Lumen.Spectra;
using Lumen.Synthetic;
using Lumen.Uncertainty;

namespace Lumen.Core.Tests;

/// <summary>Measurement uncertainty by Monte Carlo (JCGM 101:2008) and the law of propagation (JCGM 100:2008) (issue 14).</summary>
public class UncertaintyTests
{
    private static readonly AssessmentOptions Colorimetry = new(Metrics: MetricGroups.Colorimetry);

    /// <summary>A smooth warm-white phosphor LED at 5 nm (invented test spectrum, not a measurement).</summary>
    private static Spectrum Led(SpectralUnit unit = SpectralUnit.Relative)
    {
        var s = SyntheticSpectra.PhosphorLed(new PhosphorLedModel(451, 20, 0.92, 552, 110, 625, 85, 1.38), SyntheticSpectra.Grid(380, 780, 5), "led");
        return unit == SpectralUnit.Relative ? s : s.WithUnit(unit);
    }

    private static UncertaintyResult Run(Spectrum s, UncertaintyModel model, int draws, ulong seed = 7, int threads = 4, AssessmentOptions? options = null, PreparedSpec? spec = null)
    {
        options ??= Colorimetry;
        var a = Assessor.Assess(s, options);
        return MonteCarlo.Run(s, a, options, model, new MonteCarloOptions(draws, seed, Threads: threads), spec);
    }

    [Fact]
    public void Coverage_interval_is_the_probabilistically_symmetric_one_of_jcgm_101()
    {
        // JCGM 101:2008 §7.7.2: M = 100, p = 0.95 → q = 95, M − q = 5 is odd → r = 3: [y(3), y(98)].
        var y = Enumerable.Range(1, 100).Select(i => (double)i).ToArray();
        Assert.Equal((3.0, 98.0), CoverageInterval.ProbabilisticallySymmetric(y, 0.95));
        // M = 10 000 → q = 9500, r = 250: [y(250), y(9750)].
        var z = Enumerable.Range(1, 10_000).Select(i => (double)i).ToArray();
        Assert.Equal((250.0, 9750.0), CoverageInterval.ProbabilisticallySymmetric(z, 0.95));
    }

    [Fact]
    public void Independent_relative_noise_gives_the_closed_form_uncertainty_of_x()
    {
        // u(x)² = Σ (∂x/∂Sᵢ)² (u_r Sᵢ)² with ∂x/∂Sᵢ from x = X/(X+Y+Z) — here by central differences of the CIE 15
        // summation itself, independent of Lumen's propagation code.
        var s = Led();
        const double ur = 0.02;
        var wl = s.WavelengthsNm.ToArray();
        var v = s.Values.ToArray();
        double sum = 0;
        for (int i = 0; i < v.Length; i++)
        {
            double h = 1e-6 * Math.Max(1e-9, Math.Abs(v[i]));
            double X(double d) { var w = (double[])v.Clone(); w[i] += d; return Colorimeter.Relative(new Spectrum(wl, w, s.Unit, "d", s.Origin), Observer.Cie1931TwoDegree).Chromaticity.SmallX; }
            double g = (X(h) - X(-h)) / (2 * h);
            sum += g * g * (ur * v[i]) * (ur * v[i]);
        }
        double expected = Math.Sqrt(sum);
        var r = Run(s, new UncertaintyModel(RelativeNoise: ur), 20_000);
        var ux = r.Fields["chromaticity.x"];
        // Monte Carlo tolerance: the SD of M = 20 000 draws has a relative standard error 1/√(2(M−1)) ≈ 0.5 %; allow 3 %.
        Assert.InRange(ux.Standard / expected, 0.97, 1.03);
        Assert.InRange(ux.Linear!.Value / expected, 0.999, 1.001);
    }

    [Fact]
    public void Law_of_propagation_agrees_with_monte_carlo_in_the_linear_regime()
    {
        // Small errors of every kind on a smooth spectrum: u(x), u(y), u(CCT), u(Duv) agree within 5 % (JCGM 101:2008 §9
        // shows such agreement when the model is close to linear).
        var model = new UncertaintyModel(RelativeNoise: 0.005, AbsoluteNoise: 1e-4, RelativeScale: 0.02, SmoothRelative: 0.01, CorrelationLengthNm: 60, WavelengthShiftNm: 0.1);
        var r = Run(Led(), model, 8000);
        foreach (var f in new[] { "chromaticity.x", "chromaticity.y", "chromaticity.uPrime", "chromaticity.vPrime", "cct.kelvin", "cct.duv" })
        {
            var u = r.Fields[f];
            Assert.True(u.Linear is not null, f);
            Assert.InRange(u.Standard / u.Linear!.Value, 0.95, 1.05);
        }
        Assert.Empty(r.Warnings);
    }

    [Fact]
    public void A_pure_scale_error_leaves_relative_results_unchanged_and_scales_absolute_ones()
    {
        var s = Led(SpectralUnit.IrradianceWattsPerSquareMetreNm);
        var r = Run(s, new UncertaintyModel(RelativeScale: 0.03), 4000, options: AssessmentOptions.Default);
        foreach (var f in new[] { "chromaticity.x", "cct.kelvin", "cct.duv", "cri.ra", "fidelity.rf" })
            Assert.True(r.Fields[f].Standard <= 1e-9 * Math.Max(1, Math.Abs(r.Fields[f].Mean)), $"{f}: {r.Fields[f].Standard}");
        var y = r.Fields["tristimulusAbsolute.Y"];
        Assert.InRange(y.Standard / y.Mean, 0.03 * 0.95, 0.03 * 1.05); // 3 % of the value, within Monte Carlo error
    }

    [Fact]
    public void Same_seed_same_result_on_any_thread_count_and_another_seed_differs()
    {
        var model = new UncertaintyModel(RelativeNoise: 0.01, WavelengthShiftNm: 0.2);
        var a = Run(Led(), model, 500, seed: 11, threads: 1);
        var b = Run(Led(), model, 500, seed: 11, threads: 8);
        var c = Run(Led(), model, 500, seed: 12, threads: 8);
        foreach (var (f, u) in a.Fields) Assert.Equal(u, b.Fields[f]);
        Assert.NotEqual(a.Fields["cct.kelvin"].Standard, c.Fields["cct.kelvin"].Standard);
    }

    [Fact]
    public void Intervals_of_cct_and_duv_cover_the_true_value_at_the_stated_rate()
    {
        // 2000 simulated measurements of a known spectrum with 1 % independent noise and a 1 % smooth responsivity error;
        // each measurement's 95 % Monte Carlo interval (400 draws) should contain the true CCT and Duv in
        // 95 % ± 1.5 % of the measurements (the band the issue sets; binomial SE at n = 2000 is 0.5 %).
        var truth = Led();
        var model = new UncertaintyModel(RelativeNoise: 0.01, SmoothRelative: 0.01, CorrelationLengthNm: 60);
        var trueA = Assessor.Assess(truth, Colorimetry);
        var maker = new SpectrumPerturbation(truth, model);
        int n = 2000, coverT = 0, coverD = 0;
        for (int k = 0; k < n; k++)
        {
            var rng = new RandomStream(999, (ulong)k);
            var measured = maker.Draw(ref rng);
            var r = Run(measured, model, 400, seed: (ulong)(k + 1), threads: 8);
            var t = r.Fields["cct.kelvin"];
            var d = r.Fields["cct.duv"];
            if (t.Low <= trueA.Cct.CctKelvin && trueA.Cct.CctKelvin <= t.High) coverT++;
            if (d.Low <= trueA.Cct.Duv && trueA.Cct.Duv <= d.High) coverD++;
        }
        Assert.InRange(coverT / (double)n, 0.935, 0.965);
        Assert.InRange(coverD / (double)n, 0.935, 0.965);
    }

    [Fact]
    public void Adaptive_runs_blocks_until_the_second_digit_is_stable()
    {
        var s = Led();
        var a = Assessor.Assess(s, Colorimetry);
        var r = MonteCarlo.Run(s, a, Colorimetry, new UncertaintyModel(RelativeNoise: 0.01), new MonteCarloOptions(2000, 3, Adaptive: true, Threads: 8, MaxBlocks: 40));
        Assert.True(r.Adaptive);
        Assert.True(r.Draws >= 4000 && r.Draws % 2000 == 0);
    }

    [Theory]
    [InlineData(0.0, 0.5, "Inconclusive")]   // exactly at the limit
    [InlineData(-0.6, 0.5, "Fail")]          // beyond the limit by more than U
    [InlineData(0.6, 0.5, "Pass")]           // inside by more than U
    [InlineData(0.3, 0.5, "Inconclusive")]   // inside, but within U of the limit
    [InlineData(-0.3, 0.5, "Inconclusive")]  // outside, but within U of the limit
    public void Guarded_acceptance_passes_fails_or_calls_it_inconclusive(double margin, double expanded, string expected)
    {
        Assert.Equal(expected, Decisions.Of(margin, margin >= 0, expanded, DecisionRule.Guarded).ToString());
        Assert.Equal(margin >= 0 ? Decision.Pass : Decision.Fail, Decisions.Of(margin, margin >= 0, expanded, DecisionRule.Simple));
    }

    [Fact]
    public void Criteria_get_the_uncertainty_of_their_measured_value()
    {
        var s = Led();
        var a = Assessor.Assess(s, Colorimetry);
        var spec = new PreparedSpec(new ToleranceSpec("s", new ChromaticityTarget(TargetKind.Xy, a.Chromaticity.SmallX, a.Chromaticity.SmallY), new ChromaticityTolerance(ToleranceKind.EllipseSteps, 3), [new FieldLimit("cct.duv", -0.006, 0.006, 1)]));
        var r = Run(s, new UncertaintyModel(RelativeNoise: 0.01), 1000, spec: spec);
        Assert.Equal(2, r.Criteria.Count);
        Assert.True(r.Criteria[0]!.Standard > 0); // steps from the target
        Assert.Equal(r.Fields["cct.duv"].Standard, r.Criteria[1]!.Standard, 12);
    }
}
