using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Descriptors;
using Lumen.Photometry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Analysis;

/// <summary>Runs the calculators on one spectrum and gathers the results.</summary>
public static class Assessor
{
    /// <summary>Visible range that CIE light-source work expects a spectrum to cover, nm.</summary>
    public const int ExpectedFirstNm = 380;

    /// <summary>Upper end of the expected range, nm.</summary>
    public const int ExpectedLastNm = 780;

    /// <summary>Assesses one spectrum.</summary>
    /// <param name="spectrum">The measured spectrum (relative or absolute; any grid the resampler accepts).</param>
    /// <param name="options">Options; null for defaults.</param>
    /// <returns>The assessment (never throws for valid spectra; problems become warnings).</returns>
    public static Assessment Assess(Spectrum spectrum, AssessmentOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        options ??= AssessmentOptions.Default;
        var warnings = new List<string>();
        var samples = Resampler.ForCieSums(spectrum);
        if (CoverageWarning(spectrum) is { } coverage) warnings.Add(coverage);
        if (NegativeValueWarning(spectrum) is { } negative) warnings.Add(negative);

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

        CriResult? cri = null;
        FidelityResult? fidelity = null;
        bool wantCri = options.Metrics.HasFlag(MetricGroups.Cri), wantFidelity = options.Metrics.HasFlag(MetricGroups.Fidelity);
        if ((wantCri || wantFidelity) && RenditionComputable(cct, warnings))
        {
            if (wantCri)
            {
                cri = ColorRenderingIndex.Compute(samples, cct.CctKelvin);
                if (!cri.DcValid)
                    warnings.Add($"CIE 13.3: the chromaticity distance DC = {cri.Dc:0.0000} to the reference exceeds 5.4e-3; Ra is not reliable for this source.");
            }
            if (wantFidelity) fidelity = FidelityIndex.Compute(samples, cct.CctKelvin);
            if (cct.Conditions.HasFlag(CctConditions.FarFromLocus))
                warnings.Add("Colour rendering indices compare the source with a reference at its CCT; with |Duv| > 0.05 that comparison is not meaningful.");
        }

        var photometry = options.Metrics.HasFlag(MetricGroups.Photometry) ? Photometer.Compute(samples, spectrum.Unit) : null;
        var nonVisual = options.Metrics.HasFlag(MetricGroups.NonVisual) ? AlphaOpic.Compute(samples, spectrum.Unit) : null;
        var spectral = options.Metrics.HasFlag(MetricGroups.Spectral) ? SpectralDescriptors.Compute(spectrum, chroma2) : null;
        if (nonVisual is not null && (spectrum.FirstNm > ExpectedFirstNm || spectrum.LastNm < ExpectedLastNm))
            warnings.Add("CIE S 026 quantities need 380–780 nm; the missing part was taken as zero.");

        var cctOpt = options.CctOptions;
        var provenance = new Provenance(
            new Dictionary<string, string>
            {
                ["tristimulus"] = "CIE 15 summation, relative (Y = 100)",
                ["cct"] = CctResult.Describe(cctOpt.Method),
                ["planckianLocus"] = "Planck's law × CIE 1931 2° CMFs, 360–830 nm at 1 nm",
                ["sampling"] = samples.Method,
                ["cri"] = "CIE 13.3-1995 test-colour-sample method (2°, TCS01–14, reference Planckian < 5000 K, CIE daylight ≥ 5000 K)",
                ["fidelity"] = "CIE 224:2017 Rf (c_f = 6.73, 99 CES, CIE 1964 10°, CAM02-UCS); ANSI/IES TM-30-20 Rg and hue bins",
                ["photometry"] = $"K_m = {Photometer.KmLumensPerWatt} lm/W, K'_m = {Photometer.KmPrimeLumensPerWatt} lm/W; LER over the measured band {samples.StartNm}–{samples.EndNm} nm",
                ["nonVisual"] = "CIE S 026:2018 α-opic action spectra; D65 reference computed from the CIE D65 table (1 nm, 380–780 nm)",
                ["dominantWavelength"] = "CIE 15 §9.1, CIE 1931 2° spectrum locus, achromatic point E",
            },
            ["CIE 015:2018 (colorimetry)", "ISO/CIE 11664-1:2019 (observers)", "ANSI C78.377 (Duv sign)", "CIE 13.3-1995 (Ra, Ri)", "CIE 224:2017 (Rf)", "ANSI/IES TM-30-20 (Rg, hue bins)", "CIE 018:2019 (photometry)", "CIE S 026:2018 (α-opic)"],
            PlanckConstants.For(cctOpt.C2).C2,
            spectrum.FirstNm, spectrum.LastNm, samples.StartNm, samples.EndNm, samples.StepNm, samples.Method, spectrum.NegativeSampleCount);
        Tristimulus? absolute = spectrum.Unit.IsAbsolute()
            ? new Tristimulus(Colorimeter.KmLumensPerWatt * rawObs.X, Colorimeter.KmLumensPerWatt * rawObs.Y, Colorimeter.KmLumensPerWatt * rawObs.Z)
            : null;
        return new Assessment(spectrum.Name, spectrum.Origin, spectrum.Unit, options.Observer, rel, absolute, chroma, chroma2, cct, cri, fidelity,
            photometry, nonVisual, spectral, warnings, provenance);
    }

