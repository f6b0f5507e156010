using System.Numerics.Tensors;

namespace Lumen.Rendition;

/// <summary>
/// A vector-valued smooth function of the mired μ = 10⁶/T, tabulated by piecewise Chebyshev interpolation (equal pieces
/// of the range, 16 of degree 15 unless asked otherwise), of the values themselves or of their logarithms (issue 16).
/// Each piece is fitted on its first use and checks itself then, halfway between every two of its interpolation nodes
/// (and at the range's end if it holds one, where interpolation errs most); a piece that fails its check, or whose
/// function values cannot be tabulated, is never used: the temperatures it covers are computed directly by the caller.
/// </summary>
/// <remarks>
/// Built piece by piece because a batch or a single spectrum meets few temperatures: a lot of 3000 K lamps needs one
/// or two pieces, and fitting the whole range cost a process about 40 ms before its first rendition result. A piece
/// depends only on its own nodes, so a result never depends on which temperatures came before it, nor on the thread
/// that fitted the piece (two threads that need one piece at once fit it once).
/// </remarks>
internal sealed class MiredChebyshev
{
    private readonly double _minMired, _maxMired, _pieceWidth;
    private readonly int _width, _pieces, _nodes;
    private readonly bool _logarithmic;
    private readonly Func<double[], double[]> _function;
    private readonly Func<double, double, bool> _agrees;
    private readonly double[] _cosines; // cos(π·k·(j + ½)/n), once per table
    private readonly Piece?[] _fitted;
    private readonly object _fitLock = new();

    /// <summary>A fitted piece: one run of values per Chebyshev term, or none when the piece failed its check.</summary>
    private sealed class Piece(double[]? coefficients)
    {
        public double[]? Coefficients { get; } = coefficients;
    }

    private MiredChebyshev(double minMired, double maxMired, int width, int pieces, int nodes, bool logarithmic, Func<double[], double[]> function, Func<double, double, bool> agrees)
    {
        _minMired = minMired;
        _maxMired = maxMired;
        _pieces = pieces;
        _nodes = nodes;
        _pieceWidth = (maxMired - minMired) / pieces;
        _width = width;
        _logarithmic = logarithmic;
        _function = function;
        _agrees = agrees;
        _fitted = new Piece?[pieces];
        _cosines = new double[nodes * nodes];
        for (int k = 0; k < nodes; k++)
            for (int j = 0; j < nodes; j++) _cosines[k * nodes + j] = Math.Cos(Math.PI * k * (j + 0.5) / nodes);
    }

    /// <summary>A table whose pieces are fitted and checked on first use.</summary>
    /// <param name="minMired">Lowest mired (highest temperature) of the range.</param>
    /// <param name="maxMired">Highest mired (lowest temperature).</param>
    /// <param name="width">Values per point.</param>
    /// <param name="logarithmic">Interpolate ln of the values (which must then be positive).</param>
    /// <param name="function">The values at each of many mireds at once (one run of <paramref name="width"/> per mired);
    /// pure and safe to call from several threads.</param>
    /// <param name="agrees">Whether an interpolated value agrees with the function's (interpolated, exact).</param>
    /// <param name="pieces">Equal pieces of the range.</param>
    /// <param name="nodesPerPiece">Interpolation nodes per piece (the degree plus one).</param>
    /// <returns>The table.</returns>
    public static MiredChebyshev Build(double minMired, double maxMired, int width, bool logarithmic, Func<double[], double[]> function, Func<double, double, bool> agrees, int pieces = 16, int nodesPerPiece = 16) =>
        new(minMired, maxMired, width, pieces, nodesPerPiece, logarithmic, function, agrees);

    /// <summary>The values at a temperature.</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="output">Output, one per value.</param>
    /// <returns>False outside the range, or where the piece failed its check (compute the values directly then).</returns>
    public bool TryEvaluate(double temperatureKelvin, Span<double> output)
    {
        double mired = 1e6 / temperatureKelvin;
        if (!(mired >= _minMired && mired <= _maxMired)) return false;
        int p = PieceOf(mired);
        if (Fitted(p) is not { } coefficients) return false;
        EvaluateAt(coefficients, p, mired, output);
        return true;
    }

    private int PieceOf(double mired) => Math.Min(_pieces - 1, (int)((mired - _minMired) / _pieceWidth));

    /// <summary>The piece's coefficients, fitted and checked on its first use; null when it failed.</summary>
    private double[]? Fitted(int p)
    {
        var piece = Volatile.Read(ref _fitted[p]);
        if (piece is null)
        {
            lock (_fitLock)
            {
                piece = _fitted[p];
                if (piece is null)
                {
                    piece = new Piece(Fit(p));
                    Volatile.Write(ref _fitted[p], piece);
                }
            }
        }
        return piece.Coefficients;
    }

    /// <summary>Fits piece <paramref name="p"/> and checks it; null when it cannot be tabulated or fails the check.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)] // runs at start-up
    private double[]? Fit(int p)
    {
        int n = _nodes;
        var coefficients = new double[n * _width];
        var nodes = new double[n];
        var values = new double[n];
        for (int j = 0; j < n; j++) nodes[j] = MiredAt(p, Math.Cos(Math.PI * (j + 0.5) / n));
        var at = _function(nodes);
        for (int v = 0; v < _width; v++)
        {
            for (int j = 0; j < n; j++)
            {
                double f = at[j * _width + v];
                if (!double.IsFinite(f) || (_logarithmic && !(f > 0))) return null; // ln needs a positive value
                values[j] = _logarithmic ? Math.Log(f) : f;
            }
            for (int k = 0; k < n; k++)
            {
                double c = 0;
                for (int j = 0; j < n; j++) c += values[j] * _cosines[k * n + j];
                coefficients[k * _width + v] = (k == 0 ? 1.0 : 2.0) / n * c;
            }
        }
        var probes = new List<double>();
        if (p == 0) probes.Add(_minMired);
        if (p == _pieces - 1) probes.Add(_maxMired);
        for (int j = 0; j < n - 1; j++)
            probes.Add(MiredAt(p, 0.5 * (Math.Cos(Math.PI * (j + 0.5) / n) + Math.Cos(Math.PI * (j + 1.5) / n))));
        var direct = _function([.. probes]);
        var interpolated = new double[_width];
        for (int i = 0; i < probes.Count; i++)
        {
            EvaluateAt(coefficients, p, probes[i], interpolated); // at the mired itself: 10⁶/(10⁶/μ) may fall just outside the range
            for (int v = 0; v < _width; v++)
                if (!_agrees(interpolated[v], direct[i * _width + v])) return null;
        }
        return coefficients;
    }

    /// <summary>The values at a mired within piece <paramref name="p"/>.</summary>
    private void EvaluateAt(double[] coefficients, int p, double mired, Span<double> output)
    {
        double t = (mired - (_minMired + (p + 0.5) * _pieceWidth)) / (0.5 * _pieceWidth);
        // Σ c_k·T_k(t) for every value at once: the Chebyshev polynomials at t once, then one vectorised multiply-add per term.
        output = output[.._width];
        double tkMinus1 = 1, tk = t;
        coefficients.AsSpan(0, _width).CopyTo(output);
        for (int k = 1; k < _nodes; k++)
        {
            TensorPrimitives.MultiplyAdd(coefficients.AsSpan(k * _width, _width), tk, output, output);
            (tkMinus1, tk) = (tk, 2 * t * tk - tkMinus1);
        }
        if (_logarithmic) TensorPrimitives.Exp(output, output);
    }

    private double MiredAt(int piece, double t) => _minMired + (piece + 0.5 + 0.5 * t) * _pieceWidth;
}
