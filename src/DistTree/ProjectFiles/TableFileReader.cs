using DistTree.Codes;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;

namespace DistTree.ProjectFiles;

/// <summary>
/// Reads the data files a project brings in its rules: <c>conductor_catalog</c> (a catalogue in the embedded one's
/// layout, <see cref="ConductorCatalog.Load"/>) and <c>grounding_table</c> (<see cref="GroundingTable.Load"/>). A path is
/// relative to the project file and must stay inside its folder, as an include's must (<see cref="IncludeReader"/>), and
/// is read the same way (bounded, UTF-8, from the revision's source where one is given). A path that cannot be read is an
/// error at its key; a bad line, an error at that line and column of the file. Each file read joins the project's files
/// (<see cref="Project.Files"/>) and its hash, after the includes.
/// </summary>
internal sealed class TableFileReader(DiagnosticBag bag, IncludeReader files, IProjectFileSource? source)
{
    /// <summary>
    /// <paramref name="rules"/> with the files of <paramref name="catalog"/> and <paramref name="groundingTable"/> (null:
    /// not given) read, relative to the main file <paramref name="mainFile"/> (its name in diagnostics) at <paramref name="mainPath"/>.
    /// </summary>
    public Rules Read(Rules rules, string mainFile, string mainPath, IncludeEntry? catalog, IncludeEntry? groundingTable)
    {
        if (catalog is { } c && Text(c, "conductor_catalog", mainFile, mainPath) is var (catalogName, catalogText)
            && Parse(() => ConductorCatalog.Load(new StringReader(catalogText), catalogName)) is { } loaded)
        {
            rules = rules with { ConductorCatalog = loaded };
        }

        if (groundingTable is { } g && Text(g, "grounding_table", mainFile, mainPath) is var (tableName, tableText)
            && Parse(() => GroundingTable.Load(new StringReader(tableText), tableName)) is { } table)
        {
            rules = rules with { GroundingTable = table };
        }

        return rules;
    }

    /// <summary><paramref name="sizing"/> with the file of <paramref name="terminalTable"/> (null: not given) read, as <see cref="Read"/> reads the rules' files.</summary>
    public SizingOptions ReadSizing(SizingOptions sizing, string mainFile, string mainPath, IncludeEntry? terminalTable)
    {
        if (terminalTable is { } t && Text(t, "terminal_table", mainFile, mainPath) is var (tableName, tableText)
            && Parse(() => TerminalTable.Load(new StringReader(tableText), tableName)) is { } table)
        {
            sizing = sizing with { TerminalTable = table };
        }

        return sizing;
    }

    // The file's own errors, located in it.
    private T? Parse<T>(Func<T> load)
        where T : class
    {
        try
        {
            return load();
        }
        catch (DataFileException e)
        {
            bag.Error(new SourceLocation(e.SourceName, e.Line, e.Column), e.Reason);
            return null;
        }
    }

    // The file's name as diagnostics give it and its text; null (with an error) where it cannot be read.
    private (string Shown, string Text)? Text(IncludeEntry entry, string key, string mainFile, string mainPath)
    {
        if (Resolve(entry, key, mainFile, mainPath) is not var (shown, full, inProject))
        {
            return null;
        }

        byte[] bytes;
        FileIdentity? identity = null;
        long size;
        try
        {
            if (source is null)
            {
                (bytes, size, identity) = ProjectLoader.ReadBounded(full);
            }
            else
            {
                bytes = source.Read(full);
                size = bytes.LongLength;
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            var why = e is FileNotFoundException or DirectoryNotFoundException ? "no such file" : e.Message;
            bag.Error(entry.Location, ProjectMessages.CannotReadDataFile(key, shown, why));
            return null;
        }

        if (size > ProjectLimits.MaxFileBytes)
        {
            bag.Error(entry.Location, ProjectMessages.DataFileTooLarge(shown, size));
            return null;
        }

        bag.AddFile(shown);
        if (ProjectLoader.DecodeOrReport(bag, shown, bytes) is not { } text)
        {
            return null;
        }

        var hash = IncludeReader.Hash(bytes);
        files.Add(new SourceFile(shown, full, identity, size, Convert.ToHexStringLower(hash), inProject), hash);
        return (shown, text);
    }

    // The path: relative to the main file, inside its folder (every symbolic link followed, when read from disk).
    private (string Shown, string Full, string? InProject)? Resolve(IncludeEntry entry, string key, string mainFile, string mainPath)
    {
        if (entry.Path.Length == 0 || Path.IsPathRooted(entry.Path))
        {
            bag.Error(entry.Location, ProjectMessages.DataFileNotRelative(key, entry.Path));
            return null;
        }

        var folder = Path.GetDirectoryName(mainPath)!;
        var from = mainPath;
        if (source is null)
        {
            folder = IncludeReader.RealPath(folder) ?? "";
            from = IncludeReader.RealPath(mainPath) ?? mainPath;
        }

        var full = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(from)!, entry.Path));
        var inProject = IncludeReader.InProject(Path.GetFileName(mainPath), entry.Path);
        if (!full.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            bag.Error(entry.Location, ProjectMessages.DataFileOutside(key, entry.Path));
            return null;
        }

        if (source is not null)
        {
            return (source.NameOf(full), full, inProject);
        }

        var real = IncludeReader.RealPath(full);
        if (real is null || !real.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            bag.Error(entry.Location, ProjectMessages.DataFileOutside(key, entry.Path));
            return null;
        }

        var shownFolder = Path.GetDirectoryName(mainFile);
        var shown = Path.IsPathRooted(mainFile)
            ? real
            : Path.GetRelativePath(".", Path.Combine(string.IsNullOrEmpty(shownFolder) ? "." : shownFolder, entry.Path));
        return (shown.Replace('\\', '/'), real, inProject);
    }
}
