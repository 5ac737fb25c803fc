using DistTree.Diagnostics;

namespace DistTree.Cli;

/// <summary>
/// The one line a user sees for an exception that is not a user error (a defect of the program, not of the
/// input): what it was, where it was thrown, and where to report it. No stack trace.
/// </summary>
internal static class InternalError
{
    /// <summary>Where a user is asked to report an internal error; no host is named, the project has its own tracker.</summary>
    public const string ReportTo = "please report it, with the project file and this line, to the DistTree maintainers' issue tracker";

    /// <summary>
    /// <c>internal error: TYPE in METHOD: MESSAGE; please report it …</c> on one line: the message's line breaks
    /// become spaces, any other control character is escaped (<see cref="DisplayText"/>), and an aggregate of one
    /// exception (from work spread over the cores) is told as that one.
    /// </summary>
    public static string Line(Exception exception)
    {
        var e = exception;
        while (e is AggregateException { InnerExceptions: [var single] })
        {
            e = single;
        }

        var where = e.TargetSite is { } method ? $" in {method.DeclaringType?.FullName ?? "?"}.{method.Name}" : "";
        var message = string.Join(' ', e.Message.Split(['\r', '\n'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));
        return DisplayText.Escape($"internal error: {e.GetType().FullName}{where}: {message}; {ReportTo}");
    }
}
