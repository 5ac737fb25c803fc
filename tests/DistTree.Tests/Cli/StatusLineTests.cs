using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>StatusLine: silent without a terminal and during the first second; then one line rewritten in place.</summary>
public sealed class StatusLineTests
{
    [Fact]
    public void Report_NoWriter_DoesNothing()
    {
        using var line = new StatusLine(null);
        line.Report("reading");
        line.Share("solving").Report(0.5);
    }

    [Fact]
    public void Report_WithinTheFirstSecond_WritesNothing()
    {
        using var writer = new StringWriter();
        using (var line = new StatusLine(writer))
        {
            line.Report("reading");
        }

        Assert.Equal("", writer.ToString());
    }

    [Fact]
    public void Context_NotATerminal_StatusIsSilent()
    {
        using var writer = new StringWriter();
        using (var line = new CliContext(TextWriter.Null, writer).Status())
        {
            line.Report("reading");
        }

        Assert.Equal("", writer.ToString());
    }

    // Found by running analyze of 100,000 end points on a terminal: the first report after the first second
    // overflowed the time since the last one was shown, and the command crashed.
    [Fact]
    public void Report_AfterTheFirstSecond_ShowsTheLine()
    {
        using var writer = new StringWriter();
        var now = TimeSpan.FromSeconds(1.5);
        using (var line = new StatusLine(writer, () => now))
        {
            line.Report("solving 105,557 nodes");
            Assert.Equal("\rsolving 105,557 nodes", writer.ToString());
        }
    }

    [Fact]
    public void Report_TwiceWithinATenthOfASecond_ShowsTheFirstOnly_ThenPadsOverTheLongerLine()
    {
        using var writer = new StringWriter();
        var now = TimeSpan.FromSeconds(2);
        using var line = new StatusLine(writer, () => now);
        line.Report("reading the file");
        now += TimeSpan.FromMilliseconds(50);
        line.Report("building");
        Assert.Equal("\rreading the file", writer.ToString());
        now += TimeSpan.FromMilliseconds(100);
        line.Report("building");
        Assert.Equal("\rreading the file\rbuilding        ", writer.ToString());
    }

    [Fact]
    public void Report_TextWithControlCharacters_ShownEscaped_OnlyItsOwnCarriageReturnMoves()
    {
        using var writer = new StringWriter();
        var now = TimeSpan.FromSeconds(2);
        using var line = new StatusLine(writer, () => now);
        line.Report("reading a\rb\u001B[2K\u202E");
        Assert.Equal("\rreading a\\u000Db\\u001B[2K\\u202E", writer.ToString());
    }

    [Fact]
    public void Dispose_AfterALineWasShown_ClearsIt()
    {
        using var writer = new StringWriter();
        var line = new StatusLine(writer, () => TimeSpan.FromSeconds(3));
        line.Share("writing").Report(0.25);
        line.Dispose();
        Assert.Equal("\rwriting 25 %\r            \r", writer.ToString());
    }
}
