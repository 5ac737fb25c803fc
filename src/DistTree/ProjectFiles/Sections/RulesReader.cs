using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>Reads <c>rules</c> (the limits and how the tree is solved) and <c>defaults</c> (what every run inherits) into the draft.</summary>
internal sealed class RulesReader(SectionContext context)
{
    private ValueReader Values => context.Values;

    /// <summary>Reads the <c>rules</c> section, when given; every rule it does not state keeps its code's default.</summary>
    public void ReadRules(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        // The code first: its rule set's defaults are what every rule not stated here keeps.
        var code = ElectricalCode.Nec;
        if (m.Optional("code") is { } codeNode && Values.Choice(codeNode, "'code'", "code", Words.Code.Pairs) is { } chosen)
        {
            code = chosen;
        }

        // The supply next: where the code's limits depend on it, it chooses their defaults.
        var rules = Codes.CodeRules.DefaultsOf(code);
        if (m.Optional("supply") is { } supplyNode && Values.Choice(supplyNode, "'supply'", "supply", Words.Supply.Pairs) is { } supply)
        {
            if (rules.Supply is null)
            {
                context.Bag.Error(supplyNode.Location, ProjectMessages.SupplyNotRead(Words.Code.Of(code)));
            }
            else
            {
                rules = Codes.CodeRules.DefaultsOf(code, supply);
            }
        }

        if (context.InRange(m, "feeder_limit_percent", ValueRanges.LimitPercent) is { } feeder)
        {
            rules = rules with { FeederLimitPercent = feeder };
        }

        if (context.InRange(m, "branch_limit_percent", ValueRanges.LimitPercent) is { } branch)
        {
            rules = rules with { BranchLimitPercent = branch };
        }

        if (context.InRange(m, "total_limit_percent", ValueRanges.LimitPercent) is { } total)
        {
            rules = rules with { TotalLimitPercent = total };
        }

        if (context.InRange(m, "lighting_limit_percent", ValueRanges.LimitPercent) is { } lighting)
        {
            rules = rules with { LightingLimitPercent = lighting };
        }

        if (m.Optional("branch_current") is { } basisNode && Values.Choice(basisNode, "'branch_current'", "branch_current", Words.BranchCurrent.Pairs) is { } basis)
        {
            rules = rules with { BranchCurrent = basis };
        }

        if (m.Optional("conductor_temperature") is { } temperature)
        {
            rules = ReadTemperature(temperature, rules);
        }

        context.Draft.Rules = ReadSolving(m, rules);
        context.Draft.CatalogFile = FilePath(m, "conductor_catalog");
        context.Draft.GroundingTableFile = FilePath(m, "grounding_table");
    }

    // A data file the project brings: its path as written, located at its key (the loader reads it; see TableFileReader).
    private IncludeEntry? FilePath(in MappingReader m, string key) =>
        m.Optional(key) is { } node && Values.Text(node, $"'{key}'") is { } path ? new IncludeEntry(path.Trim(), m.KeyLocation(key)) : null;

    /// <summary>Reads the <c>defaults</c> section, when given; every default it does not state stays the standard one.</summary>
    public void ReadDefaults(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        var defaults = ConductorDefaults.Standard;
        if (m.Optional("material") is { } materialNode && Values.Choice(materialNode, "'material'", "material", Words.Material.Pairs) is { } material)
        {
            defaults = defaults with { Material = material };
        }

        if (m.Optional("insulation_c") is { } insulationNode && Values.IntegerOf(insulationNode, "'insulation_c'", SectionContext.TemperatureRatings) is { } insulation)
        {
            defaults = defaults with { InsulationC = insulation };
        }

        if (m.Optional("raceway") is { } racewayNode && Values.Choice(racewayNode, "'raceway'", "raceway", Words.Raceway.Pairs) is { } raceway)
        {
            defaults = defaults with { Raceway = raceway };
        }

        context.Draft.Defaults = defaults;
    }

    // The rules of how the tree is solved: the transformers' drop, the temperatures, the method, the motor-start limit.
    private Rules ReadSolving(in MappingReader m, Rules rules)
    {
        if (m.Optional("transformer_drop") is { } dropNode && Values.Choice(dropNode, "'transformer_drop'", "transformer_drop", Words.TransformerDrop.Pairs) is { } drop)
        {
            rules = rules with { TransformerDrop = drop };
        }

        if (m.Optional("ambient_c") is { } ambientNode && Values.InRange(ambientNode, "'ambient_c'", ValueRanges.AmbientC) is { } ambient)
        {
            rules = rules with { AmbientC = ambient };
        }

        if (m.Optional("terminal_c") is { } terminalNode && Values.IntegerOf(terminalNode, "'terminal_c'", SectionContext.TemperatureRatings) is { } terminal)
        {
            rules = rules with { TerminalC = terminal };
        }

        if (m.Optional("method") is { } methodNode && Values.Choice(methodNode, "'method'", "method", Words.Method.Pairs) is { } method)
        {
            rules = rules with { Method = method };
        }

        if (context.InRange(m, "motor_start_limit_percent", ValueRanges.LimitPercent) is { } motorStart)
        {
            rules = rules with { MotorStartLimitPercent = motorStart };
        }

        if (context.InRange(m, "fault_voltage_factor_max", ValueRanges.VoltageFactor) is { } factorMax)
        {
            rules = rules with { FaultVoltageFactorMax = factorMax };
        }

        if (context.InRange(m, "fault_voltage_factor_min", ValueRanges.VoltageFactor) is { } factorMin)
        {
            rules = rules with { FaultVoltageFactorMin = factorMin };
        }

        return rules;
    }

    // A number in °C fixes the temperature; a word chooses how it is found.
    private Rules ReadTemperature(SourceNode node, Rules rules)
    {
        if (node is SourceScalar { IsPlain: true } scalar && ValueReader.IsNumberText(scalar.Value))
        {
            return Values.InRange(node, "'conductor_temperature'", ValueRanges.ConductorTemperatureC) is { } c
                ? rules with { Temperature = TemperatureMode.Fixed, FixedTemperatureC = c }
                : rules;
        }

        var text = Values.Text(node, "'conductor_temperature'");
        if (text is null)
        {
            return rules;
        }

        if (Words.Temperature.TryRead(text, out var mode))
        {
            return rules with { Temperature = mode };
        }

        context.Bag.Error(node.Location, ProjectMessages.UnknownTemperature(text, Suggestions.Closest(text, Words.Temperature.Words)));
        return rules;
    }
}
