using Lumen.Blackbody;

namespace Lumen.Temperature;

/// <summary>
/// CCT and Duv as the nearest point of the exact Planckian locus (CIE 15:2004/2018 definition, Duv sign
/// per ANSI C78.377), solved by scan + safeguarded Newton on the quintic-Hermite locus table.
/// </summary>
/// <remarks>
/// docs/methods/cct.md §3 ("exact method", the recommended reference): the minimum of the distance is where
/// g(m) = (u_P − u)·u_P′ + (v_P − v)·v_P′ = 0. A scan of every 40th and then every 5th mired node brackets the minimum; Newton
/// steps with the analytic g′ converge in 3–5 iterations, with bisection whenever a step leaves the bracket.
/// Agrees with a brute-force golden-section search on the exact locus to |ΔT| &lt; 0.01 K and
/// |ΔDuv| &lt; 1e-6 over 1000–100000 K, |Duv| ≤ 0.05 (tests). This is more accurate than Ohno (2014)'s
/// 1 % table (≤ 1 K) and needs no correction factor.
/// </remarks>
internal static class NearestPlanckianPoint
{
    private const int CoarseStride = 40;
    private const int FineStride = 5;

    /// <summary>Solves CCT and Duv for a chromaticity.</summary>
    /// <param name="u">CIE 1960 u.</param>
    /// <param name="v">CIE 1960 v.</param>
    /// <param name="locus">The locus (c2 convention).</param>
    /// <returns>The result with its conditions.</returns>
    public static CctResult Solve(double u, double v, PlanckianLocus locus)
    {
        ArgumentNullException.ThrowIfNull(locus);
        if (!double.IsFinite(u) || !double.IsFinite(v)) return CctResult.Undefined(CctMethod.NearestPlanckianPoint);

        int nodes = PlanckianLocus.Nodes;
        // Two-level scan: every 40th node, then every 5th node around the best, then Newton in ±5 nodes.
        int best = Scan(locus, u, v, 0, nodes - 1, CoarseStride);
        int fine = Scan(locus, u, v, Math.Max(0, best - CoarseStride), Math.Min(nodes - 1, best + CoarseStride), FineStride);
        best = fine;
        double lo = PlanckianLocus.NodeMired(Math.Max(0, best - FineStride));
        double hi = PlanckianLocus.NodeMired(Math.Min(nodes - 1, best + FineStride));
        var conditions = CctConditions.None;

        double m = PlanckianLocus.NodeMired(best);
        if (lo <= PlanckianLocus.MinMired && G(locus.AtMired(lo), u, v) > 0)
        {
            m = lo; conditions |= CctConditions.BeyondLocus;
        }
        else if (hi >= PlanckianLocus.MaxMired && G(locus.AtMired(hi), u, v) < 0)
        {
            m = hi; conditions |= CctConditions.BeyondLocus;
        }
        else
        {
            for (int iter = 0; iter < 100; iter++)
            {
                var p = locus.AtMired(m);
                double du = p.U - u, dv = p.V - v;
                double g = du * p.DuDm + dv * p.DvDm;
                if (g < 0) lo = m; else hi = m;
                double gp = p.DuDm * p.DuDm + p.DvDm * p.DvDm + du * p.D2uDm2 + dv * p.D2vDm2;
                double next = gp > 0 ? m - g / gp : double.NaN;
                if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
                double step = Math.Abs(next - m);
                m = next;
                if (step < 1e-12 * Math.Max(1.0, m) || hi - lo < 1e-13 * m) break;
            }
        }

        var q = locus.AtMired(m);
        double eu = u - q.U, ev = v - q.V;
        double duv = Math.Sqrt(eu * eu + ev * ev) * (ev >= 0 ? 1 : -1);
        double t = 1e6 / m;
        if (Math.Abs(duv) > 0.05) conditions |= CctConditions.FarFromLocus;
        if (t < 1000 || t > 100000) conditions |= CctConditions.OutsideValidatedRange;
        return new CctResult(t, duv, CctMethod.NearestPlanckianPoint, conditions);
    }

    private static int Scan(PlanckianLocus locus, double u, double v, int from, int to, int stride)
    {
        int best = from;
        double bestD = double.MaxValue;
        for (int k = from; ; k += stride)
        {
            if (k > to) k = to;
            double du = locus.NodeU(k) - u, dv = locus.NodeV(k) - v;
            double d = du * du + dv * dv;
            if (d < bestD) { bestD = d; best = k; }
            if (k == to) break;
        }
        return best;
    }

    private static double G(LocusPoint p, double u, double v) => (p.U - u) * p.DuDm + (p.V - v) * p.DvDm;
}
