using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using Lumen.Spectra;

namespace Lumen.Blackbody;

/// <summary>
/// Least-squares fit of A·(1 + s·(λ − 560 nm)/100 nm)·L(λ, T) (a grey body, optionally with a slowly varying
/// emissivity) to a measured spectrum.
/// </summary>
/// <remarks>docs/methods/planck.md §4: for each trial T the gains are linear and solved in closed form; T is
/// found by a scan in mired (500–50000 K) and golden-section refinement. The 95 % interval on T comes from
/// the Gauss–Newton covariance σ²(JᵀJ)⁻¹ with σ² = RSS/(n − p) and Student's t (MathNet.Numerics). A relative
/// RMS residual above 3 % marks the source as not thermal (LEDs, discharge lamps), where the temperature
/// has no physical meaning.</remarks>
public static class GreyBodyFit
{
    /// <summary>Relative RMS residual above which the source is not treated as thermal (common practice for a
    /// screening fit; chosen here, not from a standard).</summary>
    public const double ThermalResidualLimit = 0.03;

    /// <summary>Fits the spectrum.</summary>
    /// <param name="spectrum">Measured spectrum (relative or absolute radiance).</param>
    /// <param name="fitEmissivitySlope">Also fit a linear emissivity slope.</param>
    /// <returns>The fit; for a spectrum with no signal (all zero) a result with NaN temperature and <see cref="GreyBodyFitResult.HasSignal"/> false.</returns>
    /// <exception cref="ArgumentException">Fewer than 5 samples with positive wavelength.</exception>
    public static GreyBodyFitResult Fit(Spectrum spectrum, bool fitEmissivitySlope = false)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var w = spectrum.WavelengthsNm.ToArray();
        var s = spectrum.Values.ToArray();
        int n = w.Length, p = fitEmissivitySlope ? 3 : 2;
        if (n < p + 2) throw new ArgumentException("Need more samples to fit a grey body.", nameof(spectrum));
        double scaleData = s.Max(Math.Abs);
        if (!(scaleData > 0) || !double.IsFinite(scaleData))
            return new GreyBodyFitResult(double.NaN, double.NaN, double.NaN, 0, 0, double.NaN, false, w[0], w[^1], n); // no signal to fit
        for (int i = 0; i < n; i++) s[i] /= scaleData;

        double Rss(double t, out double a, out double slope)
        {
            // Basis b0 = L, b1 = (λ−560)/100·L, normalised at the band's maximum for conditioning.
            var b0 = new double[n];
            double max = 0;
            for (int i = 0; i < n; i++) { b0[i] = Planck.SpectralRadianceNm(w[i], t, PlanckConstants.Cie15); max = Math.Max(max, b0[i]); }
            if (max <= 0) { a = 0; slope = 0; return double.MaxValue; }
            for (int i = 0; i < n; i++) b0[i] /= max;
            double s00 = 0, s01 = 0, s11 = 0, y0 = 0, y1 = 0;
            for (int i = 0; i < n; i++)
            {
                double b1 = (w[i] - 560) / 100 * b0[i];
                s00 += b0[i] * b0[i]; s01 += b0[i] * b1; s11 += b1 * b1; y0 += s[i] * b0[i]; y1 += s[i] * b1;
            }
            double c0, c1;
            if (fitEmissivitySlope)
            {
                double det = s00 * s11 - s01 * s01;
                c0 = (y0 * s11 - y1 * s01) / det; c1 = (s00 * y1 - s01 * y0) / det;
            }
            else { c0 = y0 / s00; c1 = 0; }
            double rss = 0;
            for (int i = 0; i < n; i++)
            {
                double r = s[i] - (c0 + c1 * (w[i] - 560) / 100) * b0[i];
                rss += r * r;
            }
            a = c0 / max * scaleData;
            slope = c0 != 0 ? c1 / c0 : 0;
            return rss;
        }

        // Scan in mired, then golden section.
        double bestM = 20, bestR = double.MaxValue;
        for (double m = 20; m <= 2000; m *= 1.02)
        {
            double r = Rss(1e6 / m, out _, out _);
            if (r < bestR) { bestR = r; bestM = m; }
        }
        double lo = bestM / 1.02, hi = bestM * 1.02;
        double g = (Math.Sqrt(5) - 1) / 2;
        double c = hi - g * (hi - lo), d = lo + g * (hi - lo);
        double fc = Rss(1e6 / c, out _, out _), fd = Rss(1e6 / d, out _, out _);
        for (int it = 0; it < 200 && hi - lo > 1e-9 * hi; it++)
        {
            if (fc < fd) { hi = d; d = c; fd = fc; c = hi - g * (hi - lo); fc = Rss(1e6 / c, out _, out _); }
            else { lo = c; c = d; fc = fd; d = lo + g * (hi - lo); fd = Rss(1e6 / d, out _, out _); }
        }
        double tBest = 1e6 / (0.5 * (lo + hi));
        double rssBest = Rss(tBest, out double gain, out double slopeBest);

        // Jacobian of the model in (a, [s,] T) at the optimum (data normalised), by central differences in T.
        var jac = Matrix<double>.Build.Dense(n, p);
        double aN = gain / scaleData;
        double dt = tBest * 1e-5;
        for (int i = 0; i < n; i++)
        {
            double l = Planck.SpectralRadianceNm(w[i], tBest, PlanckConstants.Cie15);
            double lp = Planck.SpectralRadianceNm(w[i], tBest + dt, PlanckConstants.Cie15);
            double lm = Planck.SpectralRadianceNm(w[i], tBest - dt, PlanckConstants.Cie15);
            double f = 1 + slopeBest * (w[i] - 560) / 100;
            jac[i, 0] = f * l;
            if (fitEmissivitySlope) jac[i, 1] = aN * (w[i] - 560) / 100 * l;
            jac[i, p - 1] = aN * f * (lp - lm) / (2 * dt);
        }
        double sigma2 = rssBest / (n - p);
        double varT;
        try { varT = sigma2 * (jac.TransposeThisAndMultiply(jac)).Inverse()[p - 1, p - 1]; }
        catch (ArgumentException) { varT = double.NaN; }
        double half = double.IsFinite(varT) ? StudentT.InvCDF(0, 1, n - p, 0.975) * Math.Sqrt(Math.Max(0, varT)) : double.NaN;
        double rmsData = Math.Sqrt(s.Sum(x => x * x) / n);
        double rel = Math.Sqrt(rssBest / n) / rmsData;
        bool thermal = rel <= ThermalResidualLimit && gain > 0;
        return new GreyBodyFitResult(tBest, tBest - half, tBest + half, gain, slopeBest, rel, thermal, w[0], w[^1], n);
    }
}
