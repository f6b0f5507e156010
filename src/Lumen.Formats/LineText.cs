namespace Lumen.Formats;

/// <summary>
/// A character stream made of lines (each followed by <c>\n</c>), for readers that need characters (XML) from a
/// line-based source; an optional inspector sees each line with its one-based number first and may refuse it by
/// throwing.
/// </summary>
/// <param name="nextLine">The source of lines (null at the end).</param>
/// <param name="inspect">Called with each line and its number before it is handed out; may be null.</param>
internal sealed class LineText(Func<string?> nextLine, Action<string, int>? inspect = null) : TextReader
{
    private string? _line = "";
    private int _at, _number;

    private bool Fill()
    {
        while (_line is not null && _at >= _line.Length)
        {
            var next = nextLine();
            if (next is null) { _line = null; return false; }
            _number++;
            inspect?.Invoke(next, _number);
            _line = next + "\n";
            _at = 0;
        }
        return _line is not null;
    }

    public override int Peek() => Fill() ? _line![_at] : -1;

    public override int Read() => Fill() ? _line![_at++] : -1;

    public override int Read(char[] buffer, int index, int count)
    {
        ArgumentNullException.ThrowIfNull(buffer);
        if (!Fill()) return 0;
        int n = Math.Min(count, _line!.Length - _at);
        _line.CopyTo(_at, buffer, index, n);
        _at += n;
        return n;
    }
}
