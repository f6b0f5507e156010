using System.Collections.Frozen;
using Lumen.Photometry;

using Lumen.Cie;

namespace Lumen.Analysis;

/// <summary>
/// Numeric result fields by their path in the <c>analyze</c> JSON object (e.g. <c>cct.duv</c>, <c>cri.r9</c>,
/// <c>nonVisual.melanopic.der</c>), for tolerance specs and batch statistics. A test checks that every path
/// here exists in the JSON output with the same value.
/// </summary>
public static class ResultFields
{
    private static readonly FrozenDictionary<string, Func<Assessment, double?>> Fields = Build();

    /// <summary>All known paths.</summary>
    public static IReadOnlyCollection<string> Paths => Fields.Keys;

    /// <summary>True when the path names a numeric field.</summary>
    /// <param name="path">A field path such as <c>cri.ra</c> (case-sensitive).</param>
    /// <returns>Whether it is known.</returns>
    public static bool IsKnown(string path) => Fields.ContainsKey(path);

    /// <summary>The value of a field, or null when the path is unknown or the value not computed.</summary>
    /// <param name="a">The assessment to read.</param>
    /// <param name="path">A field path such as <c>cri.ra</c>; unknown paths give null.</param>
    /// <returns>The value in the field's own unit (as in the JSON output), or null.</returns>
    public static double? Get(Assessment a, string path) =>
        Fields.TryGetValue(path, out var f) ? f(a) : null;

    /// <summary>The reader of a known field, resolved once (for writers that read the same field from every record).</summary>
    /// <param name="path">A known field path such as <c>cri.r9</c>.</param>
    /// <returns>The function giving the field's value (null when not computed).</returns>
    /// <exception cref="ArgumentException">The path is unknown.</exception>
    public static Func<Assessment, double?> Accessor(string path) =>
        Fields.TryGetValue(path, out var f) ? f : throw new ArgumentException($"unknown result field '{path}'", nameof(path));

    /// <summary>
    /// For a path in the 0-based index syntax of earlier versions (<c>cri.r[8]</c>, <c>fidelity.hueBins[0].rcs</c>,
    /// <c>fidelity.rfCes[4]</c>), the 1-based field it meant (<c>cri.r9</c>, <c>fidelity.hueBin1.rcs</c>, <c>fidelity.rfCes5</c>); else null.
    /// </summary>
    /// <param name="path">A field path.</param>
    /// <returns>The field the index syntax meant, or null.</returns>
    public static string? FromIndexSyntax(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var m = System.Text.RegularExpressions.Regex.Match(path, @"^(cri\.r|fidelity\.rfCes|fidelity\.hueBins)\[(\d+)\](.*)$");
        if (!m.Success || !int.TryParse(m.Groups[2].Value, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int k)) return null;
        string stem = m.Groups[1].Value == "fidelity.hueBins" ? "fidelity.hueBin" : m.Groups[1].Value;
        string meant = $"{stem}{k + 1}{m.Groups[3].Value}";
        return IsKnown(meant) ? meant : null;
    }

    /// <summary>The result group that computes a field (colorimetry for the always-computed fields).</summary>
    /// <param name="path">A field path such as <c>photometry.ler</c>.</param>
    /// <returns>The group.</returns>
    public static MetricGroups GroupOf(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        int dot = path.IndexOf('.', StringComparison.Ordinal);
        return (dot < 0 ? path : path[..dot]) switch
        {
            "cri" => MetricGroups.Cri,
            "fidelity" => MetricGroups.Fidelity,
            "photometry" => MetricGroups.Photometry,
            "nonVisual" => MetricGroups.NonVisual,
            "spectral" => MetricGroups.Spectral,
            _ => MetricGroups.Colorimetry,
        };
    }

