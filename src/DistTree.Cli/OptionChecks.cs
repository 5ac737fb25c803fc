namespace DistTree.Cli;

/// <summary>Checks of option values that several commands share; each failure is a usage error (exit 2).</summary>
internal static class OptionChecks
{
    /// <summary><paramref name="value"/>, when it is 1 or more.</summary>
    /// <exception cref="UsageException"><paramref name="value"/> is below 1.</exception>
    public static int Positive(int value, string option) =>
        value >= 1 ? value : throw new UsageException($"{option} takes a whole number of 1 or more");

    /// <summary>
    /// Checks the output options (option name, path or null) before any work: no path is empty, and at most one is
    /// standard output. What stands at each path is checked once the inputs are read (<see cref="OutputTarget"/>).
    /// </summary>
    /// <exception cref="UsageException">An output path is empty, or two or more are <c>-</c>.</exception>
    public static void Outputs(params (string Option, string? Path)[] outputs)
    {
        foreach (var (option, path) in outputs)
        {
            if (path is { Length: 0 })
            {
                throw new UsageException($"{option} was given an empty path; give a file name, or '-' for standard output");
            }
        }

        OneStandardOutput(outputs);
    }

    /// <summary>Passes when at most one of the outputs (option name, path or null) is standard output (<c>-</c>).</summary>
    /// <exception cref="UsageException">Two or more outputs are <c>-</c>.</exception>
    public static void OneStandardOutput(params (string Option, string? Path)[] outputs)
    {
        if (outputs.Count(o => o.Path == "-") > 1)
        {
            var names = outputs.Select(o => o.Option).ToArray();
            throw new UsageException($"only one of {string.Join(", ", names[..^1])} and {names[^1]} can write to standard output");
        }
    }
}
