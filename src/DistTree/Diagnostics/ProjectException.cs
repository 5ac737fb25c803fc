namespace DistTree.Diagnostics;

/// <summary>
/// Thrown when a project cannot be used: it carries every error found (not only the first),
/// each located in its file. The command prints them and exits with code 2.
/// </summary>
public sealed class ProjectException : Exception
{
    private ProjectException(IReadOnlyList<Diagnostic> diagnostics)
        : base(string.Join(Environment.NewLine, diagnostics))
    {
        Diagnostics = diagnostics;
    }

    /// <summary>Every diagnostic found, errors and warnings, in file order.</summary>
    public IReadOnlyList<Diagnostic> Diagnostics { get; }

    /// <summary>Creates the exception from the diagnostics found; at least one must be an error.</summary>
    public static ProjectException FromDiagnostics(IReadOnlyList<Diagnostic> diagnostics)
    {
        if (!diagnostics.Any(d => d.Severity == Severity.Error))
        {
            throw new ArgumentException("A project exception needs at least one error.", nameof(diagnostics));
        }

        return new ProjectException(diagnostics);
    }

    /// <summary>Creates the exception for one error at one place.</summary>
    public static ProjectException At(SourceLocation location, string message) =>
        new([new Diagnostic(location, Severity.Error, message)]);
}