    /// <summary>JSON field name of a photometric quantity, unit in the name.</summary>
    /// <param name="quantity">The photometric quantity the input unit gives (illuminance, luminance, intensity or flux).</param>
    /// <returns>For example <c>illuminanceLux</c>.</returns>
    public static string PhotometricName(PhotometricQuantity quantity) => quantity switch
    {
        PhotometricQuantity.IlluminanceLux => "illuminanceLux",
        PhotometricQuantity.LuminanceCandelaPerSquareMetre => "luminanceCdPerM2",
        PhotometricQuantity.IntensityCandela => "intensityCd",
        _ => "fluxLm",
    };

    /// <summary>JSON field name of the scotopic counterpart of a photometric quantity.</summary>
    /// <param name="quantity">The photometric quantity the input unit gives (illuminance, luminance, intensity or flux).</param>
    /// <returns>For example <c>scotopicIlluminanceLux</c>.</returns>
    public static string ScotopicName(PhotometricQuantity quantity)
    {
        string n = PhotometricName(quantity);
        return "scotopic" + char.ToUpperInvariant(n[0]) + n[1..];
    }

    /// <summary>JSON field name of the radiometric total, unit in the name.</summary>
    /// <param name="quantity">The photometric quantity it belongs to.</param>
    /// <returns>For example <c>irradianceWPerM2</c>.</returns>
    public static string RadiometricName(PhotometricQuantity quantity) => quantity switch
    {
        PhotometricQuantity.IlluminanceLux => "irradianceWPerM2",
        PhotometricQuantity.LuminanceCandelaPerSquareMetre => "radianceWPerSrM2",
        PhotometricQuantity.IntensityCandela => "intensityWPerSr",
        _ => "fluxW",
    };

    /// <summary>JSON name of an α-opic kind.</summary>
    /// <param name="kind">One of the five CIE S 026 α-opic quantities.</param>
    /// <returns>For example <c>sConeOpic</c>.</returns>
    public static string NonVisualName(AlphaOpicKind kind) => kind switch
    {
        AlphaOpicKind.Melanopic => "melanopic",
        AlphaOpicKind.SConeOpic => "sConeOpic",
        AlphaOpicKind.MConeOpic => "mConeOpic",
        AlphaOpicKind.LConeOpic => "lConeOpic",
        _ => "rhodopic",
    };

    /// <summary>
    /// The display format of a field's value in tables and reports — one rounding rule per quantity everywhere (common
    /// reporting practice): CCT to 1 K, Duv and chromaticity coordinates to 4 decimals (Duv signed), rendition indices
    /// and LER to 0.1, anything else to at most 4 decimals. Machine formats (CSV, JSON) keep every digit.
    /// </summary>
    /// <param name="path">A field path such as <c>cct.duv</c> (unknown paths get the general format).</param>
    /// <returns>A .NET numeric format string.</returns>
    public static string DisplayFormat(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        return path switch
        {
            "cct.kelvin" => "0",
            "cct.duv" => "+0.0000;-0.0000;0.0000",
            _ when path.StartsWith("chromaticity", StringComparison.Ordinal) => "0.0000",
            _ when path.StartsWith("cri.", StringComparison.Ordinal) || path.StartsWith("fidelity.", StringComparison.Ordinal) || path.StartsWith("photometry.ler", StringComparison.Ordinal) => "0.0",
            _ => "0.####",
        };
    }

    /// <summary>Observer label used in every output: <c>2</c> or <c>10</c>.</summary>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer.</param>
    /// <returns>The label.</returns>
    public static string ObserverLabel(Observer observer) => observer == Observer.Cie1931TwoDegree ? "2" : "10";

