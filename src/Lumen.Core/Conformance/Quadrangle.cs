using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>A chromaticity point in the CIE 1931 (x, y) diagram.</summary>
/// <param name="X">x.</param>
/// <param name="Y">y.</param>
public readonly record struct XyPoint(double X, double Y);

/// <summary>A convex quadrangle in the CIE 1931 (x, y) diagram with straight sides (ANSI C78.377 practice).</summary>
/// <param name="Corners">Four corners in order (1 upper-left warm, 2 upper-right, 3 lower-right, 4 lower-left).</param>
public sealed record Quadrangle(IReadOnlyList<XyPoint> Corners)
{
    /// <summary>
    /// Signed distance (in xy units) from a point to the nearest edge: positive inside, negative outside,
    /// zero on the boundary (a point on the boundary conforms).
    /// </summary>
    /// <param name="x">x.</param>
    /// <param name="y">y.</param>
    /// <returns>The signed distance.</returns>
    public double SignedDistance(double x, double y)
    {
        // Orientation-independent: inside means on the same side of every edge as the centroid.
        double cx = Corners.Average(c => c.X), cy = Corners.Average(c => c.Y);
        double inside = double.MaxValue, outside = double.MaxValue;
        bool isOutside = false;
        for (int i = 0; i < 4; i++)
        {
            var a = Corners[i];
            var b = Corners[(i + 1) % 4];
            double ex = b.X - a.X, ey = b.Y - a.Y, len = Math.Sqrt(ex * ex + ey * ey);
            double side = (ex * (y - a.Y) - ey * (x - a.X)) / len;
            double centroidSide = ex * (cy - a.Y) - ey * (cx - a.X);
            double s = Math.Sign(centroidSide) * side; // ≥ 0 on the inner side of this edge
            if (s < -1e-12) isOutside = true;
            inside = Math.Min(inside, s);
            outside = Math.Min(outside, SegmentDistance(x, y, a, b));
        }
        return isOutside ? -outside : inside;
    }

    /// <summary>True when the point is inside or on the boundary.</summary>
    /// <param name="x">x.</param>
    /// <param name="y">y.</param>
    /// <returns>Conformance of the point.</returns>
    public bool Contains(double x, double y) => SignedDistance(x, y) >= -1e-12;

    private static double SegmentDistance(double x, double y, XyPoint a, XyPoint b)
    {
        double ex = b.X - a.X, ey = b.Y - a.Y;
        double t = Math.Clamp(((x - a.X) * ex + (y - a.Y) * ey) / (ex * ex + ey * ey), 0, 1);
        double dx = x - (a.X + t * ex), dy = y - (a.Y + t * ey);
        return Math.Sqrt(dx * dx + dy * dy);
    }
}

/// <summary>Editions of ANSI C78.377 whose quadrangles Lumen can build.</summary>
public enum AnsiEdition
{
    /// <summary>2015/2017 editions: Duv target from the flexible-CCT formula at each corner's CCT (default).</summary>
    Ed2017,

    /// <summary>2008 edition: each category's tabulated target Duv ± 0.006 at both CCT limits (as reproduced in GOST 34819-2021 Table K.1).</summary>
    Ed2008,
}

/// <summary>One ANSI C78.377 nominal CCT category.</summary>
/// <param name="NominalCctKelvin">Nominal CCT, K (e.g. 3000).</param>
/// <param name="TargetCctKelvin">Target CCT, K.</param>
/// <param name="CctToleranceKelvin">CCT tolerance ±, K.</param>
/// <param name="PublishedCentre">Centre (x, y) as published (null for flexible categories).</param>
/// <param name="Flexible">True for a flexible-CCT category (tolerance interpolated — a stop-gap, see remarks of <see cref="AnsiC78377"/>).</param>
/// <param name="Edition">The edition whose construction applies.</param>
/// <param name="TabulatedDuv">The category's tabulated target Duv (2008 edition), or null.</param>
public sealed record AnsiCategory(int NominalCctKelvin, double TargetCctKelvin, double CctToleranceKelvin, XyPoint? PublishedCentre, bool Flexible,
    AnsiEdition Edition = AnsiEdition.Ed2017, double? TabulatedDuv = null)
{
    /// <summary>Target Duv at the target CCT (tabulated for 2008, flexible-CCT formula otherwise).</summary>
    public double TargetDuv => TabulatedDuv ?? AnsiC78377.TargetDuv(TargetCctKelvin);

    /// <summary>Centre computed from the target CCT and Duv.</summary>
    public XyPoint Centre
    {
        get
        {
            var c = CctSolver.ToChromaticity(TargetCctKelvin, TargetDuv);
            return new XyPoint(c.X, c.Y);
        }
    }

    /// <summary>The quadrangle: T_target ∓ ΔT with Duv_T(T) ± 0.006 (2017) or the tabulated Duv ± 0.006 (2008).</summary>
    public Quadrangle Quadrangle => TabulatedDuv is { } duv
        ? AnsiC78377.BuildQuadrangle(TargetCctKelvin - CctToleranceKelvin, TargetCctKelvin + CctToleranceKelvin, _ => duv)
        : AnsiC78377.BuildQuadrangle(TargetCctKelvin - CctToleranceKelvin, TargetCctKelvin + CctToleranceKelvin, AnsiC78377.TargetDuv);
}

