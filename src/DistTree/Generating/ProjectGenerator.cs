using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.ProjectFiles.Writing;
using DistTree.Solving;

namespace DistTree.Generating;

/// <summary>
/// Writes an invented, valid project (format 1) of a campus with a given number of end points, for
/// benchmarks and trials: a service and main switchboard, levels of distribution switchboards, and under
/// them groups of a 480Y/277 panelboard (277 V lighting, motors, HVAC) and a 480Y/277 to 208Y/120
/// transformer feeding a 208Y/120 panelboard (receptacles, 120 V lighting, small HVAC and motors).
/// Runs are sized as a designer would (device above the design current, conductor the device may protect,
/// larger for drop), except that about 3 % of branch circuits are made too long on purpose, so that an
/// analysis has findings to show. The same settings always give the same text: the generator uses its own
/// <see cref="SplitMix64"/>, never <see cref="Random"/>. The generator invents and sizes the equipment and circuits
/// (<see cref="PlannedEquipment"/>, <see cref="PlannedCircuit"/>); <see cref="GeneratedProjectWriter"/> writes the file.
/// </summary>
public static class ProjectGenerator
{
    /// <summary>The most end points a project may be generated with.</summary>
    public const int MaxEndPoints = 10_000_000;

    /// <summary>The most levels of switchboards (the main switchboard is level 1).</summary>
    public const int MaxDepth = 8;

    /// <summary>The share of branch circuits made too long on purpose.</summary>
    public const double FailingShare = 0.03;

    private const int CircuitsPerGroup = 72;
    private const double TotalTargetPercent = 4.5;
    private const Raceway Indoor = Raceway.Steel;
    private const double ServiceSectionA = 4000;

    // A feeder's design current over its balanced one: the allowance for the lines' imbalance (common practice).
    private const double LineImbalanceAllowance = 1.10;

    private static readonly ElectricalSystem High = ElectricalSystem.Find("480Y/277")!;
    private static readonly ElectricalSystem Low = ElectricalSystem.Find("208Y/120")!;
    private static readonly double[] TransformerKva = [15, 30, 45, 75, 112.5, 150, 225, 300, 500, 750, 1000];
    private static readonly double[] HighMotorHp = [1, 1.5, 2, 3, 5, 7.5, 10, 15, 20];
    private static readonly double[] LowMotorHp = [0.5, 0.75, 1, 1.5, 2, 3, 5];
    private static readonly double[] HighHvacA = [9, 14, 21, 28, 34, 48];
    private static readonly double[] LowHvacA = [8, 12, 16, 20, 24];
    private static readonly double[] LightingPf = [0.9, 0.95, 0.98];
    private static readonly double[] ReceptaclePf = [0.85, 0.9, 0.95, 1.0];
    private static readonly double[] HvacPf = [0.85, 0.88, 0.9];
    private static readonly double[] MotorPf = [0.8, 0.84, 0.86, 0.88];

