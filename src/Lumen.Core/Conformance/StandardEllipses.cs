using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>
/// Standard lamp-colour 1-step ellipses and n-step / Δu′v′ distances.
/// </summary>
/// <remarks>
/// docs/methods/conformance.md §2.2: the six ANSI C78.376 / IEC 60081-style 1-step ellipses (a, b, θ; from
/// memory in the note — the 3000, 4000 and 5000 K rows corroborated by a public 3-step table and the IEC
/// metric coefficients). Ellipses about any other centre take the shape of the standard ellipse nearest in
/// CCT (a documented choice). The Δu′v′ circle alternative follows CIE TN 001:2014 with ≈ 0.0011 per step
/// (from memory; consistent with the area-equivalent radii of the standard ellipses).
/// </remarks>
public static class StandardEllipses
{
    /// <summary>Δu′v′ radius that stands for one step in the circle approximation (CIE TN 001:2014, from memory).</summary>
    public const double UPrimeVPrimePerStep = 0.0011;

    /// <summary>The six standard 1-step ellipses, keyed by nominal CCT.</summary>
    public static IReadOnlyDictionary<int, StepEllipse> ByNominalCct { get; } = new Dictionary<int, StepEllipse>
    {
        [2700] = new(Chromaticity.FromXy(0.4578, 0.4101), 0.00258, 0.00137, 57.28, "ANSI C78.376-style 2700 K (from memory)"),
        [3000] = new(Chromaticity.FromXy(0.4338, 0.4030), 0.00278, 0.00136, 53.22, "ANSI C78.376-style 3000 K (from memory)"),
        [3500] = new(Chromaticity.FromXy(0.4073, 0.3917), 0.00309, 0.00138, 54.00, "ANSI C78.376-style 3500 K (from memory)"),
        [4000] = new(Chromaticity.FromXy(0.3818, 0.3797), 0.00313, 0.00134, 53.72, "ANSI C78.376-style 4000 K (from memory)"),
        [5000] = new(Chromaticity.FromXy(0.3447, 0.3553), 0.00274, 0.00118, 59.62, "ANSI C78.376-style 5000 K (from memory)"),
        [6500] = new(Chromaticity.FromXy(0.3123, 0.3282), 0.00223, 0.00095, 58.23, "ANSI C78.376-style 6500 K (from memory)"),
    };

    /// <summary>A 1-step ellipse about any centre, shaped like the standard ellipse nearest in CCT.</summary>
    /// <param name="x">CIE 1931 x of the centre, 0–1.</param>
    /// <param name="y">CIE 1931 y of the centre, 0–1.</param>
    /// <returns>The ellipse.</returns>
    public static StepEllipse About(double x, double y)
    {
        double cct = CctSolver.Solve(Chromaticity.FromXy(x, y)).CctKelvin;
        var nearest = ByNominalCct.OrderBy(kv => Math.Abs(1e6 / kv.Key - 1e6 / cct)).First();
        return nearest.Value.MovedTo(Chromaticity.FromXy(x, y)) with { Source = $"{nearest.Value.Source} shape about ({x:0.0000}, {y:0.0000})" };
    }
}
