using System.Globalization;
using System.Text;
using System.Xml;
using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>
/// IES TM-27 spectral data XML (<c>.spdx</c>; TM-27-14 and -20): read and write. Element names as the standard defines
/// them, recalled from memory (root <c>IESTM2714</c> in namespace <c>iestm2714</c>; <c>Header</c> with Manufacturer,
/// CatalogNumber, Description, DocumentCreator, UniqueIdentifier, MeasurementEquipment, Laboratory, ReportNumber,
/// ReportDate, DocumentCreationDate, Comments; <c>SpectralDistribution</c> with SpectralQuantity, BandwidthFWHM,
/// BandwidthCorrected and <c>SpectralData wavelength="…"</c> values). No schema file is at hand here, so output is
/// checked by reading it back, not by validation against the standard's XSD.
/// </summary>
/// <remarks>Security: DTD processing is prohibited (a DOCTYPE is an error, so no entity can expand or be fetched), no
/// resolver is set, and a document may hold at most <see cref="MaxCharacters"/> characters. Malformed XML is an error
/// with its line and position. The header fields become the record's metadata (camelCase keys such as
/// <c>catalogNumber</c>); the spectral quantity sets the unit.</remarks>
public static class Tm27
{
    /// <summary>Largest document read, characters (about 64 MB: some 10⁶ data points).</summary>
    public const long MaxCharacters = 64L * 1024 * 1024;

    /// <summary>The header fields, in the order they are written.</summary>
    public static IReadOnlyList<string> HeaderFields { get; } =
        ["Manufacturer", "CatalogNumber", "Description", "DocumentCreator", "UniqueIdentifier", "MeasurementEquipment", "Laboratory", "ReportNumber", "ReportDate", "DocumentCreationDate", "Comments"];

    /// <summary>The namespace of TM-27-14 documents.</summary>
    public const string Namespace = "iestm2714";

    /// <summary>True when the text starts like TM-27 XML (an XML declaration or element whose root is IESTM27…): content
    /// decides, not the extension.</summary>
    /// <param name="firstLine">The first non-blank line.</param>
    /// <returns>Whether to read it as TM-27.</returns>
    public static bool Looks(string firstLine)
    {
        ArgumentNullException.ThrowIfNull(firstLine);
        var t = firstLine.TrimStart('\uFEFF').TrimStart();
        return t.StartsWith("<?xml", StringComparison.Ordinal) || t.StartsWith("<IESTM27", StringComparison.Ordinal) || t.StartsWith("<!--", StringComparison.Ordinal) || t.StartsWith("<!DOCTYPE", StringComparison.OrdinalIgnoreCase);
    }

    private static string Camel(string name) => char.ToLowerInvariant(name[0]) + name[1..];

