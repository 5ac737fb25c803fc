namespace DistTree.ProjectFiles;

/// <summary>
/// Where <see cref="ProjectLoader.Load(string, IProjectFileSource)"/> reads a project's files from when not from
/// the file system as it is now: a revision in version control, say. Paths are resolved as on the file system
/// (an include is relative to the including file and stays in the main file's folder); the source gives each
/// file's bytes and the name diagnostics use for it.
/// </summary>
public interface IProjectFileSource
{
    /// <summary>The name diagnostics give the file at <paramref name="fullPath"/> (absolute).</summary>
    string NameOf(string fullPath);

    /// <summary>
    /// The bytes of the file at <paramref name="fullPath"/> (absolute). A source may stop reading past
    /// <see cref="ProjectLimits.MaxFileBytes"/> bytes and return what it has: the loader refuses the file then.
    /// </summary>
    /// <exception cref="FileNotFoundException">There is no such file.</exception>
    /// <exception cref="IOException">It cannot be read; the message says why.</exception>
    byte[] Read(string fullPath);
}
