using System.Globalization;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles;

/// <summary>
/// Reads the sections of a project file into drafts, reporting every unknown, missing, duplicate or
/// wrongly typed value. The tree checks (ids, sources, cycles, systems) come after, in <see cref="FeedChecker"/>.
/// </summary>
internal sealed class ProjectReader(DiagnosticBag bag)
{
    /// <summary>Branch runs longer than this are probably a typo (2000 ft, common practice as a sanity bound).</summary>
    public const double LongBranchM = 2000 * UnitFactors.MetresPerFoot;

    // "'va' of ", "'kva' of " ...: the start of a message about a load's quantity, in the order of Words.LoadQuantity.
    private static readonly string[] QuantityPrefixes = [.. ProjectKeys.LoadQuantities.Select(q => $"'{q}' of ")];

    // "'va', 'kva', 'kw', 'amps', 'hp' or 'fla'": the quantities a load may be given in, for messages.
    private static readonly string QuantityList =
        string.Join(", ", ProjectKeys.LoadQuantities.SkipLast(1).Select(q => $"'{q}'")) + $" or '{ProjectKeys.LoadQuantities[^1]}'";

    // NEMA locked-rotor code letters (NEC Table 430.7(B)); I, O and Q are not used.
    private static readonly string[] CodeLetters =
        ["A", "B", "C", "D", "E", "F", "G", "H", "J", "K", "L", "M", "N", "P", "R", "S", "T", "U", "V"];

    // Transformer taps in 2.5 % steps (common practice for dry-type distribution transformers).
    private static readonly double[] TapSteps = [-5, -2.5, 0, 2.5, 5];

    private static readonly int[] TemperatureRatings = [60, 75, 90];

    private static readonly int[] PoleCounts = [1, 2, 3];

    private readonly ValueReader _values = new(bag);

    // Each size text parsed, with its result: a file names a few sizes many times.
    private readonly Dictionary<string, (bool Ok, ConductorSize Size, string Error)> _sizes = new(StringComparer.Ordinal);

    private ProjectDraft _draft = new();

    /// <summary>Reads the whole document; the draft holds what could be read.</summary>
    public ProjectDraft Read(SourceNode root)
    {
        _draft = new ProjectDraft();
        if (root is not SourceMapping mapping)
        {
            bag.Error(root.Location, $"a project file is a mapping of keys (disttree, project, service, equipment); found {root.Describe()}");
            return _draft;
        }

        var top = new MappingReader(mapping, "the project file", ProjectKeys.Top, bag);
        ReadVersion(top.Required("disttree", " (the format version: 1)"));
        ReadProject(Map(top.Required("project"), "'project'", "the project section", ProjectKeys.Project));
        ReadRules(Map(top.Optional("rules"), "'rules'", "the rules", ProjectKeys.Rules));
        ReadDefaults(Map(top.Optional("defaults"), "'defaults'", "the defaults", ProjectKeys.Defaults));
        ReadSizing(Map(top.Optional("sizing"), "'sizing'", "the sizing section", ProjectKeys.Sizing));
        ReadService(top.Required("service"));
        _draft.Includes.AddRange(ReadIncludes(top.Optional("include")));
        ReadEquipment(top.Has("include") ? top.Optional("equipment") : top.Required("equipment"));
        return _draft;
    }

    /// <summary>
    /// Reads an included file (<c>include</c> and <c>equipment</c> only) into the same draft: its equipment is
    /// added after what was read before. Returns the files it includes in turn.
    /// </summary>
    public IReadOnlyList<IncludeEntry> ReadIncluded(SourceNode root)
    {
        if (root is not SourceMapping mapping)
        {
            bag.Error(root.Location, $"an included file is a mapping holding 'equipment:' (and 'include:'); found {root.Describe()}");
            return [];
        }

        var top = new MappingReader(mapping, "the included file", ProjectKeys.Included, bag);
        var includes = ReadIncludes(top.Optional("include"));
        ReadEquipment(top.Has("include") ? top.Optional("equipment") : top.Required("equipment", " (an included file lists equipment)"));
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
                bag.Error(node.Location, $"'include' must be a sequence of relative paths ('- buildings/north.yaml'); found {node.Describe()}");
            }

