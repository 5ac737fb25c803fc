using System.Security.Cryptography;
using System.Text;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Sections;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles;

/// <summary>
/// Loads a project file (format 1, docs/project-file.md) into the validated <see cref="Project"/> model.
/// Every error found is reported together, each as <c>FILE:LINE:COL: error: message</c>, through a
/// <see cref="ProjectException"/>. The file is only read, never written.
/// </summary>
public static class ProjectLoader
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    /// <summary>
    /// Reads and validates the project file at <paramref name="path"/>; diagnostics name the path as given.
    /// </summary>
    /// <exception cref="ProjectException">The file is not a valid project; carries every error and warning.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static Project Load(string path)
    {
        var (bytes, size, identity) = ReadBounded(path);
        var main = new MainFile(path, Path.GetFullPath(path), identity, null);
        return size > ProjectLimits.MaxFileBytes ? throw TooLarge(path, size, "bytes") : Decode(bytes, main);
    }

    /// <summary>
    /// Reads and validates the project file at <paramref name="path"/> and the files it includes from
    /// <paramref name="source"/> (a revision in version control, say) rather than from the file system;
    /// diagnostics name each file as the source does.
    /// </summary>
    /// <exception cref="ProjectException">The file is not a valid project; carries every error and warning.</exception>
    /// <exception cref="IOException">The main file cannot be read from the source.</exception>
    public static Project Load(string path, IProjectFileSource source)
    {
        ArgumentNullException.ThrowIfNull(source);
        var full = Path.GetFullPath(path);
        var name = source.NameOf(full);
        var bytes = source.Read(full);
        var main = new MainFile(name, full, null, source);
        return bytes.LongLength > ProjectLimits.MaxFileBytes ? throw TooLarge(name, bytes.LongLength, "bytes") : Decode(bytes, main);
    }

    private static Project Decode(byte[] bytes, MainFile main)
    {
        string text;
        try
        {
            text = StrictUtf8.GetString(bytes);
        }
        catch (DecoderFallbackException)
        {
            throw NotUtf8(main.Name, bytes);
        }

        if (text.Length > 0 && text[0] == '\uFEFF')
        {
            text = text[1..];
        }

        return Parse(text, main, bytes);
    }

    /// <summary>
    /// Validates project text as if read from <paramref name="file"/> (the name used in diagnostics);
    /// <see cref="Project.Sha256"/> is the hash of the text's UTF-8 bytes. Files it includes are read from
    /// disk, relative to <paramref name="file"/>.
    /// </summary>
    /// <exception cref="ProjectException">The text is not a valid project; carries every error and warning.</exception>
    public static Project Parse(string text, string file)
    {
        if (text.Length > ProjectLimits.MaxFileBytes)
        {
            throw TooLarge(file, text.Length, "characters");
        }

        return Parse(text, new MainFile(file, Path.GetFullPath(file), null, null), Encoding.UTF8.GetBytes(text));
    }

    private static Project Parse(string text, MainFile main, byte[] bytes)
    {
        // Hashed first, so that the bytes are not kept while the tree is read.
        var hash = IncludeReader.Hash(bytes);
        var length = bytes.LongLength;
        var file = main.Name;
        var bag = new DiagnosticBag();
        bag.AddFile(file);
        var root = SourceTreeReader.Read(text, file, bag);
        if (root is null || root is SourceScalar { IsNull: true })
        {
            if (!bag.HasErrors)
            {
                bag.Error(new SourceLocation(file, 1, 1), ProjectMessages.NoProject());
            }

            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        var reader = new ProjectReader(bag);
        var draft = reader.Read(root);
        var includes = new IncludeReader(bag, reader, main.Source);
        includes.Add(new SourceFile(file, main.FullPath, main.Identity, length, Convert.ToHexStringLower(hash), Path.GetFileName(main.FullPath)), hash);
        includes.ReadAll(file, main.FullPath, draft.Includes);
        var tables = new TableFileReader(bag, includes, main.Source);
        draft.Rules = tables.Read(draft.Rules, file, main.FullPath, draft.CatalogFile, draft.GroundingTableFile);
        draft.Sizing = tables.ReadSizing(draft.Sizing, file, main.FullPath, draft.TerminalTableFile);
        if (draft.Equipment.Count == 0 && draft.Includes.Count > 0 && !bag.HasErrors)
        {
            bag.Error(root.Location, ProjectMessages.NoEquipmentWithIncludes());
        }

        new FeedChecker(bag).Check(draft);
        if (bag.HasErrors)
        {
            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        return Build(draft, file, Sha256Of(includes.Hashes), bag.Warnings()) with { Files = includes.Files };
    }

    private static Project Build(ProjectDraft draft, string file, string sha256, IReadOnlyList<Diagnostic> warnings)
    {
        var equipment = new List<Equipment>(draft.Equipment.Count);
        foreach (var d in draft.Equipment)
        {
            var system = d.System!;
            var output = d.OutputSystem!;
            var lines = d.Circuits.Count > 0 ? PhaseRules.Lines(output) : 0;
            var circuits = new Circuit[d.Circuits.Count];
            for (var i = 0; i < circuits.Length; i++)
            {
                var c = d.Circuits[i];
                var poles = c.Poles!.Value;
                var supply = output.CircuitFor(poles)!.Value;
                var numbered = c.StatedPhases is null ? PhaseRules.FromNumber(c.Id!, poles, lines) : null;
                circuits[i] = new Circuit
                {
                    Id = c.Id!,
                    FullId = string.Concat(d.Id, "/", c.Id),
                    Name = c.Name,
                    Poles = poles,
                    Supply = supply,
                    Load = c.Load ?? Model.Load.Combined(c.Points, supply),
                    Points = c.Points,
                    Category = c.Category ?? (c.Load is { IsMotor: true } ? LoadCategory.Motor : LoadCategory.Other),
                    Phases = c.StatedPhases ?? numbered,
                    PhaseSource = c.StatedPhases is not null ? PhaseSource.Stated : numbered is not null ? PhaseSource.Numbered : PhaseSource.Balanced,
                    Continuous = c.Continuous,
                    Run = c.Run! with { LoadedConductors = supply.Phases == 3 ? 3 : 2 },
                    Location = c.Location,
                };
            }

            equipment.Add(new Equipment
            {
                Id = d.Id!,
                Kind = d.Kind!.Value,
                From = d.From!,
                System = system,
                Feeder = d.Feeder is { } feeder ? feeder with { LoadedConductors = PhaseRules.Lines(system) == 3 ? 3 : 2 } : null,
                DemandFactor = d.DemandFactor,
                InterruptingKa = d.InterruptingKa,
                MainA = d.MainA,
                Transformer = d.Transformer,
                Circuits = circuits,
                Location = d.Location,
            });
        }

        return new Project
        {
            Name = draft.Name!,
            Description = draft.Description,
            File = file,
            Sha256 = sha256,
            Units = draft.Units,
            Rules = draft.Rules,
            Defaults = draft.Defaults,
            Sizing = draft.Sizing,
            Service = draft.Service!,
            Equipment = equipment,
            Warnings = warnings,
        };
    }

    // One file: the SHA-256 of its bytes. With includes: the SHA-256 of the files' 32-byte digests concatenated
    // in the order read (the main file, then depth first in list order), so a change to any file changes it.
    private static string Sha256Of(List<byte[]> hashes) =>
        Convert.ToHexStringLower(hashes.Count == 1 ? hashes[0] : SHA256.HashData(hashes.SelectMany(h => h).ToArray()));

    /// <summary>
    /// The bytes of the regular file at <paramref name="path"/>, read in one bounded stream: at most
    /// <see cref="ProjectLimits.MaxFileBytes"/> + 1 bytes, so a device or a file growing without end cannot exhaust
    /// memory. <c>Size</c> is the file's size in bytes; over the limit, <c>Bytes</c> is empty (the file is not read,
    /// or not kept). <c>Identity</c> is the file's, taken from the open file (so it is the file read, whatever
    /// happens to its name meanwhile).
    /// </summary>
    /// <exception cref="IOException">The path is a folder, a device or a pipe, or cannot be read.</exception>
    internal static (byte[] Bytes, long Size, FileIdentity? Identity) ReadBounded(string path)
    {
        if (Directory.Exists(path))
        {
            throw new IOException(ProjectMessages.IsAFolder());
        }

        // A pipe, a device or a socket is refused before it is opened: opening a pipe for reading waits for a writer.
        if (FileIdentity.Of(path).Kind is FileKind.Pipe or FileKind.Device or FileKind.Socket)
        {
            throw new IOException(ProjectMessages.NotARegularFile());
        }

        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite, 1, FileOptions.SequentialScan);
        if (!stream.CanSeek)
        {
            throw new IOException(ProjectMessages.NotARegularFile());
        }

        var identity = FileIdentity.Of(stream.SafeFileHandle);
        var stated = stream.Length;
        if (stated > ProjectLimits.MaxFileBytes)
        {
            return ([], stated, identity);
        }

        // A device (/dev/zero) states no size and never ends: reading one byte more than stated tells it apart.
        var bytes = new byte[stated + 1];
        var read = stream.ReadAtLeast(bytes, bytes.Length, throwOnEndOfStream: false);
        if (read > stated)
        {
            if (stated == 0)
            {
                throw new IOException(ProjectMessages.NotARegularFile());
            }

            using var rest = new MemoryStream();
            rest.Write(bytes, 0, read);
            var more = new byte[81920];
            int chunk;
            while (rest.Length <= ProjectLimits.MaxFileBytes && (chunk = stream.Read(more, 0, (int)Math.Min(more.Length, ProjectLimits.MaxFileBytes + 1 - rest.Length))) > 0)
            {
                rest.Write(more, 0, chunk);
            }

            return rest.Length > ProjectLimits.MaxFileBytes ? ([], rest.Length, identity) : (rest.ToArray(), rest.Length, identity);
        }

        Array.Resize(ref bytes, read);
        return (bytes, read, identity);
    }

    private static ProjectException TooLarge(string file, long size, string unit) =>
        ProjectException.At(new SourceLocation(file, 1, 1), ProjectMessages.TooLarge(size, unit));

    /// <summary>The error for bytes that are not UTF-8, located at the first bad byte: its line, and its column counted in characters.</summary>
    private static ProjectException NotUtf8(string file, byte[] bytes)
    {
        var (location, message) = Utf8Error(file, bytes);
        return ProjectException.At(location, message);
    }

    /// <summary>
    /// The text of a file the project reads (an included file, a table it brings), decoded as UTF-8 without its byte-order
    /// mark; null, with a located error in <paramref name="bag"/>, where its bytes are not UTF-8.
    /// </summary>
    internal static string? DecodeOrReport(DiagnosticBag bag, string shown, byte[] bytes)
    {
        try
        {
            var text = StrictUtf8.GetString(bytes);
            return text.Length > 0 && text[0] == '\uFEFF' ? text[1..] : text;
        }
        catch (DecoderFallbackException)
        {
            var (location, message) = Utf8Error(shown, bytes);
            bag.Error(location, message);
            return null;
        }
    }

    /// <summary>Where bytes that are not UTF-8 first fail to decode (line, and column in characters) and the message saying so, with the byte's offset.</summary>
    internal static (SourceLocation Location, string Message) Utf8Error(string file, byte[] bytes)
    {
        var chars = new char[bytes.Length];
        System.Text.Unicode.Utf8.ToUtf16(bytes, chars, out var offset, out _, replaceInvalidSequences: false);
        var lineStart = Array.LastIndexOf(bytes, (byte)'\n', Math.Max(offset - 1, 0)) + 1;
        var line = 1 + bytes.AsSpan(0, lineStart).Count((byte)'\n');
        var column = 1 + StrictUtf8.GetCharCount(bytes, lineStart, offset - lineStart);
        var hint = bytes is [0xFF, 0xFE, ..] or [0xFE, 0xFF, ..] ? " (it looks like UTF-16)" : "";
        return (new SourceLocation(file, line, column), ProjectMessages.NotUtf8(hint, bytes[offset], offset));
    }

    // The main file: its name in diagnostics, where it is, which file it was, and the source of its includes (null: the file system).
    private sealed record MainFile(string Name, string FullPath, FileIdentity? Identity, IProjectFileSource? Source);
}
