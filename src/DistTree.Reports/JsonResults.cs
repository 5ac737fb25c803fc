using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>
/// Writes a solution as the results document <c>disttree-results/1</c> (DESIGN.md section 5): snake_case,
/// SI units, lengths in metres, figures rounded for reading (percent to 4 decimals, volts and amperes to 3).
/// The same solution always gives the same bytes.
/// </summary>
public static partial class JsonResults
{
    /// <summary>The format identifier.</summary>
    public const string Format = "disttree-results/1";

    private const int FlushBytes = 1 << 16;

    // 10^0 … 10^6, exact as doubles.
    private static readonly double[] Pow10 = [1, 10, 100, 1_000, 10_000, 100_000, 1_000_000];

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
            w.WriteString("caution", Caution.For(solution.Project.Rules.Code));
            WriteProject(w, solution);
            WriteRules(w, solution);
            WriteSummary(w, solution.Summary);
            w.WriteStartObject("load_flow");
            w.WriteBoolean("converged", solution.LoadFlow.Converged);
            w.WriteNumber("iterations", solution.LoadFlow.Iterations);
            w.WriteNumber("tolerance_pu", LoadFlow.TolerancePu);
            NullableString(w, "weakest"u8, solution.LoadFlow.WeakestId);
            w.WriteEndObject();
            w.WriteStartArray("runs"u8);
            foreach (var run in solution.Runs)
            {
                WriteRun(w, run, run.Kind == RunResultKind.Transformer ? null : solution.Faults.FarEndAt(run.NodeIndex));
                FlushEvery(w);
            }

            w.WriteEndArray();
            w.WriteStartArray("panels"u8);
            foreach (var p in solution.Panels)
            {
                w.WriteStartObject();
                w.WriteString("id"u8, p.Id);
                w.WriteString("system"u8, p.System);
                Numbers(w, "line_va"u8, p.LineVa, 1);
                Number(w, "neutral_current_a"u8, p.NeutralCurrentA, 3);
                Number(w, "imbalance_percent"u8, p.ImbalancePercent, 2);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            WriteEquipment(w, solution.Faults);
            w.WriteStartArray("end_points"u8);
            foreach (var e in solution.EndPoints)
            {
                WriteEndPoint(w, e, solution.Project.Service.HasSourceImpedance);
                FlushEvery(w);
            }

            w.WriteEndArray();
            extra?.Invoke(w);
            w.WriteEndObject();
        }

