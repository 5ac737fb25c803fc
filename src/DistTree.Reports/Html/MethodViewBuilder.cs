using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The method and data section: which method the findings rest on, the load flow's outcome, the conductor
/// catalogue's columns and what each rule means with its value in force.
/// </summary>
internal static class MethodViewBuilder
{
    /// <summary>The load flow's tolerance, per unit, as the page prints it.</summary>
    public static string Tolerance => LoadFlow.TolerancePu.ToString("0e0", System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>The method in words.</summary>
    public static string MethodName(SolutionMethod method) => method == SolutionMethod.LoadFlow ? "load flow" : "percent sum";

    /// <summary>The method not in force.</summary>
    public static SolutionMethod Other(SolutionMethod method) =>
        method == SolutionMethod.LoadFlow ? SolutionMethod.PercentSum : SolutionMethod.LoadFlow;

    /// <summary>Whether the load flow converged, and in how many sweeps, in words.</summary>
    public static string LoadFlowText(LoadFlowResult flow) => flow.Converged
        ? $"converged in {Count(flow.Iterations)} sweep{(flow.Iterations == 1 ? "" : "s")} (tolerance {Tolerance} pu)"
        : $"did not converge in {Count(flow.Iterations)} sweeps (tolerance {Tolerance} pu); its figures are left out";

    /// <summary>The CSS class of the load flow's outcome.</summary>
    public static string LoadFlowClass(LoadFlowResult flow) => flow.Converged ? "pass" : "fail";

    /// <summary>
    /// The header (the source of each column) of the catalogue the solution used where it is the embedded one or the
    /// project's own (<c>rules: conductor_catalog</c>), else none; escaped.
    /// </summary>
    public static string[] CatalogHeader(Solution s) =>
        string.Equals(s.CatalogName, ConductorCatalog.Standard.SourceName, StringComparison.Ordinal)
            ? ConductorCatalog.Standard.Header.Select(Escape).ToArray()
            : s.Project.Rules.ConductorCatalog is { } own ? own.Header.Select(Escape).ToArray() : [];

    /// <summary>
    /// The columns of that catalogue with values recalled rather than read (see <see cref="CatalogNotes"/>), escaped: what
    /// the page says once, in place of the header's notes.
    /// </summary>
    public static CatalogNotes.RecalledColumn[] CatalogRecalled(Solution s)
    {
        var header = string.Equals(s.CatalogName, ConductorCatalog.Standard.SourceName, StringComparison.Ordinal)
            ? ConductorCatalog.Standard.Header
            : s.Project.Rules.ConductorCatalog?.Header ?? [];
        return [.. CatalogNotes.Recalled(header).Select(c => new CatalogNotes.RecalledColumn(Escape(c.Column), Escape(c.What)))];
    }

    /// <summary>What the page says of the grounding table the project brings, or null where it brings none.</summary>
    public static GroundingTableView? GroundingTable(Solution s) => s.Project.Rules.GroundingTable is { } table
        ? new GroundingTableView(
            Escape(table.SourceName),
            Escape(s.Code.OwnGroundingTable is { } own ? $"in place of {own.SourceName}" : $"the only grounding table: {s.Code.Name} holds none of its own"),
            table.Header.Select(Escape).ToArray())
        : null;

    // The rows of the rules the project brings as files, only where it brings them.
    private static IEnumerable<RuleMeaning> OwnTables(Rules r)
    {
        if (r.ConductorCatalog is { } catalog)
        {
            yield return new("conductor_catalog", Escape(catalog.SourceName), "The project's own conductor catalogue, in the embedded one's layout: its ampacities, resistances and reactances take the place of the embedded catalogue's in the whole analysis (the solve, the sizing and its proof).");
        }

        if (r.GroundingTable is { } table)
        {
            yield return new("grounding_table", Escape(table.SourceName), "The project's own table of equipment grounding conductors by device rating, in place of the rule set's own: a device takes the row of the smallest rating at or above it; the rule set's other steps (NEC: 250.122(A), (B) and (F)) still apply.");
        }
    }

    /// <summary>Each rule, its value in force and what it means.</summary>
    public static RuleMeaning[] Meanings(Rules r) =>
    [
        new("code", Escape(RuleText.Code(r)), "The code whose rule set judges the design: its limits' defaults, the current each check uses, the conductor and device rules, and the clause each finding cites."),
        new("feeder_limit_percent", Limit(r.FeederLimitPercent) + " %", "The largest drop allowed in any one feeder, in percent of the voltage it carries. A run may set its own limit_percent."),
        new("branch_limit_percent", Limit(r.BranchLimitPercent) + " %", "The largest drop allowed in any one branch circuit, in percent of the circuit voltage."),
        new("total_limit_percent", Limit(r.TotalLimitPercent) + " %", "The largest sum of the percent drops from the service (or from a new origin, below) to any point of use."),
        .. LimitMeanings(r),
        new("branch_current", Escape(RuleText.BranchCurrent(r)), "The current a branch circuit's drop is computed at: connected = the connected load; ocpd_80 = 80 % of the overcurrent device rating; lesser = the smaller of the two."),
        new("conductor_temperature", Escape(RuleText.Temperature(r)), "The temperature of the conductor resistance: estimated = from loading (formula above); rated = the insulation rating; a number = that temperature in °C."),
        new("transformer_drop", Escape(RuleText.TransformerDrop(r)), "count = a transformer's regulation adds to the totals below it; new_origin = its secondary starts a new total budget."),
        new("ambient_c", Limit(r.AmbientC) + " °C", "Ambient temperature for ampacity correction and for the temperature estimate."),
        new("terminal_c", Count(r.TerminalC) + " °C", "Terminal rating: the ampacity column used is at most this temperature."),
        new("method", RuleText.Method(r), "Which figures the findings rest on: percent_sum = the sum of the runs' drops by the effective-impedance formula; load_flow = the backward/forward sweep. Both are computed and shown."),
        new("motor_start_limit_percent", Limit(r.MotorStartLimitPercent) + " %", "The largest dip allowed at a motor's terminals while it starts."),
        .. OwnTables(r),
    ];

    // The rows of the limits that vary by end point, where the rules have them.
    private static RuleMeaning[] LimitMeanings(Rules r)
    {
        var rows = new List<RuleMeaning>();
        if (r.Supply is { } supply)
        {
            rows.Add(new("supply", Words.Supply.Of(supply), "Who supplies the installation: public = directly from a public low-voltage network; private = from the installation's own transformer or generator. The code's limits depend on it."));
        }

        if (r.LightingLimitPercent is { } lighting)
        {
            rows.Add(new("lighting_limit_percent", Limit(lighting) + " %", "The total limit of an end point whose load is lighting (category: lighting); every other load takes total_limit_percent."));
        }

        if (r.LongPathAllowance is { } a)
        {
            rows.Add(new(
                "long-path allowance",
                Escape(string.Create(CultureInfo.InvariantCulture, $"+ {a.PercentPerM:0.###} % per m beyond {a.FromM:0.#} m, at most + {a.MaxPercent:0.##} %")),
                "The code lets an end point's total limit grow with the length of the wiring from its origin; set by the code, not a key."));
        }

        return [.. rows];
    }
}
