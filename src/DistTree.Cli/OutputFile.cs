namespace DistTree.Cli;

/// <summary>
/// Writes an output file safely: to a temporary file beside it, then renamed into place, so a reader never
/// sees half a file; and never over an input file unless the command was asked to.
/// </summary>
internal static class OutputFile
{
    /// <summary>Writes <paramref name="content"/> (UTF-8, no byte-order mark) to <paramref name="path"/>, or to standard output for <c>-</c>.</summary>
    /// <param name="context">Where standard output goes.</param>
    /// <param name="path">The output path, or <c>-</c>.</param>
    /// <param name="content">The text.</param>
    /// <param name="inputs">Files the command read: the output may not be one of them.</param>
    public static void Write(CliContext context, string path, string content, params string[] inputs) =>
        Write(context, path, content, replace: true, inputs);

    /// <summary>
    /// Writes <paramref name="content"/> like <see cref="Write(CliContext, string, string, string[])"/>, but
    /// only when nothing is at <paramref name="path"/> yet, unless <paramref name="replace"/>.
    /// </summary>
    /// <exception cref="UsageException">A file is already there and <paramref name="replace"/> is false.</exception>
    public static void Write(CliContext context, string path, string content, bool replace, params string[] inputs)
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
    public static void Write(CliContext context, string path, Action<Stream> write, params string[] inputs)
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

    private static void WriteFile(string path, Action<Stream> write, bool replace, string[] inputs)
    {

        var full = Path.GetFullPath(path);
        if (inputs.Any(i => string.Equals(Path.GetFullPath(i), full, StringComparison.Ordinal)))
        {
            throw new UsageException($"'{path}' is an input file; DistTree never overwrites its input");
        }

        var directory = Path.GetDirectoryName(full)!;
        var temporary = Path.Combine(directory, $".{Path.GetFileName(full)}.{Environment.ProcessId}.tmp");
        try
        {
            Directory.CreateDirectory(directory);
            using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 16))
            {
                write(stream);
            }

            if (!replace && (File.Exists(full) || Directory.Exists(full)))
            {
                File.Delete(temporary);
                throw new UsageException($"'{path}' already exists; DistTree replaces it only when asked");
            }

            File.Move(temporary, full, overwrite: replace);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            DeleteQuietly(temporary);
            throw new UsageException($"cannot write '{path}': {e.Message}");
        }
    }

    private static void DeleteQuietly(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Nothing was written there, or it cannot be removed: the error already reported is the one that matters.
        }
    }
}
