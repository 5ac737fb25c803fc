using DistTree.Diagnostics;

namespace DistTree.Tests.Diagnostics;

/// <summary>Diagnostic and SourceLocation as a person reads them: <c>FILE:LINE:COL: error: message</c>, on one line that acts on no terminal.</summary>
public sealed class DiagnosticTests
{
    [Fact]
    public void ToString_PathAndMessageWithControlCharacters_ShownEscaped()
    {
        var d = new Diagnostic(new SourceLocation("a\u001B[2J.yaml", 3, 7), Severity.Error, "unknown key 'x\ny\u202E'");

        Assert.Equal("a\\u001B[2J.yaml:3:7: error: unknown key 'x\\u000Ay\\u202E'", d.ToString());
        Assert.Equal("unknown key 'x\\u000Ay\\u202E'", d.Message);
        Assert.Equal("a\\u001B[2J.yaml:3:7", d.Location.ToString());
        Assert.Equal("a\u001B[2J.yaml", d.Location.File); // the path itself is kept: it opens the file
    }

    [Fact]
    public void With_NewMessage_ShownEscapedToo()
    {
        var d = new Diagnostic(new SourceLocation("p.yaml", 1, 1), Severity.Error, "plain") with { Message = "x\u0007" };

        Assert.Equal("x\\u0007", d.Message);
    }

    [Fact]
    public void ToString_PlainText_Unchanged()
    {
        Assert.Equal(
            "p.yaml:1:2: warning: the demand factor of 'LP1' is 1.2, above 1",
            new Diagnostic(new SourceLocation("p.yaml", 1, 2), Severity.Warning, "the demand factor of 'LP1' is 1.2, above 1").ToString());
    }
}
