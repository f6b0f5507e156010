using System.Numerics;
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
        return AssessMany([spectrum], options)[0];
    }

    /// <summary>
    /// Assesses many spectra at once: the same assessments as <see cref="Assess"/> on each, bit for bit, with the rendition
    /// indices of the whole block computed together (<see cref="ColorRenderingIndex.ComputeMany"/>,
    /// <see cref="FidelityIndex.ComputeMany"/>), which is faster per spectrum. Give blocks of 8–32 spectra.
    /// </summary>
    /// <param name="spectra">The measured spectra.</param>
    /// <param name="options">Options; null for defaults.</param>
    /// <returns>One assessment per spectrum, in order.</returns>
    public static Assessment[] AssessMany(IReadOnlyList<Spectrum> spectra, AssessmentOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spectra);
        options ??= AssessmentOptions.Default;
        var stages = new Stage[spectra.Count];
        for (int i = 0; i < spectra.Count; i++) stages[i] = Prepare(spectra[i] ?? throw new ArgumentException("A spectrum is null.", nameof(spectra)), options);

        bool wantCri = options.Metrics.HasFlag(MetricGroups.Cri), wantFidelity = options.Metrics.HasFlag(MetricGroups.Fidelity);
        var rendered = new List<Stage>();
        if (wantCri || wantFidelity)
            foreach (var stage in stages)
                if (RenditionComputable(stage.Cct, stage.Warnings)) rendered.Add(stage);
        if (rendered.Count > 0)
        {
            var samples = new RegularSamples[rendered.Count];
            var ccts = new double[rendered.Count];
            for (int i = 0; i < rendered.Count; i++) { samples[i] = rendered[i].Samples; ccts[i] = rendered[i].Cct.CctKelvin; }
            var cri = wantCri ? ColorRenderingIndex.ComputeMany(samples, ccts) : null;
            var fidelity = wantFidelity ? FidelityIndex.ComputeMany(samples, ccts) : null;
            for (int i = 0; i < rendered.Count; i++)
            {
                var stage = rendered[i];
                if (cri is not null)
                {
                    stage.Cri = cri[i];
                    if (!cri[i].DcValid)
                        stage.Warnings.Add($"CIE 13.3: the chromaticity distance DC = {cri[i].Dc:0.0000} to the reference exceeds 5.4e-3; Ra is not reliable for this source.");
                }
                stage.Fidelity = fidelity?[i];
                if (stage.Cct.Conditions.HasFlag(CctConditions.FarFromLocus))
                    stage.Warnings.Add("Colour rendering indices compare the source with a reference at its CCT; with |Duv| > 0.05 that comparison is not meaningful.");
            }
        }

        var result = new Assessment[stages.Length];
        for (int i = 0; i < stages.Length; i++) result[i] = Finish(stages[i], options);
        return result;
    }

    /// <summary>What is known of one spectrum before its rendition indices: scaled values, CIE sums, CCT, warnings.</summary>
    private sealed class Stage(Spectrum spectrum, Spectrum work, double scale, RegularSamples samples, Tristimulus rawObserver,
        Tristimulus relative, Chromaticity chroma, Chromaticity chroma2, CctResult cct, List<string> warnings)
    {
        public Spectrum Spectrum { get; } = spectrum;
        public Spectrum Work { get; } = work;
        public double Scale { get; } = scale;
        public RegularSamples Samples { get; } = samples;
        public Tristimulus RawObserver { get; } = rawObserver;
        public Tristimulus Relative { get; } = relative;
        public Chromaticity Chroma { get; } = chroma;
        public Chromaticity Chroma2 { get; } = chroma2;
        public CctResult Cct { get; } = cct;
        public List<string> Warnings { get; } = warnings;
        public CriResult? Cri { get; set; }
        public FidelityResult? Fidelity { get; set; }
    }

    /// <summary>Everything before the rendition indices: range and sign warnings, scaling, CIE sums, chromaticity, CCT.</summary>
    private static Stage Prepare(Spectrum spectrum, AssessmentOptions options)
    {
        var warnings = new List<string>();
        if (CoverageWarning(spectrum) is { } coverage) warnings.Add(coverage);
        var extremes = Extremes(spectrum.Values);
        if (spectrum.NegativeSampleCount > 0 && NegativeValueWarning(spectrum.NegativeSampleCount, extremes) is { } negative) warnings.Add(negative);
        // Every relative result is independent of scale, so values far from 1 (subnormal or near the top of the double
        // range) are first scaled by a power of two, which is exact; absolute quantities are scaled back at the end and
        // given only when finite.
        int exponent = ScaleExponentOf(extremes);
        double scale = Math.ScaleB(1.0, exponent); // may itself be subnormal or large; only products with it are used
        var work = exponent == 0 ? spectrum : spectrum.ScaleByPowerOfTwo(-exponent);
        var samples = Resampler.ForCieSums(work);

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
        return new Stage(spectrum, work, scale, samples, rawObs, rel, chroma, chroma2, cct, warnings);
    }

    /// <summary>Everything after the rendition indices: photometry, CIE S 026, descriptors, provenance, absolute XYZ.</summary>
    private static Assessment Finish(Stage stage, AssessmentOptions options)
    {
        var spectrum = stage.Spectrum;
        var samples = stage.Samples;
        var warnings = stage.Warnings;
        double scale = stage.Scale;
        var rawObs = stage.RawObserver;
        var photometry = options.Metrics.HasFlag(MetricGroups.Photometry) ? Rescaled(Photometer.Compute(samples, spectrum.Unit), scale, warnings) : null;
        var nonVisual = options.Metrics.HasFlag(MetricGroups.NonVisual) ? Rescaled(AlphaOpic.Compute(samples, spectrum.Unit), scale, warnings) : null;
        var spectral = options.Metrics.HasFlag(MetricGroups.Spectral) ? SpectralDescriptors.Compute(stage.Work, stage.Chroma2) : null;
        if (nonVisual is not null && (spectrum.FirstNm > ExpectedFirstNm || spectrum.LastNm < ExpectedLastNm))
            warnings.Add("CIE S 026 quantities need 380–780 nm; the missing part was taken as zero.");
        var cctOpt = options.CctOptions;
        var provenance = new Provenance(
            MethodsFor(cctOpt.Method, samples),
            Standards,
            PlanckConstants.For(cctOpt.C2).C2,
            spectrum.FirstNm, spectrum.LastNm, samples.StartNm, samples.EndNm, samples.StepNm, samples.Method, spectrum.NegativeSampleCount)
        {
            InputLayout = spectrum.Origin.Layout,
        };
        Tristimulus? absolute = null;
        if (spectrum.Unit.IsAbsolute())
        {
            double k = Colorimeter.KmLumensPerWatt * scale;
            var t = new Tristimulus(k * rawObs.X, k * rawObs.Y, k * rawObs.Z);
            if (double.IsFinite(t.X) && double.IsFinite(t.Y) && double.IsFinite(t.Z)) absolute = t;
            else if (!warnings.Contains(OverflowWarning)) warnings.Add(OverflowWarning);
        }
        return new Assessment(spectrum.Name, spectrum.Origin, spectrum.Unit, options.Observer, stage.Relative, absolute, stage.Chroma, stage.Chroma2, stage.Cct, stage.Cri, stage.Fidelity,
            photometry, nonVisual, spectral, warnings, provenance);
    }

    /// <summary>The standards every assessment cites.</summary>
    private static readonly IReadOnlyList<string> Standards = Array.AsReadOnly(
        ["CIE 015:2018 (colorimetry)", "ISO/CIE 11664-1:2019 (observers)", "ANSI C78.377 (Duv sign)", "CIE 13.3-1995 (Ra, Ri)", "CIE 224:2017 (Rf)", "ANSI/IES TM-30-20 (Rg, hue bins)", "CIE 018:2019 (photometry)", "CIE S 026:2018 (α-opic)"]);

    /// <summary>The method texts of the last assessment, with what they depend on: a batch's records share one set.</summary>
    private sealed record MethodTexts(CctMethod Cct, string Sampling, int StartNm, int EndNm, IReadOnlyDictionary<string, string> Methods);

    private static MethodTexts? _lastMethods;

    /// <summary>
    /// The provenance's method texts for a CCT method and sampling. They depend only on those, so consecutive records
    /// share one read-only dictionary (issue 16: building and formatting it for every record cost ~4 % of a
    /// chromaticity-only batch). The last set is kept; any thread may replace it, and each reader sees a whole set.
    /// </summary>
    private static IReadOnlyDictionary<string, string> MethodsFor(CctMethod cct, RegularSamples samples)
    {
        var last = Volatile.Read(ref _lastMethods);
        if (last is not null && last.Cct == cct && last.StartNm == samples.StartNm && last.EndNm == samples.EndNm && string.Equals(last.Sampling, samples.Method, StringComparison.Ordinal))
            return last.Methods;
        var methods = new System.Collections.ObjectModel.ReadOnlyDictionary<string, string>(new Dictionary<string, string>
        {
            ["tristimulus"] = "CIE 15 summation, relative (Y = 100)",
            ["cct"] = CctResult.Describe(cct),
            ["planckianLocus"] = "Planck's law × CIE 1931 2° CMFs, 360–830 nm at 1 nm",
            ["sampling"] = samples.Method,
            ["cri"] = "CIE 13.3-1995 test-colour-sample method (2°, TCS01–14, reference Planckian < 5000 K, CIE daylight ≥ 5000 K)",
            ["fidelity"] = "CIE 224:2017 Rf (c_f = 6.73, 99 CES, CIE 1964 10°, CAM02-UCS); ANSI/IES TM-30-20 Rg and hue bins",
            ["photometry"] = $"K_m = {Photometer.KmLumensPerWatt} lm/W, K'_m = {Photometer.KmPrimeLumensPerWatt} lm/W; LER over the measured band {samples.StartNm}–{samples.EndNm} nm",
            ["nonVisual"] = "CIE S 026:2018 α-opic action spectra; D65 reference computed from the CIE D65 table (1 nm, 380–780 nm)",
            ["dominantWavelength"] = "CIE 15 §9.1, CIE 1931 2° spectrum locus, achromatic point E",
        });
        Volatile.Write(ref _lastMethods, new MethodTexts(cct, samples.Method, samples.StartNm, samples.EndNm, methods));
        return methods;
    }

    private const string OverflowWarning = "Absolute quantities exceed the range of double precision for these values: not given (relative results are unaffected).";

    /// <summary>
    /// The power of two by which the spectrum is divided before computing: 1 for values of ordinary size
    /// (peak |value| within 10⁻¹⁸…10¹⁸), else the power of two nearest the peak, so that subnormal values or values near the
    /// top of the double range cannot underflow or overflow in the sums, the adaptation transforms or the colour model.
    /// </summary>
    /// <param name="extremes">The spectrum's smallest and largest value (<see cref="Extremes"/>).</param>
    /// <returns>The exponent e of the scale 2^e (0 for ordinary values and for a black spectrum).</returns>
    internal static int ScaleExponentOf((double Min, double Max) extremes)
    {
        double max = Math.Max(Math.Abs(extremes.Min), Math.Abs(extremes.Max)); // the largest magnitude
        if (max == 0 || (max >= 1e-18 && max <= 1e18)) return 0;
        return Math.ILogB(max);
    }

    /// <summary>
    /// The smallest and the largest of finite values, in one vectorised pass (a spectrum's values are finite: checked
    /// on construction). Issue 16: the sign warning and the scale took three passes (minimum, maximum, largest
    /// magnitude), about 5 % of a chromaticity-only batch's CPU; the IEEE 754 minimum and maximum (which order −0 below
    /// +0 and carry NaN) then cost about 1 % more in the native build than the processor's own instructions.
    /// </summary>
    /// <param name="values">Finite values.</param>
    /// <returns>(minimum, maximum); (+∞, −∞) for no values.</returns>
    internal static (double Min, double Max) Extremes(ReadOnlySpan<double> values)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        int i = 0;
        if (values.Length >= Vector<double>.Count)
        {
            var lo = new Vector<double>(values);
            var hi = lo;
            for (i = Vector<double>.Count; i <= values.Length - Vector<double>.Count; i += Vector<double>.Count)
            {
                var v = new Vector<double>(values[i..]);
                lo = Vector.MinNative(lo, v); // the processor's own min/max: the values are finite (no NaN to carry),
                hi = Vector.MaxNative(hi, v); // and callers need only magnitudes and values below zero (−0 vs +0 is moot)
            }
            for (int k = 0; k < Vector<double>.Count; k++)
            {
                min = Math.Min(min, lo[k]);
                max = Math.Max(max, hi[k]);
            }
        }
        for (; i < values.Length; i++)
        {
            min = Math.Min(min, values[i]);
            max = Math.Max(max, values[i]);
        }
        return (min, max);
    }

    private static PhotometricResult Rescaled(PhotometricResult p, double scale, List<string> warnings)
    {
        if (scale == 1 || p.Quantity is null) return p;
        double? S(double? v) => v is { } x ? x * scale : null;
        var r = p with { Photometric = S(p.Photometric), Scotopic = S(p.Scotopic), Radiometric = S(p.Radiometric) };
        if (r.Photometric is { } a && double.IsFinite(a) && r.Scotopic is { } b && double.IsFinite(b) && r.Radiometric is { } c && double.IsFinite(c)) return r;
        if (!warnings.Contains(OverflowWarning)) warnings.Add(OverflowWarning);
        return r with { Photometric = null, Scotopic = null, Radiometric = null };
    }

    private static IReadOnlyList<AlphaOpicResult> Rescaled(IReadOnlyList<AlphaOpicResult> list, double scale, List<string> warnings)
    {
        if (scale == 1) return list;
        var result = new AlphaOpicResult[list.Count];
        for (int i = 0; i < list.Count; i++)
        {
            var a = list[i];
            double? irr = a.Irradiance * scale, edi = a.Edi * scale;
            if ((irr is { } x && !double.IsFinite(x)) || (edi is { } y && !double.IsFinite(y)))
            {
                if (!warnings.Contains(OverflowWarning)) warnings.Add(OverflowWarning);
                irr = null; edi = null;
            }
            result[i] = a with { Irradiance = irr, Edi = edi };
        }
        return result;
    }

    /// <summary>Fraction of the peak below which negative samples are reported as a warning (common practice).</summary>
    public const double NegativeWarningFraction = 0.01;

    /// <summary>
    /// Warns when samples fall below zero by more than 1 % of the peak (more than instrument noise: a dark
    /// reference or stray-light problem). Smaller negatives are only counted in the provenance; all are kept
    /// in the sums, because clipping biases low signals (CIE 167 practice).
    /// </summary>
    /// <param name="negativeCount">How many samples are below zero.</param>
    /// <param name="extremes">The spectrum's smallest and largest value (<see cref="Extremes"/>).</param>
    /// <returns>The warning, or null when there is nothing to say.</returns>
    internal static string? NegativeValueWarning(int negativeCount, (double Min, double Max) extremes)
    {
        if (negativeCount == 0) return null;
        double peak = Math.Max(0, extremes.Max), min = Math.Min(0, extremes.Min);
        return peak > 0 && -min > NegativeWarningFraction * peak
            ? $"{negativeCount} sample(s) below zero, down to {min / peak * 100:0.0} % of the peak: check the dark reference; values kept in the sums, not clipped."
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
