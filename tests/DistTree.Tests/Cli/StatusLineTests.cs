using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>StatusLine: silent without a terminal and during the first second.</summary>
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
}
