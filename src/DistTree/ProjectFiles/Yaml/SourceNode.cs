using DistTree.Diagnostics;

namespace DistTree.ProjectFiles.Yaml;

/// <summary>
/// A node of the YAML document as read, with the place it starts. The loader keeps its own small tree
/// (rather than YamlDotNet's representation model) so that duplicate keys, aliases and tags can be
/// reported with every other error instead of stopping the read at the first one.
/// </summary>
internal abstract class SourceNode
{
    // The place is kept as its parts, not as a SourceLocation object: a file has millions of nodes,
    // and few of their locations are ever needed.
    private readonly string _file;

    protected SourceNode(SourceLocation location)
        : this(location.File, location.Line, location.Column)
    {
    }

    protected SourceNode(string file, int line, int column)
    {
        _file = file;
        Line = line;
        Column = column;
    }

    /// <summary>Where the node starts (a new object on each call, equal to the others).</summary>
    public SourceLocation Location => new(_file, Line, Column);

    /// <summary>The 1-based line where the node starts.</summary>
    public int Line { get; }

    /// <summary>The 1-based column where the node starts.</summary>
    public int Column { get; }

    /// <summary>True for a placeholder standing in for a node already reported as wrong (an alias, a bad key).</summary>
    public bool IsInvalid { get; init; }

    /// <summary>How the node reads in a message: "a mapping", "the text 'x'", "nothing".</summary>
    public abstract string Describe();
}

/// <summary>A scalar: its text and whether it was written plain (unquoted, so a number or a boolean may be meant).</summary>
internal sealed class SourceScalar : SourceNode
{
    public SourceScalar(SourceLocation location, string value, bool isPlain)
        : base(location)
    {
        Value = value;
        IsPlain = isPlain;
    }

    public SourceScalar(string file, int line, int column, string value, bool isPlain)
        : base(file, line, column)
    {
        Value = value;
        IsPlain = isPlain;
    }

    /// <summary>The scalar's text.</summary>
    public string Value { get; }

    /// <summary>True when written without quotes and without an explicit string tag.</summary>
    public bool IsPlain { get; }

    /// <summary>True for a plain empty, <c>~</c> or <c>null</c> scalar (YAML 1.2 core schema).</summary>
    public bool IsNull => IsPlain && Value is "" or "~" or "null" or "Null" or "NULL";

    public override string Describe()
    {
        if (IsNull)
        {
            return "nothing";
        }

        return IsPlain ? $"'{Echo()}'" : $"the quoted text '{Echo()}'";
    }

    /// <summary>
    /// How many characters of <see cref="Value"/> stand on the scalar's first line in the file, when it spans several
    /// (a folded value joins its lines with spaces); null when it stands on one line.
    /// </summary>
    public int? FirstLineLength { get; init; }

    /// <summary>
    /// The value as a message shows it: its first line in the file only, and at most
    /// <see cref="ProjectLimits.MaxEchoedLength"/> characters of it, "..." marking a cut; so no message prints
    /// more of a file (an unintended one, say) than the line it is about; its control characters escaped
    /// (<see cref="DisplayText"/>), so that it shows what the file holds and acts on no terminal.
    /// </summary>
    public string Echo()
    {
        var shown = Value.AsSpan();
        if (FirstLineLength is { } first && first < shown.Length)
        {
            shown = shown[..Math.Max(first, 0)];
        }

        if (shown.IndexOfAny('\n', '\r') is var end and >= 0)
        {
            shown = shown[..end];
        }

        if (shown.Length > ProjectLimits.MaxEchoedLength)
        {
            shown = shown[..ProjectLimits.MaxEchoedLength];
            if (char.IsHighSurrogate(shown[^1]))
            {
                shown = shown[..^1];
            }
        }

        return DisplayText.Escape(shown.Length == Value.Length ? Value : string.Concat(shown.TrimEnd(' '), "..."));
    }
}

/// <summary>A mapping: its entries in file order, duplicates kept (the reader reports them).</summary>
internal sealed class SourceMapping : SourceNode
{
    public SourceMapping(SourceLocation location)
        : base(location)
    {
    }

    public SourceMapping(string file, int line, int column)
        : base(file, line, column)
    {
    }

    /// <summary>Key and value pairs in file order.</summary>
    public List<KeyValuePair<SourceScalar, SourceNode>> Entries { get; } = [];

    public override string Describe() => "a mapping";
}

/// <summary>A sequence: its items in file order.</summary>
internal sealed class SourceSequence : SourceNode
{
    public SourceSequence(SourceLocation location)
        : base(location)
    {
    }

    public SourceSequence(string file, int line, int column)
        : base(file, line, column)
    {
    }

    /// <summary>The items in file order.</summary>
    public List<SourceNode> Items { get; } = [];

    public override string Describe() => "a sequence";
}
