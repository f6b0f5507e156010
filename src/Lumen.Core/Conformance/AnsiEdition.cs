namespace Lumen.Conformance;

/// <summary>Editions of ANSI C78.377 whose quadrangles Lumen can build.</summary>
public enum AnsiEdition
{
    /// <summary>2015/2017 editions: Duv target from the flexible-CCT formula at each corner's CCT (default).</summary>
    Ed2017,

    /// <summary>2008 edition: each category's tabulated target Duv ± 0.006 at both CCT limits (as reproduced in GOST 34819-2021 Table K.1).</summary>
    Ed2008,
}
