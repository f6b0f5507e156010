using System.Globalization;
using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Comparison;

/// <summary>Compares sources with a reference: distance, correction, filters, object-colour shift and SSI (docs/methods/compare.md).</summary>
public static class SourceComparer
{
    /// <summary>Spectra for a comparison should cover at least this range (the SSI range and the visible), nm.</summary>
    public const double CoverageFirstNm = 375;

    /// <summary>Upper end of the range a comparison expects, nm.</summary>
    public const double CoverageLastNm = 780;

    private static readonly AssessmentOptions ColorimetryOnly = new(Metrics: MetricGroups.Colorimetry);

    /// <summary>Compares one source with a reference.</summary>
    /// <param name="reference">The reference source (any positive scale).</param>
    /// <param name="other">The source to compare (any positive scale).</param>
    /// <param name="filters">Filter transmittances to try on the other source: each alone and every stack of two; may be empty.</param>
    /// <returns>The comparison.</returns>
    public static SourceComparison Compare(Spectrum reference, Spectrum other, IReadOnlyList<Spectrum> filters)
    {
        ArgumentNullException.ThrowIfNull(reference);
        ArgumentNullException.ThrowIfNull(other);
        ArgumentNullException.ThrowIfNull(filters);
        var r = Assessor.Assess(reference, ColorimetryOnly);
        var o = Assessor.Assess(other, ColorimetryOnly);
        double du = o.Chromaticity2Degree.DeltaUPrimeVPrime(r.Chromaticity2Degree);
        double tr = r.Cct.CctKelvin, to = o.Cct.CctKelvin;
        double mired = 1e6 / to - 1e6 / tr, duv = o.Cct.Duv - r.Cct.Duv;
        var correction = new Correction(-mired, -duv, Describe(-mired, -duv));

        var warnings = new List<string>();
        foreach (var (a, label) in new[] { (r, "reference"), (o, "other source") })
        {
            if (!a.Chromaticity2Degree.IsDefined)
                warnings.Add($"The {label} '{a.Name}' has no visible power: it has no chromaticity, so nothing can be compared.");
            if (a.Cct.Conditions.HasFlag(Temperature.CctConditions.FarFromLocus))
                warnings.Add($"The {label} '{a.Name}' has |Duv| > 0.05: CCT, mired and the correction are not meaningful for it.");
            if (a.Cct.Conditions.HasFlag(Temperature.CctConditions.OutsideValidatedRange) || a.Cct.Conditions.HasFlag(Temperature.CctConditions.BeyondLocus))
                warnings.Add($"The {label} '{a.Name}' has a CCT outside 1000–100000 K, where Lumen's CCT is validated.");
        }
        foreach (var s in new[] { reference, other })
            if (s.FirstNm > CoverageFirstNm || s.LastNm < CoverageLastNm)
                warnings.Add(string.Create(CultureInfo.InvariantCulture, $"'{s.Name}' covers {s.FirstNm:0.#}–{s.LastNm:0.#} nm, not all of 375–780 nm: the missing part counts as zero in the SSI and the sample colours."));

        var refSamples = Resampler.ForCieSums(reference);
        var otherSamples = Resampler.ForCieSums(other);
        SampleShiftResult? shift = r.Chromaticity2Degree.IsDefined && o.Chromaticity2Degree.IsDefined ? SampleShift.Compute(refSamples, otherSamples) : null;

        var (ssi, ssiU) = SpectralSimilarityIndex.Compute(other, reference);
        var ssiResult = new SsiResult(ssi, ssiU, DefaultSsi(other, to), DefaultSsi(reference, tr));
        var filterResults = Filters(r, other, o, filters);
        return new SourceComparison(r, o, du, to - tr, mired, duv, correction, filterResults, shift, ssiResult, warnings);
    }

    /// <summary>The correction in plain words, e.g. "needs about +45 MK⁻¹ of warming and a slight magenta shift".</summary>
    /// <param name="miredShift">M(reference) − M(other), MK⁻¹.</param>
    /// <param name="duvShift">Duv(reference) − Duv(other).</param>
    /// <returns>The description.</returns>
    public static string Describe(double miredShift, double duvShift)
    {
        if (!double.IsFinite(miredShift) || !double.IsFinite(duvShift)) return "no correction can be given (a CCT is undefined)";
        string temp = Math.Abs(miredShift) < 1 ? "no colour-temperature change" : string.Create(CultureInfo.InvariantCulture, $"about {miredShift:+0;-0} MK⁻¹ of {(miredShift > 0 ? "warming" : "cooling")}");
        double a = Math.Abs(duvShift);
        string tint = a < 0.001 ? "no green/magenta shift" : $"a {(a < 0.003 ? "slight" : a < 0.006 ? "moderate" : "strong")} {(duvShift > 0 ? "green" : "magenta")} shift";
        return $"needs {temp} and {tint}";
    }

    private static int? DefaultSsi(Spectrum s, double cct) =>
        double.IsFinite(cct) && cct >= Assessor.RenditionMinCctKelvin && cct <= Assessor.RenditionMaxCctKelvin
            ? SpectralSimilarityIndex.Compute(s, SpectralSimilarityIndex.DefaultReference(cct)).Value
            : null;

    private static List<FilterResult> Filters(Assessment reference, Spectrum other, Assessment otherAssessment, IReadOnlyList<Spectrum> filters)
    {
        var results = new List<FilterResult>();
        if (filters.Count == 0) return results;
        double y0 = Lumen.Colorimetry.Colorimeter.RawSums(Resampler.ForCieSums(other), Cie.Observer.Cie1931TwoDegree).Y;
        FilterResult? Try(IReadOnlyList<Spectrum> stack)
        {
            var s = other;
            bool percent = false;
            foreach (var f in stack)
            {
                (s, bool p) = Filter.Apply(s, f);
                percent |= p;
            }
            var a = Assessor.Assess(s, ColorimetryOnly);
            if (!a.Chromaticity2Degree.IsDefined) return null;
            double y = Lumen.Colorimetry.Colorimeter.RawSums(Resampler.ForCieSums(s), Cie.Observer.Cie1931TwoDegree).Y;
            return new FilterResult(string.Join(" + ", stack.Select(f => f.Name)), stack.Select(f => f.Name).ToArray(),
                a.Chromaticity2Degree.DeltaUPrimeVPrime(reference.Chromaticity2Degree), a.Cct.CctKelvin, a.Cct.Duv,
                1e6 / a.Cct.CctKelvin - 1e6 / otherAssessment.Cct.CctKelvin, y / y0, percent);
        }
        for (int i = 0; i < filters.Count; i++)
        {
            if (Try([filters[i]]) is { } one) results.Add(one);
            for (int j = i + 1; j < filters.Count; j++)
                if (Try([filters[i], filters[j]]) is { } two) results.Add(two);
        }
        return results.OrderBy(f => f.ResidualDeltaUPrimeVPrime).ToList();
    }
}
