using System.Collections.Concurrent;
using System.Text;

namespace Lumen.Formats;

/// <summary>
/// Reads an input once, line by line, with bounded memory: the first lines can be looked at (to detect the layout) and
/// are then replayed to the reader proper, so pipes, FIFOs and process substitution work; a line longer than
/// <see cref="MaxLineChars"/> stops the read with <see cref="LineTooLongException"/> instead of filling memory.
/// </summary>
/// <remarks>
/// A UTF-8 stream (<see cref="Open"/>) is read as bytes, and a row reader can take its lines as bytes
/// (<see cref="TryReadLineUtf8"/>) without turning each into a string (issue 16: at 1 nm a row is 3 KB of text, and
/// decoding and copying it as UTF-16 cost a batch's reader thread more than finding its lines). <see cref="ReadLine"/>
/// decodes the same bytes, with the same result as a <see cref="StreamReader"/> over the stream: a line ends at a
/// <c>\n</c> byte, which no multi-byte character contains, and a malformed sequence becomes U+FFFD either way.
/// </remarks>
public sealed class LineReader : TextReader
{
    /// <summary>Longest line accepted, in characters (in bytes for UTF-8 input; 4 Mi: about 400 000 cells; far beyond any instrument's row).</summary>
    public const int MaxLineChars = 4 * 1024 * 1024;

    private readonly TextReader? _inner; // characters, or
    private readonly Stream? _utf8;      // UTF-8 bytes
    private readonly Queue<string> _replay = new();
    private readonly char[] _buffer;
    private readonly StringBuilder _line = new();
    private byte[] _bytes;
    private bool _keepBuffers; // lines were handed out to keep (TryReadLineUtf8Stable): a refill reads into another buffer
    private SharedReadBuffer? _shared; // the read buffer's lines handed out to keep, while it is the read buffer
    private readonly ConcurrentBag<byte[]> _released = []; // read buffers whose kept lines have all been released
    private byte[] _lineBytes = [];
    private int _lineBytesLength;
    private int _pos, _len;
    private bool _eof;

    /// <summary>Wraps a reader.</summary>
    /// <param name="inner">The input; read once, never rewound.</param>
    public LineReader(TextReader inner)
    {
        ArgumentNullException.ThrowIfNull(inner);
        _inner = inner;
        _buffer = new char[1 << 16];
        _bytes = [];
    }

    private LineReader(Stream utf8, byte[] bytes, int start, int length)
    {
        _utf8 = utf8;
        _buffer = [];
        _bytes = bytes;
        _pos = start;
        _len = length;
    }

