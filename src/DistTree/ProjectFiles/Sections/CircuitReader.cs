using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>Reads a panel's <c>circuits</c>: each circuit's id, poles, phase, device, load (at the end or at points along the run) and run.</summary>
internal sealed class CircuitReader(SectionContext context, RunReader runs, LoadReader loads)
{
    private static readonly int[] PoleCounts = [1, 2, 3];

    private DiagnosticBag Bag => context.Bag;

    private ValueReader Values => context.Values;

    /// <summary>Reads the <c>circuits</c> of equipment <paramref name="panel"/> into its draft; ids must be unique in the panel.</summary>
    public void ReadList(in MappingReader m, EquipmentDraft draft, string panel)
    {
        if (m.Optional("circuits") is not { } node)
        {
            return;
        }

        if (draft.Kind is EquipmentKind.Transformer or EquipmentKind.Splitter)
        {
            Bag.Error(m.KeyLocation("circuits"), ProjectMessages.CircuitsNotOnPanel(panel, draft.Kind.Value));
            return;
        }

        if (node is not SourceSequence sequence)
        {
            Bag.Error(node.Location, ProjectMessages.CircuitsNotSequence(panel, node));
            return;
        }

        var seen = new Dictionary<string, SourceLocation>(sequence.Items.Count, StringComparer.Ordinal);
        draft.Circuits.EnsureCapacity(sequence.Items.Count);
        foreach (var item in sequence.Items)
        {
            if (item is not SourceMapping mapping)
            {
                if (!item.IsInvalid)
                {
                    Bag.Error(item.Location, ProjectMessages.CircuitEntryNotMapping(item));
                }

                continue;
            }

            var circuit = Read(mapping, panel);
            if (circuit.Id is { } id)
            {
                if (seen.TryGetValue(id, out var first))
                {
                    Bag.Error(circuit.Location, ProjectMessages.DuplicateCircuit(id, panel, first.Line));
                    continue;
                }

                seen.Add(id, circuit.Location);
            }

            draft.Circuits.Add(circuit);
        }
    }

    private CircuitDraft Read(SourceMapping mapping, string panel)
    {
        var draft = new CircuitDraft(mapping.Location);
        var peeked = SectionContext.PeekId(mapping);
        var full = peeked is null ? $"the circuit at line {mapping.Location.Line} of '{panel}'" : Subject.Circuit(panel, peeked);
        var m = new MappingReader(mapping, full, ProjectKeys.Circuit, Bag);
        if (m.Required("id") is { } idNode)
        {
            draft.Id = context.Id(idNode, "'id' of a circuit");
        }

        if (m.Optional("name") is { } nameNode)
        {
            draft.Name = Values.Text(nameNode, full.Of("'name' of ")) ?? "";
        }

        if (m.Required("poles", ProjectMessages.KeyHints.Poles) is { } polesNode)
        {
            draft.Poles = Values.IntegerOf(polesNode, full.Of("'poles' of "), PoleCounts);
            draft.PolesLocation = polesNode.Location;
        }

        if (m.Optional("phase") is { } phaseNode && Values.Text(phaseNode, full.Of("'phase' of ")) is { } phaseText)
        {
            draft.StatedPhases = PhaseRules.Parse(phaseText);
            draft.PhaseLocation = phaseNode.Location;
            if (draft.StatedPhases is null)
            {
                Bag.Error(phaseNode.Location, ProjectMessages.NotAPhase(phaseText));
            }
        }

        var ocpd = m.Optional("ocpd") is { } ocpdNode ? Values.InRange(ocpdNode, full.Of("'ocpd' of "), ValueRanges.OcpdA) : null;
        if (m.Optional("continuous") is { } continuousNode)
        {
            draft.Continuous = Values.Bool(continuousNode, full.Of("'continuous' of ")) ?? false;
        }

        var categoryNode = m.Optional("category");
        if (categoryNode is not null)
        {
            draft.Category = Category(categoryNode, full.Of("'category' of "));
        }

        ReadLoadOrPoints(m, draft, full);
        if (draft is { Load.IsMotor: true, Category: { } stated and not (LoadCategory.Motor or LoadCategory.Hvac) })
        {
            // A motor is a motor, or the compressor or fan of air-conditioning equipment.
            Bag.Error(categoryNode!.Location, ProjectMessages.MotorCategory(full, stated));
        }

        ReadRun(m, draft, full, ocpd);
        return draft;
    }

