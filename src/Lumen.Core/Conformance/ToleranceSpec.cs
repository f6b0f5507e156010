using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>How a chromaticity target is given.</summary>
public enum TargetKind
{
    /// <summary>An ANSI C78.377 nominal CCT category (fixed or flexible).</summary>
    NominalCct,

    /// <summary>A CIE 1931 (x, y) centre.</summary>
    Xy,

    /// <summary>A CIE 1976 (u′, v′) centre.</summary>
    UPrimeVPrime,

    /// <summary>A CCT and Duv.</summary>
    CctDuv,
}

/// <summary>A chromaticity target.</summary>
/// <param name="Kind">How it is given.</param>
/// <param name="First">Nominal CCT, x, u′ or CCT.</param>
/// <param name="Second">(unused), y, v′ or Duv.</param>
/// <param name="Edition">ANSI C78.377 edition for nominal-CCT targets.</param>
public sealed record ChromaticityTarget(TargetKind Kind, double First, double Second, AnsiEdition Edition = AnsiEdition.Ed2017)
{
    /// <summary>The ANSI category when the target is a nominal CCT.</summary>
    public AnsiCategory? Category => Kind == TargetKind.NominalCct && AnsiC78377.TryGetCategory((int)First, Edition, out var c) ? c : null;

    /// <summary>The centre chromaticity.</summary>
    public Chromaticity Centre => Kind switch
    {
        TargetKind.NominalCct => Category is { } c ? Chromaticity.FromXy(c.Centre.X, c.Centre.Y) : Chromaticity.FromXy(double.NaN, double.NaN),
        TargetKind.Xy => Chromaticity.FromXy(First, Second),
        TargetKind.UPrimeVPrime => Chromaticity.FromUPrimeVPrime(First, Second),
        _ => CctSolver.ToChromaticity(First, Second),
    };

    /// <summary>Readable description.</summary>
    public string Description => Kind switch
    {
        TargetKind.NominalCct => $"ANSI C78.377-{(Edition == AnsiEdition.Ed2008 ? "2008" : "2017")} {First:0} K{(Category?.Flexible == true ? " (flexible CCT)" : "")}",
        TargetKind.Xy => $"x {First:0.0000}, y {Second:0.0000}",
        TargetKind.UPrimeVPrime => $"u' {First:0.0000}, v' {Second:0.0000}",
        _ => $"{First:0} K, Duv {Second:+0.0000;-0.0000;0}",
    };
}

/// <summary>Kinds of chromaticity tolerance.</summary>
public enum ToleranceKind
{
    /// <summary>No chromaticity criterion.</summary>
    None,

    /// <summary>Inside the ANSI C78.377 quadrangle of the nominal category.</summary>
    Quadrangle,

    /// <summary>Within n steps of the target (standard lamp-colour ellipse metric).</summary>
    EllipseSteps,

    /// <summary>Within a Δu′v′ radius of the target (CIE TN 001 circle).</summary>
    UPrimeVPrimeRadius,
}

/// <summary>A chromaticity tolerance.</summary>
/// <param name="Kind">The kind.</param>
/// <param name="Value">Steps or radius (unused for quadrangles).</param>
public sealed record ChromaticityTolerance(ToleranceKind Kind, double Value);

/// <summary>A limit on one result field.</summary>
/// <param name="Field">Path into the analyze JSON object, e.g. <c>cri.ra</c>, <c>cri.r[8]</c>.</param>
/// <param name="Min">Lower limit (inclusive), or null.</param>
/// <param name="Max">Upper limit (inclusive), or null.</param>
/// <param name="Line">Line of the limit in the spec file (for messages).</param>
public sealed record FieldLimit(string Field, double? Min, double? Max, int Line)
{
    /// <summary>Readable limit, e.g. "≥ 90" or "80 … 90".</summary>
    public string Description => (Min, Max) switch
    {
        ({ } lo, { } hi) => $"{lo:G6} … {hi:G6}",
        ({ } lo, null) => $">= {lo:G6}",
        (null, { } hi) => $"<= {hi:G6}",
        _ => "",
    };
}

/// <summary>A product's tolerance specification, written once by a QA engineer.</summary>
/// <param name="Name">Name of the specification.</param>
/// <param name="Target">Chromaticity target, or null.</param>
/// <param name="Tolerance">Chromaticity tolerance.</param>
/// <param name="Limits">Limits on result fields.</param>
public sealed record ToleranceSpec(string Name, ChromaticityTarget? Target, ChromaticityTolerance Tolerance, IReadOnlyList<FieldLimit> Limits);

/// <summary>One criterion's outcome.</summary>
/// <param name="Criterion">What was checked (e.g. "chromaticity: 3-step ellipse", "cri.ra").</param>
/// <param name="Measured">Measured value (steps, Δu′v′, signed distance or the field's value); null when unavailable.</param>
/// <param name="Limit">The limit as text.</param>
/// <param name="Margin">Distance to the limit on the passing side (negative = failing by that much).</param>
/// <param name="Pass">Outcome.</param>
/// <param name="Note">Why a value is missing, or extra context.</param>
public sealed record CriterionResult(string Criterion, double? Measured, string Limit, double? Margin, bool Pass, string? Note = null);

