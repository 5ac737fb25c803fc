using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>The option checks the commands share.</summary>
public sealed class OptionChecksTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(250)]
    public void Positive_OneOrMore_IsTheValue(int value)
    {
        Assert.Equal(value, OptionChecks.Positive(value, "--rows"));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-3)]
    public void Positive_BelowOne_IsAUsageErrorNamingTheOption(int value)
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.Positive(value, "--worst"));

        Assert.Equal("--worst takes a whole number of 1 or more", e.Message);
    }

    [Fact]
    public void OneStandardOutput_OneDash_Passes()
    {
        OptionChecks.OneStandardOutput(("--json", "-"), ("--html", "report.html"), ("--sarif", null));
    }

    [Fact]
    public void OneStandardOutput_TwoDashes_NamesEveryOption()
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.OneStandardOutput(("--json", "-"), ("--markdown", null), ("--html", "-")));

        Assert.Equal("only one of --json, --markdown and --html can write to standard output", e.Message);
    }

    [Fact]
    public void OneStandardOutput_TwoOptions_JoinedWithAnd()
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.OneStandardOutput(("--json", "-"), ("--html", "-")));

        Assert.Equal("only one of --json and --html can write to standard output", e.Message);
    }
}
