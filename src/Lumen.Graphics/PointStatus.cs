namespace Lumen.Graphics;

/// <summary>Outcome used to mark a point.</summary>
public enum PointStatus
{
    /// <summary>No specification.</summary>
    None,

    /// <summary>Passed the specification.</summary>
    Pass,

    /// <summary>Failed the specification.</summary>
    Fail,

    /// <summary>Too close to a limit to call with the measurement uncertainty (guarded acceptance).</summary>
    Inconclusive,
}
