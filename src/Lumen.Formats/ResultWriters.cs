using System.Globalization;
using System.Text;
using System.Text.Json;
using Lumen.Cie;

namespace Lumen.Formats;

/// <summary>Output formats of <c>lumen analyze</c>.</summary>
public enum OutputFormat
{
    /// <summary>A compact table for people.</summary>
    Text,

    /// <summary>A JSON array, one object per record (field names documented in the README).</summary>
    Json,

    /// <summary>CSV, one row per record, flat columns documented in the README.</summary>
    Csv,
}

/// <summary>Writes analysis results as text, JSON or CSV.</summary>
public static class ResultWriters
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Writes items in a format.</summary>
    /// <param name="items">Items in input order.</param>
    /// <param name="format">The format.</param>
    /// <param name="output">Destination.</param>
    /// <param name="detail">With text: a block of every result per spectrum after the table.</param>
    public static void Write(IReadOnlyList<AnalysisItem> items, OutputFormat format, TextWriter output, bool detail = false)
    {
        switch (format)
        {
            case OutputFormat.Json: WriteJson(items, output); break;
            case OutputFormat.Csv: WriteCsv(items, output); break;
            default:
                WriteText(items, output);
                if (detail) WriteDetail(items, output);
                break;
        }
    }

    /// <summary>Writes every result of each spectrum as readable lines (the text form of the JSON).</summary>
    /// <param name="items">Items.</param>
    /// <param name="output">Destination.</param>
    public static void WriteDetail(IReadOnlyList<AnalysisItem> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        string N(double? v, string f) => v is { } x && double.IsFinite(x) ? x.ToString(f, Inv) : "—";
        foreach (var item in items)
        {
            if (item.Result is not { } a) continue;
            output.WriteLine();
            output.WriteLine($"{a.Name} — {a.Origin}");
            output.WriteLine($"  CCT {N(a.Cct.CctKelvin, "0.0")} K, Duv {N(a.Cct.Duv, "+0.00000;-0.00000;0")}  ({Lumen.Temperature.CctResult.Describe(a.Cct.Method)})");
            if (a.Cri is { } c)
                output.WriteLine($"  CIE 13.3: Ra {N(c.Ra, "0.0")}; R1–R14 {string.Join(" ", c.R.Select(r => N(r, "0")))}; DC {N(c.Dc, "0.0000")}; reference: {c.Reference.Description}");
            if (a.Fidelity is { } f)
            {
                output.WriteLine($"  CIE 224 / TM-30: Rf {N(f.Rf, "0.0")}, Rg {N(f.Rg, "0.0")}; reference: {f.Reference.Description}");
                output.WriteLine($"    Rf,hj  {string.Join(" ", f.HueBins.Select(b => N(b.Rf, "0").PadLeft(4)))}");
                output.WriteLine($"    Rcs,hj {string.Join(" ", f.HueBins.Select(b => N(b.Rcs * 100, "0").PadLeft(4)))} (%)");
            }
            if (a.Photometry is { } p)
            {
                string abs = p.Quantity is { } q ? $"; {N(p.Photometric, "0.###")} {Lumen.Photometry.Photometer.UnitSymbol(q)} ({N(p.Radiometric, "0.####")} {Lumen.Photometry.Photometer.RadiometricUnitSymbol(q)})" : "";
                output.WriteLine($"  Photometry: LER {N(p.LerLumensPerWatt, "0.0")} lm/W over {p.BandFirstNm:0}–{p.BandLastNm:0} nm; S/P {N(p.SpRatio, "0.000")}{abs}");
            }
            if (a.NonVisual is { } nv)
            {
                var mel = nv[0];
                string edi = mel.Edi is { } e ? $", EDI {N(e, "0.#")} {Lumen.Photometry.Photometer.UnitSymbol(Lumen.Photometry.Photometer.QuantityOf(a.Unit))}" : "";
                output.WriteLine($"  CIE S 026: melanopic DER {N(mel.Der, "0.000")} ({N(mel.EfficacyMilliwattsPerLumen, "0.0000")} mW/lm){edi}; DER S/M/L-cone, rhodopic {N(nv[1].Der, "0.000")} {N(nv[2].Der, "0.000")} {N(nv[3].Der, "0.000")} {N(nv[4].Der, "0.000")}");
            }
            if (a.Spectral is { } sd)
                output.WriteLine($"  Spectrum: peak {N(sd.PeakNm, "0.#")} nm, centroid {N(sd.CentroidNm, "0.#")} nm, FWHM {N(sd.FwhmNm, "0.#")} nm, dominant {N(sd.DominantNm, "0.#")} nm, purity {N(sd.Purity, "0.000")}");
            foreach (var w in a.Warnings) output.WriteLine($"  ! {w}");
        }
        output.WriteLine();
        output.WriteLine("CIE S 026 values are metrology, not medical or health advice.");
    }

    /// <summary>Observer label used in outputs: "2" or "10".</summary>
    /// <param name="o">Observer.</param>
    /// <returns>The label.</returns>
    public static string ObserverLabel(Observer o) => o == Observer.Cie1931TwoDegree ? "2" : "10";

    /// <summary>Writes the JSON array.</summary>
    /// <param name="items">Items.</param>
    /// <param name="output">Destination.</param>
    public static void WriteJson(IReadOnlyList<AnalysisItem> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartArray();
            foreach (var item in items) WriteJsonItem(w, item);
            w.WriteEndArray();
        }
        output.Write(Encoding.UTF8.GetString(ms.ToArray()));
        output.WriteLine();
    }

    private static void Num(Utf8JsonWriter w, string name, double value)
    {
        if (double.IsFinite(value)) w.WriteNumber(name, value);
        else w.WriteNull(name);
    }

    private static void WriteJsonItem(Utf8JsonWriter w, AnalysisItem item)
    {
        var rec = item.Record;
        w.WriteStartObject();
        w.WriteString("name", rec.Name);
        w.WriteString("source", rec.Source);
        w.WriteNumber("column", rec.Column);
        if (item.Result is not { } a)
        {
            var e = rec.Error!;
            w.WriteStartObject("error");
            w.WriteNumber("line", e.Line);
            w.WriteNumber("column", e.Column);
            w.WriteString("message", e.Message);
            w.WriteEndObject();
            w.WriteEndObject();
            return;
        }
        w.WriteString("observer", ObserverLabel(a.Observer));
        w.WriteString("unit", Lumen.Spectra.SpectralUnits.Symbol(a.Unit));
        w.WriteStartObject("tristimulus");
        Num(w, "X", a.Tristimulus.X); Num(w, "Y", a.Tristimulus.Y); Num(w, "Z", a.Tristimulus.Z);
        w.WriteEndObject();
        if (a.AbsoluteTristimulus is { } abs)
        {
            w.WriteStartObject("tristimulusAbsolute");
            Num(w, "X", abs.X); Num(w, "Y", abs.Y); Num(w, "Z", abs.Z);
            w.WriteEndObject();
        }
        w.WriteStartObject("chromaticity");
        Num(w, "x", a.Chromaticity.X); Num(w, "y", a.Chromaticity.Y);
        Num(w, "u", a.Chromaticity.U); Num(w, "v", a.Chromaticity.V);
        Num(w, "uPrime", a.Chromaticity.UPrime); Num(w, "vPrime", a.Chromaticity.VPrime);
        w.WriteEndObject();
        w.WriteStartObject("cct");
        Num(w, "kelvin", a.Cct.CctKelvin);
        Num(w, "duv", a.Cct.Duv);
        w.WriteString("method", Lumen.Temperature.CctResult.Describe(a.Cct.Method));
        w.WriteString("observer", "2");
        w.WriteEndObject();
        if (a.Cri is { } cri)
        {
            w.WriteStartObject("cri");
            Num(w, "ra", cri.Ra);
            w.WriteStartArray("r");
            foreach (var r in cri.R) w.WriteNumberValue(r);
            w.WriteEndArray();
            Num(w, "r9", cri.R9);
            WriteReference(w, cri.Reference);
            Num(w, "dc", cri.Dc);
            w.WriteBoolean("dcValid", cri.DcValid);
            w.WriteString("method", "CIE 13.3-1995");
            w.WriteEndObject();
        }
        if (a.Fidelity is { } f)
        {
            w.WriteStartObject("fidelity");
            Num(w, "rf", f.Rf);
            Num(w, "rg", f.Rg);
            w.WriteStartArray("rfCes");
            foreach (var r in f.RfCes) w.WriteNumberValue(r);
            w.WriteEndArray();
            w.WriteStartArray("hueBins");
            foreach (var b in f.HueBins)
            {
                w.WriteStartObject();
                w.WriteNumber("bin", b.Index);
                w.WriteNumber("samples", b.SampleCount);
                Num(w, "rf", b.Rf);
                Num(w, "rcs", b.Rcs * 100);
                Num(w, "rhs", b.Rhs);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            WriteReference(w, f.Reference);
            w.WriteString("method", "CIE 224:2017 Rf; ANSI/IES TM-30-20 Rg and hue bins (rcs in %)");
            w.WriteEndObject();
        }
        if (a.Photometry is { } ph)
        {
            w.WriteStartObject("photometry");
            Num(w, "ler", ph.LerLumensPerWatt);
            Num(w, "spRatio", ph.SpRatio);
            w.WriteStartObject("lerBandNm");
            w.WriteNumber("first", ph.BandFirstNm); w.WriteNumber("last", ph.BandLastNm);
            w.WriteEndObject();
            if (ph.Quantity is { } q)
            {
                Num(w, PhotometricFieldName(q), ph.Photometric!.Value);
                Num(w, "scotopic" + char.ToUpperInvariant(PhotometricFieldName(q)[0]) + PhotometricFieldName(q)[1..], ph.Scotopic!.Value);
                Num(w, RadiometricFieldName(q), ph.Radiometric!.Value);
            }
            w.WriteEndObject();
        }
        if (a.NonVisual is { } nv)
        {
            w.WriteStartObject("nonVisual");
            foreach (var r in nv)
            {
                w.WriteStartObject(NonVisualName(r.Kind));
                Num(w, "efficacy", r.EfficacyMilliwattsPerLumen);
                Num(w, "der", r.Der);
                if (r.Irradiance is { } irr)
                {
                    var q = Lumen.Photometry.Photometer.QuantityOf(a.Unit);
                    Num(w, "irradiance", irr);
                    w.WriteString("irradianceUnit", Lumen.Photometry.Photometer.RadiometricUnitSymbol(q));
                    Num(w, "edi", r.Edi!.Value);
                    w.WriteString("ediUnit", Lumen.Photometry.Photometer.UnitSymbol(q));
                }
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }
        if (a.Spectral is { } sd)
        {
            w.WriteStartObject("spectral");
            Num(w, "peakNm", sd.PeakNm);
            Num(w, "centroidNm", sd.CentroidNm);
            if (sd.FwhmNm is { } fw) Num(w, "fwhmNm", fw); else w.WriteNull("fwhmNm");
            if (sd.DominantNm is { } dm) Num(w, "dominantNm", dm); else w.WriteNull("dominantNm");
            Num(w, "purity", sd.Purity);
            w.WriteString("whitePoint", sd.WhitePoint);
            w.WriteEndObject();
        }
        w.WriteStartArray("warnings");
        foreach (var warning in a.Warnings) w.WriteStringValue(warning);
        w.WriteEndArray();
        var p = a.Provenance;
        w.WriteStartObject("provenance");
        w.WriteStartObject("methods");
        foreach (var kv in p.Methods) w.WriteString(kv.Key, kv.Value);
        w.WriteEndObject();
        w.WriteStartArray("standards");
        foreach (var s in p.Standards) w.WriteStringValue(s);
        w.WriteEndArray();
        w.WriteNumber("c2MetreKelvin", p.C2MetreKelvin);
        w.WriteStartObject("measuredRangeNm");
        w.WriteNumber("first", p.MeasuredFirstNm); w.WriteNumber("last", p.MeasuredLastNm);
        w.WriteEndObject();
        w.WriteStartObject("integration");
        w.WriteNumber("startNm", p.IntegrationStartNm); w.WriteNumber("endNm", p.IntegrationEndNm); w.WriteNumber("stepNm", p.IntegrationStepNm);
        w.WriteString("sampling", p.Sampling);
        w.WriteEndObject();
        w.WriteNumber("negativeSamples", p.NegativeSamples);
        w.WriteEndObject();
        w.WriteEndObject();
    }

    /// <summary>JSON field name of a photometric quantity, unit in the name.</summary>
    /// <param name="q">Quantity.</param>
    /// <returns>For example <c>illuminanceLux</c>.</returns>
    public static string PhotometricFieldName(Lumen.Photometry.PhotometricQuantity q) => q switch
    {
        Lumen.Photometry.PhotometricQuantity.IlluminanceLux => "illuminanceLux",
        Lumen.Photometry.PhotometricQuantity.LuminanceCandelaPerSquareMetre => "luminanceCdPerM2",
        Lumen.Photometry.PhotometricQuantity.IntensityCandela => "intensityCd",
        _ => "fluxLm",
    };

    /// <summary>JSON field name of the radiometric total, unit in the name.</summary>
    /// <param name="q">Quantity.</param>
    /// <returns>For example <c>irradianceWPerM2</c>.</returns>
    public static string RadiometricFieldName(Lumen.Photometry.PhotometricQuantity q) => q switch
    {
        Lumen.Photometry.PhotometricQuantity.IlluminanceLux => "irradianceWPerM2",
        Lumen.Photometry.PhotometricQuantity.LuminanceCandelaPerSquareMetre => "radianceWPerSrM2",
        Lumen.Photometry.PhotometricQuantity.IntensityCandela => "intensityWPerSr",
        _ => "fluxW",
    };

    /// <summary>JSON name of an α-opic kind.</summary>
    /// <param name="k">Kind.</param>
    /// <returns>For example <c>sConeOpic</c>.</returns>
    public static string NonVisualName(Lumen.Photometry.AlphaOpicKind k) => k switch
    {
        Lumen.Photometry.AlphaOpicKind.Melanopic => "melanopic",
        Lumen.Photometry.AlphaOpicKind.SConeOpic => "sConeOpic",
        Lumen.Photometry.AlphaOpicKind.MConeOpic => "mConeOpic",
        Lumen.Photometry.AlphaOpicKind.LConeOpic => "lConeOpic",
        _ => "rhodopic",
    };

    private static void WriteReference(Utf8JsonWriter w, Lumen.Rendition.ReferenceIlluminant r)
    {
        w.WriteStartObject("reference");
        w.WriteString("type", r.Kind switch
        {
            Lumen.Rendition.ReferenceKind.Planckian => "planckian",
            Lumen.Rendition.ReferenceKind.CieDaylight => "daylight",
            _ => "blend",
        });
        Num(w, "cctKelvin", r.CctKelvin);
        Num(w, "daylightFraction", r.DaylightFraction);
        w.WriteString("description", r.Description);
        w.WriteEndObject();
    }

    /// <summary>CSV column names, in order (documented in the README).</summary>
    public static IReadOnlyList<string> CsvColumns { get; } =
    [
        "name", "source", "column", "status", "observer", "X", "Y", "Z", "x", "y", "u", "v", "u_prime", "v_prime",
        "cct_k", "duv", "cct_method",
        "ra", "r1", "r2", "r3", "r4", "r5", "r6", "r7", "r8", "r9", "r10", "r11", "r12", "r13", "r14", "cri_reference", "dc",
        "rf", "rg", .. Enumerable.Range(1, 16).Select(j => $"rf_h{j}"), .. Enumerable.Range(1, 16).Select(j => $"rcs_h{j}"),
        .. Enumerable.Range(1, 16).Select(j => $"rhs_h{j}"), "fidelity_reference",
        "ler_lm_per_w", "sp_ratio", "photometric_value", "photometric_unit", "radiometric_value", "radiometric_unit",
        "mel_efficacy_mw_per_lm", "mel_der", "mel_edi", "sc_der", "mc_der", "lc_der", "rh_der",
        "peak_nm", "centroid_nm", "fwhm_nm", "dominant_nm", "purity",
        "warnings", "error_line", "error_column", "error",
    ];

    /// <summary>Writes CSV (RFC 4180 quoting, invariant culture, '.' decimal separator).</summary>
    /// <param name="items">Items.</param>
    /// <param name="output">Destination.</param>
    public static void WriteCsv(IReadOnlyList<AnalysisItem> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine(string.Join(',', CsvColumns));
        foreach (var item in items)
        {
            var r = item.Record;
            var cells = new List<string> { Csv(r.Name), Csv(r.Source), r.Column.ToString(Inv) };
            if (item.Result is { } a)
            {
                cells.Add("ok");
                cells.Add(ObserverLabel(a.Observer));
                cells.AddRange(new[] { a.Tristimulus.X, a.Tristimulus.Y, a.Tristimulus.Z, a.Chromaticity.X, a.Chromaticity.Y,
                    a.Chromaticity.U, a.Chromaticity.V, a.Chromaticity.UPrime, a.Chromaticity.VPrime, a.Cct.CctKelvin, a.Cct.Duv }.Select(F));
                cells.Add(Csv(Lumen.Temperature.CctResult.Describe(a.Cct.Method)));
                if (a.Cri is { } cri)
                {
                    cells.Add(F(cri.Ra));
                    cells.AddRange(cri.R.Select(F));
                    cells.Add(Csv(cri.Reference.Description));
                    cells.Add(F(cri.Dc));
                }
                else cells.AddRange(Enumerable.Repeat("", 17));
                if (a.Fidelity is { } fi)
                {
                    cells.Add(F(fi.Rf));
                    cells.Add(F(fi.Rg));
                    cells.AddRange(fi.HueBins.Select(b => F(b.Rf)));
                    cells.AddRange(fi.HueBins.Select(b => F(b.Rcs * 100)));
                    cells.AddRange(fi.HueBins.Select(b => F(b.Rhs)));
                    cells.Add(Csv(fi.Reference.Description));
                }
                else cells.AddRange(Enumerable.Repeat("", 51));
                if (a.Photometry is { } ph)
                {
                    cells.Add(F(ph.LerLumensPerWatt)); cells.Add(F(ph.SpRatio));
                    cells.Add(ph.Photometric is { } pv ? F(pv) : "");
                    cells.Add(ph.Quantity is { } q ? Lumen.Photometry.Photometer.UnitSymbol(q) : "");
                    cells.Add(ph.Radiometric is { } rv ? F(rv) : "");
                    cells.Add(ph.Quantity is { } q2 ? Lumen.Photometry.Photometer.RadiometricUnitSymbol(q2) : "");
                }
                else cells.AddRange(Enumerable.Repeat("", 6));
                if (a.NonVisual is { } nv)
                {
                    cells.Add(F(nv[0].EfficacyMilliwattsPerLumen)); cells.Add(F(nv[0].Der));
                    cells.Add(nv[0].Edi is { } edi ? F(edi) : "");
                    for (int k = 1; k < 5; k++) cells.Add(F(nv[k].Der));
                }
                else cells.AddRange(Enumerable.Repeat("", 7));
                if (a.Spectral is { } sd)
                {
                    cells.Add(F(sd.PeakNm)); cells.Add(F(sd.CentroidNm));
                    cells.Add(sd.FwhmNm is { } fw ? F(fw) : ""); cells.Add(sd.DominantNm is { } dm ? F(dm) : ""); cells.Add(F(sd.Purity));
                }
                else cells.AddRange(Enumerable.Repeat("", 5));
                cells.Add(Csv(string.Join(" | ", a.Warnings)));
                cells.AddRange(["", "", ""]);
            }
            else
            {
                var e = r.Error!;
                cells.Add("error");
                cells.AddRange(Enumerable.Repeat("", CsvColumns.Count - 7));
                cells.Add(e.Line.ToString(Inv));
                cells.Add(e.Column.ToString(Inv));
                cells.Add(Csv(e.Message));
            }
            output.WriteLine(string.Join(',', cells));
        }
    }

    private static string F(double v) => double.IsFinite(v) ? v.ToString("R", Inv) : "";

    /// <summary>Quotes a CSV field when needed (RFC 4180).</summary>
    /// <param name="s">Field text.</param>
    /// <returns>The field, quoted when it holds a comma, quote or line break.</returns>
    public static string Csv(string s)
    {
        ArgumentNullException.ThrowIfNull(s);
        return s.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : s;
    }

    /// <summary>Writes the compact table a lighting designer reads at a glance, then warnings and errors.</summary>
    /// <param name="items">Items.</param>
    /// <param name="output">Destination.</param>
    public static void WriteText(IReadOnlyList<AnalysisItem> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        int nameWidth = Math.Clamp(items.Count == 0 ? 4 : items.Max(i => i.Record.Name.Length), 4, 32);
        var obs = items.FirstOrDefault(i => i.Result is not null)?.Result?.Observer ?? Observer.Cie1931TwoDegree;
        output.WriteLine($"{"Name".PadRight(nameWidth)}  {"CCT (K)",8}  {"Duv",8}  {"x",7}  {"y",7}  {"u'",7}  {"v'",7}  {"Ra",5}  {"R9",6}  {"Rf",5}  {"Rg",5}");
        output.WriteLine(new string('-', nameWidth + 90));
        var notes = new List<string>();
        foreach (var item in items)
        {
            string name = item.Record.Name.Length > nameWidth ? item.Record.Name[..(nameWidth - 1)] + "…" : item.Record.Name.PadRight(nameWidth);
            if (item.Result is { } a)
            {
                string cct = double.IsFinite(a.Cct.CctKelvin) ? a.Cct.CctKelvin.ToString("0", Inv) : "—";
                string duv = double.IsFinite(a.Cct.Duv) ? a.Cct.Duv.ToString("+0.0000;-0.0000;0.0000", Inv) : "—";
                var c = a.Chromaticity;
                string ra = a.Cri is { } cr ? cr.Ra.ToString("0.0", Inv) : "—", r9 = a.Cri is { } cr9 ? cr9.R9.ToString("0.0", Inv) : "—";
                string rf = a.Fidelity is { } fi ? fi.Rf.ToString("0.0", Inv) : "—", rg = a.Fidelity is { } fg ? fg.Rg.ToString("0.0", Inv) : "—";
                output.WriteLine($"{name}  {cct,8}  {duv,8}  {G(c.X),7}  {G(c.Y),7}  {G(c.UPrime),7}  {G(c.VPrime),7}  {ra,5}  {r9,6}  {rf,5}  {rg,5}{(a.Warnings.Count > 0 ? "  !" : "")}");
                foreach (var wmsg in a.Warnings) notes.Add($"! {item.Record.Name}: {wmsg}");
            }
            else
            {
                output.WriteLine($"{name}  ERROR {item.Record.Error}");
            }
        }
        output.WriteLine();
        output.WriteLine($"Chromaticity: CIE {(obs == Observer.Cie1931TwoDegree ? "1931 2°" : "1964 10°")} observer; CCT/Duv: CIE 1931 2°, Duv > 0 above the Planckian locus.");
        output.WriteLine("Ra, R9: CIE 13.3-1995. Rf: CIE 224:2017 (= ANSI/IES TM-30-20 Rf). Rg: ANSI/IES TM-30-20. '!' marks a spectrum with warnings below.");
        if (notes.Count > 0)
        {
            output.WriteLine();
            foreach (var n in notes) output.WriteLine(n);
        }
    }

    private static string G(double v) => double.IsFinite(v) ? v.ToString("0.0000", Inv) : "—";
}
