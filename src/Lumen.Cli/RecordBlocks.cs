using System.Collections.Concurrent;
using System.Runtime.ExceptionServices;
using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Cli;

/// <summary>
/// How analyze and batch compute records (issue 16): the caller's thread cuts the input into blocks of
/// <see cref="BlockSize"/> records, worker threads parse and assess whole blocks (<see cref="RecordOutcome.OfMany"/>:
/// one rendition pass per block), and the caller receives the outcomes in input order; while the oldest block is not
/// done, the caller computes queued blocks itself, so <c>--threads N</c> is N threads computing: N − 1 workers and the
/// caller.
/// </summary>
/// <remarks>
/// Workers take blocks one after another with no barrier between groups of blocks (a chunk-at-a-time loop left a core
/// idle at the end of every chunk), and at most <see cref="BlocksInFlightPerThread"/> blocks per thread are read ahead,
/// so memory stays flat and little survives a garbage collection (the collector copies what is alive: holding thousands
/// of parsed spectra in queues made every collection cost tens of milliseconds). A record's outcome does not depend on
/// the thread that computed it or on its block, so the output is the same for any thread count. Until 3 December a
/// reader thread and N workers ran beside the caller: four busy threads on a 2-core machine, 5,800–11,000 involuntary
/// context switches for 20,000 rows (30–110 now), and when the virtual machine's host took a quarter of its processor
/// time, two threads ran slower than one (see DEVELOPERS.md).
/// </remarks>
internal static class RecordBlocks
{
    /// <summary>Records assessed together (one rendition block): 16 spectra share each pass over the sample weights.</summary>
    public const int BlockSize = 16;

    /// <summary>Blocks read ahead per computing thread (work queued while the caller writes).</summary>
    public const int BlocksInFlightPerThread = 4;

    /// <summary>
    /// Every record's outcome, in input order, computed on <paramref name="threads"/> threads: the caller's (which also
    /// reads) and <paramref name="threads"/> − 1 workers; with one thread, everything runs on the caller's thread
    /// (<see cref="OnThisThread"/>).
    /// </summary>
    /// <param name="deferred">Deferred records (each parses its row when called, on the thread that computes its block).</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null.</param>
    /// <param name="then">Applied to each outcome on the thread that computed it (e.g. the uncertainty of its results).</param>
    /// <param name="threads">Computing threads, the caller's included (at least one).</param>
    /// <param name="interrupt">When cancelled, no further record is read; the records already read are still computed and returned.</param>
    /// <returns>The outcomes, streamed. Stopping the enumeration early stops the reading and the workers.</returns>
    public static IEnumerable<RecordOutcome> Stream(IEnumerable<Func<InputRecord>> deferred, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, int threads, CancellationToken interrupt = default)
    {
        ArgumentNullException.ThrowIfNull(deferred);
        return threads <= 1 ? OnThisThread(deferred, options, spec, then, interrupt) : OnWorkers(deferred, options, spec, then, threads, interrupt);
    }

    /// <summary>
    /// <see cref="Stream"/> with one thread: blocks read, computed and returned in turn on the caller's thread, with no
    /// reader or worker thread, so <c>--threads 1</c> uses one core (for several processes side by side, or a machine
    /// shared with other work). The same outcomes, failures and interrupt rule as with workers (tests compare them).
    /// </summary>
    private static IEnumerable<RecordOutcome> OnThisThread(IEnumerable<Func<InputRecord>> deferred, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, CancellationToken interrupt)
    {
        using var source = deferred.GetEnumerator();
        bool ended = false;
        while (!ended)
        {
            var (items, end, readFailure) = ReadBlock(source, interrupt);
            ended = end;
            if (items.Length > 0)
                foreach (var outcome in Compute(items, options, spec, then)) yield return outcome;
            if (readFailure is not null) ExceptionDispatchInfo.Throw(readFailure); // after the records read before it
        }
    }

