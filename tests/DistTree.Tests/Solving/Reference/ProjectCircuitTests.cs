using System.Numerics;
using DistTree.Conductors;

namespace DistTree.Tests.Solving.Reference;

/// <summary>
/// The translation of a project into a circuit, against closed forms of the same conventions on circuits small
/// enough to write out: one constant-impedance load, so every figure is a voltage divider (Ohm's and Kirchhoff's laws)
/// through the run's conductors, the transformer's leakage referred to its secondary (ideal transformer: turns ratio,
/// impedance by its square) and the source.
/// </summary>
public sealed class ProjectCircuitTests
{
    private const double PointsTolerance = 1e-9;

    [Fact]
    public void EndPointDrops_OnePoleOnStiffSource_IsTheLoopDivider()
    {
        // A single-phase loop: line and neutral each Z_run, so V = V_LN·Z_L/(Z_L + 2·Z_run).
        var a = ReferenceHarness.Analyse(Project("120/240", "", Circuit(1, "A", "va: 1800, pf: 0.9", "30, size: 12 AWG")));
        var zRun = Z(a, "P/1", 0.030);
        var zLoad = LoadImpedance(120, 1800, 0.9);

        Assert.Equal(DropPercent(120, 120 * zLoad / (zLoad + (2 * zRun))), Drop(a, "P/1"), PointsTolerance);
    }

    [Fact]
    public void EndPointDrops_ThreePoleBelowDyn1WithTap_IsThePerPhaseDivider()
    {
        // A balanced delta load Z_Δ = 3·V_LL²/conj(S) is a star of V_LL²/conj(S) per phase. Below a Dyn1 transformer on
        // a stiff 480 V primary at tap +2.5 the star emf is (208/√3)/1.025 V, behind the leakage (%Z/100)·V_LL²/S∠atan(X/R)
        // and the branch's line impedance; the line-to-line voltage is √3 times the star voltage.
        var transformer = Transformer("T", "SVC", "75", "208Y/120", "5", "4", tap: "2.5");
        var a = ReferenceHarness.Analyse(Project("480Y/277", transformer, Circuit(3, "ABC", "kva: 30, pf: 0.85", "20, size: 4 AWG"), panelFrom: "T"));
        var leakage = 0.05 * 208 * 208 / 75_000 * Complex.FromPolarCoordinates(1, Math.Atan(4));
        var star = 208 * 208 / Complex.Conjugate(Complex.FromPolarCoordinates(30_000, Math.Acos(0.85)));
        var emf = 208 / Math.Sqrt(3) / 1.025;

        var v = emf * star / (star + leakage + Z(a, "P/1", 0.020));

        Assert.Equal(DropPercent(208, Math.Sqrt(3) * v), Drop(a, "P/1"), PointsTolerance);
    }

    [Theory]
    // 120 V: the half winding's 0.25·R + j0.1·X and the primary's 0.5·R + j0.8·X referred to the half winding (a
    // quarter: half the turns, squared): 0.375·R + j0.3·X, which on a 120 V base is 1.5·%R and 1.2·%X.
    [InlineData(1, "A", 120, 0.375, 0.3)]
    [InlineData(1, "B", 120, 0.375, 0.3)]
    // 240 V: the primary's part and both halves in series: R + jX.
    [InlineData(2, "AB", 240, 1.0, 1.0)]
    public void EndPointDrops_CentreTappedSecondary_SeesThreeWindingImpedance(int poles, string phase, double volts, double rShare, double xShare)
    {
        var transformer = Transformer("T", "SVC", "25", "120/240", "2.5", "2", tap: "0");
        var a = ReferenceHarness.Analyse(Project("480Y/277", transformer, Circuit(poles, phase, "va: 4000, pf: 0.8", "25, size: 10 AWG"), panelFrom: "T"));
        var full = 0.025 * 240 * 240 / 25_000 * Complex.FromPolarCoordinates(1, Math.Atan(2));
        var winding = new Complex(rShare * full.Real, xShare * full.Imaginary);
        var zLoad = LoadImpedance(volts, 4000, 0.8);

        var v = volts * zLoad / (zLoad + winding + (2 * Z(a, "P/1", 0.025)));

        Assert.Equal(DropPercent(volts, v), Drop(a, "P/1"), PointsTolerance);
    }

