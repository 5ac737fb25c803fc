using DistTree.Conductors;
using DistTree.Model;

namespace DistTree.Tests.Solving.Reference;

/// <summary>One small invented project for the phase-frame comparison.</summary>
/// <param name="Yaml">The project file.</param>
/// <param name="Edit">A change made in the model before solving, for what the project file cannot say yet (null for none).</param>
/// <param name="Light">
/// True when the tree is lightly loaded (end-point drops of about 2 % or less), so the percent sum, the load flow's
/// linearisation, must come within 3 % of the reference (or 0.01 points); false for a heavily loaded tree, where a
/// constant-power load draws visibly more than at nominal voltage and only the load flow is compared.
/// </param>
internal sealed record PhaseFrameCase(string Yaml, Func<Project, Project>? Edit, bool Light);

/// <summary>The projects of <see cref="PhaseFrameNodalTests"/>, covering every connection kind (invented data).</summary>
internal static class PhaseFrameCases
{
    private const string Head = """
        disttree: 1
        project: { name: Phase-frame reference case, units: metric }

        """;

    public static IReadOnlyDictionary<string, PhaseFrameCase> All { get; } = new Dictionary<string, PhaseFrameCase>(StringComparer.Ordinal)
    {
        // A 1-pole load on each line of a 208Y/120 panel behind a feeder; circuit numbers give the lines (1 A, 3 B, 5 C).
        ["OnePoleOnEachLine"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 35, size: 2 AWG }
                circuits:
                  - { id: "1", poles: 1, load: { va: 800, pf: 0.95 }, run: { length: 15, size: 12 AWG } }
                  - { id: "3", poles: 1, load: { va: 500, pf: 0.9 }, run: { length: 12, size: 12 AWG } }
                  - { id: "5", poles: 1, load: { va: 1000, pf: 1 }, run: { length: 18, size: 10 AWG } }
            """),

        // Three 1-pole loads all on line A behind a 4 AWG feeder: the neutral carries the whole line current back.
        ["ThreeOnLineAHeavy"] = Heavy("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 60, size: 4 AWG }
                circuits:
                  - { id: a1, poles: 1, phase: A, load: { va: 2400, pf: 0.9 }, run: { length: 20, size: 12 AWG } }
                  - { id: a2, poles: 1, phase: A, load: { va: 2400, pf: 0.9 }, run: { length: 15, size: 12 AWG } }
                  - { id: a3, poles: 1, phase: A, load: { va: 2400, pf: 0.9 }, run: { length: 25, size: 10 AWG } }
                  - { id: b1, poles: 1, phase: B, load: { va: 100, pf: 1 }, run: { length: 10, size: 12 AWG } }
            """),

