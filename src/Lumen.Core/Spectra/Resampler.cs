namespace Lumen.Spectra;

/// <summary>
/// The one resampler: brings any spectrum onto a regular whole-nanometre grid for the CIE sums.
/// </summary>
/// <remarks>
/// Policy (docs/methods/colorimetry.md §1.4 and the check values of tests/Lumen.Core.Tests, "Sampling decides the CIE 15
/// tables"): a spectrum already on a regular 1 nm or 5 nm grid aligned with the CIE tables is summed at its
/// own step, which reproduces the CIE 15 tabulated values (interpolating spiky 5 nm spectra moves CCT by up
/// to 8 K). Any other regular grid with at least 6 samples is interpolated to 1 nm by Sprague (1880) as
/// CIE 167:2005 §9.2.4 recommends; irregular or sub-nanometre grids are interpolated linearly to 1 nm, which
/// is adequate because the CIE functions are smooth on that scale (colorimetry.md §1.4 item 3).
/// </remarks>
public static class Resampler
{
    /// <summary>The steps of the CIE tables (nm).</summary>
    private static readonly int[] CieSteps = [1, 5];

    /// <summary>The sampling method of a spectrum on the CIE 1 nm and 5 nm grids (worded once, not per spectrum).</summary>
    private const string OwnOneNmStep = "summed at the spectrum's own 1 nm step (CIE 15)", OwnFiveNmStep = "summed at the spectrum's own 5 nm step (CIE 15)";

