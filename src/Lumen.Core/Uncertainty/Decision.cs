namespace Lumen.Uncertainty;

/// <summary>The verdict of one criterion or one unit under a decision rule.</summary>
public enum Decision
{
    /// <summary>Conforms.</summary>
    Pass,

    /// <summary>Does not conform.</summary>
    Fail,

    /// <summary>Too close to the limit to call with the stated uncertainty (guarded acceptance only).</summary>
    Inconclusive,
}
