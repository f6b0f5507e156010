using Lumen.Colorimetry;

namespace Lumen.Conformance;

/// <summary>A 1-step chromaticity ellipse in CIE 1931 (x, y): centre, semi-axes and orientation.</summary>
/// <param name="Centre">Centre of the ellipse (the target chromaticity).</param>
/// <param name="A">Semi-major axis of the 1-step ellipse (xy units).</param>
/// <param name="B">Semi-minor axis (xy units).</param>
/// <param name="ThetaDegrees">Angle of the major axis from +x, counter-clockwise, degrees.</param>
/// <param name="Source">Where the shape comes from.</param>
public sealed record StepEllipse(Chromaticity Centre, double A, double B, double ThetaDegrees, string Source)
{
    /// <summary>Metric coefficient g11 = cos²θ/a² + sin²θ/b².</summary>
    public double G11 => Metric().G11;

    /// <summary>Metric coefficient g12 = sinθ·cosθ·(1/a² − 1/b²).</summary>
    public double G12 => Metric().G12;

    /// <summary>Metric coefficient g22 = sin²θ/a² + cos²θ/b².</summary>
    public double G22 => Metric().G22;

    /// <summary>The three metric coefficients from one cosine and one sine of θ (issue 16: each coefficient took its own,
    /// ten trigonometric calls per distance; the same values, so the same results to the bit).</summary>
    private (double G11, double G12, double G22) Metric()
    {
        double t = ThetaDegrees * Math.PI / 180, cos = Math.Cos(t), sin = Math.Sin(t);
        return (cos * cos / (A * A) + sin * sin / (B * B), sin * cos * (1 / (A * A) - 1 / (B * B)), sin * sin / (A * A) + cos * cos / (B * B));
    }

    /// <summary>Distance in steps (SDCM) of a point from the centre: √(g11Δx² + 2g12ΔxΔy + g22Δy²).</summary>
    /// <param name="x">CIE 1931 x of the point, 0–1.</param>
    /// <param name="y">CIE 1931 y of the point, 0–1.</param>
    /// <returns>Steps (dimensionless, ≥ 0).</returns>
    public double Steps(double x, double y) => Measure().Steps(x, y);

    /// <summary>
    /// The step distance with the metric computed once, for many points (issue 16: the batch summary measured every unit
    /// from the batch mean, one cosine and one sine each, after the last row): each distance is the same arithmetic as
    /// <see cref="Steps(double, double)"/>, so the same value to the bit.
    /// </summary>
    /// <returns>The measure about this ellipse's centre.</returns>
    public StepMeasure Measure()
    {
        var (g11, g12, g22) = Metric();
        return new StepMeasure(Centre.SmallX, Centre.SmallY, g11, g12, g22);
    }

    /// <summary>The same shape about another centre.</summary>
    /// <param name="centre">The new centre.</param>
    /// <returns>The moved ellipse.</returns>
    public StepEllipse MovedTo(Chromaticity centre) => this with { Centre = centre };

    /// <summary>Distance in steps of a chromaticity from the centre.</summary>
    /// <param name="c">The chromaticity (CIE 1931 2°).</param>
    /// <returns>Steps (dimensionless; NaN when <paramref name="c"/> is undefined).</returns>
    public double Steps(Chromaticity c) => Steps(c.SmallX, c.SmallY);

    /// <summary>A point on the n-step ellipse at parameter angle φ (for drawing).</summary>
    /// <param name="steps">The step count n of the ellipse to draw (≥ 0).</param>
    /// <param name="phiRadians">Parameter angle.</param>
    /// <returns>The point.</returns>
    public Chromaticity PointAt(double steps, double phiRadians)
    {
        double t = ThetaDegrees * Math.PI / 180;
        double ex = steps * A * Math.Cos(phiRadians), ey = steps * B * Math.Sin(phiRadians);
        return Chromaticity.FromXy(Centre.SmallX + ex * Math.Cos(t) - ey * Math.Sin(t), Centre.SmallY + ex * Math.Sin(t) + ey * Math.Cos(t));
    }
}
