using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Cli;

/// <summary>
/// How analyze and batch compute records: chunks in input order, each chunk in blocks of <see cref="BlockSize"/> on all
/// cores; a block's rows are parsed and its rendition indices computed together (<see cref="RecordOutcome.OfMany"/>).
/// </summary>
internal static class RecordBlocks
{
    /// <summary>Records computed per parallel chunk (input order is kept).</summary>
    public const int ChunkSize = 512;

    /// <summary>Records assessed together (one rendition block, issue 16): 16 spectra share each pass over the sample weights.</summary>
    public const int BlockSize = 16;

    /// <summary>Parses, assesses and judges one chunk on up to <paramref name="threads"/> cores.</summary>
    /// <param name="chunk">Deferred records (each parses its row when called).</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null.</param>
    /// <param name="then">Applied to each outcome on its compute thread (e.g. the uncertainty of its results).</param>
    /// <param name="threads">Most threads to use.</param>
    /// <returns>The outcomes, in the chunk's order.</returns>
    public static RecordOutcome[] Compute(IReadOnlyList<Func<InputRecord>> chunk, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, int threads)
    {
        var results = new RecordOutcome[chunk.Count];
        int blocks = (chunk.Count + BlockSize - 1) / BlockSize;
        Parallel.For(0, blocks, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, threads) }, b =>
        {
            int from = b * BlockSize, to = Math.Min(chunk.Count, from + BlockSize);
            var records = new InputRecord[to - from];
            for (int i = from; i < to; i++) records[i - from] = chunk[i]();
            var outcomes = RecordOutcome.OfMany(records, options, spec);
            for (int i = from; i < to; i++) results[i] = then(outcomes[i - from]);
        });
        return results;
    }

    /// <summary>Every record's outcome, in input order, computed a chunk at a time on all cores (memory stays flat).</summary>
    /// <param name="deferred">Deferred records.</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null.</param>
    /// <param name="then">Applied to each outcome on its compute thread.</param>
    /// <param name="threads">Most threads to use.</param>
    /// <param name="interrupt">When cancelled, no further record is read; the records already taken are still computed.</param>
    /// <returns>The outcomes, streamed.</returns>
    public static IEnumerable<RecordOutcome> Stream(IEnumerable<Func<InputRecord>> deferred, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, int threads, CancellationToken interrupt = default)
    {
        var chunk = new List<Func<InputRecord>>(ChunkSize);
        foreach (var item in deferred)
        {
            if (interrupt.IsCancellationRequested) break;
            chunk.Add(item);
            if (chunk.Count < ChunkSize) continue;
            foreach (var o in Compute(chunk, options, spec, then, threads)) yield return o;
            chunk.Clear();
        }
        if (chunk.Count > 0) foreach (var o in Compute(chunk, options, spec, then, threads)) yield return o;
    }
}
