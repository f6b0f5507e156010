using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Blackbody;

/// <summary>
/// Everything <c>lumen blackbody</c> reports for a (grey) blackbody: Wien peak, exitance, net radiated power and colour.
/// Quantities that overflow double precision (e.g. σT⁴ for T above about 10⁸⁰ K) are NaN and named in
/// <see cref="Warnings"/>; writers print them as null.
/// </summary>
/// <param name="TemperatureKelvin">Temperature T, K (positive, finite).</param>
/// <param name="Emissivity">Emissivity ε in (0, 1].</param>
/// <param name="WienPeakNm">Wavelength of the per-nm radiance maximum, b/T, nm.</param>
/// <param name="ExitanceWattsPerSquareMetre">Blackbody exitance σT⁴ (ε = 1), W/m².</param>
/// <param name="GreyExitanceWattsPerSquareMetre">Grey-body exitance εσT⁴, W/m².</param>
/// <param name="AreaSquareMetres">Radiating area, m², when given.</param>
/// <param name="AmbientKelvin">Temperature of the surroundings T0, K.</param>
/// <param name="NetPowerWatts">Net radiated power σAε(T⁴ − T0⁴), W, when an area is given.</param>
/// <param name="Chromaticity">CIE 1931 2° chromaticity of the Planckian radiator (c2 of CIE 15), for 500 K to 10⁶ K; else null.</param>
/// <param name="Cct">Its CCT and Duv (CCT = T, Duv = 0 up to the solver's precision), when the chromaticity is given.</param>
/// <param name="ColorName">A plain-words colour name, when the chromaticity is given.</param>
/// <param name="Warnings">Plain-language warnings (range limits, overflow).</param>
public sealed record BlackbodyReport(
    double TemperatureKelvin,
    double Emissivity,
    double WienPeakNm,
    double ExitanceWattsPerSquareMetre,
    double GreyExitanceWattsPerSquareMetre,
    double? AreaSquareMetres,
    double AmbientKelvin,
    double? NetPowerWatts,
    Chromaticity? Chromaticity,
    CctResult? Cct,
    string? ColorName,
    IReadOnlyList<string> Warnings)
{
    /// <summary>Constants and model behind the figures, for the provenance of every output.</summary>
    public const string Constants = "CODATA 2018 (h, c, k exact): σ = 5.670374419e-8 W/(m²·K⁴), b = 2.897771955e-3 m·K; chromaticity with c2 = 1.4388e-2 m·K (CIE 15)";

    /// <summary>The net-power model, for the provenance.</summary>
    public const string NetPowerModel = "P = σ·A·ε·(T⁴ − T0⁴): small grey body in large black surroundings";

    /// <summary>The caution every blackbody output carries.</summary>
    public const string Caution = "Caution: hot surfaces burn and thermal radiation can harm eyes and skin; these are idealised calculations, not safety assessments — follow local codes and qualified practice.";

    /// <summary>Lowest temperature for which a chromaticity is given, K (the Planckian locus table starts here).</summary>
    public const double MinColorKelvin = 500;

    /// <summary>Highest temperature for which a chromaticity is given, K.</summary>
    public const double MaxColorKelvin = 1e6;

    /// <summary>Computes the report.</summary>
    /// <param name="temperatureKelvin">Temperature T, K: positive and finite.</param>
    /// <param name="emissivity">Emissivity ε in (0, 1].</param>
    /// <param name="areaSquareMetres">Radiating area in m² (≥ 0, finite), or null for no net power.</param>
    /// <param name="ambientKelvin">Temperature of the surroundings T0, K: ≥ 0 and finite.</param>
    /// <returns>The report.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public static BlackbodyReport Compute(double temperatureKelvin, double emissivity = 1, double? areaSquareMetres = null, double ambientKelvin = 293.15)
    {
        if (!(temperatureKelvin > 0 && double.IsFinite(temperatureKelvin))) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin), "Temperature must be positive and finite.");
        if (!(emissivity > 0 && emissivity <= 1)) throw new ArgumentOutOfRangeException(nameof(emissivity), "Emissivity must be in (0, 1].");
        if (!(ambientKelvin >= 0 && double.IsFinite(ambientKelvin))) throw new ArgumentOutOfRangeException(nameof(ambientKelvin), "Ambient temperature must be non-negative and finite.");
        if (areaSquareMetres is { } ar && !(ar >= 0 && double.IsFinite(ar))) throw new ArgumentOutOfRangeException(nameof(areaSquareMetres), "Area must be non-negative and finite.");
        var warnings = new List<string>();
        Chromaticity? chroma = null;
        CctResult? cct = null;
        string? name = null;
        if (temperatureKelvin >= MinColorKelvin && temperatureKelvin <= MaxColorKelvin)
        {
            var p = PlanckianLocus.Cie15.At(temperatureKelvin);
            var c = Colorimetry.Chromaticity.FromUv(p.U, p.V);
            chroma = c;
            cct = CctSolver.Solve(c);
            name = Radiator.ColorName(temperatureKelvin);
        }
        else warnings.Add("Chromaticity and CCT are given for 500 K to 1,000,000 K only.");
        if (temperatureKelvin < 800) warnings.Add("Below about 800 K a hot body hardly glows visibly (common practice, the Draper point ≈ 798 K).");

        double wien = Radiator.WienPeakNm(temperatureKelvin);
        double exitance = Radiator.ExitanceWattsPerSquareMetre(temperatureKelvin);
        double? net = areaSquareMetres is { } a ? Radiator.NetPowerWatts(temperatureKelvin, ambientKelvin, a, emissivity) : null;
        if (!double.IsFinite(wien) || wien == 0) { warnings.Add("The Wien peak wavelength is below the smallest number a double can hold: not given."); wien = double.NaN; }
        if (!double.IsFinite(exitance)) { warnings.Add("The exitance σT⁴ exceeds the range of double precision: not given."); exitance = double.NaN; }
        if (net is { } n && !double.IsFinite(n)) { warnings.Add("The net radiated power exceeds the range of double precision: not given."); net = double.NaN; }
        return new BlackbodyReport(temperatureKelvin, emissivity, wien, exitance, emissivity * exitance, areaSquareMetres, ambientKelvin, net, chroma, cct, name, warnings);
    }
}
