using System.Globalization;
using System.Text.Json;
using DistTree.Sizing;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>Formats an upsize plan: console text, and the <c>upsize_plan</c> object of the results document.</summary>
public static class PlanReport
{
    /// <summary>The plan as text: each change, the total, what no size can fix; text from the input escaped (<see cref="DisplayWriter"/>).</summary>
    public static void WriteConsole(TextWriter o, UpsizePlan plan)
    {
        o = DisplayWriter.Over(o);
        var p = plan.Before.Project;
        o.WriteLine($"DistTree upsize plan: {p.Name}");
        o.WriteLine($"  file   {p.File} (sha256 {p.Sha256[..12]}…)");
        o.WriteLine(F($"  before {plan.Before.Summary.Findings} findings, worst total {plan.Before.Summary.WorstTotalDropPercent:0.00} %; after {plan.After.Summary.Findings} findings, worst total {plan.After.Summary.WorstTotalDropPercent:0.00} %"));
        o.WriteLine();
        if (plan.Changes.Count == 0 && plan.TapChanges.Count == 0)
        {
            o.WriteLine("No run needs a larger size.");
        }
        else if (plan.Changes.Count == 0)
        {
            o.WriteLine("No run needs a larger size.");
            WriteTaps(o, plan);
        }
        else
        {
            o.WriteLine(F($"{"run",-14} {"kind",-7} {"size before → after",-34} {"drop before → after",-22} {"added (" + plan.CostUnit + ")",14}"));
            foreach (var c in plan.Changes)
            {
                var sizes = $"{Sets(c.SetsBefore)}{c.SizeBefore} → {Sets(c.SetsAfter)}{c.SizeAfter}";
                var drops = F($"{c.DropPercentBefore:0.00} % → {c.DropPercentAfter:0.00} %");
                o.WriteLine(F($"{c.RunId,-14} {Kind(c.Kind),-7} {sizes,-34} {drops,-22} {c.CostAdded,14:0.#}"));
                if (c.GroundingNote is { } note)
                {
                    o.WriteLine($"{"",-14} grounding conductor: {note}");
                }

                if (c.FaultClearingNote is { } fault)
                {
                    o.WriteLine($"{"",-14} fault at the far end: {fault}");
                }
            }

            o.WriteLine(F($"Total added: {plan.TotalCostAdded:0.#} {plan.CostUnit} over {plan.Changes.Count} runs{(plan.TapChanges.Count > 0 ? " and the taps below" : "")}."));
            WriteTaps(o, plan);
        }

        if (plan.Unresolvable.Count > 0)
        {
            o.WriteLine();
            o.WriteLine("No allowed size fixes these:");
            foreach (var u in plan.Unresolvable)
            {
                o.WriteLine($"  {u.Message}");
            }
        }

        if (plan.Cautions.Count > 0)
        {
            o.WriteLine();
            o.WriteLine("Stated taps over the light-load limit (kept as stated):");
            foreach (var c in plan.Cautions)
            {
                o.WriteLine($"  {c.Message}");
            }
        }

        o.WriteLine();
        o.WriteLine("The plan was proved by solving the tree again with it applied.");
        o.WriteLine($"Caution: {Caution.For(plan.After.Project.Rules.Code)}");
    }

    // The taps the plan sets, one line each, with the transformer's regulation before and after and what setting it costs.
    private static void WriteTaps(TextWriter o, UpsizePlan plan)
    {
        if (plan.TapChanges.Count == 0)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine("Transformer taps to set:");
        foreach (var t in plan.TapChanges)
        {
            var cost = t.CostAdded > 0 ? F($"{t.CostAdded:0.#} {plan.CostUnit}") : "free";
            o.WriteLine(F($"  {t.TransformerId}: tap_percent {t.TapPercentBefore:0.#} → {t.TapPercentAfter:0.#} (regulation {t.RegulationPercentBefore:0.00} % → {t.RegulationPercentAfter:0.00} %), {cost}"));
        }
    }

