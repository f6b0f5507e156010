namespace Lumen.Formats;

/// <summary>Bytes of input consumed so far (for progress and ETA); updated by the reading thread, read by others.</summary>
public sealed class ReadProgress
{
    private long _bytes;

    /// <summary>Bytes consumed from all files so far.</summary>
    public long Bytes => Interlocked.Read(ref _bytes);

    internal void Add(long delta) => Interlocked.Add(ref _bytes, delta);
}
