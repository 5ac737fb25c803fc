using System.Globalization;
using System.Text;
using FsCheck;
using FsCheck.Fluent;

namespace DistTree.Tests.Solving;

/// <summary>
/// Random small projects with every connection kind of the phase frame (issue 17), for the property tests that hold
/// the percent sum, the load flow and the nodal reference together (<see cref="PhaseFramePropertyTests"/>): a service
/// of any of 208Y/120, 480Y/277, 120/240, 240D and 480D, stiff or behind the utility's fault current and X/R; units
/// each of a panel, fed by a feeder or standing at its source, optionally behind a transformer (three-phase Dyn1 to
/// 208Y/120 from a 480 V or 240 V primary; single-phase across AB, BC or CA, or by default, to 120/240, 240 or 120)
/// with any tap from −5 to +5 %; feeders of one or two sets, copper or aluminium, in any raceway, with a neutral the
/// size of the lines or smaller; 1-, 2- and 3-pole branch circuits as the panel's system allows, on stated lines, by
/// circuit number or balanced by the panel, with constant-power, -current or -impedance loads given as va, kva, kw or
/// amps, at the end of the run or along it (points). Demand factors are 1 (the reference takes no other). The loads
/// are multiplied by a scale when written (see <see cref="ToYaml"/>), so a tree can be made lightly loaded.
/// </summary>
/// <param name="System">The service's system (an index).</param>
/// <param name="Fault">The utility's fault level at the service, or null for a stiff source.</param>
/// <param name="EstimatedTemperature">Conductor temperatures estimated from the currents, else at their rating.</param>
/// <param name="LoadingPercent">How heavily a test loads the tree, in percent of the drop it allows (see the tests).</param>
/// <param name="Units">The panels, each with what feeds it.</param>
internal sealed record PhaseFrameTree(int System, FaultLevel? Fault, bool EstimatedTemperature, int LoadingPercent, FrameUnit[] Units)
{
    // The sizes the runs take, smallest first (an index into this list; a reduced neutral is a few places lower).
    private static readonly string[] Sizes =
        ["12 AWG", "10 AWG", "8 AWG", "6 AWG", "4 AWG", "3 AWG", "2 AWG", "1 AWG", "1/0 AWG", "2/0 AWG", "3/0 AWG", "4/0 AWG", "250 kcmil", "300 kcmil"];

    private static readonly string[] Services = ["208Y/120", "480Y/277", "120/240", "240D", "480D", "600Y/347"];
    private static readonly string[] SinglePhaseSecondaries = ["120/240", "240", "120"];
    private static readonly string[] TransformerPhases = ["", "AB", "BC", "CA"];
    private static readonly string[] Materials = ["cu", "al"];
    private static readonly string[] Raceways = ["pvc", "aluminum", "steel"];
    private static readonly string[] Models = ["power", "current", "impedance"];
    private static readonly double[] ThreePhaseKva = [30, 45, 75, 112.5, 150];
    private static readonly double[] SinglePhaseKva = [10, 15, 25, 37.5, 50];

    public static Arbitrary<PhaseFrameTree> Arbitrary => Arb.From(Generator);

    private static Gen<PhaseFrameTree> Generator =>
        from system in Gen.Choose(0, Services.Length - 1)
        from withFault in Gen.Elements(false, true)
        from ka in Gen.Choose(5, 60)
        from xr in Gen.Choose(10, 120)
        from estimated in Gen.Elements(false, true)
        from loading in Gen.Choose(20, 100)
        from count in Gen.Choose(1, 5)
        from units in Gen.ListOf(UnitGen, count)
        select new PhaseFrameTree(system, withFault ? new FaultLevel(ka, xr / 10.0) : null, estimated, loading, [.. units]);

    private static Gen<FrameUnit> UnitGen =>
        from parent in Gen.Choose(0, 5)
        from hasTransformer in Gen.Elements(false, false, true)
        from transformer in TransformerGen
        from hasFeeder in Gen.Elements(true, true, true, false)
        from feeder in RunGen(3, 80, 3, Sizes.Length - 1)
        from hasSecondaryFeeder in Gen.Elements(false, true)
        from secondaryFeeder in RunGen(3, 30, 5, Sizes.Length - 1)
        from circuitCount in Gen.Choose(1, 4)
        from circuits in Gen.ListOf(CircuitGen, circuitCount)
        select new FrameUnit(parent, hasTransformer ? transformer : null, hasFeeder ? feeder : null, hasSecondaryFeeder ? secondaryFeeder : null, [.. circuits]);

