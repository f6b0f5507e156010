using System.Text;

namespace Lumen.Formats;

/// <summary>
/// Reads an input once, line by line, with bounded memory: the first lines can be looked at (to detect the layout) and
/// are then replayed to the reader proper, so pipes, FIFOs and process substitution work; a line longer than
/// <see cref="MaxLineChars"/> stops the read with <see cref="LineTooLongException"/> instead of filling memory.
/// </summary>
public sealed class LineReader : TextReader
{
    /// <summary>Longest line accepted, in characters (4 Mi: about 400 000 cells; far beyond any instrument's row).</summary>
    public const int MaxLineChars = 4 * 1024 * 1024;

    private readonly TextReader _inner;
    private readonly Queue<string> _replay = new();
    private readonly char[] _buffer = new char[1 << 16];
    private readonly StringBuilder _line = new();
    private int _pos, _len;
    private bool _eof;

    /// <summary>Wraps a reader.</summary>
    /// <param name="inner">The input; read once, never rewound.</param>
    public LineReader(TextReader inner)
    {
        ArgumentNullException.ThrowIfNull(inner);
        _inner = inner;
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
        _line.Clear();
        while (true)
        {
            if (_pos == _len)
            {
                if (_eof) return _line.Length > 0 ? _line.ToString() : null;
                _len = _inner.Read(_buffer, 0, _buffer.Length);
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

    /// <inheritdoc/>
    protected override void Dispose(bool disposing)
    {
        if (disposing) _inner.Dispose();
        base.Dispose(disposing);
    }
}
