using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Descriptors;

/// <summary>Spectral descriptors and CIE 15 dominant wavelength / excitation purity.</summary>
/// <remarks>
/// Dominant wavelength per CIE 15:2004 §9.1 (docs/methods/colorimetry.md §4): the ray from the achromatic
/// point N through the sample S meets the spectrum locus (CIE 1931 2°, 360–830 nm at 1 nm) at D, with λd
/// interpolated linearly along the locus segment; if it meets the purple line instead, the opposite ray
/// gives the complementary wavelength, reported negative. Excitation purity p_e = |NS|/|ND|. For light
/// sources Lumen uses the equal-energy point E (1/3, 1/3) as N (CIE 15 practice for light sources, from memory).
/// </remarks>
public static class SpectralDescriptors
{
    private static readonly Lazy<(double[] X, double[] Y, int StartNm)> Locus = new(() =>
    {
        var cmf = CieTables.ColorMatchingFunctions(Observer.Cie1931TwoDegree);
        var xb = cmf.Column("x_bar"); var yb = cmf.Column("y_bar"); var zb = cmf.Column("z_bar");
        var x = new double[cmf.Count]; var y = new double[cmf.Count];
        for (int i = 0; i < cmf.Count; i++)
        {
            double s = xb[i] + yb[i] + zb[i];
            x[i] = xb[i] / s; y[i] = yb[i] / s;
        }
        return (x, y, cmf.StartNm);
    });

    /// <summary>Computes the descriptors of a spectrum with its 2° chromaticity.</summary>
    /// <param name="spectrum">The spectrum (as measured).</param>
    /// <param name="chromaticity2Degree">Its CIE 1931 chromaticity.</param>
    /// <returns>The descriptors.</returns>
    public static SpectralDescriptorResult Compute(Spectrum spectrum, Chromaticity chromaticity2Degree)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var w = spectrum.WavelengthsNm;
        var v = spectrum.Values;
        int peak = 0;
        for (int i = 1; i < v.Length; i++) if (v[i] > v[peak]) peak = i;
        double sum = 0, sumL = 0;
        for (int i = 0; i < v.Length; i++)
        {
            double dl = i == 0 ? w[1] - w[0] : i == v.Length - 1 ? w[i] - w[i - 1] : 0.5 * (w[i + 1] - w[i - 1]);
            sum += v[i] * dl; sumL += w[i] * v[i] * dl;
        }
        double? fwhm = Fwhm(w, v, peak);
        double? dominant = null;
        double purity = double.NaN;
        if (chromaticity2Degree.IsDefined)
        {
            var d = Dominant(chromaticity2Degree.SmallX, chromaticity2Degree.SmallY, 1.0 / 3, 1.0 / 3);
            if (d is { } r) { dominant = r.WavelengthNm; purity = r.ExcitationPurity; }
        }
        return new SpectralDescriptorResult(w[peak], sum != 0 ? sumL / sum : double.NaN, fwhm, dominant, purity, "equal-energy E (1/3, 1/3)");
    }

    private static double? Fwhm(ReadOnlySpan<double> w, ReadOnlySpan<double> v, int peak)
    {
        double half = v[peak] / 2;
        if (!(half > 0)) return null;
        int i = peak;
        while (i > 0 && v[i] > half) i--;
        if (v[i] > half) return null;
        double left = w[i] + (half - v[i]) * (w[i + 1] - w[i]) / (v[i + 1] - v[i]);
        int j = peak;
        while (j < v.Length - 1 && v[j] > half) j++;
        if (v[j] > half) return null;
        double right = w[j - 1] + (half - v[j - 1]) * (w[j] - w[j - 1]) / (v[j] - v[j - 1]);
        return right - left;
    }

    /// <summary>Dominant or complementary wavelength and excitation purity of (x, y) seen from white (xn, yn).</summary>
    /// <param name="x">CIE 1931 2° x of the sample, 0–1.</param>
    /// <param name="y">CIE 1931 2° y of the sample, 0–1.</param>
    /// <param name="xn">x of the achromatic (white) point, 0–1; 1/3 for the equal-energy point E.</param>
    /// <param name="yn">y of the achromatic (white) point, 0–1.</param>
    /// <returns>The result, or null when the sample coincides with the white point.</returns>
    internal static DominantWavelengthResult? Dominant(double x, double y, double xn, double yn)
    {
        double dx = x - xn, dy = y - yn;
        if (Math.Sqrt(dx * dx + dy * dy) < 1e-9) return null;
        var hit = HitLocus(xn, yn, dx, dy);
        if (hit is { } h && !h.Purple)
        {
            double pe = PurityOf(x, y, xn, yn, h.X, h.Y);
            return new DominantWavelengthResult(h.WavelengthNm, pe, false, h.X, h.Y);
        }
        // Purple: D on the purple line (for purity); complementary wavelength from the opposite ray.
        var opposite = HitLocus(xn, yn, -dx, -dy);
        if (hit is not { } p || opposite is not { } o || o.Purple) return null;
        return new DominantWavelengthResult(-o.WavelengthNm, PurityOf(x, y, xn, yn, p.X, p.Y), true, p.X, p.Y);
    }

    private static double PurityOf(double x, double y, double xn, double yn, double xd, double yd) =>
        Math.Abs(xd - xn) > Math.Abs(yd - yn) ? (x - xn) / (xd - xn) : (y - yn) / (yd - yn);

    private static (double X, double Y, double WavelengthNm, bool Purple)? HitLocus(double xn, double yn, double dx, double dy)
    {
        var (lx, ly, start) = Locus.Value;
        double bestT = double.MaxValue;
        (double, double, double, bool)? best = null;
        int n = lx.Length;
        for (int i = 0; i < n; i++)
        {
            // Segment i: locus[i] → locus[i+1]; the last segment is the purple line locus[n-1] → locus[0].
            int j = i == n - 1 ? 0 : i + 1;
            double ax = lx[i], ay = ly[i], bx = lx[j], by = ly[j];
            double ex = bx - ax, ey = by - ay;
            double den = dx * ey - dy * ex;
            if (Math.Abs(den) < 1e-15) continue;
            double t = ((ax - xn) * ey - (ay - yn) * ex) / den;
            double u = ((ax - xn) * dy - (ay - yn) * dx) / den;
            if (t > 0 && u >= 0 && u <= 1 && t < bestT)
            {
                bestT = t;
                best = (xn + t * dx, yn + t * dy, start + i + u * (j == 0 ? 0 : 1), i == n - 1);
            }
        }
        return best;
    }
}
