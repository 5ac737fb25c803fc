namespace DistTree.Cli;

/// <summary>Where a command writes: standard output and standard error, replaceable in tests.</summary>
/// <param name="Out">Standard output.</param>
/// <param name="Error">Standard error.</param>
public sealed record CliContext(TextWriter Out, TextWriter Error)
{
    /// <summary>
    /// True when standard error is a terminal that a person watches: long work then shows a status line there.
    /// False (the default) for logs, pipes and tests, which stay free of it.
    /// </summary>
    public bool ShowProgress { get; init; }

    /// <summary>A status line for long work: shown only when <see cref="ShowProgress"/> is true.</summary>
    public StatusLine Status() => new(ShowProgress ? Error : null);
}