    private static Gen<FrameTransformer> TransformerGen =>
        from threePhase in Gen.Elements(false, true)
        from secondary in Gen.Choose(0, SinglePhaseSecondaries.Length - 1)
        from phase in Gen.Choose(0, TransformerPhases.Length - 1)
        from rating in Gen.Choose(0, 4)
        from impedance in Gen.Choose(15, 60)
        from xr in Gen.Choose(8, 60)
        from tapSteps in Gen.Choose(-2, 2)
        from deltaPrimary in Gen.Elements(false, true)
        select new FrameTransformer(threePhase, secondary, phase, rating, impedance / 10.0, xr / 10.0, tapSteps * 2.5, deltaPrimary);

    // A run: length in metres, its size's index, a neutral 0 (the lines' size) or 1 to 3 sizes smaller, one or two sets.
    private static Gen<FrameRun> RunGen(int shortestM, int longestM, int smallest, int largest) =>
        from length in Gen.Choose(shortestM, longestM)
        from size in Gen.Choose(smallest, largest)
        from neutralStepsDown in Gen.Elements(0, 0, 1, 2, 3)
        from sets in Gen.Elements(1, 1, 1, 2)
        from material in Gen.Choose(0, Materials.Length - 1)
        from raceway in Gen.Choose(0, Raceways.Length - 1)
        select new FrameRun(length, size, neutralStepsDown, sets, material, raceway);

    private static Gen<FrameCircuit> CircuitGen =>
        from poles in Gen.Choose(0, 2)
        from lines in Gen.Choose(0, 2)
        from naming in Gen.Elements(CircuitNaming.Stated, CircuitNaming.Numbered, CircuitNaming.Balanced)
        from run in RunGen(3, 60, 0, 4)
        from pointCount in Gen.Elements(1, 1, 1, 2, 3, 5)
        from loads in Gen.ListOf(LoadGen, pointCount)
        from atPercent in Gen.ListOf(Gen.Choose(10, 100), pointCount)
        select new FrameCircuit(poles, lines, naming, run with { Sets = 1 }, [.. loads], [.. atPercent.Order()]);

    private static Gen<FrameLoad> LoadGen =>
        from quantity in Gen.Choose(0, 3)
        from va in Gen.Choose(50, 2000)
        from pf in Gen.Choose(70, 100)
        from model in Gen.Choose(0, Models.Length - 1)
        select new FrameLoad(quantity, va, pf / 100.0, model);

    /// <summary>
    /// The project file (metric), every load multiplied by <paramref name="loadScale"/>; <paramref name="rules"/> is
    /// added to the rules mapping (the conductor temperature is the tree's own).
    /// </summary>
    public string ToYaml(double loadScale = 1.0, string rules = "")
    {
        var b = new StringBuilder();
        b.AppendLine("disttree: 1");
        b.AppendLine("project: { name: Random phase frame, units: metric }");
        b.AppendLine(Inv($"rules: {{ conductor_temperature: {(EstimatedTemperature ? "estimated" : "rated")}{(rules.Length > 0 ? ", " + rules : "")} }}"));
        var fault = Fault is { } f ? Inv($", available_fault_current_ka: {f.Ka}, fault_x_r: {f.XOverR}") : "";
        b.AppendLine($"service: {{ id: SVC, system: {Services[System]}{fault} }}");
        b.AppendLine("equipment:");
        var systems = new string[Units.Length];
        for (var i = 0; i < Units.Length; i++)
        {
            var unit = Units[i];
            var parent = unit.Parent % (i + 1) - 1;
            var (from, primary) = parent < 0 ? ("SVC", Services[System]) : ($"P{parent}", systems[parent]);
            var panelFrom = from;
            var panelFeeder = unit.Feeder;
            if (unit.Transformer is { } t && IsThreePhase(primary))
            {
                var threePhase = t.ThreePhase && LineToLineV(primary) != 208;
                var secondary = threePhase ? "208Y/120" : SinglePhaseSecondaries[t.Secondary];
                b.AppendLine($"  - id: T{i}");
                b.AppendLine("    kind: transformer");
                b.AppendLine($"    from: {from}");
                // A delta primary on a bus of its line-to-line voltage: its feeder carries three lines and no neutral.
                var carried = t.DeltaPrimary && DeltaOf(primary) is { } delta ? delta : primary;
                if (t.DeltaPrimary)
                {
                    b.AppendLine($"    primary: \"{carried}\"");
                }

                AppendRun(b, "feeder", unit.Feeder, carried);
                b.AppendLine(Inv($"    kva: {(threePhase ? ThreePhaseKva : SinglePhaseKva)[t.Rating]}"));
                b.AppendLine($"    secondary: \"{secondary}\"");
                b.AppendLine(Inv($"    impedance_percent: {t.ImpedancePercent}"));
                b.AppendLine(Inv($"    x_r: {t.XOverR}"));
                b.AppendLine(Inv($"    tap_percent: {t.TapPercent}"));
                if (!threePhase && TransformerPhases[t.Phase].Length > 0)
                {
                    b.AppendLine($"    phase: {TransformerPhases[t.Phase]}");
                }

                (panelFrom, panelFeeder, systems[i]) = ($"T{i}", unit.SecondaryFeeder, secondary);
            }
            else
            {
                systems[i] = primary;
            }

            b.AppendLine($"  - id: P{i}");
            b.AppendLine("    kind: panelboard");
            b.AppendLine($"    from: {panelFrom}");
            AppendRun(b, "feeder", panelFeeder, systems[i]);
            b.AppendLine("    circuits:");
            AppendCircuits(b, unit.Circuits, systems[i], loadScale);
        }

        return b.ToString();
    }