/// <summary>
/// ANSI C78.377-2017 nominal CCT categories for solid-state lighting: targets, tolerances and quadrangles.
/// </summary>
/// <remarks>
/// Methods note conformance.md §1: target CCT ± tolerance and centres from a public summary of the 2015/2017
/// editions; Duv target from the flexible-CCT formula Duv_T(T) = 57700/T² − 44.6/T + 0.0085 (from memory in
/// the note, but it reproduces the published 2015 corners within 2e-4); Duv tolerance ±0.006. Corners are
/// built as xy(T_lo, Duv_T(T_lo) + 0.006), xy(T_hi, Duv_T(T_hi) + 0.006), xy(T_hi, Duv_T(T_hi) − 0.006),
/// xy(T_lo, Duv_T(T_lo) − 0.006) with straight sides in xy. Flexible CCT (2700–6500 K in 100 K steps): the
/// standard's CCT tolerance for these was not available; Lumen interpolates the neighbouring fixed
/// categories' tolerances linearly in CCT and marks the result as such. Verify against the standard
/// before claiming conformance. The 2008 edition (target CCT 5028/5665/6530 K, tabulated target Duv,
/// centres (0.4338, 0.4030) …) is available for products claimed against it; its quadrangles, built with the
/// category's target Duv ± 0.006 at both CCT limits, reproduce the corners of GOST 34819-2021 Table K.1
/// (which reproduces ANSI C78.377) to 4 decimals.
/// </remarks>
public static class AnsiC78377
{
    /// <summary>Duv tolerance ±.</summary>
    public const double DuvTolerance = 0.006;

    /// <summary>The fixed categories, 2200 K to 6500 K.</summary>
    public static IReadOnlyList<AnsiCategory> Categories { get; } =
    [
        new(2200, 2238, 102, new XyPoint(0.5018, 0.4153), false),
        new(2500, 2460, 120, new XyPoint(0.4806, 0.4141), false),
        new(2700, 2725, 145, new XyPoint(0.4578, 0.4101), false),
        new(3000, 3045, 175, new XyPoint(0.4339, 0.4033), false),
        new(3500, 3465, 245, new XyPoint(0.4078, 0.3930), false),
        new(4000, 3985, 275, new XyPoint(0.3818, 0.3797), false),
        new(4500, 4503, 243, new XyPoint(0.3613, 0.3670), false),
        new(5000, 5029, 283, new XyPoint(0.3446, 0.3551), false),
        new(5700, 5667, 355, new XyPoint(0.3287, 0.3425), false),
        new(6500, 6532, 510, new XyPoint(0.3123, 0.3283), false),
    ];

    /// <summary>The 2008-edition categories, 2700 K to 6500 K (targets, tolerances, tabulated Duv and centres as
    /// reproduced in GOST 34819-2021 Table K.1; shared/reference ids ansi_c78377.*).</summary>
    public static IReadOnlyList<AnsiCategory> Categories2008 { get; } =
    [
        new(2700, 2725, 145, new XyPoint(0.4578, 0.4101), false, AnsiEdition.Ed2008, 0.000),
        new(3000, 3045, 175, new XyPoint(0.4338, 0.4030), false, AnsiEdition.Ed2008, 0.000),
        new(3500, 3465, 245, new XyPoint(0.4073, 0.3917), false, AnsiEdition.Ed2008, 0.000),
        new(4000, 3985, 275, new XyPoint(0.3818, 0.3797), false, AnsiEdition.Ed2008, 0.001),
        new(4500, 4503, 243, new XyPoint(0.3611, 0.3658), false, AnsiEdition.Ed2008, 0.001),
        new(5000, 5028, 283, new XyPoint(0.3447, 0.3553), false, AnsiEdition.Ed2008, 0.002),
        new(5700, 5665, 355, new XyPoint(0.3287, 0.3417), false, AnsiEdition.Ed2008, 0.002),
        new(6500, 6530, 510, new XyPoint(0.3123, 0.3282), false, AnsiEdition.Ed2008, 0.003),
    ];

