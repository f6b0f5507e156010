using System.Text.Json;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>The one JSON form of a verdict, shared by analyze and batch rows.</summary>
internal static class JsonVerdict
{
    /// <summary>Writes <c>verdict</c> {<c>pass</c>, <c>stepsFromTarget</c>, <c>deltaUPrimeVPrimeFromTarget</c>,
    /// <c>criteria</c> [...], and <c>target</c> when the specification is given}.</summary>
    /// <param name="w">The JSON writer.</param>
    /// <param name="v">The verdict.</param>
    /// <param name="prepared">The specification behind it, for its target; null to leave the target out.</param>
    public static void Write(Utf8JsonWriter w, Verdict v, PreparedSpec? prepared)
    {
        w.WriteStartObject("verdict");
        w.WriteBoolean("pass", v.Pass);
        w.NumberOrNull("stepsFromTarget", v.StepsFromTarget);
        w.NumberOrNull("deltaUPrimeVPrimeFromTarget", v.DeltaUPrimeVPrimeFromTarget);
        w.WriteStartArray("criteria");
        foreach (var c in v.Criteria)
        {
            w.WriteStartObject();
            w.WriteString("criterion", c.Criterion);
            w.NumberOrNull("measured", c.Measured);
            w.WriteString("limit", c.Limit);
            w.NumberOrNull("margin", c.Margin);
            w.WriteBoolean("pass", c.Pass);
            if (c.Note is not null) w.WriteString("note", c.Note);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        if (prepared is not null) JsonTarget.Write(w, prepared);
        w.WriteEndObject();
    }
}
