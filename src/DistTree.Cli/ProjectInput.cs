using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Cli;

/// <summary>Reads the project file a command names, turning a file that cannot be read into a usage error.</summary>
internal static class ProjectInput
{
    /// <summary>Loads and validates <paramref name="path"/>; a bad project throws <see cref="Diagnostics.ProjectException"/>.</summary>
    /// <exception cref="UsageException">The file does not exist or cannot be read.</exception>
    public static Project Load(string path) => Read(path, ProjectLoader.Load);

    /// <summary>
    /// Runs <paramref name="load"/> (the loader, or the whole <see cref="Analysis"/>) on <paramref name="path"/> once
    /// it names a file; a bad project throws <see cref="Diagnostics.ProjectException"/>.
    /// </summary>
    /// <exception cref="UsageException">The file does not exist or cannot be read.</exception>
    public static T Read<T>(string path, Func<string, T> load)
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
            return load(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new UsageException($"cannot read '{path}': {e.Message}");
        }
    }
}
