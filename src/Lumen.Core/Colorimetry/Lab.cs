namespace Lumen.Colorimetry;

/// <summary>CIE 1976 L*a*b* coordinates (CIELAB).</summary>
/// <param name="L">Lightness L*, 0–100 for object colours.</param>
/// <param name="A">a*, red–green opponent coordinate (positive = red).</param>
/// <param name="B">b*, yellow–blue opponent coordinate (positive = yellow).</param>
public readonly record struct Lab(double L, double A, double B);
