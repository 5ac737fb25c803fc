using DistTree.Tests.ProjectFiles;
using static DistTree.Tests.ProjectFiles.ProjectLoaderFuzzTests;

namespace DistTree.Tests.Cli;

/// <summary>
/// One case of <see cref="CommandFuzzTests"/>: the files of a project (a demo project or a small one, its text
/// mutated by the loader fuzz test's mutations, or not), and a command line for it, with odd option values in some
/// cases and good ones in the others (so that most commands run to their outputs). Case <c>index</c> of seed
/// <c>seed</c> is the same whatever the number of cases run.
/// </summary>
/// <param name="Files">The files to write into the case's folder (path relative to it, text), the project's main file first.</param>
/// <param name="Args">The command line, paths absolute.</param>
/// <param name="Outputs">The full paths the command may create (the outputs it was asked for; a path ending in a separator, any new file under that folder); every other file stays as it was.</param>
/// <param name="Project">Which project, and how its text was mutated.</param>
/// <param name="ExactToStandardOutput">True when JSON (results or SARIF) or the applied project goes to standard output: each carries the text exactly (JSON escapes control characters only).</param>
internal sealed record CommandFuzzCase(
    IReadOnlyList<(string Path, string Text)> Files, string[] Args, IReadOnlySet<string> Outputs, string Project, bool ExactToStandardOutput)
{
    // Characters that act rather than show, for DisplayText to escape (the loader fuzz test's fragments have C0 and
    // separators only): escape sequences, C1, DEL, direction marks.
    private static readonly string[] Acting = ["\u001B[2J", "\u001B]0;t\u0007", "\u009B31m", "\u0085", "\u007F", "\u202E", "\u2066", "\u200F"];

    // The projects, weighted towards the small ones: the commands' work is mostly in the same code whatever the size.
    private static readonly (string Name, int Weight, (string Path, string Text)[] Files)[] Seeds = LoadSeeds();

    // Option values: good ones, and odd ones for the cases with odd options.
    private static readonly Values Counts = new(["1", "3", "20"], ["0", "-1", "2147483647", "2147483648", "-2147483649", "", "1.5", "1e3", "abc", "+5", " 7", "\u0663"]);

    private static readonly Values MaxSets = new(["1", "2", "3"], ["0", "-1", "", "abc", "2147483648", "2147483647", "41", "1.5"]);

    private static readonly Values Dates = new(["2031-04-05"], ["", "-", "\u001B[31mred\u202E", "<script>x</script> & 'q'", new string('d', 5000)]);

    private static readonly Values Numbers = new(["75", "82.5", "90", "60", "50", "30"], ["0", "-0", "-1", "1e308", "-1e308", "1e309", "nan", "Infinity", "", "1,5", "abc", "4.9e-324", "-273.15", "1e6"]);

    private static readonly Values Materials = new(["cu", "al"], ["CU", "", "steel"]);

    private static readonly Values Raceways = new(["pvc", "steel", "aluminum"], ["", "x"]);

    private static readonly string[] Revisions = ["HEAD", "", "-x", "--output=x", "HEAD~1", "a\u001Bb"];

    /// <summary>The case <paramref name="index"/> of <paramref name="seed"/>, its paths in <paramref name="folder"/>.</summary>
    public static CommandFuzzCase Make(int seed, int index, string folder)
    {
        var rng = new Random(unchecked((seed * 1_000_003) + index));
        var (name, _, files) = Pick(rng);
        var texts = files.ToList();
        var odd = rng.Next(100) < 35;
        var command = rng.Next(odd ? 100 : 95);
        var project = Mutate(rng, name, texts, rng.Next(texts.Count), OddNumbers);
        var main = Path.Combine(folder, texts[0].Path);
        var builder = new ArgsBuilder(rng, odd, folder, main, texts.Skip(1).Select(f => Path.Combine(folder, f.Path)).ToArray());
        var args = builder.Command(command);
        if (odd && rng.Next(10) == 0 && args.Length > 1)
        {
            // Options in another order (an option may lose its value).
            rng.Shuffle(args.AsSpan(1));
        }

        if (builder.Old is { } old)
        {
            // compare's old revision: the project as it was, or mutated otherwise; beside it, so it includes the same files.
            var olds = new List<(string Path, string Text)> { (old, files[0].Text) };
            project += $"; old: {Mutate(rng, "the same", olds, 0, OddNumbers)}";
            texts.Add(olds[0]);
        }

        return new CommandFuzzCase(texts, args, builder.Outputs, project, builder.ExactToStandardOutput);
    }

    /// <summary>The case's command line as one line to read.</summary>
    public override string ToString() =>
        $"{Project}: disttree {string.Join(' ', Args.Select(a => a.Length == 0 || a.Contains(' ', StringComparison.Ordinal) ? $"'{a}'" : a))}";

    private static (string Name, int Weight, (string Path, string Text)[] Files) Pick(Random rng)
    {
        var roll = rng.Next(Seeds.Sum(s => s.Weight));
        foreach (var seed in Seeds)
        {
            if ((roll -= seed.Weight) < 0)
            {
                return seed;
            }
        }

        return Seeds[^1];
    }

    // One to three mutations of the file at index `at`, in a little under half the cases.
    private static string Mutate(Random rng, string name, List<(string Path, string Text)> texts, int at, string[] numbers)
    {
        if (rng.Next(100) >= 45)
        {
            return name;
        }

        var mutations = Enumerable.Range(0, 1 + rng.Next(3)).Select(_ => Mutation(rng, numbers)).ToArray();
        var fuzz = new FuzzCase(0, mutations);
        var (path, text) = texts[at];
        var lines = text.ReplaceLineEndings("\n").Split('\n');
        var mutated = fuzz.Apply(lines);

        // The lines the mutations made (the first few), to see the case without running it.
        var made = mutated.Split('\n').Except(lines, StringComparer.Ordinal).Take(4).Select(l => $"'{(l.Length > 80 ? l[..80] + "..." : l)}'");
        texts[at] = (path, mutated);
        return $"{name} ({path}: {fuzz}; lines made: {string.Join(", ", made)})";
    }

    private static Mutation Mutation(Random rng, string[] numbers)
    {
        var kind = (MutationKind)rng.Next(6);
        var payload = kind switch
        {
            MutationKind.OddNumber => Element(rng, numbers),
            MutationKind.InsertCharacters => rng.Next(4) == 0
                ? Element(rng, Acting)
                : string.Concat(Enumerable.Range(0, 1 + rng.Next(3)).Select(_ => Element(rng, Fragments))),
            _ => "",
        };
        return new Mutation(kind, rng.Next(100_001), rng.Next(100_001), payload);
    }

    private static T Element<T>(Random rng, T[] items) => items[rng.Next(items.Length)];

    private static (string, int, (string, string)[])[] LoadSeeds()
    {
        static string Demo(string path) => File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "projects", path));
        var longRun = ProjectText.Minimal(circuit: "poles: 1\n        ocpd: 20\n        load: { va: 1500 }\n        run: { length: 150, size: 14 AWG }");
        return
        [
            ("minimal", 20, [("minimal.yaml", ProjectText.Minimal())]),
            ("minimal, over its limits", 20, [("long.yaml", longRun)]),
            ("minimal imperial", 10, [("imperial.yaml", ProjectText.Minimal(units: "imperial", system: "480Y/277"))]),
            ("small-office", 20, [("small-office.yaml", Demo("small-office.yaml"))]),
            ("riverside-clinic-metric", 10, [("riverside-clinic-metric.yaml", Demo("riverside-clinic-metric.yaml"))]),
            ("campus", 15,
            [
                ("campus.yaml", Demo("campus/campus.yaml")),
                ("buildings/north-hall.yaml", Demo("campus/buildings/north-hall.yaml")),
                ("buildings/south-lab.yaml", Demo("campus/buildings/south-lab.yaml")),
            ]),
            ("quillfeather-medical", 3, [("quillfeather-medical.yaml", Demo("quillfeather-medical.yaml"))]),
        ];
    }

    // An option's good values, and odd ones.
    private sealed record Values(string[] Good, string[] Odd);

    // The command line: a command, its file arguments and its options; odd values among the good ones when odd.
    private sealed class ArgsBuilder(Random rng, bool odd, string folder, string main, string[] included)
    {
        private readonly List<string> _args = [];
        private readonly List<string> _outputs = [];

        public HashSet<string> Outputs { get; } = new(StringComparer.Ordinal);

        public bool ExactToStandardOutput { get; private set; }

        /// <summary>The name of compare's old revision in the case's folder, when the command compares two files.</summary>
        public string? Old { get; private set; }

        /// <summary>True when <see cref="Command"/> makes an upsize command of <paramref name="roll"/>.</summary>
        public static bool IsUpsize(int roll) => roll is >= 50 and < 70;

        /// <summary>The command line: <paramref name="roll"/> (0 to 99, 95 and up for junk) chooses the command.</summary>
        public string[] Command(int roll)
        {
            switch (roll)
            {
                case < 25:
                    _args.AddRange(["analyze", File()]);
                    Maybe(0.4, "--json", () => OutputPath("json", exact: true));
                    Maybe(0.3, "--html", () => OutputPath("html"));
                    Maybe(0.15, "--date", () => Value(Dates));
                    Maybe(0.3, "--sarif", () => OutputPath("sarif", exact: true));
                    Maybe(0.3, "--worst", () => Value(Counts));
                    Maybe(0.15, "--schedules", SchedulesFolder);
                    break;
                case < 40:
                    _args.AddRange(["check", File()]);
                    Maybe(0.5, "--sarif", () => OutputPath("sarif", exact: true));
                    break;
                case < 50:
                    _args.AddRange(["validate", File()]);
                    break;
                case < 70:
                    _args.AddRange(["upsize", File()]);
                    Maybe(0.3, "--json", () => OutputPath("json", exact: true));
                    Maybe(0.25, "--html", () => OutputPath("html"));
                    Maybe(0.1, "--date", () => Value(Dates));
                    Maybe(0.35, "--apply", () => OutputPath("yaml", exact: true));
                    Maybe(0.3, "--max-sets", () => Value(MaxSets));
                    break;
                case < 90:
                    Compare();
                    break;
                case < 95:
                    _args.Add("conductors");
                    Maybe(0.3, "--material", () => Value(Materials));
                    Maybe(0.3, "--raceway", () => Value(Raceways));
                    Maybe(0.3, "--temperature", () => Value(Numbers));
                    Maybe(0.3, "--frequency", () => Value(Numbers));
                    Maybe(0.3, "--ambient", () => Value(Numbers));
                    Maybe(0.3, "--json", null);
                    break;
                default:
                    _args.AddRange(Element<string[]>(rng, [[], ["--help"], ["--version"], ["analyse", main], ["analyze"], ["analyze", main, "--jsn", "x"], ["check", main, "--sarif"], ["validate", main, main], ["-x"]]));
                    break;
            }

            return [.. _args];
        }

        private void Compare()
        {
            _args.Add("compare");
            var other = Path.Combine(folder, "old.yaml");
            var form = odd ? rng.Next(100) : 100;
            if (form < 3)
            {
                // Spawns git (the case's folder is in no checkout): rare, as it is slow.
                _args.AddRange([File(), "--against", Element(rng, Revisions)]);
            }
            else if (form < 15)
            {
                _args.AddRange(Element<string[]>(rng, [[main], [main, main, main], [main, other, "--against", "HEAD"], [main, main]]));
            }
            else
            {
                Old = Path.GetFileName(other);
                _args.AddRange(rng.Next(2) == 0 ? [other, File()] : [File(), other]);
            }

            Maybe(0.3, "--json", () => OutputPath("json", exact: true, other));
            Maybe(0.3, "--markdown", () => OutputPath("md", exact: false, other));
            Maybe(0.2, "--html", () => OutputPath("html", exact: false, other));
            Maybe(0.1, "--date", () => Value(Dates));
            Maybe(0.3, "--rows", () => Value(Counts));
        }

        private string Value(Values values) => odd && rng.Next(2) == 0 ? Element(rng, values.Odd) : Element(rng, values.Good);

        // The project's main file, or in a case with odd options now and then a path that is no project file.
        private string File() => (odd ? rng.Next(100) : 0) switch
        {
            < 75 => main,
            < 80 => Path.Combine(folder, "missing.yaml"),
            < 84 => folder,
            < 87 => "",
            < 90 => "-",
            < 93 => "/dev/null",
            < 96 => Path.Combine(folder, "no\u001B[2Jne.yaml"),
            _ => included.Length > 0 ? included[0] : main, // an included file as a project: it has no service
        };

        // Where an output goes: '-', a new file, or in a case with odd options a path that must be refused or is odd.
        private string OutputPath(string extension, bool exact = false, string? secondInput = null)
        {
            var roll = rng.Next(odd ? 100 : 55);
            if (roll < 25)
            {
                ExactToStandardOutput |= exact;
                return "-";
            }

            var path = roll switch
            {
                < 55 => Path.Combine(folder, $"out-{_outputs.Count}.{extension}"),
                < 62 => Path.Combine(folder, "missing", "deeper", $"out.{extension}"),
                < 70 => main, // an input: refused
                < 74 => secondInput ?? main,
                < 78 => folder, // a folder
                < 82 => Path.Combine(main, $"x.{extension}"), // under a file
                < 86 => Path.Combine(folder, $"o u\u001Bt \u2713.{extension}"),
                < 88 => Path.Combine(folder, new string('x', 300)),
                < 90 => "", // empty: refused
                < 91 => Path.Combine(folder, $"nul\0.{extension}"),
                < 93 => System.IO.File.Exists(Path.Combine(folder, "buildings", "north-hall.yaml")) ? Path.Combine(folder, "buildings", "north-hall.yaml") : main, // an included file: refused
                _ => _outputs.Count > 0 ? _outputs[^1] : main, // two outputs to one path
            };
            _outputs.Add(path);
            if (path.Length > 0 && !path.Contains('\0', StringComparison.Ordinal))
            {
                Outputs.Add(Path.GetFullPath(path));
            }
            return path;
        }

        // The folder --schedules writes into: a new one, or in a case with odd options one that must be refused or is odd.
        // Every file under it may be an output (an entry ending in a separator in Outputs).
        private string SchedulesFolder()
        {
            var path = (odd ? rng.Next(100) : 0) switch
            {
                < 60 => Path.Combine(folder, "schedules"),
                < 68 => folder, // the case's own folder: the schedules land beside the project
                < 76 => main, // a file: refused
                < 82 => "-", // refused
                < 88 => "", // refused
                < 94 => Path.Combine(folder, "s c\u001Bh \u2713"),
                _ => Path.Combine(main, "under"), // under a file
            };
            if (path.Length > 0 && path != "-")
            {
                Outputs.Add(Path.GetFullPath(path).TrimEnd(Path.DirectorySeparatorChar) + Path.DirectorySeparatorChar);
            }

            return path;
        }

        // The option with a value, at probability p; in a case with odd options now and then without its value, or twice.
        private void Maybe(double p, string option, Func<string>? value)
        {
            if (rng.NextDouble() >= p)
            {
                return;
            }

            _args.Add(option);
            if (value is not null && (!odd || rng.Next(30) != 0))
            {
                _args.Add(value());
            }

            if (odd && rng.Next(30) == 0)
            {
                _args.Add(option);
            }
        }
    }
}
