using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>Collects every error and warning found while loading, to be reported together in file order.</summary>
internal sealed class DiagnosticBag
{
    private readonly List<Diagnostic> _items = [];
    private readonly Dictionary<string, int> _fileOrder = new(StringComparer.Ordinal);

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

    /// <summary>Notes a file read, so that its diagnostics sort after those of the files read before it.</summary>
    public void AddFile(string file) => _fileOrder.TryAdd(file, _fileOrder.Count);

    /// <summary>
    /// Every diagnostic, sorted by file (in the order read), line and column (stable: same place keeps the
    /// order found).
    /// </summary>
    public IReadOnlyList<Diagnostic> Sorted() =>
        _items.OrderBy(d => _fileOrder.GetValueOrDefault(d.Location.File)).ThenBy(d => d.Location.Line).ThenBy(d => d.Location.Column).ToArray();

    /// <summary>The warnings alone, in file order.</summary>
    public IReadOnlyList<Diagnostic> Warnings() => Sorted().Where(d => d.Severity == Severity.Warning).ToArray();
}
