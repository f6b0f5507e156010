namespace Lumen.Rendition;

/// <summary>The reflecting sample sets of the rendition methods.</summary>
public enum SampleSet
{
    /// <summary>CIE 13.3-1995 test colour samples TCS01–TCS14.</summary>
    CieTestColorSamples,

    /// <summary>CIE 224:2017 colour evaluation samples CES1–CES99.</summary>
    ColorEvaluationSamples,
}
