namespace Lumen.Mixing;

/// <summary>What the mixer optimises among the mixes that hit the target chromaticity.</summary>
public enum MixObjective
{
    /// <summary>Maximise CIE 224 Rf (the default; output breaks ties by scaling the levels up).</summary>
    MaximizeRf,

    /// <summary>Maximise CIE 13.3 Ra.</summary>
    MaximizeRa,

    /// <summary>Maximise CIE 13.3 R9.</summary>
    MaximizeR9,

    /// <summary>Maximise the Spectral Similarity Index to a matched spectrum.</summary>
    MaximizeSsi,

    /// <summary>Maximise the luminous output (flux of the mix relative to all channels at full).</summary>
    MaximizeOutput,

    /// <summary>Maximise the melanopic daylight efficacy ratio (CIE S 026).</summary>
    MaximizeMelanopicDer,

    /// <summary>Minimise the melanopic daylight efficacy ratio (CIE S 026).</summary>
    MinimizeMelanopicDer,
}
