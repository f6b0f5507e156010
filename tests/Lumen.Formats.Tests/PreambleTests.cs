using Lumen.Analysis;
using Lumen.Formats;

namespace Lumen.Formats.Tests;

/// <summary>Metadata carried from a file into its records: the <c># key: value</c> preamble and row-layout columns (issue 13).</summary>
public class PreambleTests
{
    [Theory]
    [InlineData("# lot: A17", "lot", "A17")]
    [InlineData("#station:EOL-2", "station", "EOL-2")]
    [InlineData("## Test date: 2026-11-30 08:15", "Test date", "2026-11-30 08:15")]
    public void Key_value_comments_are_entries(string line, string key, string value)
    {
        Assert.True(Preamble.TryParse(line, out var k, out var v));
        Assert.Equal(key, k);
        Assert.Equal(value, v);
    }

    [Theory]
    [InlineData("# unit: W/m2/nm")] // a directive, not metadata
    [InlineData("# plain remark without a colon")]
    [InlineData("# 12:30 measured after warm-up")] // a key starts with a letter
    [InlineData("# warm-up (30 min), then: measured")] // '(' and ',' are not key characters
    public void Other_comments_are_not_entries(string line)
    {
        Assert.False(Preamble.TryParse(line, out _, out _));
    }

    [Fact]
    public void Row_layout_records_carry_the_preamble_and_their_metadata_cells()
    {
        var wl = string.Join(',', Enumerable.Range(0, 81).Select(i => 380 + 5 * i));
        var row = string.Join(',', Enumerable.Repeat("1", 81));
        var text = $"# station: EOL-2\n# lot: from-preamble\n# unit: relative\nunit_id,lot,,shift,{wl}\nU1,A,x,day,{row}\nU2,B,y,night,{row}\n";
        var records = RowSpectrumReader.Read(new StringReader(text), "t.csv", "t").ToList();
        Assert.Equal(2, records.Count);
        Assert.Equal(["station", "lot", "column3", "shift"], records[0].Metadata.Select(kv => kv.Key));
        Assert.Equal("A", records[0].MetadataValue("lot")); // the column overrides the preamble's key
        Assert.Equal("B", records[1].MetadataValue("lot"));
        Assert.Equal("EOL-2", records[1].MetadataValue("station"));
        Assert.Equal("night", records[1].MetadataValue("shift"));
        Assert.Equal("U2", records[1].Name);
    }

    [Fact]
    public void Each_row_merges_its_metadata_as_the_merge_rule_does()
    {
        // The merged key layout is worked out once per file (issue 16); each row must still equal Merge applied to the
        // preamble and its own cells: a repeated column name keeps the later cell, in the first one's place.
        var wl = string.Join(',', Enumerable.Range(0, 81).Select(i => 380 + 5 * i));
        var row = string.Join(',', Enumerable.Repeat("1", 81));
        var text = $"# shift: preamble\n# station: EOL-2\nunit_id,shift,lot,shift,{wl}\nU1,early,A,late,{row}\nU2,e2,B,l2,{row}\n";
        foreach (var utf8 in new[] { false, true })
        {
            using TextReader reader = utf8 ? LineReader.Open(new MemoryStream(System.Text.Encoding.UTF8.GetBytes(text))) : new StringReader(text);
            var records = RowSpectrumReader.ReadDeferred(reader, "t.csv", "t").Select(p => p()).ToList();
            foreach (var (r, cells) in records.Zip(new[] { new[] { "early", "A", "late" }, ["e2", "B", "l2"] }))
            {
                var expected = Preamble.Merge([new("shift", "preamble"), new("station", "EOL-2"), new("shift", cells[0]), new("lot", cells[1]), new("shift", cells[2])]);
                Assert.Equal(expected, r.Metadata);
            }
            Assert.Equal(["shift", "station", "lot"], records[0].Metadata.Select(kv => kv.Key));
            Assert.Equal("late", records[0].MetadataValue("shift"));
        }
    }

    [Fact]
    public void Column_layout_records_carry_the_preamble()
    {
        var text = "# project: atrium\nnm,a,b\n" + string.Join('\n', Enumerable.Range(0, 81).Select(i => $"{380 + 5 * i},1,2")) + "\n";
        var records = DelimitedSpectrumReader.Read(new StringReader(text), "t.csv", "t");
        Assert.All(records, r => Assert.Equal("atrium", r.MetadataValue("project")));
    }

    [Fact]
    public void Metadata_keys_are_found_from_the_header_without_reading_the_data()
    {
        var path = Path.Combine(Path.GetTempPath(), $"lumen-meta-{Guid.NewGuid():N}.csv");
        try
        {
            var wl = string.Join(',', Enumerable.Range(0, 81).Select(i => 380 + 5 * i));
            File.WriteAllText(path, $"# station: EOL-2\nunit_id,lot,{wl}\nU1,A,{string.Join(',', Enumerable.Repeat("1", 81))}\n");
            Assert.Equal(["station", "lot"], SpectrumFiles.MetadataKeys(path));
            Assert.Equal(["station"], SpectrumFiles.MetadataKeys(path, Lumen.Formats.TableLayout.Columns));
        }
        finally { File.Delete(path); }
    }
}