    [Fact]
    public void EndPointDrops_WithFaultCurrent_AddsHalfTheUtilityLoopToAOnePoleLoop()
    {
        // 120/240 with I_sc = 10 kA at X/R 3: the loop 240/I_sc∠atan 3 split between the two lines; a 1-pole load's
        // loop takes one line's half (the neutral is grounded at the service).
        var a = ReferenceHarness.Analyse(Project("120/240", "", Circuit(1, "B", "va: 1500, pf: 1", "20, size: 12 AWG")), p => p.WithFaultCurrent(10, 3));
        var utility = Complex.FromPolarCoordinates(240.0 / 10_000 / 2, Math.Atan(3));
        var zLoad = LoadImpedance(120, 1500, 1);

        var v = 120 * zLoad / (zLoad + utility + (2 * Z(a, "P/1", 0.020)));

        Assert.Equal(DropPercent(120, v), Drop(a, "P/1"), PointsTolerance);
    }

    [Fact]
    public void EndPointDrops_FeederWithSmallerNeutral_TakesTheNeutralSizesImpedance()
    {
        // A 1-pole load behind a feeder whose neutral is 8 AWG: the loop is the feeder's line, its neutral (catalogue
        // figures of 8 AWG at the run's temperature) and the branch's line and neutral; the source and the base are
        // V_LL/√3 (208/√3, not the nameplate's 120), the load's impedance V²/conj(S) at that base.
        var feeder = "    feeder: { length: 40, size: 4 AWG }\n";
        var a = ReferenceHarness.Analyse(
            Project("208Y/120", "", Circuit(1, "C", "va: 1900, pf: 0.95", "15, size: 12 AWG"), panelFeeder: feeder),
            p => p.WithEquipment("P", e => e with { Feeder = e.Feeder! with { NeutralSize = ConductorSize.Parse("8 AWG") } }));
        var run = a.Run("P");
        var catalog = ConductorCatalog.Standard;
        var neutral = new Complex(
            catalog.AcResistanceOhmPerKm(ConductorSize.Parse("8 AWG"), Material.Copper, Raceway.Pvc, run.TemperatureC!.Value, 60),
            catalog.ReactanceOhmPerKm(ConductorSize.Parse("8 AWG"), Raceway.Pvc, 60)) * 0.040;
        var baseV = 208 / Math.Sqrt(3);
        var zLoad = LoadImpedance(baseV, 1900, 0.95);

        var v = baseV * zLoad / (zLoad + Z(a, "P", 0.040) + neutral + (2 * Z(a, "P/1", 0.015)));

        Assert.Equal(DropPercent(baseV, v), Drop(a, "P/1"), PointsTolerance);
    }

    [Fact]
    public void EndPointDrops_LoadsAtTwoPoints_IsTheLadderDivider()
    {
        // Loads at 10 m and 30 m of a 1-pole run: a ladder. The loop impedance of each span is 2·Z per length; the
        // first load is in parallel with the second span and load, so I = V/(Z₁ + Z_L1 ∥ (Z₂ + Z_L2)),
        // V₁ = V − I·Z₁ and V₂ = V₁·Z_L2/(Z₂ + Z_L2) (series and parallel impedances, Kirchhoff's laws).
        var points = "      - { id: \"1\", poles: 1, phase: A, points: [ { at: 10, load: { va: 600, pf: 0.9, model: impedance } }, "
            + "{ at: 30, load: { va: 900, pf: 1, model: impedance } } ], run: { length: 30, size: 12 AWG } }";
        var a = ReferenceHarness.Analyse(Project("120/240", "", points));
        var (z1, z2) = (2 * Z(a, "P/1", 0.010), 2 * Z(a, "P/1", 0.020));
        var (zl1, zl2) = (LoadImpedance(120, 600, 0.9), LoadImpedance(120, 900, 1));
        var far = z2 + zl2;
        var i = 120 / (z1 + (zl1 * far / (zl1 + far)));
        var v1 = 120 - (i * z1);

        Assert.Equal(DropPercent(120, v1 * zl2 / far), Drop(a, "P/1"), PointsTolerance);
    }

