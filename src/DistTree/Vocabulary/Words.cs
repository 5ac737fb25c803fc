using DistTree.Comparing;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Vocabulary;

/// <summary>
/// Every word of the file format and of the outputs that names a value of an enum, defined once: the readers,
/// the writers, the reports and the comparison use these tables. A test fails when an enum value has no word.
/// </summary>
public static class Words
{
    /// <summary><c>project: units</c>: <c>metric</c> or <c>imperial</c>.</summary>
    public static WordTable<UnitSystem> Units { get; } = new("unit system", [("metric", UnitSystem.Metric), ("imperial", UnitSystem.Imperial)]);

    /// <summary><c>rules: branch_current</c>.</summary>
    public static WordTable<BranchCurrentBasis> BranchCurrent { get; } = new(
        "branch_current", [("connected", BranchCurrentBasis.Connected), ("ocpd_80", BranchCurrentBasis.Ocpd80), ("lesser", BranchCurrentBasis.Lesser)]);

    /// <summary><c>rules: conductor_temperature</c>; a fixed temperature is written as its number in °C.</summary>
    public static WordTable<TemperatureMode> Temperature { get; } = new(
        "conductor_temperature", [("estimated", TemperatureMode.Estimated), ("rated", TemperatureMode.Rated)], TemperatureMode.Fixed);

    /// <summary><c>rules: transformer_drop</c>.</summary>
    public static WordTable<TransformerDropMode> TransformerDrop { get; } = new(
        "transformer_drop", [("count", TransformerDropMode.Count), ("new_origin", TransformerDropMode.NewOrigin)]);

    /// <summary><c>rules: code</c>: the code whose rule set judges the project.</summary>
    public static WordTable<ElectricalCode> Code { get; } = new("code", [("nec", ElectricalCode.Nec), ("cec", ElectricalCode.Cec), ("iec", ElectricalCode.Iec)]);

    /// <summary><c>rules: supply</c>.</summary>
    public static WordTable<SupplyKind> Supply { get; } = new("supply", [("public", SupplyKind.Public), ("private", SupplyKind.Private)]);

    /// <summary><c>rules: method</c>.</summary>
    public static WordTable<SolutionMethod> Method { get; } = new(
        "method", [("percent_sum", SolutionMethod.PercentSum), ("load_flow", SolutionMethod.LoadFlow)]);

    /// <summary>A conductor's <c>material</c>.</summary>
    public static WordTable<Material> Material { get; } = new("material", [("cu", Conductors.Material.Copper), ("al", Conductors.Material.Aluminum)]);

    /// <summary>A run's <c>raceway</c>.</summary>
    public static WordTable<Raceway> Raceway { get; } = new(
        "raceway", [("pvc", Conductors.Raceway.Pvc), ("aluminum", Conductors.Raceway.Aluminum), ("steel", Conductors.Raceway.Steel)]);

    /// <summary>A run's <c>installation_method</c>: a reference method of IEC 60364-5-52, its letter in lower case (<c>b1</c>).</summary>
    public static WordTable<InstallationMethod> InstallationMethod { get; } = new(
        "installation_method",
        [
            ("a1", Model.InstallationMethod.A1), ("b1", Model.InstallationMethod.B1), ("b2", Model.InstallationMethod.B2),
            ("c", Model.InstallationMethod.C), ("e", Model.InstallationMethod.E),
        ]);

    /// <summary>A run's <c>device_type</c>.</summary>
    public static WordTable<DeviceType> DeviceType { get; } = new("device_type", [("breaker", Model.DeviceType.Breaker), ("fuse", Model.DeviceType.Fuse)]);

    /// <summary>An equipment's <c>kind</c>.</summary>
    public static WordTable<EquipmentKind> EquipmentKind { get; } = new(
        "kind",
        [
            ("switchboard", Model.EquipmentKind.Switchboard), ("panelboard", Model.EquipmentKind.Panelboard),
            ("transformer", Model.EquipmentKind.Transformer), ("splitter", Model.EquipmentKind.Splitter),
        ]);

