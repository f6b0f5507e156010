namespace Lumen.Uncertainty;

/// <summary>How to run the Monte Carlo propagation.</summary>
/// <param name="Draws">Draws M (with <paramref name="Adaptive"/>, the size of each block).</param>
/// <param name="Seed">Seed of the draws.</param>
/// <param name="Adaptive">Run blocks of M draws until every reported standard uncertainty, and the ends of its interval,
/// are stable to their second significant digit (JCGM 101:2008 §7.9, n_dig = 2).</param>
/// <param name="Threads">Worker threads (the result does not depend on it).</param>
/// <param name="MaxBlocks">Most blocks the adaptive procedure runs.</param>
public sealed record MonteCarloOptions(int Draws = 10_000, ulong Seed = 1, bool Adaptive = false, int Threads = 1, int MaxBlocks = 100);
