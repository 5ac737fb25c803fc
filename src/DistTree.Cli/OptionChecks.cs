using System.Globalization;

namespace DistTree.Cli;

/// <summary>Checks of option values that several commands share; each failure is a usage error (exit 2).</summary>
internal static class OptionChecks
{
    /// <summary>
    /// The most lines a listing option (<c>--worst</c>, <c>--rows</c>) may ask for: 1,000. Each worst path costs the
    /// HTML report about 4 KB; all 100,000 of a large project took 35 s and 2.4 GB for a 400 MB page (docs/limits.md).
    /// </summary>
    public const int MaxListed = 1000;

    /// <summary><paramref name="value"/>, when it is from 1 to <see cref="MaxListed"/>.</summary>
    /// <exception cref="UsageException"><paramref name="value"/> is below 1 or above <see cref="MaxListed"/>.</exception>
    public static int Listed(int value, string option) =>
        value is >= 1 and <= MaxListed ? value : throw new UsageException(string.Create(CultureInfo.InvariantCulture, $"{option} takes a whole number from 1 to {MaxListed:N0}"));

    /// <summary><paramref name="value"/>, when it lies in <paramref name="range"/> (one of the project file's, <see cref="ProjectFiles.ValueRanges"/>).</summary>
    /// <exception cref="UsageException"><paramref name="value"/> is outside the range.</exception>
    public static double InRange(double value, ProjectFiles.NumberRange range, string option) =>
        range.Contains(value) ? value : throw new UsageException($"{option} must be {range}; found {ProjectFiles.NumberRange.Text(value)}");

    /// <summary>
    /// Checks the output options (option name, path or null) before any work: no path is empty, and at most one is
    /// standard output; no path holds a NUL character. What stands at each path is checked once the inputs are read (<see cref="OutputTarget"/>).
    /// </summary>
    /// <exception cref="UsageException">An output path is empty or holds a NUL character, or two or more are <c>-</c>.</exception>
    public static void Outputs(params (string Option, string? Path)[] outputs)
    {
        foreach (var (option, path) in outputs)
        {
            if (path is { Length: 0 })
            {
                throw new UsageException($"{option} was given an empty path; give a file name, or '-' for standard output");
            }

            if (path is not null && path.Contains('\0', StringComparison.Ordinal))
            {
                throw new UsageException($"{option} was given a path with a NUL character, which no file name can hold");
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
