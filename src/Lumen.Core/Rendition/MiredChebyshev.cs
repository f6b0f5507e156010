using System.Numerics.Tensors;

namespace Lumen.Rendition;

/// <summary>
/// A vector-valued smooth function of the mired μ = 10⁶/T, tabulated by piecewise Chebyshev interpolation (16 equal
/// pieces of the range, degree 15 on each), of the values themselves or of their logarithms (issue 16). A table checks
/// itself when built, halfway between every two interpolation nodes and at both ends (where interpolation errs most),
/// and is returned only if every value agrees with the function there.
/// </summary>
internal sealed class MiredChebyshev
{
    private const int Pieces = 16, Nodes = 16;
    private readonly double _minMired, _maxMired, _pieceWidth;
    private readonly int _width;
    private readonly bool _logarithmic;
    private readonly double[] _coefficients; // [piece][k][value]: one run of values per Chebyshev term

    private MiredChebyshev(double minMired, double maxMired, int width, bool logarithmic, double[] coefficients)
    {
        _minMired = minMired;
        _maxMired = maxMired;
        _pieceWidth = (maxMired - minMired) / Pieces;
        _width = width;
        _logarithmic = logarithmic;
        _coefficients = coefficients;
    }

    /// <summary>Fits and checks a table; null when the function cannot be tabulated or the check fails.</summary>
    /// <param name="minMired">Lowest mired (highest temperature) of the range.</param>
    /// <param name="maxMired">Highest mired (lowest temperature).</param>
    /// <param name="width">Values per point.</param>
    /// <param name="logarithmic">Interpolate ln of the values (which must then be positive).</param>
    /// <param name="function">The values at each of many mireds at once (one run of <paramref name="width"/> per mired).</param>
    /// <param name="agrees">Whether an interpolated value agrees with the function's (interpolated, exact).</param>
    /// <returns>The table, or null.</returns>
    public static MiredChebyshev? Build(double minMired, double maxMired, int width, bool logarithmic, Func<double[], double[]> function, Func<double, double, bool> agrees)
    {
        double pieceWidth = (maxMired - minMired) / Pieces;
        var coefficients = new double[Pieces * Nodes * width];
        var nodes = new double[Nodes];
        var values = new double[Nodes];
        for (int p = 0; p < Pieces; p++)
        {
            for (int j = 0; j < Nodes; j++) nodes[j] = MiredAt(minMired, pieceWidth, p, Math.Cos(Math.PI * (j + 0.5) / Nodes));
            var at = function(nodes);
            for (int v = 0; v < width; v++)
            {
                for (int j = 0; j < Nodes; j++)
                {
                    double f = at[j * width + v];
                    if (!double.IsFinite(f) || (logarithmic && !(f > 0))) return null; // ln needs a positive value
                    values[j] = logarithmic ? Math.Log(f) : f;
                }
                for (int k = 0; k < Nodes; k++)
                {
                    double c = 0;
                    for (int j = 0; j < Nodes; j++) c += values[j] * Math.Cos(Math.PI * k * (j + 0.5) / Nodes);
                    coefficients[(p * Nodes + k) * width + v] = (k == 0 ? 1.0 : 2.0) / Nodes * c;
                }
            }
        }
        var table = new MiredChebyshev(minMired, maxMired, width, logarithmic, coefficients);
        var probes = new List<double> { minMired, maxMired };
        for (int p = 0; p < Pieces; p++)
            for (int j = 0; j < Nodes - 1; j++)
                probes.Add(MiredAt(minMired, pieceWidth, p, 0.5 * (Math.Cos(Math.PI * (j + 0.5) / Nodes) + Math.Cos(Math.PI * (j + 1.5) / Nodes))));
        var direct = function([.. probes]);
        var interpolated = new double[width];
        for (int i = 0; i < probes.Count; i++)
        {
            if (!table.TryEvaluate(1e6 / probes[i], interpolated)) return null;
            for (int v = 0; v < width; v++)
                if (!agrees(interpolated[v], direct[i * width + v])) return null;
        }
        return table;
    }

    /// <summary>The values at a temperature.</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="output">Output, one per value.</param>
    /// <returns>False outside the range.</returns>
    public bool TryEvaluate(double temperatureKelvin, Span<double> output)
    {
        double mired = 1e6 / temperatureKelvin;
        if (!(mired >= _minMired && mired <= _maxMired)) return false;
        int p = Math.Min(Pieces - 1, (int)((mired - _minMired) / _pieceWidth));
        double t = (mired - (_minMired + (p + 0.5) * _pieceWidth)) / (0.5 * _pieceWidth);
        // Σ c_k·T_k(t) for every value at once: the Chebyshev polynomials at t once, then one vectorised multiply-add per term.
        output = output[.._width];
        double tkMinus1 = 1, tk = t;
        _coefficients.AsSpan(p * Nodes * _width, _width).CopyTo(output);
        for (int k = 1; k < Nodes; k++)
        {
            TensorPrimitives.MultiplyAdd(_coefficients.AsSpan((p * Nodes + k) * _width, _width), tk, output, output);
            (tkMinus1, tk) = (tk, 2 * t * tk - tkMinus1);
        }
        if (_logarithmic) TensorPrimitives.Exp(output, output);
        return true;
    }

    private static double MiredAt(double minMired, double pieceWidth, int piece, double t) => minMired + (piece + 0.5 + 0.5 * t) * pieceWidth;
}
