using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// Reads the sections of a project file into drafts, reporting every unknown, missing, duplicate or wrongly
/// typed value: the top of the file (format version, <c>project</c>, <c>service</c>, <c>include</c>) here, and each
/// other section with a reader of its own (<see cref="RulesReader"/>, <see cref="SizingReader"/>,
/// <see cref="EquipmentReader"/>, <see cref="CircuitReader"/>, <see cref="LoadReader"/>, <see cref="RunReader"/>).
/// The tree checks (ids, sources, cycles, systems) come after, in <see cref="FeedChecker"/>.
/// </summary>
internal sealed class ProjectReader
{
    private readonly SectionContext _context;
    private readonly RulesReader _rules;
    private readonly SizingReader _sizing;
    private readonly EquipmentReader _equipment;

    /// <summary>A reader for one project (its main file and the files it includes), reporting to <paramref name="bag"/>.</summary>
    public ProjectReader(DiagnosticBag bag)
    {
        _context = new SectionContext(bag);
        _rules = new RulesReader(_context);
        _sizing = new SizingReader(_context);
        var runs = new RunReader(_context);
        _equipment = new EquipmentReader(_context, runs, new CircuitReader(_context, runs, new LoadReader(_context)));
    }

    private DiagnosticBag Bag => _context.Bag;

    private ValueReader Values => _context.Values;

    /// <summary>Reads the whole document; the draft holds what could be read.</summary>
    public ProjectDraft Read(SourceNode root)
    {
        var draft = _context.Draft = new ProjectDraft();
        if (root is not SourceMapping mapping)
        {
            Bag.Error(root.Location, ProjectMessages.NotAProject(root));
            return draft;
        }

        var top = new MappingReader(mapping, "the project file", ProjectKeys.Top, Bag);
        ReadVersion(top.Required("disttree", ProjectMessages.KeyHints.FormatVersion));
        ReadProject(_context.Map(top.Required("project"), "'project'", "the project section", ProjectKeys.Project));
        _rules.ReadRules(_context.Map(top.Optional("rules"), "'rules'", "the rules", ProjectKeys.Rules));
        _rules.ReadDefaults(_context.Map(top.Optional("defaults"), "'defaults'", "the defaults", ProjectKeys.Defaults));
        _sizing.Read(_context.Map(top.Optional("sizing"), "'sizing'", "the sizing section", ProjectKeys.Sizing));
        ReadService(top.Required("service"));
        draft.Includes.AddRange(ReadIncludes(top.Optional("include")));
        _equipment.ReadList(top.Has("include") ? top.Optional("equipment") : top.Required("equipment"));
        return draft;
    }

    /// <summary>
    /// Reads an included file (<c>include</c> and <c>equipment</c> only) into the same draft: its equipment is
    /// added after what was read before. Returns the files it includes in turn.
    /// </summary>
    public IReadOnlyList<IncludeEntry> ReadIncluded(SourceNode root)
    {
        if (root is not SourceMapping mapping)
        {
            Bag.Error(root.Location, ProjectMessages.NotAnIncludedFile(root));
            return [];
        }

        var top = new MappingReader(mapping, "the included file", ProjectKeys.Included, Bag);
        var includes = ReadIncludes(top.Optional("include"));
        _equipment.ReadList(top.Has("include") ? top.Optional("equipment") : top.Required("equipment", ProjectMessages.KeyHints.IncludedEquipment));
        return includes;
    }

    private List<IncludeEntry> ReadIncludes(SourceNode? node)
    {
        var entries = new List<IncludeEntry>();
        if (node is null)
        {
            return entries;
        }

        if (node is not SourceSequence sequence)
        {
            if (!node.IsInvalid)
            {
                Bag.Error(node.Location, ProjectMessages.IncludeNotSequence(node));
            }

            return entries;
        }

        foreach (var item in sequence.Items)
        {
            if (Values.Text(item, "an 'include' path") is { } path)
            {
                entries.Add(new IncludeEntry(path.Trim(), item.Location));
            }
        }

        return entries;
    }

    private void ReadVersion(SourceNode? node)
    {
        if (node is not null && Values.Integer(node, "'disttree' (the format version)") is { } version && version != 1)
        {
            Bag.Error(node.Location, ProjectMessages.UnsupportedVersion(version));
        }
    }