    /// <summary>
    /// The project text (YAML, LF line ends) for <paramref name="endPoints"/> branch circuits under
    /// <paramref name="depth"/> levels of switchboards, from <paramref name="seed"/>.
    /// </summary>
    /// <param name="endPoints">Branch circuits to generate, 1 to <see cref="MaxEndPoints"/>.</param>
    /// <param name="depth">Levels of switchboards, 1 (the main switchboard feeds the panels) to <see cref="MaxDepth"/>.</param>
    /// <param name="seed">Any number; the same seed gives the same text.</param>
    /// <param name="progress">Told the share done, 0 to 1, now and then.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its range.</exception>
    public static string Generate(int endPoints, int depth = 3, ulong seed = 1, IProgress<double>? progress = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(endPoints, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(endPoints, MaxEndPoints);
        ArgumentOutOfRangeException.ThrowIfLessThan(depth, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(depth, MaxDepth);

        var random = new SplitMix64(seed);
        var items = Layout(endPoints, depth, random);
        progress?.Report(0.2);
        AccumulatePower(items);
        SizeFeeders(items, random);
        SizeCircuits(items);
        progress?.Report(0.4);
        return Write(items, endPoints, depth, seed, progress);
    }

    private static List<PlannedEquipment> Layout(int endPoints, int depth, SplitMix64 random)
    {
        var groups = (endPoints + CircuitsPerGroup - 1) / CircuitsPerGroup;
        var fanOut = 2;
        while (Math.Pow(fanOut, depth) < groups)
        {
            fanOut++;
        }

        var items = new List<PlannedEquipment>();
        var msb = new PlannedEquipment("MSB", PlannedKind.Board, High, null, 1);
        items.Add(msb);
        var level = new List<PlannedEquipment> { msb };
        var needed = groups;
        var counts = new int[depth + 1];
        for (var d = depth; d >= 2; d--)
        {
            needed = (needed + fanOut - 1) / fanOut;
            counts[d] = needed;
        }

        for (var d = 2; d <= depth; d++)
        {
            var next = new List<PlannedEquipment>(counts[d]);
            for (var i = 0; i < counts[d]; i++)
            {
                var parent = level[i / fanOut];
                var id = d == 2 ? $"DS{i + 1:D2}" : $"{parent.Id}-{(i % fanOut) + 1:D2}";
                var board = new PlannedEquipment(id, PlannedKind.Board, High, parent, d);
                items.Add(board);
                next.Add(board);
            }

            level = next;
        }

        for (var g = 0; g < groups; g++)
        {
            var board = level[g / fanOut];
            var count = (endPoints / groups) + (g < endPoints % groups ? 1 : 0);
            var highCount = count < 4 ? 0 : count * 2 / 5;
            var prefix = depth == 1 ? $"G{g + 1:D2}" : $"{board.Id}-{(g % fanOut) + 1:D2}";
            if (highCount > 0)
            {
                var panel = new PlannedEquipment($"{prefix}-H", PlannedKind.Panel, High, board, 0);
                items.Add(panel);
                AddCircuits(panel, highCount, random);
            }

            var transformer = new PlannedEquipment($"{prefix}-T", PlannedKind.Transformer, High, board, 0) { Secondary = Low };
            items.Add(transformer);
            var low = new PlannedEquipment($"{prefix}-L", PlannedKind.Panel, Low, transformer, 0);
            items.Add(low);
            AddCircuits(low, count - highCount, random);
        }

        return items;
    }

    private static void AddCircuits(PlannedEquipment panel, int count, SplitMix64 random)
    {
        var high = panel.System == High;
        for (var i = 1; i <= count; i++)
        {
            var roll = random.NextDouble();
            var c = high ? HighCircuit(roll, i, random) : LowCircuit(roll, i, random);
            c.Id = i;
            c.Supply = panel.System.CircuitFor(c.Poles)!.Value;
            c.Power = LoadPower.Of(c.Load, c.Supply);
            c.CurrentA = LoadPower.CurrentA(c.Power.VoltAmperes, c.Supply);
            c.Failing = random.Chance(FailingShare);
            c.FailPercent = 3.6 + (2.4 * random.NextDouble());
            panel.Circuits.Add(c);
        }
    }

    private static PlannedCircuit HighCircuit(double roll, int n, SplitMix64 r) => roll switch
    {
        < 0.55 => new PlannedCircuit($"Lighting, zone {n}", 1, LoadKind.Kw, r.Between(4, 24) / 10.0, r.Pick(LightingPf), true, 20, r.Between(40, 180)),
        < 0.75 => new PlannedCircuit($"RTU-{n} rooftop unit", 3, LoadKind.Amps, r.Pick(HighHvacA), r.Pick(HvacPf), false, 15, r.Between(50, 250)),
        _ => new PlannedCircuit(r.Chance(0.5) ? $"EF-{n} exhaust fan" : $"P-{n} pump", 3, LoadKind.Hp, r.Pick(HighMotorHp), r.Pick(MotorPf), false, 15, r.Between(30, 200)),
    };

    private static PlannedCircuit LowCircuit(double roll, int n, SplitMix64 r) => roll switch
    {
        < 0.55 => new PlannedCircuit($"Receptacles, room {100 + n}", 1, LoadKind.Va, 180 * r.Between(3, 8), r.Pick(ReceptaclePf), false, 20, r.Between(25, 150)),
        < 0.75 => new PlannedCircuit($"Lighting, area {n}", 1, LoadKind.Kw, r.Between(2, 14) / 10.0, r.Pick(LightingPf), true, 20, r.Between(30, 140)),
        < 0.9 => new PlannedCircuit($"FCU-{n} fan coil unit", 2, LoadKind.Amps, r.Pick(LowHvacA), r.Pick(HvacPf), false, 15, r.Between(30, 160)),
        _ => new PlannedCircuit($"EF-{n} exhaust fan", 3, LoadKind.Hp, r.Pick(LowMotorHp), r.Pick(MotorPf), false, 15, r.Between(20, 150)),
    };

    // Bottom-up: items are listed parents first, so a backwards pass adds each item's power to its parent's, and carries
    // its largest motor up to a transformer (the motors below one are on another system).
    private static void AccumulatePower(List<PlannedEquipment> items)
    {
        for (var i = items.Count - 1; i >= 0; i--)
        {
            var item = items[i];
            foreach (var c in item.Circuits)
            {
                item.Power += c.Power;
                if (c.Load.IsMotor)
                {
                    item.LargestMotorA = Math.Max(item.LargestMotorA, c.CurrentA);
                }
            }

            if (item.Parent is { } parent)
            {
                parent.Power += item.Power;
                if (item.Kind != PlannedKind.Transformer)
                {
                    parent.LargestMotorA = Math.Max(parent.LargestMotorA, item.LargestMotorA);
                }
            }
        }
    }

    // Top-down: each feeder sized for its load, then for a share of the drop; the estimate carried down.
    private static void SizeFeeders(List<PlannedEquipment> items, SplitMix64 random)
    {
        foreach (var item in items)
        {
            if (item.Parent is not { } parent)
            {
                continue;
            }

            var supply = parent.OutputSystem.FeederSupply;
            double designA;
            double target;
            if (item.Kind == PlannedKind.Transformer)
            {
                var kva = TransformerKva.FirstOrDefault(k => k * 1000 * 0.65 >= item.Power.VoltAmperes, TransformerKva[^1]);
                item.Kva = kva;
                item.ImpedancePercent = random.Between(45, 575) / 100.0;
                item.XOverR = random.Between(20, 60) / 10.0;
                item.LengthFt = random.Between(10, 60);
                designA = 1.25 * LoadPower.CurrentA(kva * 1000, supply);
                target = 0.3;
            }
            else if (parent.Kind == PlannedKind.Transformer)
            {
                item.LengthFt = random.Between(5, 25);
                designA = 1.25 * LoadPower.CurrentA(parent.Kva * 1000, supply);
                target = 0.3;
            }
            else
            {
                item.LengthFt = item.Kind != PlannedKind.Board ? random.Between(20, 200) : item.Level == 2 ? random.Between(100, 500) : random.Between(50, 300);
                // The most loaded line carries more than the balanced current: a designer allows 10 % for the
                // imbalance of the panels' single-phase circuits (common practice); and 25 % more of the largest motor.
                designA = (1.25 * LineImbalanceAllowance * LoadPower.CurrentA(item.Power.VoltAmperes, supply)) + (0.25 * item.LargestMotorA);
                target = item.Kind != PlannedKind.Board ? 0.75 : item.Level == 2 ? 1.0 : 0.5;
                if (item.Kind == PlannedKind.Board && designA > ServiceSectionA)
                {
                    // More than one feeder would carry: a service section of its own, standing at the service.
                    item.StandsAtSource = true;
                    item.UpstreamPercent = parent.UpstreamPercent;
                    continue;
                }
            }

            var currentA = LoadPower.CurrentA(item.Power.VoltAmperes, supply);
            item.OcpdA = RunSizer.Ocpd(designA, 30);
            var start = RunSizer.ForAmpacity(designA, item.OcpdA);
            (item.Size, item.Sets) = RunSizer.ForDrop(start, item.LengthFt, currentA, item.Power, supply, Indoor, target);
            var drop = RunSizer.DropPercent(item.Size, item.Sets, item.LengthFt, currentA, item.Power, supply, Indoor);
            item.UpstreamPercent = parent.UpstreamPercent + drop;
            if (item.Kind == PlannedKind.Transformer)
            {
                var percentR = item.ImpedancePercent / Math.Sqrt(1 + (item.XOverR * item.XOverR));
                var regulation = ((percentR * item.Power.PowerFactor) + (percentR * item.XOverR * item.Power.SinTheta)) * item.Power.VoltAmperes / (item.Kva * 1000);
                // A heavily loaded transformer is boosted by its nameplate primary tap: -2.5 % takes turns off the
                // primary, so the secondary stands 1/0.975 of its rating, about 2.56 % up.
                item.TapPercent = regulation > 1.5 ? -2.5 : 0;
                item.UpstreamPercent += regulation - TapBoostPercent(item.TapPercent);
            }
        }
    }

    /// <summary>
    /// How far a primary tap raises the secondary, percent of its rating: the turns ratio grows by 1 + tap/100, so the
    /// secondary stands 1/(1 + tap/100) of its rating (a negative tap raises it).
    /// </summary>
    internal static double TapBoostPercent(double tapPercent) => 100 * ((1 / (1 + (tapPercent / 100))) - 1);

    private static void SizeCircuits(List<PlannedEquipment> items)
    {
        foreach (var panel in items)
        {
            var budget = Math.Clamp(TotalTargetPercent - panel.UpstreamPercent, 1.0, 2.5);
            foreach (var c in panel.Circuits)
            {
                var designA = c.Continuous || c.Load.Kind == LoadKind.Hp ? 1.25 * c.CurrentA : c.CurrentA;
                c.OcpdA = RunSizer.Ocpd(designA, c.MinimumOcpdA)!.Value;
                var start = RunSizer.ForAmpacity(designA, c.OcpdA);
                if (c.Failing)
                {
                    (c.Size, c.Sets) = start;
                    var failing = RunSizer.LengthForDrop(c.Size, c.Sets, c.CurrentA, c.Power, c.Supply, Indoor, c.FailPercent);
                    c.LengthFt = Math.Clamp(Math.Ceiling(failing), c.LengthFt, 1900);
                }
                else
                {
                    (c.Size, c.Sets) = RunSizer.ForDrop(start, c.LengthFt, c.CurrentA, c.Power, c.Supply, Indoor, budget);
                }
            }
        }
    }

    private static string Write(List<PlannedEquipment> items, int endPoints, int depth, ulong seed, IProgress<double>? progress)
    {
        var writer = new GeneratedProjectWriter(endPoints * 230);
        writer.Comment($"Generated by 'disttree generate --end-points {endPoints} --depth {depth} --seed {seed}'.");
        writer.Comment("Invented: this campus, its loads and every figure below are made up and describe no real site or design.");
        writer.Comment(string.Create(CultureInfo.InvariantCulture, $"About {FailingShare * 100:0} % of branch circuits are too long on purpose, so that an analysis has findings."));
        writer.Comment("The service stands for the whole campus supply; a switchboard whose load is more than one");
        writer.Comment(string.Create(CultureInfo.InvariantCulture, $"feeder would carry (above {ServiceSectionA} A) is a service section with no feeder of its own."));
        writer.Top(
            $"Generated campus ({endPoints} end points, seed {seed})",
            UnitSystem.Imperial,
            "Invented by disttree generate for benchmarks and trials; describes no real site.",
            new ConductorDefaults(Material.Copper, RunSizer.InsulationC, Indoor),
            "SVC",
            High);
        var written = 0;
        foreach (var item in items)
        {
            WriteItem(writer, item);
            written += item.Circuits.Count;
            if (progress is not null && item.Circuits.Count > 0 && written % 5000 < item.Circuits.Count)
            {
                progress.Report(0.4 + (0.6 * written / endPoints));
            }
        }

        progress?.Report(1.0);
        return writer.ToString();
    }

    private static void WriteItem(GeneratedProjectWriter writer, PlannedEquipment item)
    {
        var kind = item.Kind switch { PlannedKind.Board => EquipmentKind.Switchboard, PlannedKind.Transformer => EquipmentKind.Transformer, PlannedKind.Panel => EquipmentKind.Panelboard };
        writer.Equipment(item.Id, kind, item.Parent?.Id ?? "SVC");
        if (item.Kind == PlannedKind.Transformer)
        {
            writer.Transformer(item.Kva, item.Secondary!, item.ImpedancePercent, item.XOverR, item.TapPercent);
        }

        if (item.Parent is not null && !item.StandsAtSource)
        {
            writer.Feeder(new WrittenRun(item.LengthFt, item.Size, item.Sets, item.OcpdA));
        }

        if (item.Circuits.Count == 0)
        {
            return;
        }

        writer.Circuits();
        foreach (var c in item.Circuits)
        {
            writer.Circuit(c.Id, c.Name, c.Poles, c.OcpdA, c.Load, c.Continuous, new WrittenRun(c.LengthFt, c.Size, c.Sets, null));
        }
    }
}