    /// <summary>Reads the next block's records: up to <see cref="BlockSize"/>, fewer at the end, at an interrupt or at a
    /// read failure (returned with the records read before it).</summary>
    private static (Func<InputRecord>[] Items, bool Ended, Exception? Failure) ReadBlock(IEnumerator<Func<InputRecord>> source, CancellationToken interrupt)
    {
        var items = new List<Func<InputRecord>>(BlockSize);
        try
        {
            while (items.Count < BlockSize)
            {
                if (interrupt.IsCancellationRequested || !source.MoveNext()) return ([.. items], true, null);
                items.Add(source.Current);
            }
            return ([.. items], false, null);
        }
        catch (Exception ex)
        {
            return ([.. items], true, ex);
        }
    }

    /// <summary><see cref="Stream"/> with worker threads (see the class remarks).</summary>
    private static IEnumerable<RecordOutcome> OnWorkers(IEnumerable<Func<InputRecord>> deferred, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, int threads, CancellationToken interrupt)
    {
        using var toCompute = new BlockingCollection<Block>();
        var inOrder = new Queue<Block>(); // read and not yet returned, in input order (this thread's only)
        using var source = deferred.GetEnumerator();
        bool ended = false;
        Exception? readFailure = null;
        int window = BlocksInFlightPerThread * threads;

        var workers = new Thread[threads - 1];
        for (int t = 0; t < workers.Length; t++)
        {
            workers[t] = new Thread(() =>
            {
                foreach (var block in toCompute.GetConsumingEnumerable()) block.Run(options, spec, then);
            }) { IsBackground = true, Name = $"lumen worker {t + 1}" };
            workers[t].Start();
        }
        try
        {
            while (true)
            {
                // Read ahead up to the window, then return the oldest block, computing queued blocks while it is not done.
                while (!ended && inOrder.Count < window)
                {
                    var (items, end, failure) = ReadBlock(source, interrupt);
                    ended = end;
                    readFailure = failure; // thrown after the records read before it
                    if (items.Length == 0) break;
                    var block = new Block(items);
                    inOrder.Enqueue(block);
                    toCompute.Add(block);
                }
                if (ended && !toCompute.IsAddingCompleted) toCompute.CompleteAdding();
                if (inOrder.Count == 0) break;
                var head = inOrder.Peek();
                while (!head.Done.IsSet && toCompute.TryTake(out var queued)) queued.Run(options, spec, then);
                head.Done.Wait();
                inOrder.Dequeue();
                head.Done.Dispose();
                if (head.Failure is { } computeFailure) ExceptionDispatchInfo.Throw(computeFailure);
                foreach (var outcome in head.Results!) yield return outcome;
            }
            if (readFailure is not null) ExceptionDispatchInfo.Throw(readFailure);
        }
        finally
        {
            // An early stop: nothing more is read, the blocks not yet started are dropped, the workers finish theirs.
            if (!toCompute.IsAddingCompleted) toCompute.CompleteAdding();
            while (toCompute.TryTake(out _)) { }
            foreach (var w in workers) w.Join();
        }
    }

    /// <summary>Parses, assesses and judges one block on the calling thread.</summary>
    private static RecordOutcome[] Compute(Func<InputRecord>[] items, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then)
    {
        var records = new InputRecord[items.Length];
        for (int i = 0; i < items.Length; i++)
        {
            records[i] = items[i]();
            items[i] = null!; // the row's text is garbage once parsed
        }
        var outcomes = RecordOutcome.OfMany(records, options, spec);
        for (int i = 0; i < outcomes.Length; i++) outcomes[i] = then(outcomes[i]);
        return outcomes;
    }

    /// <summary>A block of records: its items, then its outcomes once a thread has computed them.</summary>
    private sealed class Block(Func<InputRecord>[] items)
    {
        public Func<InputRecord>[] Items { get; } = items;
        public RecordOutcome[]? Results { get; private set; }
        public Exception? Failure { get; private set; }
        public ManualResetEventSlim Done { get; } = new(false);

        /// <summary>Computes the block on the calling thread (a worker, or the caller while it waits); a failure is kept
        /// for the caller, in order.</summary>
        public void Run(AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then)
        {
            try { Results = Compute(Items, options, spec, then); }
            catch (Exception ex) { Failure = ex; }
            finally { Done.Set(); }
        }
    }
}
