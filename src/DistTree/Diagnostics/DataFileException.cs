namespace DistTree.Diagnostics;

/// <summary>
/// A bad line in a data file the project brings (a conductor catalogue, a grounding table): where it is (line and column,
/// counted from 1, the column in characters) and what is wrong, so the loader can report it as
/// <c>FILE:LINE:COL: error: message</c>.
/// </summary>
public sealed class DataFileException : FormatException
{
    /// <summary>An error at <paramref name="line"/> and <paramref name="column"/> of <paramref name="sourceName"/>, saying <paramref name="reason"/>; the message is <paramref name="message"/>.</summary>
    public DataFileException(string sourceName, int line, int column, string reason, string message)
        : base(message)
    {
        SourceName = sourceName;
        Line = line;
        Column = column;
        Reason = reason;
    }

    /// <summary>An error as <see cref="DataFileException(string, int, int, string, string)"/>, its message <c>FILE:LINE:COL: reason</c>.</summary>
    public DataFileException(string sourceName, int line, int column, string reason)
        : this(sourceName, line, column, reason, $"{sourceName}:{line}:{column}: {reason}")
    {
    }

    /// <summary>The file's name as diagnostics give it.</summary>
    public string SourceName { get; }

    /// <summary>The line, from 1.</summary>
    public int Line { get; }

    /// <summary>The column, from 1, in characters (a tab counts one).</summary>
    public int Column { get; }

    /// <summary>What is wrong, without the place.</summary>
    public string Reason { get; }
}