    /// <summary>Brings <paramref name="spectrum"/> onto the grid the CIE sums use (see remarks of the type).</summary>
    /// <param name="spectrum">The measured spectrum, on any ascending grid.</param>
    /// <returns>The regular samples and the method used. On the CIE grid itself they are the spectrum's own values, not a
    /// copy (a spectrum never changes, and samples are read-only): a batch no longer copies every spectrum once more.</returns>
    public static RegularSamples ForCieSums(Spectrum spectrum)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var step = spectrum.RegularStepNm;
        if (step is double s)
        {
            foreach (int cieStep in CieSteps)
            {
                double first = spectrum.FirstNm;
                if (Math.Abs(s - cieStep) < 1e-6 && Math.Abs(first - Math.Round(first)) < 1e-6
                    && ((int)Math.Round(first)) % cieStep == 0)
                {
                    return new RegularSamples((int)Math.Round(first), cieStep, spectrum.ValueArray,
                        cieStep == 1 ? OwnOneNmStep : OwnFiveNmStep);
                }
            }
            if (spectrum.Count >= 6)
                return SpragueToOneNm(spectrum.FirstNm, s, spectrum.Values);
        }
        return LinearToOneNm(spectrum.WavelengthsNm, spectrum.Values);
    }

    /// <summary>
    /// Sprague (1880) fifth-order interpolation of uniformly spaced data onto the whole-nanometre grid
    /// inside the data's range, with the CIE 167:2005 Table V end extension (divisor 209).
    /// </summary>
    /// <param name="firstNm">Wavelength of the first sample, nm.</param>
    /// <param name="stepNm">Uniform step, nm (positive).</param>
    /// <param name="y">At least 6 samples.</param>
    /// <returns>Samples at every whole nm from ceil(first) to floor(last).</returns>
    /// <remarks>Coefficients as in docs/methods/colorimetry.md §1.4 (CIE 167:2005 §9.2.4). Returns the
    /// original values at the nodes; may overshoot slightly near sharp lines (kept, not clipped).</remarks>
    /// <exception cref="ArgumentException">Fewer than 6 samples or a non-positive step.</exception>
    public static RegularSamples SpragueToOneNm(double firstNm, double stepNm, ReadOnlySpan<double> y)
    {
        int n = y.Length;
        if (n < 6) throw new ArgumentException("Sprague interpolation needs at least 6 samples.", nameof(y));
        if (!(stepNm > 0)) throw new ArgumentException("Step must be positive.", nameof(stepNm));
        var e = new double[n + 4];
        for (int i = 0; i < n; i++) e[i + 2] = y[i];
        e[0] = (884 * y[0] - 1960 * y[1] + 3033 * y[2] - 2648 * y[3] + 1080 * y[4] - 180 * y[5]) / 209.0;
        e[1] = (508 * y[0] - 540 * y[1] + 488 * y[2] - 367 * y[3] + 144 * y[4] - 24 * y[5]) / 209.0;
        e[n + 2] = (-24 * y[n - 6] + 144 * y[n - 5] - 367 * y[n - 4] + 488 * y[n - 3] - 540 * y[n - 2] + 508 * y[n - 1]) / 209.0;
        e[n + 3] = (-180 * y[n - 6] + 1080 * y[n - 5] - 2648 * y[n - 4] + 3033 * y[n - 3] - 1960 * y[n - 2] + 884 * y[n - 1]) / 209.0;
        double lastNm = firstNm + (n - 1) * stepNm;
        int start = (int)Math.Ceiling(firstNm - 1e-9);
        int end = (int)Math.Floor(lastNm + 1e-9);
        var result = new double[end - start + 1];
        for (int k = 0; k < result.Length; k++)
        {
            double pos = (start + k - firstNm) / stepNm;
            int i = Math.Min((int)Math.Floor(pos + 1e-12), n - 1);
            double x = pos - i;
            if (i == n - 1) { result[k] = y[n - 1]; continue; }
            double r0 = e[i], r1 = e[i + 1], r2 = e[i + 2], r3 = e[i + 3], r4 = e[i + 4], r5 = e[i + 5];
            double a1 = (2 * r0 - 16 * r1 + 16 * r3 - 2 * r4) / 24;
            double a2 = (-r0 + 16 * r1 - 30 * r2 + 16 * r3 - r4) / 24;
            double a3 = (-9 * r0 + 39 * r1 - 70 * r2 + 66 * r3 - 33 * r4 + 7 * r5) / 24;
            double a4 = (13 * r0 - 64 * r1 + 126 * r2 - 124 * r3 + 61 * r4 - 12 * r5) / 24;
            double a5 = (-5 * r0 + 25 * r1 - 50 * r2 + 50 * r3 - 25 * r4 + 5 * r5) / 24;
            result[k] = r2 + x * (a1 + x * (a2 + x * (a3 + x * (a4 + x * a5))));
        }
        return new RegularSamples(start, 1, result, $"Sprague interpolation (CIE 167) from {stepNm:0.###} nm to 1 nm");
    }

    /// <summary>Linear interpolation of any ascending grid onto the whole-nanometre grid inside its range.</summary>
    /// <param name="wavelengthsNm">Ascending wavelengths, nm.</param>
    /// <param name="values">Values on a regular grid, at least 6.</param>
    /// <returns>Samples at every whole nm from ceil(first) to floor(last).</returns>
    public static RegularSamples LinearToOneNm(ReadOnlySpan<double> wavelengthsNm, ReadOnlySpan<double> values)
    {
        int start = (int)Math.Ceiling(wavelengthsNm[0] - 1e-9);
        int end = (int)Math.Floor(wavelengthsNm[^1] + 1e-9);
        var result = new double[Math.Max(0, end - start + 1)];
        int j = 0;
        for (int k = 0; k < result.Length; k++)
        {
            double w = start + k;
            while (j < wavelengthsNm.Length - 2 && wavelengthsNm[j + 1] < w) j++;
            double w0 = wavelengthsNm[j], w1 = wavelengthsNm[j + 1];
            double t = Math.Clamp((w - w0) / (w1 - w0), 0, 1);
            result[k] = values[j] + t * (values[j + 1] - values[j]);
        }
        return new RegularSamples(start, 1, result, "linear interpolation to 1 nm (irregular grid)");
    }
}