    /// <summary>The category of an edition for a nominal CCT.</summary>
    /// <param name="nominalKelvin">Nominal CCT.</param>
    /// <param name="edition">Edition.</param>
    /// <param name="category">The category.</param>
    /// <returns>False when none (the 2008 edition has no flexible or 2200/2500 K categories).</returns>
    public static bool TryGetCategory(int nominalKelvin, AnsiEdition edition, out AnsiCategory category)
    {
        if (edition == AnsiEdition.Ed2017) return TryGetCategory(nominalKelvin, out category);
        category = Categories2008.FirstOrDefault(c => c.NominalCctKelvin == nominalKelvin)!;
        return category is not null;
    }

    /// <summary>The flexible-CCT target Duv: 57700/T² − 44.6/T + 0.0085.</summary>
    /// <param name="cctKelvin">CCT, K.</param>
    /// <returns>Target Duv.</returns>
    public static double TargetDuv(double cctKelvin) => 57700 / (cctKelvin * cctKelvin) - 44.6 / cctKelvin + 0.0085;

    /// <summary>The category for a nominal CCT: a fixed one, or a flexible one (2700–6500 K in 100 K steps).</summary>
    /// <param name="nominalKelvin">Nominal CCT, K.</param>
    /// <param name="category">The category.</param>
    /// <returns>False when no category exists for that value.</returns>
    public static bool TryGetCategory(int nominalKelvin, out AnsiCategory category)
    {
        var fixedCat = Categories.FirstOrDefault(c => c.NominalCctKelvin == nominalKelvin);
        if (fixedCat is not null) { category = fixedCat; return true; }
        category = null!;
        if (nominalKelvin < 2700 || nominalKelvin > 6500 || nominalKelvin % 100 != 0) return false;
        var lo = Categories.Last(c => c.TargetCctKelvin <= nominalKelvin);
        var hi = Categories.First(c => c.TargetCctKelvin > nominalKelvin);
        double f = (nominalKelvin - lo.TargetCctKelvin) / (hi.TargetCctKelvin - lo.TargetCctKelvin);
        category = new AnsiCategory(nominalKelvin, nominalKelvin, lo.CctToleranceKelvin + f * (hi.CctToleranceKelvin - lo.CctToleranceKelvin), null, true);
        return true;
    }

    /// <summary>The quadrangle between two CCTs with a Duv centre line ± 0.006.</summary>
    /// <param name="lowKelvin">T_lo.</param>
    /// <param name="highKelvin">T_hi.</param>
    /// <param name="centreDuv">Duv of the centre line at a CCT (the flexible formula, or a constant).</param>
    /// <returns>The quadrangle.</returns>
    public static Quadrangle BuildQuadrangle(double lowKelvin, double highKelvin, Func<double, double> centreDuv)
    {
        ArgumentNullException.ThrowIfNull(centreDuv);
        XyPoint P(double t, double duv) { var c = CctSolver.ToChromaticity(t, duv); return new XyPoint(c.X, c.Y); }
        return new Quadrangle([
            P(lowKelvin, centreDuv(lowKelvin) + DuvTolerance),
            P(highKelvin, centreDuv(highKelvin) + DuvTolerance),
            P(highKelvin, centreDuv(highKelvin) - DuvTolerance),
            P(lowKelvin, centreDuv(lowKelvin) - DuvTolerance),
        ]);
    }

    /// <summary>The fixed categories whose quadrangle contains a chromaticity (none, one, or two on a shared edge).</summary>
    /// <param name="c">Chromaticity (2°).</param>
    /// <returns>Nominal CCTs.</returns>
    public static IReadOnlyList<int> CategoriesContaining(Chromaticity c) =>
        Categories.Where(k => k.Quadrangle.Contains(c.X, c.Y)).Select(k => k.NominalCctKelvin).ToArray();
}
