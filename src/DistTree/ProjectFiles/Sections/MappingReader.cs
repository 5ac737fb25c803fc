using System.Runtime.CompilerServices;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// One mapping of the project file checked against the keys it may hold: unknown keys (with a
/// "did you mean" hint) and duplicate keys are reported when it is made; missing keys when asked for.
/// A value, not an object: three are made for every circuit, and none outlives the reading of its mapping.
/// </summary>
internal readonly struct MappingReader
{
    /// <summary>The most keys a mapping may be allowed (ProjectKeys.Run and ProjectKeys.Rules have 17 each).</summary>
    private const int MaxAllowed = 24;

    private readonly string[] _allowed;
    private readonly DiagnosticBag _bag;
    private readonly Subject _context;
    private readonly List<string>? _suggested;

    // For each allowed key (by its index in _allowed), 1 + the index in the mapping's entries of the entry
    // that gives it; 0 when not given. Held in the object itself: one allocation per mapping read.
    private readonly EntryIndexes _given;

    public MappingReader(SourceMapping mapping, Subject context, string[] allowed, DiagnosticBag bag)
    {
        if (allowed.Length > MaxAllowed)
        {
            throw new ArgumentException($"A mapping may be allowed at most {MaxAllowed} keys.", nameof(allowed));
        }

        Node = mapping;
        _context = context;
        _bag = bag;
        _allowed = allowed;
        var entries = mapping.Entries;
        for (var i = 0; i < entries.Count; i++)
        {
            var key = entries[i].Key;
            if (key.IsInvalid)
            {
                continue;
            }

            var index = IndexOf(key.Value);
            if (index < 0)
            {
                bag.Error(key.Location, ProjectMessages.UnknownKey(key.Value, context, Suggestions.Hint(key.Value, allowed)));
                if (Suggestions.Closest(key.Value, allowed) is { } suggested)
                {
                    (_suggested ??= []).Add(suggested);
                }
            }
            else if (_given[index] > 0)
            {
                bag.Error(key.Location, ProjectMessages.DuplicateKey(key.Value, context, entries[_given[index] - 1].Key.Line));
            }
            else
            {
                _given[index] = i + 1;
            }
        }
    }

    /// <summary>The mapping read.</summary>
    public SourceMapping Node { get; }

    /// <summary>How the mapping is named in messages ("circuit 'LP1/3'").</summary>
    public string Context => _context.ToString();

    /// <summary>True when the key is given (even with no value).</summary>
    public bool Has(string key) => Find(key) >= 0;

    /// <summary>The key's own position, or the mapping's when absent.</summary>
    public SourceLocation KeyLocation(string key) =>
        Find(key) is var index and >= 0 ? Node.Entries[index].Key.Location : Node.Location;

    /// <summary>The value of an optional key; null when absent or written with no value.</summary>
    public SourceNode? Optional(string key)
    {
        var index = Find(key);
        if (index < 0)
        {
            return null;
        }

        var value = Node.Entries[index].Value;
        return value is SourceScalar { IsNull: true } || value.IsInvalid ? null : value;
    }

    /// <summary>The value of a required key; reports it missing (at the mapping) or empty (at the key).</summary>
    public SourceNode? Required(string key, string hint = "")
    {
        var index = Find(key);
        if (index < 0)
        {
            // A misspelt key already reported with "did you mean '{key}'?" is not also reported missing.
            if (_suggested is null || !_suggested.Contains(key, StringComparer.Ordinal))
            {
                _bag.Error(Node.Location, ProjectMessages.MissingKey(key, _context, hint));
            }

            return null;
        }

        var entry = Node.Entries[index];
        if (entry.Value.IsInvalid)
        {
            return null;
        }

        if (entry.Value is SourceScalar { IsNull: true })
        {
            _bag.Error(entry.Key.Location, ProjectMessages.NoValue(key, _context, hint));
            return null;
        }

        return entry.Value;
    }

    /// <summary>The index of <paramref name="key"/> in the allowed keys, or -1.</summary>
    private int IndexOf(string key)
    {
        for (var i = 0; i < _allowed.Length; i++)
        {
            if (string.Equals(_allowed[i], key, StringComparison.Ordinal))
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>The index in the mapping's entries of the entry that gives <paramref name="key"/>, or -1.</summary>
    private int Find(string key) => IndexOf(key) is var index and >= 0 ? _given[index] - 1 : -1;

    [InlineArray(MaxAllowed)]
    private struct EntryIndexes
    {
        private int _element;
    }
}
