using System.Text;
using Lumen.Analysis;
using Lumen.Formats;
using Lumen.Spectra;

namespace Lumen.Formats.Tests;

/// <summary>IES TM-27 spectral data XML in and out (issue 15).</summary>
public class Tm27Tests
{
    private static string Example => Path.Combine(AppContext.BaseDirectory, "data", "tm27-example.spdx");

    private static IReadOnlyList<InputRecord> ReadText(string xml) => Tm27.Read(new StringReader(xml), "t.spdx", "t");

    [Fact]
    public void The_example_reads_every_header_field_and_value()
    {
        // tests/Lumen.Formats.Tests/data/tm27-example.spdx (an invented spectrum in the TM-27-14 element names).
        var records = SpectrumFiles.Read(Example).ToList();
        var s = Assert.IsType<SpectrumRecord>(Assert.Single(records));
        Assert.Equal("synthetic phosphor-converted white LED, 3000 K class", s.Name);
        Assert.Equal("Invented Example Works", s.MetadataValue("manufacturer"));
        Assert.Equal("EX-3000-01", s.MetadataValue("catalogNumber"));
        Assert.Equal("00000000-0000-4000-8000-000000000001", s.MetadataValue("uniqueIdentifier"));
        Assert.Equal("2026-12-02", s.MetadataValue("reportDate"));
        Assert.Equal("relative", s.MetadataValue("spectralQuantity"));
        Assert.Equal("5", s.MetadataValue("bandwidthFWHM"));
        Assert.Equal("false", s.MetadataValue("bandwidthCorrected"));
        Assert.Equal(380, s.Spectrum.FirstNm);
        Assert.Equal(0.02219, s.Spectrum.Values[0]);
        Assert.Equal(0.98573, s.Spectrum.Values[14]); // 450 nm in the file
        Assert.Equal(SpectralUnit.Relative, s.Spectrum.Unit);
        Assert.Contains("IES TM-27", s.Spectrum.Origin.Layout, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_then_read_keeps_every_header_field_and_every_value()
    {
        var original = Assert.IsType<SpectrumRecord>(SpectrumFiles.Read(Example).Single());
        var sw = new StringWriter();
        Tm27.Write(sw, original.Spectrum, original.Metadata);
        var back = Assert.IsType<SpectrumRecord>(Assert.Single(ReadText(sw.ToString())));
        Assert.Equal(original.Metadata, back.Metadata);
        Assert.Equal(original.Spectrum.WavelengthsNm.ToArray(), back.Spectrum.WavelengthsNm.ToArray());
        Assert.Equal(original.Spectrum.Values.ToArray(), back.Spectrum.Values.ToArray()); // "R" round-trips every double
        // An absolute spectrum keeps its unit through the spectral quantity.
        var abs = new Spectrum([400.0, 500, 600, 700], [0.1, 0.2, 0.3, 1e-7 / 3], SpectralUnit.IrradianceWattsPerSquareMetreNm, "abs", SpectrumOrigin.Generated("test"));
        var sw2 = new StringWriter();
        Tm27.Write(sw2, abs);
        var b2 = Assert.IsType<SpectrumRecord>(Assert.Single(ReadText(sw2.ToString())));
        Assert.Equal(SpectralUnit.IrradianceWattsPerSquareMetreNm, b2.Spectrum.Unit);
        Assert.Equal(abs.Values.ToArray(), b2.Spectrum.Values.ToArray());
    }

    [Fact]
    public void A_doctype_or_external_entity_is_refused_and_nothing_is_fetched()
    {
        var secret = Path.Combine(Path.GetTempPath(), $"lumen-secret-{Guid.NewGuid():N}.txt");
        File.WriteAllText(secret, "123");
        try
        {
            string xml = $"<?xml version=\"1.0\"?>\n<!DOCTYPE IESTM2714 [<!ENTITY x SYSTEM \"file://{secret}\">]>\n<IESTM2714 xmlns=\"iestm2714\"><SpectralDistribution><SpectralData wavelength=\"400\">&x;</SpectralData></SpectralDistribution></IESTM2714>";
            var e = Assert.IsType<ErrorRecord>(Assert.Single(ReadText(xml)));
            Assert.Contains("DOCTYPE", e.Error.Message, StringComparison.Ordinal);
            Assert.Equal(2, e.Error.Line);
            // A billion-laughs style internal entity is refused the same way.
            var laughs = "<?xml version=\"1.0\"?><!DOCTYPE r [<!ENTITY a \"aaaaaaaaaa\"><!ENTITY b \"&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;\">]><IESTM2714>&b;</IESTM2714>";
            Assert.IsType<ErrorRecord>(Assert.Single(ReadText(laughs)));
        }
        finally { File.Delete(secret); }
    }

    [Fact]
    public void Malformed_xml_names_line_and_position()
    {
        var e = Assert.IsType<ErrorRecord>(Assert.Single(ReadText("<?xml version=\"1.0\"?>\n<IESTM2714>\n  <Header><Manufacturer>x</Manufactur></Header>\n</IESTM2714>")));
        Assert.Equal(3, e.Error.Line);
        Assert.True(e.Error.Column > 1);
        Assert.Contains("malformed", e.Error.Message, StringComparison.Ordinal);
        var bad = Assert.IsType<ErrorRecord>(Assert.Single(ReadText("<IESTM2714><SpectralDistribution>\n<SpectralData wavelength=\"400\">1</SpectralData>\n<SpectralData wavelength=\"410\">n/a</SpectralData>\n<SpectralData wavelength=\"420\">1</SpectralData></SpectralDistribution></IESTM2714>")));
        Assert.Equal(3, bad.Error.Line);
        Assert.Contains("'n/a' is not a number", bad.Error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_million_points_read_within_a_memory_bound()
    {
        // 10⁶ data points (0.02 nm apart; a spectrum may have steps down to 0.01 nm): the reader keeps two lists of doubles and
        // streams the XML (the text itself is held by the test, not counted).
        var sb = new StringBuilder("<IESTM2714 xmlns=\"iestm2714\"><SpectralDistribution><SpectralQuantity>relative</SpectralQuantity>\n");
        for (int i = 0; i < 1_000_000; i++) sb.Append("<SpectralData wavelength=\"").Append((380 + i * 0.02).ToString("R", System.Globalization.CultureInfo.InvariantCulture)).Append("\">1</SpectralData>\n");
        sb.Append("</SpectralDistribution></IESTM2714>\n");
        var text = sb.ToString();
        sb.Clear();
        long held = GC.GetTotalMemory(forceFullCollection: true);
        long before = GC.GetAllocatedBytesForCurrentThread();
        var r = Assert.IsType<SpectrumRecord>(Assert.Single(Tm27.Read(new StringReader(text), "big.spdx", "big")));
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        long retained = GC.GetTotalMemory(forceFullCollection: true) - held;
        Assert.Equal(1_000_000, r.Spectrum.Count);
        // Retained: the spectrum's two arrays of 10⁶ doubles (16 MB) and little else. Passing through: the XML reader's
        // short-lived strings, under 600 bytes a point.
        Assert.True(retained < 64_000_000, $"retained {retained / 1e6:0} MB");
        Assert.True(allocated < 600_000_000, $"allocated {allocated / 1e6:0} MB");
    }

    [Fact]
    public void Content_decides_not_the_extension()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-tm27-{Guid.NewGuid():N}.txt");
        try
        {
            File.Copy(Example, path);
            Assert.IsType<SpectrumRecord>(Assert.Single(SpectrumFiles.Read(path)));
        }
        finally { File.Delete(path); }
    }
}
