using System.Text;

namespace Lumen.Formats.Tests;

/// <summary>
/// The UTF-8 line reader (issue 16) against the character one over .NET's <see cref="StreamReader"/>, the reference for
/// decoding: the same lines, whatever the encoding mark, line ends, malformed bytes or where the reads split the input.
/// </summary>
public sealed class LineReaderTests
{
    private static List<string> ByCharacters(byte[] input)
    {
        using var lines = new LineReader(new StreamReader(new MemoryStream(input), Encoding.UTF8, detectEncodingFromByteOrderMarks: true));
        var all = new List<string>();
        while (lines.ReadLine() is { } l) all.Add(l);
        return all;
    }

    private static List<string> ByBytes(Stream input, bool utf8Lines)
    {
        using var lines = LineReader.Open(input);
        var all = new List<string>();
        if (utf8Lines && lines.IsUtf8)
            while (lines.TryReadLineUtf8(out var l)) all.Add(Encoding.UTF8.GetString(l));
        else
            while (lines.ReadLine() is { } l) all.Add(l);
        Assert.Equal(all.Count, lines.LinesRead);
        return all;
    }

    /// <summary>Random text of lines made to hit every edge: long and empty lines, CR LF and lone CR, two-, three- and
    /// four-byte characters, malformed bytes, and no line end at the very end.</summary>
    private static byte[] Text(int seed, int bytes)
    {
        var random = new Random(seed);
        var output = new List<byte>();
        byte[][] pieces =
        [
            "0.125,"u8.ToArray(), "DL-ü"u8.ToArray(), "\u00A0"u8.ToArray(), "€"u8.ToArray(), "😀"u8.ToArray(), [0xE2, 0x82], [0xFF], [0xC3],
            "\r"u8.ToArray(), " \t"u8.ToArray(), "#"u8.ToArray(), "\""u8.ToArray(),
        ];
        while (output.Count < bytes)
        {
            int length = random.Next(40) == 0 ? random.Next(70_000, 140_000) : random.Next(0, 300);
            for (int i = 0; i < length;)
            {
                var p = pieces[random.Next(pieces.Length)];
                output.AddRange(p);
                i += p.Length;
            }
            output.AddRange(random.Next(3) == 0 ? "\r\n"u8.ToArray() : "\n"u8.ToArray());
        }
        output.AddRange("last,line\r"u8.ToArray()); // the end: no line feed, a carriage return kept as the character reader keeps it
        return [.. output];
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Utf8_lines_equal_the_character_reader_on_hostile_text(int seed)
    {
        var input = Text(seed, 600_000);
        var expected = ByCharacters(input);
        Assert.True(expected.Count > 50);
        Assert.Equal(expected, ByBytes(new MemoryStream(input), utf8Lines: false));
        Assert.Equal(expected, ByBytes(new MemoryStream(input), utf8Lines: true));
        Assert.Equal(expected, ByBytes(new Trickle(input, seed), utf8Lines: true)); // reads of 1–9 bytes: every split
    }

    [Theory]
    [InlineData("utf-8 mark")]
    [InlineData("utf-16LE")]
    [InlineData("utf-16BE")]
    [InlineData("utf-32LE")]
    [InlineData("utf-32BE")]
    [InlineData("none")]
    public void Every_encoding_mark_gives_the_same_lines(string encoding)
    {
        const string text = "\u00A0id,lot,380,385\r\nA-ü,x,1.5,2\n\nB,€,3,4\r\n";
        byte[] input = encoding switch
        {
            "utf-8 mark" => [.. Encoding.UTF8.GetPreamble(), .. Encoding.UTF8.GetBytes(text)],
            "utf-16LE" => [.. Encoding.Unicode.GetPreamble(), .. Encoding.Unicode.GetBytes(text)],
            "utf-16BE" => [.. Encoding.BigEndianUnicode.GetPreamble(), .. Encoding.BigEndianUnicode.GetBytes(text)],
            "utf-32LE" => [.. Encoding.UTF32.GetPreamble(), .. Encoding.UTF32.GetBytes(text)],
            "utf-32BE" => [.. new UTF32Encoding(true, true).GetPreamble(), .. new UTF32Encoding(true, true).GetBytes(text)],
            _ => Encoding.UTF8.GetBytes(text),
        };
        string[] expected = ["\u00A0id,lot,380,385", "A-ü,x,1.5,2", "", "B,€,3,4"];
        Assert.Equal(expected, ByCharacters(input));
        Assert.Equal(expected, ByBytes(new MemoryStream(input), utf8Lines: true));
        Assert.Equal(expected, ByBytes(new Trickle(input, 7), utf8Lines: true));
        using var lines = LineReader.Open(new MemoryStream(input));
        Assert.Equal(encoding is "utf-8 mark" or "none", lines.IsUtf8);
    }

    [Theory]
    [InlineData(4)]
    [InlineData(5)]
    public void Kept_lines_stay_intact_while_the_rest_is_read(int seed)
    {
        // A batch hands rows to worker threads unparsed (issue 16): every line kept from the stable read must still hold
        // its bytes after the whole input has gone through the reader's buffers (600 KB: ten refills and more).
        var input = Text(seed, 600_000);
        var expected = ByCharacters(input);
        foreach (Stream stream in new Stream[] { new MemoryStream(input), new Trickle(input, seed) })
        {
            using var lines = LineReader.Open(stream);
            var kept = new List<ReadOnlyMemory<byte>>();
            while (lines.TryReadLineUtf8Stable(out var l, out _)) kept.Add(l); // never released: no buffer is read into again
            Assert.Equal(expected, kept.Select(k => Encoding.UTF8.GetString(k.Span)));
            Assert.Equal(expected.Count, lines.LinesRead);
        }
    }

    [Theory]
    [InlineData(6, 1)]
    [InlineData(7, 40)]
    [InlineData(8, 400)]
    public void Released_lines_give_their_buffers_back_and_held_lines_stay_intact(int seed, int window)
    {
        // A batch releases each row's hold when a worker has parsed it, in any order (issue 16): a buffer may be read into
        // again only when every line taken from it is released. Up to `window` lines are held; when the window is full a
        // random one is checked against the character reader and released. Reading a buffer again too early changes a
        // held line before it is checked.
        var input = Text(seed, 900_000);
        var expected = ByCharacters(input);
        var random = new Random(seed);
        using var lines = LineReader.Open(new MemoryStream(input));
        var held = new List<(int Index, ReadOnlyMemory<byte> Line, SharedReadBuffer? Hold)>();
        var arrays = new HashSet<byte[]>(ReferenceEqualityComparer.Instance);
        int index = 0, released = 0;
        void ReleaseOne(int at)
        {
            var (i, line, hold) = held[at];
            Assert.Equal(expected[i], Encoding.UTF8.GetString(line.Span));
            hold?.Release();
            held.RemoveAt(at);
            released++;
        }
        while (lines.TryReadLineUtf8Stable(out var line, out var hold))
        {
            if (hold is not null && System.Runtime.InteropServices.MemoryMarshal.TryGetArray(line, out var segment)) arrays.Add(segment.Array!);
            held.Add((index++, line, hold));
            if (held.Count > window) ReleaseOne(random.Next(held.Count));
        }
        while (held.Count > 0) ReleaseOne(random.Next(held.Count));
        Assert.Equal(expected.Count, index);
        Assert.Equal(index, released);
        // Released promptly, a few buffers carry all the kept lines; read into a new buffer each time, they took ten (the
        // long lines between them are copies).
        if (window <= 40) Assert.InRange(arrays.Count, 1, 6);
    }

    [Fact]
    public void A_buffer_released_more_often_than_held_is_refused()
    {
        using var lines = LineReader.Open(new MemoryStream("a\n"u8.ToArray()));
        Assert.True(lines.TryReadLineUtf8Stable(out _, out var hold));
        Assert.NotNull(hold);
        hold.Release();
        Assert.False(lines.TryReadLineUtf8Stable(out _, out _)); // the reader moved past the buffer: its own hold released
        Assert.Throws<InvalidOperationException>(hold.Release);
    }

    [Fact]
    public void Peeked_lines_are_replayed_as_bytes()
    {
        using var lines = LineReader.Open(new MemoryStream("# note\n\nid,380\nA,1\n"u8.ToArray()));
        Assert.Equal("id,380", lines.PeekFirstDataLine());
        var seen = new List<string>();
        while (lines.TryReadLineUtf8(out var l)) seen.Add(Encoding.UTF8.GetString(l));
        Assert.Equal(["# note", "", "id,380", "A,1"], seen);
        Assert.Equal(4, lines.LinesRead);
        using var again = LineReader.Open(new MemoryStream("# note\n\nid,380\nA,1\n"u8.ToArray()));
        Assert.Equal("id,380", again.PeekFirstDataLine());
        var kept = new List<ReadOnlyMemory<byte>>();
        while (again.TryReadLineUtf8Stable(out var l, out _)) kept.Add(l);
        Assert.Equal(seen, kept.Select(k => Encoding.UTF8.GetString(k.Span)));
    }

    [Fact]
    public void A_line_over_the_limit_stops_with_its_number()
    {
        var input = new byte[LineReader.MaxLineChars + 10 + 4];
        input.AsSpan().Fill((byte)'7');
        "a\nb\n"u8.CopyTo(input);
        using var lines = LineReader.Open(new MemoryStream(input));
        Assert.True(lines.TryReadLineUtf8(out _));
        Assert.True(lines.TryReadLineUtf8(out _));
        var ex = Assert.Throws<LineTooLongException>(() => lines.TryReadLineUtf8(out _));
        Assert.Equal(3, ex.Line);
    }

    [Fact]
    public void An_empty_stream_has_no_lines()
    {
        Assert.Empty(ByBytes(new MemoryStream([]), utf8Lines: true));
        Assert.Empty(ByBytes(new MemoryStream([0xEF, 0xBB, 0xBF]), utf8Lines: true));
        Assert.Equal([""], ByBytes(new MemoryStream("\n"u8.ToArray()), utf8Lines: true));
    }

    /// <summary>A stream that hands out a few bytes at a time, as a pipe may.</summary>
    private sealed class Trickle(byte[] data, int seed) : ForwardOnlyStream
    {
        private readonly Random _random = new(seed);
        private int _at;

        public override int Read(Span<byte> buffer)
        {
            int n = Math.Min(Math.Min(buffer.Length, _random.Next(1, 10)), data.Length - _at);
            data.AsSpan(_at, n).CopyTo(buffer);
            _at += n;
            return n;
        }
    }
}
