using Lumen.Colorimetry;

namespace Lumen.Conformance;

/// <summary>A convex quadrangle in the CIE 1931 (x, y) diagram with straight sides (ANSI C78.377 practice).</summary>
/// <param name="Corners">Four corners in order (1 upper-left warm, 2 upper-right, 3 lower-right, 4 lower-left).</param>
public sealed record Quadrangle(IReadOnlyList<Chromaticity> Corners)
{
    /// <summary>
    /// Signed distance (in xy units) from a point to the nearest edge: positive inside, negative outside,
    /// zero on the boundary (a point on the boundary conforms).
    /// </summary>
    /// <param name="x">CIE 1931 x of the point, 0–1.</param>
    /// <param name="y">CIE 1931 y of the point, 0–1.</param>
    /// <returns>The signed distance.</returns>
    public double SignedDistance(double x, double y)
    {
        // Orientation-independent: inside means on the same side of every edge as the centroid.
        double cx = Corners.Average(c => c.SmallX), cy = Corners.Average(c => c.SmallY);
        double inside = double.MaxValue, outside = double.MaxValue;
        bool isOutside = false;
        for (int i = 0; i < 4; i++)
        {
            var a = Corners[i];
            var b = Corners[(i + 1) % 4];
            double ex = b.SmallX - a.SmallX, ey = b.SmallY - a.SmallY, len = Math.Sqrt(ex * ex + ey * ey);
            double side = (ex * (y - a.SmallY) - ey * (x - a.SmallX)) / len;
            double centroidSide = ex * (cy - a.SmallY) - ey * (cx - a.SmallX);
            double s = Math.Sign(centroidSide) * side; // ≥ 0 on the inner side of this edge
            if (s < -1e-12) isOutside = true;
            inside = Math.Min(inside, s);
            outside = Math.Min(outside, SegmentDistance(x, y, a, b));
        }
        return isOutside ? -outside : inside;
    }

    /// <summary>True when the point is inside or on the boundary.</summary>
    /// <param name="x">CIE 1931 x of the point, 0–1.</param>
    /// <param name="y">CIE 1931 y of the point, 0–1.</param>
    /// <returns>Conformance of the point.</returns>
    public bool Contains(double x, double y) => SignedDistance(x, y) >= -1e-12;

    private static double SegmentDistance(double x, double y, Chromaticity a, Chromaticity b)
    {
        double ex = b.SmallX - a.SmallX, ey = b.SmallY - a.SmallY;
        double t = Math.Clamp(((x - a.SmallX) * ex + (y - a.SmallY) * ey) / (ex * ex + ey * ey), 0, 1);
        double dx = x - (a.SmallX + t * ex), dy = y - (a.SmallY + t * ey);
        return Math.Sqrt(dx * dx + dy * dy);
    }
}
