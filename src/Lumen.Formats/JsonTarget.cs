using System.Text.Json;
using Lumen.Conformance;
using Lumen.Temperature;

namespace Lumen.Formats;

/// <summary>Writes a specification's target as the verdicts use it: a <c>target</c> object (null without a target).</summary>
public static class JsonTarget
{
    /// <summary>Writes <c>target</c> {<c>x</c>, <c>y</c>, <c>uPrime</c>, <c>vPrime</c>, <c>cct</c>, <c>duv</c>, <c>ellipse</c>
    /// {<c>a</c>, <c>b</c>, <c>thetaDeg</c>, <c>source</c>}, and <c>quadrangle</c> [corners] or <c>radius</c>; <c>cautions</c>}.</summary>
    /// <param name="w">The JSON writer.</param>
    /// <param name="spec">The prepared specification.</param>
    public static void Write(Utf8JsonWriter w, PreparedSpec spec)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(spec);
        if (spec.Centre is not { } c) { w.WriteNull("target"); return; }
        var cct = CctSolver.Solve(c);
        w.WriteStartObject("target");
        w.NumberOrNull("x", c.SmallX); w.NumberOrNull("y", c.SmallY); w.NumberOrNull("uPrime", c.UPrime); w.NumberOrNull("vPrime", c.VPrime);
        w.NumberOrNull("cct", cct.CctKelvin); w.NumberOrNull("duv", cct.Duv);
        if (spec.Ellipse is { } e)
        {
            w.WriteStartObject("ellipse");
            w.NumberOrNull("a", e.A); w.NumberOrNull("b", e.B); w.NumberOrNull("thetaDeg", e.ThetaDegrees); w.WriteString("source", e.Source);
            w.WriteEndObject();
        }
        if (spec.Quadrangle is { } q)
        {
            w.WriteStartArray("quadrangle");
            foreach (var p in q.Corners) { w.WriteStartObject(); w.NumberOrNull("x", p.SmallX); w.NumberOrNull("y", p.SmallY); w.WriteEndObject(); }
            w.WriteEndArray();
        }
        if (spec.Spec.Tolerance.Kind == ToleranceKind.UPrimeVPrimeRadius) w.NumberOrNull("radius", spec.Spec.Tolerance.Value);
        w.StringArray("cautions", spec.Cautions);
        w.WriteEndObject();
    }

    /// <summary>Writes the sidecar that travels with a CSV of verdicts (CSV has no place for it): the results file's
    /// name, the specification's name and description, and its <c>target</c> as in <see cref="Write"/>.</summary>
    /// <param name="output">Where to write.</param>
    /// <param name="spec">The prepared specification the verdicts used.</param>
    /// <param name="resultsFileName">The CSV file's name.</param>
    /// <param name="rule">The decision rule the verdicts were read under.</param>
    public static void WriteSidecar(TextWriter output, PreparedSpec spec, string resultsFileName, Lumen.Uncertainty.DecisionRule rule = Lumen.Uncertainty.DecisionRule.Simple)
    {
        ArgumentNullException.ThrowIfNull(spec);
        JsonOutput.Write(output, w =>
        {
            w.WriteStartObject();
            w.WriteString("results", resultsFileName);
            w.WriteString("spec", spec.Spec.Name);
            w.WriteString("description", spec.Spec.Description);
            w.WriteString("rule", Lumen.Uncertainty.Decisions.Describe(rule));
            Write(w, spec);
            w.WriteEndObject();
        });
    }

    /// <summary>The sidecar's path for a CSV results path: <c>NAME.csv</c> → <c>NAME.csv.target.json</c>.</summary>
    /// <param name="resultsPath">The results path.</param>
    /// <returns>The sidecar path.</returns>
    public static string SidecarPath(string resultsPath) => resultsPath + ".target.json";
}
