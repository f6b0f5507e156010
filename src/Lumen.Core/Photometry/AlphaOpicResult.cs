namespace Lumen.Photometry;

/// <summary>One α-opic result.</summary>
/// <param name="Kind">The photoreceptor class.</param>
/// <param name="EfficacyMilliwattsPerLumen">α-opic efficacy of luminous radiation K_α,v, mW/lm.</param>
/// <param name="Der">α-opic daylight (D65) efficacy ratio γ = K_α,v / K_α,v(D65).</param>
/// <param name="Irradiance">α-opic irradiance (or radiance, intensity, flux) in W-based units when absolute; else null.</param>
/// <param name="Edi">α-opic equivalent daylight (D65) illuminance (lx) — or luminance, intensity, flux for the other units — when absolute; else null.</param>
public readonly record struct AlphaOpicResult(AlphaOpicKind Kind, double EfficacyMilliwattsPerLumen, double Der, double? Irradiance, double? Edi);
