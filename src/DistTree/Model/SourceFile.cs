using DistTree.ProjectFiles;

namespace DistTree.Model;

/// <summary>
/// A file the loader read for a project: the main file or an included one. It says which file it was
/// (so that a command can refuse to write over it, whatever name it is given) and what it held (so that a
/// command editing it can check it still holds that).
/// </summary>
/// <param name="Name">The name diagnostics give it: the path as given for the main file, as shown for an include.</param>
/// <param name="FullPath">Its absolute path, symbolic links followed for an included file.</param>
/// <param name="Identity">Which file it was when read (device and inode); null where the system does not say, or for text not read from a file.</param>
/// <param name="Length">How many bytes were read.</param>
/// <param name="Sha256">Lower-case hex SHA-256 of the bytes read.</param>
/// <param name="PathInProject">
/// Where it stands relative to the main file's folder as the includes name it ('/' between folders): the main file's
/// own name, or the include paths joined ('buildings/north-hall.yaml'); so a copy of the project's files at these
/// paths in another folder reads as the project. Null when the includes, as written, climb above the main file's
/// folder (through a symbolic link).
/// </param>
public sealed record SourceFile(string Name, string FullPath, FileIdentity? Identity, long Length, string Sha256, string? PathInProject);