    private static void AppendCircuits(StringBuilder b, FrameCircuit[] circuits, string system, double loadScale)
    {
        var number = 1;
        for (var c = 0; c < circuits.Length; c++)
        {
            var circuit = circuits[c];
            var allowed = Poles(system);
            var poles = allowed[circuit.Poles % allowed.Length];
            var stated = StatedLines(system, poles);
            var (id, phase) = circuit.Naming switch
            {
                CircuitNaming.Stated when stated.Length > 0 => ($"s{c}", $", phase: {stated[circuit.Lines % stated.Length]}"),
                CircuitNaming.Numbered => (number.ToString(CultureInfo.InvariantCulture), ""),
                CircuitNaming.Stated or CircuitNaming.Balanced => ($"b{c}", ""),
            };
            number += 2 * (poles + circuit.Lines);
            var run = circuit.Run;
            var neutral = poles == 1 && run.NeutralStepsDown > 0 ? $", neutral_size: {Sizes[Math.Max(0, run.Size - run.NeutralStepsDown)]}" : "";
            var runText = Inv($"{{ length: {run.LengthM}, size: {Sizes[run.Size]}{neutral}, material: {Materials[run.Material]}, raceway: {Raceways[run.Raceway]} }}");
            var v = poles == 1 ? LineToNeutralV(system) : LineToLineV(system) * (poles == 3 ? Math.Sqrt(3) : 1);
            string loads;
            if (circuit.Loads.Length == 1 && circuit.AtPercent[0] > 60)
            {
                loads = "load: " + LoadText(circuit.Loads[0], loadScale, v);
            }
            else
            {
                var points = circuit.Loads.Select((l, k) => Inv($"{{ at: {Math.Max(1, run.LengthM * circuit.AtPercent[k] / 100)}, load: {LoadText(l, loadScale, v)} }}"));
                loads = $"points: [ {string.Join(", ", points)} ]";
            }

            b.AppendLine($"      - {{ id: \"{id}\", poles: {poles}{phase}, {loads}, run: {runText} }}");
        }
    }

    // The load as one of its quantities: va, kva, kw (from the power factor) or amps (at the circuit's voltage v,
    // √3·V_LL for 3 poles), with its model.
    private static string LoadText(FrameLoad load, double scale, double v)
    {
        var va = load.Va * scale;
        var quantity = load.Quantity switch
        {
            0 => Inv($"va: {va:R}"),
            1 => Inv($"kva: {va / 1000:R}"),
            2 => Inv($"kw: {va * load.PowerFactor / 1000:R}"),
            _ => Inv($"amps: {va / v:R}"),
        };
        return Inv($"{{ {quantity}, pf: {load.PowerFactor}, model: {Models[load.Model]} }}");
    }

