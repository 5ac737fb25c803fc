using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using DistTree.Comparing;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>
/// Writes a comparison as the document <c>disttree-comparison/1</c>: snake_case, SI units, figures rounded for
/// reading (percent to 4 decimals, changes in percentage points to 6, amperes and volts to 3). The same
/// comparison always gives the same bytes.
/// </summary>
public static class ComparisonJson
{
    /// <summary>The format identifier.</summary>
    public const string Format = "disttree-comparison/1";

    private static readonly JsonWriterOptions Options = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The document as UTF-8 text, ending in a newline.</summary>
    public static string Write(Comparison c)
    {
        ArgumentNullException.ThrowIfNull(c);
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, Options))
        {
            w.WriteStartObject();
            w.WriteString("format", Format);
            w.WriteString("caution", Caution.For(c.Before.Code, c.After.Code));
            w.WriteStartObject("tolerance");
            w.WriteNumber("percent_points", ComparisonTolerance.PercentPoints);
            w.WriteNumber("relative", ComparisonTolerance.Relative);
            w.WriteEndObject();
            WriteRevision(w, "before", c.Before);
            WriteRevision(w, "after", c.After);
            WriteSummary(w, c);
            w.WriteStartArray("project_changes");
            foreach (var f in c.ProjectChanges)
            {
                WriteField(w, f);
            }

            w.WriteEndArray();
            WriteElements(w, "equipment", c.Equipment);
            WriteElements(w, "circuits", c.Circuits);
            w.WriteStartArray("end_points");
            foreach (var e in c.EndPoints)
            {
                WriteEndPoint(w, e);
            }

            w.WriteEndArray();
            WriteRuns(w, "runs", c.Runs);
            WriteRuns(w, "upstream_runs", c.UpstreamRuns);
            WriteFaults(w, c.Faults);
            WriteFindings(w, "new_findings", c.NewFindings);
            WriteFindings(w, "resolved_findings", c.ResolvedFindings);
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray()) + "\n";
    }

    private static void WriteRevision(Utf8JsonWriter w, string name, RevisionInfo r)
    {
        w.WriteStartObject(name);
        w.WriteString("name", r.Name);
        w.WriteString("file", r.File);
        w.WriteString("sha256", r.Sha256);
        w.WriteNumber("end_points", r.Summary.EndPoints);
        w.WriteNumber("runs", r.Summary.Runs);
        w.WriteNumber("findings", r.Summary.Findings);
        JsonResults.Number(w, "worst_total_drop_percent", r.Summary.WorstTotalDropPercent, 4);
        NullableString(w, "worst_end_point", r.Summary.WorstEndPoint);
        w.WriteEndObject();
    }

    private static void WriteSummary(Utf8JsonWriter w, Comparison c)
    {
        var s = c.Summary;
        w.WriteStartObject("summary");
        w.WriteBoolean("unchanged", c.IsUnchanged);
        w.WriteBoolean("has_new_findings", c.HasNewFindings);
        w.WriteNumber("project_changes", s.ProjectChanges);
        w.WriteNumber("equipment_added", s.EquipmentAdded);
        w.WriteNumber("equipment_removed", s.EquipmentRemoved);
        w.WriteNumber("equipment_changed", s.EquipmentChanged);
        w.WriteNumber("circuits_added", s.CircuitsAdded);
        w.WriteNumber("circuits_removed", s.CircuitsRemoved);
        w.WriteNumber("circuits_changed", s.CircuitsChanged);
        w.WriteNumber("end_points_compared", s.EndPointsCompared);
        w.WriteNumber("end_points_affected", s.EndPointsAffected);
        w.WriteNumber("end_points_newly_failing", s.EndPointsNewlyFailing);
        w.WriteNumber("end_points_newly_passing", s.EndPointsNewlyPassing);
        w.WriteNumber("runs_compared", s.RunsCompared);
        w.WriteNumber("runs_affected", s.RunsAffected);
        JsonResults.Number(w, "largest_rise_points", s.LargestRisePoints, 6);
        NullableString(w, "largest_rise_end_point", s.LargestRiseEndPoint);
        JsonResults.Number(w, "largest_fall_points", s.LargestFallPoints, 6);
        NullableString(w, "largest_fall_end_point", s.LargestFallEndPoint);
        w.WriteNumber("new_findings", s.NewFindings);
        w.WriteNumber("resolved_findings", s.ResolvedFindings);
        w.WriteNumber("faults_compared", s.FaultsCompared);
        w.WriteNumber("faults_rose", s.FaultsRose);
        w.WriteNumber("faults_newly_over_rating", s.FaultsNewlyOverRating);
        w.WriteEndObject();
    }

    private static void WriteElements(Utf8JsonWriter w, string name, IReadOnlyList<ElementChange> changes)
    {
        w.WriteStartArray(name);
        foreach (var e in changes)
        {
            w.WriteStartObject();
            w.WriteString("id", e.Id);
            w.WriteString("change", ComparisonText.Change(e.Change));
            w.WriteStartArray("fields");
            foreach (var f in e.Fields)
            {
                WriteField(w, f);
            }

            w.WriteEndArray();
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void WriteField(Utf8JsonWriter w, FieldChange f)
    {
        w.WriteStartObject();
        w.WriteString("field", f.Field);
        NullableString(w, "before", f.Before);
        NullableString(w, "after", f.After);
        w.WriteEndObject();
    }

    private static void WriteEndPoint(Utf8JsonWriter w, EndPointDelta e)
    {
        w.WriteStartObject();
        w.WriteString("id", e.Id);
        w.WriteString("name", e.Name);
        w.WriteString("panel", e.Panel);
        w.WriteString("status", ComparisonText.Status(e.Status));
        Pair(w, "total_drop_percent", e.TotalDropPercent, 4);
        JsonResults.Number(w, "change_points", e.TotalDropPercent.Change, 6);
        Pair(w, "limit_percent", e.LimitPercent, 4);
        Pair(w, "end_voltage_v", e.EndVoltageV, 3);
        Codes(w, "findings_before", e.FindingsBefore);
        Codes(w, "findings_after", e.FindingsAfter);
        w.WriteEndObject();
    }

    private static void WriteRuns(Utf8JsonWriter w, string name, IReadOnlyList<RunDelta> runs)
    {
        w.WriteStartArray(name);
        foreach (var r in runs)
        {
            w.WriteStartObject();
            w.WriteString("id", r.Id);
            w.WriteString("kind", ComparisonText.RunKind(r.Kind));
            w.WriteString("from", r.From);
            w.WriteString("status", ComparisonText.Status(r.Status));
            Pair(w, "drop_percent", r.DropPercent, 4);
            JsonResults.Number(w, "change_points", r.DropPercent.Change, 6);
            Pair(w, "drop_v", r.DropV, 3);
            Pair(w, "current_a", r.CurrentA, 3);
            Pair(w, "design_current_a", r.DesignCurrentA, 3);
            Pair(w, "ampacity_a", r.AmpacityA, 3);
            Pair(w, "margin_a", r.MarginA, 3);
            JsonResults.Number(w, "margin_change_a", r.MarginA?.Change, 3);
            Codes(w, "findings_before", r.FindingsBefore);
            Codes(w, "findings_after", r.FindingsAfter);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    // Every piece of equipment in either revision, each revision's figures as its own study wrote them (kA to 3
    // decimals, as the results document), the changes, and where the new figure exceeds a stated rating.
    private static void WriteFaults(Utf8JsonWriter w, IReadOnlyList<FaultDelta> faults)
    {
        w.WriteStartArray("faults");
        foreach (var f in faults)
        {
            w.WriteStartObject();
            w.WriteString("id", f.Id);
            w.WriteString("kind", Words.EquipmentKind.Of(f.Kind));
            NullableString(w, "change", f.IsAdded ? ComparisonText.Change(ChangeKind.Added) : f.IsRemoved ? ComparisonText.Change(ChangeKind.Removed) : null);
            w.WriteBoolean("moved", f.Moved);
            w.WriteBoolean("rose", f.Rose);
            JsonResults.Number(w, "available_fault_current_ka_before", f.Before?.AvailableFaultCurrentKa, 3);
            JsonResults.Number(w, "available_fault_current_ka_after", f.After?.AvailableFaultCurrentKa, 3);
            JsonResults.Number(w, "change_ka", f.ChangeKa, 3);
            JsonResults.Number(w, "change_percent", f.ChangePercent, 2);
            JsonResults.Number(w, "available_fault_current_lg_ka_before", f.Before?.AvailableFaultCurrentLgKa, 3);
            JsonResults.Number(w, "available_fault_current_lg_ka_after", f.After?.AvailableFaultCurrentLgKa, 3);
            JsonResults.Number(w, "change_lg_ka", f.ChangeLgKa, 3);
            JsonResults.Number(w, "change_lg_percent", f.ChangeLgPercent, 2);
            JsonResults.Number(w, "interrupting_ka_before", f.Before?.InterruptingKa, 2);
            JsonResults.Number(w, "interrupting_ka_after", f.After?.InterruptingKa, 2);
            w.WriteBoolean("over_rating_before", f.OverRatingBefore);
            w.WriteBoolean("over_rating_after", f.OverRatingAfter);
            w.WriteEndObject();
        }

        w.WriteEndArray();
    }

    private static void WriteFindings(Utf8JsonWriter w, string name, IReadOnlyList<Solving.Finding> findings)
    {
        w.WriteStartArray(name);
        foreach (var f in findings)
        {
            JsonResults.WriteFinding(w, f);
        }

        w.WriteEndArray();
    }

    private static void Pair(Utf8JsonWriter w, string name, Delta? delta, int decimals)
    {
        JsonResults.Number(w, name + "_before", delta?.Before, decimals);
        JsonResults.Number(w, name + "_after", delta?.After, decimals);
    }

    private static void Codes(Utf8JsonWriter w, string name, IReadOnlyList<string> codes)
    {
        w.WriteStartArray(name);
        foreach (var code in codes)
        {
            w.WriteStringValue(code);
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
}
