using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>The CSV schema of <c>lumen batch</c> results: identity and verdict, key results, then four columns per criterion.</summary>
public static class BatchColumns
{
    /// <summary>The schema for a specification (its criteria become columns).</summary>
    /// <param name="spec">The specification.</param>
    /// <returns>The schema.</returns>
    public static ColumnSchema<RecordOutcome> For(ToleranceSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        static Column<RecordOutcome> F(string path) => AnalysisColumns.Field(path); // batch runs use the 2° observer, so chromaticity.* is the 2° chromaticity
        var c = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("id", o => o.Record.Name),
            Column<RecordOutcome>.Text("location", o => o.Record.Location),
            Column<RecordOutcome>.Text("status", o => o.Status),
            Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(x => !x.Pass).Select(x => x.Criterion)) : null),
            F("cct.kelvin"), F("cct.duv"),
            F("chromaticity.x"), F("chromaticity.y"), F("chromaticity.uPrime"), F("chromaticity.vPrime"),
            F("cri.ra"), F("cri.r9"), F("fidelity.rf"), F("fidelity.rg"),
            Column<RecordOutcome>.Number("steps_from_target", o => o.Verdict?.StepsFromTarget),
            Column<RecordOutcome>.Number("delta_uv_from_target", o => o.Verdict?.DeltaUPrimeVPrimeFromTarget),
        };
        var names = new List<string>();
        if (spec.Tolerance.Kind != ToleranceKind.None) names.Add("chromaticity");
        names.AddRange(spec.Limits.Select(l => l.Field));
        for (int i = 0; i < names.Count; i++)
        {
            int k = i;
            CriterionResult? C(RecordOutcome o) => o.Verdict is { } v && k < v.Criteria.Count ? v.Criteria[k] : null;
            c.Add(Column<RecordOutcome>.Number($"{names[k]}_value", o => C(o)?.Measured));
            c.Add(Column<RecordOutcome>.Text($"{names[k]}_limit", o => C(o)?.Limit));
            c.Add(Column<RecordOutcome>.Number($"{names[k]}_margin", o => C(o)?.Margin));
            c.Add(Column<RecordOutcome>.Text($"{names[k]}_pass", o => C(o) is { } x ? (x.Pass ? "yes" : "no") : null));
        }
        c.AddRange(AnalysisColumns.ErrorColumns<RecordOutcome>(o => o.Error));
        return new ColumnSchema<RecordOutcome>(c);
    }
}
