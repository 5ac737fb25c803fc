using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using DistTree.Diagnostics;
using DistTree.Model;

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
        var size = new FileInfo(path).Length;
        if (size > ProjectLimits.MaxFileBytes)
        {
            throw TooLarge(path, size, "bytes");
        }

        var bytes = File.ReadAllBytes(path);
        if (bytes.Length > ProjectLimits.MaxFileBytes)
        {
            throw TooLarge(path, bytes.Length, "bytes");
        }

        string text;
        try
        {
            text = StrictUtf8.GetString(bytes);
        }
        catch (DecoderFallbackException)
        {
            throw NotUtf8(path, bytes);
        }

        if (text.Length > 0 && text[0] == '\uFEFF')
        {
            text = text[1..];
        }

        return Parse(text, path, Hash(bytes));
    }

    /// <summary>
    /// Validates project text as if read from <paramref name="file"/> (the name used in diagnostics);
    /// <see cref="Project.Sha256"/> is the hash of the text's UTF-8 bytes.
    /// </summary>
    /// <exception cref="ProjectException">The text is not a valid project; carries every error and warning.</exception>
    public static Project Parse(string text, string file)
    {
        if (text.Length > ProjectLimits.MaxFileBytes)
        {
            throw TooLarge(file, text.Length, "characters");
        }

        return Parse(text, file, Hash(Encoding.UTF8.GetBytes(text)));
    }

    private static Project Parse(string text, string file, string sha256)
    {
        var bag = new DiagnosticBag();
        var root = SourceTreeReader.Read(text, file, bag);
        if (root is null || root is SourceScalar { IsNull: true })
        {
            if (!bag.HasErrors)
            {
                bag.Error(new SourceLocation(file, 1, 1), "the file holds no project; it starts with 'disttree: 1' (see docs/project-file.md)");
            }

            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        var draft = new ProjectReader(bag).Read(root);
        new FeedChecker(bag).Check(draft);
        if (bag.HasErrors)
        {
            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        return Build(draft, file, sha256, bag.Warnings());
    }

    private static Project Build(ProjectDraft draft, string file, string sha256, IReadOnlyList<Diagnostic> warnings)
    {
        var equipment = new List<Equipment>(draft.Equipment.Count);
        foreach (var d in draft.Equipment)
        {
            var system = d.System!;
            var output = d.OutputSystem!;
            var circuits = d.Circuits.Select(c => new Circuit
            {
                Id = c.Id!,
                FullId = $"{d.Id}/{c.Id}",
                Name = c.Name,
                Poles = c.Poles!.Value,
                Supply = output.CircuitFor(c.Poles.Value)!.Value,
                Load = c.Load!,
                Continuous = c.Continuous,
                Run = c.Run!,
                Location = c.Location,
            }).ToArray();
            equipment.Add(new Equipment
            {
                Id = d.Id!,
                Kind = d.Kind!.Value,
                From = d.From!,
                System = system,
                Feeder = d.Feeder,
                DemandFactor = d.DemandFactor,
                Transformer = d.Transformer,
                Circuits = circuits,
                Location = d.Location,
            });
        }

        return new Project
        {
            Name = draft.Name!,
            File = file,
            Sha256 = sha256,
            Units = draft.Units,
            Rules = draft.Rules,
            Defaults = draft.Defaults,
            Service = draft.Service!,
            Equipment = equipment,
            Warnings = warnings,
        };
    }

    private static ProjectException TooLarge(string file, long size, string unit) => ProjectException.At(
        new SourceLocation(file, 1, 1),
        string.Create(
            CultureInfo.InvariantCulture,
            $"the file has {size:N0} {unit}; a project file may have at most {ProjectLimits.MaxFileBytes:N0} (64 MiB, see docs/limits.md)"));

    /// <summary>The error for bytes that are not UTF-8, located at the first bad byte: its line, and its column counted in characters.</summary>
    private static ProjectException NotUtf8(string file, byte[] bytes)
    {
        var chars = new char[bytes.Length];
        System.Text.Unicode.Utf8.ToUtf16(bytes, chars, out var offset, out _, replaceInvalidSequences: false);
        var lineStart = Array.LastIndexOf(bytes, (byte)'\n', Math.Max(offset - 1, 0)) + 1;
        var line = 1 + bytes.AsSpan(0, lineStart).Count((byte)'\n');
        var column = 1 + StrictUtf8.GetCharCount(bytes, lineStart, offset - lineStart);
        var hint = bytes is [0xFF, 0xFE, ..] or [0xFE, 0xFF, ..] ? " (it looks like UTF-16)" : "";
        return ProjectException.At(
            new SourceLocation(file, line, column),
            string.Create(
                CultureInfo.InvariantCulture,
                $"the file is not UTF-8 text{hint}: the byte 0x{bytes[offset]:X2} at offset {offset:N0} does not decode; save the file as UTF-8"));
    }

    private static string Hash(byte[] bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));
}
