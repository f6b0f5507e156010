namespace Lumen.Formats;

/// <summary>Output formats of the per-record writers.</summary>
public enum OutputFormat
{
    /// <summary>A compact table for people.</summary>
    Text,

    /// <summary>A JSON array, one object per record (field names documented in the README).</summary>
    Json,

    /// <summary>CSV, one row per record, flat columns documented in the README.</summary>
    Csv,

    /// <summary>JSON Lines: one JSON object per record per line (the objects of <see cref="Json"/>), streamed.</summary>
    JsonLines,
}
