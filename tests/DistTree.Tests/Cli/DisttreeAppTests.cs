using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>The top-level catch: user errors exit 2, anything else is one <c>internal error:</c> line and exit 3, or is thrown on for tests.</summary>
public sealed class DisttreeAppTests
{
    private static string SmallOffice => Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml");

    [Fact]
    public void Run_UnexpectedException_PrintsOneInternalErrorLineAndExitsThree()
    {
        using var stderr = new StringWriter();

        var exit = DisttreeApp.Run(["validate", SmallOffice], new FailingWriter(), stderr);

        var lines = stderr.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(ExitCodes.InternalError, exit);
        Assert.Equal(3, exit);
        var line = Assert.Single(lines);
        Assert.StartsWith("internal error: System.InvalidOperationException in ", line, StringComparison.Ordinal);
        Assert.Contains(": injected for the test; ", line, StringComparison.Ordinal);
        Assert.EndsWith(InternalError.ReportTo, line.TrimEnd('\r'), StringComparison.Ordinal);
    }

    [Fact]
    public void Run_UnexpectedExceptionWithRethrow_ThrowsIt()
    {
        using var stderr = new StringWriter();

        var e = Assert.Throws<InvalidOperationException>(
            () => DisttreeApp.Run(["validate", SmallOffice], new FailingWriter(), stderr, showProgress: false, rethrowUnexpected: true));

        Assert.Equal("injected for the test", e.Message);
        Assert.Empty(stderr.ToString());
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Run_MissingFile_ExitsTwoWithOrWithoutRethrow(bool rethrow)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();

        var exit = DisttreeApp.Run(["analyze", "no-such-project.yaml"], stdout, stderr, showProgress: false, rethrowUnexpected: rethrow);

        Assert.Equal((ExitCodes.BadInput, "disttree: error: cannot read 'no-such-project.yaml': no such file\n"), (exit, stderr.ToString().ReplaceLineEndings("\n")));
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Run_BadProjectWithOrWithoutRethrow_ExitsTwoWithLocatedErrors(bool rethrow)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();

        var exit = DisttreeApp.Run(["check", Path.Combine(TestPaths.Cases, "bad", "unknown-size.yaml")], stdout, stderr, showProgress: false, rethrowUnexpected: rethrow);

        Assert.Equal(ExitCodes.BadInput, exit);
        Assert.Contains("unknown-size.yaml:", stderr.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", stderr.ToString(), StringComparison.Ordinal);
    }

    // Standard output that fails on the first write: a defect injected where every command reaches.
    private sealed class FailingWriter : StringWriter
    {
        public override void Write(char value) => throw new InvalidOperationException("injected for the test");

        public override void Write(string? value) => throw new InvalidOperationException("injected for the test");

        public override void WriteLine(string? value) => throw new InvalidOperationException("injected for the test");
    }
}
