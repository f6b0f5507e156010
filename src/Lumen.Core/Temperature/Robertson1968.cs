namespace Lumen.Temperature;

/// <summary>
/// Robertson (1968) CCT by interpolation between isotemperature lines (historical method, for comparison).
/// </summary>
/// <remarks>
/// A. R. Robertson, "Computation of correlated color temperature and distribution temperature",
/// JOSA 58(11):1528–1535 (1968); table as in Wyszecki &amp; Stiles, Color Science 2nd ed., Table 1(3.11),
/// with the u at 325 mired corrected from the misprinted 0.24702 to 0.24792 (docs/methods/cct.md §5).
/// Accuracy against the exact locus: ≤ 0.6 K at 2000–6500 K, up to ~17 K at 18 000 K. Undefined below
/// 1667 K (600 mired).
/// </remarks>
internal static class Robertson1968
{
    private static readonly double[,] Table =
    {
        { 0, 0.18006, 0.26352, -0.24341 }, { 10, 0.18066, 0.26589, -0.25479 }, { 20, 0.18133, 0.26846, -0.26876 },
        { 30, 0.18208, 0.27119, -0.28539 }, { 40, 0.18293, 0.27407, -0.30470 }, { 50, 0.18388, 0.27709, -0.32675 },
        { 60, 0.18494, 0.28021, -0.35156 }, { 70, 0.18611, 0.28342, -0.37915 }, { 80, 0.18740, 0.28668, -0.40955 },
        { 90, 0.18880, 0.28997, -0.44278 }, { 100, 0.19032, 0.29326, -0.47888 }, { 125, 0.19462, 0.30141, -0.58204 },
        { 150, 0.19962, 0.30921, -0.70471 }, { 175, 0.20525, 0.31647, -0.84901 }, { 200, 0.21142, 0.32312, -1.0182 },
        { 225, 0.21807, 0.32909, -1.2168 }, { 250, 0.22511, 0.33439, -1.4512 }, { 275, 0.23247, 0.33904, -1.7298 },
        { 300, 0.24010, 0.34308, -2.0637 }, { 325, 0.24792, 0.34655, -2.4681 }, { 350, 0.25591, 0.34951, -2.9641 },
        { 375, 0.26400, 0.35200, -3.5814 }, { 400, 0.27218, 0.35407, -4.3633 }, { 425, 0.28039, 0.35577, -5.3762 },
        { 450, 0.28863, 0.35714, -6.7262 }, { 475, 0.29685, 0.35823, -8.5955 }, { 500, 0.30505, 0.35907, -11.324 },
        { 525, 0.31320, 0.35968, -15.628 }, { 550, 0.32129, 0.36011, -23.325 }, { 575, 0.32931, 0.36038, -40.770 },
        { 600, 0.33724, 0.36051, -116.45 },
    };

    /// <summary>CCT and Duv by Robertson's method.</summary>
    /// <param name="u">CIE 1960 u.</param>
    /// <param name="v">CIE 1960 v.</param>
    /// <returns>The result; <see cref="CctConditions.BeyondLocus"/> when outside 0–600 mired.</returns>
    public static CctResult Solve(double u, double v)
    {
        if (!double.IsFinite(u) || !double.IsFinite(v)) return CctResult.Undefined(CctMethod.Robertson1968);
        int n = Table.GetLength(0);
        double prev = Distance(0, u, v);
        for (int i = 1; i < n; i++)
        {
            double di = Distance(i, u, v);
            if (prev / di <= 0 || di == 0)
            {
                double r0 = Table[i - 1, 0], r1 = Table[i, 0];
                double r = r0 + (r1 - r0) * prev / (prev - di);
                double f = (r1 - r) / (r1 - r0);
                double uL = f * Table[i - 1, 1] + (1 - f) * Table[i, 1];
                double vL = f * Table[i - 1, 2] + (1 - f) * Table[i, 2];
                double t0 = Table[i - 1, 3], t1 = Table[i, 3];
                double n0 = Math.Sqrt(1 + t0 * t0), n1 = Math.Sqrt(1 + t1 * t1);
                double eu = f / n0 + (1 - f) / n1, ev = f * t0 / n0 + (1 - f) * t1 / n1;
                double len = Math.Sqrt(eu * eu + ev * ev);
                eu /= len; ev /= len;
                double duv = -((u - uL) * eu + (v - vL) * ev);
                double cct = r > 0 ? 1e6 / r : double.PositiveInfinity;
                var cond = CctConditions.None;
                if (Math.Abs(duv) > 0.05) cond |= CctConditions.FarFromLocus;
                if (cct < 1000 || cct > 100000) cond |= CctConditions.OutsideValidatedRange;
                return new CctResult(cct, duv, CctMethod.Robertson1968, cond);
            }
            prev = di;
        }
        return new CctResult(double.NaN, double.NaN, CctMethod.Robertson1968, CctConditions.BeyondLocus);
    }

    private static double Distance(int i, double u, double v)
    {
        double t = Table[i, 3];
        return ((v - Table[i, 2]) - t * (u - Table[i, 1])) / Math.Sqrt(1 + t * t);
    }
}