        stream.WriteByte((byte)'\n');
    }

    // The writer keeps what it has written until flushed: hand it to the stream in blocks, so that a large
    // document is never held whole in memory.
    private static void FlushEvery(Utf8JsonWriter w)
    {
        if (w.BytesPending > FlushBytes)
        {
            w.Flush();
        }
    }

    /// <summary>Writes a finding object (kind, reference, subject, value, limit, message, line, column).</summary>
    public static void WriteFinding(Utf8JsonWriter w, Finding f)
    {
        w.WriteStartObject();
        w.WriteString("kind"u8, f.Code);
        w.WriteString("reference"u8, f.Reference);
        w.WriteString("subject"u8, f.Subject);
        Number(w, "value"u8, f.Value, 4);
        Number(w, "limit"u8, f.Limit, 4);
        w.WriteString("message"u8, f.Message);
        w.WriteNumber("line"u8, f.Location.Line);
        w.WriteNumber("column"u8, f.Location.Column);
        w.WriteEndObject();
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
        w.WriteString("code", Words.Code.Of(r.Code));
        w.WriteString("code_edition", RuleText.Code(r));
        w.WriteString("method", RuleText.Method(r));
        w.WriteNumber("feeder_limit_percent", r.FeederLimitPercent);
        w.WriteNumber("branch_limit_percent", r.BranchLimitPercent);
        w.WriteNumber("total_limit_percent", r.TotalLimitPercent);
        if (r.LightingLimitPercent is { } lighting)
        {
            w.WriteNumber("lighting_limit_percent", lighting);
        }

        if (r.Supply is { } supply)
        {
            w.WriteString("supply", Words.Supply.Of(supply));
        }

        if (r.LongPathAllowance is { } allowance)
        {
            w.WriteStartObject("long_path_allowance");
            w.WriteNumber("from_m", allowance.FromM);
            w.WriteNumber("percent_per_m", allowance.PercentPerM);
            w.WriteNumber("max_percent", allowance.MaxPercent);
            w.WriteEndObject();
        }

        w.WriteString("branch_current", RuleText.BranchCurrent(r));
        w.WriteString("conductor_temperature", RuleText.Temperature(r));
        w.WriteString("transformer_drop", RuleText.TransformerDrop(r));
        w.WriteNumber("ambient_c", r.AmbientC);
        w.WriteNumber("terminal_c", r.TerminalC);
        w.WriteNumber("motor_start_limit_percent", r.MotorStartLimitPercent);
        w.WriteNumber("frequency_hz", s.Project.Service.FrequencyHz);
        if (s.Project.Service is { AvailableFaultCurrentKa: { } faultKa, FaultXOverR: { } faultXOverR })
        {
            // The service's source, only when stated (the loader takes both or neither).
            w.WriteNumber("available_fault_current_ka", faultKa);
            w.WriteNumber("fault_x_r", faultXOverR);
        }

        if (s.Project.Service is { UtilityTransformerKva: { } kva, UtilityTransformerImpedancePercent: { } percent, FaultXOverR: { } transformerXOverR })
        {
            w.WriteNumber("utility_transformer_kva", kva);
            w.WriteNumber("utility_transformer_impedance_percent", percent);
            w.WriteNumber("fault_x_r", transformerXOverR);
        }

        w.WriteNumber("fault_voltage_factor_max", r.FaultVoltageFactorMax);
        w.WriteNumber("fault_voltage_factor_min", r.FaultVoltageFactorMin);

        // The tables the project brings, only when it brings them: each named by its file and its header (its source).
        if (r.ConductorCatalog is { } catalog)
        {
            WriteTableFile(w, "conductor_catalog", catalog.SourceName, catalog.Header);
        }

        if (r.GroundingTable is { } table)
        {
            WriteTableFile(w, "grounding_table", table.SourceName, table.Header);
        }

        w.WriteEndObject();
    }

    private static void WriteTableFile(Utf8JsonWriter w, string key, string file, IReadOnlyList<string> header)
    {
        w.WriteStartObject(key);
        w.WriteString("file", file);
        w.WriteStartArray("header");
        foreach (var line in header)
        {
            w.WriteStringValue(line);
        }

        w.WriteEndArray();
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

    private static void WriteRun(Utf8JsonWriter w, RunResult r, FarEndFault? farEnd)
    {
        w.WriteStartObject();
        w.WriteString("id"u8, r.Id);
        w.WriteString("kind"u8, Words.RunKind.Of(r.Kind));
        w.WriteString("from"u8, r.From);
        w.WriteString("to"u8, r.To);
        w.WriteString("system"u8, r.System);
        Number(w, "voltage_v"u8, r.VoltageV, 3);
        Number(w, "current_a"u8, r.CurrentA, 3);
        Number(w, "design_current_a"u8, r.DesignCurrentA, 3);
        NullableString(w, "design_line"u8, r.DesignLine);
        Number(w, "power_factor"u8, r.PowerFactor, 4);
        NullableString(w, "size"u8, r.Size);
        if (r.NeutralSize is { } neutralSize)
        {
            w.WriteString("neutral_size"u8, neutralSize);
        }

        NullableString(w, "material"u8, r.Material);
        NullableString(w, "raceway"u8, r.Raceway);
        NullableString(w, "raceway_id"u8, r.RacewayId);
        NullableInteger(w, "current_carrying_conductors"u8, r.CurrentCarryingConductors);
        w.WriteNumber("sets"u8, r.Sets);
        Number(w, "length_m"u8, r.LengthM, 3);
        Number(w, "temperature_c"u8, r.TemperatureC, 2);
        Number(w, "resistance_ohm_per_km"u8, r.ResistanceOhmPerKm, 5);
        Number(w, "reactance_ohm_per_km"u8, r.ReactanceOhmPerKm, 5);
        Number(w, "ampacity_a"u8, r.AmpacityA, 2);
        Number(w, "ocpd_a"u8, r.OcpdA, 1);
        if (r.GroundSize is { } groundSize)
        {
            w.WriteString("ground_size"u8, groundSize);
        }

        NullableString(w, "ground_min_size"u8, r.GroundMinSize);
        Number(w, "drop_v"u8, r.DropV, 3);
        Number(w, "drop_percent"u8, r.DropPercent, 4);
        Number(w, "drop_percent_percent_sum"u8, r.PercentSumDropPercent, 4);
        Number(w, "drop_percent_load_flow"u8, r.LoadFlowDropPercent, 4);
        NullableString(w, "lines"u8, r.Lines);
        Numbers(w, "line_currents_a"u8, r.LineCurrentsA, 3);
        Number(w, "neutral_current_a"u8, r.NeutralCurrentA, 3);
        Number(w, "neutral_design_current_a"u8, r.NeutralDesignCurrentA, 3);
        Number(w, "neutral_ampacity_a"u8, r.NeutralAmpacityA, 2);
        Number(w, "limit_percent"u8, r.LimitPercent, 4);
        Number(w, "max_length_m"u8, r.MaxLengthM, 2);
        Number(w, "max_length_total_m"u8, r.MaxLengthTotalM, 2);
        w.WriteBoolean("counts_in_total"u8, r.CountsInTotal);
        WriteFarEnd(w, farEnd);
        WriteFindings(w, r.Findings);
        w.WriteEndObject();
    }

    private static void WriteEndPoint(Utf8JsonWriter w, EndPointResult e, bool withSource)
    {
        w.WriteStartObject();
        w.WriteString("id"u8, e.Id);
        w.WriteString("name"u8, e.Name);
        w.WriteString("category"u8, Words.LoadCategory.Of(e.Category));
        w.WriteStartArray("path"u8);
        foreach (var id in e.Path)
        {
            w.WriteStringValue(id);
        }

        w.WriteEndArray();
        Number(w, "voltage_v"u8, e.VoltageV, 3);
        Number(w, "total_drop_percent"u8, e.TotalDropPercent, 4);
        Number(w, "limit_percent"u8, e.LimitPercent, 4);
        Number(w, "end_voltage_v"u8, e.EndVoltageV, 3);
        Number(w, "total_drop_percent_percent_sum"u8, e.PercentSumTotalDropPercent, 4);
        Number(w, "total_drop_percent_load_flow"u8, e.LoadFlowTotalDropPercent, 4);
        Number(w, "end_voltage_v_load_flow"u8, e.LoadFlowEndVoltageV, 3);
        if (withSource)
        {
            Number(w, "source_drop_percent"u8, e.SourceDropPercent, 4);
        }

        if (e.MotorStart is { } m)
        {
            WriteMotorStart(w, m);
        }
        else
        {
            w.WriteNull("motor_start"u8);
        }

        WriteFindings(w, e.Findings);
        w.WriteEndObject();
    }

    private static void WriteFindings(Utf8JsonWriter w, IReadOnlyList<Finding> findings)
    {
        w.WriteStartArray("findings"u8);
        foreach (var f in findings)
        {
            WriteFinding(w, f);
        }

        w.WriteEndArray();
    }
}