    // A feeder on a bus of system: with its neutral smaller where the system has a neutral and the tree says so.
    private static void AppendRun(StringBuilder b, string key, FrameRun? run, string system)
    {
        if (run is null)
        {
            return;
        }

        var neutral = HasNeutral(system) && run.NeutralStepsDown > 0 ? $", neutral_size: {Sizes[Math.Max(0, run.Size - run.NeutralStepsDown)]}" : "";
        b.AppendLine(Inv($"    {key}: {{ length: {run.LengthM}, size: {Sizes[run.Size]}{neutral}, sets: {run.Sets}, material: {Materials[run.Material]}, raceway: {Raceways[run.Raceway]} }}"));
    }

    // What each system can give (docs/project-file.md, Circuits): 1 pole needs a neutral, 2 poles two lines, 3 poles three.
    private static int[] Poles(string system) => system switch
    {
        "208Y/120" or "480Y/277" or "600Y/347" => [1, 2, 3],
        "240D" or "480D" => [2, 3],
        "120/240" => [1, 2],
        "240" => [2],
        _ => [1],
    };

    // The lines a circuit may state (none on a two-wire system: it has one choice).
    private static string[] StatedLines(string system, int poles) => (IsThreePhase(system), system, poles) switch
    {
        (true, _, 1) => ["A", "B", "C"],
        (true, _, 2) => ["AB", "BC", "CA"],
        (true, _, _) => ["ABC"],
        (false, "120/240", 1) => ["A", "B"],
        (false, "120/240", _) => ["AB"],
        _ => [],
    };

    private static bool IsThreePhase(string system) => system is "208Y/120" or "480Y/277" or "600Y/347" or "240D" or "480D";

    private static bool HasNeutral(string system) => system is "208Y/120" or "480Y/277" or "600Y/347" or "120/240" or "120";

    // The delta primary a three-phase bus takes (docs/project-file.md, Transformers); none at 208 V.
    private static string? DeltaOf(string system) => system switch
    {
        "480Y/277" or "480D" => "480D",
        "600Y/347" => "600D",
        "240D" => "240D",
        _ => null,
    };

    private static double LineToLineV(string system) => system switch
    {
        "208Y/120" => 208,
        "480Y/277" or "480D" => 480,
        "600Y/347" => 600,
        _ => 240,
    };

    private static double LineToNeutralV(string system) => system switch
    {
        "480Y/277" => 277,
        "600Y/347" => 347,
        _ => 120,
    };

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}

/// <summary>The utility's available fault current (kA) and its X/R at the service.</summary>
internal sealed record FaultLevel(int Ka, double XOverR);

/// <summary>
/// A panel (its id P and its position) fed from the service or an earlier unit's panel (<c>Parent</c> modulo its
/// position + 1, less one: −1 the service), optionally behind a transformer (ignored on a single-phase bus), with its
/// feeder (the transformer's when there is one, on the primary) and the panel's feeder from the transformer.
/// </summary>
internal sealed record FrameUnit(int Parent, FrameTransformer? Transformer, FrameRun? Feeder, FrameRun? SecondaryFeeder, FrameCircuit[] Circuits);

/// <summary>
/// A transformer: three-phase (to 208Y/120; single-phase on a 208 V primary) or single-phase to one of 120/240, 240,
/// 120 across a stated pair of lines or by default; its rating's index, %Z, X/R and tap; whether it states a delta
/// primary (on a three-phase bus that has one of its line-to-line voltage).
/// </summary>
internal sealed record FrameTransformer(bool ThreePhase, int Secondary, int Phase, int Rating, double ImpedancePercent, double XOverR, double TapPercent, bool DeltaPrimary);

/// <summary>A run: length in metres, size index, how many sizes smaller its neutral is (0: the same), sets, material and raceway indices.</summary>
internal sealed record FrameRun(int LengthM, int Size, int NeutralStepsDown, int Sets, int Material, int Raceway);

/// <summary>
/// A branch circuit: its poles (an index into what the panel can give), its lines (an index into what it may state,
/// and a skip in the numbering), how they are chosen, its run, and its loads at percentages of the run's length (one
/// load past 60 % is written as the run's end load).
/// </summary>
internal sealed record FrameCircuit(int Poles, int Lines, CircuitNaming Naming, FrameRun Run, FrameLoad[] Loads, int[] AtPercent);

/// <summary>A load: which quantity it is written as, its apparent power (VA, before the scale), power factor and model index.</summary>
internal sealed record FrameLoad(int Quantity, int Va, double PowerFactor, int Model);

/// <summary>How a circuit's lines are chosen: stated (<c>phase</c>), by its circuit number, or balanced by the panel.</summary>
internal enum CircuitNaming
{
    Stated,
    Numbered,
    Balanced,
}
