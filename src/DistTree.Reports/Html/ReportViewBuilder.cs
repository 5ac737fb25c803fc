using DistTree.Model;
using DistTree.Solving;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// Turns a solution into the escaped, formatted view the template prints, section by section: the header and
/// summary (<see cref="SummaryViewBuilder"/>), the comparison (<see cref="ComparisonViewBuilder"/>), the tree
/// (<see cref="TreeViewBuilder"/>), the worst paths (<see cref="PathsViewBuilder"/>), the panels
/// (<see cref="PanelViewBuilder"/>), the available fault current (<see cref="FaultViewBuilder"/>), motor starting (<see cref="MotorRowBuilder"/>), the findings
/// (<see cref="FindingGroupBuilder"/>), the upsize plan (<see cref="PlanViewBuilder"/>) and the method and data
/// (<see cref="MethodViewBuilder"/>). They select, sort and format the solver's figures; they compute no
/// electrical figure. What is below each node is gathered once (<see cref="NodeRollup"/>), so the work grows
/// linearly with the tree.
/// </summary>
internal static class ReportViewBuilder
{
    /// <summary>End points above which each panel lists only its worst circuits, and each kind of finding its first ones.</summary>
    public const int LargeProjectEndPoints = 2000;

    /// <summary>Builds the view of <paramref name="s"/>.</summary>
    public static ReportView Build(Solution s, HtmlReportOptions options, string css)
    {
        var p = s.Project;
        var rules = p.Rules;
        var large = s.EndPoints.Count > LargeProjectEndPoints;
        var below = NodeRollup.Of(s);
        var worst = SummaryViewBuilder.Worst(s);
        var findings = FindingGroupBuilder.ByKind(s);
        var motors = MotorRowBuilder.Motors(s);
        var faults = FaultViewBuilder.Build(s, i => below.OwnCircuits[i] > 0 ? $"#panel-{Count(i)}" : "");
        return new ReportView
        {
            Title = Escape(options.Title ?? $"{p.Name} · voltage-drop review"),
            ProjectName = Escape(p.Name),
            File = Escape(p.File),
            Sha256 = Escape(p.Sha256),
            Date = options.Date is null ? null : Escape(options.Date),
            CatalogName = Escape(s.CatalogName),
            Rules = Escape(RuleText.Summary(rules)),
            Caution = Escape(Caution.For(s.Project.Rules.Code)),
            CodeTitle = Escape($"{s.Code.Title} ({s.Code.ClauseSource})"),
            AmpacitySource = Escape(s.Code.AmpacitySource),
            DesignCurrentFormula = Formula(s.Code.DesignCurrentFormula),
            DesignCurrentRule = Content(s.Code.DesignCurrentRule),
            Css = css,
            VerdictClass = SummaryViewBuilder.VerdictClass(s),
            VerdictText = SummaryViewBuilder.VerdictText(s),
            Counts = SummaryViewBuilder.Counts(s),
            WorstId = worst is { } w ? Escape(w.Id) : null,
            WorstName = worst is { } v ? Escape(v.Name) : null,
            WorstTotal = Percent(s.Summary.WorstTotalDropPercent),
            WorstBand = worst is { } b ? Bands.Class(Bands.Of(b)) : "none",
            TotalLimit = worst is { } limited ? Limit(limited.LimitPercent) : Limit(rules.TotalLimitPercent),
            Limits = SummaryViewBuilder.Limits(s),
            FindingKinds = FindingGroupBuilder.Counts(findings),
            Paths = PathsViewBuilder.Build(s, options.Worst),
            Tree = TreeViewBuilder.Build(s, below),
            Panels = PanelViewBuilder.Build(s, below, large),
            PanelRule = PanelViewBuilder.Rule(s, large),
            ShowFeet = p.Units == UnitSystem.Imperial,
            LengthUnit = p.Units == UnitSystem.Imperial ? "ft" : "m",
            Findings = FindingGroupBuilder.Groups(findings, large),
            FindingsRule = FindingGroupBuilder.Rule(large),
            Plan = options.Plan is { } plan ? PlanViewBuilder.Build(plan) : null,
            Comparison = options.Comparison is { } comparison ? ComparisonViewBuilder.Build(comparison, id => PanelAnchor(s, id)) : null,
            Faults = faults,
            Num = Numbers(options, motors.Count > 0, faults is not null),
            MethodText = MethodViewBuilder.MethodName(rules.Method),
            OtherMethodText = MethodViewBuilder.MethodName(MethodViewBuilder.Other(rules.Method)),
            LoadFlowText = MethodViewBuilder.LoadFlowText(s.LoadFlow),
            LoadFlowClass = MethodViewBuilder.LoadFlowClass(s.LoadFlow),
            Tolerance = MethodViewBuilder.Tolerance,
            Motors = MotorRowBuilder.Rows(s, motors),
            MotorsMore = MotorRowBuilder.More(motors),
            MotorLimit = Limit(rules.MotorStartLimitPercent),
            AnyPoints = s.Network.Nodes.Any(node => node.Circuit is { Points.Count: > 0 }),
            CatalogHeader = MethodViewBuilder.CatalogHeader(s),
            CatalogRecalled = MethodViewBuilder.CatalogRecalled(s),
            OwnCatalogName = rules.ConductorCatalog is { } own ? Escape(own.SourceName) : null,
            GroundingTable = MethodViewBuilder.GroundingTable(s),
            RuleMeanings = MethodViewBuilder.Meanings(rules),
            NearPercent = Count((int)Math.Round(Bands.NearFraction * 100)),
        };
    }

    // The link to the panel table of the end point with this id, or none where the page has no such end point.
    private static string PanelAnchor(Solution s, string id) => s.EndPointById(id) is { } e ? PanelViewBuilder.AnchorOf(s, e) : "";

    private static SectionNumbers Numbers(HtmlReportOptions options, bool motors, bool faults)
    {
        var n = 0;
        string Next() => Count(++n);
        string? NextIf(bool shown) => shown ? Next() : null;
        return new SectionNumbers(
            Summary: Next(),
            Comparison: NextIf(options.Comparison is not null),
            Tree: Next(),
            Worst: Next(),
            Panels: Next(),
            Faults: NextIf(faults),
            Motors: NextIf(motors),
            Findings: Next(),
            Plan: NextIf(options.Plan is not null),
            Method: Next());
    }
}
