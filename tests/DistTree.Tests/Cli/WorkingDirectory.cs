namespace DistTree.Tests.Cli;

/// <summary>
/// Tests that change the process's working folder (relative default paths, relative URIs) run in this
/// collection, alone: the working folder is shared by every thread.
/// </summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class WorkingDirectory
{
    public const string Name = "working directory";

    /// <summary>Runs <paramref name="work"/> with <paramref name="folder"/> as the working folder, then restores it.</summary>
    public static void In(string folder, Action work)
    {
        var before = Directory.GetCurrentDirectory();
        Directory.SetCurrentDirectory(folder);
        try
        {
            work();
        }
        finally
        {
            Directory.SetCurrentDirectory(before);
        }
    }
}