    /// <summary>
    /// Reads a stream of text once: UTF-8 (with or without its byte-order mark) as bytes; a UTF-16 or UTF-32 stream,
    /// known by its byte-order mark, through a <see cref="StreamReader"/>. Nothing is sought, so pipes work.
    /// </summary>
    /// <param name="stream">The input, positioned at its start; disposed with the reader.</param>
    /// <returns>The reader.</returns>
    public static LineReader Open(Stream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        var bytes = new byte[1 << 16];
        int length = 0, read;
        while (length < 4 && (read = stream.Read(bytes, length, bytes.Length - length)) > 0) length += read;
        var head = bytes.AsSpan(0, length);
        if (head.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) return new LineReader(stream, bytes, 3, length);
        bool otherMark = head.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || head.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF])
            || head.StartsWith((ReadOnlySpan<byte>)[0, 0, 0xFE, 0xFF]);
        if (!otherMark) return new LineReader(stream, bytes, 0, length);
        var rest = new PrefixedStream(bytes.AsSpan(0, length).ToArray(), stream);
        return new LineReader(new StreamReader(rest, Encoding.UTF8, detectEncodingFromByteOrderMarks: true, bufferSize: 1 << 16));
    }

    /// <summary>True when lines come from UTF-8 bytes (<see cref="TryReadLineUtf8"/> hands them out without decoding).</summary>
    internal bool IsUtf8 => _utf8 is not null;

    /// <summary>
    /// The next line as UTF-8 bytes, valid until the next read; a replayed line comes back encoded. Counts the line as
    /// <see cref="ReadLine"/> does. Only for a reader made by <see cref="Open"/> on UTF-8.
    /// </summary>
    /// <param name="line">The line without its <c>\n</c> (nor a <c>\r</c> before it).</param>
    /// <returns>False at the end of the input.</returns>
    internal bool TryReadLineUtf8(out ReadOnlySpan<byte> line)
    {
        if (_utf8 is null) throw new InvalidOperationException("not a UTF-8 line reader");
        if (_replay.Count > 0)
        {
            var text = _replay.Dequeue();
            GrowLineBytes(Encoding.UTF8.GetMaxByteCount(text.Length));
            line = _lineBytes.AsSpan(0, Encoding.UTF8.GetBytes(text, _lineBytes));
        }
        else if (!ReadPhysicalUtf8(out line)) return false;
        LinesRead++;
        return true;
    }

    /// <summary>
    /// <see cref="TryReadLineUtf8"/>, but the line stays valid after later reads, so it can be handed to another thread
    /// unparsed: a line that lies in the read buffer is a slice of it, and from the first call on every refill reads into
    /// another buffer instead of overwriting the old one; a line assembled across buffers, or replayed, is copied. Issue
    /// 16: copying each 3 KB row of a batch into an array of its own cost the reader thread more than finding the rows.
    /// </summary>
    /// <remarks>
    /// A slice comes with its buffer's <paramref name="hold"/>: the buffer is read into again only after the reader has
    /// moved past it and every hold taken on it has been released (<see cref="SharedReadBuffer.Release"/>, once per
    /// line). A line never released keeps its bytes for good, and its buffer goes to the garbage collector with it; so
    /// a caller that does not release is safe, and one that releases saves the allocation (and first touch) of a new
    /// 64 KB buffer per refill.
    /// </remarks>
    /// <param name="line">The line without its <c>\n</c> (nor a <c>\r</c> before it).</param>
    /// <param name="hold">The hold on the buffer the line lies in, or null when the line is a copy of its own.</param>
    /// <returns>False at the end of the input.</returns>
    internal bool TryReadLineUtf8Stable(out ReadOnlyMemory<byte> line, out SharedReadBuffer? hold)
    {
        _keepBuffers = true;
        hold = null;
        if (!TryReadLineUtf8(out var span))
        {
            line = default;
            return false;
        }
        if (!_bytes.AsSpan().Overlaps(span, out int offset))
        {
            line = span.ToArray();
            return true;
        }
        line = _bytes.AsMemory(offset, span.Length);
        hold = _shared ??= new SharedReadBuffer(_bytes, _released);
        hold.Hold();
        return true;
    }

    /// <summary>Lines handed out so far (one-based number of the last line read), counting replayed lines once.</summary>
    public int LinesRead { get; private set; }

    /// <summary>
    /// The first line that is neither blank nor a <c>#</c> comment, without consuming anything: every line read to find it
    /// is replayed by later <see cref="ReadLine"/> calls. Null when the input has no such line.
    /// </summary>
    /// <returns>The line, trimmed, or null.</returns>
    public string? PeekFirstDataLine()
    {
        foreach (var l in _replay)
        {
            var t = l.Trim().TrimStart('\uFEFF');
            if (t.Length > 0 && t[0] != '#') return t;
        }
        while (ReadPhysicalLine() is { } line)
        {
            _replay.Enqueue(line);
            var t = line.Trim().TrimStart('\uFEFF');
            if (t.Length > 0 && t[0] != '#') return t;
        }
        return null;
    }

    /// <summary>The rest of the input as a character stream (lines joined by <c>\n</c>), for readers that need one (XML);
    /// lines keep their length limit.</summary>
    /// <returns>A reader over the remaining lines.</returns>
    public TextReader AsCharacterStream() => new LineText(ReadLine);

    /// <inheritdoc/>
    public override string? ReadLine()
    {
        var line = _replay.Count > 0 ? _replay.Dequeue() : ReadPhysicalLine();
        if (line is not null) LinesRead++;
        return line;
    }

    /// <inheritdoc/>
    public override int Peek() => throw new NotSupportedException("LineReader is read line by line.");

    /// <inheritdoc/>
    public override int Read() => throw new NotSupportedException("LineReader is read line by line.");

    private string? ReadPhysicalLine()
    {
        if (_utf8 is not null) return ReadPhysicalUtf8(out var bytes) ? Encoding.UTF8.GetString(bytes) : null;
        _line.Clear();
        while (true)
        {
            if (_pos == _len)
            {
                if (_eof) return _line.Length > 0 ? _line.ToString() : null;
                _len = _inner!.Read(_buffer, 0, _buffer.Length);
                _pos = 0;
                if (_len == 0) { _eof = true; continue; }
            }
            int start = _pos;
            int found = _buffer.AsSpan(_pos, _len - _pos).IndexOf('\n'); // vectorised search
            _pos = found < 0 ? _len : _pos + found;
            if (found >= 0 && _line.Length == 0 && found <= MaxLineChars)
            {
                // The whole line lies in the buffer: one copy into its string.
                _pos++; // the '\n'
                int length = found > 0 && _buffer[start + found - 1] == '\r' ? found - 1 : found;
                return new string(_buffer, start, length);
            }
            _line.Append(_buffer, start, _pos - start);
            if (_line.Length > MaxLineChars)
                throw new LineTooLongException(LinesRead + _replay.Count + 1);
            if (_pos < _len)
            {
                _pos++; // the '\n'
                if (_line.Length > 0 && _line[^1] == '\r') _line.Length--;
                return _line.ToString();
            }
        }
    }

    /// <summary>The UTF-8 twin of the character loop above: the same line ends, length limit and end-of-input rule.</summary>
    private bool ReadPhysicalUtf8(out ReadOnlySpan<byte> line)
    {
        _lineBytesLength = 0;
        while (true)
        {
            if (_pos == _len)
            {
                if (_eof)
                {
                    line = _lineBytes.AsSpan(0, _lineBytesLength);
                    return _lineBytesLength > 0;
                }
                if (_keepBuffers) NextReadBuffer();
                _len = _utf8!.Read(_bytes, 0, _bytes.Length);
                _pos = 0;
                if (_len == 0) { _eof = true; continue; }
            }
            int start = _pos;
            int found = _bytes.AsSpan(_pos, _len - _pos).IndexOf((byte)'\n');
            _pos = found < 0 ? _len : _pos + found;
            if (found >= 0 && _lineBytesLength == 0 && found <= MaxLineChars)
            {
                // The whole line lies in the buffer: handed out in place.
                _pos++;
                int length = found > 0 && _bytes[start + found - 1] == '\r' ? found - 1 : found;
                line = _bytes.AsSpan(start, length);
                return true;
            }
            int piece = _pos - start;
            GrowLineBytes(_lineBytesLength + piece);
            _bytes.AsSpan(start, piece).CopyTo(_lineBytes.AsSpan(_lineBytesLength));
            _lineBytesLength += piece;
            if (_lineBytesLength > MaxLineChars)
                throw new LineTooLongException(LinesRead + _replay.Count + 1);
            if (_pos < _len)
            {
                _pos++;
                if (_lineBytesLength > 0 && _lineBytes[_lineBytesLength - 1] == '\r') _lineBytesLength--;
                line = _lineBytes.AsSpan(0, _lineBytesLength);
                return true;
            }
        }
    }

    /// <summary>Moves on from the read buffer, which may hold kept lines: the next one is a released buffer, or a new one
    /// (not zeroed; the read fills what is used).</summary>
    private void NextReadBuffer()
    {
        if (_shared is null) _released.Add(_bytes); // no line of it was kept
        else _shared.Release(); // the reader's own hold: back once every kept line of it is released
        _shared = null;
        _bytes = _released.TryTake(out var again) ? again : GC.AllocateUninitializedArray<byte>(_bytes.Length);
    }

    private void GrowLineBytes(int needed)
    {
        if (_lineBytes.Length >= needed) return;
        Array.Resize(ref _lineBytes, Math.Max(needed, Math.Max(1024, 2 * _lineBytes.Length)));
    }

    /// <inheritdoc/>
    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _inner?.Dispose();
            _utf8?.Dispose();
        }
        base.Dispose(disposing);
    }

    /// <summary>Bytes already read, then the rest of a stream: hands a sniffed start back to a <see cref="StreamReader"/>.</summary>
    private sealed class PrefixedStream(byte[] prefix, Stream rest) : ForwardOnlyStream
    {
        private int _at;

        public override int Read(Span<byte> buffer)
        {
            if (_at == prefix.Length) return rest.Read(buffer);
            int n = Math.Min(buffer.Length, prefix.Length - _at);
            prefix.AsSpan(_at, n).CopyTo(buffer);
            _at += n;
            return n;
        }

        protected override void Dispose(bool disposing)
        {
            if (disposing) rest.Dispose();
            base.Dispose(disposing);
        }
    }
}

/// <summary>
/// A read buffer of a <see cref="LineReader"/> whose lines were handed out to keep
/// (<see cref="LineReader.TryReadLineUtf8Stable"/>): it goes back to the reader, to be read into again, once the reader has
/// moved past it and every line taken from it has been released. Thread-safe: lines are released on any thread.
/// </summary>
internal sealed class SharedReadBuffer
{
    private readonly byte[] _bytes;
    private readonly ConcurrentBag<byte[]> _released;
    private int _holds = 1; // the reader's own, while it reads from this buffer

    internal SharedReadBuffer(byte[] bytes, ConcurrentBag<byte[]> released)
    {
        _bytes = bytes;
        _released = released;
    }

    /// <summary>One more line of it kept (called by the reader, before it moves on).</summary>
    internal void Hold() => Interlocked.Increment(ref _holds);

    /// <summary>A kept line of it is no longer used: call once per line, and not before its bytes are no longer read.</summary>
    /// <exception cref="InvalidOperationException">More releases than holds (a line released twice).</exception>
    public void Release()
    {
        int left = Interlocked.Decrement(ref _holds);
        if (left == 0) _released.Add(_bytes);
        else if (left < 0) throw new InvalidOperationException("a read buffer was released more often than its lines were kept");
    }
}
