namespace DistTree.Tests.Comparing;

/// <summary>Small invented projects for comparison tests (demo data, no real building).</summary>
internal static class ComparisonProjects
{
    /// <summary>
    /// SVC (208Y/120) → MSB → LP1 (three circuits) and LP2 (one circuit); every load at power factor 0.9 so that
    /// a run's phase angle does not change when load is added; rated conductor temperature so resistance is fixed.
    /// <paramref name="extraEquipment"/> is appended to the equipment list.
    /// </summary>
    public static string Shared(string extraEquipment = "", string lp1Circuit1Length = "20") => $$"""
        disttree: 1
        project:
          name: Shared feeder test
          units: metric
        rules:
          conductor_temperature: rated
        service:
          id: SVC
          system: 208Y/120
        equipment:
          - id: MSB
            kind: switchboard
            from: SVC
            feeder: { length: 30, size: 250 kcmil, ocpd: 250 }
          - id: LP1
            kind: panelboard
            from: MSB
            feeder: { length: 40, size: 1/0 AWG, ocpd: 150 }
            circuits:
              - { id: "1", name: Receptacles, poles: 1, ocpd: 20, load: { va: 1500, pf: 0.9 }, run: { length: {{lp1Circuit1Length}}, size: 12 AWG } }
              - { id: "2", name: Lighting, poles: 1, ocpd: 20, load: { va: 1200, pf: 0.9 }, run: { length: 18, size: 12 AWG } }
              - { id: "3", name: Unit heater, poles: 3, ocpd: 30, load: { kva: 10, pf: 0.9 }, run: { length: 25, size: 10 AWG } }
          - id: LP2
            kind: panelboard
            from: MSB
            feeder: { length: 25, size: 2 AWG, ocpd: 100 }
            circuits:
              - { id: "1", name: Copier, poles: 1, ocpd: 20, load: { va: 1800, pf: 0.9 }, run: { length: 15, size: 12 AWG } }
        {{extraEquipment}}
        """;

    /// <summary>A sub-panel fed from LP1 carrying 12 kVA at power factor 0.9.</summary>
    public const string SubPanel = """
          - id: SUB
            kind: panelboard
            from: LP1
            feeder: { length: 15, size: 4 AWG, ocpd: 70 }
            circuits:
              - { id: "1", name: Kitchen equipment, poles: 3, ocpd: 50, load: { kva: 12, pf: 0.9 }, run: { length: 10, size: 6 AWG } }
        """;

    /// <summary>A design with a transformer, written in one order with one set of comments.</summary>
    public const string Ordered = """
        # Invented demo design for the reordering test.
        disttree: 1
        project:
          name: Reorder test
          units: imperial
        rules:
          total_limit_percent: 5
        defaults:
          raceway: steel
        service:
          id: SVC
          system: 480Y/277
        equipment:
          - id: MSB
            kind: switchboard
            from: SVC
          - id: HP1          # mechanical
            kind: panelboard
            from: MSB
            feeder: { length: 120, size: 3/0 AWG, ocpd: 200 }
            circuits:
              - id: "1"
                name: Pump
                poles: 3
                ocpd: 30
                load: { hp: 10, pf: 0.85 }
                run: { length: 150, size: 10 AWG }
              - id: "3"
                name: Fan
                poles: 3
                ocpd: 15
                load: { hp: 2, pf: 0.8 }
                run: { length: 200, size: 12 AWG }
          - id: T1
            kind: transformer
            from: MSB
            kva: 45
            secondary: 208Y/120
            impedance_percent: 4.5
            x_r: 3
            feeder: { length: 60, size: 6 AWG, ocpd: 60 }
          - id: LP1
            kind: panelboard
            from: T1
            feeder: { length: 10, size: 3/0 AWG, ocpd: 150 }
            circuits:
              - id: "1"
                name: Receptacles
                poles: 1
                ocpd: 20
                load: { va: 1440, pf: 0.95 }
                run: { length: 90, size: 12 AWG }
              - id: "2"
                name: Lighting
                poles: 1
                ocpd: 20
                continuous: true
                load: { va: 1600, pf: 0.9 }
                run: { length: 140, size: 12 AWG }
        """;

    /// <summary><see cref="Ordered"/> with equipment, circuits and keys in another order and other comments.</summary>
    public const string Reordered = """
        disttree: 1
        service:
          system: 480Y/277   # utility
          id: SVC
        defaults:
          raceway: steel
        equipment:
          # lighting panel first this time
          - kind: panelboard
            id: LP1
            from: T1
            circuits:
              - id: "2"
                run: { size: 12 AWG, length: 140 }
                load: { pf: 0.9, va: 1600 }
                continuous: true
                ocpd: 20
                poles: 1
                name: Lighting
              - name: Receptacles
                id: "1"
                poles: 1
                ocpd: 20
                run: { size: 12 AWG, length: 90 }
                load: { va: 1440, pf: 0.95 }
            feeder: { ocpd: 150, size: 3/0 AWG, length: 10 }
          - id: T1
            from: MSB
            kind: transformer
            feeder: { size: 6 AWG, length: 60, ocpd: 60 }
            x_r: 3
            impedance_percent: 4.5
            secondary: 208Y/120
            kva: 45
          - id: HP1
            from: MSB
            kind: panelboard
            circuits:
              - { id: "3", name: Fan, poles: 3, ocpd: 15, load: { hp: 2, pf: 0.8 }, run: { length: 200, size: 12 AWG } }
              - { id: "1", name: Pump, poles: 3, ocpd: 30, load: { hp: 10, pf: 0.85 }, run: { length: 150, size: 10 AWG } }
            feeder: { length: 120, size: 3/0 AWG, ocpd: 200 }
          - id: MSB
            from: SVC
            kind: switchboard
        rules:
          total_limit_percent: 5
        project:
          units: imperial
          name: Reorder test
        """;
}
