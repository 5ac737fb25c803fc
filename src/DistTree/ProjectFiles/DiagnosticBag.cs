using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>
/// Collects every error and warning found while loading, to be reported together in file order. At most
/// <see cref="ProjectLimits.MaxDiagnostics"/> of each are kept; the rest are counted in one closing diagnostic.
/// </summary>
internal sealed class DiagnosticBag
{
    private readonly List<Diagnostic> _items = [];
    private readonly Dictionary<string, int> _fileOrder = new(StringComparer.Ordinal);
    private int _errors;
    private int _warnings;
    private Diagnostic? _firstDroppedError;
    private Diagnostic? _firstDroppedWarning;

    /// <summary>True once any error has been added.</summary>
    public bool HasErrors => _errors > 0;

    /// <summary>True once the bag holds as many errors as it reports: further checks may stop.</summary>
    public bool IsFull => _errors >= ProjectLimits.MaxDiagnostics;

    /// <summary>Adds an error.</summary>
    public void Error(SourceLocation location, string message)
    {
        var diagnostic = new Diagnostic(location, Severity.Error, message);
        if (_errors++ < ProjectLimits.MaxDiagnostics)
        {
            _items.Add(diagnostic);
        }
        else
        {
            _firstDroppedError ??= diagnostic;
        }
    }

    /// <summary>Adds a warning.</summary>
    public void Warning(SourceLocation location, string message)
    {
        var diagnostic = new Diagnostic(location, Severity.Warning, message);
        if (_warnings++ < ProjectLimits.MaxDiagnostics)
        {
            _items.Add(diagnostic);
        }
        else
        {
            _firstDroppedWarning ??= diagnostic;
        }
    }

    /// <summary>Notes a file read, so that its diagnostics sort after those of the files read before it.</summary>
    public void AddFile(string file) => _fileOrder.TryAdd(file, _fileOrder.Count);

    /// <summary>
    /// Every diagnostic kept, sorted by file (in the order read), line and column (stable: same place keeps the
    /// order found), then one for the errors and one for the warnings not kept, if any.
    /// </summary>
    public IReadOnlyList<Diagnostic> Sorted()
    {
        var sorted = _items.OrderBy(d => _fileOrder.GetValueOrDefault(d.Location.File)).ThenBy(d => d.Location.Line).ThenBy(d => d.Location.Column).ToList();
        if (_firstDroppedError is { } error)
        {
            sorted.Add(error with { Message = ProjectMessages.More(_errors, "errors") });
        }

        if (_firstDroppedWarning is { } warning)
        {
            sorted.Add(warning with { Message = ProjectMessages.More(_warnings, "warnings") });
        }

        return sorted;
    }

    /// <summary>The warnings alone, in file order.</summary>
    public IReadOnlyList<Diagnostic> Warnings() => Sorted().Where(d => d.Severity == Severity.Warning).ToArray();
}
