using System.Numerics.Tensors;

namespace Lumen.Rendition;

/// <summary>
/// A vector-valued smooth function of the mired μ = 10⁶/T, tabulated by piecewise Chebyshev interpolation (equal pieces
/// of the range, 16 of degree 15 unless asked otherwise), of the values themselves or of their logarithms (issue 16). A table checks
/// itself when built, halfway between every two interpolation nodes and at both ends (where interpolation errs most),
/// and is returned only if every value agrees with the function there.
/// </summary>
internal sealed class MiredChebyshev
{
    private readonly double _minMired, _maxMired, _pieceWidth;
    private readonly int _width, _pieces, _nodes;
    private readonly bool _logarithmic;
    private readonly double[] _coefficients; // [piece][k][value]: one run of values per Chebyshev term

    private MiredChebyshev(double minMired, double maxMired, int width, int pieces, int nodes, bool logarithmic, double[] coefficients)
    {
        _minMired = minMired;
        _maxMired = maxMired;
        _pieces = pieces;
        _nodes = nodes;
        _pieceWidth = (maxMired - minMired) / pieces;
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
    /// <param name="pieces">Equal pieces of the range.</param>
    /// <param name="nodesPerPiece">Interpolation nodes per piece (the degree plus one).</param>
    /// <returns>The table, or null.</returns>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)] // runs at start-up; with the cosines below, the first CIE 224 result of a process fell from 118–143 to 87–105 ms
    public static MiredChebyshev? Build(double minMired, double maxMired, int width, bool logarithmic, Func<double[], double[]> function, Func<double, double, bool> agrees, int pieces = 16, int nodesPerPiece = 16)
    {
        double pieceWidth = (maxMired - minMired) / pieces;
        var coefficients = new double[pieces * nodesPerPiece * width];
        var nodes = new double[nodesPerPiece];
        var values = new double[nodesPerPiece];
        // cos(π·k·(j + ½)/n) once per table, not once per value (the same calls, so the same coefficients).
        var cosines = new double[nodesPerPiece * nodesPerPiece];
        for (int k = 0; k < nodesPerPiece; k++)
            for (int j = 0; j < nodesPerPiece; j++) cosines[k * nodesPerPiece + j] = Math.Cos(Math.PI * k * (j + 0.5) / nodesPerPiece);
        for (int p = 0; p < pieces; p++)
        {
            for (int j = 0; j < nodesPerPiece; j++) nodes[j] = MiredAt(minMired, pieceWidth, p, Math.Cos(Math.PI * (j + 0.5) / nodesPerPiece));
            var at = function(nodes);
            for (int v = 0; v < width; v++)
            {
                for (int j = 0; j < nodesPerPiece; j++)
                {
                    double f = at[j * width + v];
                    if (!double.IsFinite(f) || (logarithmic && !(f > 0))) return null; // ln needs a positive value
                    values[j] = logarithmic ? Math.Log(f) : f;
                }
                for (int k = 0; k < nodesPerPiece; k++)
                {
                    double c = 0;
                    for (int j = 0; j < nodesPerPiece; j++) c += values[j] * cosines[k * nodesPerPiece + j];
                    coefficients[(p * nodesPerPiece + k) * width + v] = (k == 0 ? 1.0 : 2.0) / nodesPerPiece * c;
                }
            }
        }
        var table = new MiredChebyshev(minMired, maxMired, width, pieces, nodesPerPiece, logarithmic, coefficients);
        var probes = new List<double> { minMired, maxMired };
        for (int p = 0; p < pieces; p++)
            for (int j = 0; j < nodesPerPiece - 1; j++)
                probes.Add(MiredAt(minMired, pieceWidth, p, 0.5 * (Math.Cos(Math.PI * (j + 0.5) / nodesPerPiece) + Math.Cos(Math.PI * (j + 1.5) / nodesPerPiece))));
        var direct = function([.. probes]);
        var interpolated = new double[width];
        for (int i = 0; i < probes.Count; i++)
        {
            table.EvaluateAt(probes[i], interpolated); // at the mired itself: 10⁶/(10⁶/μ) may fall just outside the range
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
        EvaluateAt(mired, output);
        return true;
    }

    /// <summary>The values at a mired within the range.</summary>
    private void EvaluateAt(double mired, Span<double> output)
    {
        int p = Math.Min(_pieces - 1, (int)((mired - _minMired) / _pieceWidth));
        double t = (mired - (_minMired + (p + 0.5) * _pieceWidth)) / (0.5 * _pieceWidth);
        // Σ c_k·T_k(t) for every value at once: the Chebyshev polynomials at t once, then one vectorised multiply-add per term.
        output = output[.._width];
        double tkMinus1 = 1, tk = t;
        _coefficients.AsSpan(p * _nodes * _width, _width).CopyTo(output);
        for (int k = 1; k < _nodes; k++)
        {
            TensorPrimitives.MultiplyAdd(_coefficients.AsSpan((p * _nodes + k) * _width, _width), tk, output, output);
            (tkMinus1, tk) = (tk, 2 * t * tk - tkMinus1);
        }
        if (_logarithmic) TensorPrimitives.Exp(output, output);
    }

    private static double MiredAt(double minMired, double pieceWidth, int piece, double t) => minMired + (piece + 0.5 + 0.5 * t) * pieceWidth;
}
