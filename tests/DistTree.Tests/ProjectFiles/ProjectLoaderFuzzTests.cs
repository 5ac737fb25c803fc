using System.Globalization;
using System.Text.RegularExpressions;
using DistTree.Diagnostics;
using DistTree.Reports;
using FsCheck;
using FsCheck.Fluent;
using Xunit.Abstractions;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// Fuzzing the loader: valid projects mutated (lines deleted, duplicated, swapped; numbers changed to odd
/// values; random characters inserted; the text truncated) either load, and then build, solve and render
/// without an exception, or fail with a <see cref="ProjectException"/> whose every diagnostic names a
/// line and a column of 1 or more. Never any other exception.
/// CI runs <see cref="DefaultCases"/> cases; set DISTTREE_FUZZ_CASES for more.
/// </summary>
public sealed partial class ProjectLoaderFuzzTests(ITestOutputHelper output)
{
    private const int DefaultCases = 2000;

    /// <summary>Odd values for a number (also used by CommandFuzzTests).</summary>
    internal static readonly string[] OddNumbers =
    [
        "0", "-0", "-1", "1e309", "-1e309", ".nan", ".NaN", ".inf", "-.inf", "+.Inf", "1e-320", "4.9e-324",
        "1.7976931348623157e308", "99999999999999999999", "2147483648", "-2147483649", "0x1F", "0o17", "0b101",
        "1_000", "+5", "1e", "0.", ".5", "NaN", "Infinity", "", "~", "null", "true", "'5'", "\"7\"", "1e300", "1e-300",
    ];

    /// <summary>YAML's indicators, white space of every kind, controls, a lone surrogate, a byte-order mark, an emoji (also used by CommandFuzzTests).</summary>
    internal static readonly string[] Fragments =
    [
        "[", "]", "{", "}", ":", ": ", ",", "- ", "?", "&a ", "*a", "!", "!!str ", "!!int ", "|", ">", "'", "\"", "%", "@",
        "`", "#", "\t", "\n", "\r", "\r\n", " ", "  ", "\\", "\0", "\u0007", "\u00e9", "\u2028", "\uFEFF", "\uD800",
        "\U0001F600", "---", "...", "<<: ", "x: ", "id: ", "1", "-", ".", "e9",
    ];

    /// <summary>The seed texts, split into lines (also mutated by FastYamlReaderTests).</summary>
    internal static readonly string[][] Seeds = LoadSeeds();

