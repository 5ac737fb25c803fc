using System.Runtime.CompilerServices;
using DistTree.Cli;

namespace DistTree.Tests.Cli;

/// <summary>The one line an internal error prints: what, where it was thrown, where to report it.</summary>
public sealed class InternalErrorTests
{
    [Fact]
    public void Line_ThrownException_NamesTypeMethodMessageAndWhereToReport()
    {
        var e = Assert.Throws<InvalidOperationException>(Fail);

        Assert.Equal(
            $"internal error: System.InvalidOperationException in {typeof(InternalErrorTests).FullName}.{nameof(Fail)}: no such state; {InternalError.ReportTo}",
            InternalError.Line(e));
    }

    [Fact]
    public void Line_MessageOverSeveralLines_IsOneLine()
    {
        var e = new ArgumentOutOfRangeException("kind", "MotorStart", "a finding kind without a rule");

        var line = InternalError.Line(e);

        Assert.DoesNotContain('\n', line);
        Assert.DoesNotContain('\r', line);
        Assert.Equal(
            $"internal error: System.ArgumentOutOfRangeException: a finding kind without a rule (Parameter 'kind') Actual value was MotorStart.; {InternalError.ReportTo}",
            line);
    }

    [Fact]
    public void Line_MessageWithControlCharacters_ShownEscaped()
    {
        var line = InternalError.Line(new InvalidOperationException("no '\u001B[31mP-9\u202E'\tfound"));

        Assert.Equal($"internal error: System.InvalidOperationException: no '\\u001B[31mP-9\\u202E'\\u0009found; {InternalError.ReportTo}", line);
    }

    [Fact]
    public void Line_AggregateOfOne_TellsTheOneInside()
    {
        var line = InternalError.Line(new AggregateException(new AggregateException(new KeyNotFoundException("no 'P-9'"))));

        Assert.StartsWith("internal error: System.Collections.Generic.KeyNotFoundException: no 'P-9'; ", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Line_AggregateOfSeveral_TellsTheAggregate()
    {
        var line = InternalError.Line(new AggregateException(new InvalidOperationException("a"), new InvalidOperationException("b")));

        Assert.StartsWith("internal error: System.AggregateException: ", line, StringComparison.Ordinal);
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void Fail() => throw new InvalidOperationException("no such state");
}
