using Lumen.Analysis;
using Lumen.Colorimetry;

namespace Lumen.Conformance;

/// <summary>A specification with its geometry computed once (thread-safe to share).</summary>
public sealed class PreparedSpec
{
    private readonly Chromaticity _centre;
    private readonly StepEllipse? _ellipse;
    private readonly Quadrangle? _quadrangle;
    private readonly string _toleranceCriterion = "", _toleranceLimit = "";

    /// <summary>Prepares a specification: computes the target's centre, 1-step ellipse and quadrangle once.</summary>
    /// <param name="spec">The specification.</param>
    /// <exception cref="ArgumentNullException"><paramref name="spec"/> is null.</exception>
    public PreparedSpec(ToleranceSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        Spec = spec;
        if (spec.Target is { } t)
        {
            _centre = t.Centre;
            _ellipse = EllipseFor(t);
            _quadrangle = spec.Tolerance.Kind == ToleranceKind.Quadrangle ? t.Category!.Quadrangle : null;
            // The tolerance criterion's name and limit are the same for every unit: worded once here (issue 16: formatting
            // them per unit was about 1 % of a chromaticity-only batch's CPU).
            (_toleranceCriterion, _toleranceLimit) = spec.Tolerance.Kind switch
            {
                ToleranceKind.Quadrangle => ($"chromaticity: ANSI C78.377 {t.First:0} K quadrangle", "inside (distance to nearest edge, xy)"),
                ToleranceKind.EllipseSteps => ($"chromaticity: {spec.Tolerance.Value:0.#}-step ellipse", $"<= {spec.Tolerance.Value:0.#} steps"),
                ToleranceKind.UPrimeVPrimeRadius => ($"chromaticity: Δu'v' circle r = {spec.Tolerance.Value:0.####}", $"<= {spec.Tolerance.Value:0.####}"),
                _ => ("", ""),
            };
        }
    }

    /// <summary>The specification.</summary>
    public ToleranceSpec Spec { get; }

    /// <summary>The 1-step ellipse about the target (null without a target).</summary>
    public StepEllipse? Ellipse => _ellipse;

    /// <summary>The target's centre chromaticity (CIE 1931 2°), or null without a target.</summary>
    public Chromaticity? Centre => Spec.Target is null ? null : _centre;

    /// <summary>The quadrangle of a quadrangle tolerance, or null.</summary>
    public Quadrangle? Quadrangle => _quadrangle;

    /// <summary>
    /// Cautions that every verdict output must carry for this target: the step-ellipse shapes rest on recalled values,
    /// and a flexible-CCT quadrangle's tolerance is interpolated (docs/methods/conformance.md §1, §2.2).
    /// </summary>
    public IReadOnlyList<string> Cautions
    {
        get
        {
            var c = new List<string>();
            if (_ellipse is { } e && e.Source.Contains("from memory", StringComparison.Ordinal))
                c.Add("The step-ellipse shape rests on recalled values (ANSI C78.376 / IEC 60081 style, from memory): verify against the standard before claiming conformance.");
            if (_quadrangle is not null && Spec.Target?.Category?.Flexible == true)
                c.Add("Flexible-CCT quadrangle: its CCT tolerance is interpolated between the neighbouring categories, not taken from the standard.");
            return c;
        }
    }

    /// <summary>
    /// The target as the verdicts use it, in words: centre (xy, u′v′, CCT and Duv), the step ellipse (a, b, θ, source),
    /// and the quadrangle corners or the circle radius of the tolerance; null without a target.
    /// </summary>
    public string? TargetDescription
    {
        get
        {
            if (Spec.Target is null) return null;
            var c = _centre;
            var cct = Temperature.CctSolver.Solve(c);
            var sb = new System.Text.StringBuilder(System.FormattableString.Invariant(
                $"centre x {c.SmallX:0.00000}, y {c.SmallY:0.00000} (u′ {c.UPrime:0.00000}, v′ {c.VPrime:0.00000}; CCT {cct.CctKelvin:0} K, Duv {cct.Duv:+0.0000;-0.0000;0.0000})"));
            if (_ellipse is { } e)
                sb.Append(System.FormattableString.Invariant($"; 1-step ellipse a {e.A:0.00000}, b {e.B:0.00000}, θ {e.ThetaDegrees:0.00}° ({e.Source})"));
            if (_quadrangle is { } q)
                sb.Append("; quadrangle corners ").Append(string.Join(" ", q.Corners.Select(p => System.FormattableString.Invariant($"({p.SmallX:0.0000}, {p.SmallY:0.0000})"))));
            if (Spec.Tolerance.Kind == ToleranceKind.UPrimeVPrimeRadius)
                sb.Append(System.FormattableString.Invariant($"; Δu′v′ circle radius {Spec.Tolerance.Value:0.0000}"));
            return sb.ToString();
        }
    }

