using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>
/// ANSI C78.377-2017 nominal CCT categories for solid-state lighting: targets, tolerances and quadrangles.
/// </summary>
/// <remarks>
/// docs/methods/conformance.md §1: target CCT ± tolerance and centres from a public summary of the 2015/2017
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
        new(2200, 2238, 102, Chromaticity.FromXy(0.5018, 0.4153), false),
        new(2500, 2460, 120, Chromaticity.FromXy(0.4806, 0.4141), false),
        new(2700, 2725, 145, Chromaticity.FromXy(0.4578, 0.4101), false),
        new(3000, 3045, 175, Chromaticity.FromXy(0.4339, 0.4033), false),
        new(3500, 3465, 245, Chromaticity.FromXy(0.4078, 0.3930), false),
        new(4000, 3985, 275, Chromaticity.FromXy(0.3818, 0.3797), false),
        new(4500, 4503, 243, Chromaticity.FromXy(0.3613, 0.3670), false),
        new(5000, 5029, 283, Chromaticity.FromXy(0.3446, 0.3551), false),
        new(5700, 5667, 355, Chromaticity.FromXy(0.3287, 0.3425), false),
        new(6500, 6532, 510, Chromaticity.FromXy(0.3123, 0.3283), false),
    ];

    /// <summary>The 2008-edition categories, 2700 K to 6500 K (targets, tolerances, tabulated Duv and centres as
    /// reproduced in GOST 34819-2021 Table K.1; check values in tests/Lumen.Core.Tests/ConformanceTests.cs).</summary>
    public static IReadOnlyList<AnsiCategory> Categories2008 { get; } =
    [
        new(2700, 2725, 145, Chromaticity.FromXy(0.4578, 0.4101), false, AnsiEdition.Ed2008, 0.000),
        new(3000, 3045, 175, Chromaticity.FromXy(0.4338, 0.4030), false, AnsiEdition.Ed2008, 0.000),
        new(3500, 3465, 245, Chromaticity.FromXy(0.4073, 0.3917), false, AnsiEdition.Ed2008, 0.000),
        new(4000, 3985, 275, Chromaticity.FromXy(0.3818, 0.3797), false, AnsiEdition.Ed2008, 0.001),
        new(4500, 4503, 243, Chromaticity.FromXy(0.3611, 0.3658), false, AnsiEdition.Ed2008, 0.001),
        new(5000, 5028, 283, Chromaticity.FromXy(0.3447, 0.3553), false, AnsiEdition.Ed2008, 0.002),
        new(5700, 5665, 355, Chromaticity.FromXy(0.3287, 0.3417), false, AnsiEdition.Ed2008, 0.002),
        new(6500, 6530, 510, Chromaticity.FromXy(0.3123, 0.3282), false, AnsiEdition.Ed2008, 0.003),
    ];

    /// <summary>The category of an edition for a nominal CCT.</summary>
    /// <param name="nominalKelvin">Nominal CCT, K: a fixed category (2200–6500 K) or a flexible value 2700–6500 K in 100 K steps.</param>
    /// <param name="edition">The ANSI C78.377 edition whose construction applies (2017 default, or 2008).</param>
    /// <param name="category">The category found, or null when there is none.</param>
    /// <returns>False when none (the 2008 edition has no flexible or 2200/2500 K categories).</returns>
    public static bool TryGetCategory(int nominalKelvin, AnsiEdition edition, out AnsiCategory category)
    {
        if (edition == AnsiEdition.Ed2017) return TryGetCategory(nominalKelvin, out category);
        category = Categories2008.FirstOrDefault(c => c.NominalCctKelvin == nominalKelvin)!;
        return category is not null;
    }

    /// <summary>The flexible-CCT target Duv: 57700/T² − 44.6/T + 0.0085.</summary>
    /// <param name="cctKelvin">CCT, K (the formula is meant for about 2200–6500 K).</param>
    /// <returns>Target Duv.</returns>
    public static double TargetDuv(double cctKelvin) => 57700 / (cctKelvin * cctKelvin) - 44.6 / cctKelvin + 0.0085;

    /// <summary>The category for a nominal CCT: a fixed one, or a flexible one (2700–6500 K in 100 K steps).</summary>
    /// <param name="nominalKelvin">Nominal CCT, K.</param>
    /// <param name="category">The category found, or null when there is none.</param>
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
    /// <param name="lowKelvin">Lower CCT limit of the quadrangle (target − tolerance), K.</param>
    /// <param name="highKelvin">Upper CCT limit of the quadrangle (target + tolerance), K.</param>
    /// <param name="centreDuv">Duv of the centre line at a CCT (the flexible formula, or a constant).</param>
    /// <returns>The quadrangle.</returns>
    internal static Quadrangle BuildQuadrangle(double lowKelvin, double highKelvin, Func<double, double> centreDuv)
    {
        ArgumentNullException.ThrowIfNull(centreDuv);
        Chromaticity P(double t, double duv) { var c = CctSolver.ToChromaticity(t, duv); return Chromaticity.FromXy(c.SmallX, c.SmallY); }
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
        Categories.Where(k => k.Quadrangle.Contains(c.SmallX, c.SmallY)).Select(k => k.NominalCctKelvin).ToArray();
}
