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
}
