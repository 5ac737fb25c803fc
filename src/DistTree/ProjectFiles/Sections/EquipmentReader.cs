using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>Reads <c>equipment</c>: each entry's id, kind, source, feeder and demand factor, a transformer's data, and its circuits.</summary>
internal sealed class EquipmentReader(SectionContext context, RunReader runs, CircuitReader circuits)
{
    // Transformer taps in 2.5 % steps (common practice for dry-type distribution transformers).
    private static IReadOnlyList<double> TapSteps => TransformerData.TapSteps;

    private DiagnosticBag Bag => context.Bag;

    private ValueReader Values => context.Values;

    /// <summary>Reads an <c>equipment</c> list into the draft, after the equipment read before.</summary>
    public void ReadList(SourceNode? node)
    {
        if (node is null)
        {
            return;
        }

        if (node is not SourceSequence sequence)
        {
            if (!node.IsInvalid)
            {
                Bag.Error(node.Location, ProjectMessages.EquipmentNotSequence(node));
            }

            return;
        }

        if (sequence.Items.Count == 0)
        {
            Bag.Error(node.Location, ProjectMessages.EquipmentEmpty());
        }

        foreach (var item in sequence.Items)
        {
            if (item is SourceMapping mapping)
            {
                context.Draft.Equipment.Add(Read(mapping));
            }
            else if (!item.IsInvalid)
            {
                Bag.Error(item.Location, ProjectMessages.EquipmentEntryNotMapping(item));
            }
        }
    }

    private EquipmentDraft Read(SourceMapping mapping)
    {
        var draft = new EquipmentDraft(mapping.Location);
        var peeked = SectionContext.PeekId(mapping);
        var name = peeked ?? $"at line {mapping.Location.Line}";
        Subject quoted = $"'{name}'";
        var m = new MappingReader(mapping, peeked is null ? $"the equipment entry at line {mapping.Location.Line}" : $"equipment '{peeked}'", ProjectKeys.Equipment, Bag);
        if (m.Required("id") is { } idNode)
        {
            draft.Id = context.Id(idNode, "'id' of equipment");
            draft.IdLocation = idNode.Location;
        }

        if (m.Required("kind", ProjectMessages.KeyHints.Kind) is { } kindNode)
        {
            draft.Kind = Values.Choice(kindNode, quoted.Of("'kind' of "), "kind", Words.EquipmentKind.Pairs);
        }

        if (m.Required("from", ProjectMessages.KeyHints.From) is { } fromNode)
        {
            draft.From = context.IdReference(fromNode, quoted.Of("'from' of "));
            draft.FromLocation = fromNode.Location;
        }

        if (m.Optional("feeder") is { } feederNode)
        {
            draft.Feeder = runs.Read(feederNode, quoted.Of("the feeder of "), false, out _, out var neutralLocation);
            draft.FeederNeutralLocation = neutralLocation;
            draft.FeederOk = draft.Feeder is not null;
        }

        if (m.Optional("demand_factor") is { } demandNode && Values.InRange(demandNode, quoted.Of("'demand_factor' of "), ValueRanges.DemandFactor) is { } demand)
        {
            draft.DemandFactor = demand;
            if (demand > 1)
            {
                Bag.Warning(demandNode.Location, ProjectMessages.DemandAboveOne(name, demand));
            }
        }

        if (m.Optional("interrupting_ka") is { } ratingNode)
        {
            draft.InterruptingKa = Values.InRange(ratingNode, quoted.Of("'interrupting_ka' of "), ValueRanges.InterruptingKa);
        }

        if (m.Optional("main_a") is { } mainNode)
        {
            draft.MainA = Values.InRange(mainNode, quoted.Of("'main_a' of "), ValueRanges.OcpdA);
        }

        ReadTransformer(m, draft, name);
        circuits.ReadList(m, draft, name);
        return draft;
    }

