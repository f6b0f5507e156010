namespace Lumen.Formats;

/// <summary>
/// The <c># key: value</c> lines an instrument or tester writes above its data (<c># lot: A17</c>, <c># station: EOL-2</c>).
/// A comment is a preamble entry when it has a colon and the text before it is a plausible key: 1–40 characters,
/// starting with a letter, made of letters, digits, spaces, <c>_</c>, <c>-</c> and <c>.</c>. The <c>unit</c> directive is
/// not an entry (it sets the unit). Other comments stay comments. Rule of our own, documented in the README (Reading rules).
/// </summary>
public static class Preamble
{
    /// <summary>Longest key accepted.</summary>
    public const int MaxKeyLength = 40;

    /// <summary>Recognises a preamble entry.</summary>
    /// <param name="comment">A trimmed line starting with <c>#</c>.</param>
    /// <param name="key">The key, trimmed.</param>
    /// <param name="value">The value, trimmed (may be empty).</param>
    /// <returns>True for an entry.</returns>
    public static bool TryParse(string comment, out string key, out string value)
    {
        ArgumentNullException.ThrowIfNull(comment);
        key = value = "";
        var body = comment.TrimStart('#').Trim();
        int colon = body.IndexOf(':', StringComparison.Ordinal);
        if (colon <= 0 || colon > MaxKeyLength) return false;
        var k = body[..colon].Trim();
        if (k.Length == 0 || !char.IsLetter(k[0])) return false;
        foreach (char ch in k)
            if (!char.IsLetterOrDigit(ch) && ch is not (' ' or '_' or '-' or '.')) return false;
        if (k.Equals("unit", StringComparison.OrdinalIgnoreCase)) return false;
        key = k;
        value = body[(colon + 1)..].Trim();
        return true;
    }

    /// <summary>Merges preamble entries and column metadata: keys unique, a later entry replacing an earlier one in place.</summary>
    /// <param name="entries">Entries in file order.</param>
    /// <returns>The merged list.</returns>
    public static IReadOnlyList<KeyValuePair<string, string>> Merge(IEnumerable<KeyValuePair<string, string>> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        var list = new List<KeyValuePair<string, string>>();
        foreach (var kv in entries)
        {
            int at = list.FindIndex(x => string.Equals(x.Key, kv.Key, StringComparison.Ordinal));
            if (at >= 0) list[at] = kv; else list.Add(kv);
        }
        return list;
    }
}
