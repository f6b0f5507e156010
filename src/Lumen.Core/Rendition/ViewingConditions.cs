namespace Lumen.Rendition;

/// <summary>CIECAM02 viewing conditions.</summary>
/// <param name="AdaptingLuminance">L_A, cd/m².</param>
/// <param name="BackgroundY">Y_b, background relative luminance (0–100).</param>
/// <param name="F">Surround factor F (average 1.0).</param>
/// <param name="C">Surround impact c (average 0.69).</param>
/// <param name="Nc">Chromatic induction N_c (average 1.0).</param>
/// <param name="Degree">Degree of adaptation D in [0, 1], or null to compute it from F and L_A.</param>
internal sealed record ViewingConditions(double AdaptingLuminance, double BackgroundY, double F, double C, double Nc, double? Degree)
{
    /// <summary>CIE 224:2017 conditions: L_A = 100 cd/m², Y_b = 20, average surround, D = 1.</summary>
    public static ViewingConditions Cie224 { get; } = new(100, 20, 1.0, 0.69, 1.0, 1.0);
}
