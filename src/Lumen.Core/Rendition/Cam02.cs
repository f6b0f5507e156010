namespace Lumen.Rendition;

/// <summary>CIECAM02 correlates used by Lumen (J, C, M, h) and the CAM02-UCS coordinates.</summary>
/// <param name="J">Lightness.</param>
/// <param name="C">Chroma.</param>
/// <param name="M">Colourfulness.</param>
/// <param name="HueDegrees">Hue angle h, degrees in [0, 360).</param>
internal readonly record struct Cam02(double J, double C, double M, double HueDegrees)
{
    /// <summary>CAM02-UCS coordinates (Luo, Cui, Li 2006): J′ = 1.7J/(1 + 0.007J), M′ = ln(1 + 0.0228M)/0.0228.</summary>
    /// <returns>(J′, a′, b′).</returns>
    public (double J, double A, double B) ToUcs()
    {
        double jp = 1.7 * J / (1 + 0.007 * J);
        double mp = Math.Log(1 + 0.0228 * M) / 0.0228;
        double h = HueDegrees * Math.PI / 180;
        return (jp, mp * Math.Cos(h), mp * Math.Sin(h));
    }
}
