using Lumen.Analysis;

namespace Lumen.Core.Tests;

/// <summary>How a located problem is written: <c>file:line:column: message</c> (common practice of compilers and
/// linters, which editors follow to the place), shortened where the problem concerns a whole line or file.</summary>
public class ReadDiagnosticTests
{
    [Theory]
    [InlineData(12, 4, "lamp.csv:12:4: 'x' is not a number")]
    [InlineData(12, 0, "lamp.csv:12: 'x' is not a number")]
    [InlineData(0, 0, "lamp.csv: 'x' is not a number")]
    public void A_location_is_written_as_precisely_as_it_is_known(int line, int column, string expected) =>
        Assert.Equal(expected, new ReadDiagnostic("lamp.csv", line, column, "'x' is not a number").ToString());
}
