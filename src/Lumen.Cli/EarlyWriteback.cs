namespace Lumen.Cli;

/// <summary>
/// A file being written that has the system write its pages to disk while it grows (issue 16): after every
/// <see cref="Every"/> bytes, one flush to disk starts on another thread, unless one is still running. The final flush
/// (<see cref="Complete"/>) then has only the last pages left to write, instead of the whole file after the last byte.
/// A batch of 20,000 chromaticity-only rows writes 6 MB after its last row (the robust-z copy): its flush took 6–9 ms
/// after the copy; with early flushes, copy and flush together took about 4 ms less (timed in process). The bytes and
/// their order are the file's own; everything else is passed through to the file (a seek included: Parquet).
/// </summary>
/// <remarks>
/// A flush that fails (the disk is full, a network share went away) is reported by the next write or by
/// <see cref="Complete"/>, never lost: a file is renamed over its target only after <see cref="Complete"/> returned.
/// </remarks>
internal sealed class EarlyWriteback(FileStream file, long every = EarlyWriteback.DefaultEvery) : Stream
{
    /// <summary>Bytes written between early flushes: 1 MB.</summary>
    public const long DefaultEvery = 1 << 20;

    private long _sinceFlush;
    private Task? _flush;

    /// <summary>Bytes written between early flushes.</summary>
    public long Every { get; } = every;

    /// <summary>Early flushes started so far (for tests).</summary>
    public int EarlyFlushes { get; private set; }

    /// <inheritdoc/>
    public override void Write(ReadOnlySpan<byte> buffer)
    {
        file.Write(buffer);
        _sinceFlush += buffer.Length;
        if (_sinceFlush < Every) return;
        if (_flush is { IsCompleted: false }) return; // the disk is still busy with the last one
        _flush?.GetAwaiter().GetResult(); // a failed flush fails the write
        _sinceFlush = 0;
        file.Flush(); // the buffered bytes go to the system first
        var handle = file.SafeFileHandle;
        _flush = Task.Factory.StartNew(() => RandomAccess.FlushToDisk(handle), CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        EarlyFlushes++;
    }

    /// <inheritdoc/>
    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    /// <inheritdoc/>
    public override void WriteByte(byte value) => Write([value]);

    /// <summary>Waits for the early flush in flight (throwing its failure), then flushes the rest to disk.</summary>
    public void Complete()
    {
        var flush = _flush;
        _flush = null;
        flush?.GetAwaiter().GetResult();
        file.Flush(flushToDisk: true);
    }

    /// <inheritdoc/>
    protected override void Dispose(bool disposing)
    {
        // Not completed (a write failed): the flush in flight still holds the file; its failure is not the first one.
        if (disposing && _flush is { } flush)
        {
            try { flush.Wait(); }
            catch (AggregateException) { }
        }
        base.Dispose(disposing);
    }

    /// <inheritdoc/>
    public override bool CanRead => file.CanRead;

    /// <inheritdoc/>
    public override bool CanSeek => file.CanSeek;

    /// <inheritdoc/>
    public override bool CanWrite => file.CanWrite;

    /// <inheritdoc/>
    public override long Length => file.Length;

    /// <inheritdoc/>
    public override long Position { get => file.Position; set => file.Position = value; }

    /// <inheritdoc/>
    public override void Flush() => file.Flush();

    /// <inheritdoc/>
    public override int Read(byte[] buffer, int offset, int count) => file.Read(buffer, offset, count);

    /// <inheritdoc/>
    public override long Seek(long offset, SeekOrigin origin) => file.Seek(offset, origin);

    /// <inheritdoc/>
    public override void SetLength(long value) => file.SetLength(value);
}
