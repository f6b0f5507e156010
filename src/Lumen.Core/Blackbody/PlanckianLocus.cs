using Lumen.Cie;

namespace Lumen.Blackbody;

/// <summary>
/// The Planckian locus in the CIE 1960 UCS (u, v), from 500 K to 10⁶ K, for one c2 convention.
/// </summary>
/// <remarks>
/// <para>Exact points come from Planck's law summed against the CIE 1931 2° colour-matching functions at
/// 1 nm from 360 to 830 nm (docs/methods/cct.md §2, recommended construction), with the first and second
/// derivatives with respect to mired in closed form (∂L/∂m from Planck's law, then the quotient rule for
/// u = 4X/(X+15Y+3Z), v = 6Y/(X+15Y+3Z)).</para>
/// <para>For speed the locus is tabulated once at every whole mired from 1 to 2000 (10⁶ K to 500 K) with
/// values, first and second derivatives, and evaluated between nodes by quintic Hermite interpolation,
/// which matches the exact locus to better than 1e-12 in u and v (see the tests), so that CCT solved on
/// the table agrees with a brute-force search on the exact locus to far better than 0.01 K.</para>
/// </remarks>
internal sealed class PlanckianLocus
{
    /// <summary>Smallest tabulated mired (10⁶ K).</summary>
    public const double MinMired = 1.0;

    /// <summary>Largest tabulated mired (500 K).</summary>
    public const double MaxMired = 2000.0;

    private const int NodeCount = 2000;
    private const double Step = 1.0;

    private static readonly Lazy<PlanckianLocus> Its90 = new(() => new PlanckianLocus(C2Convention.Cie15Its90));
    private static readonly Lazy<PlanckianLocus> Codata = new(() => new PlanckianLocus(C2Convention.Codata2018));

    private readonly double[] _wavelengthFactor; // c2·1e-6/λ  (x = factor·m)
    private readonly double[] _lambdaPow5Inv;
    private readonly double[] _xBar, _yBar, _zBar;
    // The table is built as it is used (issue 16): a node when a scan or an interval first needs it, an interval's quintic
    // coefficients when a point in it is first asked for. Building all 2,000 nodes up front was half of a native batch's
    // start-up (about 15 ms, 940,000 exponentials), and a batch of 3000 K lamps touches a few dozen of them. Every entry is
    // the same pure function of its index, so the values are those of the whole table built in order, on any thread; an
    // entry is published by a volatile flag written after it (two threads may both compute one: the same bits).
    private readonly LocusPoint[] _points;
    private readonly int[] _pointKnown;
    private readonly double[] _coefU, _coefV; // 6 per interval
    private readonly int[] _coefKnown;

    /// <summary>A locus for a convention; <see cref="For"/> shares one per convention (tests make their own).</summary>
    internal PlanckianLocus(C2Convention convention)
    {
        Convention = convention;
        C2 = PlanckConstants.For(convention).C2;
        var cmf = CieTables.ColorMatchingFunctions(Observer.Cie1931TwoDegree);
        int n = cmf.Count;
        _wavelengthFactor = new double[n];
        _lambdaPow5Inv = new double[n];
        _xBar = cmf.Column("x_bar").ToArray();
        _yBar = cmf.Column("y_bar").ToArray();
        _zBar = cmf.Column("z_bar").ToArray();
        for (int i = 0; i < n; i++)
        {
            double lambdaM = (cmf.StartNm + i * cmf.StepNm) * 1e-9;
            _wavelengthFactor[i] = C2 * 1e-6 / lambdaM;
            _lambdaPow5Inv[i] = 1.0 / Math.Pow(lambdaM * 1e6, 5); // scaled (λ in µm) to keep magnitudes tame
        }

        _points = new LocusPoint[NodeCount];
        _pointKnown = new int[NodeCount];
        _coefU = new double[(NodeCount - 1) * 6];
        _coefV = new double[(NodeCount - 1) * 6];
        _coefKnown = new int[NodeCount - 1];
    }

    /// <summary>The exact point at node <paramref name="k"/>, computed on first use; by reference, as the CCT search
    /// reads two of its seven numbers at some 130 nodes per spectrum (copying each point cost ~1 % of a batch).</summary>
    private ref readonly LocusPoint Node(int k)
    {
        if (Volatile.Read(ref _pointKnown[k]) == 0)
        {
            _points[k] = EvaluateExactAtMired(MinMired + k * Step);
            Volatile.Write(ref _pointKnown[k], 1);
        }
        return ref _points[k];
    }

    /// <summary>Makes sure interval <paramref name="k"/> (nodes k and k + 1) has its quintic coefficients.</summary>
    private void EnsureInterval(int k)
    {
        if (Volatile.Read(ref _coefKnown[k]) != 0) return;
        ref readonly LocusPoint a = ref Node(k), b = ref Node(k + 1);
        Quintic(a.U, a.DuDm, a.D2uDm2, b.U, b.DuDm, b.D2uDm2, _coefU.AsSpan(k * 6, 6));
        Quintic(a.V, a.DvDm, a.D2vDm2, b.V, b.DvDm, b.D2vDm2, _coefV.AsSpan(k * 6, 6));
        Volatile.Write(ref _coefKnown[k], 1);
    }

    /// <summary>The locus with c2 = 1.4388e-2 m·K (CIE 15; Lumen's default).</summary>
    public static PlanckianLocus Cie15 => Its90.Value;

