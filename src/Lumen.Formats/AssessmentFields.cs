using System.Collections.Frozen;
using Lumen.Photometry;

namespace Lumen.Formats;

/// <summary>
/// Numeric result fields by their path in the <c>analyze</c> JSON object (e.g. <c>cct.duv</c>, <c>cri.r[8]</c>,
/// <c>nonVisual.melanopic.der</c>), for tolerance specs and batch statistics. A test checks that every path
/// here exists in the JSON output with the same value.
/// </summary>
public static class AssessmentFields
{
    private static readonly FrozenDictionary<string, Func<Lumen.Assessment.Assessment, double?>> Fields = Build();

    /// <summary>All known paths.</summary>
    public static IReadOnlyCollection<string> Paths => Fields.Keys;

    /// <summary>True when the path names a numeric field.</summary>
    /// <param name="path">Path.</param>
    /// <returns>Whether it is known.</returns>
    public static bool IsKnown(string path) => Fields.ContainsKey(path);

    /// <summary>The value of a field, or null when the path is unknown or the value not computed.</summary>
    /// <param name="a">The assessment.</param>
    /// <param name="path">Path.</param>
    /// <returns>The value.</returns>
    public static double? Get(Lumen.Assessment.Assessment a, string path) =>
        Fields.TryGetValue(path, out var f) ? f(a) : null;

    private static FrozenDictionary<string, Func<Lumen.Assessment.Assessment, double?>> Build()
    {
        var d = new Dictionary<string, Func<Lumen.Assessment.Assessment, double?>>(StringComparer.Ordinal)
        {
            ["tristimulus.X"] = a => a.Tristimulus.X,
            ["tristimulus.Y"] = a => a.Tristimulus.Y,
            ["tristimulus.Z"] = a => a.Tristimulus.Z,
            ["tristimulusAbsolute.X"] = a => a.AbsoluteTristimulus?.X,
            ["tristimulusAbsolute.Y"] = a => a.AbsoluteTristimulus?.Y,
            ["tristimulusAbsolute.Z"] = a => a.AbsoluteTristimulus?.Z,
            ["chromaticity.x"] = a => a.Chromaticity.X,
            ["chromaticity.y"] = a => a.Chromaticity.Y,
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
        for (int i = 0; i < 14; i++) { int k = i; d[$"cri.r[{k}]"] = a => a.Cri is { } c ? c.R[k] : null; }
        for (int i = 0; i < 99; i++) { int k = i; d[$"fidelity.rfCes[{k}]"] = a => a.Fidelity is { } f ? f.RfCes[k] : null; }
        for (int j = 0; j < 16; j++)
        {
            int k = j;
            d[$"fidelity.hueBins[{k}].rf"] = a => a.Fidelity is { } f ? f.HueBins[k].Rf : null;
            d[$"fidelity.hueBins[{k}].rcs"] = a => a.Fidelity is { } f ? f.HueBins[k].Rcs * 100 : null;
            d[$"fidelity.hueBins[{k}].rhs"] = a => a.Fidelity is { } f ? f.HueBins[k].Rhs : null;
        }
        foreach (PhotometricQuantity q in Enum.GetValues<PhotometricQuantity>())
        {
            var qq = q;
            string name = ResultWriters.PhotometricFieldName(q);
            d[$"photometry.{name}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Photometric : null;
            d[$"photometry.scotopic{char.ToUpperInvariant(name[0])}{name[1..]}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Scotopic : null;
            d[$"photometry.{ResultWriters.RadiometricFieldName(q)}"] = a => a.Photometry is { Quantity: { } x } p && x == qq ? p.Radiometric : null;
        }
        foreach (AlphaOpicKind k in Enum.GetValues<AlphaOpicKind>())
        {
            var kk = k;
            string n = ResultWriters.NonVisualName(k);
            d[$"nonVisual.{n}.efficacy"] = a => a.NonVisual?[(int)kk].EfficacyMilliwattsPerLumen;
            d[$"nonVisual.{n}.der"] = a => a.NonVisual?[(int)kk].Der;
            d[$"nonVisual.{n}.irradiance"] = a => a.NonVisual?[(int)kk].Irradiance;
            d[$"nonVisual.{n}.edi"] = a => a.NonVisual?[(int)kk].Edi;
        }
        return d.ToFrozenDictionary(StringComparer.Ordinal);
    }
}
