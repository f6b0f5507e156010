using Lumen.Analysis;
using Lumen.Photometry;
using Lumen.Temperature;

namespace Lumen.Formats;

/// <summary>The column schemas of <c>lumen analyze</c>: the flat CSV (documented in the README) and the text table.</summary>
public static class AnalysisColumns
{
    /// <summary>Every CSV column, in order: identity, colorimetry, CIE 13.3, CIE 224 / TM-30, photometry, CIE S 026, descriptors, warnings, error.</summary>
    public static ColumnSchema<RecordOutcome> Csv { get; } = new(BuildCsv());

    /// <summary>The compact table a lighting designer reads at a glance.</summary>
    public static ColumnSchema<RecordOutcome> Table { get; } = new(
    [
        Column<RecordOutcome>.Text("name", o => o.Record.Name, "Name"),
        Field("cct.kelvin", null, "CCT (K)"),
        Field("cct.duv", null, "Duv"),
        Field("chromaticity.x", null, "x"),
        Field("chromaticity.y", null, "y"),
        Field("chromaticity.uPrime", null, "u'"),
        Field("chromaticity.vPrime", null, "v'"),
        Field("cri.ra", null, "Ra"),
        Field("cri.r9", null, "R9"),
        Field("fidelity.rf", null, "Rf"),
        Field("fidelity.rg", null, "Rg"),
    ]);

    /// <summary>The CSV with a specification: every column of <see cref="Csv"/>, then <c>verdict</c> (pass/fail) and <c>failed</c> (the criteria that failed).</summary>
    public static ColumnSchema<RecordOutcome> CsvWithVerdict { get; } = new([.. BuildCsv(), .. VerdictColumns()]);

    /// <summary>The text table with a specification: the table's columns and the verdict.</summary>
    public static ColumnSchema<RecordOutcome> TableWithVerdict { get; } = new([.. Table.Columns, .. VerdictColumns()]);

    /// <summary>A numeric column named by its result-field path and read through <see cref="ResultFields.Accessor"/> (resolved once), so a
    /// quantity has one name in specs, CSV headers, summaries and reports.</summary>
    /// <param name="path">The field path (must be known to <see cref="ResultFields"/>).</param>
    /// <param name="format">Number format for text tables; null for the quantity's rule (<see cref="ResultFields.DisplayFormat"/>).</param>
    /// <param name="title">Title for text tables, or null for the path.</param>
    /// <returns>The column.</returns>
    public static Column<RecordOutcome> Field(string path, string? format = null, string? title = null)
    {
        var get = ResultFields.Accessor(path);
        return Column<RecordOutcome>.Number(path, o => o.Assessment is { } a ? get(a) : null, format ?? ResultFields.DisplayFormat(path), title);
    }

    /// <summary>
    /// A schema with the measurement uncertainty of each result-field column beside it: <c>PATH_u</c> (standard
    /// uncertainty), <c>PATH_low</c> and <c>PATH_high</c> (the 95 % coverage interval); empty cells where a record has
    /// no uncertainty.
    /// </summary>
    /// <param name="schema">The schema.</param>
    /// <returns>The schema with the uncertainty columns.</returns>
    public static ColumnSchema<RecordOutcome> WithUncertainty(ColumnSchema<RecordOutcome> schema)
    {
        ArgumentNullException.ThrowIfNull(schema);
        var list = new List<Column<RecordOutcome>>();
        foreach (var c in schema.Columns)
        {
            list.Add(c);
            if (!ResultFields.IsKnown(c.Name)) continue;
            string path = c.Name;
            Lumen.Uncertainty.FieldUncertainty? U(RecordOutcome o) => o.Uncertainty is { } u && u.Fields.TryGetValue(path, out var f) ? f : null;
            list.Add(Column<RecordOutcome>.Number(path + "_u", o => U(o)?.Standard));
            list.Add(Column<RecordOutcome>.Number(path + "_low", o => U(o)?.Low));
            list.Add(Column<RecordOutcome>.Number(path + "_high", o => U(o)?.High));
        }
        return new ColumnSchema<RecordOutcome>(list);
    }

