using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>
/// One mapping of the project file checked against the keys it may hold: unknown keys (with a
/// "did you mean" hint) and duplicate keys are reported when it is made; missing keys when asked for.
/// </summary>
internal sealed class MappingReader
{
    private readonly Dictionary<string, KeyValuePair<SourceScalar, SourceNode>> _entries = new(StringComparer.Ordinal);
    private readonly DiagnosticBag _bag;
    private readonly HashSet<string> _suggested = new(StringComparer.Ordinal);

    public MappingReader(SourceMapping mapping, string context, IReadOnlyList<string> allowed, DiagnosticBag bag)
    {
        Node = mapping;
        Context = context;
        _bag = bag;
        foreach (var entry in mapping.Entries)
        {
            var key = entry.Key;
            if (key.IsInvalid)
            {
                continue;
            }

            if (!allowed.Contains(key.Value, StringComparer.Ordinal))
            {
                bag.Error(key.Location, $"unknown key '{key.Value}' in {context}{Suggestions.Hint(key.Value, allowed)}");
                if (Suggestions.Closest(key.Value, allowed) is { } suggested)
                {
                    _suggested.Add(suggested);
                }
            }
            else if (_entries.TryGetValue(key.Value, out var first))
            {
                bag.Error(key.Location, $"duplicate key '{key.Value}' in {context} (first given at line {first.Key.Location.Line})");
            }
            else
            {
                _entries.Add(key.Value, entry);
            }
        }
    }

    /// <summary>The mapping read.</summary>
    public SourceMapping Node { get; }

    /// <summary>How the mapping is named in messages ("circuit 'LP1/3'").</summary>
    public string Context { get; }

    /// <summary>True when the key is given (even with no value).</summary>
    public bool Has(string key) => _entries.ContainsKey(key);

    /// <summary>The key's own position, or the mapping's when absent.</summary>
    public SourceLocation KeyLocation(string key) =>
        _entries.TryGetValue(key, out var entry) ? entry.Key.Location : Node.Location;

    /// <summary>The value of an optional key; null when absent or written with no value.</summary>
    public SourceNode? Optional(string key)
    {
        if (!_entries.TryGetValue(key, out var entry))
        {
            return null;
        }

        return entry.Value is SourceScalar { IsNull: true } || entry.Value.IsInvalid ? null : entry.Value;
    }

    /// <summary>The value of a required key; reports it missing (at the mapping) or empty (at the key).</summary>
    public SourceNode? Required(string key, string hint = "")
    {
        if (!_entries.TryGetValue(key, out var entry))
        {
            // A misspelt key already reported with "did you mean '{key}'?" is not also reported missing.
            if (!_suggested.Contains(key))
            {
                _bag.Error(Node.Location, $"missing key '{key}' in {Context}{hint}");
            }

            return null;
        }

        if (entry.Value.IsInvalid)
        {
            return null;
        }

        if (entry.Value is SourceScalar { IsNull: true })
        {
            _bag.Error(entry.Key.Location, $"'{key}' in {Context} has no value{hint}");
            return null;
        }

        return entry.Value;
    }
}
