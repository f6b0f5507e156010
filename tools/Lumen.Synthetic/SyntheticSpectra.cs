using Lumen.Spectra;
using Lumen.Blackbody;

namespace Lumen.Synthetic;

/// <summary>
/// Synthetic spectra for examples, benchmarks and tests: blackbody, phosphor-converted white LED, mixtures,
/// and seeded measurement noise. Deterministic: the only randomness comes from an explicit seed.
/// </summary>
/// <remarks>These are invented shapes for demonstration, not models of any real product.</remarks>
public static class SyntheticSpectra
{
    /// <summary>The wavelengths first, first+step, …, last (nm).</summary>
    /// <param name="firstNm">First wavelength.</param>
    /// <param name="lastNm">Last wavelength (included when on the grid).</param>
    /// <param name="stepNm">Step (positive).</param>
    /// <returns>The grid.</returns>
    public static double[] Grid(double firstNm, double lastNm, double stepNm) => WavelengthGrid.Regular(firstNm, lastNm, stepNm);

    /// <summary>A blackbody's relative spectral radiance, normalised to 1 at 560 nm (CIE 15 c2).</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="wavelengthsNm">Grid.</param>
    /// <param name="name">Name.</param>
    /// <returns>The spectrum (unit relative).</returns>
    public static Spectrum Blackbody(double temperatureKelvin, double[] wavelengthsNm, string name)
    {
        ArgumentNullException.ThrowIfNull(wavelengthsNm);
        var c = PlanckConstants.Cie15;
        double norm = Planck.SpectralRadianceNm(560, temperatureKelvin, c);
        var v = wavelengthsNm.Select(w => Planck.SpectralRadianceNm(w, temperatureKelvin, c) / norm).ToArray();
        return new Spectrum(wavelengthsNm, v, SpectralUnit.Relative, name, SpectrumOrigin.Generated($"blackbody {temperatureKelvin} K"));
    }

    /// <summary>A phosphor-converted white LED: sum of three Gaussian bands (pump, green, red).</summary>
    /// <param name="model">Band parameters.</param>
    /// <param name="wavelengthsNm">Grid.</param>
    /// <param name="name">Name.</param>
    /// <returns>The spectrum (unit relative, green band peak ≈ 1).</returns>
    public static Spectrum PhosphorLed(PhosphorLedModel model, double[] wavelengthsNm, string name)
    {
        ArgumentNullException.ThrowIfNull(wavelengthsNm);
        var v = new double[wavelengthsNm.Length];
        for (int i = 0; i < v.Length; i++)
        {
            double w = wavelengthsNm[i];
            v[i] = model.BlueWeight * Gauss(w, model.BluePeakNm, model.BlueFwhmNm)
                 + Gauss(w, model.GreenPeakNm, model.GreenFwhmNm)
                 + model.RedWeight * Gauss(w, model.RedPeakNm, model.RedFwhmNm);
        }
        return new Spectrum(wavelengthsNm, v, SpectralUnit.Relative, name, SpectrumOrigin.Generated("synthetic phosphor LED"));
    }

    /// <summary>A weighted sum of spectra on the same grid.</summary>
    /// <param name="parts">Spectra and weights.</param>
    /// <param name="name">Name.</param>
    /// <returns>The mixture.</returns>
    public static Spectrum Mix(IReadOnlyList<(Spectrum Spectrum, double Weight)> parts, string name)
    {
        ArgumentNullException.ThrowIfNull(parts);
        var w = parts[0].Spectrum.WavelengthsNm.ToArray();
        var v = new double[w.Length];
        foreach (var (s, weight) in parts)
        {
            if (s.Count != w.Length) throw new ArgumentException("All parts must share one grid.", nameof(parts));
            for (int i = 0; i < v.Length; i++) v[i] += weight * s.Values[i];
        }
        return new Spectrum(w, v, parts[0].Spectrum.Unit, name, SpectrumOrigin.Generated("mixture"));
    }

    /// <summary>Adds Gaussian noise (standard deviation relative to the spectrum's maximum) from a seed.</summary>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="relativeSigma">Noise σ as a fraction of the peak value.</param>
    /// <param name="seed">Random seed.</param>
    /// <returns>The noisy spectrum (negative values possible, as with dark-subtracted instruments).</returns>
    public static Spectrum WithNoise(Spectrum spectrum, double relativeSigma, int seed)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var rng = new Random(seed);
        double peak = 0;
        foreach (var x in spectrum.Values) peak = Math.Max(peak, x);
        var v = spectrum.Values.ToArray();
        for (int i = 0; i < v.Length; i++)
        {
            double u1 = 1.0 - rng.NextDouble(), u2 = rng.NextDouble();
            v[i] += relativeSigma * peak * Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
        }
        return new Spectrum(spectrum.WavelengthsNm, v, spectrum.Unit, spectrum.Name, spectrum.Origin);
    }

    private static double Gauss(double x, double mu, double fwhm)
    {
        double s = fwhm / 2.354820045;
        double d = (x - mu) / s;
        return Math.Exp(-0.5 * d * d);
    }
}