/// <summary>Pass/fail of one spectrum against a specification.</summary>
/// <param name="Pass">True when every criterion passes.</param>
/// <param name="Criteria">The criteria in spec order (chromaticity first).</param>
/// <param name="StepsFromTarget">Steps from the target (ellipse metric), when a target exists.</param>
/// <param name="DeltaUPrimeVPrimeFromTarget">Δu′v′ from the target, when a target exists.</param>
public sealed record Verdict(bool Pass, IReadOnlyList<CriterionResult> Criteria, double? StepsFromTarget, double? DeltaUPrimeVPrimeFromTarget);

/// <summary>Evaluates a specification against an assessment (pure).</summary>
public static class SpecEvaluator
{
    /// <summary>The 1-step ellipse used for a target: the standard shape of its category, or the nearest standard shape.</summary>
    /// <param name="target">The target.</param>
    /// <returns>The ellipse centred on the target.</returns>
    public static StepEllipse EllipseFor(ChromaticityTarget target)
    {
        ArgumentNullException.ThrowIfNull(target);
        var c = target.Centre;
        if (target.Kind == TargetKind.NominalCct && StandardEllipses.ByNominalCct.TryGetValue((int)target.First, out var std))
            return std.MovedTo(c.X, c.Y) with { Source = std.Source + ", about the ANSI C78.377 centre" };
        return StandardEllipses.About(c.X, c.Y);
    }

    /// <summary>Evaluates the spec (prepares it first; for many spectra, prepare once with <see cref="Prepare"/>).</summary>
    /// <param name="spec">The specification.</param>
    /// <param name="chromaticity2Degree">The measured CIE 1931 2° chromaticity.</param>
    /// <param name="field">Resolves a field path to its value (null when not available).</param>
    /// <returns>The verdict.</returns>
    public static Verdict Evaluate(ToleranceSpec spec, Chromaticity chromaticity2Degree, Func<string, double?> field) =>
        Prepare(spec).Evaluate(chromaticity2Degree, field);

    /// <summary>Computes the target's centre, ellipse and quadrangle once.</summary>
    /// <param name="spec">The specification.</param>
    /// <returns>The prepared specification.</returns>
    public static PreparedSpec Prepare(ToleranceSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        return new PreparedSpec(spec);
    }
}

/// <summary>A specification with its geometry computed once (thread-safe to share).</summary>
public sealed class PreparedSpec
{
    private readonly Chromaticity _centre;
    private readonly StepEllipse? _ellipse;
    private readonly Quadrangle? _quadrangle;

    internal PreparedSpec(ToleranceSpec spec)
    {
        Spec = spec;
        if (spec.Target is { } t)
        {
            _centre = t.Centre;
            _ellipse = SpecEvaluator.EllipseFor(t);
            _quadrangle = spec.Tolerance.Kind == ToleranceKind.Quadrangle ? t.Category!.Quadrangle : null;
        }
    }

    /// <summary>The specification.</summary>
    public ToleranceSpec Spec { get; }

    /// <summary>The 1-step ellipse about the target (null without a target).</summary>
    public StepEllipse? Ellipse => _ellipse;

    /// <summary>Evaluates the spec.</summary>
    /// <param name="chromaticity2Degree">The measured CIE 1931 2° chromaticity.</param>
    /// <param name="field">Resolves a field path to its value (null when not available).</param>
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
            steps = ellipse.Steps(c.X, c.Y);
            duv = c.DeltaUPrimeVPrime(centre);
            switch (spec.Tolerance.Kind)
            {
                case ToleranceKind.Quadrangle:
                    var quad = _quadrangle!;
                    double d = quad.SignedDistance(c.X, c.Y);
                    criteria.Add(new CriterionResult($"chromaticity: ANSI C78.377 {target.First:0} K quadrangle", d, "inside (distance to nearest edge, xy)", d, d >= -1e-12,
                        target.Category!.Flexible ? "flexible-CCT tolerance interpolated between neighbouring categories (verify against the standard)" : null));
                    break;
                case ToleranceKind.EllipseSteps:
                    criteria.Add(new CriterionResult($"chromaticity: {spec.Tolerance.Value:0.#}-step ellipse", steps, $"<= {spec.Tolerance.Value:0.#} steps", spec.Tolerance.Value - steps, steps <= spec.Tolerance.Value, ellipse.Source));
                    break;
                case ToleranceKind.UPrimeVPrimeRadius:
                    criteria.Add(new CriterionResult($"chromaticity: Δu'v' circle r = {spec.Tolerance.Value:0.####}", duv, $"<= {spec.Tolerance.Value:0.####}", spec.Tolerance.Value - duv, duv <= spec.Tolerance.Value, "CIE TN 001:2014 circle"));
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
