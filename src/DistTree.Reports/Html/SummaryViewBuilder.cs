using DistTree.Network;
using DistTree.Solving;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// The summary section: the verdict, the count tiles, the worst end point and the table of limits checked.
/// It counts and selects the solver's figures (the worst of each kind is the largest the solver gave); it
/// computes none.
/// </summary>
internal static class SummaryViewBuilder
{
    /// <summary>The verdict's CSS class: fail where any limit is exceeded.</summary>
    public static string VerdictClass(Solution s) => s.HasFindings ? "fail" : "pass";

    /// <summary>The verdict in words.</summary>
    public static string VerdictText(Solution s) => s.HasFindings
        ? $"{Count(s.Summary.Findings)} finding{(s.Summary.Findings == 1 ? "" : "s")}: limits exceeded"
        : "Every run and end point is within its limits";

    /// <summary>The count tiles: end points, runs, equipment, panelboards and findings.</summary>
    public static LabelValue[] Counts(Solution s)
    {
        var nodes = s.Network.Nodes;
        var equipmentCount = nodes.Count(node => node.Kind is not NodeKind.EndPoint and not NodeKind.Service);
        var panelCount = nodes.Count(node => node.Kind == NodeKind.Panelboard);
        return
        [
            new("end points", Count(s.Summary.EndPoints)),
            new("runs", Count(s.Summary.Runs)),
            new("equipment", Count(equipmentCount)),
            new("panelboards", Count(panelCount)),
            new("findings", Count(s.Summary.Findings)),
        ];
    }

    /// <summary>The end point with the largest total, as the solver's summary names it, or null without end points.</summary>
    public static EndPointResult? Worst(Solution s) => s.Summary.WorstEndPoint is { } id ? s.EndPointById(id) : null;

    /// <summary>The table of limits: for each check, its limit, how many it checked, how many fail and the worst figure.</summary>
    public static LimitRow[] Limits(Solution s)
    {
        var rules = s.Project.Rules;
        var over = new int[Enum.GetValues<FindingKind>().Length];
        foreach (var f in s.AllFindings)
        {
            over[(int)f.Kind]++;
        }

        var t = Tally.Of(s);
        return [.. FindingKinds.All.Select(k => Row(k.Kind, rules, s, t, over[(int)k.Kind]))];
    }

    // A check's row: its limit, how many it checked and its worst figure. No fallback arm: a new finding kind does
    // not compile until its row is written here.
    private static LimitRow Row(FindingKind kind, Model.Rules rules, Solution s, Tally t, int over)
    {
        var (limit, checkedCount, worst) = kind switch
        {
            FindingKind.FeederDrop => (Limit(rules.FeederLimitPercent) + " %", t.Feeders, Worst(t.WorstFeeder)),
            FindingKind.BranchDrop => (Limit(rules.BranchLimitPercent) + " %", t.Branches, Worst(t.WorstBranch)),
            FindingKind.TotalDrop => (Escape(RuleText.TotalLimits(s)) + " %", s.EndPoints.Count, s.EndPoints.Count == 0 ? "–" : Percent(s.Summary.WorstTotalDropPercent) + " %"),
            FindingKind.Ampacity => ("allowable ampacity", t.WithAmpacity, "–"),
            FindingKind.OcpdAboveAmpacity => ("conductor ampacity", t.WithOcpd, "–"),
            FindingKind.TransformerOverload => ("nameplate kVA", t.Transformers, "–"),
            FindingKind.MotorStart => (Limit(rules.MotorStartLimitPercent) + " %", t.Motors, Worst(t.WorstDip)),
            FindingKind.NeutralAmpacity => ("neutral's ampacity", t.WithNeutral, "–"),
            FindingKind.DeviceBelowLoad => ("device rating", t.WithOcpd, "–"),
            FindingKind.GroundingConductor => ("minimum for the device", t.WithGround, "–"),
            FindingKind.InterruptingRating => ("stated rating", s.Faults.Equipment.Count(e => e.InterruptingKa is not null), "–"),
            FindingKind.FaultClearing => ("instantaneous trip", FarEndsChecked(s), "–"),
            FindingKind.NoLoadRise => (Limit(s.Project.Sizing.LightLoadRisePercent) + " % at no load", t.Transformers, "–"),
        };
        return LimitRowOf(FindingKinds.Of(kind).Check, limit, checkedCount, over, worst);
    }

    // How many runs' far ends were judged: those whose device's instantaneous trip is known.
    private static int FarEndsChecked(Solution s)
    {
        var count = 0;
        foreach (var r in s.Runs)
        {
            if (r.Kind != RunResultKind.Transformer && s.Faults.FarEndAt(r.NodeIndex) is { TripCurrentA: not null })
            {
                count++;
            }
        }

        return count;
    }

    private static LimitRow LimitRowOf(string name, string limit, int checkedCount, int over, string worst)
    {
        var status = checkedCount == 0 ? "none" : over > 0 ? "fail" : "pass";
        var text = checkedCount == 0 ? "nothing to check" : over > 0 ? "fail" : "pass";
        return new LimitRow(name, limit, Count(checkedCount), Count(over), worst, status, text);
    }

    private static string Worst(double v) => double.IsNegativeInfinity(v) ? "–" : Percent(v) + " %";

    // How many of each kind the limits' checks saw, and the largest figure of each that has one.
    private readonly record struct Tally(
        int Feeders, int Branches, int Transformers, int WithAmpacity, int WithOcpd, int WithNeutral, int WithGround, double WorstFeeder, double WorstBranch, int Motors, double WorstDip)
    {
        public static Tally Of(Solution s)
        {
            int feeders = 0, branches = 0, transformers = 0, withAmpacity = 0, withOcpd = 0, withNeutral = 0, withGround = 0, motors = 0;
            double worstFeeder = double.NegativeInfinity, worstBranch = double.NegativeInfinity, worstDip = double.NegativeInfinity;
            foreach (var r in s.Runs)
            {
                switch (r.Kind)
                {
                    case RunResultKind.Feeder:
                        feeders++;
                        worstFeeder = Math.Max(worstFeeder, r.DropPercent);
                        break;
                    case RunResultKind.Branch:
                        branches++;
                        worstBranch = Math.Max(worstBranch, r.DropPercent);
                        break;
                    default:
                        transformers++;
                        break;
                }

                withAmpacity += r.Kind != RunResultKind.Transformer && r.AmpacityA is not null ? 1 : 0;
                withOcpd += r.OcpdA is not null ? 1 : 0;
                withNeutral += r.NeutralAmpacityA is not null ? 1 : 0;
                withGround += r.GroundSize is not null && r.GroundMinSize is not null ? 1 : 0;
            }

            foreach (var e in s.EndPoints)
            {
                if (e.MotorStart is { } m)
                {
                    motors++;
                    worstDip = Math.Max(worstDip, m.TerminalDipPercent);
                }
            }

            return new Tally(feeders, branches, transformers, withAmpacity, withOcpd, withNeutral, withGround, worstFeeder, worstBranch, motors, worstDip);
        }
    }
}
