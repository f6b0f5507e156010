using System.Collections.Concurrent;
using Lumen.Spectra;

namespace Lumen.Uncertainty;

/// <summary>
/// Draws spectra as the model says the instrument could have read them (docs/methods/uncertainty.md §2):
/// S′ᵢ = S(λᵢ − δ)·(1 + ε_scale)·(1 + ε_smooth(λᵢ))·(1 + εᵢ) + ηᵢ, with δ the wavelength-scale offset (S between samples
/// by linear interpolation, end values held), ε_scale the common scale error, ε_smooth the smooth responsivity error,
/// εᵢ the relative and ηᵢ the absolute noise. The smooth error is drawn from a truncated Karhunen–Loève expansion: the
/// eigenvectors of the correlation matrix exp(−Δλ²/2ℓ²) on the spectrum's grid that carry 99.99 % of its trace.
/// </summary>
public sealed class SpectrumPerturbation
{
    /// <summary>Share of the correlation matrix's trace the smooth basis keeps.</summary>
    public const double BasisTraceShare = 0.9999;

    private static readonly ConcurrentDictionary<(int, double, double, double, double), double[][]> BasisCache = new();

    private readonly Spectrum _spectrum;
    private readonly UncertaintyModel _model;
    private readonly double[] _wavelengths, _values;
    private readonly double[][] _basis; // K vectors of length n, each scaled by √eigenvalue

    /// <summary>Prepares draws of a spectrum under a model.</summary>
    /// <param name="spectrum">The measured spectrum.</param>
    /// <param name="model">The uncertainty model (valid).</param>
    public SpectrumPerturbation(Spectrum spectrum, UncertaintyModel model)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(model);
        _spectrum = spectrum;
        _model = model;
        _wavelengths = spectrum.WavelengthsNm.ToArray();
        _values = spectrum.Values.ToArray();
        _basis = model.SmoothRelative > 0 ? SmoothBasis(_wavelengths, model.CorrelationLengthNm) : [];
    }

    /// <summary>Number of smooth basis functions kept (0 without a smooth component).</summary>
    public int SmoothBasisSize => _basis.Length;

    /// <summary>The eigen-basis of the Gaussian correlation on a grid, cached per grid and length.</summary>
    internal static double[][] SmoothBasis(double[] wavelengths, double lengthNm)
    {
        var key = (wavelengths.Length, wavelengths[0], wavelengths[^1], wavelengths.Sum(), lengthNm);
        return BasisCache.GetOrAdd(key, _ =>
        {
            int n = wavelengths.Length;
            var r = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, n, (i, j) =>
            {
                double d = wavelengths[i] - wavelengths[j];
                return Math.Exp(-d * d / (2 * lengthNm * lengthNm));
            });
            var evd = r.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
            var pairs = Enumerable.Range(0, n).Select(k => (Value: evd.EigenValues[k].Real, k)).OrderByDescending(p => p.Value).ToList();
            double total = n, kept = 0; // the trace of a correlation matrix is n
            var basis = new List<double[]>();
            foreach (var (value, k) in pairs)
            {
                if (kept >= BasisTraceShare * total || value <= 0) break;
                kept += value;
                double scale = Math.Sqrt(value);
                var v = new double[n];
                for (int i = 0; i < n; i++) v[i] = evd.EigenVectors[i, k] * scale;
                basis.Add(v);
            }
            return basis.ToArray();
        });
    }

    /// <summary>Draws one spectrum.</summary>
    /// <param name="rng">The draw's random stream.</param>
    /// <returns>The perturbed spectrum (same grid, unit, name and origin).</returns>
    internal Spectrum Draw(ref RandomStream rng)
    {
        int n = _values.Length;
        var m = _model;
        var y = new double[n];
        double shift = m.WavelengthShiftNm > 0 ? m.WavelengthShiftNm * rng.NextGaussian() : 0;
        if (shift != 0) for (int i = 0; i < n; i++) y[i] = Interpolate(_wavelengths[i] - shift);
        else Array.Copy(_values, y, n);
        double scale = 1 + (m.RelativeScale > 0 ? m.RelativeScale * rng.NextGaussian() : 0);
        if (_basis.Length > 0)
        {
            var smooth = new double[n];
            foreach (var b in _basis)
            {
                double z = rng.NextGaussian() * m.SmoothRelative;
                for (int i = 0; i < n; i++) smooth[i] += z * b[i];
            }
            for (int i = 0; i < n; i++) y[i] *= 1 + smooth[i];
        }
        for (int i = 0; i < n; i++)
        {
            double v = y[i] * scale;
            if (m.RelativeNoise > 0) v *= 1 + m.RelativeNoise * rng.NextGaussian();
            if (m.AbsoluteNoise > 0) v += m.AbsoluteNoise * rng.NextGaussian();
            y[i] = v;
        }
        return new Spectrum(_wavelengths, y, _spectrum.Unit, _spectrum.Name, _spectrum.Origin);
    }

    /// <summary>S at a wavelength by linear interpolation between samples; end values held outside the grid.</summary>
    private double Interpolate(double wl)
    {
        var w = _wavelengths;
        if (wl <= w[0]) return _values[0];
        if (wl >= w[^1]) return _values[^1];
        int hi = Array.BinarySearch(w, wl);
        if (hi >= 0) return _values[hi];
        hi = ~hi;
        int lo = hi - 1;
        double t = (wl - w[lo]) / (w[hi] - w[lo]);
        return _values[lo] + t * (_values[hi] - _values[lo]);
    }
}
