using DistTree.Model;

namespace DistTree.Cli;

/// <summary>
/// Writes an output file safely: first checked (<see cref="OutputTarget"/>: never an input file, never anything but a
/// regular file or a new name), then written to a new temporary file beside it and renamed into place, so a reader
/// never sees half a file and only a regular file is ever replaced. The temporary file is removed on every way out:
/// an error, an exception, a termination signal (<see cref="TemporaryFiles"/>).
/// </summary>
internal static class OutputFile
{
    /// <summary>Writes <paramref name="content"/> (UTF-8, no byte-order mark) to <paramref name="path"/>, or to standard output for <c>-</c>.</summary>
    /// <param name="context">Where standard output goes.</param>
    /// <param name="path">The output path, or <c>-</c>.</param>
    /// <param name="content">The text.</param>
    /// <param name="inputs">Files the command read: the output may not be one of them.</param>
    public static void Write(CliContext context, string path, string content, IReadOnlyList<SourceFile> inputs) =>
        Write(context, path, content, replace: true, inputs);

    /// <summary>
    /// Writes <paramref name="content"/> like <see cref="Write(CliContext, string, string, IReadOnlyList{SourceFile})"/>,
    /// but only when nothing is at <paramref name="path"/> yet, unless <paramref name="replace"/>.
    /// </summary>
    /// <exception cref="UsageException">A file is already there and <paramref name="replace"/> is false.</exception>
    public static void Write(CliContext context, string path, string content, bool replace, IReadOnlyList<SourceFile> inputs)
    {
        if (path == "-")
        {
            context.Out.Write(content);
            return;
        }

        WriteFile(path, stream =>
        {
            using var writer = new StreamWriter(stream, new System.Text.UTF8Encoding(false));
            writer.Write(content);
        }, replace, inputs);
    }

    /// <summary>
    /// Writes the UTF-8 bytes that <paramref name="write"/> puts on a stream to <paramref name="path"/> (through a
    /// temporary file, as for text), or to standard output for <c>-</c>; the whole text is never held at once
    /// when writing a file.
    /// </summary>
    /// <param name="context">Where standard output goes.</param>
    /// <param name="path">The output path, or <c>-</c>.</param>
    /// <param name="write">Writes the content as UTF-8 bytes, without a byte-order mark.</param>
    /// <param name="inputs">Files the command read: the output may not be one of them.</param>
    public static void Write(CliContext context, string path, Action<Stream> write, IReadOnlyList<SourceFile> inputs)
    {
        if (path == "-")
        {
            using var buffer = new MemoryStream();
            write(buffer);
            context.Out.Write(System.Text.Encoding.UTF8.GetString(buffer.GetBuffer(), 0, (int)buffer.Length));
            return;
        }

        WriteFile(path, write, replace: true, inputs);
    }

    private static void WriteFile(string path, Action<Stream> write, bool replace, IReadOnlyList<SourceFile> inputs)
    {
        var target = OutputTarget.Check(path, inputs);
        var registry = TemporaryFiles.Process;
        string? temporary = null;
        try
        {
            Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(target))!);
            (temporary, var stream) = registry.Create(target);
            using (stream)
            {
                write(stream);
            }

            // Checked again at the last moment: what stands at the path may have changed while the output was made.
            target = OutputTarget.Check(path, inputs);
            if (!replace && Path.Exists(target))
            {
                throw new UsageException($"'{path}' already exists; DistTree replaces it only when asked");
            }

            registry.Commit(temporary, target, replace);
            temporary = null;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new UsageException($"cannot write '{path}': {e.Message}");
        }
        finally
        {
            if (temporary is not null)
            {
                registry.Discard(temporary);
            }
        }
    }
}
