using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Cli;

/// <summary>Loads the project file a command names, turning a file that cannot be read into a usage error.</summary>
internal static class ProjectInput
{
    /// <summary>Loads and validates <paramref name="path"/>; a bad project throws <see cref="Diagnostics.ProjectException"/>.</summary>
    /// <exception cref="UsageException">The file does not exist or cannot be read.</exception>
    public static Project Load(string path)
    {
        if (Directory.Exists(path))
        {
            throw new UsageException($"'{path}' is a directory, not a project file");
        }

        if (!File.Exists(path))
        {
            throw new UsageException($"cannot read '{path}': no such file");
        }

        try
        {
            return ProjectLoader.Load(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new UsageException($"cannot read '{path}': {e.Message}");
        }
    }
}