    /// <summary>Reads the spectra of a TM-27 document.</summary>
    /// <param name="reader">The text.</param>
    /// <param name="source">Source label (path).</param>
    /// <param name="stem">Name when the header has no description or catalog number.</param>
    /// <returns>One record per SpectralDistribution, or one error record naming line and position.</returns>
    public static IReadOnlyList<InputRecord> Read(TextReader reader, string source, string stem)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var settings = new XmlReaderSettings
        {
            DtdProcessing = DtdProcessing.Prohibit,
            XmlResolver = null,
            MaxCharactersInDocument = MaxCharacters,
            MaxCharactersFromEntities = 0,
            IgnoreComments = true,
            IgnoreProcessingInstructions = true,
            IgnoreWhitespace = true,
        };
        var header = new List<KeyValuePair<string, string>>();
        var records = new List<InputRecord>();
        string? version = null;
        IXmlLineInfo? where = null;
        try
        {
            using var xml = XmlReader.Create(new LineText(reader.ReadLine, RefuseDoctype), settings);
            var info = (IXmlLineInfo)xml;
            where = info;
            bool root = false;
            while (xml.Read())
            {
                if (xml.NodeType != XmlNodeType.Element) continue;
                if (!root)
                {
                    root = true;
                    if (!xml.LocalName.StartsWith("IESTM27", StringComparison.Ordinal))
                        return [Error(source, info, $"root element <{xml.LocalName}> is not an IES TM-27 document (expected <IESTM2714>)")];
                    version = xml.GetAttribute("version");
                    continue;
                }
                if (xml.LocalName == "Header") ReadHeader(xml.ReadSubtree(), header);
                else if (xml.LocalName == "SpectralDistribution")
                {
                    int line = info.LineNumber;
                    records.Add(ReadDistribution(xml.ReadSubtree(), info, source, stem, header, version, line, records.Count + 1));
                }
            }
            if (!root) return [ErrorRecord.ForFile(source, "empty XML document; expected an IES TM-27 <IESTM2714> document")];
        }
        catch (XmlException ex)
        {
            string why = ex.Message.Contains("DTD", StringComparison.OrdinalIgnoreCase) ? DoctypeMessage : ex.Message;
            int line = ex.LineNumber > 0 ? ex.LineNumber : where?.LineNumber ?? 0, position = ex.LineNumber > 0 ? ex.LinePosition : where?.LinePosition ?? 0;
            return [new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, line, position, $"malformed IES TM-27 XML: {why}")) { Line = line }];
        }
        if (records.Count == 0) return [ErrorRecord.ForFile(source, "IES TM-27 document has no <SpectralDistribution>")];
        return records;
    }

    private const string DoctypeMessage = "a DOCTYPE (DTD) is not allowed in spectral data: Lumen never expands entities or fetches anything a file points to";

    /// <summary>Stops at a DOCTYPE with its line and column (the XML reader, which prohibits DTDs too, cannot say where it was).</summary>
    private static void RefuseDoctype(string line, int number)
    {
        int d = line.IndexOf("<!DOCTYPE", StringComparison.Ordinal);
        if (d >= 0) throw new XmlException(DoctypeMessage, null, number, d + 1);
    }

    private static ErrorRecord Error(string source, IXmlLineInfo info, string message) =>
        new(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, info.LineNumber, info.LinePosition, message)) { Line = info.LineNumber };

    private static void ReadHeader(XmlReader xml, List<KeyValuePair<string, string>> header)
    {
        using (xml)
        {
            xml.Read();
            while (!xml.EOF)
            {
                if (xml.NodeType != XmlNodeType.Element || xml.Depth != 1) { xml.Read(); continue; }
                string name = xml.LocalName;
                header.Add(new(Camel(name), xml.ReadElementContentAsString().Trim()));
            }
        }
    }

    private static InputRecord ReadDistribution(XmlReader xml, IXmlLineInfo info, string source, string stem, List<KeyValuePair<string, string>> header, string? version, int line, int index)
    {
        var meta = new List<KeyValuePair<string, string>>(header);
        string name = header.FirstOrDefault(h => h.Key == "description").Value is { Length: > 0 } d ? d
            : header.FirstOrDefault(h => h.Key == "catalogNumber").Value is { Length: > 0 } c ? c : $"{stem}#{index}";
        var wl = new List<double>(1024);
        var values = new List<double>(1024);
        string? quantity = null;
        using (xml)
        {
            xml.Read();
            while (!xml.EOF)
            {
                if (xml.NodeType != XmlNodeType.Element || xml.Depth != 1) { xml.Read(); continue; }
                string el = xml.LocalName;
                int at = info.LineNumber, pos = info.LinePosition;
                if (el == "SpectralData")
                {
                    string? w = xml.GetAttribute("wavelength");
                    string text = xml.ReadElementContentAsString().Trim();
                    if (w is null || !double.TryParse(w, NumberStyles.Float, CultureInfo.InvariantCulture, out double lambda) || !double.IsFinite(lambda))
                        return Bad(at, pos, $"<SpectralData> needs a numeric wavelength attribute, found '{w}'");
                    if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
                        return Bad(at, pos, $"'{(text.Length > 24 ? text[..21] + "..." : text)}' is not a number; expected the spectral value at {w} nm");
                    wl.Add(lambda);
                    values.Add(v);
                }
                else
                {
                    string value = xml.ReadElementContentAsString().Trim();
                    if (el == "SpectralQuantity") quantity = value;
                    meta.Add(new(Camel(el), value));
                }
            }
        }
        if (wl.Count == 0) return Bad(line, 1, "<SpectralDistribution> has no <SpectralData>");
        // Sort by wavelength (the standard does not require order); equal wavelengths are an error of the spectrum.
        var order = Enumerable.Range(0, wl.Count).OrderBy(i => wl[i]).ToArray();
        var wls = order.Select(i => wl[i]).ToArray();
        var vs = order.Select(i => values[i]).ToArray();
        var unit = UnitOf(quantity);
        try
        {
            var s = new Spectrum(wls, vs, unit, name, new SpectrumOrigin(source, 0) { Layout = $"IES TM-27 spectral data XML{(version is null ? "" : $" (version {version})")}, spectral quantity '{quantity ?? "unstated"}'" });
            return new SpectrumRecord(source, 0, name, s) { Line = line, Metadata = Preamble.Merge(meta) };
        }
        catch (InvalidSpectrumException ex)
        {
            return Bad(line, 1, ex.Message);
        }

        ErrorRecord Bad(int ln, int col, string message) => new(source, 0, name, new ReadDiagnostic(source, ln, col, message)) { Line = ln, Metadata = Preamble.Merge(meta) };
    }

    /// <summary>The unit of a TM-27 spectral quantity: relative or normalised quantities are relative; the absolute
    /// ones map to Lumen's units (unknown ones are read as relative, with the quantity stated in the provenance).</summary>
    public static SpectralUnit UnitOf(string? quantity) => quantity?.Trim().ToLowerInvariant() switch
    {
        "irradiance" => SpectralUnit.IrradianceWattsPerSquareMetreNm,
        "radiance" => SpectralUnit.RadianceWattsPerSteradianSquareMetreNm,
        "intensity" or "radiantintensity" => SpectralUnit.IntensityWattsPerSteradianNm,
        "flux" or "radiantflux" or "power" => SpectralUnit.FluxWattsPerNm,
        _ => SpectralUnit.Relative,
    };

    /// <summary>The TM-27 spectral quantity of a unit.</summary>
    public static string QuantityOf(SpectralUnit unit) => unit switch
    {
        SpectralUnit.IrradianceWattsPerSquareMetreNm => "irradiance",
        SpectralUnit.RadianceWattsPerSteradianSquareMetreNm => "radiance",
        SpectralUnit.IntensityWattsPerSteradianNm => "intensity",
        SpectralUnit.FluxWattsPerNm => "flux",
        _ => "relative",
    };

    /// <summary>Writes one spectrum as a TM-27 document.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="header">Header fields by their element name or camelCase key (unknown keys are left out; missing ones
    /// written empty except Description, which defaults to the spectrum's name).</param>
    /// <param name="bandwidthNm">BandwidthFWHM, or null to leave it out.</param>
    /// <param name="bandwidthCorrected">BandwidthCorrected, or null to leave it out.</param>
    public static void Write(TextWriter output, Spectrum spectrum, IReadOnlyList<KeyValuePair<string, string>>? header = null, double? bandwidthNm = null, bool? bandwidthCorrected = null)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(spectrum);
        string? Get(string field) => header?.FirstOrDefault(h => h.Key == field || h.Key == Camel(field)).Value;
        var settings = new XmlWriterSettings { Indent = true, Encoding = new UTF8Encoding(false), OmitXmlDeclaration = false };
        using var xml = XmlWriter.Create(output, settings);
        xml.WriteStartDocument();
        xml.WriteStartElement("IESTM2714", Namespace);
        xml.WriteAttributeString("version", "1.0");
        xml.WriteStartElement("Header", Namespace);
        foreach (var f in HeaderFields)
        {
            string? v = Get(f) ?? (f == "Description" ? spectrum.Name : f == "DocumentCreator" ? "Lumen" : null);
            if (v is not null) xml.WriteElementString(f, Namespace, v);
        }
        xml.WriteEndElement();
        xml.WriteStartElement("SpectralDistribution", Namespace);
        xml.WriteElementString("SpectralQuantity", Namespace, Get("SpectralQuantity") ?? QuantityOf(spectrum.Unit));
        double? bw = bandwidthNm ?? (double.TryParse(Get("BandwidthFWHM"), NumberStyles.Float, CultureInfo.InvariantCulture, out var b) ? b : null);
        if (bw is { } bwv) xml.WriteElementString("BandwidthFWHM", Namespace, bwv.ToString("R", CultureInfo.InvariantCulture));
        string? corrected = bandwidthCorrected is { } bc ? (bc ? "true" : "false") : Get("BandwidthCorrected");
        if (corrected is not null) xml.WriteElementString("BandwidthCorrected", Namespace, corrected);
        var wl = spectrum.WavelengthsNm;
        var v2 = spectrum.Values;
        for (int i = 0; i < wl.Length; i++)
        {
            xml.WriteStartElement("SpectralData", Namespace);
            xml.WriteAttributeString("wavelength", wl[i].ToString("R", CultureInfo.InvariantCulture));
            xml.WriteString(v2[i].ToString("R", CultureInfo.InvariantCulture));
            xml.WriteEndElement();
        }
        xml.WriteEndElement();
        xml.WriteEndElement();
        xml.WriteEndDocument();
    }
}
