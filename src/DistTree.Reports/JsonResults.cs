using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using DistTree.Solving;

namespace DistTree.Reports;

/// <summary>
/// Writes a solution as the results document <c>disttree-results/1</c> (DESIGN.md section 5): snake_case,
/// SI units, lengths in metres, figures rounded for reading (percent to 4 decimals, volts and amperes to 3).
/// The same solution always gives the same bytes.
/// </summary>
public static class JsonResults
{
    /// <summary>The format identifier.</summary>
    public const string Format = "disttree-results/1";

    private static readonly JsonWriterOptions Options = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The document as UTF-8 text, ending in a newline.</summary>
    public static string Write(Solution solution, Action<Utf8JsonWriter>? extra = null)
    {
        using var buffer = new MemoryStream();
        Write(solution, buffer, extra);
        return Encoding.UTF8.GetString(buffer.GetBuffer(), 0, (int)buffer.Length);
    }

    /// <summary>
    /// Writes the document to <paramref name="stream"/> as UTF-8 bytes ending in a newline: the same bytes
    /// as <see cref="Write(Solution, Action{Utf8JsonWriter}?)"/>, without holding the whole text in memory.
    /// </summary>
    public static void Write(Solution solution, Stream stream, Action<Utf8JsonWriter>? extra = null)
    {
        ArgumentNullException.ThrowIfNull(solution);
        ArgumentNullException.ThrowIfNull(stream);
        using (var w = new Utf8JsonWriter(stream, Options))
        {
            w.WriteStartObject();
            w.WriteString("format", Format);
            w.WriteString("caution", Caution.Text);
            WriteProject(w, solution);
            WriteRules(w, solution);
            WriteSummary(w, solution.Summary);
            w.WriteStartObject("load_flow");
            w.WriteBoolean("converged", solution.LoadFlow.Converged);
            w.WriteNumber("iterations", solution.LoadFlow.Iterations);
            w.WriteNumber("tolerance_pu", LoadFlow.TolerancePu);
            w.WriteNumber("base_kva", LoadFlow.BaseVa / 1000.0);
            w.WriteEndObject();
            w.WriteStartArray("runs");
            foreach (var run in solution.Runs)
            {
                WriteRun(w, run);
            }

            w.WriteEndArray();
            w.WriteStartArray("panels");
            foreach (var p in solution.Panels)
            {
                w.WriteStartObject();
                w.WriteString("id", p.Id);
                w.WriteString("system", p.System);
                Numbers(w, "line_va", p.LineVa, 1);
                Number(w, "neutral_current_a", p.NeutralCurrentA, 3);
                Number(w, "imbalance_percent", p.ImbalancePercent, 2);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteStartArray("end_points");
            foreach (var e in solution.EndPoints)
            {
                WriteEndPoint(w, e);
            }

            w.WriteEndArray();
            extra?.Invoke(w);
            w.WriteEndObject();
        }

        stream.WriteByte((byte)'\n');
    }

    /// <summary>Writes a finding object (kind, subject, value, limit, message, line, column).</summary>
    public static void WriteFinding(Utf8JsonWriter w, Finding f)
    {
        w.WriteStartObject();
        w.WriteString("kind", f.Code);
        w.WriteString("subject", f.Subject);
        Number(w, "value", f.Value, 4);
        Number(w, "limit", f.Limit, 4);
        w.WriteString("message", f.Message);
        w.WriteNumber("line", f.Location.Line);
        w.WriteNumber("column", f.Location.Column);
        w.WriteEndObject();
    }

    /// <summary>Writes a rounded number, or null.</summary>
    public static void Number(Utf8JsonWriter w, string name, double? value, int decimals)
    {
        if (value is { } v && double.IsFinite(v))
        {
            w.WriteNumber(name, Math.Round(v, decimals, MidpointRounding.AwayFromZero) + 0.0);
        }
        else
        {
            w.WriteNull(name);
        }
    }

    // An array of rounded numbers; a non-finite one is written as null.
    private static void Numbers(Utf8JsonWriter w, string name, IEnumerable<double> values, int decimals)
    {
        w.WriteStartArray(name);
        foreach (var v in values)
        {
            if (double.IsFinite(v))
            {
                w.WriteNumberValue(Math.Round(v, decimals, MidpointRounding.AwayFromZero) + 0.0);
            }
            else
            {
                w.WriteNullValue();
            }
        }

        w.WriteEndArray();
    }

    private static void WriteProject(Utf8JsonWriter w, Solution s)
    {
        w.WriteStartObject("project");
        w.WriteString("name", s.Project.Name);
        w.WriteString("file", s.Project.File);
        w.WriteString("sha256", s.Project.Sha256);
        w.WriteString("conductor_data", s.CatalogName);
        w.WriteEndObject();
    }

    private static void WriteRules(Utf8JsonWriter w, Solution s)
    {
        var r = s.Project.Rules;
        w.WriteStartObject("rules");
        w.WriteString("method", r.Method == DistTree.Model.SolutionMethod.LoadFlow ? "load_flow" : "percent_sum");
        w.WriteNumber("feeder_limit_percent", r.FeederLimitPercent);
        w.WriteNumber("branch_limit_percent", r.BranchLimitPercent);
        w.WriteNumber("total_limit_percent", r.TotalLimitPercent);
        w.WriteString("branch_current", RuleText.BranchCurrent(r));
        w.WriteString("conductor_temperature", RuleText.Temperature(r));
        w.WriteString("transformer_drop", RuleText.TransformerDrop(r));
        w.WriteNumber("ambient_c", r.AmbientC);
        w.WriteNumber("terminal_c", r.TerminalC);
        w.WriteNumber("motor_start_limit_percent", r.MotorStartLimitPercent);
        w.WriteNumber("frequency_hz", s.Project.Service.FrequencyHz);
        w.WriteEndObject();
    }

    private static void WriteSummary(Utf8JsonWriter w, SolutionSummary summary)
    {
        w.WriteStartObject("summary");
        w.WriteNumber("end_points", summary.EndPoints);
        w.WriteNumber("runs", summary.Runs);
        w.WriteNumber("findings", summary.Findings);
        Number(w, "worst_total_drop_percent", summary.WorstTotalDropPercent, 4);
        if (summary.WorstEndPoint is { } worst)
        {
            w.WriteString("worst_end_point", worst);
        }
        else
        {
            w.WriteNull("worst_end_point");
        }

        w.WriteEndObject();
    }

    private static void WriteRun(Utf8JsonWriter w, RunResult r)
    {
        w.WriteStartObject();
        w.WriteString("id", r.Id);
        w.WriteString("kind", r.Kind switch { RunResultKind.Branch => "branch", RunResultKind.Transformer => "transformer", _ => "feeder" });
        w.WriteString("from", r.From);
        w.WriteString("to", r.To);
        w.WriteString("system", r.System);
        Number(w, "voltage_v", r.VoltageV, 3);
        Number(w, "current_a", r.CurrentA, 3);
        Number(w, "design_current_a", r.DesignCurrentA, 3);
        Number(w, "power_factor", r.PowerFactor, 4);
        NullableString(w, "size", r.Size);
        NullableString(w, "material", r.Material);
        NullableString(w, "raceway", r.Raceway);
        w.WriteNumber("sets", r.Sets);
        Number(w, "length_m", r.LengthM, 3);
        Number(w, "temperature_c", r.TemperatureC, 2);
        Number(w, "resistance_ohm_per_km", r.ResistanceOhmPerKm, 5);
        Number(w, "reactance_ohm_per_km", r.ReactanceOhmPerKm, 5);
        Number(w, "ampacity_a", r.AmpacityA, 2);
        Number(w, "ocpd_a", r.OcpdA, 1);
        Number(w, "drop_v", r.DropV, 3);
        Number(w, "drop_percent", r.DropPercent, 4);
        Number(w, "drop_percent_percent_sum", r.PercentSumDropPercent, 4);
        Number(w, "drop_percent_load_flow", r.LoadFlowDropPercent, 4);
        NullableString(w, "lines", r.Lines);
        Numbers(w, "line_currents_a", r.LineCurrentsA, 3);
        Number(w, "neutral_current_a", r.NeutralCurrentA, 3);
        Number(w, "limit_percent", r.LimitPercent, 4);
        Number(w, "max_length_m", r.MaxLengthM, 2);
        Number(w, "max_length_total_m", r.MaxLengthTotalM, 2);
        w.WriteBoolean("counts_in_total", r.CountsInTotal);
        w.WriteStartArray("findings");
        foreach (var f in r.Findings)
        {
            WriteFinding(w, f);
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void WriteEndPoint(Utf8JsonWriter w, EndPointResult e)
    {
        w.WriteStartObject();
        w.WriteString("id", e.Id);
        w.WriteString("name", e.Name);
        w.WriteStartArray("path");
        foreach (var id in e.Path)
        {
            w.WriteStringValue(id);
        }

        w.WriteEndArray();
        Number(w, "voltage_v", e.VoltageV, 3);
        Number(w, "total_drop_percent", e.TotalDropPercent, 4);
        Number(w, "limit_percent", e.LimitPercent, 4);
        Number(w, "end_voltage_v", e.EndVoltageV, 3);
        Number(w, "total_drop_percent_percent_sum", e.PercentSumTotalDropPercent, 4);
        Number(w, "total_drop_percent_load_flow", e.LoadFlowTotalDropPercent, 4);
        Number(w, "end_voltage_v_load_flow", e.LoadFlowEndVoltageV, 3);
        if (e.MotorStart is { } m)
        {
            w.WriteStartObject("motor_start");
            Number(w, "locked_rotor_kva", m.LockedRotorVa / 1000.0, 3);
            Number(w, "terminal_dip_percent", m.TerminalDipPercent, 4);
            Number(w, "panel_dip_percent", m.PanelDipPercent, 4);
            Number(w, "limit_percent", m.LimitPercent, 4);
            w.WriteEndObject();
        }
        else
        {
            w.WriteNull("motor_start");
        }
        w.WriteStartArray("findings");
        foreach (var f in e.Findings)
        {
            WriteFinding(w, f);
        }

        w.WriteEndArray();
        w.WriteEndObject();
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