            return entries;
        }

        foreach (var item in sequence.Items)
        {
            if (_values.Text(item, "an 'include' path") is { } path)
            {
                entries.Add(new IncludeEntry(path.Trim(), item.Location));
            }
        }

        return entries;
    }

    private MappingReader? Map(SourceNode? node, Subject what, Subject context, string[] keys)
    {
        if (node is null)
        {
            return null;
        }

        if (node is SourceMapping mapping)
        {
            return new MappingReader(mapping, context, keys, bag);
        }

        if (!node.IsInvalid)
        {
            bag.Error(node.Location, $"{what} must be a mapping of keys; found {node.Describe()}");
        }

        return null;
    }

    private void ReadVersion(SourceNode? node)
    {
        if (node is not null && _values.Integer(node, "'disttree' (the format version)") is { } version && version != 1)
        {
            bag.Error(node.Location, $"unsupported format version {version}; this DistTree reads 'disttree: 1'");
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
            _draft.Name = _values.Text(name, "'name' of the project");
        }

        if (m.Optional("units") is { } units && _values.Choice(units, "'units'", "unit system", Words.Units.Pairs) is { } u)
        {
            _draft.Units = u;
        }

        if (m.Optional("description") is { } description)
        {
            _values.Text(description, "'description'");
        }
    }

    private void ReadRules(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        var rules = Rules.Default;
        if (Positive(m, "feeder_limit_percent") is { } feeder)
        {
            rules = rules with { FeederLimitPercent = feeder };
        }

        if (Positive(m, "branch_limit_percent") is { } branch)
        {
            rules = rules with { BranchLimitPercent = branch };
        }

        if (Positive(m, "total_limit_percent") is { } total)
        {
            rules = rules with { TotalLimitPercent = total };
        }

        if (m.Optional("branch_current") is { } basisNode && _values.Choice(basisNode, "'branch_current'", "branch_current", Words.BranchCurrent.Pairs) is { } basis)
        {
            rules = rules with { BranchCurrent = basis };
        }

        if (m.Optional("conductor_temperature") is { } temperature)
        {
            rules = ReadTemperature(temperature, rules);
        }

        if (m.Optional("transformer_drop") is { } dropNode && _values.Choice(dropNode, "'transformer_drop'", "transformer_drop", Words.TransformerDrop.Pairs) is { } drop)
        {
            rules = rules with { TransformerDrop = drop };
        }

        if (m.Optional("ambient_c") is { } ambientNode && _values.Number(ambientNode, "'ambient_c'") is { } ambient)
        {
            rules = rules with { AmbientC = ambient };
        }

        if (m.Optional("terminal_c") is { } terminalNode && _values.IntegerOf(terminalNode, "'terminal_c'", TemperatureRatings) is { } terminal)
        {
            rules = rules with { TerminalC = terminal };
        }

        if (m.Optional("method") is { } methodNode && _values.Choice(methodNode, "'method'", "method", Words.Method.Pairs) is { } method)
        {
            rules = rules with { Method = method };
        }

        if (Positive(m, "motor_start_limit_percent") is { } motorStart)
        {
            rules = rules with { MotorStartLimitPercent = motorStart };
        }

        _draft.Rules = rules;
    }

    private Rules ReadTemperature(SourceNode node, Rules rules)
    {
        if (node is SourceScalar { IsPlain: true } scalar && ValueReader.IsNumberText(scalar.Value))
        {
            return _values.Positive(node, "'conductor_temperature'") is { } c
                ? rules with { Temperature = TemperatureMode.Fixed, FixedTemperatureC = c }
                : rules;
        }

        var text = _values.Text(node, "'conductor_temperature'");
        switch (text)
        {
            case null:
                return rules;
            case "estimated":
                return rules with { Temperature = TemperatureMode.Estimated };
            case "rated":
                return rules with { Temperature = TemperatureMode.Rated };
            default:
                var near = Suggestions.Closest(text, ["estimated", "rated"]);
                var hint = near is null ? "" : $"; did you mean '{near}'?";
                bag.Error(node.Location, $"unknown conductor_temperature '{text}'{hint} (expected 'estimated', 'rated' or a number in °C)");
                return rules;
        }
    }

    private void ReadDefaults(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        var defaults = ConductorDefaults.Standard;
        if (m.Optional("material") is { } materialNode && _values.Choice(materialNode, "'material'", "material", Words.Material.Pairs) is { } material)
        {
            defaults = defaults with { Material = material };
        }

        if (m.Optional("insulation_c") is { } insulationNode && _values.IntegerOf(insulationNode, "'insulation_c'", TemperatureRatings) is { } insulation)
        {
            defaults = defaults with { InsulationC = insulation };
        }

        if (m.Optional("raceway") is { } racewayNode && _values.Choice(racewayNode, "'raceway'", "raceway", Words.Raceway.Pairs) is { } raceway)
        {
            defaults = defaults with { Raceway = raceway };
        }

        _draft.Defaults = defaults;
    }

    private void ReadSizing(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        var sizing = SizingOptions.Default;
        if (m.Optional("max_sets") is { } setsNode && _values.Integer(setsNode, "'max_sets'") is { } sets)
        {
            if (sets < 1)
            {
                bag.Error(setsNode.Location, $"'max_sets' must be 1 or more; found {sets}");
            }
            else
            {
                sizing = sizing with { MaxSets = sets };
            }
        }

        if (m.Optional("currency") is { } currencyNode && _values.Text(currencyNode, "'currency'") is { } currency)
        {
            sizing = sizing with { Currency = currency };
        }

        if (Positive(m, "resolution_percent") is { } resolution)
        {
            sizing = sizing with { ResolutionPercent = resolution };
        }

        if (m.Optional("prices") is { } pricesNode)
        {
            sizing = sizing with { Prices = ReadPrices(pricesNode) };
        }

        _draft.Sizing = sizing;
    }

    private Dictionary<ConductorSize, double> ReadPrices(SourceNode node)
    {
        var prices = new Dictionary<ConductorSize, double>();
        if (node is not SourceMapping mapping)
        {
            if (!node.IsInvalid)
            {
                bag.Error(node.Location, $"'prices' must be a mapping of size to price per metre; found {node.Describe()}");
            }

            return prices;
        }

        foreach (var (key, value) in mapping.Entries)
        {
            if (!ConductorSize.TryParse(key.Value, out var size, out var error))
            {
                bag.Error(key.Location, error);
                continue;
            }

            if (prices.ContainsKey(size))
            {
                bag.Error(key.Location, $"the price of {size} is given twice");
                continue;
            }

            if (_values.Positive(value, $"the price of {size}") is { } price)
            {
                prices[size] = price;
            }
        }

        return prices;
    }

    private void ReadService(SourceNode? node)
    {
        if (node is SourceSequence sequence)
        {
            if (sequence.Items.Count > 1)
            {
                bag.Error(sequence.Items[1].Location, $"a project has exactly one service (the root of the tree); found {sequence.Items.Count}");
            }
            else
            {
                bag.Error(node.Location, "'service' must be a mapping of keys, not a sequence");
            }

            return;
        }

        if (Map(node, "'service'", "the service", ProjectKeys.Service) is not { } m)
        {
            return;
        }

        var id = m.Required("id") is { } idNode ? Id(idNode, "'id' of the service") : null;
        var system = m.Required("system", " (e.g. 480Y/277)") is { } systemNode ? _values.SystemOf(systemNode, "'system' of the service") : null;
        var frequency = m.Optional("frequency_hz") is { } hz ? _values.Positive(hz, "'frequency_hz'") : 60;
        if (id is not null && system is not null && frequency is not null)
        {
            _draft.Service = new Service(id, system, frequency.Value, m.Node.Location);
        }
    }

    private void ReadEquipment(SourceNode? node)
    {
        if (node is null)
        {
            return;
        }

        if (node is not SourceSequence sequence)
        {
            if (!node.IsInvalid)
            {
                bag.Error(node.Location, $"'equipment' must be a sequence of entries ('- id: ...'); found {node.Describe()}");
            }

            return;
        }

        if (sequence.Items.Count == 0)
        {
            bag.Error(node.Location, "'equipment' lists nothing; a project needs at least one piece of equipment");
        }

        foreach (var item in sequence.Items)
        {
            if (item is SourceMapping mapping)
            {
                _draft.Equipment.Add(ReadOneEquipment(mapping));
            }
            else if (!item.IsInvalid)
            {
                bag.Error(item.Location, $"an equipment entry must be a mapping of keys; found {item.Describe()}");
            }
        }
    }

    private EquipmentDraft ReadOneEquipment(SourceMapping mapping)
    {
        var draft = new EquipmentDraft(mapping.Location);
        var peeked = PeekId(mapping);
        var name = peeked ?? $"at line {mapping.Location.Line}";
        Subject quoted = $"'{name}'";
        var m = new MappingReader(mapping, peeked is null ? $"the equipment entry at line {mapping.Location.Line}" : $"equipment '{peeked}'", ProjectKeys.Equipment, bag);
        if (m.Required("id") is { } idNode)
        {
            draft.Id = Id(idNode, "'id' of equipment");
            draft.IdLocation = idNode.Location;
        }

        if (m.Required("kind", " (switchboard, panelboard, transformer or splitter)") is { } kindNode)
        {
            draft.Kind = _values.Choice(kindNode, quoted.Of("'kind' of "), "kind", Words.EquipmentKind.Pairs);
        }

        if (m.Required("from", " (the id of the service or equipment that feeds it)") is { } fromNode)
        {
            draft.From = _values.Text(fromNode, quoted.Of("'from' of "));
            draft.FromLocation = fromNode.Location;
        }

        if (m.Optional("feeder") is { } feederNode)
        {
            draft.Feeder = ReadRun(feederNode, quoted.Of("the feeder of "), false, out _);
            draft.FeederOk = draft.Feeder is not null;
        }

        if (m.Optional("demand_factor") is { } demandNode && _values.Positive(demandNode, quoted.Of("'demand_factor' of ")) is { } demand)
        {
            draft.DemandFactor = demand;
            if (demand > 1)
            {
                bag.Warning(demandNode.Location, $"the demand factor of '{name}' is {ValueReader.Format(demand)}, above 1: it raises the load it applies to");
            }
        }

        ReadTransformer(m, draft, name);
        ReadCircuits(m, draft, name);
        return draft;
    }

    private void ReadTransformer(in MappingReader m, EquipmentDraft draft, string name)
    {
        if (draft.Kind is null)
        {
            return;
        }

        if (draft.Kind != EquipmentKind.Transformer)
        {
            foreach (var key in ProjectKeys.TransformerOnly)
            {
                if (!m.Has(key))
                {
                    continue;
                }

                bag.Error(m.KeyLocation(key), $"'{key}' applies to transformers only; '{name}' is a {KindWord(draft.Kind.Value)}");
            }

            return;
        }

        var kva = m.Required("kva", " (the rating in kVA)") is { } kvaNode ? _values.Positive(kvaNode, $"'kva' of '{name}'") : null;
        var secondary = m.Required("secondary", " (the secondary system, e.g. 208Y/120)") is { } secondaryNode
            ? _values.SystemOf(secondaryNode, $"'secondary' of '{name}'")
            : null;
        var impedance = m.Required("impedance_percent", " (the nameplate %Z)") is { } zNode ? _values.Positive(zNode, $"'impedance_percent' of '{name}'") : null;
        var xr = m.Required("x_r", " (the X/R ratio)") is { } xrNode ? _values.Positive(xrNode, $"'x_r' of '{name}'") : null;
        var tap = m.Optional("tap_percent") is { } tapNode ? _values.Number(tapNode, $"'tap_percent' of '{name}'") : 0;
        if (tap is { } t && !TapSteps.Contains(t))
        {
            bag.Error(m.KeyLocation("tap_percent"), $"'tap_percent' of '{name}' is {ValueReader.Format(t)}; taps come in 2.5 % steps: -5, -2.5, 0, 2.5 or 5");
            tap = null;
        }
        if (m.Optional("primary") is { } primaryNode)
        {
            draft.Primary = _values.SystemOf(primaryNode, $"'primary' of '{name}'");
            draft.PrimaryLocation = primaryNode.Location;
        }

        if (kva is not null && secondary is not null && impedance is not null && xr is not null && tap is not null)
        {
            draft.Transformer = new TransformerData(kva.Value, secondary, impedance.Value, xr.Value, tap.Value);
        }
    }

    private void ReadCircuits(in MappingReader m, EquipmentDraft draft, string panel)
    {
        if (m.Optional("circuits") is not { } node)
        {
            return;
        }

        if (draft.Kind is EquipmentKind.Transformer or EquipmentKind.Splitter)
        {
            bag.Error(m.KeyLocation("circuits"), $"'{panel}' is a {KindWord(draft.Kind.Value)}: branch circuits are fed from a panelboard or a switchboard");
            return;
        }

        if (node is not SourceSequence sequence)
        {
            bag.Error(node.Location, $"'circuits' of '{panel}' must be a sequence of entries ('- id: ...'); found {node.Describe()}");
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
                    bag.Error(item.Location, $"a circuit entry must be a mapping of keys; found {item.Describe()}");
                }

                continue;
            }

            var circuit = ReadCircuit(mapping, panel);
            if (circuit.Id is { } id)
            {
                if (seen.TryGetValue(id, out var first))
                {
                    bag.Error(circuit.Location, $"duplicate circuit id '{id}' in '{panel}' (first given at line {first.Line})");
                    continue;
                }

                seen.Add(id, circuit.Location);
            }

            draft.Circuits.Add(circuit);
        }
    }

    private CircuitDraft ReadCircuit(SourceMapping mapping, string panel)
    {
        var draft = new CircuitDraft(mapping.Location);
        var peeked = PeekId(mapping);
        var full = peeked is null ? $"the circuit at line {mapping.Location.Line} of '{panel}'" : Subject.Circuit(panel, peeked);
        var m = new MappingReader(mapping, full, ProjectKeys.Circuit, bag);
        if (m.Required("id") is { } idNode)
        {
            draft.Id = Id(idNode, "'id' of a circuit");
        }

        if (m.Optional("name") is { } nameNode)
        {
            draft.Name = _values.Text(nameNode, full.Of("'name' of ")) ?? "";
        }

        if (m.Required("poles", " (1, 2 or 3)") is { } polesNode)
        {
            draft.Poles = _values.IntegerOf(polesNode, full.Of("'poles' of "), PoleCounts);
            draft.PolesLocation = polesNode.Location;
        }

        if (m.Optional("phase") is { } phaseNode && _values.Text(phaseNode, full.Of("'phase' of ")) is { } phaseText)
        {
            draft.StatedPhases = PhaseRules.Parse(phaseText);
            draft.PhaseLocation = phaseNode.Location;
            if (draft.StatedPhases is null)
            {
                bag.Error(phaseNode.Location, $"'{phaseText}' is not a phase; expected A, B, C, AB, BC, CA or ABC");
            }
        }

        var ocpd = m.Optional("ocpd") is { } ocpdNode ? _values.Positive(ocpdNode, full.Of("'ocpd' of ")) : null;
        if (m.Optional("continuous") is { } continuousNode)
        {
            draft.Continuous = _values.Bool(continuousNode, full.Of("'continuous' of ")) ?? false;
        }

        var loadNode = m.Optional("load");
        var pointsNode = m.Optional("points");
        if (loadNode is not null && pointsNode is not null)
        {
            bag.Error(m.KeyLocation("points"), $"{full} gives both 'load' and 'points'; give its load at the end ('load') or along the run ('points')");
        }
        else if (loadNode is not null)
        {
            draft.Load = ReadLoad(loadNode, full.Of("the load of "));
        }
        else if (pointsNode is not null)
        {
            ReadPoints(pointsNode, draft, full);
        }
        else
        {
            bag.Error(m.Node.Location, $"missing key 'load' in {full} (or 'points' for loads along the run)");
        }

        if (m.Required("run", " (its length and size)") is { } runNode)
        {
            var run = ReadRun(runNode, full.Of("the run of "), true, out var runOcpdLocation, ocpd);
            if (run is not null && ocpd is not null && runOcpdLocation is not null)
            {
                bag.Error(runOcpdLocation, $"'ocpd' is given both on {full} and on its run; give it once");
                run = null;
            }

            draft.Run = run;
        }

        if (draft.Points.Count > 0 && draft.Run is { } withPoints && draft.Points[^1].AtM > withPoints.LengthM + 1e-9)
        {
            bag.Error(draft.PointsLocation!, $"the farthest point of {full} is {ValueReader.Format(draft.Points[^1].AtM)} m along a run of {ValueReader.Format(withPoints.LengthM)} m; a point lies on its run");
        }

        return draft;
    }

    private void ReadPoints(SourceNode node, CircuitDraft draft, Subject full)
    {
        if (node is not SourceSequence sequence || sequence.Items.Count == 0)
        {
            if (!node.IsInvalid)
            {
                bag.Error(node.Location, $"'points' of {full} must be a sequence of one or more '{{ at: LENGTH, load: {{ ... }} }}'; found {node.Describe()}");
            }

            return;
        }

        var points = new List<LoadPoint>();
        var ok = true;
        foreach (var item in sequence.Items)
        {
            var point = full.Of("a point of ");
            if (Map(item, point, point, ProjectKeys.Point) is not { } m)
            {
                ok = false;
                continue;
            }

            var at = m.Required("at", " (its distance along the run)") is { } atNode ? _values.LengthM(atNode, point.Of("'at' of "), _draft.Units) : null;
            var load = m.Required("load") is { } loadNode ? ReadLoad(loadNode, point.Of("the load of ")) : null;
            if (load is { IsMotor: true })
            {
                bag.Error(m.KeyLocation("load"), $"a point of {full} carries a motor; a motor is a circuit of its own");
                load = null;
            }

            if (at is null || load is null)
            {
                ok = false;
                continue;
            }

            if (points.Count > 0 && at.Value < points[^1].AtM)
            {
                bag.Error(item.Location, $"the points of {full} must be listed nearest first");
                ok = false;
            }

            points.Add(new LoadPoint(at.Value, load));
        }

        if (ok)
        {
            draft.Points = points;
            draft.PointsLocation = sequence.Location;
        }
    }

    private Load? ReadLoad(SourceNode node, Subject context)
    {
        if (Map(node, context, context, ProjectKeys.Load) is not { } m)
        {
            return null;
        }

        // The first two different quantities given, in file order.
        SourceScalar? first = null;
        SourceScalar? second = null;
        foreach (var entry in m.Node.Entries)
        {
            var key = entry.Key;
            if (!Words.LoadQuantity.TryRead(key.Value, out _))
            {
                continue;
            }

            if (first is null)
            {
                first = key;
            }
            else if (!string.Equals(key.Value, first.Value, StringComparison.Ordinal))
            {
                second = key;
                break;
            }
        }

        if (first is null)
        {
            bag.Error(m.Node.Location, $"{context} states no quantity; give exactly one of {QuantityList}");
            return null;
        }

        if (second is not null)
        {
            bag.Error(second.Location, $"{context} gives both '{first.Value}' and '{second.Value}'; give exactly one of {QuantityList}");
            return null;
        }

        var quantity = Words.LoadQuantity.IndexOf(first.Value);
        var kind = Words.LoadQuantity.Pairs[quantity].Value;
        var value = m.Required(first.Value) is { } valueNode ? _values.NotNegative(valueNode, context.Of(QuantityPrefixes[quantity])) : null;
        double? pf = 1.0;
        if (m.Optional("pf") is { } pfNode)
        {
            pf = _values.Number(pfNode, context.Of("'pf' of "));
            if (pf is <= 0 or > 1)
            {
                bag.Error(pfNode.Location, $"a power factor must be greater than 0 and at most 1; found {ValueReader.Format(pf.Value)}");
                pf = null;
            }
        }
        else if (kind is LoadKind.Hp or LoadKind.Fla)
        {
            bag.Error(m.Node.Location, $"missing key 'pf' in {context} (a motor load needs its power factor)");
            pf = null;
        }

        var model = LoadModel.ConstantPower;
        if (m.Optional("model") is { } modelNode && _values.Choice(modelNode, "'model'", "load model", Words.LoadModel.Pairs) is { } chosen)
        {
            model = chosen;
        }

        var start = ReadMotorStart(m, context, kind is LoadKind.Hp or LoadKind.Fla, out var startOk);
        return value is not null && pf is not null && startOk ? new Load(kind, value.Value, pf.Value) { Model = model, Start = start } : null;
    }

    private MotorStart? ReadMotorStart(in MappingReader m, Subject context, bool motor, out bool ok)
    {
        ok = true;
        var given = false;
        foreach (var key in ProjectKeys.MotorStart)
        {
            if (!m.Has(key))
            {
                continue;
            }

            given = true;
            if (!motor)
            {
                bag.Error(m.KeyLocation(key), $"'{key}' in {context} applies to motors only (loads given as 'hp' or 'fla')");
                ok = false;
            }
        }

        if (!motor || !given)
        {
            return null;
        }

        string? letter = null;
        if (m.Optional("code_letter") is { } letterNode && _values.Text(letterNode, context.Of("'code_letter' of ")) is { } text)
        {
            letter = text.ToUpperInvariant();
            if (!CodeLetters.Contains(letter, StringComparer.Ordinal))
            {
                bag.Error(letterNode.Location, $"'{text}' is not a locked-rotor code letter; expected one of {string.Join(", ", CodeLetters)}");
                ok = false;
            }
        }

        if (letter is not null && m.Has("fla"))
        {
            bag.Error(m.KeyLocation("code_letter"), $"a code letter gives kVA per horsepower: {context} needs 'hp' with it, or 'lrc_multiple' with 'fla'");
            ok = false;
        }

        double? multiple = null;
        if (m.Optional("lrc_multiple") is { } multipleNode)
        {
            multiple = _values.Positive(multipleNode, context.Of("'lrc_multiple' of "));
            if (multiple is < 1)
            {
                bag.Error(multipleNode.Location, $"'lrc_multiple' of {context} is the locked-rotor current over the full-load current: at least 1");
                ok = false;
            }

            if (letter is not null)
            {
                bag.Error(multipleNode.Location, $"{context} gives both 'code_letter' and 'lrc_multiple'; give one");
                ok = false;
            }
        }

        var startingPf = MotorStart.DefaultPowerFactor;
        if (m.Optional("starting_pf") is { } spfNode && _values.Number(spfNode, context.Of("'starting_pf' of ")) is { } spf)
        {
            if (spf is <= 0 or > 1)
            {
                bag.Error(spfNode.Location, $"a power factor must be greater than 0 and at most 1; found {ValueReader.Format(spf)}");
                ok = false;
            }

            startingPf = spf;
        }

        return new MotorStart(letter, multiple, startingPf);
    }

    /// <summary>
    /// Reads a feeder or branch run. <paramref name="circuitOcpdA"/> (the circuit's own 'ocpd') becomes the run's
    /// device when the run states none; <paramref name="ocpdLocation"/> is set when the run states one.
    /// </summary>
    private Run? ReadRun(SourceNode node, Subject context, bool branch, out SourceLocation? ocpdLocation, double? circuitOcpdA = null)
    {
        ocpdLocation = null;
        if (Map(node, context, context, ProjectKeys.Run) is not { } m)
        {
            return null;
        }

        var lengthNode = m.Required("length");
        var length = lengthNode is null ? null : _values.LengthM(lengthNode, context.Of("'length' of "), _draft.Units);
        if (branch && length > LongBranchM)
        {
            bag.Warning(lengthNode!.Location, $"{context} is {length.Value.ToString("0.##", CultureInfo.InvariantCulture)} m long, more than 609.6 m (2000 ft); check the length");
        }

        ConductorSize? size = null;
        var sizeNode = m.Required("size", " (e.g. 12 AWG, 250 kcmil or 95 mm2)");
        if (sizeNode is not null && _values.Text(sizeNode, context.Of("'size' of ")) is { } sizeText)
        {
            if (!_sizes.TryGetValue(sizeText, out var parsed))
            {
                parsed.Ok = ConductorSize.TryParse(sizeText, out parsed.Size, out parsed.Error);
                _sizes.Add(sizeText, parsed);
            }

            if (parsed.Ok)
            {
                size = parsed.Size;
            }
            else
            {
                bag.Error(sizeNode.Location, parsed.Error);
            }
        }

        var sets = 1;
        if (m.Optional("sets") is { } setsNode && _values.Integer(setsNode, context.Of("'sets' of ")) is { } s)
        {
            if (s < 1)
            {
                bag.Error(setsNode.Location, $"'sets' of {context} must be 1 or more; found {s}");
            }

            sets = s;
        }

        var defaults = _draft.Defaults;
        var material = m.Optional("material") is { } materialNode ? _values.Choice(materialNode, context.Of("'material' of "), "material", Words.Material.Pairs) : defaults.Material;
        var insulation = m.Optional("insulation_c") is { } insulationNode ? _values.IntegerOf(insulationNode, context.Of("'insulation_c' of "), TemperatureRatings) : defaults.InsulationC;
        var raceway = m.Optional("raceway") is { } racewayNode ? _values.Choice(racewayNode, context.Of("'raceway' of "), "raceway", Words.Raceway.Pairs) : defaults.Raceway;
        double? ocpd = null;
        if (m.Optional("ocpd") is { } ocpdNode)
        {
            ocpd = _values.Positive(ocpdNode, context.Of("'ocpd' of "));
            ocpdLocation = m.KeyLocation("ocpd");
        }

        var limit = m.Optional("limit_percent") is { } limitNode ? _values.Positive(limitNode, context.Of("'limit_percent' of ")) : null;
        var isFixed = m.Optional("fixed") is { } fixedNode && (_values.Bool(fixedNode, context.Of("'fixed' of ")) ?? false);
        if (length is null || size is null || sets < 1 || material is null || insulation is null || raceway is null
            || (m.Optional("ocpd") is not null && ocpd is null) || (m.Optional("limit_percent") is not null && limit is null))
        {
            return null;
        }

        return new Run
        {
            LengthM = length.Value,
            Size = size.Value,
            Sets = sets,
            Material = material.Value,
            InsulationC = insulation.Value,
            Raceway = raceway.Value,
            OcpdA = ocpd ?? circuitOcpdA,
            LimitPercent = limit,
            Fixed = isFixed,
            Location = m.Node.Location,
            SizeLocation = sizeNode!.Location,
        };
    }

    private double? Positive(in MappingReader m, string key) =>
        m.Optional(key) is { } node ? _values.Positive(node, $"'{key}'") : null;

    private string? Id(SourceNode node, string what)
    {
        var id = _values.Text(node, what);
        if (id is not null && id.Contains('/', StringComparison.Ordinal))
        {
            bag.Error(node.Location, $"the id '{id}' must not contain '/' (it joins a panel's id and a circuit's: LP1/3)");
            return null;
        }

        return id;
    }

    private static string? PeekId(SourceMapping mapping)
    {
        foreach (var entry in mapping.Entries)
        {
            if (entry.Key.Value == "id")
            {
                return entry.Value is SourceScalar { IsNull: false } scalar && scalar.Value.Trim() is { Length: > 0 } id ? id : null;
            }
        }

        return null;
    }

    private static string KindWord(EquipmentKind kind) => Words.EquipmentKind.Of(kind);
}
