using System.Globalization;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>
/// Formats a solution as plain text for a terminal: a summary, the worst paths, every finding. Text from the input
/// (names, paths) is shown with its control characters escaped (<see cref="DisplayWriter"/>).
/// </summary>
public static partial class ConsoleReport
{
    /// <summary>The full analysis text.</summary>
    public static void WriteAnalysis(TextWriter o, Solution s, int worst)
    {
        o = DisplayWriter.Over(o);
        var p = s.Project;
        o.WriteLine($"DistTree analysis: {p.Name}");
        o.WriteLine($"  file   {p.File} (sha256 {p.Sha256[..12]}…)");
        o.WriteLine($"  rules  {RuleText.Summary(p.Rules)}");
        o.WriteLine();
        WriteSummaryLine(o, s);
        o.WriteLine();
        o.WriteLine(F($"Worst paths (total drop; each run's share in percent, service first):"));
        var unit = s.Project.Units == UnitSystem.Imperial ? "ft" : "m";
        o.WriteLine($"  (reach, {unit}: the length at which a run's own drop would reach its own limit / at which the end point would reach the total limit, other things equal; of its length; over: below it)");
        var rank = 0;
        foreach (var e in s.WorstEndPoints(worst))
        {
            rank++;
            o.WriteLine(F($"  {rank,3}. {e.Id,-14} {e.TotalDropPercent,6:0.00} % of {e.LimitPercent:0.##} %  {Truncate(e.Name, 40)}  {PathVerdict(s, e)}"));
            var shares = e.RunIndices.Zip(e.RunSharesPercent).Select(p => F($"{Label(s.Runs[p.First])} {p.Second:0.00}"));
            o.WriteLine($"        {string.Join("  +  ", shares)}");
            o.WriteLine($"        reach {unit}  {string.Join("  +  ", e.RunIndices.Select(r => Reach(s.Runs[r], s.Project.Units)))}");
            WriteFarEnds(o, s, e);
        }

        o.WriteLine();
        if (s.Panels.Count > 0)
        {
            o.WriteLine("Panels (kVA per line after demand, neutral, imbalance):");
            foreach (var panel in s.Panels)
            {
                var lines = string.Join(" / ", panel.LineVa.Select(va => F($"{va / 1000:0.0}")));
                var neutral = panel.NeutralCurrentA is { } n ? F($"N {n:0.0} A") : "no neutral";
                o.WriteLine(F($"  {panel.Id,-10} {panel.System,-9} {lines,-22} {neutral,-12} imbalance {panel.ImbalancePercent:0.0} %"));
            }

            o.WriteLine();
        }

        WriteFaults(o, s);
        WriteFindings(o, s);
        o.WriteLine();
        o.WriteLine($"Caution: {Caution.For(s.Project.Rules.Code)}");
    }

    /// <summary>The terse check text: a verdict line and the findings.</summary>
    public static void WriteCheck(TextWriter o, Solution s)
    {
        o = DisplayWriter.Over(o);
        var verdict = s.HasFindings ? "FAIL" : "PASS";
        o.WriteLine(F($"{verdict}: {s.Project.File}: {s.Summary.EndPoints} end points, {s.Summary.Findings} findings, worst total {s.Summary.WorstTotalDropPercent:0.00} % at {s.Summary.WorstEndPoint ?? "-"}"));
        foreach (var f in s.AllFindings)
        {
            o.WriteLine($"{f.Location}: {f.Code}: {f.Message} [{f.Reference}]");
        }
    }

    private static void WriteSummaryLine(TextWriter o, Solution s)
    {
        var sum = s.Summary;
        o.WriteLine(F($"Summary: {sum.EndPoints} end points, {sum.Runs} runs, {sum.Findings} findings; worst total {sum.WorstTotalDropPercent:0.00} % at {sum.WorstEndPoint ?? "-"} (limit {RuleText.TotalLimits(s)} %)"));
        var byKind = s.AllFindings.GroupBy(f => f.Code).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} {g.Count()}");
        if (sum.Findings > 0)
        {
            o.WriteLine($"Findings by kind: {string.Join(", ", byKind)}");
        }
    }

    private static void WriteFindings(TextWriter o, Solution s)
    {
        if (!s.HasFindings)
        {
            o.WriteLine("Findings: none; every run and end point is within its limits.");
            return;
        }

        o.WriteLine(F($"Findings ({s.Summary.Findings}):"));
        foreach (var f in s.AllFindings)
        {
            o.WriteLine($"  {f.Location}: {f.Code}: {f.Message} [{f.Reference}]");
        }
    }

    // What the path fails, by the codes of its findings (the end point's, then its runs', service side first, each
    // once), or "ok": a path over its total limit and one that fails another check say which.
    private static string PathVerdict(Solution s, EndPointResult e)
    {
        var failed = e.Findings.Select(f => f.Code)
            .Concat(e.RunIndices.SelectMany(r => s.Runs[r].Findings).Select(f => f.Code))
            .Distinct(StringComparer.Ordinal)
            .ToArray();
        return failed.Length == 0 ? "ok" : "fails: " + string.Join(", ", failed);
    }

    // A run's reach by its own limit and by the total's, of its length, in the project's length unit; "over" where
    // either is below its length. A transformer has none.
    private static string Reach(RunResult r, UnitSystem units)
    {
        if (r.Kind == RunResultKind.Transformer)
        {
            return $"{Label(r)} –";
        }

        var over = r.MaxLengthM < r.LengthM || r.MaxLengthTotalM < r.LengthM ? " over" : "";
        return $"{r.Id} {Length(r.MaxLengthM, units)}/{Length(r.MaxLengthTotalM, units)} of {Length(r.LengthM, units)}{over}";
    }

    // A length given in metres, in the project's unit: metres to 0.1, or whole feet; a dash for none.
    private static string Length(double? metres, UnitSystem units) => metres switch
    {
        null => "–",
        { } m when units == UnitSystem.Imperial => F($"{m / UnitFactors.MetresPerFoot:0}"),
        { } m => F($"{m:0.0}"),
    };

    private static string Label(RunResult r) => r.Kind == RunResultKind.Transformer ? $"{r.Id}(xfmr)" : r.Id;

    private static string Truncate(string text, int length) => text.Length <= length ? text : DisplayText.Prefix(text, length - 1) + "…";

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