    private void ReadTransformer(in MappingReader m, EquipmentDraft draft, string name)
    {
        if (draft.Kind is null)
        {
            return;
        }

        if (draft.Kind == EquipmentKind.Transformer && m.Has("main_a"))
        {
            Bag.Error(m.KeyLocation("main_a"), ProjectMessages.MainOnTransformer(name));
        }

        if (draft.Kind != EquipmentKind.Transformer)
        {
            foreach (var key in ProjectKeys.TransformerOnly)
            {
                if (m.Has(key))
                {
                    Bag.Error(m.KeyLocation(key), ProjectMessages.TransformerOnlyKey(key, name, draft.Kind.Value));
                }
            }

            return;
        }

        var kva = m.Required("kva", ProjectMessages.KeyHints.Kva) is { } kvaNode ? Values.InRange(kvaNode, $"'kva' of '{name}'", ValueRanges.Kva) : null;
        var secondary = m.Required("secondary", ProjectMessages.KeyHints.Secondary) is { } secondaryNode ? Values.SystemOf(secondaryNode, $"'secondary' of '{name}'") : null;
        draft.SecondaryLocation = m.KeyLocation("secondary");
        var impedance = m.Required("impedance_percent", ProjectMessages.KeyHints.Impedance) is { } zNode ? Values.InRange(zNode, $"'impedance_percent' of '{name}'", ValueRanges.ImpedancePercent) : null;
        var xr = m.Required("x_r", ProjectMessages.KeyHints.XOverR) is { } xrNode ? Values.InRange(xrNode, $"'x_r' of '{name}'", ValueRanges.XOverR) : null;
        var tap = m.Optional("tap_percent") is { } tapNode ? Values.InRange(tapNode, $"'tap_percent' of '{name}'", ValueRanges.TapPercent) : 0;
        if (tap is { } t && !TapSteps.Contains(t))
        {
            Bag.Error(m.KeyLocation("tap_percent"), ProjectMessages.TapNotAStep(name, t));
            tap = null;
        }

        var range = m.Optional("tap_range_percent") is { } rangeNode ? Values.InRange(rangeNode, $"'tap_range_percent' of '{name}'", ValueRanges.TapRangePercent) : 5;
        if (range is { } r && !TapSteps.Contains(r))
        {
            Bag.Error(m.KeyLocation("tap_range_percent"), ProjectMessages.TapRangeNotAStep(name, r));
            range = null;
        }

        if (m.Optional("primary") is { } primaryNode)
        {
            draft.Primary = Values.SystemOf(primaryNode, $"'primary' of '{name}'");
            draft.PrimaryLocation = primaryNode.Location;
        }

        var primaryPhases = ReadPrimaryPhases(m, draft, name, secondary);
        if (kva is not null && secondary is not null && impedance is not null && xr is not null && tap is not null && primaryPhases is not null && range is not null)
        {
            draft.Transformer = new TransformerData(kva.Value, secondary, impedance.Value, xr.Value, tap.Value) { PrimaryPhases = primaryPhases.Value, TapRangePercent = range.Value };
        }
    }

    // The two primary lines a single-phase transformer is across ('phase': AB, BC or CA; AB unless stated). Only a
    // single-phase secondary takes it; that the primary is three-phase is a tree check (FeedChecker), as the primary
    // is known only once the transformer's source is.
    private Phases? ReadPrimaryPhases(in MappingReader m, EquipmentDraft draft, string name, ElectricalSystem? secondary)
    {
        if (m.Optional("phase") is not { } phaseNode)
        {
            return Phases.AB;
        }

        if (Values.Text(phaseNode, $"'phase' of '{name}'") is not { } text)
        {
            return null;
        }

        if (PhaseRules.Parse(text) is not { } phases || PhaseRules.Count(phases) != 2)
        {
            Bag.Error(phaseNode.Location, ProjectMessages.TransformerPhaseNotTwoLines(name, text));
            return null;
        }

        if (secondary is { Phases: not 1 })
        {
            Bag.Error(m.KeyLocation("phase"), ProjectMessages.TransformerPhaseThreePhase(name, secondary));
            return null;
        }

        draft.PrimaryPhasesLocation = m.KeyLocation("phase");
        return phases;
    }
}
