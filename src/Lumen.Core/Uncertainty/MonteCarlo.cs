using Lumen.Analysis;
using Lumen.Conformance;
using Lumen.Spectra;

namespace Lumen.Uncertainty;

/// <summary>
/// Propagates a spectrum's measurement uncertainty to every numeric result by Monte Carlo (JCGM 101:2008, GUM
/// Supplement 1; docs/methods/uncertainty.md §3): M spectra drawn from the model are assessed exactly as the measured
/// one, and each result's draws give its standard uncertainty and probabilistically symmetric 95 % interval. The law of
/// propagation (<see cref="LinearPropagation"/>) is computed beside it for XYZ, xy, u′v′, CCT and Duv, with a warning
/// where the two disagree by more than 10 %.
/// </summary>
public static class MonteCarlo
{
    /// <summary>Relative disagreement between the law of propagation and Monte Carlo that earns a warning.</summary>
    public const double LinearAgreement = 0.10;

    /// <summary>Runs the propagation for one spectrum.</summary>
    /// <param name="spectrum">The measured spectrum.</param>
    /// <param name="assessment">Its assessment (gives the fields to report: those with a value).</param>
    /// <param name="options">What to compute (as for the assessment).</param>
    /// <param name="model">The uncertainty model (valid).</param>
    /// <param name="run">Draws, seed, adaptivity, threads.</param>
    /// <param name="spec">The specification, for the uncertainty of each criterion's measured value; or null.</param>
    /// <returns>The result.</returns>
    public static UncertaintyResult Run(Spectrum spectrum, Assessment assessment, AssessmentOptions options, UncertaintyModel model, MonteCarloOptions run, PreparedSpec? spec = null)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(assessment);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(run);
        if (run.Draws < 2) throw new ArgumentOutOfRangeException(nameof(run), "At least 2 draws are needed.");
        var paths = ResultFields.Paths.Where(p => ResultFields.Get(assessment, p) is { } v && double.IsFinite(v)).Order(StringComparer.Ordinal).ToArray();
        var getters = paths.Select(ResultFields.Accessor).ToArray();
        int criteria = spec?.Evaluate(assessment).Criteria.Count ?? 0;
        var perturbation = new SpectrumPerturbation(spectrum, model);
        int columns = paths.Length + criteria + 2; // fields, criteria, 2° u′ and v′
        var blocks = new List<double[][]>();
        var po = new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, run.Threads) };
        int m = run.Draws;
        for (int h = 0; h < (run.Adaptive ? run.MaxBlocks : 1); h++)
        {
            var block = new double[columns][];
            for (int c = 0; c < columns; c++) block[c] = new double[m];
            long first = (long)h * m;
            // Draws in groups of 16, assessed together (Assessor.AssessMany: the rendition indices of a group share each pass
            // over the sample weights). Each draw's random stream depends only on (seed, draw index), and each spectrum's sums
            // are computed the same way whatever its group, so any thread count gives the same bytes.
            int groups = (m + DrawGroup - 1) / DrawGroup;
            Parallel.For(0, groups, po, g =>
            {
                int from = g * DrawGroup, to = Math.Min(m, from + DrawGroup);
                var drawn = new Spectrum?[to - from];
                for (int i = from; i < to; i++)
                {
                    var rng = new RandomStream(run.Seed, (ulong)(first + i));
                    try { drawn[i - from] = perturbation.Draw(ref rng); }
                    catch (Exception ex) when (ex is InvalidSpectrumException or ArgumentException or InvalidOperationException) { drawn[i - from] = null; }
                }
                var valid = drawn.Where(d => d is not null).Select(d => d!).ToArray();
                Assessment?[] assessed;
                try { assessed = Assessor.AssessMany(valid, options); }
                catch (Exception ex) when (ex is InvalidSpectrumException or ArgumentException or InvalidOperationException)
                {
                    assessed = valid.Select(d => AssessOrNull(d, options)).ToArray(); // one bad draw must not void its group
                }
                int next = 0;
                for (int i = from; i < to; i++)
                {
                    var a = drawn[i - from] is null ? null : assessed[next++];
                    if (a is null) { for (int c = 0; c < columns; c++) block[c][i] = double.NaN; continue; } // a draw that cannot be assessed counts as undefined
                    for (int f = 0; f < getters.Length; f++) block[f][i] = getters[f](a) ?? double.NaN;
                    if (spec is not null)
                    {
                        var v = spec.Evaluate(a);
                        for (int c = 0; c < criteria; c++) block[paths.Length + c][i] = c < v.Criteria.Count ? v.Criteria[c].Measured ?? double.NaN : double.NaN;
                    }
                    block[columns - 2][i] = a.Chromaticity2Degree.UPrime;
                    block[columns - 1][i] = a.Chromaticity2Degree.VPrime;
                }
            });
            blocks.Add(block);
            if (!run.Adaptive || (blocks.Count >= 2 && Stable(blocks, columns - 2))) break;
        }

        var linear = LinearPropagation.Of(spectrum, options, model);
        var fields = new SortedDictionary<string, FieldUncertainty>(StringComparer.Ordinal);
        var warnings = new List<string>();
        for (int f = 0; f < paths.Length; f++)
        {
            var u = Summarise(Column(blocks, f));
            if (linear.TryGetValue(paths[f], out double lin))
            {
                u = u with { Linear = lin };
                double scale = Math.Max(u.Standard, lin);
                if (scale > 1e-12 * Math.Max(1, Math.Abs(u.Mean)) && Math.Abs(u.Standard - lin) > LinearAgreement * scale)
                    warnings.Add(FormattableString.Invariant($"{paths[f]}: the law of propagation gives u = {lin:G3}, Monte Carlo {u.Standard:G3} (more than {LinearAgreement:P0} apart): the model is not linear here; use the Monte Carlo value"));
            }
            fields[paths[f]] = u;
        }
        var crit = new FieldUncertainty?[criteria];
        for (int c = 0; c < criteria; c++)
        {
            var x = Column(blocks, paths.Length + c);
            crit[c] = x.Any(double.IsFinite) ? Summarise(x) : null;
        }
        var cov = Covariance(Column(blocks, columns - 2), Column(blocks, columns - 1));
        return new UncertaintyResult(model, (long)blocks.Count * m, run.Seed, run.Adaptive, fields, crit, cov, warnings);
    }

    /// <summary>Draws assessed together (one rendition block).</summary>
    private const int DrawGroup = 16;

    private static Assessment? AssessOrNull(Spectrum draw, AssessmentOptions options)
    {
        try { return Assessor.Assess(draw, options); }
        catch (Exception ex) when (ex is InvalidSpectrumException or ArgumentException or InvalidOperationException) { return null; }
    }

    private static double[] Column(List<double[][]> blocks, int c) => blocks.SelectMany(b => b[c]).ToArray();

    /// <summary>Mean, SD and the 95 % interval of the finite draws.</summary>
    internal static FieldUncertainty Summarise(double[] draws)
    {
        var finite = draws.Where(double.IsFinite).ToArray();
        if (finite.Length < 2) return new FieldUncertainty(double.NaN, double.NaN, double.NaN, double.NaN, finite.Length);
        Array.Sort(finite);
        double mean = 0;
        foreach (var x in finite) mean += x;
        mean /= finite.Length;
        double ss = 0;
        foreach (var x in finite) ss += (x - mean) * (x - mean);
        var (lo, hi) = CoverageInterval.ProbabilisticallySymmetric(finite, FieldUncertainty.Coverage);
        return new FieldUncertainty(mean, Math.Sqrt(ss / (finite.Length - 1)), lo, hi, finite.Length);
    }

    private static (double, double, double) Covariance(double[] u, double[] v)
    {
        double mu = 0, mv = 0;
        int n = 0;
        for (int i = 0; i < u.Length; i++) if (double.IsFinite(u[i]) && double.IsFinite(v[i])) { mu += u[i]; mv += v[i]; n++; }
        if (n < 2) return (double.NaN, double.NaN, double.NaN);
        mu /= n; mv /= n;
        double uu = 0, uv = 0, vv = 0;
        for (int i = 0; i < u.Length; i++)
        {
            if (!double.IsFinite(u[i]) || !double.IsFinite(v[i])) continue;
            double du = u[i] - mu, dv = v[i] - mv;
            uu += du * du; uv += du * dv; vv += dv * dv;
        }
        return (uu / (n - 1), uv / (n - 1), vv / (n - 1));
    }

    /// <summary>
    /// The adaptive stopping rule (JCGM 101:2008 §7.9.4) over every reported field: with h blocks, the standard deviation
    /// of the block means, of the block standard uncertainties and of the block interval ends, each doubled, must not
    /// exceed the numerical tolerance δ = ½·10ˡ of the standard uncertainty expressed with two significant digits
    /// (u = c·10ˡ, c an integer of two digits). A field whose uncertainty is zero (a relative result under a pure scale
    /// error) is stable.
    /// </summary>
    internal static bool Stable(List<double[][]> blocks, int fieldColumns)
    {
        int h = blocks.Count;
        for (int f = 0; f < fieldColumns; f++)
        {
            var per = blocks.Select(b => Summarise(b[f])).ToArray();
            if (per.Any(p => !double.IsFinite(p.Standard))) continue; // undefined in a block: nothing to stabilise
            var all = Summarise(Column(blocks, f));
            double u = all.Standard;
            if (!(u > 1e-12 * Math.Max(1, Math.Abs(all.Mean)))) continue;
            int l = (int)Math.Floor(Math.Log10(u)) - 1;
            double delta = 0.5 * Math.Pow(10, l);
            double Sd(Func<FieldUncertainty, double> pick)
            {
                double mean = per.Average(pick);
                return Math.Sqrt(per.Sum(p => (pick(p) - mean) * (pick(p) - mean)) / (h * (h - 1.0)));
            }
            if (2 * Sd(p => p.Mean) > delta || 2 * Sd(p => p.Standard) > delta || 2 * Sd(p => p.Low) > delta || 2 * Sd(p => p.High) > delta) return false;
        }
        return true;
    }
}
