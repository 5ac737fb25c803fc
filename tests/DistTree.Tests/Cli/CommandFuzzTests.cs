using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;
using DistTree.Diagnostics;
using Xunit.Abstractions;

namespace DistTree.Tests.Cli;

/// <summary>
/// Fuzzing the commands: the demo projects (the campus with its included files too) and small ones, copied into a
/// folder of their own, their text mutated as <see cref="ProjectFiles.ProjectLoaderFuzzTests"/> mutates it, run by
/// analyze, check, validate, upsize, compare or conductors with odd options (empty, negative and huge numbers, paths
/// that are the input, a folder, in missing folders, '-'), in-process as a user runs them: an unexpected exception is
/// exit 3. Each case must exit 0, 1 or 2, print no stack trace, no exception's name and no character that acts on a
/// terminal, change no file that was there before, and leave no file but the outputs it was asked for.
/// The cases are the same on every run (<see cref="DefaultSeed"/>); CI runs <see cref="DefaultCases"/>. Set
/// DISTTREE_FUZZ_CASES for more, DISTTREE_FUZZ_SEED for others, and DISTTREE_FUZZ_FIRST to start at a given case.
/// </summary>
public sealed partial class CommandFuzzTests(ITestOutputHelper output)
{
    private const int DefaultCases = 3000;
    private const int DefaultSeed = 20;

    // The failures listed, at most; the run stops there.
    private const int MaxFailures = 5;

    [Fact]
    public void Run_MutatedProjectsAndOddOptions_ExitCleanlyAndChangeNoInput()
    {
        var cases = Setting("DISTTREE_FUZZ_CASES", DefaultCases);
        var seed = Setting("DISTTREE_FUZZ_SEED", DefaultSeed);
        var first = Setting("DISTTREE_FUZZ_FIRST", 0);
        using var temp = new TempFolder();
        var folder = Path.Combine(temp.Path, "case");
        var exits = new int[3];
        var failures = new List<string>();
        var clock = Stopwatch.StartNew();
        var run = 0;
        for (; run < cases && failures.Count < MaxFailures; run++)
        {
            var fuzz = CommandFuzzCase.Make(seed, first + run, folder);
            var (failure, exit) = Check(fuzz, folder);
            if (failure is not null)
            {
                failures.Add($"case {first + run} of seed {seed} (DISTTREE_FUZZ_SEED={seed} DISTTREE_FUZZ_FIRST={first + run} DISTTREE_FUZZ_CASES=1 runs it alone): {fuzz}\n{failure}");
            }
            else
            {
                exits[exit]++;
            }
        }

        output.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"fuzz: {run} command cases, seed {seed} ({cases} asked, DISTTREE_FUZZ_CASES to change): exit 0 {exits[0]}, exit 1 {exits[1]}, exit 2 {exits[2]}, {failures.Count} failed, in {clock.Elapsed.TotalSeconds:0.0} s"));
        Assert.True(failures.Count == 0, string.Join("\n\n", failures));
        Assert.True(exits.All(n => n > 0), "the cases should give every exit code");
    }

    // The exit code, and null when the case passes, else what went wrong.
    private static (string? Failure, int Exit) Check(CommandFuzzCase fuzz, string folder)
    {
        var before = Prepare(fuzz, folder);
        var result = CliRunner.RunAsUser(fuzz.Args);
        var problems = new List<string>();
        if (result.ExitCode is < 0 or > 2)
        {
            problems.Add($"exit code {result.ExitCode}");
        }

        foreach (var (name, text) in new[] { ("standard output", result.Out), ("standard error", result.Error) })
        {
            if (StackFrame().IsMatch(text) || text.Contains("Exception:", StringComparison.Ordinal))
            {
                problems.Add($"a stack trace or an exception's name on {name}");
            }

            // JSON and the applied project on standard output carry the text exactly.
            if ((name == "standard error" || !fuzz.ExactToStandardOutput) && DisplayText.NeedsEscape(text.ReplaceLineEndings("")))
            {
                problems.Add($"a character that acts on {name}");
            }
        }

        var after = Hashes(folder);
        problems.AddRange(before.Where(b => !after.TryGetValue(b.Key, out var hash) || hash != b.Value).Select(b => $"{b.Key} changed or removed"));
        problems.AddRange(after.Keys.Where(f => !before.ContainsKey(f) && !IsOutput(fuzz, f)).Select(f => $"{f} left behind"));
        if (problems.Count == 0)
        {
            return (null, result.ExitCode);
        }

        return ($"{string.Join("; ", problems)}\n--- standard error ---\n{Cut(result.Error)}\n--- standard output ---\n{Cut(result.Out)}{Rethrown(fuzz, folder, result)}", result.ExitCode);
    }

    // True when the case asked for the file: by its path, or as a schedule (NAME.csv) right in a folder it named.
    private static bool IsOutput(CommandFuzzCase fuzz, string file) =>
        fuzz.Outputs.Contains(file) || (file.EndsWith(".csv", StringComparison.Ordinal)
            && fuzz.Outputs.Contains(Path.GetDirectoryName(file) + Path.DirectorySeparatorChar));

    // Writes the case's files into a fresh folder; returns the hash of each.
    private static Dictionary<string, string> Prepare(CommandFuzzCase fuzz, string folder)
    {
        if (Directory.Exists(folder))
        {
            Directory.Delete(folder, recursive: true);
        }

        foreach (var (path, text) in fuzz.Files)
        {
            var full = Path.Combine(folder, path);
            Directory.CreateDirectory(Path.GetDirectoryName(full)!);
            File.WriteAllBytes(full, Bytes(text));
        }

        return Hashes(folder);
    }

    // UTF-8, but half a surrogate pair (U+D800, from the loader fuzz test's fragments) as the three bytes it would have
    // if it were a character: bytes that no UTF-8 decoder accepts.
    private static byte[] Bytes(string text)
    {
        var bytes = Encoding.UTF8.GetBytes(text.Replace('\uD800', '\uFFFF'));
        for (var i = 0; i + 2 < bytes.Length; i++)
        {
            if (bytes[i] == 0xEF && bytes[i + 1] == 0xBF && bytes[i + 2] == 0xBF)
            {
                (bytes[i], bytes[i + 1], bytes[i + 2]) = ((byte)0xED, (byte)0xA0, (byte)0x80);
            }
        }

        return bytes;
    }

    private static Dictionary<string, string> Hashes(string folder) =>
        Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .ToDictionary(f => f, f => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(f))), StringComparer.Ordinal);

    // For an internal error, the exception with its stack trace: the case run again with it thrown on.
    private static string Rethrown(CommandFuzzCase fuzz, string folder, CliResult result)
    {
        if (result.ExitCode != 3)
        {
            return "";
        }

        Prepare(fuzz, folder);
        try
        {
            CliRunner.Run(fuzz.Args);
            return "";
        }
#pragma warning disable CA1031 // any exception is what is reported
        catch (Exception e)
#pragma warning restore CA1031
        {
            return $"\n--- the exception ---\n{e}";
        }
    }

    private static string Cut(string text) => DisplayText.Escape(text.Length <= 2000 ? text : text[..2000] + "…").Replace("\\u000A", "\n", StringComparison.Ordinal);

    private static int Setting(string name, int fallback) =>
        int.TryParse(Environment.GetEnvironmentVariable(name), NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n > 0 ? n : fallback;

    // A frame of a .NET stack trace: "   at Namespace.Type.Method(...)".
    [GeneratedRegex(@"^\s+at \S+\(.*\)", RegexOptions.Multiline)]
    private static partial Regex StackFrame();
}
