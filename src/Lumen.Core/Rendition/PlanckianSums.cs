using Lumen.Colorimetry;

namespace Lumen.Rendition;

/// <summary>
/// The sums of a Planckian reference (every weight row of a <see cref="SampleSums"/> table, for Planckian radiators from
/// 1000 K to 5000 K) from a table instead of a pass over the weights: ln F_r(μ) in the mired μ = 10⁶/T, piecewise
/// Chebyshev interpolation of degree 15 on 16 equal pieces of 200–1000 mired (<see cref="MiredChebyshev"/>, issue 16).
/// </summary>
/// <remarks>
/// F_r is a positive, smooth function of μ (a sum of exponentials in μ weighted by positive weights), so its logarithm is
/// interpolated to full double precision: each piece checks itself when first used, at the midpoint between every two of
/// its interpolation nodes, and is used only if every row agrees with the direct sum there within 1e-12 relative (else
/// the Planckian references it covers are summed directly, as before). The interpolation nodes are Planckian spectra from
/// <see cref="ReferenceIlluminants.Planckian"/>, the function that makes the reference spectra themselves.
/// </remarks>
internal sealed class PlanckianSums
{
    /// <summary>Lowest mired tabulated (5000 K).</summary>
    public const double MinMired = 200;

    /// <summary>Highest mired tabulated (1000 K).</summary>
    public const double MaxMired = 1000;

    /// <summary>Relative agreement the table must show with direct sums to be used.</summary>
    public const double Agreement = 1e-12;

    private readonly MiredChebyshev _table;

    private PlanckianSums(MiredChebyshev table) => _table = table;

    /// <summary>The table for some weight rows on a grid; its pieces are fitted and checked on first use.</summary>
    /// <param name="rows">Weight rows (a multiple of 3).</param>
    /// <param name="startNm">Grid start, whole nm.</param>
    /// <param name="stepNm">Grid step, whole nm.</param>
    /// <param name="count">Grid size.</param>
    /// <returns>The table.</returns>
    public static PlanckianSums Build(double[][] rows, int startNm, int stepNm, int count)
    {
        double[] SumsAt(double[] mireds)
        {
            var spectra = mireds.Select(m => ReferenceIlluminants.Planckian(1e6 / m, startNm, stepNm, count)).ToArray();
            var sums = new double[mireds.Length * rows.Length];
            SpectralSum.Many(rows, spectra, sums);
            return sums;
        }
        return new PlanckianSums(MiredChebyshev.Build(MinMired, MaxMired, rows.Length, logarithmic: true, SumsAt, (t, d) => Math.Abs(t - d) <= Agreement * Math.Abs(d)));
    }

    /// <summary>The sums of every row for a Planckian radiator (normalised as <see cref="ReferenceIlluminants.Planckian"/>).</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="sums">Output, one value per row.</param>
    /// <returns>False outside 1000–5000 K, or where the table's piece failed its check (sum the spectrum directly then).</returns>
    public bool TryEvaluate(double temperatureKelvin, Span<double> sums) => _table.TryEvaluate(temperatureKelvin, sums);
}
