namespace DistTree.ProjectFiles;

/// <summary>
/// The keys each mapping of a project file may hold (format 1). The schema in
/// <c>schema/project.schema.json</c> and <c>docs/project-file.md</c> list the same keys; a test keeps them in step.
/// </summary>
internal static class ProjectKeys
{
    public static readonly string[] Top = ["disttree", "project", "rules", "defaults", "sizing", "service", "include", "equipment"];

    /// <summary>What an included file may hold (docs/project-file.md, Including other files).</summary>
    public static readonly string[] Included = ["include", "equipment"];

    public static readonly string[] Project = ["name", "units", "description"];

    public static readonly string[] Rules =
    [
        "code", "supply", "feeder_limit_percent", "branch_limit_percent", "total_limit_percent", "lighting_limit_percent", "branch_current",
        "conductor_temperature", "transformer_drop", "ambient_c", "terminal_c", "method", "motor_start_limit_percent",
        "conductor_catalog", "grounding_table", "fault_voltage_factor_max", "fault_voltage_factor_min",
    ];

    public static readonly string[] Defaults = ["material", "insulation_c", "raceway"];

    public static readonly string[] Sizing = ["max_sets", "prices", "currency", "resolution_percent", "terminal_table", "tap_cost", "light_load_rise_percent"];

    public static readonly string[] Service = ["id", "system", "frequency_hz", "available_fault_current_ka", "fault_x_r", "utility_transformer_kva", "utility_transformer_impedance_percent"];

    public static readonly string[] TransformerOnly = ["kva", "primary", "secondary", "impedance_percent", "x_r", "tap_percent", "tap_range_percent", "phase"];

    public static readonly string[] Equipment =
        ["id", "kind", "from", "feeder", "demand_factor", "interrupting_ka", "main_a", "circuits", .. TransformerOnly];

    public static readonly string[] Run =
        ["length", "size", "neutral_size", "ground_size", "sets", "material", "insulation_c", "raceway", "raceway_id", "current_carrying", "ocpd", "device_type", "trip", "installation_method", "limit_percent", "fixed", "device_rated_continuous"];

    public static readonly string[] Circuit = ["id", "name", "poles", "phase", "ocpd", "category", "load", "points", "continuous", "run"];

    public static readonly string[] Point = ["at", "category", "load"];

    /// <summary>The quantities a load may be given in, from the one table of load words.</summary>
    public static readonly IReadOnlyList<string> LoadQuantities = Vocabulary.Words.LoadQuantity.Words;

    public static readonly string[] MotorStart = ["code_letter", "lrc_multiple", "starting_pf"];

    /// <summary>Air-conditioning equipment's nameplate figures: minimum circuit ampacity, maximum overcurrent device.</summary>
    public static readonly string[] Nameplate = ["mca", "mocp"];

    public static readonly string[] Load = [.. LoadQuantities, "pf", "model", .. MotorStart, .. Nameplate];
}