    [Fact]
    public void Parse_MutatedProjects_LoadOrFailWithLocatedErrorsOnly()
    {
        var cases = Cases();
        var counts = new int[3];
        var property = Prop.ForAll(Arb.From(CaseGen), fuzz =>
        {
            var outcome = Run(fuzz.Apply(Seeds[fuzz.Seed % Seeds.Length]));
            counts[(int)outcome]++;
            return outcome != Outcome.Broken;
        });

        Check.One(Config.QuickThrowOnFailure.WithMaxTest(cases).WithQuietOnSuccess(true), property);

        output.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"fuzz: {counts.Sum()} cases ({cases} asked, DISTTREE_FUZZ_CASES to change): {counts[(int)Outcome.Loaded]} loaded and solved, {counts[(int)Outcome.Refused]} refused with located errors"));
        Assert.Equal(cases, counts.Sum());
        Assert.True(counts[(int)Outcome.Loaded] > 0 && counts[(int)Outcome.Refused] > 0, "the mutations should give both outcomes");
    }

    private static int Cases() =>
        int.TryParse(Environment.GetEnvironmentVariable("DISTTREE_FUZZ_CASES"), NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n > 0
            ? n
            : DefaultCases;

    private static Outcome Run(string text)
    {
        try
        {
            var solution = Analysis.Parse(text, "fuzz.yaml").Solution;
            _ = JsonResults.Write(solution);
            ConsoleReport.WriteAnalysis(TextWriter.Null, solution, 10);
            ConsoleReport.WriteCheck(TextWriter.Null, solution);
            return Outcome.Loaded;
        }
        catch (ProjectException e)
        {
            var bad = e.Diagnostics.Where(d => d.Location.File != "fuzz.yaml" || d.Location.Line < 1 || d.Location.Column < 1).ToArray();
            Assert.True(bad.Length == 0, $"unlocated diagnostics: {string.Join("; ", bad.Select(d => d.ToString()))}\n--- input ---\n{text}");
            return Outcome.Refused;
        }
#pragma warning disable CA1031 // any other exception is the failure this test looks for
        catch (Exception e)
#pragma warning restore CA1031
        {
            Assert.Fail($"{e.GetType().Name}: {e.Message}\n{e.StackTrace}\n--- input ---\n{text}");
            return Outcome.Broken;
        }
    }

    private static Gen<Mutation> MutationGen =>
        from kind in Gen.Choose(0, 5)
        from a in Gen.Choose(0, 100_000)
        from b in Gen.Choose(0, 100_000)
        from odd in Gen.Elements(OddNumbers)
        from fragments in Gen.Choose(1, 3).SelectMany(n => Gen.ListOf(Gen.Elements(Fragments), n))
        select new Mutation((MutationKind)kind, a, b, kind == (int)MutationKind.OddNumber ? odd : string.Concat(fragments));

    /// <summary>A seed and one to four mutations of it (also used by FastYamlReaderTests).</summary>
    internal static Gen<FuzzCase> CaseGen =>
        from seed in Gen.Choose(0, 1000)
        from count in Gen.Elements(1, 1, 1, 2, 2, 3, 4)
        from mutations in Gen.ListOf(MutationGen, count)
        select new FuzzCase(seed, mutations.ToArray());

    private static string[][] LoadSeeds()
    {
        var seeds = TestPaths.ProjectFiles().Select(f => File.ReadAllText(f)).Append(ProjectText.Minimal()).Append(ProjectText.Minimal(units: "imperial", system: "480Y/277"));
        return seeds.Select(s => s.ReplaceLineEndings("\n").Split('\n')).ToArray();
    }

    [GeneratedRegex(@"-?\d+(\.\d+)?(e-?\d+)?")]
    private static partial Regex NumberPattern();

    private enum Outcome
    {
        Loaded,
        Refused,
        Broken,
    }

    internal enum MutationKind
    {
        DeleteLine,
        DuplicateLine,
        SwapLines,
        OddNumber,
        InsertCharacters,
        Truncate,
    }

    internal sealed record Mutation(MutationKind Kind, int A, int B, string Payload)
    {
        public void ApplyTo(List<string> lines)
        {
            if (lines.Count == 0)
            {
                return;
            }

            var i = A % lines.Count;
            var j = B % lines.Count;
            switch (Kind)
            {
                case MutationKind.DeleteLine:
                    lines.RemoveAt(i);
                    break;
                case MutationKind.DuplicateLine:
                    lines.Insert(j, lines[i]);
                    break;
                case MutationKind.SwapLines:
                    (lines[i], lines[j]) = (lines[j], lines[i]);
                    break;
                case MutationKind.OddNumber:
                    // The first number at or after line i, so most mutations hit one.
                    for (var k = 0; k < lines.Count; k++)
                    {
                        var at = (i + k) % lines.Count;
                        var match = NumberPattern().Match(lines[at]);
                        if (match.Success)
                        {
                            lines[at] = lines[at][..match.Index] + Payload + lines[at][(match.Index + match.Length)..];
                            return;
                        }
                    }

                    break;
                case MutationKind.InsertCharacters:
                    var column = lines[i].Length == 0 ? 0 : B % (lines[i].Length + 1);
                    lines[i] = lines[i].Insert(column, Payload);
                    break;
                default:
                    var total = lines.Sum(l => l.Length + 1);
                    var keep = (int)((long)B * total / 100_000);
                    var text = string.Join('\n', lines);
                    lines.Clear();
                    lines.AddRange(text[..Math.Min(keep, text.Length)].Split('\n'));
                    break;
            }
        }
    }

    internal sealed record FuzzCase(int Seed, Mutation[] Mutations)
    {
        public string Apply(string[] seed)
        {
            var lines = seed.ToList();
            foreach (var mutation in Mutations)
            {
                mutation.ApplyTo(lines);
            }

            return string.Join('\n', lines);
        }

        public override string ToString() => $"seed {Seed}: {string.Join(", ", Mutations.Select(m => $"{m.Kind}({m.A}, {m.B}, {Escape(m.Payload)})"))}";

        private static string Escape(string s) => string.Concat(s.Select(c => c < ' ' || c > '~' ? $"\\u{(int)c:x4}" : c.ToString()));
    }
}
