using System.Text;
using DistTree.Diagnostics;

namespace DistTree.Reports;

/// <summary>
/// The console renderers write through this: each string is escaped (<see cref="DisplayText"/>) before it reaches the
/// writer beneath, so that a name, a path or a message from the input can neither act on a terminal nor break a line.
/// The line breaks are <see cref="TextWriter.WriteLine()"/>'s own; the renderers put none inside a string.
/// </summary>
internal sealed class DisplayWriter : TextWriter
{
    private readonly TextWriter _inner;

    private DisplayWriter(TextWriter inner)
        : base(inner.FormatProvider)
    {
        _inner = inner;
        CoreNewLine = inner.NewLine.ToCharArray();
    }

    /// <inheritdoc />
    public override Encoding Encoding => _inner.Encoding;

    /// <summary><paramref name="writer"/> with every string written to it escaped.</summary>
    public static TextWriter Over(TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        return writer as DisplayWriter ?? new DisplayWriter(writer);
    }

    /// <inheritdoc />
    public override void Write(char value)
    {
        // Half of a pair is passed on: only a whole string shows whether it has its other half.
        if (char.IsSurrogate(value))
        {
            _inner.Write(value);
        }
        else
        {
            _inner.Write(DisplayText.Escape(value.ToString()));
        }
    }

    /// <inheritdoc />
    public override void Write(string? value) => _inner.Write(DisplayText.Escape(value));

    /// <inheritdoc />
    public override void WriteLine(string? value) => _inner.WriteLine(DisplayText.Escape(value));

    /// <inheritdoc />
    public override void WriteLine() => _inner.WriteLine();

    /// <inheritdoc />
    public override void Flush() => _inner.Flush();
}
