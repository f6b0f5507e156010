using System.Text.Json;
using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Formats.Tests;

public class DelimitedReaderTests
{
    private static IReadOnlyList<InputRecord> Read(string text, string source = "in.csv") =>
        DelimitedSpectrumReader.Read(new StringReader(text), source, "in");

    private static string Rows(char d, string header = "") =>
        header + string.Join("\n", Enumerable.Range(0, 5).Select(i => $"{400 + 10 * i}{d}{1 + i}{d}{2 + i}")) + "\n";

    [Fact]
    public void Comma_file_with_header_names_spectra_from_header()
    {
        var r = Read(Rows(',', "nm,lampA,lampB\n"));
        Assert.Equal(2, r.Count);
        Assert.All(r, x => Assert.True(x.IsOk));
        Assert.Equal("lampA", r[0].Name);
        Assert.Equal(2, r[0].Column);
        Assert.Equal(5, r[1].Spectrum!.Count);
        Assert.Equal(6, r[1].Spectrum!.Values[4]);
    }

    [Fact]
    public void A_row_layout_header_too_short_to_be_recognised_is_named_in_the_error()
    {
        // Two wavelengths across the top are too few for a row-layout header, so the file is read as columns and the
        // first data row's ID is not a wavelength: the error says which layout was assumed and why.
        var r = Read("unit_id,380,381\nA1,1,2\n");
        Assert.All(r, x => Assert.Contains("read as columns", x.Error!.Message, StringComparison.Ordinal));
        Assert.Contains($"at least {RowSpectrumReader.MinimumWavelengths}", r[0].Error!.Message, StringComparison.Ordinal);
        Assert.Equal((2, 1), (r[0].Error!.Line, r[0].Error!.Column));
        // A column file with named spectra keeps the plain message.
        var named = Read("nm,lampA\n400,1\nx,2\n");
        Assert.DoesNotContain("read as columns", Assert.Single(named).Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void File_without_header_names_spectra_stem_hash_k()
    {
        var r = Read(Rows(','));
        Assert.Equal(["in#1", "in#2"], r.Select(x => x.Name));
    }

    [Fact]
    public void Semicolon_with_decimal_comma_is_detected()
    {
        var r = Read("wl;a\n400;1,5\n410;2,25\n420;3\n");
        Assert.True(r[0].IsOk);
        Assert.Equal(2.25, r[0].Spectrum!.Values[1]);
    }

    [Fact]
    public void Tab_delimited_CRLF_with_BOM_and_comments_reads()
    {
        var r = Read("\uFEFF# comment\r\nwl\tx\r\n400\t1\r\n# mid comment\r\n410\t2\r\n420\t3\r\n");
        Assert.True(r[0].IsOk);
        Assert.Equal("x", r[0].Name);
        Assert.Equal(3, r[0].Spectrum!.Count);
    }

    [Fact]
    public void Unit_directive_sets_the_unit()
    {
        var r = Read("# unit: W/m2/nm\nwl,x\n400,1\n410,2\n420,3\n");
        Assert.Equal(SpectralUnit.IrradianceWattsPerSquareMetreNm, r[0].Spectrum!.Unit);
    }

    [Fact]
    public void Empty_file_is_an_error_at_line_1()
    {
        var r = Read("");
        var e = Assert.Single(r).Error!;
        Assert.Equal(1, e.Line);
        Assert.Equal(1, e.Column);
        Assert.Contains("empty file", e.Message, StringComparison.Ordinal);
        Assert.StartsWith("in.csv:1:1:", e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Header_only_is_an_error_for_each_column_naming_the_next_line()
    {
        var r = Read("wl,a,b\n");
        Assert.Equal(2, r.Count);
        Assert.All(r, x => Assert.Contains("header only", x.Error!.Message, StringComparison.Ordinal));
        Assert.Equal(2, r[0].Error!.Line);
    }

    [Fact]
    public void Text_in_a_number_cell_spoils_only_its_column_and_names_line_and_column()
    {
        var r = Read("wl,good,bad\n400,1,1\n410,2,oops\n420,3,3\n");
        Assert.True(r[0].IsOk);
        var e = r[1].Error!;
        Assert.Equal(3, e.Line);
        Assert.Equal(3, e.Column);
        Assert.Contains("'oops' is not a number", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void NaN_cell_is_rejected_not_read_as_a_number()
    {
        var r = Read("wl,a\n400,1\n410,NaN\n420,3\n");
        Assert.Equal(3, r[0].Error!.Line);
        Assert.Equal(2, r[0].Error!.Column);
    }

    [Fact]
    public void Ragged_short_row_spoils_the_missing_column()
    {
        var r = Read("wl,a,b\n400,1,1\n410,2\n420,3,3\n");
        Assert.True(r[0].IsOk);
        Assert.Equal(3, r[1].Error!.Line);
        Assert.Contains("ragged", r[1].Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Ragged_long_row_is_a_file_error_reported_for_every_column()
    {
        var r = Read("wl,a\n400,1\n410,2,9\n420,3\n");
        var e = Assert.Single(r).Error!;
        Assert.Equal(3, e.Line);
        Assert.Equal(3, e.Column);
    }

    [Fact]
    public void Descending_wavelengths_are_an_error_naming_the_line()
    {
        var r = Read("wl,a,b\n400,1,1\n410,2,2\n405,3,3\n");
        Assert.Equal(2, r.Count);
        Assert.All(r, x => Assert.Equal(4, x.Error!.Line));
        Assert.Contains("ascending", r[0].Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Duplicate_wavelength_is_an_error()
    {
        var r = Read("wl,a\n400,1\n400,2\n410,3\n");
        Assert.Contains("duplicate", r[0].Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Too_few_points_is_an_error_record_not_an_exception()
    {
        var r = Read("wl,a\n400,1\n410,2\n");
        Assert.Contains("at least 3", r[0].Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_file_is_an_error_record()
    {
        var r = DelimitedSpectrumReader.ReadFile("/nonexistent/file.csv");
        Assert.Contains("not found", Assert.Single(r).Error!.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_writer_emits_the_documented_fields_and_error_records()
    {
        var recs = Read("wl,lamp,bad\n" + string.Join("\n", Enumerable.Range(380, 401).Select(w => $"{w},1,{(w == 500 ? "x" : "1")}")));
        var items = recs.Select(r => RecordOutcome.Of(r, AssessmentOptions.Default)).ToList();
        var sw = new StringWriter();
        AnalysisWriter.Write(items, OutputFormat.Json, sw);
        using var doc = JsonDocument.Parse(sw.ToString());
        var a = doc.RootElement[0];
        foreach (var f in new[] { "name", "source", "observer", "tristimulus", "chromaticity", "cct", "warnings", "provenance" })
            Assert.True(a.TryGetProperty(f, out _), f);
        Assert.Equal("2", a.GetProperty("observer").GetString());
        foreach (var f in new[] { "x", "y", "u", "v", "uPrime", "vPrime" }) Assert.True(a.GetProperty("chromaticity").TryGetProperty(f, out _));
        foreach (var f in new[] { "kelvin", "duv", "method" }) Assert.True(a.GetProperty("cct").TryGetProperty(f, out _));
        Assert.Equal(0.014388, a.GetProperty("provenance").GetProperty("c2MetreKelvin").GetDouble());
        // Equal-energy spectrum: x = y = 1/3 by definition of the CMF normalisation (CIE 15), within table rounding.
        Assert.Equal(1.0 / 3, a.GetProperty("chromaticity").GetProperty("x").GetDouble(), 3);
        var err = doc.RootElement[1].GetProperty("error");
        Assert.Equal(122, err.GetProperty("line").GetInt32());
        Assert.Equal(3, err.GetProperty("column").GetInt32());
    }

    [Fact]
    public void Csv_writer_writes_one_row_per_record_with_documented_columns()
    {
        var recs = Read("wl,a,b\n400,1,1\n410,2,x\n420,3,3\n");
        var items = recs.Select(r => RecordOutcome.Of(r, AssessmentOptions.Default)).ToList();
        var sw = new StringWriter();
        AnalysisWriter.Write(items, OutputFormat.Csv, sw);
        var lines = sw.ToString().TrimEnd().Split('\n');
        Assert.Equal(3, lines.Length);
        Assert.Equal(string.Join(',', AnalysisColumns.Csv.Names), lines[0].TrimEnd('\r'));
        Assert.Equal(AnalysisColumns.Csv.Columns.Count, Csv.Split(lines[2].TrimEnd('\r')).Length);
        Assert.Equal(AnalysisColumns.Csv.Columns.Count, Csv.Split(lines[1].TrimEnd('\r')).Length);
        Assert.Contains(",error,", lines[2], StringComparison.Ordinal);
    }

    [Fact]
    public void Csv_has_flat_rendition_columns_filled_for_results()
    {
        var recs = Read("wl,eq\n" + string.Join("\n", Enumerable.Range(380, 401).Select(w => $"{w},1")));
        var items = recs.Select(r => RecordOutcome.Of(r, AssessmentOptions.Default)).ToList();
        var sw = new StringWriter();
        AnalysisWriter.Write(items, OutputFormat.Csv, sw);
        var lines = sw.ToString().TrimEnd().Split('\n');
        var header = Csv.Split(lines[0].TrimEnd('\r'));
        var row = Csv.Split(lines[1].TrimEnd('\r'));
        Assert.Equal(header.Length, row.Length);
        foreach (var c in new[] { "cri.ra", "cri.r1", "cri.r9", "cri.r14", "fidelity.rf", "fidelity.rg", "fidelity.hueBin1.rf", "fidelity.hueBin16.rcs", "fidelity.hueBin8.rhs" })
        {
            int i = Array.IndexOf(header, c);
            Assert.True(i >= 0, c);
            Assert.True(double.TryParse(row[i], System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _), c);
        }
    }

    [Fact]
    public void Csv_quotes_fields_with_commas_and_quotes()
    {
        Assert.Equal("\"a,\"\"b\"\"\"", Csv.Quote("a,\"b\""));
    }
}