    [Theory]
    [MemberData(nameof(PhaseFrameNodalTests.Cases), MemberType = typeof(PhaseFrameNodalTests))]
    public void Circuit_EveryPhaseFrameCase_SourcePowerIsLossesPlusLoads(string name)
    {
        // Conservation of complex power (Tellegen's theorem) on each comparison case's circuit, and every load of
        // constant power takes its stated S: the translation loses no element and the iteration has converged.
        var c = PhaseFrameCases.All[name];
        var circuit = ProjectCircuit.Of(ReferenceHarness.Analyse(c.Yaml, c.Edit)).Circuit;
        var s = circuit.Solve();

        var given = s.TotalSourcePowerVa;
        Assert.True((given - s.TotalLossVa - s.TotalLoadPowerVa).Magnitude <= 1e-9 * given.Magnitude, $"{given} against {s.TotalLossVa} + {s.TotalLoadPowerVa}");
        for (var k = 0; k < circuit.Loads.Count; k++)
        {
            if (circuit.Loads[k].Model == DistTree.Model.LoadModel.ConstantPower)
            {
                Assert.True((s.LoadPowerVa(k) - circuit.Loads[k].PowerVa).Magnitude <= 1e-9 * circuit.Loads[k].PowerVa.Magnitude);
            }
        }
    }

    [Fact]
    public void Of_DemandFactorOtherThanOne_Throws()
    {
        var a = ReferenceHarness.Analyse(Project("208Y/120", "", Circuit(1, "A", "va: 100, pf: 1", "10, size: 12 AWG")), p => p.WithEquipment("P", e => e with { DemandFactor = 0.8 }));

        Assert.Throws<NotSupportedException>(() => ProjectCircuit.Of(a));
    }

    private static double Drop(AnalysisResult a, string id) => ProjectCircuit.Of(a).EndPointDropsPercent()[id];

    private static double DropPercent(double nominalV, Complex v) => (nominalV - v.Magnitude) / nominalV * 100;

    // A constant-impedance load of |S| VA at power factor pf on nominalV: Z = V²/conj(S).
    private static Complex LoadImpedance(double nominalV, double va, double pf) =>
        nominalV * nominalV / Complex.Conjugate(Complex.FromPolarCoordinates(va, Math.Acos(pf)));

    // One conductor of the run feeding `id`, over `km`, from the solution's figures.
    private static Complex Z(AnalysisResult a, string id, double km)
    {
        var run = a.Run(id);
        return new Complex(run.ResistanceOhmPerKm!.Value, run.ReactanceOhmPerKm!.Value) * km / run.Sets;
    }

    private static string Transformer(string id, string from, string kva, string secondary, string z, string xr, string tap) => $"""
          - id: {id}
            kind: transformer
            from: {from}
            kva: {kva}
            secondary: {secondary}
            impedance_percent: {z}
            x_r: {xr}
            tap_percent: {tap}

        """;

    private static string Circuit(int poles, string phase, string load, string run) =>
        $"      - {{ id: \"1\", poles: {poles}, phase: {phase}, load: {{ {load}, model: impedance }}, run: {{ length: {run} }} }}";

    private static string Project(string system, string equipment, string circuit, string panelFrom = "SVC", string panelFeeder = "") => $"""
        disttree: 1
        project: {"{"} name: Reference, units: metric {"}"}
        service: {"{"} id: SVC, system: {system} {"}"}
        equipment:
        {equipment}  - id: P
            kind: panelboard
            from: {panelFrom}
        {panelFeeder}    circuits:
        {circuit}
        """;
}
