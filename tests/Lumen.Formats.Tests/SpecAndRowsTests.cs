using System.Text;
using System.Text.Json;
using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Conformance;

namespace Lumen.Formats.Tests;

public class SpecReaderTests
{
    private static ToleranceSpec? Read(string json, out IReadOnlyList<ReadDiagnostic> errors) =>
        SpecReader.Read(Encoding.UTF8.GetBytes(json), "spec.json", out errors);

    [Fact]
    public void Example_spec_in_the_issue_shape_reads()
    {
        var spec = Read("""
            {"name": "DL", "target": {"nominalCct": 3000}, "chromaticity": {"ellipseSteps": 3},
             "limits": [{"field": "cri.ra", "min": 90}, {"field": "cri.r9", "min": 50}, {"field": "cct.duv", "max": 0.006}]}
            """, out var errors);
        Assert.Empty(errors);
        Assert.Equal(TargetKind.NominalCct, spec!.Target!.Kind);
        Assert.Equal(ToleranceKind.EllipseSteps, spec.Tolerance.Kind);
        Assert.Equal(3, spec.Limits.Count);
        Assert.Equal(2, spec.Limits[0].Line);
    }

    [Fact]
    public void Project_client_and_preparer_are_optional_texts_for_the_report()
    {
        var spec = Read("""{"name": "n", "project": "Atrium", "client": "Estates", "preparedBy": "QA", "limits": [{"field": "cri.ra", "min": 80}]}""", out var errors);
        Assert.Empty(errors);
        Assert.Equal(("Atrium", "Estates", "QA"), (spec!.Project, spec.Client, spec.PreparedBy));
        Assert.Null(Read("""{"project": 7, "limits": [{"field": "cri.ra", "min": 80}]}""", out errors));
        Assert.Contains(errors, e => e.Message.Contains("project must be a text", StringComparison.Ordinal) && e.Line == 1);
    }

    [Theory]
    [InlineData("""{"target": {"x": 0.4338, "y": 0.4030}, "chromaticity": {"uPrimeVPrimeRadius": 0.003}}""", ToleranceKind.UPrimeVPrimeRadius)]
    [InlineData("""{"target": {"cct": 3000, "duv": 0.0}, "chromaticity": {"ellipseSteps": 5}}""", ToleranceKind.EllipseSteps)]
    [InlineData("""{"target": {"nominalCct": 4000, "edition": "2008"}, "chromaticity": {"quadrangle": true}}""", ToleranceKind.Quadrangle)]
    public void Every_target_and_tolerance_form_reads(string json, ToleranceKind kind)
    {
        var spec = Read(json, out var errors);
        Assert.Empty(errors);
        Assert.Equal(kind, spec!.Tolerance.Kind);
    }