    private static IEnumerable<Column<RecordOutcome>> VerdictColumns()
    {
        yield return Column<RecordOutcome>.Text("verdict", o => o.Verdict is not null ? o.Status : null, "Verdict");
        yield return Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(c => !c.Pass).Select(c => c.Criterion)) : null, "Failed");
    }

    private static List<Column<RecordOutcome>> BuildCsv()
    {
        static Column<RecordOutcome> P(string path) => Field(path);
        static Column<RecordOutcome> N(string name, Func<Assessment, double?> f) => Column<RecordOutcome>.Number(name, o => o.Assessment is { } a ? f(a) : null);
        static Column<RecordOutcome> T(string name, Func<Assessment, string?> f) => Column<RecordOutcome>.Text(name, o => o.Assessment is { } a ? f(a) : null);
        var c = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("name", o => o.Record.Name),
            Column<RecordOutcome>.Text("source", o => o.Record.Source),
            Column<RecordOutcome>.Number("column", o => o.Record.Column),
            Column<RecordOutcome>.Text("status", o => o.Assessment is null ? "error" : "ok"),
            T("observer", a => ResultFields.ObserverLabel(a.Observer)),
            P("tristimulus.X"), P("tristimulus.Y"), P("tristimulus.Z"),
            P("chromaticity.x"), P("chromaticity.y"),
            P("chromaticity.u"), P("chromaticity.v"),
            P("chromaticity.uPrime"), P("chromaticity.vPrime"),
            P("cct.kelvin"), P("cct.duv"),
            T("cct_method", a => CctResult.Describe(a.Cct.Method)),
            P("cri.ra"),
        };
        for (int i = 1; i <= 14; i++) c.Add(P($"cri.r{i}"));
        c.Add(T("cri_reference", a => a.Cri?.Reference.Description));
        c.Add(P("cri.dc"));
        c.Add(P("fidelity.rf"));
        c.Add(P("fidelity.rg"));
        for (int j = 1; j <= 16; j++) c.Add(P($"fidelity.hueBin{j}.rf"));
        for (int j = 1; j <= 16; j++) c.Add(P($"fidelity.hueBin{j}.rcs"));
        for (int j = 1; j <= 16; j++) c.Add(P($"fidelity.hueBin{j}.rhs"));
        c.Add(T("fidelity_reference", a => a.Fidelity?.Reference.Description));
        c.Add(P("photometry.ler"));
        c.Add(P("photometry.spRatio"));
        c.Add(N("photometric_value", a => a.Photometry?.Photometric));
        c.Add(T("photometric_unit", a => a.Photometry?.Quantity is { } q ? Photometer.UnitSymbol(q) : null));
        c.Add(N("radiometric_value", a => a.Photometry?.Radiometric));
        c.Add(T("radiometric_unit", a => a.Photometry?.Quantity is { } q ? Photometer.RadiometricUnitSymbol(q) : null));
        c.Add(P("nonVisual.melanopic.efficacy"));
        c.Add(P("nonVisual.melanopic.der"));
        c.Add(P("nonVisual.melanopic.edi"));
        c.Add(P("nonVisual.sConeOpic.der"));
        c.Add(P("nonVisual.mConeOpic.der"));
        c.Add(P("nonVisual.lConeOpic.der"));
        c.Add(P("nonVisual.rhodopic.der"));
        c.Add(P("spectral.peakNm"));
        c.Add(P("spectral.centroidNm"));
        c.Add(P("spectral.fwhmNm"));
        c.Add(P("spectral.dominantNm"));
        c.Add(P("spectral.purity"));
        c.Add(T("warnings", a => string.Join(" | ", a.Warnings)));
        c.AddRange(ErrorColumns<RecordOutcome>(o => o.Error));
        return c;
    }

    /// <summary>The three error columns every per-record CSV ends with: <c>error_line, error_column, error</c>.</summary>
    /// <typeparam name="T">The row type.</typeparam>
    /// <param name="error">The row's error, or null.</param>
    /// <returns>The columns.</returns>
    public static IEnumerable<Column<T>> ErrorColumns<T>(Func<T, ReadDiagnostic?> error)
    {
        ArgumentNullException.ThrowIfNull(error);
        yield return Column<T>.Number("error_line", r => error(r)?.Line);
        yield return Column<T>.Number("error_column", r => error(r)?.Column);
        yield return Column<T>.Text("error", r => error(r)?.Message);
    }
}
