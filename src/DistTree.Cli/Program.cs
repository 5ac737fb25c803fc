namespace DistTree.Cli;

/// <summary>The <c>disttree</c> command's entry point.</summary>
public static class Program
{
    /// <summary>Runs the command line and returns its exit code (0 ok, 1 a limit exceeded, 2 bad input or usage, 3 an internal error).</summary>
    public static int Main(string[] args) => DisttreeApp.Run(args, Console.Out, Console.Error, showProgress: !Console.IsErrorRedirected);
}
