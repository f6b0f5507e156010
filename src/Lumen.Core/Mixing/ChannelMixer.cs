using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Comparison;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Mixing;

/// <summary>
/// Levels of a multi-channel fixture that hit a target chromaticity with the best value of an objective
/// (docs/methods/mixing.md). Channels add linearly: the mix is Σ levelᵢ·Sᵢ(λ), every level in [0, 1].
/// </summary>
/// <remarks>
/// The target (u′t, v′t) is hit exactly when 4X − u′t·D = 0 and 9Y − v′t·D = 0 (D = X + 15Y + 3Z), two equations linear
/// in the levels, because X, Y, Z are. With three channels that fixes the ratios: the null vector of the 2 × 3 system,
/// scaled so the largest level is 1 (or the total is the cap). With more, the directions that hit the target form a
/// polytope whose vertices are the exact three-channel solutions; Lumen optimises over convex combinations of those
/// vertices by projected gradient ascent on the simplex of weights (finite-difference gradients, backtracking step),
/// started from the barycentre and the best vertices, stopping when a step improves the objective by less than 1e-4
/// or after 60 steps. Outside the gamut (the convex hull of the channels in u′v′), the reachable mix nearest to the
/// target is returned: the nearest point of the hull, made from the two channels of its edge.
/// </remarks>
public static class ChannelMixer
{
    /// <summary>Default chromaticity tolerance, Δu′v′.</summary>
    public const double DefaultTolerance = 0.0005;

    private const int MaxSteps = 60;
    private const double StopImprovement = 1e-4;

