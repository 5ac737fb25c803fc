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
        var bytes = File.ReadAllBytes(path);
        string text;
        try
        {
            text = StrictUtf8.GetString(bytes);
        }
        catch (DecoderFallbackException)
        {
            throw ProjectException.At(new SourceLocation(path, 1, 1), "the file is not UTF-8 text");
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
    public static Project Parse(string text, string file) => Parse(text, file, Hash(Encoding.UTF8.GetBytes(text)));

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
            Sizing = draft.Sizing,
            Service = draft.Service!,
            Equipment = equipment,
            Warnings = warnings,
        };
    }

    private static string Hash(byte[] bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));
}