    /// <summary>Writes the <c>upsize_plan</c> property.</summary>
    public static void WriteJson(Utf8JsonWriter w, UpsizePlan plan)
    {
        w.WriteStartObject("upsize_plan");
        w.WriteString("cost_unit", plan.CostUnit);
        JsonResults.Number(w, "total_cost_added", plan.TotalCostAdded, 3);
        w.WriteNumber("findings_before", plan.Before.Summary.Findings);
        w.WriteNumber("findings_after", plan.After.Summary.Findings);
        JsonResults.Number(w, "worst_total_drop_percent_after", plan.After.Summary.WorstTotalDropPercent, 4);
        w.WriteStartArray("changes");
        foreach (var c in plan.Changes)
        {
            w.WriteStartObject();
            w.WriteString("run", c.RunId);
            w.WriteString("kind", Kind(c.Kind));
            w.WriteString("size_before", c.SizeBefore);
            w.WriteString("size_after", c.SizeAfter);
            w.WriteNumber("sets_before", c.SetsBefore);
            w.WriteNumber("sets_after", c.SetsAfter);
            JsonResults.Number(w, "drop_percent_before", c.DropPercentBefore, 4);
            JsonResults.Number(w, "drop_percent_after", c.DropPercentAfter, 4);
            JsonResults.Number(w, "cost_added", c.CostAdded, 3);
            if (c.GroundingNote is { } note)
            {
                w.WriteString("grounding_note", note);
            }
            else
            {
                w.WriteNull("grounding_note");
            }

            NullableString(w, "ground_min_size", c.GroundMinSize);
            NullableString(w, "ground_size", c.GroundSize);
            w.WriteBoolean("ground_must_increase", c.GroundMustIncrease);
            NullableString(w, "ground_size_after", c.GroundSizeAfter);
            NullableString(w, "fault_clearing_note", c.FaultClearingNote);

            w.WriteNumber("line", c.SizeLocation.Line);
            w.WriteNumber("column", c.SizeLocation.Column);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteStartArray("tap_changes");
        foreach (var t in plan.TapChanges)
        {
            w.WriteStartObject();
            w.WriteString("transformer", t.TransformerId);
            JsonResults.Number(w, "tap_percent_before", t.TapPercentBefore, 2);
            JsonResults.Number(w, "tap_percent_after", t.TapPercentAfter, 2);
            JsonResults.Number(w, "regulation_percent_before", t.RegulationPercentBefore, 4);
            JsonResults.Number(w, "regulation_percent_after", t.RegulationPercentAfter, 4);
            JsonResults.Number(w, "cost_added", t.CostAdded, 3);
            w.WriteNumber("line", t.Location.Line);
            w.WriteNumber("column", t.Location.Column);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        Notes(w, "unresolvable", plan.Unresolvable.Select(u => (u.Subject, u.Message)));

        // Written only where a stated tap is over the light-load limit, so a plan without one reads as before.
        if (plan.Cautions.Count > 0)
        {
            Notes(w, "cautions", plan.Cautions.Select(c => (c.Subject, c.Message)));
        }

        w.WriteEndObject();
    }

    // An array of notes, each a subject and a message.
    private static void Notes(Utf8JsonWriter w, string name, IEnumerable<(string Subject, string Message)> notes)
    {
        w.WriteStartArray(name);
        foreach (var (subject, message) in notes)
        {
            w.WriteStartObject();
            w.WriteString("subject", subject);
            w.WriteString("message", message);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void NullableString(Utf8JsonWriter w, string name, string? value)
    {
        if (value is null)
        {
            w.WriteNull(name);
        }
        else
        {
            w.WriteString(name, value);
        }
    }

    private static string Sets(int sets) => sets > 1 ? $"{sets}×" : "";

    private static string Kind(RunResultKind kind) => Words.RunKind.Of(kind == RunResultKind.Branch ? RunResultKind.Branch : RunResultKind.Feeder);

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
