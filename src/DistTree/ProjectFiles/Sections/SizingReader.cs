using DistTree.Conductors;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles.Sections;

/// <summary>Reads <c>sizing</c>: what the sizer may choose and what conductors cost.</summary>
internal sealed class SizingReader(SectionContext context)
{
    private ValueReader Values => context.Values;

    /// <summary>Reads the <c>sizing</c> section, when given; every option it does not state keeps its default.</summary>
    public void Read(MappingReader? section)
    {
        if (section is not { } m)
        {
            return;
        }

        var sizing = SizingOptions.Default;
        if (m.Optional("max_sets") is { } setsNode && Values.WholeInRange(setsNode, "'max_sets'", ValueRanges.MaxSetsRange) is { } sets)
        {
            sizing = sizing with { MaxSets = sets };
        }

        if (m.Optional("currency") is { } currencyNode && Values.Text(currencyNode, "'currency'") is { } currency)
        {
            sizing = sizing with { Currency = currency };
        }

        if (context.InRange(m, "resolution_percent", ValueRanges.ResolutionPercent) is { } resolution)
        {
            sizing = sizing with { ResolutionPercent = resolution };
        }

        if (context.InRange(m, "tap_cost", ValueRanges.TapCost) is { } tapCost)
        {
            sizing = sizing with { TapCost = tapCost };
        }

        if (context.InRange(m, "light_load_rise_percent", ValueRanges.LightLoadRisePercent) is { } rise)
        {
            sizing = sizing with { LightLoadRisePercent = rise };
        }

        if (m.Optional("terminal_table") is { } tableNode && Values.Text(tableNode, "'terminal_table'") is { } tablePath)
        {
            context.Draft.TerminalTableFile = new IncludeEntry(tablePath.Trim(), m.KeyLocation("terminal_table"));
        }

        if (m.Optional("prices") is { } pricesNode)
        {
            sizing = sizing with { Prices = ReadPrices(pricesNode) };
        }

        context.Draft.Sizing = sizing;
    }

    private Dictionary<ConductorSize, double> ReadPrices(SourceNode node)
    {
        var prices = new Dictionary<ConductorSize, double>();
        if (node is not SourceMapping mapping)
        {
            if (!node.IsInvalid)
            {
                context.Bag.Error(node.Location, ProjectMessages.PricesNotMapping(node));
            }

            return prices;
        }

        foreach (var (key, value) in mapping.Entries)
        {
            if (!SizeText.TryParse(key.Value, "a size in 'prices'", out var size, out var error))
            {
                context.Bag.Error(key.Location, error);
                continue;
            }

            if (prices.ContainsKey(size))
            {
                context.Bag.Error(key.Location, ProjectMessages.PriceTwice(size));
                continue;
            }

            if (Values.InRange(value, $"the price of {size}", ValueRanges.Price) is { } price)
            {
                prices[size] = price;
            }
        }

        return prices;
    }
}
