using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Assessment;

/// <summary>What to compute and how.</summary>
/// <param name="Observer">Observer for the reported tristimulus values and chromaticity (CCT always uses 2°).</param>
/// <param name="Cct">CCT method and c2 convention.</param>
public sealed record AssessmentOptions(Observer Observer = Observer.Cie1931TwoDegree, CctOptions? Cct = null)
{
    /// <summary>The defaults: 2° observer, exact-locus CCT with CIE 15 c2.</summary>
    public static AssessmentOptions Default { get; } = new();

    /// <summary>The CCT options in force.</summary>
    public CctOptions CctOptions => Cct ?? CctOptions.Default;
}

/// <summary>How a result was obtained: methods, standards, constants and the data range used.</summary>
/// <param name="Methods">Method names keyed by quantity (e.g. "cct").</param>
/// <param name="Standards">Standards and editions followed.</param>
/// <param name="C2MetreKelvin">c2 used for the Planckian locus, m·K.</param>
/// <param name="MeasuredFirstNm">First measured wavelength, nm.</param>
/// <param name="MeasuredLastNm">Last measured wavelength, nm.</param>
/// <param name="IntegrationStartNm">First wavelength of the integration grid, nm.</param>
/// <param name="IntegrationEndNm">Last wavelength of the integration grid, nm.</param>
/// <param name="IntegrationStepNm">Integration step, nm.</param>
/// <param name="Sampling">How the spectrum was brought onto the integration grid.</param>
public sealed record Provenance(
    IReadOnlyDictionary<string, string> Methods,
    IReadOnlyList<string> Standards,
    double C2MetreKelvin,
    double MeasuredFirstNm,
    double MeasuredLastNm,
    int IntegrationStartNm,
    int IntegrationEndNm,
    int IntegrationStepNm,
    string Sampling);

/// <summary>Everything Lumen computed for one spectrum; every writer, plot and report reads this.</summary>
/// <param name="Name">Spectrum name.</param>
/// <param name="Origin">Source and column.</param>
/// <param name="Unit">Unit of the input values.</param>
/// <param name="Observer">Observer of <see cref="Tristimulus"/> and <see cref="Chromaticity"/>.</param>
/// <param name="Tristimulus">Relative tristimulus values, Y = 100.</param>
/// <param name="Chromaticity">Chromaticity for <see cref="Observer"/>.</param>
/// <param name="Chromaticity2Degree">CIE 1931 2° chromaticity (what CCT and Duv use).</param>
/// <param name="Cct">CCT and Duv.</param>
/// <param name="Warnings">Plain-language warnings a practitioner needs.</param>
/// <param name="Provenance">Methods, standards, constants, ranges.</param>
public sealed record Assessment(
    string Name,
    SpectrumOrigin Origin,
    SpectralUnit Unit,
    Observer Observer,
    Tristimulus Tristimulus,
    Chromaticity Chromaticity,
    Chromaticity Chromaticity2Degree,
    CctResult Cct,
    IReadOnlyList<string> Warnings,
    Provenance Provenance);

/// <summary>Runs the calculators on one spectrum and gathers the results.</summary>
public static class Assessor
{
    /// <summary>Visible range that CIE light-source work expects a spectrum to cover, nm.</summary>
    public const int ExpectedFirstNm = 380;

    /// <summary>Upper end of the expected range, nm.</summary>
    public const int ExpectedLastNm = 780;

    /// <summary>Assesses one spectrum.</summary>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="options">Options; null for defaults.</param>
    /// <returns>The assessment (never throws for valid spectra; problems become warnings).</returns>
    public static Assessment Assess(Spectrum spectrum, AssessmentOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        options ??= AssessmentOptions.Default;
        var warnings = new List<string>();
        var samples = Resampler.ForCieSums(spectrum);
        CoverageWarnings(spectrum, warnings);
        if (spectrum.NegativeSampleCount > 0)
            warnings.Add($"{spectrum.NegativeSampleCount} sample(s) below zero (instrument noise) kept in the sums, not clipped.");

        var raw2 = Colorimeter.RawSums(samples, Observer.Cie1931TwoDegree);
        var rawObs = options.Observer == Observer.Cie1931TwoDegree ? raw2 : Colorimeter.RawSums(samples, options.Observer);
        Tristimulus rel;
        if (rawObs.Y > 0) rel = rawObs.NormalisedToY(100);
        else
        {
            rel = new Tristimulus(double.NaN, double.NaN, double.NaN);
            warnings.Add("No visible power (the sum of S·ȳ is not positive): chromaticity, CCT and Duv are undefined.");
        }
        var chroma = Chromaticity.FromXyz(rel);
        var chroma2 = raw2.Y > 0 ? Chromaticity.FromXyz(raw2) : Chromaticity.FromXyz(default);
        var cct = CctSolver.Solve(chroma2, options.CctOptions);
        CctWarnings(cct, warnings);

        var cctOpt = options.CctOptions;
        var provenance = new Provenance(
            new Dictionary<string, string>
            {
                ["tristimulus"] = "CIE 15 summation, relative (Y = 100)",
                ["cct"] = CctResult.Describe(cctOpt.Method),
                ["planckianLocus"] = "Planck's law × CIE 1931 2° CMFs, 360–830 nm at 1 nm",
                ["sampling"] = samples.Method,
            },
            ["CIE 015:2018 (colorimetry)", "ISO/CIE 11664-1:2019 (observers)", "ANSI C78.377 (Duv sign)"],
            PlanckConstants.For(cctOpt.C2).C2,
            spectrum.FirstNm, spectrum.LastNm, samples.StartNm, samples.EndNm, samples.StepNm, samples.Method);
        return new Assessment(spectrum.Name, spectrum.Origin, spectrum.Unit, options.Observer, rel, chroma, chroma2, cct, warnings, provenance);
    }

    /// <summary>Adds the warning for a spectrum that does not cover 380–780 nm.</summary>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="warnings">List to add to.</param>
    public static void CoverageWarnings(Spectrum spectrum, List<string> warnings)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(warnings);
        var gaps = new List<string>();
        if (spectrum.FirstNm > ExpectedFirstNm) gaps.Add($"{ExpectedFirstNm}–{spectrum.FirstNm:0.#} nm");
        if (spectrum.LastNm < ExpectedLastNm) gaps.Add($"{spectrum.LastNm:0.#}–{ExpectedLastNm} nm");
        if (gaps.Count > 0)
            warnings.Add($"Spectrum covers {spectrum.FirstNm:0.#}–{spectrum.LastNm:0.#} nm, not all of 380–780 nm; {string.Join(" and ", gaps)} taken as zero (emission spectrum).");
    }

    private static void CctWarnings(CctResult cct, List<string> warnings)
    {
        if (cct.Conditions.HasFlag(CctConditions.Undefined)) return;
        if (cct.Conditions.HasFlag(CctConditions.FarFromLocus))
            warnings.Add($"|Duv| = {Math.Abs(cct.Duv):0.0000} exceeds 0.05: CCT is not meaningful this far from the Planckian locus (CIE 15).");
        if (cct.Conditions.HasFlag(CctConditions.BeyondLocus))
            warnings.Add("The nearest Planckian point is at the end of the locus (500 K or 1,000,000 K): CCT clamped.");
        else if (cct.Conditions.HasFlag(CctConditions.OutsideValidatedRange))
            warnings.Add($"CCT {cct.CctKelvin:0} K is outside 1000–100000 K, the range where Lumen's CCT is validated.");
    }
}
