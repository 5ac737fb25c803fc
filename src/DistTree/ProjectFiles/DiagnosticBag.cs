using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>Collects every error and warning found while loading, to be reported together in file order.</summary>
internal sealed class DiagnosticBag
{
    private readonly List<Diagnostic> _items = [];

    /// <summary>True once any error has been added.</summary>
    public bool HasErrors { get; private set; }

    /// <summary>Adds an error.</summary>
    public void Error(SourceLocation location, string message)
    {
        _items.Add(new Diagnostic(location, Severity.Error, message));
        HasErrors = true;
    }

    /// <summary>Adds a warning.</summary>
    public void Warning(SourceLocation location, string message) =>
        _items.Add(new Diagnostic(location, Severity.Warning, message));

    /// <summary>Every diagnostic, sorted by line and column (stable: same place keeps the order found).</summary>
    public IReadOnlyList<Diagnostic> Sorted() =>
        _items.OrderBy(d => d.Location.Line).ThenBy(d => d.Location.Column).ToArray();

    /// <summary>The warnings alone, in file order.</summary>
    public IReadOnlyList<Diagnostic> Warnings() => Sorted().Where(d => d.Severity == Severity.Warning).ToArray();
}
