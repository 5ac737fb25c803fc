using System.CommandLine;
using System.CommandLine.Invocation;
using System.Reflection;

namespace DistTree.Cli;

/// <summary>
/// The action of <c>--version</c>: prints the version of the tool itself (0.1.0). System.CommandLine's own
/// prints the entry assembly's, which is the test host's when the command is run in-process.
/// </summary>
internal sealed class PrintVersion : SynchronousCommandLineAction
{
    /// <summary>The tool's version, as packed (no commit suffix).</summary>
    public static string Version { get; } =
        typeof(PrintVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion
        ?? typeof(PrintVersion).Assembly.GetName().Version?.ToString(3)
        ?? "0.0.0";

    public override int Invoke(ParseResult parseResult)
    {
        (parseResult.InvocationConfiguration.Output ?? Console.Out).WriteLine(Version);
        return ExitCodes.Ok;
    }
}
