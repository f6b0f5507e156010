namespace Lumen.Photometry;

/// <summary>The five CIE S 026 photoreceptor classes, melanopic first.</summary>
public enum AlphaOpicKind
{
    /// <summary>Melanopic (ipRGC melanopsin).</summary>
    Melanopic,

    /// <summary>S-cone-opic.</summary>
    SConeOpic,

    /// <summary>M-cone-opic.</summary>
    MConeOpic,

    /// <summary>L-cone-opic.</summary>
    LConeOpic,

    /// <summary>Rhodopic (rods).</summary>
    Rhodopic,
}