    [Theory]
    [InlineData("cri.r[8]", "write 'cri.r9'")]
    [InlineData("cri.r[9]", "this was R10); write 'cri.r10'")]
    [InlineData("fidelity.hueBins[0].rcs", "write 'fidelity.hueBin1.rcs'")]
    [InlineData("fidelity.rfCes[4]", "write 'fidelity.rfCes5'")]
    public void Index_syntax_is_rejected_naming_the_field_it_meant(string field, string expected)
    {
        // The trap found in review: cri.r[9] was accepted and checked R10.
        Read($"{{\"name\": \"x\", \"limits\": [{{\"field\": \"{field}\", \"min\": 50}}]}}", out var errors);
        var e = Assert.Single(errors);
        Assert.Contains(expected, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_column_for_an_unknown_field_is_refused_when_the_schema_is_built()
    {
        // Writers resolve each field's reader once; a misspelt path fails at once, not as an empty column.
        Assert.Throws<ArgumentException>(() => Lumen.Formats.AnalysisColumns.Field("cri.r[9]"));
        Assert.Equal("cri.r9", Lumen.Formats.AnalysisColumns.Field("cri.r9").Name);
    }

    [Fact]
    public void Every_field_numbered_by_the_trade_resolves_from_1()
    {
        for (int i = 1; i <= 14; i++) Assert.True(Lumen.Analysis.ResultFields.IsKnown($"cri.r{i}"), $"cri.r{i}");
        for (int j = 1; j <= 16; j++) Assert.True(Lumen.Analysis.ResultFields.IsKnown($"fidelity.hueBin{j}.rcs"));
        Assert.False(Lumen.Analysis.ResultFields.IsKnown("cri.r0"));
        Assert.False(Lumen.Analysis.ResultFields.IsKnown("cri.r15"));
        Assert.DoesNotContain(Lumen.Analysis.ResultFields.Paths, p => p.Contains('[', StringComparison.Ordinal));
    }

    [Fact]
    public void Deprecated_duvRadius_key_still_reads_with_a_warning_naming_the_new_key()
    {
        var spec = Read("{\n  \"target\": {\"x\": 0.4338, \"y\": 0.4030},\n  \"chromaticity\": {\"duvRadius\": 0.003}\n}", out var errors);
        Assert.Empty(errors);
        Assert.Equal(ToleranceKind.UPrimeVPrimeRadius, spec!.Tolerance.Kind);
        var w = Assert.Single(spec.Warnings);
        Assert.Contains("uPrimeVPrimeRadius", w, StringComparison.Ordinal);
        Assert.Contains(":3:", w, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_field_is_rejected_naming_its_line()
    {
        Read("{\n  \"name\": \"x\",\n  \"limits\": [\n    {\"field\": \"cri.ra\", \"min\": 80},\n    {\"field\": \"cri.sparkle\", \"min\": 1}\n  ]\n}", out var errors);
        var e = Assert.Single(errors);
        Assert.Equal(5, e.Line);
        Assert.Contains("unknown field 'cri.sparkle'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Impossible_limit_is_rejected_naming_its_line()
    {
        Read("{\n\"limits\": [\n {\"field\": \"cri.ra\", \"min\": 90, \"max\": 80}\n]}", out var errors);
        var e = Assert.Single(errors);
        Assert.Equal(3, e.Line);
        Assert.Contains("impossible", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_top_level_key_quadrangle_without_category_and_bad_json_are_errors()
    {
        Read("{\"nmae\": \"typo\"}", out var e1);
        Assert.Contains("unknown field 'nmae'", Assert.Single(e1).Message, StringComparison.Ordinal);
        Read("{\"target\": {\"x\": 0.4, \"y\": 0.4}, \"chromaticity\": {\"quadrangle\": true}}", out var e2);
        Assert.Contains("nominalCct", Assert.Single(e2).Message, StringComparison.Ordinal);
        Read("{\n\"name\": \"x\",,\n}", out var e3);
        Assert.Equal(2, Assert.Single(e3).Line);
        Read("{\"target\": {\"nominalCct\": 3333}}", out var e4);
        Assert.Contains("no ANSI C78.377 category", Assert.Single(e4).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Bundled_example_spec_reads()
    {
        var root = new DirectoryInfo(AppContext.BaseDirectory);
        while (!File.Exists(Path.Combine(root.FullName, "Lumen.sln"))) root = root.Parent!;
        var spec = SpecReader.ReadFile(Path.Combine(root.FullName, "examples", "batch", "spec-dl30.json"), out var errors);
        Assert.Empty(errors);
        Assert.Equal(4, spec!.Limits.Count);
    }
}

public class AssessmentFieldTests
{
    [Fact]
    public void Every_field_path_exists_in_the_analyze_JSON_with_the_same_value()
    {
        var s = CieTables.FluorescentIlluminants5Nm.ToSpectrum("FL2").WithUnit(Lumen.Spectra.SpectralUnit.IrradianceWattsPerSquareMetreNm);
        var a = Assessor.Assess(s);
        var sw = new StringWriter();
        AnalysisWriter.Write([RecordOutcome.Of(new SpectrumRecord("t", 2, "FL2", s), AssessmentOptions.Default)], OutputFormat.Json, sw);
        using var doc = JsonDocument.Parse(sw.ToString());
        var root = doc.RootElement[0];
        int checkedCount = 0;
        foreach (var path in ResultFields.Paths)
        {
            double? expected = ResultFields.Get(a, path);
            var el = Navigate(root, path);
            if (expected is null) { Assert.True(el is null || el.Value.ValueKind == JsonValueKind.Null, path); continue; }
            Assert.True(el is not null, $"{path} missing from JSON");
            Assert.Equal(expected.Value, el!.Value.GetDouble(), 9);
            checkedCount++;
        }
        Assert.True(checkedCount > 150);
    }

    // The JSON keeps arrays (cri.r, fidelity.rfCes, fidelity.hueBins); the 1-based field names map onto them.
    private static JsonElement? Navigate(JsonElement e, string path)
    {
        var m = System.Text.RegularExpressions.Regex.Match(path, @"^(cri\.r|fidelity\.rfCes|fidelity\.hueBin)(\d+)(.*)$");
        if (m.Success)
        {
            int k = int.Parse(m.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture) - 1;
            string arrayPath = m.Groups[1].Value == "fidelity.hueBin" ? "fidelity.hueBins" : m.Groups[1].Value;
            var arr = Navigate(e, arrayPath);
            if (arr is null) return null;
            var item = arr.Value[k];
            return m.Groups[3].Value.Length == 0 ? item : Navigate(item, m.Groups[3].Value.TrimStart('.'));
        }
        foreach (var part in path.Split('.'))
        {
            if (!e.TryGetProperty(part, out var next)) return null;
            e = next;
        }
        return e;
    }
}

public class RowReaderTests
{
    private static string Header(string ids) => ids + string.Join(",", Enumerable.Range(0, 81).Select(i => 380 + 5 * i));

    private static string Row(string ids, Func<int, string>? cell = null) =>
        ids + string.Join(",", Enumerable.Range(0, 81).Select(i => cell?.Invoke(i) ?? "1"));

    [Fact]
    public void Layout_is_detected_from_the_first_row()
    {
        Assert.Equal(TableLayout.Rows, RowSpectrumReader.DetectLayout(Header("id,lot,")));
        Assert.Equal(TableLayout.Rows, RowSpectrumReader.DetectLayout(Header("")));
        Assert.Equal(TableLayout.Columns, RowSpectrumReader.DetectLayout("wavelength_nm,a,b"));
        Assert.Equal(TableLayout.Columns, RowSpectrumReader.DetectLayout("380,0.1,0.2"));
    }

    [Fact]
    public void Every_row_becomes_one_record_with_id_and_line_or_an_error()
    {
        var text = "# unit: W/m2/nm\n" + Header("id,lot,") + "\n" + Row("U1,A,") + "\n" + Row("U2,A,", i => i == 5 ? "x" : "1") + "\n"
            + Row("U3,B,") + ",9\n" + Row("U4,A,", i => i == 7 ? "NaN" : "1") + "\n" + Row("U5,A,") + "\n";
        var recs = RowSpectrumReader.Read(new StringReader(text), "rows.csv", "rows").ToList();
        Assert.Equal(5, recs.Count);
        Assert.Equal(["U1", "U2", "U3", "U4", "U5"], recs.Select(r => r.Name));
        Assert.True(recs[0].IsOk);
        Assert.Equal(3, recs[0].Line);
        Assert.Equal(Lumen.Spectra.SpectralUnit.IrradianceWattsPerSquareMetreNm, recs[0].Spectrum!.Unit);
        Assert.Equal((4, 8), (recs[1].Error!.Line, recs[1].Error!.Column));
        Assert.Contains("ragged", recs[2].Error!.Message, StringComparison.Ordinal);
        Assert.Equal((6, 10), (recs[3].Error!.Line, recs[3].Error!.Column));
        Assert.True(recs[4].IsOk);
    }

    [Fact]
    public void A_deferred_utf8_row_is_parsed_once()
    {
        // Its bytes wait in the reader's buffer, which is read into again once its rows are parsed (issue 16): a second
        // parse would read another row's bytes, so it is refused. The first parse equals the streamed record.
        var text = Header("id,") + "\n" + Row("U1,") + "\n" + Row("U2,", i => i == 3 ? "2" : "1") + "\n";
        using var lines = LineReader.Open(new MemoryStream(Encoding.UTF8.GetBytes(text)));
        var items = RowSpectrumReader.ReadDeferred(lines, "rows.csv", "rows").ToList();
        var streamed = RowSpectrumReader.Read(new StringReader(text), "rows.csv", "rows").ToList();
        Assert.Equal(2, items.Count);
        var second = items[1]();
        Assert.Equal(streamed[1].Spectrum!.Values.ToArray(), second.Spectrum!.Values.ToArray());
        Assert.Equal("U2", second.Name);
        var ex = Assert.Throws<InvalidOperationException>(() => items[1]());
        Assert.Contains("line 3", ex.Message, StringComparison.Ordinal);
        Assert.Equal("U1", items[0]().Name);
    }

    [Fact]
    public void A_header_written_longest_wavelength_first_is_named_as_descending()
    {
        // Read as columns, such a file gave one error per "column" naming an ID cell as a bad wavelength; it is a row
        // file whose header descends, and the error says so at the header cell that breaks the ascending order.
        string header = "id," + string.Join(",", Enumerable.Range(0, 81).Select(i => 780 - 5 * i));
        Assert.Equal(TableLayout.Rows, RowSpectrumReader.DetectLayout(header));
        // Serial numbers that descend but are no plausible grid (none in 380–780 nm) keep a column file a column file.
        Assert.Equal(TableLayout.Columns, RowSpectrumReader.DetectLayout("wavelength_nm," + string.Join(",", Enumerable.Range(0, 12).Select(i => 1012 - i))));
        var text = header + "\n" + Row("U1,") + "\n" + Row("U2,") + "\n";
        var streamed = Assert.Single(RowSpectrumReader.Read(new StringReader(text), "desc.csv", "desc"));
        using var lines = LineReader.Open(new MemoryStream(Encoding.UTF8.GetBytes(text)));
        var deferred = Assert.Single(RowSpectrumReader.ReadDeferred(lines, "desc.csv", "desc"))();
        foreach (var record in new[] { streamed, deferred })
        {
            Assert.Equal((1, 3), (record.Error!.Line, record.Error!.Column));
            Assert.Contains("wavelengths descend (775 nm follows 780 nm)", record.Error!.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Header_without_wavelengths_is_one_error()
    {
        var recs = RowSpectrumReader.Read(new StringReader("id,a,b\n1,2,3\n"), "x.csv", "x").ToList();
        Assert.Contains("wavelength header", Assert.Single(recs).Error!.Message, StringComparison.Ordinal);
    }
}

/// <summary>Property checks: hostile input never crashes a reader, and nothing is lost.</summary>
public class ReaderFuzzTests
{
    [Fact]
    public void Random_garbage_never_throws_and_every_column_gets_one_record()
    {
        var rng = new Random(2026);
        string[] atoms = ["380", "400.5", "1e3", "-2", "NaN", "Infinity", "x", "", "1,5", "\"q\"", "#", "∞", "0", "9e999", " ", "\t"];
        for (int trial = 0; trial < 500; trial++)
        {
            int rows = rng.Next(0, 8), cols = rng.Next(1, 5);
            char d = ",;\t"[rng.Next(3)];
            var lines = Enumerable.Range(0, rows).Select(_ => string.Join(d, Enumerable.Range(0, cols + rng.Next(0, 2)).Select(_ => atoms[rng.Next(atoms.Length)])));
            var text = string.Join(rng.Next(2) == 0 ? "\n" : "\r\n", lines);
            var recs = DelimitedSpectrumReader.Read(new StringReader(text), "fuzz.csv", "fuzz");
            Assert.NotEmpty(recs);
            Assert.All(recs, r => Assert.True(r.Spectrum is not null ^ r.Error is not null));
            var rowRecs = RowSpectrumReader.Read(new StringReader(text), "fuzz.csv", "fuzz").ToList();
            Assert.All(rowRecs, r => Assert.True(r.Spectrum is not null ^ r.Error is not null));
        }
    }

    [Fact]
    public void Mutated_specifications_never_throw_and_either_read_or_name_a_line()
    {
        var seed = """{"name": "x", "target": {"nominalCct": 3000}, "chromaticity": {"ellipseSteps": 3}, "limits": [{"field": "cri.ra", "min": 80}, {"field": "cct.duv", "min": -0.006, "max": 0.006}]}"""u8.ToArray();
        var rng = new Random(7);
        byte[] atoms = [.. "{}[]\",:-.0123456789e "u8, 0xFF, 0xC3, 0x00];
        for (int trial = 0; trial < 3000; trial++)
        {
            var b = new List<byte>(seed);
            for (int k = rng.Next(1, 5); k > 0; k--)
            {
                int at = rng.Next(b.Count + 1);
                switch (rng.Next(3))
                {
                    case 0: b.Insert(at, atoms[rng.Next(atoms.Length)]); break;
                    case 1 when at < b.Count: b.RemoveAt(at); break;
                    default: if (at < b.Count) b[at] = atoms[rng.Next(atoms.Length)]; break;
                }
            }
            var spec = SpecReader.Read(b.ToArray(), "fuzz.json", out var errors);
            Assert.True(spec is not null ^ errors.Count > 0);
            Assert.All(errors, e => Assert.True(e.Line >= 1 && e.Column >= 1, e.ToString()));
        }
    }
}
