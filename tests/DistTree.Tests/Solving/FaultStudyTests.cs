using DistTree.Solving;
using DistTree.Tests.Solving.Reference;

namespace DistTree.Tests.Solving;

/// <summary>
/// The short-circuit study (issue 23) against closed forms and the trade's rules. Invented projects.
/// </summary>
public sealed class FaultStudyTests
{
    private const string Head = """
        disttree: 1
        project: { name: Fault closed forms, units: metric }

        """;

    // A transformer standing at an infinite bus (no feeder, no source impedance).
    private const string TransformerOnInfiniteBus = Head + """
        rules: { fault_voltage_factor_max: 1.0 }
        service: { id: SVC, system: 480Y/277 }
        equipment:
          - id: T1
            kind: transformer
            from: SVC
            kva: 1000
            secondary: 208Y/120
            impedance_percent: 5.75
            x_r: 6
        """;

    [Fact]
    public void Transformer_OnInfiniteBus_GivesTheNameplateClosedFormOverKT()
    {
        var study = ReferenceHarness.Analyse(TransformerOnInfiniteBus).Solution.Faults!;
        var t1 = study.Equipment.Single(e => e.Id == "T1");

        // Common practice: I = kVA/(√3·V_LL·%Z/100) on an infinite bus; IEC 60909-0 (recalled) divides the impedance by
        // K_T = 0.95·c_max/(1 + 0.6·x_T), x_T = %Z·sin(atan(X/R))/100, and multiplies by c_max (1.0 here).
        var closedFormKa = 1000 / (Math.Sqrt(3) * 0.208 * 0.0575) / 1000;
        var xT = 0.0575 * Math.Sin(Math.Atan(6));
        var kT = 0.95 * 1.0 / (1 + (0.6 * xT));
        Assert.Equal(closedFormKa / kT, t1.AvailableFaultCurrentKa!.Value, 1e-9);

        // Dyn1 on an infinite bus: the zero sequence is the leakage alone, equal to the positive, so the line-to-ground
        // current equals the three-phase one (symmetrical components, circuit theory).
        Assert.Equal(t1.AvailableFaultCurrentKa!.Value, t1.AvailableFaultCurrentLgKa!.Value, 1e-9);
        Assert.Equal(6, t1.XOverR!.Value, 1e-9);
        Assert.Equal(FaultSourceKind.InfiniteBus, study.Source);
    }

    [Fact]
    public void Transformer_OnInfiniteBus_MatchesTheReferencesWorkedFigure()
    {
        // REFERENCES.md, Fault current (common practice): 1000 kVA, 480 V, 5.75 % → 20.9 kA on an infinite bus. The same
        // transformer with a 480 V secondary, c_max 1.0 and K_T taken out of the figure.
        var analysis = ReferenceHarness.Analyse(TransformerOnInfiniteBus.Replace("secondary: 208Y/120", "secondary: 480Y/277", StringComparison.Ordinal));
        var t1 = analysis.Solution.Faults!.Equipment.Single(e => e.Id == "T1");
        var kT = 0.95 / (1 + (0.6 * 0.0575 * Math.Sin(Math.Atan(6))));
        Assert.Equal(20.9, t1.AvailableFaultCurrentKa!.Value * kT, 0.05);
    }

