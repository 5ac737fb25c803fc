using DistTree.Cli;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Cli;

/// <summary>The option checks the commands share.</summary>
public sealed class OptionChecksTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(250)]
    [InlineData(1000)]
    public void Listed_OneToTheMost_IsTheValue(int value)
    {
        Assert.Equal(value, OptionChecks.Listed(value, "--rows"));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-3)]
    [InlineData(1001)]
    [InlineData(int.MaxValue)]
    public void Listed_OutOfRange_IsAUsageErrorNamingTheOption(int value)
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.Listed(value, "--worst"));

        Assert.Equal("--worst takes a whole number from 1 to 1,000", e.Message);
    }

    [Theory]
    [InlineData(-60)]
    [InlineData(37.5)]
    [InlineData(90)]
    public void InRange_Inside_IsTheValue(double value)
    {
        Assert.Equal(value, OptionChecks.InRange(value, ValueRanges.AmbientC, "--ambient"));
    }

    [Theory]
    [InlineData(-300, "-300")]
    [InlineData(90.5, "90.5")]
    public void InRange_Outside_IsAUsageErrorNamingTheRange(double value, string shown)
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.InRange(value, ValueRanges.AmbientC, "--ambient"));

        Assert.Equal($"--ambient must be between -60 and 90 °C; found {shown}", e.Message);
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

    // A NUL character cannot be in a file name (POSIX); the path is refused before any work, not met as an internal error.
    [Fact]
    public void Outputs_PathWithNul_IsAUsageError()
    {
        var e = Assert.Throws<UsageException>(() => OptionChecks.Outputs(("--html", "out\0.html")));

        Assert.Equal("--html was given a path with a NUL character, which no file name can hold", e.Message);
    }
}