    private void ReadProject(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        if (m.Required("name") is { } name)
        {
            _context.Draft.Name = Values.Text(name, "'name' of the project");
        }

        if (m.Optional("units") is { } units && Values.Choice(units, "'units'", "unit system", Words.Units.Pairs) is { } u)
        {
            _context.Draft.Units = u;
        }

        if (m.Optional("description") is { } description)
        {
            _context.Draft.Description = Values.Text(description, "'description'") ?? "";
        }
    }

    private void ReadService(SourceNode? node)
    {
        if (node is SourceSequence sequence)
        {
            if (sequence.Items.Count > 1)
            {
                Bag.Error(sequence.Items[1].Location, ProjectMessages.ServiceCount(sequence.Items.Count));
            }
            else
            {
                Bag.Error(node.Location, ProjectMessages.ServiceIsSequence());
            }

            return;
        }

        if (_context.Map(node, "'service'", "the service", ProjectKeys.Service) is not { } m)
        {
            return;
        }

        var id = m.Required("id") is { } idNode ? _context.Id(idNode, "'id' of the service") : null;
        var system = m.Required("system", ProjectMessages.KeyHints.System) is { } systemNode ? Values.SystemOf(systemNode, "'system' of the service") : null;
        var frequency = m.Optional("frequency_hz") is { } hz ? Values.InRange(hz, "'frequency_hz'", ValueRanges.FrequencyHz) : 60;
        var faultKa = ServiceValue(m, "available_fault_current_ka", ValueRanges.AvailableFaultCurrentKa, out var faultKaOk);
        var faultXr = ServiceValue(m, "fault_x_r", ValueRanges.FaultXOverR, out var faultXrOk);
        var utilityKva = ServiceValue(m, "utility_transformer_kva", ValueRanges.UtilityKva, out var utilityKvaOk);
        var utilityZ = ServiceValue(m, "utility_transformer_impedance_percent", ValueRanges.ImpedancePercent, out var utilityZOk);
        if (id is not null && system is not null && frequency is not null && faultKaOk && faultXrOk && utilityKvaOk && utilityZOk && SourceKeysAgree(m))
        {
            _context.Draft.Service = new Service(id, system, frequency.Value, m.Node.Location)
            {
                AvailableFaultCurrentKa = faultKa,
                FaultXOverR = faultXr,
                UtilityTransformerKva = utilityKva,
                UtilityTransformerImpedancePercent = utilityZ,
            };
        }
    }

    // The utility's source is given one way or none: an available fault current with its X/R, or the utility transformer's
    // kVA and %Z with the X/R; a key of one way alone, or of both ways, is an error at the key.
    private bool SourceKeysAgree(in MappingReader m)
    {
        const string Ka = "available_fault_current_ka", XR = "fault_x_r", Kva = "utility_transformer_kva", Z = "utility_transformer_impedance_percent";
        if (m.Optional(Ka) is not null && m.Optional(Kva) is not null)
        {
            Bag.Error(m.KeyLocation(Kva), ProjectMessages.SourceGivenTwice(Ka, Kva));
            return false;
        }

        var byTransformer = m.Optional(Kva) is not null || m.Optional(Z) is not null;
        return byTransformer
            ? Paired(m, Kva, Z) && Paired(m, Z, Kva) && Paired(m, Kva, XR)
            : Paired(m, Ka, XR) && Paired(m, XR, Ka);
    }

    // An optional figure of the service, in its range; ok is false when given and wrong.
    private double? ServiceValue(in MappingReader m, string key, NumberRange range, out bool ok)
    {
        ok = true;
        if (m.Optional(key) is not { } node)
        {
            return null;
        }

        var value = Values.InRange(node, $"'{key}' of the service", range);
        ok = value is not null;
        return value;
    }

    // False, with the error at the key given, when 'key' has a value and 'partner' none.
    private bool Paired(in MappingReader m, string key, string partner)
    {
        if (m.Optional(key) is not null && m.Optional(partner) is null)
        {
            Bag.Error(m.KeyLocation(key), ProjectMessages.FaultKeyAlone(key, partner));
            return false;
        }

        return true;
    }
}
