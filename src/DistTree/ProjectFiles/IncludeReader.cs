using System.Security.Cryptography;
using DistTree.Diagnostics;
using DistTree.ProjectFiles.Sections;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles;

/// <summary>
/// Reads the files a project includes, depth first in list order, iteratively (an explicit stack). A path is
/// relative to the including file and must stay inside the main file's folder; a file that includes itself,
/// directly or through others, is an include cycle; a file included twice is an error. Each file read adds
/// its SHA-256 to <see cref="Hashes"/> and itself to <see cref="Files"/>, in the order read, after the main file's.
/// With a <paramref name="source"/>, files are read from it (a revision in version control) and paths are
/// resolved as written, with no symbolic link followed.
/// </summary>
internal sealed class IncludeReader(DiagnosticBag bag, ProjectReader reader, IProjectFileSource? source)
{
    /// <summary>SHA-256 of every file read, the main file's first.</summary>
    public List<byte[]> Hashes { get; } = [];

    /// <summary>Every file read, the main file's first.</summary>
    public List<Model.SourceFile> Files { get; } = [];

    /// <summary>Notes a file read (the main file, by the loader) and its SHA-256.</summary>
    public void Add(Model.SourceFile file, byte[] hash)
    {
        Files.Add(file);
        Hashes.Add(hash);
    }

    /// <summary>
    /// Reads every file that <paramref name="mainFile"/> (named so in diagnostics, found at <paramref name="mainPath"/>)
    /// includes (its entries are <paramref name="includes"/>).
    /// </summary>
    public void ReadAll(string mainFile, string mainPath, IReadOnlyList<IncludeEntry> includes)
    {
        if (includes.Count == 0)
        {
            return;
        }

        var folder = Path.GetDirectoryName(mainPath)!;
        var mainFull = mainPath;
        if (source is null)
        {
            folder = RealPath(folder) ?? "";
            mainFull = RealPath(mainPath) ?? mainPath;
        }

        var chain = new List<Frame> { new(mainFile, mainFull, Path.GetFileName(mainPath), includes) };
        var seen = new Dictionary<string, SourceLocation>(StringComparer.Ordinal) { [mainFull] = new SourceLocation(mainFile, 1, 1) };
        while (chain.Count > 0)
        {
            var frame = chain[^1];
            if (frame.Next == frame.Includes.Count)
            {
                chain.RemoveAt(chain.Count - 1);
                continue;
            }

            var entry = frame.Includes[frame.Next++];
            if (Resolve(entry, frame, folder) is not { } resolved)
            {
                continue;
            }

            var (shown, full) = resolved;
            if (chain.FindIndex(f => f.Full == full) is var open and >= 0)
            {
                var names = chain.Skip(open).Select(f => $"'{f.Shown}'").Append($"'{shown}'");
                bag.Error(entry.Location, ProjectMessages.IncludeCycle(names));
                continue;
            }

            if (seen.TryGetValue(full, out var first))
            {
                bag.Error(entry.Location, ProjectMessages.IncludedTwice(shown, first));
                continue;
            }

            seen.Add(full, entry.Location);
            var inProject = InProject(frame.InProject, entry.Path);
            if (ReadFile(entry, shown, full, inProject) is { } next)
            {
                chain.Add(new Frame(shown, full, inProject, next));
            }
        }
    }

    /// <summary>The SHA-256 of one file's bytes.</summary>
    public static byte[] Hash(byte[] bytes) => SHA256.HashData(bytes);

