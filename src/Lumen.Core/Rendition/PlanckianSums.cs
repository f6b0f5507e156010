using Lumen.Colorimetry;

namespace Lumen.Rendition;

/// <summary>
/// The sums of a Planckian reference (every weight row of a <see cref="SampleSums"/> table, for Planckian radiators from
/// 1000 K to 5000 K) from a table instead of a pass over the weights: ln F_r(μ) in the mired μ = 10⁶/T, piecewise
/// Chebyshev interpolation of degree 15 on 16 equal pieces of 200–1000 mired (issue 16).
/// </summary>
/// <remarks>
/// F_r is a positive, smooth function of μ (a sum of exponentials in μ weighted by positive weights), so its logarithm is
/// interpolated to full double precision: the table checks itself when built, at the midpoint between every two
/// interpolation nodes, and is used only if every row agrees with the direct sum there within 1e-12 relative (else every
/// Planckian reference is summed directly, as before). The interpolation nodes are Planckian spectra from
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

    private const int Pieces = 16, Nodes = 16;
    private const double PieceWidth = (MaxMired - MinMired) / Pieces;
    private readonly int _rows;
    private readonly double[] _coefficients; // [piece][k][row]: one run of rows per Chebyshev term

    private PlanckianSums(int rows, double[] coefficients)
    {
        _rows = rows;
        _coefficients = coefficients;
    }

    /// <summary>Builds and checks the table for some weight rows on a grid; null when the check fails.</summary>
    /// <param name="rows">Weight rows (a multiple of 3).</param>
    /// <param name="startNm">Grid start, whole nm.</param>
    /// <param name="stepNm">Grid step, whole nm.</param>
    /// <param name="count">Grid size.</param>
    /// <returns>The table, or null to sum Planckian references directly.</returns>
    public static PlanckianSums? Build(double[][] rows, int startNm, int stepNm, int count)
    {
        int r = rows.Length;
        var coefficients = new double[Pieces * r * Nodes];
        var spectra = new double[Nodes][];
        var sums = new double[Nodes * r];
        var values = new double[Nodes];
        for (int p = 0; p < Pieces; p++)
        {
            for (int j = 0; j < Nodes; j++)
                spectra[j] = ReferenceIlluminants.Planckian(1e6 / MiredAt(p, Math.Cos(Math.PI * (j + 0.5) / Nodes)), startNm, stepNm, count);
            SpectralSum.Many(rows, spectra, sums);
            for (int row = 0; row < r; row++)
            {
                for (int j = 0; j < Nodes; j++)
                {
                    double f = sums[j * r + row];
                    if (!(f > 0) || !double.IsFinite(f)) return null; // a row without a positive sum cannot be tabulated in ln
                    values[j] = Math.Log(f);
                }
                for (int k = 0; k < Nodes; k++)
                {
                    double c = 0;
                    for (int j = 0; j < Nodes; j++) c += values[j] * Math.Cos(Math.PI * k * (j + 0.5) / Nodes);
                    coefficients[(p * Nodes + k) * r + row] = (k == 0 ? 1.0 : 2.0) / Nodes * c;
                }
            }
        }
        var table = new PlanckianSums(r, coefficients);
        return table.Check(rows, startNm, stepNm, count) ? table : null;
    }

    /// <summary>The sums of every row for a Planckian radiator (normalised as <see cref="ReferenceIlluminants.Planckian"/>).</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="sums">Output, one value per row.</param>
    /// <returns>False outside 1000–5000 K (sum the spectrum directly then).</returns>
    public bool TryEvaluate(double temperatureKelvin, Span<double> sums)
    {
        double mired = 1e6 / temperatureKelvin;
        if (!(mired >= MinMired && mired <= MaxMired)) return false;
        int p = Math.Min(Pieces - 1, (int)((mired - MinMired) / PieceWidth));
        double t = (mired - (MinMired + (p + 0.5) * PieceWidth)) / (0.5 * PieceWidth);
        // Σ c_k·T_k(t) for every row at once: the Chebyshev polynomials at t once, then one vectorised multiply-add per term.
        var output = sums[.._rows];
        double tkMinus1 = 1, tk = t;
        _coefficients.AsSpan(p * Nodes * _rows, _rows).CopyTo(output);
        for (int k = 1; k < Nodes; k++)
        {
            System.Numerics.Tensors.TensorPrimitives.MultiplyAdd(_coefficients.AsSpan((p * Nodes + k) * _rows, _rows), tk, output, output);
            (tkMinus1, tk) = (tk, 2 * t * tk - tkMinus1);
        }
        System.Numerics.Tensors.TensorPrimitives.Exp(output, output);
        return true;
    }

    private static double MiredAt(int piece, double t) => MinMired + (piece + 0.5 + 0.5 * t) * PieceWidth;

    /// <summary>Compares the table with direct sums halfway between nodes (where interpolation errs most) and at the ends.</summary>
    private bool Check(double[][] rows, int startNm, int stepNm, int count)
    {
        var probes = new List<double> { MinMired, MaxMired };
        for (int p = 0; p < Pieces; p++)
            for (int j = 0; j < Nodes - 1; j++)
                probes.Add(MiredAt(p, 0.5 * (Math.Cos(Math.PI * (j + 0.5) / Nodes) + Math.Cos(Math.PI * (j + 1.5) / Nodes))));
        var spectra = probes.Select(m => ReferenceIlluminants.Planckian(1e6 / m, startNm, stepNm, count)).ToArray();
        var direct = new double[spectra.Length * _rows];
        SpectralSum.Many(rows, spectra, direct);
        Span<double> table = stackalloc double[_rows];
        for (int i = 0; i < probes.Count; i++)
        {
            if (!TryEvaluate(1e6 / probes[i], table)) return false;
            for (int row = 0; row < _rows; row++)
            {
                double d = direct[i * _rows + row];
                if (Math.Abs(table[row] - d) > Agreement * Math.Abs(d)) return false;
            }
        }
        return true;
    }
}
