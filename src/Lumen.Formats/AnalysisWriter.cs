using System.Globalization;
using System.Text.Json;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Photometry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Formats;

/// <summary>Writes <c>lumen analyze</c> results as text, JSON or CSV (fields documented in the README).</summary>
public static class AnalysisWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Writes outcomes in a format.</summary>
    /// <param name="items">Outcomes in input order.</param>
    /// <param name="format">The format.</param>
    /// <param name="output">Destination.</param>
    /// <param name="detail">With text: a block of every result per spectrum after the table.</param>
    public static void Write(IReadOnlyList<RecordOutcome> items, OutputFormat format, TextWriter output, bool detail = false)
    {
        bool verdicts = items.Any(i => i.Verdict is not null);
        FormattedOutput.Write(items, format, output, (w, item) => WriteRecord(w, item), verdicts ? AnalysisColumns.CsvWithVerdict : AnalysisColumns.Csv, (all, o) =>
        {
            WriteText(all, o);
            if (detail) WriteDetail(all, o);
        });
    }

    /// <summary>Writes the compact table, then the notes on observers and methods, then each spectrum's warnings.</summary>
    /// <param name="items">Outcomes.</param>
    /// <param name="output">Destination.</param>
    public static void WriteText(IReadOnlyList<RecordOutcome> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        (items.Any(i => i.Verdict is not null) ? AnalysisColumns.TableWithVerdict : AnalysisColumns.Table).WriteTable(output, items,
            wholeLine: o => o.Error is { } e ? $"ERROR {e}" : null,
            suffix: o => o.Assessment?.Warnings.Count > 0 ? "  !" : "");
        var obs = items.FirstOrDefault(i => i.Assessment is not null)?.Assessment?.Observer ?? Observer.Cie1931TwoDegree;
        output.WriteLine();
        output.WriteLine($"Chromaticity: CIE {(obs == Observer.Cie1931TwoDegree ? "1931 2°" : "1964 10°")} observer; CCT/Duv: CIE 1931 2°, Duv > 0 above the Planckian locus.");
        output.WriteLine("Ra, R9: CIE 13.3-1995. Rf: CIE 224:2017 (= ANSI/IES TM-30-20 Rf). Rg: ANSI/IES TM-30-20. '!' marks a spectrum with warnings below.");
        WriteUncertaintyText(items, output);
        var notes = items.Where(i => i.Assessment is not null).SelectMany(i => i.Assessment!.Warnings.Select(w => $"! {i.Record.Name}: {w}"))
            .Concat(items.Where(i => i.Uncertainty is not null).SelectMany(i => i.Uncertainty!.Warnings.Select(w => $"! {i.Record.Name}: {w}"))).ToList();
        if (notes.Count > 0)
        {
            output.WriteLine();
            foreach (var n in notes) output.WriteLine(n);
        }
    }

    /// <summary>The value ± standard uncertainty of the table's main results, when the run propagated uncertainty.</summary>
    private static readonly (string Path, string Heading)[] UncertaintyTable =
    [
        ("cct.kelvin", "CCT (K)"), ("cct.duv", "Duv"), ("chromaticity.x", "x"), ("chromaticity.y", "y"),
        ("cri.ra", "Ra"), ("cri.r9", "R9"), ("fidelity.rf", "Rf"), ("fidelity.rg", "Rg"),
    ];

    private static void WriteUncertaintyText(IReadOnlyList<RecordOutcome> items, TextWriter output)
    {
        var withU = items.Where(i => i.Uncertainty is not null && i.Assessment is not null).ToList();
        if (withU.Count == 0) return;
        var u0 = withU[0].Uncertainty!;
        output.WriteLine();
        output.WriteLine($"Measurement uncertainty: value ± standard uncertainty (k = 1), Monte Carlo with {u0.Draws:N0} draws (JCGM 101:2008), seed {u0.Seed}; 95 % intervals in JSON and CSV.");
        output.WriteLine($"Model: {u0.Model.Description}.");
        var columns = new List<Column<RecordOutcome>> { Column<RecordOutcome>.Text("name", o => o.Record.Name, "Name") };
        foreach (var (path, heading) in UncertaintyTable)
        {
            string format = ResultFields.DisplayFormat(path);
            var get = ResultFields.Accessor(path);
            string spread = format.StartsWith('+') ? "0.0000" : format;
            columns.Add(Column<RecordOutcome>.Text(path, o => o.Assessment is { } a && get(a) is { } v && double.IsFinite(v)
                ? v.ToString(format, Inv) + (o.Uncertainty!.Fields.TryGetValue(path, out var f) && double.IsFinite(f.Standard) ? " ± " + f.Standard.ToString(spread, Inv) : "")
                : "—", heading));
        }
        new ColumnSchema<RecordOutcome>(columns).WriteTable(output, withU);
    }

    /// <summary>Writes every result of each spectrum as readable lines (the text form of the JSON).</summary>
    /// <param name="items">Outcomes.</param>
    /// <param name="output">Destination.</param>
    public static void WriteDetail(IReadOnlyList<RecordOutcome> items, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        static string N(double? v, string f) => v is { } x && double.IsFinite(x) ? x.ToString(f, Inv) : "—";
        foreach (var item in items)
        {
            if (item.Assessment is not { } a) continue;
            output.WriteLine();
            output.WriteLine($"{a.Name} — {a.Origin}");
            output.WriteLine($"  CCT {N(a.Cct.CctKelvin, "0.0")} K, Duv {N(a.Cct.Duv, "+0.00000;-0.00000;0")}  ({CctResult.Describe(a.Cct.Method)})");
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
                string abs = p.Quantity is { } q ? $"; {N(p.Photometric, "0.###")} {Photometer.UnitSymbol(q)} ({N(p.Radiometric, "0.####")} {Photometer.RadiometricUnitSymbol(q)})" : "";
                output.WriteLine(string.Create(Inv, $"  Photometry: LER {N(p.LerLumensPerWatt, "0.0")} lm/W over {p.BandFirstNm:0}–{p.BandLastNm:0} nm; S/P {N(p.SpRatio, "0.000")}{abs}"));
            }
            if (a.NonVisual is { } nv)
            {
                var mel = nv[0];
                string edi = mel.Edi is { } e ? $", EDI {N(e, "0.#")} {Photometer.UnitSymbol(Photometer.QuantityOf(a.Unit))}" : "";
                output.WriteLine($"  CIE S 026: melanopic DER {N(mel.Der, "0.000")} ({N(mel.EfficacyMilliwattsPerLumen, "0.0000")} mW/lm){edi}; DER S/M/L-cone, rhodopic {N(nv[1].Der, "0.000")} {N(nv[2].Der, "0.000")} {N(nv[3].Der, "0.000")} {N(nv[4].Der, "0.000")}");
            }
            if (a.Spectral is { } sd)
                output.WriteLine($"  Spectrum: peak {N(sd.PeakNm, "0.#")} nm, centroid {N(sd.CentroidNm, "0.#")} nm, FWHM {N(sd.FwhmNm, "0.#")} nm, dominant {N(sd.DominantNm, "0.#")} nm, purity {N(sd.Purity, "0.000")}");
            foreach (var w in a.Warnings) output.WriteLine($"  ! {w}");
        }
        output.WriteLine();
        output.WriteLine("CIE S 026 values are metrology, not medical or health advice.");
    }

    /// <summary>Writes one record as a JSON object (the <c>analyze</c> JSON contract).</summary>
    /// <param name="w">The JSON writer.</param>
    /// <param name="item">The outcome.</param>
    /// <param name="spec">The specification behind the verdict, for <c>verdict.target</c>; null to leave it out.</param>
    public static void WriteRecord(Utf8JsonWriter w, RecordOutcome item, Lumen.Conformance.PreparedSpec? spec = null)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(item);
        var rec = item.Record;
        w.WriteStartObject();
        w.WriteString("name", rec.Name);
        w.WriteString("source", rec.Source);
        w.WriteNumber("column", rec.Column);
        if (item.Record.Metadata.Count > 0)
        {
            w.WriteStartObject("metadata");
            foreach (var (key, value) in item.Record.Metadata) w.WriteString(key, value);
            w.WriteEndObject();
        }
        if (item.Assessment is not { } a)
        {
            w.Error(item.Error!);
            w.WriteEndObject();
            return;
        }
        w.WriteString("observer", ResultFields.ObserverLabel(a.Observer));
        w.WriteString("unit", SpectralUnits.Symbol(a.Unit));
        WriteXyz(w, "tristimulus", a.Tristimulus);
        if (a.AbsoluteTristimulus is { } abs) WriteXyz(w, "tristimulusAbsolute", abs);
        w.WriteStartObject("chromaticity");
        w.NumberOrNull("x", a.Chromaticity.SmallX); w.NumberOrNull("y", a.Chromaticity.SmallY);
        w.NumberOrNull("u", a.Chromaticity.U); w.NumberOrNull("v", a.Chromaticity.V);
        w.NumberOrNull("uPrime", a.Chromaticity.UPrime); w.NumberOrNull("vPrime", a.Chromaticity.VPrime);
        w.WriteEndObject();
        w.WriteStartObject("cct");
        w.NumberOrNull("kelvin", a.Cct.CctKelvin);
        w.NumberOrNull("duv", a.Cct.Duv);
        w.WriteString("method", CctResult.Describe(a.Cct.Method));
        w.WriteString("observer", "2");
        w.WriteEndObject();
        if (a.Cri is { } cri)
        {
            w.WriteStartObject("cri");
            w.NumberOrNull("ra", cri.Ra);
            w.WriteStartArray("r");
            foreach (var r in cri.R) w.NumberOrNullValue(r);
            w.WriteEndArray();
            w.NumberOrNull("r9", cri.R9);
            WriteReference(w, cri.Reference);
            w.NumberOrNull("dc", cri.Dc);
            w.WriteBoolean("dcValid", cri.DcValid);
            w.WriteString("method", "CIE 13.3-1995");
            w.WriteEndObject();
        }
        if (a.Fidelity is { } f)
        {
            w.WriteStartObject("fidelity");
            w.NumberOrNull("rf", f.Rf);
            w.NumberOrNull("rg", f.Rg);
            w.WriteStartArray("rfCes");
            foreach (var r in f.RfCes) w.NumberOrNullValue(r);
            w.WriteEndArray();
            w.WriteStartArray("hueBins");
            foreach (var b in f.HueBins)
            {
                w.WriteStartObject();
                w.WriteNumber("bin", b.Index);
                w.WriteNumber("samples", b.SampleCount);
                w.NumberOrNull("rf", b.Rf);
                w.NumberOrNull("rcs", b.Rcs * 100);
                w.NumberOrNull("rhs", b.Rhs);
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
            w.NumberOrNull("ler", ph.LerLumensPerWatt);
            w.NumberOrNull("spRatio", ph.SpRatio);
            w.WriteStartObject("lerBandNm");
            w.NumberOrNull("first", ph.BandFirstNm); w.NumberOrNull("last", ph.BandLastNm);
            w.WriteEndObject();
            if (ph.Quantity is { } q)
            {
                w.NumberOrNull(ResultFields.PhotometricName(q), ph.Photometric);
                w.NumberOrNull(ResultFields.ScotopicName(q), ph.Scotopic);
                w.NumberOrNull(ResultFields.RadiometricName(q), ph.Radiometric);
            }
            w.WriteEndObject();
        }
        if (a.NonVisual is { } nv)
        {
            w.WriteStartObject("nonVisual");
            foreach (var r in nv)
            {
                w.WriteStartObject(ResultFields.NonVisualName(r.Kind));
                w.NumberOrNull("efficacy", r.EfficacyMilliwattsPerLumen);
                w.NumberOrNull("der", r.Der);
                if (r.Irradiance is { } irr)
                {
                    var q = Photometer.QuantityOf(a.Unit);
                    w.NumberOrNull("irradiance", irr);
                    w.WriteString("irradianceUnit", Photometer.RadiometricUnitSymbol(q));
                    w.NumberOrNull("edi", r.Edi);
                    w.WriteString("ediUnit", Photometer.UnitSymbol(q));
                }
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }
        if (a.Spectral is { } sd)
        {
            w.WriteStartObject("spectral");
            w.NumberOrNull("peakNm", sd.PeakNm);
            w.NumberOrNull("centroidNm", sd.CentroidNm);
            w.NumberOrNull("fwhmNm", sd.FwhmNm);
            w.NumberOrNull("dominantNm", sd.DominantNm);
            w.NumberOrNull("purity", sd.Purity);
            w.WriteString("whitePoint", sd.WhitePoint);
            w.WriteEndObject();
        }
        if (item.Verdict is { } v) JsonVerdict.Write(w, v, spec, item);
        if (item.Uncertainty is { } u) JsonUncertainty.Write(w, u);
        w.StringArray("warnings", a.Warnings);
        WriteProvenance(w, a.Provenance);
        w.WriteEndObject();
    }

    /// <summary>Writes a <c>provenance</c> object.</summary>
    /// <param name="w">The JSON writer.</param>
    /// <param name="p">The provenance.</param>
    public static void WriteProvenance(Utf8JsonWriter w, Provenance p)
    {
        ArgumentNullException.ThrowIfNull(w);
        ArgumentNullException.ThrowIfNull(p);
        w.WriteStartObject("provenance");
        w.WriteStartObject("methods");
        foreach (var kv in p.Methods) w.WriteString(kv.Key, kv.Value);
        w.WriteEndObject();
        w.StringArray("standards", p.Standards);
        w.NumberOrNull("c2MetreKelvin", p.C2MetreKelvin);
        w.WriteStartObject("measuredRangeNm");
        w.NumberOrNull("first", p.MeasuredFirstNm); w.NumberOrNull("last", p.MeasuredLastNm);
        w.WriteEndObject();
        w.WriteStartObject("integration");
        w.WriteNumber("startNm", p.IntegrationStartNm); w.WriteNumber("endNm", p.IntegrationEndNm); w.WriteNumber("stepNm", p.IntegrationStepNm);
        w.WriteString("sampling", p.Sampling);
        w.WriteEndObject();
        w.WriteNumber("negativeSamples", p.NegativeSamples);
        if (p.InputLayout is not null) w.WriteString("inputLayout", p.InputLayout);
        w.WriteEndObject();
    }

    private static void WriteXyz(Utf8JsonWriter w, string name, Lumen.Colorimetry.Tristimulus t)
    {
        w.WriteStartObject(name);
        w.NumberOrNull("X", t.X); w.NumberOrNull("Y", t.Y); w.NumberOrNull("Z", t.Z);
        w.WriteEndObject();
    }

    private static void WriteReference(Utf8JsonWriter w, ReferenceIlluminant r)
    {
        w.WriteStartObject("reference");
        w.WriteString("type", r.Kind switch
        {
            ReferenceKind.Planckian => "planckian",
            ReferenceKind.CieDaylight => "daylight",
            _ => "blend",
        });
        w.NumberOrNull("cctKelvin", r.CctKelvin);
        w.NumberOrNull("daylightFraction", r.DaylightFraction);
        w.WriteString("description", r.Description);
        w.WriteEndObject();
    }
}