    /// <summary>The quantity a load is given in: the key of a <c>load</c> mapping (<c>va</c>, <c>kva</c>, …).</summary>
    public static WordTable<LoadKind> LoadQuantity { get; } = new(
        "load quantity",
        [("va", LoadKind.Va), ("kva", LoadKind.Kva), ("kw", LoadKind.Kw), ("amps", LoadKind.Amps), ("hp", LoadKind.Hp), ("fla", LoadKind.Fla)]);

    /// <summary>A load's <c>model</c>.</summary>
    public static WordTable<LoadModel> LoadModel { get; } = new(
        "load model", [("power", Model.LoadModel.ConstantPower), ("current", Model.LoadModel.ConstantCurrent), ("impedance", Model.LoadModel.ConstantImpedance)]);

    /// <summary>A circuit's or a point's <c>category</c>, and an end point's in the results.</summary>
    public static WordTable<LoadCategory> LoadCategory { get; } = new(
        "load category",
        [
            ("lighting", Model.LoadCategory.Lighting), ("receptacle", Model.LoadCategory.Receptacle), ("motor", Model.LoadCategory.Motor),
            ("hvac", Model.LoadCategory.Hvac), ("kitchen", Model.LoadCategory.Kitchen), ("ev_charger", Model.LoadCategory.EvCharger),
            ("other", Model.LoadCategory.Other),
        ]);

    /// <summary>A result run's <c>kind</c> in the outputs.</summary>
    public static WordTable<RunResultKind> RunKind { get; } = new(
        "run kind", [("feeder", RunResultKind.Feeder), ("branch", RunResultKind.Branch), ("transformer", RunResultKind.Transformer)]);

    /// <summary>A finding's code, from the registry of finding kinds (<see cref="FindingKinds"/>).</summary>
    public static WordTable<FindingKind> FindingKind { get; } = new("finding kind", [.. FindingKinds.All.Select(k => (k.Code, k.Kind))]);

    /// <summary>How an element changed between two revisions.</summary>
    public static WordTable<ChangeKind> Change { get; } = new(
        "change", [("added", ChangeKind.Added), ("removed", ChangeKind.Removed), ("changed", ChangeKind.Changed)]);

    /// <summary>How the findings of a run or end point changed between two revisions.</summary>
    public static WordTable<StatusChange> Status { get; } = new(
        "status",
        [
            ("none", StatusChange.None), ("newly_failing", StatusChange.NewlyFailing),
            ("newly_passing", StatusChange.NewlyPassing), ("findings_changed", StatusChange.FindingsChanged),
        ]);

    /// <summary>What a run is called in a sentence for people: <c>feeder</c> or <c>branch circuit</c>.</summary>
    public static string Noun(Network.RunKind kind) => kind switch
    {
        Network.RunKind.Feeder => "feeder",
        Network.RunKind.Branch => "branch circuit",
    };

    /// <summary>
    /// The words of <paramref name="table"/> as a sentence lists them: <c>cu or al</c>, <c>pvc, aluminum or steel</c>
    /// (<paramref name="conjunction"/> before the last).
    /// </summary>
    public static string Listed<T>(WordTable<T> table, string conjunction)
        where T : struct, Enum
    {
        ArgumentNullException.ThrowIfNull(table);
        var words = table.Words;
        return words.Count == 1 ? words[0] : $"{string.Join(", ", words.Take(words.Count - 1))} {conjunction} {words[^1]}";
    }

    /// <summary>The <c>conductor_temperature</c> value of <paramref name="rules"/> as a project file writes it: a word, or the fixed temperature in °C.</summary>
    public static string TemperatureOf(Rules rules) => rules.Temperature == TemperatureMode.Fixed
        ? (rules.FixedTemperatureC ?? 0).ToString("0.##", System.Globalization.CultureInfo.InvariantCulture)
        : Temperature.Of(rules.Temperature);
}
