using Lumen.Analysis;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Uncertainty;

/// <summary>
/// The law of propagation of uncertainty (JCGM 100:2008 §5.1–5.2; docs/methods/uncertainty.md §4) for the tristimulus
/// values, xy, u′v′, CCT and Duv. XYZ are linear in the spectral values: their sensitivity coefficients are the CIE
/// summation weights (found by summing unit spectra through the same resampling as every result), so the XYZ
/// covariance W·Σ_S·Wᵀ is exact for the noise, scale and smooth components. The wavelength offset enters through
/// ∂XYZ/∂δ by a central difference. From XYZ, xy and u′v′ follow by their analytic derivatives, CCT and Duv by central
/// differences of the same CCT solver in u′ and v′ (step 10⁻⁶). First order only: where the model is not linear the
/// Monte Carlo value is the one to use.
/// </summary>
public static class LinearPropagation
{
    /// <summary>Standard uncertainties by result-field path: tristimulus.X/Z (Y = 100), chromaticity.x/y/u/v/uPrime/vPrime
    /// (the options' observer), cct.kelvin and cct.duv (2°).</summary>
    /// <param name="spectrum">The measured spectrum.</param>
    /// <param name="options">The assessment's options (observer, CCT method).</param>
    /// <param name="model">The uncertainty model.</param>
    /// <returns>Field path → standard uncertainty; empty when XYZ is undefined.</returns>
    public static IReadOnlyDictionary<string, double> Of(Spectrum spectrum, AssessmentOptions options, UncertaintyModel model)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(model);
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        var (xyz, cov) = XyzCovariance(spectrum, options.Observer, model);
        if (!(xyz[1] > 0)) return result;
        double x = xyz[0], y = xyz[1], z = xyz[2], t = x + y + z, d = x + 15 * y + 3 * z;
        double[] Gx = [(y + z) / (t * t), -x / (t * t), -x / (t * t)];
        double[] Gy = [-y / (t * t), (x + z) / (t * t), -y / (t * t)];
        double[] Gu = [4 / d - 4 * x / (d * d), -60 * x / (d * d), -12 * x / (d * d)];
        double[] Gv = [-9 * y / (d * d), 9 / d - 135 * y / (d * d), -27 * y / (d * d)];
        double[] GX = [100 / y, -100 * x / (y * y), 0];
        double[] GZ = [0, -100 * z / (y * y), 100 / y];
        result["tristimulus.X"] = Std(GX, cov);
        result["tristimulus.Z"] = Std(GZ, cov);
        result["chromaticity.x"] = Std(Gx, cov);
        result["chromaticity.y"] = Std(Gy, cov);
        result["chromaticity.uPrime"] = Std(Gu, cov);
        result["chromaticity.vPrime"] = Std(Gv, cov);
        result["chromaticity.u"] = Std(Gu, cov);
        result["chromaticity.v"] = Std(Gv, cov) / 1.5;

