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
        static Column<RecordOutcome> N(string name, Func<Assessment, double?> f) => Column<RecordOutcome>.Number(name, o => o.Assessment is { } a ? f(a) : null);
        var c = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("id", o => o.Record.Name),
            Column<RecordOutcome>.Text("location", o => o.Record.Location),
            Column<RecordOutcome>.Text("status", o => o.Status),
            Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(x => !x.Pass).Select(x => x.Criterion)) : null),
            N("cct_k", a => a.Cct.CctKelvin), N("duv", a => a.Cct.Duv),
            N("x", a => a.Chromaticity2Degree.SmallX), N("y", a => a.Chromaticity2Degree.SmallY),
            N("u_prime", a => a.Chromaticity2Degree.UPrime), N("v_prime", a => a.Chromaticity2Degree.VPrime),
            N("ra", a => a.Cri?.Ra), N("r9", a => a.Cri?.R9), N("rf", a => a.Fidelity?.Rf), N("rg", a => a.Fidelity?.Rg),
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
