using System.Globalization;
using System.Text;
using DistTree.Conductors;
using FsCheck;
using FsCheck.Fluent;

namespace DistTree.Tests.Solving;

/// <summary>Random small distribution trees for property tests, rendered as project files.</summary>
internal sealed record RandomTree(IReadOnlyList<RandomPanel> Panels)
{
    public static readonly ConductorSize[] Ladder = ConductorSize.InSeries(SizeSeries.NorthAmerican).ToArray();

    public static Arbitrary<RandomTree> Arbitrary => Arb.From(Generator);

    private static Gen<RandomTree> Generator =>
        from count in Gen.Choose(1, 5)
        from panels in Gen.ListOf(PanelGen, count)
        select Fix(panels.ToList());

    private static Gen<RandomPanel> PanelGen =>
        from parent in Gen.Choose(0, 4)
        from feederLength in Gen.Choose(3, 80)
        from feederSize in Gen.Choose(8, 20)
        from demand in Gen.Elements(1.0, 1.0, 0.8)
        from circuitCount in Gen.Choose(1, 3)
        from circuits in Gen.ListOf(CircuitGen, circuitCount)
        select new RandomPanel(parent, feederLength, feederSize, demand, circuits.ToArray());

    private static Gen<RandomCircuit> CircuitGen =>
        from poles in Gen.Elements(1, 1, 2, 3)
        from va in Gen.Choose(100, 3000)
        from pf in Gen.Choose(70, 100)
        from length in Gen.Choose(3, 60)
        from size in Gen.Choose(1, 8)
        select new RandomCircuit(poles, va, pf / 100.0, length, size);

    // Each panel's parent must come before it: panel i is fed from panel (parent mod i), or the service for i = 0.
    private static RandomTree Fix(List<RandomPanel> panels) =>
        new(panels.Select((p, i) => p with { Parent = i == 0 ? -1 : p.Parent % i }).ToArray());

    /// <summary>The project file; lengths are bare numbers in <paramref name="units"/>, scaled by <paramref name="lengthScale"/>.</summary>
    public string ToYaml(string units = "metric", double lengthScale = 1.0, string rules = "conductor_temperature: rated", int bumpRun = -1)
    {
        var b = new StringBuilder();
        b.AppendLine("disttree: 1");
        b.AppendLine($"project: {{ name: Random, units: {units} }}");
        b.AppendLine($"rules: {{ {rules} }}");
        b.AppendLine("service: { id: SVC, system: 208Y/120, frequency_hz: 60 }");
        b.AppendLine("equipment:");
        var run = 0;
        for (var i = 0; i < Panels.Count; i++)
        {
            var p = Panels[i];
            var feederSize = Ladder[p.FeederSize + (bumpRun == run++ ? 1 : 0)];
            b.AppendLine($"  - id: P{i}");
            b.AppendLine("    kind: panelboard");
            b.AppendLine($"    from: {(p.Parent < 0 ? "SVC" : $"P{p.Parent}")}");
            b.AppendLine(Inv($"    demand_factor: {p.DemandFactor}"));
            b.AppendLine(Inv($"    feeder: {{ length: {p.FeederLength * lengthScale}, size: {feederSize.Text} }}"));
            b.AppendLine("    circuits:");
            for (var c = 0; c < p.Circuits.Length; c++)
            {
                var k = p.Circuits[c];
                var size = Ladder[k.Size + (bumpRun == run++ ? 1 : 0)];
                b.AppendLine(Inv($"      - {{ id: \"{c + 1}\", poles: {k.Poles}, load: {{ va: {k.Va}, pf: {k.PowerFactor} }}, run: {{ length: {k.Length * lengthScale}, size: {size.Text} }} }}"));
            }
        }

        return b.ToString();
    }

    /// <summary>How many runs (feeders and branch circuits) the tree has.</summary>
    public int RunCount => Panels.Sum(p => 1 + p.Circuits.Length);

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}

internal sealed record RandomPanel(int Parent, int FeederLength, int FeederSize, double DemandFactor, RandomCircuit[] Circuits);

internal sealed record RandomCircuit(int Poles, int Va, double PowerFactor, int Length, int Size);
