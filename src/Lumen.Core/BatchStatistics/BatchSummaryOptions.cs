namespace Lumen.BatchStatistics;

/// <summary>How a batch is divided for its summary.</summary>
/// <param name="GroupBy">A metadata key (a row-layout column such as <c>lot</c>, or a preamble key): one summary per value
/// besides the overall one; its groups are also the subgroups of Cpk unless <paramref name="SubgroupSize"/> is given.</param>
/// <param name="SubgroupSize">Consecutive results (in input order, errors not counted) per rational subgroup for Cpk; null
/// for none.</param>
public sealed record BatchSummaryOptions(string? GroupBy = null, int? SubgroupSize = null)
{
    /// <summary>No groups, no subgroups: Ppk only.</summary>
    public static BatchSummaryOptions None { get; } = new();

    /// <summary>The subgroup rule in words, or null when the batch has none.</summary>
    public string? SubgroupRule => SubgroupSize is { } n ? $"consecutive subgroups of {n} results in input order"
        : GroupBy is { } g ? $"subgroups by '{g}'" : null;
}