        // The same shape lightly loaded, so that the percent sum must follow the neutral's share too.
        ["ThreeOnLineALight"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 60, size: 4 AWG }
                circuits:
                  - { id: a1, poles: 1, phase: A, load: { va: 600, pf: 0.9 }, run: { length: 12, size: 12 AWG } }
                  - { id: a2, poles: 1, phase: A, load: { va: 600, pf: 0.9 }, run: { length: 10, size: 12 AWG } }
                  - { id: a3, poles: 1, phase: A, load: { va: 600, pf: 0.9 }, run: { length: 15, size: 10 AWG } }
                  - { id: c1, poles: 1, phase: C, load: { va: 100, pf: 1 }, run: { length: 10, size: 12 AWG } }
            """),

        // 2-pole loads on a 208Y/120 panel (on AB and BC), with a 1-pole load beside them.
        ["TwoPoleOn208"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 30, size: 3 AWG }
                circuits:
                  - { id: w1, poles: 2, phase: AB, load: { va: 2500, pf: 0.9 }, run: { length: 15, size: 10 AWG } }
                  - { id: w2, poles: 2, phase: BC, load: { kw: 1.5, pf: 0.85 }, run: { length: 20, size: 10 AWG } }
                  - { id: r1, poles: 1, phase: C, load: { va: 600, pf: 0.95 }, run: { length: 10, size: 12 AWG } }
            """),

        // 2-pole and 1-pole loads on a 120/240 service panel behind a feeder.
        ["TwoPoleOn120240"] = Light("""
            service: { id: SVC, system: 120/240 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 25, size: 2 AWG }
                circuits:
                  - { id: d1, poles: 2, phase: AB, load: { va: 3000, pf: 0.95 }, run: { length: 12, size: 10 AWG } }
                  - { id: l1, poles: 1, phase: A, load: { va: 700, pf: 0.9 }, run: { length: 14, size: 12 AWG } }
                  - { id: l2, poles: 1, phase: B, load: { va: 300, pf: 1 }, run: { length: 9, size: 12 AWG } }
            """),

        // A balanced 3-pole motor (10 hp from the motor tables) behind a feeder, with a 1-pole load on the panel.
        ["ThreePoleMotor"] = Light("""
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: MP
                kind: panelboard
                from: SVC
                feeder: { length: 40, size: 6 AWG }
                circuits:
                  - { id: m1, poles: 3, load: { hp: 10, pf: 0.85 }, run: { length: 30, size: 10 AWG } }
                  - { id: l1, poles: 1, phase: B, load: { va: 1200, pf: 0.9 }, run: { length: 20, size: 12 AWG } }
            """),

        // 480Y/277 to 208Y/120 through a three-phase (Dyn1) transformer fed by a feeder, unbalanced loads below a
        // secondary feeder: two 1-pole loads on A, one on B, a 2-pole load on CA and a 3-pole load.
        ["ThreePhaseTransformer"] = Light("""
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: T1
                kind: transformer
                from: SVC
                feeder: { length: 30, size: 6 AWG }
                kva: 75
                secondary: 208Y/120
                impedance_percent: 3.5
                x_r: 3
              - id: LP
                kind: panelboard
                from: T1
                feeder: { length: 8, size: 2/0 AWG }
                circuits:
                  - { id: a1, poles: 1, phase: A, load: { va: 900, pf: 0.95 }, run: { length: 10, size: 12 AWG } }
                  - { id: a2, poles: 1, phase: A, load: { va: 700, pf: 0.9 }, run: { length: 12, size: 12 AWG } }
                  - { id: b1, poles: 1, phase: B, load: { va: 500, pf: 1 }, run: { length: 8, size: 12 AWG } }
                  - { id: ca, poles: 2, phase: CA, load: { va: 2000, pf: 0.9 }, run: { length: 10, size: 10 AWG } }
                  - { id: m3, poles: 3, load: { kva: 4, pf: 0.85 }, run: { length: 15, size: 10 AWG } }
            """),

        // Single-phase transformers on a 480Y/277 primary, one across A-B (the default) and one across B-C (set in
        // the model), each with a 120/240 centre-tapped secondary feeding 1-pole and 2-pole loads.
        ["SinglePhaseTransformers"] = new(Head + """
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: TA
                kind: transformer
                from: SVC
                feeder: { length: 25, size: 8 AWG }
                kva: 25
                secondary: 120/240
                impedance_percent: 2.5
                x_r: 1.5
              - id: TB
                kind: transformer
                from: SVC
                feeder: { length: 40, size: 8 AWG }
                kva: 37.5
                secondary: 120/240
                impedance_percent: 3
                x_r: 2
              - id: PA
                kind: panelboard
                from: TA
                circuits:
                  - { id: l1, poles: 1, phase: A, load: { va: 900, pf: 0.95 }, run: { length: 12, size: 12 AWG } }
                  - { id: l2, poles: 1, phase: B, load: { va: 400, pf: 0.9 }, run: { length: 10, size: 12 AWG } }
                  - { id: d1, poles: 2, phase: AB, load: { va: 2000, pf: 0.9 }, run: { length: 10, size: 10 AWG } }
              - id: PB
                kind: panelboard
                from: TB
                feeder: { length: 6, size: 1/0 AWG }
                circuits:
                  - { id: l1, poles: 1, phase: A, load: { va: 700, pf: 1 }, run: { length: 15, size: 12 AWG } }
                  - { id: d1, poles: 2, phase: AB, load: { va: 3000, pf: 0.85 }, run: { length: 12, size: 10 AWG } }
            """, p => p.WithEquipment("TB", e => e with { Transformer = e.Transformer! with { PrimaryPhases = Phases.BC } }), Light: true),

        // Constant-current and constant-impedance loads of every pole count.
        ["CurrentAndImpedanceLoads"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 30, size: 3 AWG }
                circuits:
                  - { id: i1, poles: 1, phase: A, load: { amps: 6, pf: 0.9, model: current }, run: { length: 15, size: 12 AWG } }
                  - { id: z1, poles: 1, phase: B, load: { va: 900, pf: 1, model: impedance }, run: { length: 15, size: 12 AWG } }
                  - { id: i2, poles: 2, phase: CA, load: { va: 2000, pf: 0.85, model: current }, run: { length: 12, size: 10 AWG } }
                  - { id: z3, poles: 3, load: { kva: 5, pf: 0.9, model: impedance }, run: { length: 20, size: 10 AWG } }
                  - { id: i3, poles: 3, load: { kva: 3, pf: 0.8, model: current }, run: { length: 18, size: 10 AWG } }
            """),

        // Loads along runs: a row of eight luminaires on a 1-pole circuit, and three 2-pole heaters on one run.
        ["LoadsAlongRuns"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 20, size: 3 AWG }
                circuits:
                  - id: row
                    poles: 1
                    phase: B
                    points:
                      - { at: 10, load: { va: 80, pf: 0.95 } }
                      - { at: 16, load: { va: 80, pf: 0.95 } }
                      - { at: 22, load: { va: 80, pf: 0.95 } }
                      - { at: 28, load: { va: 80, pf: 0.95 } }
                      - { at: 34, load: { va: 80, pf: 0.95 } }
                      - { at: 40, load: { va: 80, pf: 0.95 } }
                      - { at: 46, load: { va: 80, pf: 0.95 } }
                      - { at: 52, load: { va: 80, pf: 0.95 } }
                    run: { length: 55, size: 12 AWG }
                  - id: heat
                    poles: 2
                    phase: AB
                    points:
                      - { at: 8, load: { va: 500, pf: 1 } }
                      - { at: 15, load: { va: 500, pf: 1, model: impedance } }
                      - { at: 15, load: { va: 300, pf: 1 } }
                    run: { length: 20, size: 12 AWG }
            """),

        // Taps: a three-phase transformer at −2.5 % and a single-phase one at +5 %, both lightly loaded.
        ["Taps"] = Light("""
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: T3
                kind: transformer
                from: SVC
                kva: 45
                secondary: 208Y/120
                impedance_percent: 4
                x_r: 2.5
                tap_percent: -2.5
              - id: T1
                kind: transformer
                from: SVC
                feeder: { length: 20, size: 10 AWG }
                kva: 15
                secondary: 120/240
                impedance_percent: 2
                x_r: 1.2
                tap_percent: 5
              - id: P3
                kind: panelboard
                from: T3
                circuits:
                  - { id: a, poles: 1, phase: A, load: { va: 600, pf: 0.95 }, run: { length: 10, size: 12 AWG } }
                  - { id: m, poles: 3, load: { kva: 3, pf: 0.85 }, run: { length: 12, size: 10 AWG } }
              - id: P1
                kind: panelboard
                from: T1
                circuits:
                  - { id: l, poles: 1, phase: B, load: { va: 500, pf: 1 }, run: { length: 10, size: 12 AWG } }
                  - { id: d, poles: 2, phase: AB, load: { va: 1200, pf: 0.9 }, run: { length: 10, size: 10 AWG } }
            """),

        // A feeder above a tapped transformer whose load is constant impedance: below the tap the no-load voltage is
        // 1/1.05 of nominal, and the load draws its current there, in both methods (found by the random-tree property).
        ["FeederAboveATap"] = Light("""
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - { id: MP, kind: panelboard, from: SVC, feeder: { length: 80, size: 6 AWG },
                  circuits: [ { id: m, poles: 3, load: { va: 100, pf: 1 }, run: { length: 3, size: 12 AWG } } ] }
              - { id: T, kind: transformer, from: MP, kva: 75, secondary: 208Y/120, impedance_percent: 2, x_r: 2, tap_percent: 5 }
              - { id: LP, kind: panelboard, from: T,
                  circuits: [ { id: h, poles: 3, load: { kva: 7.5, pf: 1, model: impedance }, run: { length: 3, size: 6 AWG } } ] }
            """),

        // The utility's fault current and X/R at a 208Y/120 service (set in the model), mixed loads.
        ["FaultCurrentThreePhase"] = new(Head + """
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 25, size: 2 AWG }
                circuits:
                  - { id: a, poles: 1, phase: A, load: { va: 900, pf: 0.9 }, run: { length: 12, size: 12 AWG } }
                  - { id: bc, poles: 2, phase: BC, load: { va: 1800, pf: 0.9 }, run: { length: 12, size: 10 AWG } }
                  - { id: m, poles: 3, load: { kva: 4, pf: 0.85 }, run: { length: 15, size: 10 AWG } }
            """, p => p.WithFaultCurrent(5, 2), Light: true),

        // The same at a 120/240 service.
        ["FaultCurrentSinglePhase"] = new(Head + """
            service: { id: SVC, system: 120/240 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 20, size: 3 AWG }
                circuits:
                  - { id: a, poles: 1, phase: A, load: { va: 700, pf: 0.9 }, run: { length: 12, size: 12 AWG } }
                  - { id: d, poles: 2, phase: AB, load: { va: 2400, pf: 0.95 }, run: { length: 12, size: 10 AWG } }
            """, p => p.WithFaultCurrent(8, 1.5), Light: true),

        // A feeder whose neutral is smaller than its lines (set in the model), under unbalanced 1-pole loads.
        ["ReducedNeutral"] = new(Head + """
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: LP
                kind: panelboard
                from: SVC
                feeder: { length: 30, size: 2 AWG }
                circuits:
                  - { id: a, poles: 1, phase: A, load: { va: 900, pf: 0.95 }, run: { length: 12, size: 12 AWG } }
                  - { id: b, poles: 1, phase: B, load: { va: 300, pf: 1 }, run: { length: 10, size: 12 AWG } }
            """, p => p.WithEquipment("LP", e => e with { Feeder = e.Feeder! with { NeutralSize = ConductorSize.Parse("6 AWG") } }), Light: true),

        // A delta service (a virtual grounded star point, no neutral conductor): a 3-pole load, a 2-pole load and a
        // Dyn1 transformer to 208Y/120 with 1-pole loads.
        ["DeltaService"] = Light("""
            service: { id: SVC, system: 480D }
            equipment:
              - id: MP
                kind: panelboard
                from: SVC
                feeder: { length: 30, size: 8 AWG }
                circuits:
                  - { id: m, poles: 3, load: { kva: 8, pf: 0.85 }, run: { length: 20, size: 12 AWG } }
                  - { id: w, poles: 2, phase: BC, load: { va: 2000, pf: 0.9 }, run: { length: 15, size: 12 AWG } }
              - id: T
                kind: transformer
                from: SVC
                kva: 30
                secondary: 208Y/120
                impedance_percent: 3
                x_r: 2
              - id: LP
                kind: panelboard
                from: T
                circuits:
                  - { id: a, poles: 1, phase: A, load: { va: 600, pf: 0.95 }, run: { length: 10, size: 12 AWG } }
                  - { id: c, poles: 1, phase: C, load: { va: 400, pf: 1 }, run: { length: 12, size: 12 AWG } }
            """),

        // Two-wire secondaries of single-phase transformers: 240 V (about a grounded midpoint) and 120 V (line to
        // neutral), on a 208Y/120 primary across A-B.
        ["TwoWireSecondaries"] = Light("""
            service: { id: SVC, system: 208Y/120 }
            equipment:
              - id: T240
                kind: transformer
                from: SVC
                kva: 10
                secondary: "240"
                impedance_percent: 2.5
                x_r: 1.5
              - id: T120
                kind: transformer
                from: SVC
                kva: 5
                secondary: "120"
                impedance_percent: 2
                x_r: 1
              - id: P240
                kind: panelboard
                from: T240
                circuits:
                  - { id: h, poles: 2, load: { va: 1500, pf: 1 }, run: { length: 10, size: 12 AWG } }
              - id: P120
                kind: panelboard
                from: T120
                circuits:
                  - { id: r, poles: 1, load: { va: 500, pf: 0.9 }, run: { length: 10, size: 12 AWG } }
            """),
    };

    private static PhaseFrameCase Light(string yaml) => new(Head + yaml, null, Light: true);

    private static PhaseFrameCase Heavy(string yaml) => new(Head + yaml, null, Light: false);
}
