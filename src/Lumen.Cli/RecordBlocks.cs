using System.Collections.Concurrent;
using System.Runtime.ExceptionServices;
using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Cli;

/// <summary>
/// How analyze and batch compute records (issue 16): a reader thread cuts the input into blocks of
/// <see cref="BlockSize"/> records, worker threads parse and assess whole blocks (<see cref="RecordOutcome.OfMany"/>:
/// one rendition pass per block), and the caller receives the outcomes in input order while the next blocks are being
/// read and computed.
/// </summary>
/// <remarks>
/// Workers take blocks one after another with no barrier between groups of blocks (a chunk-at-a-time loop left a core
/// idle at the end of every chunk), and at most <see cref="BlocksInFlightPerThread"/> blocks per worker are in flight,
/// so memory stays flat and little survives a garbage collection (the collector copies what is alive: holding thousands
/// of parsed spectra in queues made every collection cost tens of milliseconds). A record's outcome does not depend on
/// the thread that computed it or on its block, so the output is the same for any thread count.
/// </remarks>
internal static class RecordBlocks
{
    /// <summary>Records assessed together (one rendition block): 16 spectra share each pass over the sample weights.</summary>
    public const int BlockSize = 16;

    /// <summary>Blocks read ahead per worker thread (work queued while the caller writes).</summary>
    public const int BlocksInFlightPerThread = 4;

    /// <summary>
    /// Every record's outcome, in input order, computed on <paramref name="threads"/> worker threads beside a reader
    /// thread and the caller's; with one thread, everything runs on the caller's thread (<see cref="OnThisThread"/>).
    /// </summary>
    /// <param name="deferred">Deferred records (each parses its row when called, on a worker).</param>
    /// <param name="options">What to compute.</param>
    /// <param name="spec">The specification, or null.</param>
    /// <param name="then">Applied to each outcome on its worker (e.g. the uncertainty of its results).</param>
    /// <param name="threads">Worker threads (at least one).</param>
    /// <param name="interrupt">When cancelled, no further record is read; the records already read are still computed and returned.</param>
    /// <returns>The outcomes, streamed. Stopping the enumeration early stops the reader and the workers.</returns>
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
        var items = new List<Func<InputRecord>>(BlockSize);
        bool ended = false;
        while (!ended)
        {
            Exception? readFailure = null;
            try
            {
                while (items.Count < BlockSize)
                {
                    if (interrupt.IsCancellationRequested || !source.MoveNext())
                    {
                        ended = true;
                        break;
                    }
                    items.Add(source.Current);
                }
            }
            catch (Exception ex)
            {
                readFailure = ex; // after the records read before it
                ended = true;
            }
            if (items.Count > 0)
            {
                var outcomes = Compute([.. items], options, spec, then);
                items.Clear();
                foreach (var outcome in outcomes) yield return outcome;
            }
            if (readFailure is not null) ExceptionDispatchInfo.Throw(readFailure);
        }
    }

    /// <summary><see cref="Stream"/> with worker threads (see the class remarks).</summary>
    private static IEnumerable<RecordOutcome> OnWorkers(IEnumerable<Func<InputRecord>> deferred, AssessmentOptions options, PreparedSpec? spec, Func<RecordOutcome, RecordOutcome> then, int threads, CancellationToken interrupt)
    {
        using var stop = new CancellationTokenSource();
        using var inOrder = new BlockingCollection<Block>(BlocksInFlightPerThread * threads);
        using var toCompute = new BlockingCollection<Block>();
        Exception? readFailure = null;

        var reader = new Thread(() =>
        {
            var items = new List<Func<InputRecord>>(BlockSize);
            void Send()
            {
                var block = new Block([.. items]);
                items.Clear();
                inOrder.Add(block, stop.Token); // waits while the window is full
                toCompute.Add(block);
            }
            try
            {
                try
                {
                    foreach (var item in deferred)
                    {
                        if (interrupt.IsCancellationRequested || stop.IsCancellationRequested) break;
                        items.Add(item);
                        if (items.Count == BlockSize) Send();
                    }
                }
                catch (Exception ex) when (!stop.IsCancellationRequested)
                {
                    readFailure = ex; // after the records read before it
                }
                if (items.Count > 0 && !stop.IsCancellationRequested) Send();
            }
            catch (OperationCanceledException) when (stop.IsCancellationRequested) { }
            finally
            {
                toCompute.CompleteAdding();
                inOrder.CompleteAdding();
            }
        }) { IsBackground = true, Name = "lumen reader" };

        var workers = new Thread[threads];
        for (int t = 0; t < threads; t++)
        {
            workers[t] = new Thread(() =>
            {
                foreach (var block in toCompute.GetConsumingEnumerable())
                {
                    try
                    {
                        if (!stop.IsCancellationRequested) block.Results = Compute(block.Items, options, spec, then);
                    }
                    catch (Exception ex) { block.Failure = ex; }
                    finally { block.Done.Set(); }
                }
            }) { IsBackground = true, Name = $"lumen worker {t + 1}" };
        }

        reader.Start();
        foreach (var w in workers) w.Start();
        try
        {
            foreach (var block in inOrder.GetConsumingEnumerable())
            {
                block.Done.Wait();
                block.Done.Dispose();
                if (block.Failure is { } failure) ExceptionDispatchInfo.Throw(failure);
                foreach (var outcome in block.Results!) yield return outcome;
            }
            if (readFailure is not null) ExceptionDispatchInfo.Throw(readFailure);
        }
        finally
        {
            stop.Cancel(); // an early stop: the reader stops adding, the workers skip what is left
            reader.Join();
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

    /// <summary>A block of records: its items, then its outcomes once a worker has computed them.</summary>
    private sealed class Block(Func<InputRecord>[] items)
    {
        public Func<InputRecord>[] Items { get; } = items;
        public RecordOutcome[]? Results { get; set; }
        public Exception? Failure { get; set; }
        public ManualResetEventSlim Done { get; } = new(false);
    }
}