    [Fact]
    public void Switchboard_AtTheService_TakesTheUtilitysStatedCurrent()
    {
        // IEC 60909-0's network feeder: Z_Q = c·U_n/(√3·I″kQ), so a fault at the service draws I″kQ again.
        var analysis = ReferenceHarness.Analyse(Head + """
            service: { id: SVC, system: 480Y/277, available_fault_current_ka: 35, fault_x_r: 8 }
            equipment:
              - { id: MSB, kind: switchboard, from: SVC, interrupting_ka: 25 }
            """);
        var msb = analysis.Solution.Faults!.Equipment.Single();
        Assert.Equal(35, msb.AvailableFaultCurrentKa!.Value, 1e-9);
        Assert.Equal(8, msb.XOverR!.Value, 1e-9);

        // The zero sequence taken equal to the positive (the utility gives the three-phase figure only): L-G = 3-phase.
        Assert.Equal(35, msb.AvailableFaultCurrentLgKa!.Value, 1e-9);

        // Rated 25 kA under 35 kA available: a finding citing the rule set's clause.
        var finding = Assert.Single(msb.Findings);
        Assert.Equal(FindingKind.InterruptingRating, finding.Kind);
        Assert.Equal("NEC 110.9 and 110.10", finding.Reference);
        Assert.Equal((35.0, 25.0), (finding.Value, finding.Limit));
        Assert.Contains(finding, analysis.Solution.AllFindings);
        Assert.True(analysis.Solution.HasFindings);
    }

    [Fact]
    public void Motor_FeedsTheBusAtFourTimesItsFullLoadCurrent()
    {
        // A utility source Z_Q and one 3-phase motor on a very short branch: the bus's Thevenin impedance is Z_Q in
        // parallel with the motor's U_n/(√3·4·I_FL) at R/X 0.42 (common practice; IEC 60909-0, recalled) plus its
        // branch circuit, closed form by hand.
        var analysis = ReferenceHarness.Analyse(Head + """
            rules: { conductor_temperature: 20 }
            service: { id: SVC, system: 480Y/277, available_fault_current_ka: 10, fault_x_r: 4 }
            equipment:
              - id: MCC
                kind: switchboard
                from: SVC
                circuits:
                  - { id: M1, poles: 3, ocpd: 125, load: { fla: 96, pf: 0.85 }, run: { length: 1, size: 1/0 AWG } }
            """);
        var mcc = analysis.Solution.Faults!.Equipment.Single();
        var branch = analysis.Run("MCC/M1");
        var zBranch = new System.Numerics.Complex(branch.ResistanceOhmPerKm!.Value, branch.ReactanceOhmPerKm!.Value) / 1000;
        var uLn = 480 / Math.Sqrt(3);
        var zq = System.Numerics.Complex.FromPolarCoordinates(1.05 * uLn / 10_000, Math.Atan(4));
        var zm = System.Numerics.Complex.FromPolarCoordinates(uLn / (4 * 96), Math.Atan(1 / 0.42)) + zBranch;
        var thevenin = 1 / ((1 / zq) + (1 / zm));
        Assert.Equal(1.05 * uLn / thevenin.Magnitude / 1000, mcc.AvailableFaultCurrentKa!.Value, 1e-9);
        Assert.True(mcc.AvailableFaultCurrentKa > 10.3, "the motor adds about 4 × 96 A");
    }

    [Theory]
    [InlineData("B", 5)]
    [InlineData("C", 10)]
    [InlineData("D", 20)]
    [InlineData("7.5", 7.5)]
    public void Trip_ClassOrMultiple_SetsTheInstantaneousCurrent(string trip, double multiple)
    {
        // IEC 60898-1's classes at the top of their bands (B 3–5, C 5–10, D 10–20 × In; recalled).
        var analysis = ReferenceHarness.Analyse(Head + $$"""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 500 }, run: { length: 20, size: 12 AWG, trip: {{trip}} } }
            """);
        var farEnd = analysis.Solution.Faults!.FarEndAt(analysis.Run("LP/1").NodeIndex)!.Value;
        Assert.Equal(multiple * 20, farEnd.TripCurrentA!.Value, 1e-9);
    }

