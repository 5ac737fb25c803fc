namespace DistTree.Diagnostics;

/// <summary>How serious a diagnostic is.</summary>
public enum Severity
{
    /// <summary>Suspicious but legal input; the exit code is unaffected.</summary>
    Warning,

    /// <summary>Input that cannot be used.</summary>
    Error,
}

/// <summary>One message about the input, located in its file.</summary>
/// <param name="Location">Where in the project file the problem is.</param>
/// <param name="Severity">Error or warning.</param>
/// <param name="Message">What is wrong and what was expected.</param>
public sealed record Diagnostic(SourceLocation Location, Severity Severity, string Message)
{
    private readonly string _message = DisplayText.Escape(Message);

    /// <summary>
    /// What is wrong and what was expected, as a person reads it: the values it repeats from the file (ids, keys,
    /// text) with their control characters escaped (<see cref="DisplayText"/>), so a message is one line that acts on
    /// no terminal.
    /// </summary>
    public string Message
    {
        get => _message;
        init => _message = DisplayText.Escape(value);
    }

    /// <summary>The message as <c>FILE:LINE:COL: error: message</c>.</summary>
    public override string ToString() =>
        $"{Location}: {(Severity == Severity.Error ? "error" : "warning")}: {Message}";
}