    private (string Shown, string Full)? Resolve(IncludeEntry entry, Frame from, string folder)
    {
        if (entry.Path.Length == 0 || Path.IsPathRooted(entry.Path))
        {
            bag.Error(entry.Location, ProjectMessages.IncludeNotRelative(entry.Path));
            return null;
        }

        var full = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(from.Full)!, entry.Path));
        if (!full.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            bag.Error(entry.Location, ProjectMessages.IncludeOutside(entry.Path));
            return null;
        }

        if (source is not null)
        {
            return (source.NameOf(full), full);
        }

        // The path as written stays inside; so must the file it names, every symbolic link on the way followed.
        var real = RealPath(full);
        if (real is null || !real.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            bag.Error(entry.Location, ProjectMessages.IncludeLinksOutside(entry.Path));
            return null;
        }

        full = real;

        var shownFolder = Path.GetDirectoryName(from.Shown);
        var shown = Path.GetRelativePath(".", Path.Combine(string.IsNullOrEmpty(shownFolder) ? "." : shownFolder, entry.Path));
        if (Path.IsPathRooted(from.Shown))
        {
            shown = full;
        }

        return (shown.Replace('\\', '/'), full);
    }

    /// <summary>
    /// <paramref name="full"/> (an absolute path) with every symbolic link on it followed, component by component,
    /// as the system opens it; a part that does not exist is kept as written. Null past 40 links (a loop).
    /// </summary>
    internal static string? RealPath(string full)
    {
        const int MaxLinks = 40;
        var root = Path.GetPathRoot(full) ?? "/";
        var remaining = new Stack<string>(Parts(full).Reverse());
        var current = root;
        var links = 0;
        while (remaining.Count > 0)
        {
            var part = remaining.Pop();
            if (part == ".")
            {
                continue;
            }

            if (part == "..")
            {
                current = Path.GetDirectoryName(current) ?? root;
                continue;
            }

            var next = Path.Combine(current, part);
            if (new FileInfo(next).LinkTarget is not { } target)
            {
                current = next;
                continue;
            }

            if (++links > MaxLinks)
            {
                return null;
            }

            foreach (var step in Parts(target).Reverse())
            {
                remaining.Push(step);
            }

            if (Path.IsPathRooted(target))
            {
                current = Path.GetPathRoot(target) ?? root;
            }
        }

        return current;

        static string[] Parts(string path) =>
            path[(Path.GetPathRoot(path)?.Length ?? 0)..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries);
    }

    /// <summary>
    /// The path of a file included as <paramref name="path"/> from the file at <paramref name="from"/>, both relative to
    /// the main file's folder, with '.' and '..' worked out; null when it climbs above that folder (or from is null).
    /// </summary>
    internal static string? InProject(string? from, string path)
    {
        if (from is null)
        {
            return null;
        }

        var parts = new List<string>(from.Split('/')[..^1]);
        foreach (var part in path.Split(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar))
        {
            if (part is "" or ".")
            {
                continue;
            }

            if (part != "..")
            {
                parts.Add(part);
            }
            else if (parts.Count == 0)
            {
                return null;
            }
            else
            {
                parts.RemoveAt(parts.Count - 1);
            }
        }

        return string.Join('/', parts);
    }

    private IReadOnlyList<IncludeEntry>? ReadFile(IncludeEntry entry, string shown, string full, string? inProject)
    {
        byte[] bytes;
        Model.SourceFile file;
        try
        {
            FileIdentity? identity = null;
            long size;
            if (source is null)
            {
                (bytes, size, identity) = ProjectLoader.ReadBounded(full);
            }
            else
            {
                bytes = source.Read(full);
                size = bytes.LongLength;
            }

            file = new Model.SourceFile(shown, full, identity, size, "", inProject);
            if (size > ProjectLimits.MaxFileBytes)
            {
                bag.Error(entry.Location, ProjectMessages.IncludeTooLarge(shown, size));
                return null;
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            var why = e is FileNotFoundException or DirectoryNotFoundException ? "no such file" : e.Message;
            bag.Error(entry.Location, ProjectMessages.CannotReadInclude(shown, why));
            return null;
        }

        bag.AddFile(shown);
        if (ProjectLoader.DecodeOrReport(bag, shown, bytes) is not { } text)
        {
            return null;
        }

        var hash = Hash(bytes);
        Add(file with { Sha256 = Convert.ToHexStringLower(hash) }, hash);
        var root = SourceTreeReader.Read(text, shown, bag);
        if (root is null || root is SourceScalar { IsNull: true })
        {
            // An empty or comment-only file holds no document: no reader reports it, so it is reported here.
            if (root is not null || HoldsNoDocument(text))
            {
                bag.Error(new SourceLocation(shown, 1, 1), ProjectMessages.IncludedHoldsNothing());
            }

            return null;
        }

        return reader.ReadIncluded(root);
    }

    /// <summary>True when every line is blank, a comment, or a document marker ('---', '...').</summary>
    private static bool HoldsNoDocument(string text)
    {
        foreach (var line in text.AsSpan().EnumerateLines())
        {
            var trimmed = line.Trim();
            if (!(trimmed.IsEmpty || trimmed[0] == '#' || trimmed is "---" or "..."))
            {
                return false;
            }
        }

        return true;
    }

    private sealed class Frame(string shown, string full, string? inProject, IReadOnlyList<IncludeEntry> includes)
    {
        public string? InProject { get; } = inProject;

        public string Shown { get; } = shown;

        public string Full { get; } = full;

        public IReadOnlyList<IncludeEntry> Includes { get; } = includes;

        public int Next { get; set; }
    }
}
