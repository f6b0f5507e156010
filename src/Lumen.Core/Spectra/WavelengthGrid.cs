namespace Lumen.Spectra;

/// <summary>Wavelength grids.</summary>
public static class WavelengthGrid
{
    /// <summary>The wavelengths first, first + step, …, up to last (included when it falls on the grid), nm.</summary>
    /// <param name="firstNm">First wavelength, nm (finite).</param>
    /// <param name="lastNm">Last wavelength, nm (≥ first).</param>
    /// <param name="stepNm">Step, nm (positive).</param>
    /// <returns>The grid, ascending.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The step is not positive, or the range is empty or not finite.</exception>
    public static double[] Regular(double firstNm, double lastNm, double stepNm)
    {
        if (!(stepNm > 0) || !double.IsFinite(stepNm)) throw new ArgumentOutOfRangeException(nameof(stepNm), "The step must be positive and finite.");
        if (!double.IsFinite(firstNm) || !(lastNm >= firstNm) || !double.IsFinite(lastNm)) throw new ArgumentOutOfRangeException(nameof(lastNm), "The range must be finite with last ≥ first.");
        int n = (int)Math.Floor((lastNm - firstNm) / stepNm + 1e-9) + 1;
        var g = new double[n];
        for (int i = 0; i < n; i++) g[i] = firstNm + i * stepNm;
        return g;
    }
}
