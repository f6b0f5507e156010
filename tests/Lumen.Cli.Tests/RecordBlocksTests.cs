using Lumen.Analysis;
using Lumen.Cli;
using Xunit;

namespace Lumen.Cli.Tests;

/// <summary>
/// The record pipeline behind analyze and batch (issue 16): input order kept on any thread count, bounded read-ahead,
/// and no hang or lost failure when the consumer stops early, a record's step throws or the input fails part-way.
/// Records here are cheap error records: the pipeline, not the assessment, is under test.
/// </summary>
public class RecordBlocksTests
{
    private static Func<InputRecord> Item(int i) => () => new ErrorRecord("test", 0, $"r{i}", new ReadDiagnostic("test", i + 1, 1, "placeholder"));

    private static IEnumerable<Func<InputRecord>> Items(int count, Action<int>? pulled = null)
    {
        for (int i = 0; i < count; i++)
        {
            pulled?.Invoke(i);
            yield return Item(i);
        }
    }

    private static readonly AssessmentOptions Options = new();

    [Fact]
    public void One_thread_computes_on_the_callers_thread()
    {
        // --threads 1 uses one core: no reader or worker thread (issue 16), so every record is parsed where it is consumed.
        int caller = Environment.CurrentManagedThreadId;
        var threadsSeen = new HashSet<int>();
        IEnumerable<Func<InputRecord>> Recorded()
        {
            for (int i = 0; i < 100; i++)
            {
                lock (threadsSeen) threadsSeen.Add(Environment.CurrentManagedThreadId);
                var item = Item(i);
                yield return () => { lock (threadsSeen) threadsSeen.Add(Environment.CurrentManagedThreadId); return item(); };
            }
        }
        Assert.Equal(100, RecordBlocks.Stream(Recorded(), Options, null, o => o, 1).Count());
        Assert.Equal([caller], threadsSeen);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(4)]
    public void N_threads_are_the_caller_and_N_minus_1_workers(int threads)
    {
        // --threads N computes on N threads (issue 16): the caller reads, and computes queued blocks while the oldest is
        // not done; N − 1 workers compute the rest. No reader thread beside them.
        int caller = Environment.CurrentManagedThreadId;
        var readers = new HashSet<int>();
        var parsers = new HashSet<int>();
        IEnumerable<Func<InputRecord>> Recorded()
        {
            for (int i = 0; i < 4000; i++)
            {
                lock (readers) readers.Add(Environment.CurrentManagedThreadId);
                var item = Item(i);
                yield return () =>
                {
                    lock (parsers) parsers.Add(Environment.CurrentManagedThreadId);
                    Thread.SpinWait(2000); // long enough that the caller finds blocks waiting
                    return item();
                };
            }
        }
        Assert.Equal(4000, RecordBlocks.Stream(Recorded(), Options, null, o => o, threads).Count());
        Assert.Equal([caller], readers);
        Assert.InRange(parsers.Count, 2, threads);
        Assert.Contains(parsers, id => id != caller);
    }

    [Theory]
    [InlineData(1, 0)]
    [InlineData(1, 1)]
    [InlineData(2, 15)]
    [InlineData(2, 16)]
    [InlineData(3, 17)]
    [InlineData(4, 1000)]
    [InlineData(16, 333)]
    public void Every_record_comes_back_once_in_input_order(int threads, int count)
    {
        var names = RecordBlocks.Stream(Items(count), Options, null, o => o, threads).Select(o => o.Record.Name).ToList();
        Assert.Equal(Enumerable.Range(0, count).Select(i => $"r{i}"), names);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void Stopping_early_stops_the_reader_within_the_read_ahead_window(int threads)
    {
        int pulled = 0;
        var taken = RecordBlocks.Stream(Items(1_000_000, i => Interlocked.Exchange(ref pulled, i + 1)), Options, null, o => o, threads).Take(40).ToList();
        Assert.Equal(40, taken.Count);
        // Returned (the reader and workers were joined) having read at most the window ahead, not the million.
        int window = (RecordBlocks.BlocksInFlightPerThread * threads + 3) * RecordBlocks.BlockSize;
        Assert.InRange(Volatile.Read(ref pulled), 40, 40 + window);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    public void A_failure_in_a_records_step_reaches_the_caller_in_order(int threads)
    {
        var seen = new List<string>();
        var ex = Assert.Throws<InvalidOperationException>(() =>
        {
            foreach (var o in RecordBlocks.Stream(Items(500), Options, null, o => o.Record.Name == "r100" ? throw new InvalidOperationException("step failed") : o, threads))
                seen.Add(o.Record.Name);
        });
        Assert.Equal("step failed", ex.Message);
        Assert.Equal(Enumerable.Range(0, 96).Select(i => $"r{i}"), seen); // the blocks before r100's block, nothing after
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void A_failing_input_gives_what_was_read_then_the_failure(int threads)
    {
        static IEnumerable<Func<InputRecord>> Failing()
        {
            foreach (var item in Items(100)) yield return item;
            throw new IOException("disk went away");
        }
        var seen = new List<string>();
        var ex = Assert.Throws<IOException>(() =>
        {
            foreach (var o in RecordBlocks.Stream(Failing(), Options, null, o => o, threads)) seen.Add(o.Record.Name);
        });
        Assert.Equal("disk went away", ex.Message);
        Assert.Equal(Enumerable.Range(0, 100).Select(i => $"r{i}"), seen); // every record read before the failure
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void An_interrupt_stops_reading_and_returns_what_was_read(int threads)
    {
        using var interrupt = new CancellationTokenSource();
        int pulled = 0;
        var outcomes = RecordBlocks.Stream(Items(1_000_000, i => { if (Interlocked.Increment(ref pulled) == 50) interrupt.Cancel(); }), Options, null, o => o, threads, interrupt.Token).ToList();
        Assert.InRange(outcomes.Count, 48, 50); // everything read before the signal, nothing after
        Assert.Equal(Enumerable.Range(0, outcomes.Count).Select(i => $"r{i}"), outcomes.Select(o => o.Record.Name));
    }
}