    /// <summary>The locus for a c2 convention (built once, lazily).</summary>
    /// <param name="convention">The convention.</param>
    /// <returns>The locus.</returns>
    public static PlanckianLocus For(C2Convention convention) => convention == C2Convention.Cie15Its90 ? Its90.Value : Codata.Value;

    /// <summary>The c2 convention of this locus.</summary>
    public C2Convention Convention { get; }

    /// <summary>The value of c2 used, m·K.</summary>
    public double C2 { get; }

    /// <summary>Exact locus point and derivatives at a temperature, by direct Planck summation (slow path).</summary>
    /// <param name="temperatureKelvin">Temperature, K (positive).</param>
    /// <returns>The point with derivatives with respect to mired.</returns>
    public LocusPoint EvaluateExact(double temperatureKelvin)
    {
        if (!(temperatureKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin));
        return EvaluateExactAtMired(1e6 / temperatureKelvin);
    }

    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)] // called for every table node a batch touches (about a hundred times by the first record): unoptimised, they cost every process milliseconds
    private LocusPoint EvaluateExactAtMired(double m)
    {
        double x0 = 0, y0 = 0, z0 = 0, x1 = 0, y1 = 0, z1 = 0, x2 = 0, y2 = 0, z2 = 0;
        for (int i = 0; i < _xBar.Length; i++)
        {
            double a = _wavelengthFactor[i];
            double x = a * m;
            if (x > 700) continue;
            double em1 = Planck.Expm1(x);
            double e = em1 + 1;
            double l = _lambdaPow5Inv[i] / em1;
            double l1 = -_lambdaPow5Inv[i] * a * e / (em1 * em1);
            double l2 = _lambdaPow5Inv[i] * a * a * e * (e + 1) / (em1 * em1 * em1);
            x0 += l * _xBar[i]; y0 += l * _yBar[i]; z0 += l * _zBar[i];
            x1 += l1 * _xBar[i]; y1 += l1 * _yBar[i]; z1 += l1 * _zBar[i];
            x2 += l2 * _xBar[i]; y2 += l2 * _yBar[i]; z2 += l2 * _zBar[i];
        }
        double d = x0 + 15 * y0 + 3 * z0, d1 = x1 + 15 * y1 + 3 * z1, d2 = x2 + 15 * y2 + 3 * z2;
        static (double f, double f1, double f2) Ratio(double c, double n0, double n1, double n2, double d, double d1, double d2)
        {
            double f = c * n0 / d;
            double f1 = c * (n1 * d - n0 * d1) / (d * d);
            double f2 = c * (n2 / d - 2 * n1 * d1 / (d * d) - n0 * d2 / (d * d) + 2 * n0 * d1 * d1 / (d * d * d));
            return (f, f1, f2);
        }
        var (u, u1, u2) = Ratio(4, x0, x1, x2, d, d1, d2);
        var (v, v1, v2) = Ratio(6, y0, y1, y2, d, d1, d2);
        return new LocusPoint(u, v, u1, v1, u2, v2);
    }

    private static void Quintic(double p0, double d0, double s0, double p1, double d1, double s1, Span<double> c)
    {
        // Scaled to t ∈ [0, 1] over one step (Step = 1 mired, so derivatives need no scaling).
        double dp = p1 - p0;
        c[0] = p0;
        c[1] = d0;
        c[2] = 0.5 * s0;
        c[3] = 10 * dp - 6 * d0 - 4 * d1 - 1.5 * s0 + 0.5 * s1;
        c[4] = -15 * dp + 8 * d0 + 7 * d1 + 1.5 * s0 - s1;
        c[5] = 6 * dp - 3 * d0 - 3 * d1 - 0.5 * s0 + 0.5 * s1;
    }

    /// <summary>Locus point and derivatives at a mired value from the table (fast path).</summary>
    /// <param name="mired">m = 10⁶/T, clamped to [1, 2000].</param>
    /// <returns>The interpolated point.</returns>
    public LocusPoint AtMired(double mired)
    {
        double m = Math.Clamp(mired, MinMired, MaxMired);
        int k = Math.Min((int)((m - MinMired) / Step), NodeCount - 2);
        double t = (m - MinMired) / Step - k;
        EnsureInterval(k);
        var cu = _coefU.AsSpan(k * 6, 6);
        var cv = _coefV.AsSpan(k * 6, 6);
        return new LocusPoint(
            Poly(cu, t), Poly(cv, t), Deriv(cu, t), Deriv(cv, t), Deriv2(cu, t), Deriv2(cv, t));
    }

    /// <summary>Locus point at a temperature from the table.</summary>
    /// <param name="temperatureKelvin">Temperature in K, 500 to 10⁶.</param>
    /// <returns>The point (derivatives with respect to mired).</returns>
    public LocusPoint At(double temperatureKelvin) => AtMired(1e6 / temperatureKelvin);

    private static double Poly(ReadOnlySpan<double> c, double t) => c[0] + t * (c[1] + t * (c[2] + t * (c[3] + t * (c[4] + t * c[5]))));

    private static double Deriv(ReadOnlySpan<double> c, double t) => c[1] + t * (2 * c[2] + t * (3 * c[3] + t * (4 * c[4] + t * 5 * c[5])));

    private static double Deriv2(ReadOnlySpan<double> c, double t) => 2 * c[2] + t * (6 * c[3] + t * (12 * c[4] + t * 20 * c[5]));

    /// <summary>Number of table nodes (one per whole mired).</summary>
    internal static int Nodes => NodeCount;

    internal double NodeU(int k) => Node(k).U;

    internal double NodeV(int k) => Node(k).V;

    internal static double NodeMired(int k) => MinMired + k * Step;
}
