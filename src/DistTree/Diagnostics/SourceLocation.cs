namespace DistTree.Diagnostics;

/// <summary>A place in a project file: path as the user gave it, 1-based line and column.</summary>
/// <param name="File">The file's path as given on the command line or in an include.</param>
/// <param name="Line">1-based line number.</param>
/// <param name="Column">1-based column number.</param>
public sealed record SourceLocation(string File, int Line, int Column)
{
    /// <summary>A location for values that come from no file (defaults, generated data).</summary>
    public static SourceLocation None { get; } = new("", 0, 0);

    /// <summary><c>FILE:LINE:COL</c>, the file's path with its control characters escaped (<see cref="DisplayText"/>).</summary>
    public override string ToString() => $"{DisplayText.Escape(File)}:{Line}:{Column}";
}