        // CCT and Duv always use the 2° observer.
        var (xyz2, cov2) = options.Observer == Observer.Cie1931TwoDegree ? (xyz, cov) : XyzCovariance(spectrum, Observer.Cie1931TwoDegree, model);
        double x2 = xyz2[0], y2 = xyz2[1], z2 = xyz2[2], d2 = x2 + 15 * y2 + 3 * z2;
        double[] Gu2 = [4 / d2 - 4 * x2 / (d2 * d2), -60 * x2 / (d2 * d2), -12 * x2 / (d2 * d2)];
        double[] Gv2 = [-9 * y2 / (d2 * d2), 9 / d2 - 135 * y2 / (d2 * d2), -27 * y2 / (d2 * d2)];
        double up = 4 * x2 / d2, vp = 9 * y2 / d2;
        const double h = 1e-6;
        CctResult At(double u, double v) => CctSolver.Solve(Chromaticity.FromUPrimeVPrime(u, v), options.CctOptions);
        var (pu, mu, pv, mv) = (At(up + h, vp), At(up - h, vp), At(up, vp + h), At(up, vp - h));
        double dTdu = (pu.CctKelvin - mu.CctKelvin) / (2 * h), dTdv = (pv.CctKelvin - mv.CctKelvin) / (2 * h);
        double dDdu = (pu.Duv - mu.Duv) / (2 * h), dDdv = (pv.Duv - mv.Duv) / (2 * h);
        var gT = new double[3];
        var gD = new double[3];
        for (int k = 0; k < 3; k++) { gT[k] = dTdu * Gu2[k] + dTdv * Gv2[k]; gD[k] = dDdu * Gu2[k] + dDdv * Gv2[k]; }
        if (double.IsFinite(dTdu) && double.IsFinite(dTdv)) result["cct.kelvin"] = Std(gT, cov2);
        if (double.IsFinite(dDdu) && double.IsFinite(dDdv)) result["cct.duv"] = Std(gD, cov2);
        return result;
    }

    private static double Std(double[] g, double[,] c)
    {
        double s = 0;
        for (int i = 0; i < 3; i++) for (int j = 0; j < 3; j++) s += g[i] * c[i, j] * g[j];
        return Math.Sqrt(Math.Max(0, s));
    }

    /// <summary>Raw XYZ (k = 1) of the spectrum and their 3×3 covariance under the model.</summary>
    internal static (double[] Xyz, double[,] Covariance) XyzCovariance(Spectrum spectrum, Observer observer, UncertaintyModel model)
    {
        int n = spectrum.Count;
        var wl = spectrum.WavelengthsNm.ToArray();
        var s = spectrum.Values.ToArray();
        var w = Weights(spectrum, observer);
        var xyz = new double[3];
        for (int a = 0; a < 3; a++) for (int i = 0; i < n; i++) xyz[a] += w[a][i] * s[i];
        var cov = new double[3, 3];
        double r2 = model.RelativeNoise * model.RelativeNoise, b2 = model.AbsoluteNoise * model.AbsoluteNoise;
        for (int a = 0; a < 3; a++)
            for (int b = 0; b < 3; b++)
            {
                double sum = 0;
                for (int i = 0; i < n; i++) sum += w[a][i] * w[b][i] * (r2 * s[i] * s[i] + b2);
                cov[a, b] = sum + model.RelativeScale * model.RelativeScale * xyz[a] * xyz[b];
            }
        if (model.SmoothRelative > 0)
        {
            // σ²·Σᵢⱼ AₐᵢρᵢⱼAᵦⱼ with A = W·diag(S) and ρ the Gaussian correlation.
            double l2 = 2 * model.CorrelationLengthNm * model.CorrelationLengthNm, s2 = model.SmoothRelative * model.SmoothRelative;
            var rowA = new double[3][];
            for (int a = 0; a < 3; a++) { rowA[a] = new double[n]; for (int i = 0; i < n; i++) rowA[a][i] = w[a][i] * s[i]; }
            var tmp = new double[3];
            for (int i = 0; i < n; i++)
            {
                Array.Clear(tmp);
                for (int j = 0; j < n; j++)
                {
                    double dl = wl[i] - wl[j], rho = Math.Exp(-dl * dl / l2);
                    for (int b = 0; b < 3; b++) tmp[b] += rho * rowA[b][j];
                }
                for (int a = 0; a < 3; a++) for (int b = 0; b < 3; b++) cov[a, b] += s2 * rowA[a][i] * tmp[b];
            }
        }
        if (model.WavelengthShiftNm > 0)
        {
            // ∂XYZ/∂δ for S′ᵢ = S(λᵢ − δ): −W·dS/dλ with central differences of the samples (one-sided at the ends).
            var g = new double[3];
            for (int i = 0; i < n; i++)
            {
                int lo = Math.Max(0, i - 1), hi = Math.Min(n - 1, i + 1);
                double slope = (s[hi] - s[lo]) / (wl[hi] - wl[lo]);
                for (int a = 0; a < 3; a++) g[a] -= w[a][i] * slope;
            }
            double u2 = model.WavelengthShiftNm * model.WavelengthShiftNm;
            for (int a = 0; a < 3; a++) for (int b = 0; b < 3; b++) cov[a, b] += u2 * g[a] * g[b];
        }
        return (xyz, cov);
    }

    /// <summary>The summation weights of each spectral value in raw X, Y, Z (the sums are linear in the values).</summary>
    internal static double[][] Weights(Spectrum spectrum, Observer observer)
    {
        int n = spectrum.Count;
        var w = new[] { new double[n], new double[n], new double[n] };
        var unit = new double[n];
        var wl = spectrum.WavelengthsNm.ToArray();
        for (int i = 0; i < n; i++)
        {
            unit[i] = 1;
            var raw = Colorimeter.RawSums(Resampler.ForCieSums(new Spectrum(wl, unit, spectrum.Unit, "unit", spectrum.Origin)), observer);
            w[0][i] = raw.X; w[1][i] = raw.Y; w[2][i] = raw.Z;
            unit[i] = 0;
        }
        return w;
    }
}
