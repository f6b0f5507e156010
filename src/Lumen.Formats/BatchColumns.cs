using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>The CSV schema of <c>lumen batch</c> results: identity, the record's metadata, verdict, key results, then four
/// columns per criterion, then the error columns. (<c>robust_z</c> and <c>outlier</c> follow when the batch is complete:
/// <see cref="OutlierColumns"/>.)</summary>
public static class BatchColumns
{
    /// <summary>The schema for a specification (its criteria become columns).</summary>
    /// <param name="spec">The specification.</param>
    /// <param name="metadataKeys">Metadata keys, one column each after <c>location</c> (a key that is already a column
    /// name gets the prefix <c>meta_</c>); null for none.</param>
    /// <returns>The schema.</returns>
    public static ColumnSchema<RecordOutcome> For(ToleranceSpec spec, IReadOnlyList<string>? metadataKeys = null)
    {
        ArgumentNullException.ThrowIfNull(spec);
        static Column<RecordOutcome> F(string path) => AnalysisColumns.Field(path); // batch runs use the 2° observer, so chromaticity.* is the 2° chromaticity
        var c = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("id", o => o.Record.Name),
            Column<RecordOutcome>.Text("location", o => o.Record.Location),
        };
        int firstMetadata = c.Count;
        var rest = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("status", o => o.Status),
            Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(x => !x.Pass).Select(x => x.Criterion)) : null),
            F("cct.kelvin"), F("cct.duv"),
            F("chromaticity.x"), F("chromaticity.y"), F("chromaticity.uPrime"), F("chromaticity.vPrime"),
            F("cri.ra"), F("cri.r9"), F("fidelity.rf"), F("fidelity.rg"),
            Column<RecordOutcome>.Number("steps_from_target", o => o.Verdict?.StepsFromTarget),
            Column<RecordOutcome>.Number("delta_uv_from_target", o => o.Verdict?.DeltaUPrimeVPrimeFromTarget),
        };
        c.AddRange(rest);
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
        var taken = new HashSet<string>(c.Select(x => x.Name).Append(OutlierColumns.RobustZ).Append(OutlierColumns.Flag), StringComparer.Ordinal);
        var meta = new List<Column<RecordOutcome>>();
        foreach (var key in (metadataKeys ?? []).Distinct(StringComparer.Ordinal))
        {
            string k = key;
            meta.Add(Column<RecordOutcome>.Text(taken.Contains(k) ? "meta_" + k : k, o => o.Record.MetadataValue(k)));
        }
        c.InsertRange(firstMetadata, meta);
        return new ColumnSchema<RecordOutcome>(c);
    }
}
