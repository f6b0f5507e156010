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

    [Fact]
    public void Stopping_early_stops_the_reader_within_the_read_ahead_window()
    {
        int pulled = 0;
        const int threads = 2;
        var taken = RecordBlocks.Stream(Items(1_000_000, i => Interlocked.Exchange(ref pulled, i + 1)), Options, null, o => o, threads).Take(40).ToList();
        Assert.Equal(40, taken.Count);
        // Returned (the reader and workers were joined) having read at most the window ahead, not the million.
        int window = (RecordBlocks.BlocksInFlightPerThread * threads + 3) * RecordBlocks.BlockSize;
        Assert.InRange(Volatile.Read(ref pulled), 40, 40 + window);
    }

    [Fact]
    public void A_failure_in_a_records_step_reaches_the_caller_in_order()
    {
        var seen = new List<string>();
        var ex = Assert.Throws<InvalidOperationException>(() =>
        {
            foreach (var o in RecordBlocks.Stream(Items(500), Options, null, o => o.Record.Name == "r100" ? throw new InvalidOperationException("step failed") : o, 3))
                seen.Add(o.Record.Name);
        });
        Assert.Equal("step failed", ex.Message);
        Assert.Equal(Enumerable.Range(0, 96).Select(i => $"r{i}"), seen); // the blocks before r100's block, nothing after
    }

    [Fact]
    public void A_failing_input_gives_what_was_read_then_the_failure()
    {
        static IEnumerable<Func<InputRecord>> Failing()
        {
            foreach (var item in Items(100)) yield return item;
            throw new IOException("disk went away");
        }
        var seen = new List<string>();
        var ex = Assert.Throws<IOException>(() =>
        {
            foreach (var o in RecordBlocks.Stream(Failing(), Options, null, o => o, 2)) seen.Add(o.Record.Name);
        });
        Assert.Equal("disk went away", ex.Message);
        Assert.Equal(Enumerable.Range(0, 100).Select(i => $"r{i}"), seen); // every record read before the failure
    }

    [Fact]
    public void An_interrupt_stops_reading_and_returns_what_was_read()
    {
        using var interrupt = new CancellationTokenSource();
        int pulled = 0;
        var outcomes = RecordBlocks.Stream(Items(1_000_000, i => { if (Interlocked.Increment(ref pulled) == 50) interrupt.Cancel(); }), Options, null, o => o, 2, interrupt.Token).ToList();
        Assert.InRange(outcomes.Count, 48, 50); // everything read before the signal, nothing after
        Assert.Equal(Enumerable.Range(0, outcomes.Count).Select(i => $"r{i}"), outcomes.Select(o => o.Record.Name));
    }
}
