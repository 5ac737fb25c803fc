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

        return Parse(text, path, bytes);
    }

    /// <summary>
    /// Validates project text as if read from <paramref name="file"/> (the name used in diagnostics);
    /// <see cref="Project.Sha256"/> is the hash of the text's UTF-8 bytes. Files it includes are read from
    /// disk, relative to <paramref name="file"/>.
    /// </summary>
    /// <exception cref="ProjectException">The text is not a valid project; carries every error and warning.</exception>
    public static Project Parse(string text, string file) => Parse(text, file, Encoding.UTF8.GetBytes(text));

    private static Project Parse(string text, string file, byte[] bytes)
    {
        var bag = new DiagnosticBag();
        bag.AddFile(file);
        var root = SourceTreeReader.Read(text, file, bag);
        if (root is null || root is SourceScalar { IsNull: true })
        {
            if (!bag.HasErrors)
            {
                bag.Error(new SourceLocation(file, 1, 1), "the file holds no project; it starts with 'disttree: 1' (see docs/project-file.md)");
            }

            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        var reader = new ProjectReader(bag);
        var draft = reader.Read(root);
        var includes = new IncludeReader(bag, reader);
        includes.Hashes.Add(IncludeReader.Hash(bytes));
        includes.ReadAll(file, draft.Includes);
        if (draft.Equipment.Count == 0 && draft.Includes.Count > 0 && !bag.HasErrors)
        {
            bag.Error(root.Location, "the project and the files it includes list no equipment; a project needs at least one piece of equipment");
        }

        new FeedChecker(bag).Check(draft);
        if (bag.HasErrors)
        {
            throw ProjectException.FromDiagnostics(bag.Sorted());
        }

        return Build(draft, file, Sha256Of(includes.Hashes), bag.Warnings());
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
                Load = c.Load ?? Combined(c.Points, output.CircuitFor(c.Poles.Value)!.Value),
                Points = c.Points,
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

    // The sum of the points' loads as one apparent power (phasor sum; points carry no motors).
    private static Load Combined(IReadOnlyList<LoadPoint> points, CircuitSupply supply)
    {
        double p = 0, q = 0;
        foreach (var point in points)
        {
            var l = point.Load;
            var va = l.Kind switch
            {
                LoadKind.Kva => l.Value * 1000,
                LoadKind.Kw => l.Value * 1000 / l.PowerFactor,
                LoadKind.Amps => l.Value * supply.VoltageV * (supply.Phases == 3 ? Math.Sqrt(3) : 1),
                _ => l.Value,
            };
            p += va * l.PowerFactor;
            q += va * Math.Sqrt(1 - (l.PowerFactor * l.PowerFactor));
        }

        var s = Math.Sqrt((p * p) + (q * q));
        return new Load(LoadKind.Va, s, s > 0 ? p / s : 1.0);
    }


    // One file: the SHA-256 of its bytes. With includes: the SHA-256 of the files' 32-byte digests concatenated
    // in the order read (the main file, then depth first in list order), so a change to any file changes it.
    private static string Sha256Of(List<byte[]> hashes) =>
        Convert.ToHexStringLower(hashes.Count == 1 ? hashes[0] : SHA256.HashData(hashes.SelectMany(h => h).ToArray()));
}