    /// <summary>Fraction of the peak below which negative samples are reported as a warning (common practice).</summary>
    public const double NegativeWarningFraction = 0.01;

    /// <summary>
    /// Warns when samples fall below zero by more than 1 % of the peak (more than instrument noise: a dark
    /// reference or stray-light problem). Smaller negatives are only counted in the provenance; all are kept
    /// in the sums, because clipping biases low signals (CIE 167 practice).
    /// </summary>
    /// <param name="spectrum">The measured spectrum (relative or absolute; any grid the resampler accepts).</param>
    /// <returns>The warning, or null when there is nothing to say.</returns>
    internal static string? NegativeValueWarning(Spectrum spectrum)
    {
        if (spectrum.NegativeSampleCount == 0) return null;
        double peak = 0, min = 0;
        foreach (var v in spectrum.Values) { peak = Math.Max(peak, v); min = Math.Min(min, v); }
        return peak > 0 && -min > NegativeWarningFraction * peak
            ? $"{spectrum.NegativeSampleCount} sample(s) below zero, down to {min / peak * 100:0.0} % of the peak: check the dark reference; values kept in the sums, not clipped."
            : null;
    }

    /// <summary>The warning for a spectrum that does not cover 380–780 nm.</summary>
    /// <param name="spectrum">The measured spectrum (relative or absolute; any grid the resampler accepts).</param>
    /// <returns>The warning, or null when the spectrum covers 380–780 nm.</returns>
    internal static string? CoverageWarning(Spectrum spectrum)
    {
        var gaps = new List<string>();
        if (spectrum.FirstNm > ExpectedFirstNm) gaps.Add($"{ExpectedFirstNm}–{spectrum.FirstNm:0.#} nm");
        if (spectrum.LastNm < ExpectedLastNm) gaps.Add($"{spectrum.LastNm:0.#}–{ExpectedLastNm} nm");
        return gaps.Count == 0 ? null : $"Spectrum covers {spectrum.FirstNm:0.#}–{spectrum.LastNm:0.#} nm, not all of 380–780 nm; {string.Join(" and ", gaps)} taken as zero (emission spectrum).";
    }

    /// <summary>Lowest CCT for which Lumen builds a rendition reference, K.</summary>
    public const double RenditionMinCctKelvin = 1000;

    /// <summary>Highest CCT for which Lumen builds a rendition reference (end of the CIE daylight formula), K.</summary>
    public const double RenditionMaxCctKelvin = 25000;

    private static bool RenditionComputable(CctResult cct, List<string> warnings)
    {
        if (!double.IsFinite(cct.CctKelvin)) return false;
        if (cct.CctKelvin < RenditionMinCctKelvin || cct.CctKelvin > RenditionMaxCctKelvin)
        {
            warnings.Add($"Colour rendition not computed: CCT {cct.CctKelvin:0} K is outside 1000–25000 K, where the reference illuminants are defined.");
            return false;
        }
        return true;
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
