using System.Text.Json;
using Lumen.Analysis;
using Lumen.Conformance;
using Lumen.Uncertainty;

namespace Lumen.Formats;

/// <summary>The one JSON form of a verdict, shared by analyze and batch rows.</summary>
internal static class JsonVerdict
{
    /// <summary>Writes <c>verdict</c> {<c>pass</c>, <c>stepsFromTarget</c>, <c>deltaUPrimeVPrimeFromTarget</c>,
    /// <c>criteria</c> [...], and <c>target</c> when the specification is given}.</summary>
    /// <param name="w">The JSON writer.</param>
    /// <param name="v">The verdict.</param>
    /// <param name="prepared">The specification behind it, for its target; null to leave the target out.</param>
    /// <param name="item">The outcome, for its decision rule and uncertainty (<c>rule</c>, <c>decision</c> and each
    /// criterion's <c>decision</c> and <c>expandedUncertainty</c>); null for simple acceptance.</param>
    public static void Write(Utf8JsonWriter w, Verdict v, PreparedSpec? prepared, RecordOutcome? item = null)
    {
        w.WriteStartObject("verdict");
        w.WriteBoolean("pass", v.Pass);
        var rule = item?.Rule ?? DecisionRule.Simple;
        var judged = Decisions.Of(v, item?.Uncertainty, rule);
        w.WriteString("rule", Decisions.Describe(rule));
        w.WriteString("decision", Name(judged.Unit));
        w.NumberOrNull("stepsFromTarget", v.StepsFromTarget);
        w.NumberOrNull("deltaUPrimeVPrimeFromTarget", v.DeltaUPrimeVPrimeFromTarget);
        w.WriteStartArray("criteria");
        for (int i = 0; i < v.Criteria.Count; i++)
        {
            var c = v.Criteria[i];
            w.WriteStartObject();
            w.WriteString("criterion", c.Criterion);
            w.NumberOrNull("measured", c.Measured);
            w.WriteString("limit", c.Limit);
            w.NumberOrNull("margin", c.Margin);
            w.WriteBoolean("pass", c.Pass);
            w.WriteString("decision", Name(judged.Criteria[i]));
            if (item?.Uncertainty is { } u && i < u.Criteria.Count && u.Criteria[i] is { } cu) w.NumberOrNull("expandedUncertainty", cu.Expanded);
            if (c.Note is not null) w.WriteString("note", c.Note);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        if (prepared is not null) JsonTarget.Write(w, prepared);
        w.WriteEndObject();
    }

    /// <summary>The output name of a decision.</summary>
    public static string Name(Decision d) => d switch { Decision.Pass => "pass", Decision.Fail => "fail", _ => "inconclusive" };
}
