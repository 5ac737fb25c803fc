using DistTree.Conductors;
using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// ProjectLoader on the keys the phase-frame model reads (docs/project-file.md): a run's <c>neutral_size</c>, a
/// transformer's <c>phase</c>, the service's <c>available_fault_current_ka</c> and <c>fault_x_r</c>, and a
/// three-phase secondary's need of a three-phase primary. Invented projects; each error is checked for its text
/// and for the key or value it points at.
/// </summary>
public sealed class ProjectLoaderElectricalKeysTests
{
    private const string Circuit1 = "{ id: 1, poles: 1, load: { va: 1000 }, run: { length: 20, size: 12 AWG } }";

    // --- neutral_size ---

    [Fact]
    public void Parse_NeutralSize_StoredOnTheFeederAndTheBranchRun()
    {
        var text = Project("208Y/120", Panel("LP1", "SVC", "{ length: 20, size: 2/0 AWG, neutral_size: 1/0 AWG }",
            "{ id: 1, poles: 1, load: { va: 1000 }, run: { length: 20, size: 12 AWG, neutral_size: 10 AWG } }"));

        var panel = ProjectLoader.Parse(text, "t.yaml").Equipment[0];

        Assert.Equal(ConductorSize.Parse("1/0 AWG"), panel.Feeder!.NeutralSize);
        Assert.Equal(ConductorSize.Parse("10 AWG"), panel.Circuits[0].Run.NeutralSize);
    }

    [Fact]
    public void Parse_NoNeutralSize_IsNull()
    {
        var panel = ProjectLoader.Parse(Project("208Y/120", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1)), "t.yaml").Equipment[0];