    /// <summary>The spectrum of a mix: Σ levelᵢ·channelᵢ on the first channel's grid (the others interpolated onto it),
    /// as <see cref="Solve"/> assumes (channels add linearly).</summary>
    /// <param name="channels">The channel spectra (same unit).</param>
    /// <param name="levels">One level per channel.</param>
    /// <param name="name">The mix's name.</param>
    /// <returns>The mixed spectrum.</returns>
    public static Spectrum MixedSpectrum(IReadOnlyList<Spectrum> channels, IReadOnlyList<double> levels, string name = "mix")
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(levels);
        if (channels.Count == 0 || channels.Count != levels.Count) throw new ArgumentException("One level per channel is needed.", nameof(levels));
        var grid = channels[0].WavelengthsNm.ToArray();
        var v = new double[grid.Length];
        for (int c = 0; c < channels.Count; c++)
            if (levels[c] != 0) for (int i = 0; i < v.Length; i++) v[i] += levels[c] * channels[c].ValueAt(grid[i]);
        return new Spectrum(grid, v, channels[0].Unit, name, SpectrumOrigin.Generated("channel mix"));
    }

    /// <summary>Finds the levels for a target.</summary>
    /// <param name="channels">Channel spectra (same unit; any grids — each is sampled on the first channel's grid).</param>
    /// <param name="target">The target chromaticity (CIE 1931 2°).</param>
    /// <param name="objective">What to optimise when more than one mix hits the target.</param>
    /// <param name="tolerance">Largest Δu′v′ that counts as hitting the target (positive).</param>
    /// <param name="maxTotal">Cap on the sum of the levels, or null for none (each level is at most 1 either way).</param>
    /// <param name="match">The spectrum to match (for the SSI objective and metric), or null.</param>
    /// <returns>The result.</returns>
    /// <exception cref="ArgumentException">Fewer than two channels.</exception>
    public static MixResult Solve(IReadOnlyList<Spectrum> channels, Chromaticity target, MixObjective objective = MixObjective.MaximizeRf,
        double tolerance = DefaultTolerance, double? maxTotal = null, Spectrum? match = null)
    {
        ArgumentNullException.ThrowIfNull(channels);
        if (channels.Count < 2) throw new ArgumentException("Mixing needs at least two channels.", nameof(channels));
        var grid = channels[0].WavelengthsNm.ToArray();
        var values = channels.Select(c => grid.Select(c.ValueAt).ToArray()).ToArray();
        var xyz = values.Select(v => Colorimeter.RawSums(Resampler.ForCieSums(new Spectrum(grid, v, channels[0].Unit, "c", SpectrumOrigin.Generated("mix"))), Observer.Cie1931TwoDegree)).ToArray();
        var names = channels.Select(c => c.Name).ToArray();
        var warnings = new List<string> { "Channels are assumed to add linearly (mix = Σ level·channel); real fixtures deviate when drivers, dimming curves or temperature change the channel spectra." };
        if (objective == MixObjective.MaximizeSsi && match is null) throw new ArgumentException("The SSI objective needs a spectrum to match.", nameof(match));

        // A channel without visible power cannot move the chromaticity: it stays at 0 and is named in a warning.
        var dark = Enumerable.Range(0, xyz.Length).Where(i => !(xyz[i].Y > 0) || !double.IsFinite(xyz[i].X + xyz[i].Y + xyz[i].Z)).ToHashSet();
        foreach (var i in dark) warnings.Add($"Channel '{names[i]}' has no visible power; it is left at 0.");
        if (dark.Count > xyz.Length - 1) throw new ArgumentException("Mixing needs at least one channel with visible power.", nameof(channels));
        var usable = xyz.Select((t, i) => dark.Contains(i) ? new Tristimulus(0, 0, 0) : t).ToArray();
        var context = new Context(grid, values, xyz, channels[0].Unit, match, maxTotal);
        var vertices = Vertices(usable, target).Where(v => dark.All(i => v[i] == 0)).ToList();
        if (vertices.Count == 0)
        {
            var (levels, residual) = Nearest(usable, target);
            var near = context.Finish(context.Scale(levels), target);
            warnings.Add($"The target is outside the channels' gamut: the nearest reachable mix misses it by Δu′v′ {residual:0.0000}.");
            return near with { Channels = names, Reachable = residual <= tolerance, Objective = objective, ObjectiveValue = context.Objective(levels, objective), Method = "outside the gamut: nearest point of the channels' hull in u′v′ (two channels)", Warnings = [.. warnings, .. near.Warnings] };
        }
        double[] best;
        int evaluations = 0;
        string method;
        if (vertices.Count == 1)
        {
            best = vertices[0];
            method = channels.Count == 3 ? "exact: three channels fix the ratios (null vector of the chromaticity equations)" : "exact: only one mix hits the target";
        }
        else
        {
            (best, evaluations) = Optimise(vertices, w => context.Objective(Combine(vertices, w), objective));
            method = $"optimised over the {vertices.Count} exact three-channel mixes: projected gradient on the simplex of their weights, multi-start (barycentre and best vertices), stop below 1e-4 improvement or {MaxSteps} steps";
        }
        var scaled = context.Scale(best);
        var result = context.Finish(scaled, target);
        return result with { Channels = names, Reachable = true, Objective = objective, ObjectiveValue = context.Objective(scaled, objective), Method = method, Iterations = evaluations, Warnings = [.. warnings, .. result.Warnings] };
    }

    /// <summary>Exact mixes of three channels (direction, levels summing to 1) that hit the target, without duplicates.</summary>
    internal static List<double[]> Vertices(IReadOnlyList<Tristimulus> xyz, Chromaticity target)
    {
        int n = xyz.Count;
        double ut = target.UPrime, vt = target.VPrime;
        // Rows of the two linear equations, one coefficient per channel.
        var a = xyz.Select(t => 4 * t.X - ut * (t.X + 15 * t.Y + 3 * t.Z)).ToArray();
        var b = xyz.Select(t => 9 * t.Y - vt * (t.X + 15 * t.Y + 3 * t.Z)).ToArray();
        var result = new List<double[]>();
        void Add(double[] l)
        {
            double sum = l.Sum();
            if (!(sum > 0)) return;
            for (int i = 0; i < n; i++) l[i] = Math.Max(0, l[i] / sum);
            if (result.Any(r => r.Zip(l, (p, q) => Math.Abs(p - q)).Max() < 1e-9)) return;
            result.Add(l);
        }
        for (int i = 0; i < n; i++)
        {
            if (!(xyz[i].Y > 0)) continue; // a dark channel is never part of a solution
            // A single channel at the target (both rows vanish).
            double scale = Math.Abs(xyz[i].Y) + 1e-300;
            if (Math.Abs(a[i]) < 1e-9 * scale && Math.Abs(b[i]) < 1e-9 * scale) { var l = new double[n]; l[i] = 1; Add(l); }
            for (int j = i + 1; j < n; j++)
                for (int k = j + 1; k < n; k++)
                {
                    // Null vector of [[a_i a_j a_k], [b_i b_j b_k]]: the cross product.
                    double ci = a[j] * b[k] - a[k] * b[j], cj = a[k] * b[i] - a[i] * b[k], ck = a[i] * b[j] - a[j] * b[i];
                    double m = Math.Max(Math.Abs(ci), Math.Max(Math.Abs(cj), Math.Abs(ck)));
                    if (!(m > 0)) continue;
                    double tol = 1e-12 * m;
                    if (ci < -tol || cj < -tol || ck < -tol)
                    {
                        if (ci > tol || cj > tol || ck > tol) continue; // mixed signs: this triple cannot reach the target
                        ci = -ci; cj = -cj; ck = -ck;
                    }
                    var l = new double[n];
                    l[i] = Math.Max(0, ci); l[j] = Math.Max(0, cj); l[k] = Math.Max(0, ck);
                    Add(l);
                }
        }
        return result;
    }

    /// <summary>The reachable mix nearest to an out-of-gamut target: the nearest point of the hull of the channels in u′v′.</summary>
    internal static (double[] Levels, double Residual) Nearest(IReadOnlyList<Tristimulus> xyz, Chromaticity target)
    {
        int n = xyz.Count;
        var p = xyz.Select(t => Chromaticity.FromXyz(t)).ToArray();
        var d = xyz.Select(t => t.X + 15 * t.Y + 3 * t.Z).ToArray();
        double best = double.PositiveInfinity;
        double[] levels = new double[n];
        for (int i = 0; i < n; i++)
            for (int j = i; j < n; j++)
            {
                if (!(d[i] > 0) || !(d[j] > 0)) continue;
                // Nearest point of segment p_i–p_j to the target, in u′v′.
                double ax = p[i].UPrime, ay = p[i].VPrime, bx = p[j].UPrime, by = p[j].VPrime;
                double ex = bx - ax, ey = by - ay, len2 = ex * ex + ey * ey;
                double s = len2 > 0 ? Math.Clamp(((target.UPrime - ax) * ex + (target.VPrime - ay) * ey) / len2, 0, 1) : 0;
                double qx = ax + s * ex, qy = ay + s * ey;
                double dist = Math.Sqrt((qx - target.UPrime) * (qx - target.UPrime) + (qy - target.VPrime) * (qy - target.VPrime));
                if (dist >= best) continue;
                best = dist;
                levels = new double[n];
                // u′v′ of a two-channel mix is the D-weighted mean of the channel points: weight of j is s, of i is 1 − s.
                double li = (1 - s) / d[i], lj = s / d[j];
                levels[i] += li; levels[j] += lj;
                double sum = levels.Sum();
                for (int k = 0; k < n; k++) levels[k] /= sum;
            }
        return (levels, best);
    }

    private static double[] Combine(List<double[]> vertices, double[] w)
    {
        var l = new double[vertices[0].Length];
        for (int v = 0; v < vertices.Count; v++)
            for (int k = 0; k < l.Length; k++) l[k] += w[v] * vertices[v][k];
        return l;
    }

    private static (double[] Levels, int Evaluations) Optimise(List<double[]> vertices, Func<double[], double> objective)
    {
        int m = vertices.Count, evals = 0;
        double F(double[] w) { evals++; double f = objective(w); return double.IsFinite(f) ? f : double.NegativeInfinity; }
        var starts = new List<double[]> { Enumerable.Repeat(1.0 / m, m).ToArray() };
        var vertexScores = Enumerable.Range(0, m).Select(v => { var w = new double[m]; w[v] = 1; return (w, f: F(w)); }).OrderByDescending(t => t.f).ToList();
        starts.AddRange(vertexScores.Take(2).Select(t => Mix(t.w, starts[0], 0.85)));
        double[] bestW = vertexScores[0].w;
        double bestF = vertexScores[0].f;
        foreach (var start in starts)
        {
            var w = start;
            double f = F(w), step = 0.2;
            for (int it = 0; it < MaxSteps && step > 1e-4; it++)
            {
                var g = new double[m];
                const double h = 1e-3;
                for (int k = 0; k < m; k++)
                {
                    var wp = (double[])w.Clone();
                    wp[k] += h;
                    g[k] = (F(ProjectToSimplex(wp)) - f) / h;
                }
                double gn = Math.Sqrt(g.Sum(x => x * x));
                if (!(gn > 0)) break;
                bool improved = false;
                while (step > 1e-4)
                {
                    var trial = ProjectToSimplex(w.Select((x, k) => x + step * g[k] / gn).ToArray());
                    double ft = F(trial);
                    if (ft > f)
                    {
                        improved = ft - f >= StopImprovement;
                        w = trial; f = ft;
                        step *= 1.5;
                        break;
                    }
                    step *= 0.5;
                }
                if (!improved) break;
            }
            if (f > bestF) { bestF = f; bestW = w; }
        }
        return (Combine(vertices, bestW), evals);
    }

    private static double[] Mix(double[] a, double[] b, double t) => a.Select((x, i) => t * x + (1 - t) * b[i]).ToArray();

    /// <summary>Euclidean projection onto the probability simplex (sort-based algorithm).</summary>
    internal static double[] ProjectToSimplex(double[] v)
    {
        var u = v.OrderByDescending(x => x).ToArray();
        double cumulative = 0, theta = 0;
        for (int i = 0; i < u.Length; i++)
        {
            cumulative += u[i];
            double t = (cumulative - 1) / (i + 1);
            if (u[i] - t > 0) theta = t;
        }
        return v.Select(x => Math.Max(0, x - theta)).ToArray();
    }

    private sealed class Context(double[] grid, double[][] values, Tristimulus[] xyz, SpectralUnit unit, Spectrum? match, double? maxTotal)
    {
        private readonly double _totalY = xyz.Sum(t => t.Y);

        /// <summary>The levels scaled up as far as the limits allow: largest level 1, total at most the cap.</summary>
        public double[] Scale(double[] direction)
        {
            double max = direction.Max(), sum = direction.Sum();
            if (!(max > 0)) return direction;
            double k = 1 / max;
            if (maxTotal is { } cap && sum * k > cap) k = cap / sum;
            return direction.Select(x => x * k).ToArray();
        }

        public Spectrum Spectrum(double[] levels)
        {
            var v = new double[grid.Length];
            for (int c = 0; c < levels.Length; c++)
                if (levels[c] != 0) for (int i = 0; i < v.Length; i++) v[i] += levels[c] * values[c][i];
            return new Spectrum(grid, v, unit, "mix", SpectrumOrigin.Generated("channel mix"));
        }

        public double Objective(double[] levels, MixObjective objective)
        {
            if (objective == MixObjective.MaximizeOutput)
            {
                var s = Scale(levels);
                return s.Select((l, i) => l * xyz[i].Y).Sum() / _totalY;
            }
            var spectrum = Spectrum(levels);
            var samples = Resampler.ForCieSums(spectrum);
            var cct = CctSolver.Solve(Chromaticity.FromXyz(Colorimeter.RawSums(samples, Observer.Cie1931TwoDegree))).CctKelvin;
            bool rendition = double.IsFinite(cct) && cct >= Assessor.RenditionMinCctKelvin && cct <= Assessor.RenditionMaxCctKelvin;
            return objective switch
            {
                MixObjective.MaximizeRf => rendition ? Rendition.FidelityIndex.Compute(samples, cct).Rf : double.NaN,
                MixObjective.MaximizeRa => rendition ? Rendition.ColorRenderingIndex.Compute(samples, cct).Ra : double.NaN,
                MixObjective.MaximizeR9 => rendition ? Rendition.ColorRenderingIndex.Compute(samples, cct).R9 : double.NaN,
                MixObjective.MaximizeSsi => SpectralSimilarityIndex.Compute(spectrum, match!).Unrounded,
                MixObjective.MaximizeMelanopicDer => Photometry.AlphaOpic.Compute(samples, SpectralUnit.Relative)[0].Der,
                _ => -Photometry.AlphaOpic.Compute(samples, SpectralUnit.Relative)[0].Der,
            };
        }

        public MixResult Finish(double[] levels, Chromaticity target)
        {
            var spectrum = Spectrum(levels);
            var a = Assessor.Assess(spectrum, new AssessmentOptions(Metrics: MetricGroups.Cri | MetricGroups.Fidelity | MetricGroups.Photometry | MetricGroups.NonVisual));
            double output = levels.Select((l, i) => l * xyz[i].Y).Sum() / _totalY;
            var metrics = new MixMetrics(a.Cri?.Ra ?? double.NaN, a.Cri?.R9 ?? double.NaN, a.Fidelity?.Rf ?? double.NaN, a.Fidelity?.Rg ?? double.NaN,
                a.Photometry?.LerLumensPerWatt ?? double.NaN, output, a.NonVisual?[0].Der ?? double.NaN, match is null ? null : SpectralSimilarityIndex.Compute(spectrum, match).Value);
            return new MixResult([], levels, target, a.Chromaticity2Degree, a.Cct, a.Chromaticity2Degree.DeltaUPrimeVPrime(target), true, MixObjective.MaximizeRf, double.NaN, metrics, "", 0, a.Warnings);
        }
    }
}