    // A 'category' word of Words.LoadCategory, with a "did you mean" hint; null (reported) for any other text.
    private LoadCategory? Category(SourceNode node, Subject what) =>
        Values.Choice(node, what, "load category", Words.LoadCategory.Pairs);

    // The load at the end ('load') or along the run ('points'): one of the two.
    private void ReadLoadOrPoints(in MappingReader m, CircuitDraft draft, Subject full)
    {
        var loadNode = m.Optional("load");
        var pointsNode = m.Optional("points");
        if (loadNode is not null && pointsNode is not null)
        {
            Bag.Error(m.KeyLocation("points"), ProjectMessages.LoadAndPoints(full));
        }
        else if (loadNode is not null)
        {
            draft.Load = loads.Read(loadNode, full.Of("the load of "));
        }
        else if (pointsNode is not null)
        {
            ReadPoints(pointsNode, draft, full);
        }
        else
        {
            Bag.Error(m.Node.Location, ProjectMessages.NoLoad(full));
        }
    }

    // The run, with the circuit's 'ocpd' as its device; the points must lie on it.
    private void ReadRun(in MappingReader m, CircuitDraft draft, Subject full, double? ocpd)
    {
        if (m.Required("run", ProjectMessages.KeyHints.Run) is { } runNode)
        {
            var run = runs.Read(runNode, full.Of("the run of "), true, out var runOcpdLocation, out var neutralLocation, ocpd);
            if (run is not null && ocpd is not null && runOcpdLocation is not null)
            {
                Bag.Error(runOcpdLocation, ProjectMessages.OcpdTwice(full));
                run = null;
            }

            // Only a 1-pole circuit has a neutral (line to neutral); 2 and 3 poles are line to line.
            if (run is not null && neutralLocation is not null && draft.Poles is { } poles and not 1)
            {
                Bag.Error(neutralLocation, ProjectMessages.NeutralOnLineToLine(full, poles));
                run = null;
            }

            draft.Run = run;
        }

        if (draft.Points.Count > 0 && draft.Run is { } withPoints && draft.Points[^1].AtM > withPoints.LengthM + 1e-9)
        {
            Bag.Error(draft.PointsLocation!, ProjectMessages.PointBeyondRun(full, draft.Points[^1].AtM, withPoints.LengthM, context.Draft.Units));
        }
    }

    private void ReadPoints(SourceNode node, CircuitDraft draft, Subject full)
    {
        if (node is not SourceSequence sequence || sequence.Items.Count == 0)
        {
            if (!node.IsInvalid)
            {
                Bag.Error(node.Location, ProjectMessages.PointsNotSequence(full, node));
            }

            return;
        }

        var points = new List<LoadPoint>();
        var ok = true;
        foreach (var item in sequence.Items)
        {
            var point = full.Of("a point of ");
            if (context.Map(item, point, point, ProjectKeys.Point) is not { } m)
            {
                ok = false;
                continue;
            }

            var at = m.Required("at", ProjectMessages.KeyHints.At) is { } atNode ? Values.LengthM(atNode, point.Of("'at' of "), context.Draft.Units) : null;
            // The point's own category, else its circuit's; null when the point's cannot be read (reported).
            LoadCategory? category = draft.Category ?? LoadCategory.Other;
            if (m.Optional("category") is { } categoryNode)
            {
                category = Category(categoryNode, point.Of("'category' of "));
            }

            var load = m.Required("load") is { } loadNode ? loads.Read(loadNode, point.Of("the load of ")) : null;
            if (load is { IsMotor: true })
            {
                Bag.Error(m.KeyLocation("load"), ProjectMessages.PointCarriesMotor(full));
                load = null;
            }
            else if (load is { MinimumCircuitA: not null })
            {
                Bag.Error(m.KeyLocation("load"), ProjectMessages.PointCarriesNameplate(full));
                load = null;
            }

            if (at is null || load is null || category is null)
            {
                ok = false;
                continue;
            }

            if (points.Count > 0 && at.Value < points[^1].AtM)
            {
                Bag.Error(item.Location, ProjectMessages.PointsOutOfOrder(full));
                ok = false;
            }

            points.Add(new LoadPoint(at.Value, load) { Category = category.Value });
        }

        if (ok)
        {
            draft.Points = points;
            draft.PointsLocation = sequence.Location;
        }
    }
}
