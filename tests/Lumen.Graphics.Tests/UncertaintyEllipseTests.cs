using Lumen.Cli;
using Lumen.Colorimetry;

namespace Lumen.Graphics.Tests;

/// <summary>The 95 % uncertainty ellipse of a point in u′v′ (issue 14).</summary>
public class UncertaintyEllipseTests
{
    [Fact]
    public void Every_vertex_lies_at_the_95_percent_mahalanobis_distance()
    {
        // For a bivariate normal, P(d² ≤ χ²₂(0.95)) = 0.95 with χ²₂(0.95) = −2 ln 0.05 = 5.9915 (standard result).
        var centre = Chromaticity.FromUPrimeVPrime(0.25, 0.52);
        var cov = (UU: 4e-7, UV: 1.5e-7, VV: 2e-7);
        var p = new DiagramPoint("u", centre, PointStatus.None) { UPrimeVPrimeCovariance = cov };
        var outline = p.UncertaintyEllipse(36);
        Assert.Equal(36, outline.Count);
        double det = cov.UU * cov.VV - cov.UV * cov.UV;
        foreach (var c in outline)
        {
            double du = c.UPrime - 0.25, dv = c.VPrime - 0.52;
            double d2 = (cov.VV * du * du - 2 * cov.UV * du * dv + cov.UU * dv * dv) / det;
            Assert.Equal(-2 * Math.Log(0.05), d2, 6);
        }
        Assert.Empty((p with { UPrimeVPrimeCovariance = (1e-7, 1e-6, 1e-7) }).UncertaintyEllipse()); // not positive definite
    }

    [Fact]
    public void Plot_locus_draws_the_ellipses_of_an_uncertainty_model()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-ue-{Guid.NewGuid():N}.svg");
        try
        {
            var o = new StringWriter();
            var e = new StringWriter();
            int code = LumenApp.Run(["plot", "locus", Path.Combine(GraphicsTests.Root, "examples", "quillfern-downlights-3000K.csv"), "--uncertainty",
                Path.Combine(GraphicsTests.Root, "examples", "uncertainty", "array-spectroradiometer.json"), "--draws", "300", "--space", "uv", "-o", path], TextReader.Null, o, e);
            Assert.Equal(0, code);
            Assert.Contains("95 % uncertainty ellipse", File.ReadAllText(path), StringComparison.Ordinal);
        }
        finally { File.Delete(path); }
    }
}
