namespace Lumen.Colorimetry;

/// <summary>An 8-bit sRGB colour with a flag for colours that had to be clipped into the gamut.</summary>
/// <param name="R">Red channel, gamma-encoded sRGB, 0–255.</param>
/// <param name="G">Green channel, gamma-encoded sRGB, 0–255.</param>
/// <param name="B">Blue channel, gamma-encoded sRGB, 0–255.</param>
/// <param name="Clipped">True when the colour lay outside the sRGB gamut or above white and was clipped.</param>
public readonly record struct Rgb8(byte R, byte G, byte B, bool Clipped)
{
    /// <summary>CSS hex form, e.g. <c>#a1b2c3</c>.</summary>
    public string Hex => $"#{R:x2}{G:x2}{B:x2}";
}
