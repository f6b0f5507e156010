using Lumen.Colorimetry;

namespace Lumen.Graphics;

/// <summary>A measured point to plot.</summary>
/// <param name="Label">Name (shown for few points).</param>
/// <param name="Chromaticity">Its CIE 1931 2° chromaticity.</param>
/// <param name="Status">Pass/fail marking.</param>
public sealed record DiagramPoint(string Label, Chromaticity Chromaticity, PointStatus Status)
{
    /// <summary>Covariance of the point's CIE 1976 (u′, v′) from its measurement uncertainty — (var u′, cov, var v′) —
    /// drawn as the 95 % uncertainty ellipse; null for none.</summary>
    public (double UU, double UV, double VV)? UPrimeVPrimeCovariance { get; init; }

    /// <summary>χ² quantile of 2 degrees of freedom at 95 %: the ellipse is the set where the Mahalanobis distance² ≤ it
    /// (−2 ln 0.05, exact for the bivariate normal).</summary>
    public const double Chi2TwoDof95 = 5.991464547107979;

    /// <summary>The 95 % uncertainty ellipse as chromaticities (a closed polygon of <paramref name="segments"/> points);
    /// empty without a usable covariance.</summary>
    /// <param name="segments">Number of vertices.</param>
    /// <returns>The outline.</returns>
    public IReadOnlyList<Chromaticity> UncertaintyEllipse(int segments = 72)
    {
        if (UPrimeVPrimeCovariance is not { } c || !Chromaticity.IsDefined) return [];
        double a = c.UU, b = c.UV, d = c.VV;
        if (!(a > 0) || !(d > 0) || a * d - b * b <= 0) return [];
        // Cholesky factor L of the covariance: p = centre + k·L·(cos t, sin t), k² the χ² quantile.
        double l11 = Math.Sqrt(a), l21 = b / l11, l22 = Math.Sqrt(d - l21 * l21), k = Math.Sqrt(Chi2TwoDof95);
        var list = new Chromaticity[segments];
        for (int i = 0; i < segments; i++)
        {
            double t = 2 * Math.PI * i / segments, ct = Math.Cos(t), st = Math.Sin(t);
            list[i] = Chromaticity.FromUPrimeVPrime(Chromaticity.UPrime + k * l11 * ct, Chromaticity.VPrime + k * (l21 * ct + l22 * st));
        }
        return list;
    }
}