    [Fact]
    public void FarEnd_LongThinRun_IsAFindingAndAFuseWithoutMultipleIsNotJudged()
    {
        // 12 AWG for 120 m on a 20 A breaker: the loop of line and 12 AWG grounding conductor is about 2 × 120 m ×
        // 6.6 Ω/km ≈ 1.6 Ω at 75 °C (NEC Chapter 9 Table 8's 2.0 Ω/kft, read), so 0.95 × 120 V/1.6 Ω ≈ 72 A, far below
        // 10 × 20 A. The same run on a fuse with no stated multiple has no trip current to judge.
        var analysis = ReferenceHarness.Analyse(Head + """
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 120, size: 12 AWG } }
                  - { id: "2", poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 120, size: 12 AWG, device_type: fuse } }
            """);
        var faults = analysis.Solution.Faults!;
        var breaker = faults.FarEndAt(analysis.Run("LP/1").NodeIndex)!.Value;
        Assert.InRange(breaker.MinimumCurrentA, 60, 80);
        Assert.False(breaker.Clears);
        var finding = Assert.Single(analysis.Run("LP/1").Findings, f => f.Kind == FindingKind.FaultClearing);
        Assert.Equal("NEC 250.4(A)(5)", finding.Reference);
        Assert.Equal(200, finding.Limit, 1e-9);

        var fuse = faults.FarEndAt(analysis.Run("LP/2").NodeIndex)!.Value;
        Assert.Null(fuse.TripCurrentA);
        Assert.True(fuse.Clears);
        Assert.DoesNotContain(analysis.Run("LP/2").Findings, f => f.Kind == FindingKind.FaultClearing);
    }

    [Fact]
    public void FarEnd_SourceEnd_IsTheSameFaultAtThePanel()
    {
        // A branch circuit's source end is its panel's bus: the same line-to-ground fault there is the feeder's own far end
        // (both line to ground, both at c_min with conductors hot), so no size of the branch circuit can give more.
        var analysis = ReferenceHarness.Analyse(Head + """
            service: { id: SVC, system: 208Y/120, available_fault_current_ka: 10, fault_x_r: 3 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 60, size: 4 AWG, ground_size: 8 AWG, ocpd: 70 }
                circuits:
                  - { id: "1", poles: 1, ocpd: 20, load: { va: 500 }, run: { length: 30, size: 12 AWG } }
            """);
        var faults = analysis.Solution.Faults!;
        var feeder = faults.FarEndAt(analysis.Run("LP").NodeIndex)!.Value;
        var branch = faults.FarEndAt(analysis.Run("LP/1").NodeIndex)!.Value;
        Assert.Equal((FaultKind.LineToGround, FaultKind.LineToGround), (feeder.Kind, branch.Kind));
        Assert.Equal(feeder.MinimumCurrentA, branch.SourceEndA, 1e-9);
        Assert.True(branch.MinimumCurrentA < branch.SourceEndA);
    }

    [Fact]
    public void UtilityTransformer_IsTheSourceOfFaultsAndOfTheDrop()
    {
        // A 500 kVA, 5 % utility transformer: at the service I = 500/(√3·0.48·0.05)·c_max/K_T (common practice with
        // IEC 60909-0's factors); the same impedance (without them) stands ahead of the service in the voltage drop.
        var analysis = ReferenceHarness.Analyse(Head + """
            service: { id: SVC, system: 480Y/277, utility_transformer_kva: 500, utility_transformer_impedance_percent: 5, fault_x_r: 5 }
            equipment:
              - id: MSB
                kind: switchboard
                from: SVC
                circuits:
                  - { id: "1", poles: 3, ocpd: 100, load: { kva: 50 }, run: { length: 10, size: 3 AWG } }
            """);
        var msb = analysis.Solution.Faults!.Equipment.Single();
        var kT = 0.95 * 1.05 / (1 + (0.6 * 0.05 * Math.Sin(Math.Atan(5))));
        Assert.Equal(500 / (Math.Sqrt(3) * 0.48 * 0.05) / 1000 * 1.05 / kT, msb.AvailableFaultCurrentKa!.Value, 1e-9);
        Assert.Equal(FaultSourceKind.UtilityTransformer, analysis.Solution.Faults.Source);
        Assert.True(analysis.Solution.EndPoints.Single().SourceDropPercent > 0);
    }
}
