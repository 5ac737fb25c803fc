using System.Globalization;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>The words and codes that outputs use for the rules in force.</summary>
public static class RuleText
{
    /// <summary>The <c>branch_current</c> value as written in project files.</summary>
    public static string BranchCurrent(Rules rules) => Words.BranchCurrent.Of(rules.BranchCurrent);

    /// <summary>The <c>conductor_temperature</c> value as written in project files.</summary>
    public static string Temperature(Rules rules) => Words.TemperatureOf(rules);

    /// <summary>The <c>transformer_drop</c> value as written in project files.</summary>
    public static string TransformerDrop(Rules rules) => Words.TransformerDrop.Of(rules.TransformerDrop);

    /// <summary>The code and edition the checks assume: <c>NEC 2020</c>.</summary>
    public static string Code(Rules rules) => Codes.CodeRules.Describe(rules.Code);

    /// <summary>The <c>method</c> value as written in project files.</summary>
    public static string Method(Rules rules) => Words.Method.Of(rules.Method);

    /// <summary>
    /// The total limit of <paramref name="s"/>'s end points, without its unit: one figure where every end point has the
    /// same, else the least and the largest (<c>3–5.5</c>).
    /// </summary>
    public static string TotalLimits(Solving.Solution s)
    {
        ArgumentNullException.ThrowIfNull(s);
        var (least, largest) = (s.Project.Rules.TotalLimitPercent, s.Project.Rules.TotalLimitPercent);
        if (s.Project.Rules.TotalLimitVaries && s.EndPoints.Count > 0)
        {
            (least, largest) = (s.EndPoints.Min(e => e.LimitPercent), s.EndPoints.Max(e => e.LimitPercent));
        }

        return least == largest
            ? string.Create(CultureInfo.InvariantCulture, $"{least:0.##}")
            : string.Create(CultureInfo.InvariantCulture, $"{least:0.##}–{largest:0.##}");
    }

    /// <summary>The total-limit part of <see cref="Summary"/>: the limit, and for lighting and long paths their own.</summary>
    private static string Total(Rules rules) => string.Create(CultureInfo.InvariantCulture, $"total {rules.TotalLimitPercent:0.##} %")
        + (rules.LightingLimitPercent is { } lighting ? string.Create(CultureInfo.InvariantCulture, $", lighting {lighting:0.##} %") : "")
        + (rules.LongPathAllowance is { } a ? string.Create(CultureInfo.InvariantCulture, $", + {a.PercentPerM:0.###} % per m beyond {a.FromM:0.#} m, at most + {a.MaxPercent:0.##} %") : "")
        + (rules.Supply is { } supply ? $" ({Words.Supply.Of(supply)} supply)" : "");

    /// <summary>One line summing up the rules.</summary>
    public static string Summary(Rules rules) => string.Create(
        CultureInfo.InvariantCulture,
        $"{Code(rules)}; feeder {rules.FeederLimitPercent:0.##} %, branch {rules.BranchLimitPercent:0.##} %, {Total(rules)}; " +
        $"branch current: {BranchCurrent(rules)}; conductor temperature: {Temperature(rules)}; transformers: {TransformerDrop(rules)}; " +
        $"ambient {rules.AmbientC:0.#} °C; terminals {rules.TerminalC} °C{OwnTables(rules)}");

    /// <summary>The tables the project brings, named by their files, after '; ' each; empty when it brings none.</summary>
    public static string OwnTables(Rules rules) =>
        (rules.ConductorCatalog is { } catalog ? $"; conductor catalogue: {catalog.SourceName}" : "") +
        (rules.GroundingTable is { } table ? $"; grounding table: {table.SourceName}" : "");
}
