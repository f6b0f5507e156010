using Lumen.Colorimetry;

namespace Lumen.Conformance;

/// <summary>An ellipse's step distance with its metric evaluated (<see cref="StepEllipse.Measure"/>).</summary>
public readonly struct StepMeasure
{
    private readonly double _x, _y, _g11, _g12, _g22;

    internal StepMeasure(double x, double y, double g11, double g12, double g22) => (_x, _y, _g11, _g12, _g22) = (x, y, g11, g12, g22);

    /// <summary>Distance in steps (SDCM) of a point from the centre: √(g11Δx² + 2g12ΔxΔy + g22Δy²).</summary>
    /// <param name="x">CIE 1931 x of the point, 0–1.</param>
    /// <param name="y">CIE 1931 y of the point, 0–1.</param>
    /// <returns>Steps (dimensionless, ≥ 0).</returns>
    public double Steps(double x, double y)
    {
        double dx = x - _x, dy = y - _y;
        return Math.Sqrt(_g11 * dx * dx + 2 * _g12 * dx * dy + _g22 * dy * dy);
    }

    /// <summary>Distance in steps of a chromaticity from the centre.</summary>
    /// <param name="c">The chromaticity (CIE 1931 2°).</param>
    /// <returns>Steps (dimensionless; NaN when <paramref name="c"/> is undefined).</returns>
    public double Steps(Chromaticity c) => Steps(c.SmallX, c.SmallY);
}
