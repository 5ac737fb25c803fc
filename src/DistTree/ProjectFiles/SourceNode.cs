using DistTree.Diagnostics;

namespace DistTree.ProjectFiles;

/// <summary>
/// A node of the YAML document as read, with the place it starts. The loader keeps its own small tree
/// (rather than YamlDotNet's representation model) so that duplicate keys, aliases and tags can be
/// reported with every other error instead of stopping the read at the first one.
/// </summary>
internal abstract class SourceNode
{
    protected SourceNode(SourceLocation location) => Location = location;

    /// <summary>Where the node starts.</summary>
    public SourceLocation Location { get; }

    /// <summary>True for a placeholder standing in for a node already reported as wrong (an alias, a bad key).</summary>
    public bool IsInvalid { get; init; }

    /// <summary>How the node reads in a message: "a mapping", "the text 'x'", "nothing".</summary>
    public abstract string Describe();
}

/// <summary>A scalar: its text and whether it was written plain (unquoted, so a number or a boolean may be meant).</summary>
internal sealed class SourceScalar(SourceLocation location, string value, bool isPlain) : SourceNode(location)
{
    /// <summary>The scalar's text.</summary>
    public string Value { get; } = value;

    /// <summary>True when written without quotes and without an explicit string tag.</summary>
    public bool IsPlain { get; } = isPlain;

    /// <summary>True for a plain empty, <c>~</c> or <c>null</c> scalar (YAML 1.2 core schema).</summary>
    public bool IsNull => IsPlain && Value is "" or "~" or "null" or "Null" or "NULL";

    public override string Describe()
    {
        if (IsNull)
        {
            return "nothing";
        }

        return IsPlain ? $"'{Value}'" : $"the quoted text '{Value}'";
    }
}

/// <summary>A mapping: its entries in file order, duplicates kept (the reader reports them).</summary>
internal sealed class SourceMapping(SourceLocation location) : SourceNode(location)
{
    /// <summary>Key and value pairs in file order.</summary>
    public List<KeyValuePair<SourceScalar, SourceNode>> Entries { get; } = [];

    public override string Describe() => "a mapping";
}

/// <summary>A sequence: its items in file order.</summary>
internal sealed class SourceSequence(SourceLocation location) : SourceNode(location)
{
    /// <summary>The items in file order.</summary>
    public List<SourceNode> Items { get; } = [];

    public override string Describe() => "a sequence";
}
