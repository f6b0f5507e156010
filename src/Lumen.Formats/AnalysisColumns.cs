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
        Column<RecordOutcome>.Number("cct_k", o => o.Assessment?.Cct.CctKelvin, "0", "CCT (K)"),
        Column<RecordOutcome>.Number("duv", o => o.Assessment?.Cct.Duv, "+0.0000;-0.0000;0.0000", "Duv"),
        Column<RecordOutcome>.Number("x", o => o.Assessment?.Chromaticity.SmallX, "0.0000"),
        Column<RecordOutcome>.Number("y", o => o.Assessment?.Chromaticity.SmallY, "0.0000"),
        Column<RecordOutcome>.Number("u_prime", o => o.Assessment?.Chromaticity.UPrime, "0.0000", "u'"),
        Column<RecordOutcome>.Number("v_prime", o => o.Assessment?.Chromaticity.VPrime, "0.0000", "v'"),
        Column<RecordOutcome>.Number("ra", o => o.Assessment?.Cri?.Ra, "0.0", "Ra"),
        Column<RecordOutcome>.Number("r9", o => o.Assessment?.Cri?.R9, "0.0", "R9"),
        Column<RecordOutcome>.Number("rf", o => o.Assessment?.Fidelity?.Rf, "0.0", "Rf"),
        Column<RecordOutcome>.Number("rg", o => o.Assessment?.Fidelity?.Rg, "0.0", "Rg"),
    ]);

    /// <summary>The CSV with a specification: every column of <see cref="Csv"/>, then <c>verdict</c> (pass/fail) and <c>failed</c> (the criteria that failed).</summary>
    public static ColumnSchema<RecordOutcome> CsvWithVerdict { get; } = new([.. BuildCsv(), .. VerdictColumns()]);

    /// <summary>The text table with a specification: the table's columns and the verdict.</summary>
    public static ColumnSchema<RecordOutcome> TableWithVerdict { get; } = new([.. Table.Columns, .. VerdictColumns()]);

    private static IEnumerable<Column<RecordOutcome>> VerdictColumns()
    {
        yield return Column<RecordOutcome>.Text("verdict", o => o.Verdict is { } v ? (v.Pass ? "pass" : "fail") : null, "Verdict");
        yield return Column<RecordOutcome>.Text("failed", o => o.Verdict is { } v ? string.Join(" | ", v.Criteria.Where(c => !c.Pass).Select(c => c.Criterion)) : null, "Failed");
    }

    private static List<Column<RecordOutcome>> BuildCsv()
    {
        static Column<RecordOutcome> N(string name, Func<Assessment, double?> f) => Column<RecordOutcome>.Number(name, o => o.Assessment is { } a ? f(a) : null);
        static Column<RecordOutcome> T(string name, Func<Assessment, string?> f) => Column<RecordOutcome>.Text(name, o => o.Assessment is { } a ? f(a) : null);
        var c = new List<Column<RecordOutcome>>
        {
            Column<RecordOutcome>.Text("name", o => o.Record.Name),
            Column<RecordOutcome>.Text("source", o => o.Record.Source),
            Column<RecordOutcome>.Number("column", o => o.Record.Column),
            Column<RecordOutcome>.Text("status", o => o.Assessment is null ? "error" : "ok"),
            T("observer", a => ResultFields.ObserverLabel(a.Observer)),
            N("X", a => a.Tristimulus.X), N("Y", a => a.Tristimulus.Y), N("Z", a => a.Tristimulus.Z),
            N("x", a => a.Chromaticity.SmallX), N("y", a => a.Chromaticity.SmallY),
            N("u", a => a.Chromaticity.U), N("v", a => a.Chromaticity.V),
            N("u_prime", a => a.Chromaticity.UPrime), N("v_prime", a => a.Chromaticity.VPrime),
            N("cct_k", a => a.Cct.CctKelvin), N("duv", a => a.Cct.Duv),
            T("cct_method", a => CctResult.Describe(a.Cct.Method)),
            N("ra", a => a.Cri?.Ra),
        };
        for (int i = 0; i < 14; i++) { int k = i; c.Add(N($"r{k + 1}", a => a.Cri?.R[k])); }
        c.Add(T("cri_reference", a => a.Cri?.Reference.Description));
        c.Add(N("dc", a => a.Cri?.Dc));
        c.Add(N("rf", a => a.Fidelity?.Rf));
        c.Add(N("rg", a => a.Fidelity?.Rg));
        for (int j = 0; j < 16; j++) { int k = j; c.Add(N($"rf_h{k + 1}", a => a.Fidelity?.HueBins[k].Rf)); }
        for (int j = 0; j < 16; j++) { int k = j; c.Add(N($"rcs_h{k + 1}", a => a.Fidelity?.HueBins[k].Rcs * 100)); }
        for (int j = 0; j < 16; j++) { int k = j; c.Add(N($"rhs_h{k + 1}", a => a.Fidelity?.HueBins[k].Rhs)); }
        c.Add(T("fidelity_reference", a => a.Fidelity?.Reference.Description));
        c.Add(N("ler_lm_per_w", a => a.Photometry?.LerLumensPerWatt));
        c.Add(N("sp_ratio", a => a.Photometry?.SpRatio));
        c.Add(N("photometric_value", a => a.Photometry?.Photometric));
        c.Add(T("photometric_unit", a => a.Photometry?.Quantity is { } q ? Photometer.UnitSymbol(q) : null));
        c.Add(N("radiometric_value", a => a.Photometry?.Radiometric));
        c.Add(T("radiometric_unit", a => a.Photometry?.Quantity is { } q ? Photometer.RadiometricUnitSymbol(q) : null));
        c.Add(N("mel_efficacy_mw_per_lm", a => a.NonVisual?[0].EfficacyMilliwattsPerLumen));
        c.Add(N("mel_der", a => a.NonVisual?[0].Der));
        c.Add(N("mel_edi", a => a.NonVisual?[0].Edi));
        c.Add(N("sc_der", a => a.NonVisual?[1].Der));
        c.Add(N("mc_der", a => a.NonVisual?[2].Der));
        c.Add(N("lc_der", a => a.NonVisual?[3].Der));
        c.Add(N("rh_der", a => a.NonVisual?[4].Der));
        c.Add(N("peak_nm", a => a.Spectral?.PeakNm));
        c.Add(N("centroid_nm", a => a.Spectral?.CentroidNm));
        c.Add(N("fwhm_nm", a => a.Spectral?.FwhmNm));
        c.Add(N("dominant_nm", a => a.Spectral?.DominantNm));
        c.Add(N("purity", a => a.Spectral?.Purity));
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