        Assert.Null(panel.Feeder!.NeutralSize);
        Assert.Null(panel.Circuits[0].Run.NeutralSize);
    }

    // The forms docs/project-file.md lists for 'size' ('1/0', '#12', 'MCM', 'mm²'), each the size its canonical text names.
    [Theory]
    [InlineData("2 AWG", "1/0", "1/0 AWG")]
    [InlineData("2 AWG", "\"#6\"", "6 AWG")]
    [InlineData("500 kcmil", "250 MCM", "250 kcmil")]
    [InlineData("500 kcmil", "750 kcmil", "750 kcmil")]
    [InlineData("95 mm2", "50 mm²", "50 mm2")]
    [InlineData("2 AWG", "2 AWG", "2 AWG")]
    public void Parse_NeutralSizeForms_ReadAsSizeIs(string size, string neutral, string expected)
    {
        var text = Project("208Y/120", Panel("LP1", "SVC", $"{{ length: 20, size: {size}, neutral_size: {neutral} }}", Circuit1));

        Assert.Equal(expected, ProjectLoader.Parse(text, "t.yaml").Equipment[0].Feeder!.NeutralSize!.Value.Text);
    }

    [Theory]
    [InlineData("13 AWG", "'13 AWG' is not a standard size; nearest: 14 AWG or 12 AWG")]
    [InlineData("12 furlongs", "'12 furlongs' has an unknown size unit 'furlongs'; expected AWG, kcmil (or MCM) or mm2")]
    public void Parse_NeutralSizeNotASize_TheSizeErrorAtTheValue(string neutral, string message)
    {
        var text = Project("208Y/120", Panel("LP1", "SVC", $"{{ length: 20, size: 2 AWG, neutral_size: {neutral} }}", Circuit1));

        ProjectText.AssertOneError(text, neutral, message);
        // The same text as 'size' gives for it.
        ProjectText.AssertOneError(Project("208Y/120", Panel("LP1", "SVC", $"{{ length: 20, size: {neutral} }}", Circuit1)), neutral, message);
    }

    [Theory]
    [InlineData("2 AWG", "35 mm2", "'neutral_size' of the feeder of 'LP1' is 35 mm2, but its 'size' is 2 AWG: give both in AWG and kcmil, or both in mm2")]
    [InlineData("95 mm2", "1/0", "'neutral_size' of the feeder of 'LP1' is 1/0 AWG, but its 'size' is 95 mm2: give both in AWG and kcmil, or both in mm2")]
    public void Parse_NeutralSizeOfTheOtherSeries_IsAnError(string size, string neutral, string message)
    {
        var text = Project("208Y/120", Panel("LP1", "SVC", $"{{ length: 20, size: {size}, neutral_size: {neutral} }}", Circuit1));

        ProjectText.AssertOneError(text, neutral, message);
    }

    // docs/project-file.md: a 2-pole circuit is line to line (single-phase), a 3-pole circuit three-phase; neither has a neutral.
    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void Parse_NeutralSizeOnLineToLineCircuit_IsAnErrorAtTheKey(int poles)
    {
        var circuit = $"{{ id: 1, poles: {poles}, load: {{ va: 1000 }}, run: {{ length: 20, size: 12 AWG, neutral_size: 12 AWG }} }}";

        ProjectText.AssertOneError(
            Project("208Y/120", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", circuit)),
            "neutral_size",
            $"'neutral_size' of the run of circuit 'LP1/1': a {poles}-pole circuit has no neutral (only a 1-pole circuit's run has one)");
    }

    // A delta (480D) and a two-wire 240 V system have no neutral; 120/240 and the wyes have one (docs/project-file.md, Systems).
    [Theory]
    [InlineData("480D")]
    [InlineData("240")]
    public void Parse_NeutralSizeOnFeederOfSystemWithoutNeutral_IsAnErrorAtTheKey(string system)
    {
        var circuit = "{ id: 1, poles: 2, load: { va: 1000 }, run: { length: 20, size: 12 AWG } }";

        ProjectText.AssertOneError(
            Project(system, Panel("LP1", "SVC", "{ length: 20, size: 2 AWG, neutral_size: 4 AWG }", circuit)),
            "neutral_size",
            $"'neutral_size' of the feeder of 'LP1': it is fed from 'SVC', which gives {system}, a system with no neutral");
    }

    [Theory]
    [InlineData("120/240")]
    [InlineData("480Y/277")]
    [InlineData("400Y/230")]
    public void Parse_NeutralSizeOnFeederOfSystemWithNeutral_IsRead(string system)
    {
        var text = Project(system, Panel("LP1", "SVC", "{ length: 20, size: 2 AWG, neutral_size: 4 AWG }", Circuit1));

        Assert.Equal(ConductorSize.Parse("4 AWG"), ProjectLoader.Parse(text, "t.yaml").Equipment[0].Feeder!.NeutralSize);
    }

    // A transformer's feeder carries its primary (docs/project-file.md): a 480D primary has no neutral, whatever the secondary.
    [Fact]
    public void Parse_NeutralSizeOnTransformerFeederFromDelta_IsAnError()
    {
        var text = Project("480D", Transformer("T1", "SVC", "208Y/120", feeder: "{ length: 30, size: 1 AWG, neutral_size: 2 AWG }"));

        ProjectText.AssertOneError(text, "neutral_size", "'neutral_size' of the feeder of 'T1': it is fed from 'SVC', which gives 480D, a system with no neutral");
    }

    [Fact]
    public void Parse_NeutralSizeOnTransformerFeederFromWye_IsRead()
    {
        var text = Project("480Y/277", Transformer("T1", "SVC", "208Y/120", feeder: "{ length: 30, size: 1 AWG, neutral_size: 2 AWG }"));

        Assert.Equal(ConductorSize.Parse("2 AWG"), ProjectLoader.Parse(text, "t.yaml").Equipment[0].Feeder!.NeutralSize);
    }

    // --- a transformer's phase ---

    // A single-phase transformer on a three-phase primary is across two of its lines; AB, BC or CA in either order.
    [Theory]
    [InlineData(null, Phases.AB)]
    [InlineData("AB", Phases.AB)]
    [InlineData("BC", Phases.BC)]
    [InlineData("CA", Phases.CA)]
    [InlineData("BA", Phases.AB)]
    [InlineData("cb", Phases.BC)]
    [InlineData("AC", Phases.CA)]
    public void Parse_TransformerPhase_IsItsPrimaryLines(string? phase, Phases expected)
    {
        var text = Project("480Y/277", Transformer("T1", "SVC", "120/240", phase: phase));

        Assert.Equal(expected, ProjectLoader.Parse(text, "t.yaml").Equipment[0].Transformer!.PrimaryPhases);
    }

    [Theory]
    [InlineData("A")]
    [InlineData("ABC")]
    [InlineData("AA")]
    [InlineData("XY")]
    public void Parse_TransformerPhaseNotTwoLines_IsAnErrorAtTheValue(string phase)
    {
        ProjectText.AssertOneError(
            Project("480Y/277", Transformer("T1", "SVC", "120/240", phase: phase)),
            phase,
            $"'phase' of 'T1' is '{phase}'; a single-phase transformer's primary is across two lines: AB, BC or CA");
    }

    [Fact]
    public void Parse_TransformerPhaseWithThreePhaseSecondary_IsAnErrorAtTheKey()
    {
        ProjectText.AssertOneError(
            Project("480Y/277", Transformer("T1", "SVC", "208Y/120", phase: "BC")),
            "phase",
            "'phase' of 'T1' chooses the two primary lines of a single-phase transformer; its secondary 208Y/120 is three-phase and takes all three");
    }

    [Fact]
    public void Parse_TransformerPhaseOnSinglePhasePrimary_IsAnErrorAtTheKey()
    {
        ProjectText.AssertOneError(
            Project("120/240", Transformer("T1", "SVC", "120/240", phase: "AB")),
            "phase",
            "'phase' of 'T1' chooses two lines of a three-phase primary, but it is fed from 'SVC', which gives 120/240, single-phase");
    }

    [Fact]
    public void Parse_PhaseOnASwitchboard_IsATransformerOnlyKey()
    {
        ProjectText.AssertOneError(
            Project("480Y/277", "  - { id: MSB, kind: switchboard, from: SVC, phase: AB }\n"),
            "phase",
            "'phase' applies to transformers only; 'MSB' is a switchboard");
    }

    // --- a three-phase secondary needs a three-phase primary ---

    [Theory]
    [InlineData("120/240", "480Y/277")]
    [InlineData("240", "208Y/120")]
    [InlineData("120", "480D")]
    public void Parse_ThreePhaseSecondaryOnSinglePhasePrimary_IsAnErrorAtTheSecondaryKey(string primary, string secondary)
    {
        ProjectText.AssertOneError(
            Project(primary, Transformer("T1", "SVC", secondary)),
            "secondary",
            $"the secondary of 'T1' is {secondary}, three-phase, but it is fed from 'SVC', which gives {primary}, single-phase: a three-phase secondary needs a three-phase primary");
    }

    [Theory]
    [InlineData("120/240", "120/240")]
    [InlineData("480D", "120/240")]
    [InlineData("480Y/277", "208Y/120")]
    [InlineData("208Y/120", "480D")]
    public void Parse_SecondaryThePrimaryCanGive_IsRead(string primary, string secondary)
    {
        var transformer = ProjectLoader.Parse(Project(primary, Transformer("T1", "SVC", secondary)), "t.yaml").Equipment[0];

        Assert.Equal((primary, secondary), (transformer.System.Name, transformer.OutputSystem.Name));
    }

    // --- the service's source ---

    [Fact]
    public void Parse_ServiceFaultCurrentAndXOverR_StoredOnTheService()
    {
        var service = ProjectLoader.Parse(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1), ", available_fault_current_ka: 42.5, fault_x_r: 6"), "t.yaml").Service;

        Assert.Equal((42.5, 6.0), (service.AvailableFaultCurrentKa!.Value, service.FaultXOverR!.Value));
    }

    [Fact]
    public void Parse_NoFaultKeys_AStiffSource()
    {
        var service = ProjectLoader.Parse(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1)), "t.yaml").Service;

        Assert.Equal((null, null), (service.AvailableFaultCurrentKa, service.FaultXOverR));
    }

    [Theory]
    [InlineData(", available_fault_current_ka: 300, fault_x_r: 100", 300.0, 100.0)]
    [InlineData(", available_fault_current_ka: 0.5, fault_x_r: 0.1", 0.5, 0.1)]
    public void Parse_FaultKeysAtTheirBounds_AreRead(string keys, double ka, double xr)
    {
        var service = ProjectLoader.Parse(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1), keys), "t.yaml").Service;

        Assert.Equal((ka, xr), (service.AvailableFaultCurrentKa!.Value, service.FaultXOverR!.Value));
    }

    [Theory]
    [InlineData(", available_fault_current_ka: 22", "available_fault_current_ka", "'available_fault_current_ka' of the service needs 'fault_x_r' with it: the utility's source is given by its fault current and its X/R ratio together, or by its transformer's kVA, %Z and X/R together")]
    [InlineData(", fault_x_r: 8", "fault_x_r", "'fault_x_r' of the service needs 'available_fault_current_ka' with it: the utility's source is given by its fault current and its X/R ratio together, or by its transformer's kVA, %Z and X/R together")]
    public void Parse_OneFaultKeyAlone_IsAnErrorNamingTheOther(string keys, string token, string message)
    {
        ProjectText.AssertOneError(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1), keys), token, message);
    }

    [Theory]
    [InlineData("available_fault_current_ka: 300.5, fault_x_r: 8", "300.5", "'available_fault_current_ka' of the service must be between 0.1 and 300 kA; found 300.5")]
    [InlineData("available_fault_current_ka: 0, fault_x_r: 8", "0", "'available_fault_current_ka' of the service must be between 0.1 and 300 kA; found 0")]
    [InlineData("available_fault_current_ka: 22, fault_x_r: 101", "101", "'fault_x_r' of the service must be greater than 0 and at most 100; found 101")]
    [InlineData("available_fault_current_ka: 22, fault_x_r: -3", "-3", "'fault_x_r' of the service must be greater than 0 and at most 100; found -3")]
    [InlineData("available_fault_current_ka: 22, fault_x_r: high", "high", "'fault_x_r' of the service must be a number; found 'high'")]
    public void Parse_FaultKeyOutOfRange_IsAnErrorAtTheValue(string keys, string token, string message)
    {
        ProjectText.AssertOneError(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1), ", " + keys), token, message);
    }

    // --- the short-circuit study's keys (issue 23) ---

    [Fact]
    public void Parse_UtilityTransformerAndFaultKeys_AreRead()
    {
        var project = ProjectLoader.Parse(
            Project("480Y/277", "  - { id: LP1, kind: panelboard, from: SVC, interrupting_ka: 22, feeder: { length: 20, size: 2 AWG, trip: D }, circuits: [ " + Circuit1 + " ] }\n",
                ", utility_transformer_kva: 750, utility_transformer_impedance_percent: 5.5, fault_x_r: 5"),
            "t.yaml");

        Assert.Equal((750.0, 5.5, 5.0), (project.Service.UtilityTransformerKva!.Value, project.Service.UtilityTransformerImpedancePercent!.Value, project.Service.FaultXOverR!.Value));
        Assert.Equal(22.0, project.Equipment[0].InterruptingKa);
        Assert.Equal(new TripSetting("D", 20), project.Equipment[0].Feeder!.Trip);
    }

    [Theory]
    [InlineData(", available_fault_current_ka: 22, fault_x_r: 5, utility_transformer_kva: 500, utility_transformer_impedance_percent: 5", "utility_transformer_kva",
        "'utility_transformer_kva' and 'available_fault_current_ka' of the service both give the utility's source: keep one (the fault current the utility states, or its transformer's nameplate)")]
    [InlineData(", utility_transformer_kva: 500, fault_x_r: 5", "utility_transformer_kva",
        "'utility_transformer_kva' of the service needs 'utility_transformer_impedance_percent' with it: the utility's source is given by its fault current and its X/R ratio together, or by its transformer's kVA, %Z and X/R together")]
    public void Parse_UtilitySourceGivenWrongly_IsAnErrorAtTheKey(string keys, string token, string message)
    {
        ProjectText.AssertOneError(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1), keys), token, message);
    }

    [Theory]
    [InlineData("trip: E", "E", "'trip' of the feeder of 'LP1' must be a curve class of IEC 60898-1 (B, C or D) or the multiple of the device's rating at which it trips without delay (a number); found 'E'")]
    [InlineData("trip: 0.5", "0.5", "'trip' of the feeder of 'LP1' must be greater than 1 and at most 50; found 0.5")]
    public void Parse_TripNotAClassOrMultiple_IsAnErrorAtTheValue(string key, string token, string message)
    {
        ProjectText.AssertOneError(Project("480Y/277", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG, " + key + " }", Circuit1)), token, message);
    }

    // --- main_a (the far-end terminals of a feeder, for the upsizer) ---

    [Fact]
    public void Parse_MainA_StoredOnTheEquipmentAndAbsentIsNull()
    {
        var project = ProjectLoader.Parse(
            Project("208Y/120", Panel("LP1", "SVC", "{ length: 20, size: 2 AWG }", Circuit1).Replace("from: SVC,", "from: SVC, main_a: 100,", StringComparison.Ordinal)
                + Panel("LP2", "SVC", "{ length: 20, size: 2 AWG }", Circuit1)),
            "t.yaml");

        Assert.Equal(100.0, project.Equipment[0].MainA);
        Assert.Null(project.Equipment[1].MainA);
    }

    [Fact]
    public void Parse_MainAOnATransformer_IsAnErrorAtTheKey()
    {
        ProjectText.AssertOneError(
            Project("480Y/277", Transformer("T1", "SVC", "208Y/120", feeder: "{ length: 20, size: 2 AWG, ocpd: 100 }") + "    main_a: 100\n"),
            "main_a",
            "'main_a' is for a switchboard, panelboard or splitter (the rating of its main device or main lugs); transformer 'T1' has neither: its primary terminals are taken as those of its feeder's 'ocpd'");
    }

    private static string Project(string system, string equipment, string serviceKeys = "") =>
        $"disttree: 1\nproject: {{ name: Keys }}\nservice: {{ id: SVC, system: {system}{serviceKeys} }}\nequipment:\n{equipment}";

    private static string Panel(string id, string from, string feeder, string circuit) =>
        $"  - {{ id: {id}, kind: panelboard, from: {from}, feeder: {feeder}, circuits: [ {circuit} ] }}\n";

    private static string Transformer(string id, string from, string secondary, string? phase = null, string? feeder = null) =>
        $"  - id: {id}\n    kind: transformer\n    from: {from}\n    kva: 45\n    secondary: {secondary}\n    impedance_percent: 4\n    x_r: 3\n"
        + (phase is null ? "" : $"    phase: {phase}\n")
        + (feeder is null ? "" : $"    feeder: {feeder}\n");
}