    /// <summary>
    /// The result groups the verdicts of this specification need: colorimetry always, and every group a limit names —
    /// nothing more, so a spec that limits only chromaticity costs only colorimetry. (A batch adds groups for its
    /// summary only when asked: <c>--metrics</c>.)
    /// </summary>
    public MetricGroups RequiredMetrics
    {
        get
        {
            var m = MetricGroups.Colorimetry;
            foreach (var l in Spec.Limits) m |= ResultFields.GroupOf(l.Field);
            return m;
        }
    }

    /// <summary>The 1-step ellipse used for a target: the standard shape of its category, or the nearest standard shape.</summary>
    /// <param name="target">The chromaticity target (nominal CCT, xy, u′v′ or CCT + Duv).</param>
    /// <returns>The ellipse centred on the target.</returns>
    public static StepEllipse EllipseFor(ChromaticityTarget target)
    {
        ArgumentNullException.ThrowIfNull(target);
        var c = target.Centre;
        if (target.Kind == TargetKind.NominalCct && StandardEllipses.ByNominalCct.TryGetValue((int)target.First, out var std))
            return std.MovedTo(c) with { Source = std.Source + ", about the ANSI C78.377 centre" };
        return StandardEllipses.About(c.SmallX, c.SmallY);
    }

    /// <summary>Evaluates the specification against one assessment (its 2° chromaticity and its result fields).</summary>
    /// <param name="assessment">The assessment.</param>
    /// <returns>The verdict.</returns>
    public Verdict Evaluate(Assessment assessment)
    {
        ArgumentNullException.ThrowIfNull(assessment);
        return Evaluate(assessment.Chromaticity2Degree, p => ResultFields.Get(assessment, p));
    }

    /// <summary>Evaluates the specification against a chromaticity and any source of field values.</summary>
    /// <param name="chromaticity2Degree">The measured CIE 1931 2° chromaticity.</param>
    /// <param name="field">Resolves a field path (as in <see cref="ResultFields"/>) to its value; null when not available.</param>
    /// <returns>The verdict.</returns>
    public Verdict Evaluate(Chromaticity chromaticity2Degree, Func<string, double?> field)
    {
        ArgumentNullException.ThrowIfNull(field);
        var spec = Spec;
        var criteria = new List<CriterionResult>(spec.Limits.Count + 1);
        double? steps = null, duv = null;
        var c = chromaticity2Degree;
        if (spec.Target is { } target && c.IsDefined)
        {
            var centre = _centre;
            var ellipse = _ellipse!;
            steps = ellipse.Steps(c.SmallX, c.SmallY);
            duv = c.DeltaUPrimeVPrime(centre);
            switch (spec.Tolerance.Kind)
            {
                case ToleranceKind.Quadrangle:
                    var quad = _quadrangle!;
                    double d = quad.SignedDistance(c.SmallX, c.SmallY);
                    criteria.Add(new CriterionResult(_toleranceCriterion, d, _toleranceLimit, d, d >= -1e-12,
                        target.Category!.Flexible ? "flexible-CCT tolerance interpolated between neighbouring categories (verify against the standard)" : null));
                    break;
                case ToleranceKind.EllipseSteps:
                    criteria.Add(new CriterionResult(_toleranceCriterion, steps, _toleranceLimit, spec.Tolerance.Value - steps, steps <= spec.Tolerance.Value, ellipse.Source));
                    break;
                case ToleranceKind.UPrimeVPrimeRadius:
                    criteria.Add(new CriterionResult(_toleranceCriterion, duv, _toleranceLimit, spec.Tolerance.Value - duv, duv <= spec.Tolerance.Value, "CIE TN 001:2014 circle"));
                    break;
            }
        }
        else if (spec.Tolerance.Kind != ToleranceKind.None)
        {
            criteria.Add(new CriterionResult("chromaticity", null, "", null, false, "chromaticity undefined (no visible power)"));
        }

        foreach (var limit in spec.Limits)
        {
            double? v = field(limit.Field);
            if (v is not { } value || !double.IsFinite(value))
            {
                criteria.Add(new CriterionResult(limit.Field, null, limit.Description, null, false, "value not available for this spectrum"));
                continue;
            }
            double margin = double.PositiveInfinity;
            if (limit.Min is { } lo) margin = Math.Min(margin, value - lo);
            if (limit.Max is { } hi) margin = Math.Min(margin, hi - value);
            criteria.Add(new CriterionResult(limit.Field, value, limit.Description, margin, margin >= 0));
        }
        return new Verdict(criteria.All(x => x.Pass), criteria, steps, duv);
    }
}