    private static FrozenDictionary<string, Func<Assessment, double?>> Build()
    {
        var d = new Dictionary<string, Func<Assessment, double?>>(StringComparer.Ordinal)
        {
            ["tristimulus.X"] = a => a.Tristimulus.X,
            ["tristimulus.Y"] = a => a.Tristimulus.Y,
            ["tristimulus.Z"] = a => a.Tristimulus.Z,
            ["tristimulusAbsolute.X"] = a => a.AbsoluteTristimulus?.X,
            ["tristimulusAbsolute.Y"] = a => a.AbsoluteTristimulus?.Y,
            ["tristimulusAbsolute.Z"] = a => a.AbsoluteTristimulus?.Z,
            ["chromaticity.x"] = a => a.Chromaticity.SmallX,
            ["chromaticity.y"] = a => a.Chromaticity.SmallY,
            ["chromaticity.u"] = a => a.Chromaticity.U,
            ["chromaticity.v"] = a => a.Chromaticity.V,
            ["chromaticity.uPrime"] = a => a.Chromaticity.UPrime,
            ["chromaticity.vPrime"] = a => a.Chromaticity.VPrime,
            ["cct.kelvin"] = a => a.Cct.CctKelvin,
            ["cct.duv"] = a => a.Cct.Duv,
            ["cri.ra"] = a => a.Cri?.Ra,
            ["cri.r9"] = a => a.Cri?.R9,
            ["cri.dc"] = a => a.Cri?.Dc,
            ["fidelity.rf"] = a => a.Fidelity?.Rf,
            ["fidelity.rg"] = a => a.Fidelity?.Rg,
            ["photometry.ler"] = a => a.Photometry?.LerLumensPerWatt,
            ["photometry.spRatio"] = a => a.Photometry?.SpRatio,
            ["spectral.peakNm"] = a => a.Spectral?.PeakNm,
            ["spectral.centroidNm"] = a => a.Spectral?.CentroidNm,
            ["spectral.fwhmNm"] = a => a.Spectral?.FwhmNm,
            ["spectral.dominantNm"] = a => a.Spectral?.DominantNm,
            ["spectral.purity"] = a => a.Spectral?.Purity,
        };
        // Numbered as the trade numbers them, from 1: R1–R14, CES1–CES99, hue bins 1–16 (no 0-based index syntax).
        for (int i = 0; i < 14; i++) { int k = i; d[$"cri.r{k + 1}"] = a => a.Cri is { } c ? c.R[k] : null; }
        for (int i = 0; i < 99; i++) { int k = i; d[$"fidelity.rfCes{k + 1}"] = a => a.Fidelity is { } f ? f.RfCes[k] : null; }
        for (int j = 0; j < 16; j++)
        {
            int k = j;
            d[$"fidelity.hueBin{k + 1}.rf"] = a => a.Fidelity is { } f ? f.HueBins[k].Rf : null;
            d[$"fidelity.hueBin{k + 1}.rcs"] = a => a.Fidelity is { } f ? f.HueBins[k].Rcs * 100 : null;
            d[$"fidelity.hueBin{k + 1}.rhs"] = a => a.Fidelity is { } f ? f.HueBins[k].Rhs : null;
        }
        foreach (PhotometricQuantity q in Enum.GetValues<PhotometricQuantity>())
        {
            var qq = q;
            string name = PhotometricName(q);
            d[$"photometry.{name}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Photometric : null;
            d[$"photometry.{ScotopicName(q)}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Scotopic : null;
            d[$"photometry.{RadiometricName(q)}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Radiometric : null;
        }
        foreach (AlphaOpicKind k in Enum.GetValues<AlphaOpicKind>())
        {
            var kk = k;
            string n = NonVisualName(k);
            d[$"nonVisual.{n}.efficacy"] = a => a.NonVisual?[(int)kk].EfficacyMilliwattsPerLumen;
            d[$"nonVisual.{n}.der"] = a => a.NonVisual?[(int)kk].Der;
            d[$"nonVisual.{n}.irradiance"] = a => a.NonVisual?[(int)kk].Irradiance;
            d[$"nonVisual.{n}.edi"] = a => a.NonVisual?[(int)kk].Edi;
        }
        return d.ToFrozenDictionary(StringComparer.Ordinal);
    }
}
