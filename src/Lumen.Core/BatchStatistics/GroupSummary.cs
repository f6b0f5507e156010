namespace Lumen.BatchStatistics;

/// <summary>The summary of the units that share one value of the grouping metadata column.</summary>
/// <param name="Value">The column's value (empty when a record had none).</param>
/// <param name="Summary">The summary of that group alone, as a separate batch of those records would give it.</param>
public sealed record GroupSummary(string Value, BatchSummary Summary);
