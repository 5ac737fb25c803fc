using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Cli;

/// <summary>The <c>--sarif PATH</c> output of analyze and check: the findings as a SARIF 2.1.0 log.</summary>
internal static class FindingsOutput
{
    /// <summary>The option's description, the same on every command that has it.</summary>
    public const string SarifDescription = "Write the findings as a SARIF 2.1.0 log to PATH (or '-' for standard output), for code-review tools.";

    /// <summary>Writes the log when <paramref name="sarifPath"/> is given; the input file is never overwritten.</summary>
    public static void WriteSarif(CliContext context, string? sarifPath, Solution solution, string projectPath)
    {
        if (sarifPath is not null)
        {
            OutputFile.Write(context, sarifPath, SarifResults.Write(solution, ArtifactUri(projectPath)), solution.Project.Files);
        }
    }

    /// <summary>
    /// The project file as a URI reference relative to the working folder, with forward slashes and each
    /// segment escaped; a file on another drive becomes an absolute <c>file:</c> URI.
    /// </summary>
    public static string ArtifactUri(string projectPath)
    {
        var full = Path.GetFullPath(projectPath);
        var relative = Path.GetRelativePath(Directory.GetCurrentDirectory(), full);
        if (Path.IsPathRooted(relative))
        {
            return new Uri(full).AbsoluteUri;
        }

        return string.Join('/', relative.Split(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar).Select(Uri.EscapeDataString));
    }
}
