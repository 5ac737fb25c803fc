using DistTree.Conductors;
using DistTree.Model;
using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Writing;
using DistTree.Vocabulary;

namespace DistTree.Tests.ProjectFiles.Writing;

/// <summary>GeneratedProjectWriter: what it writes reads back as what it was told.</summary>
public sealed class GeneratedProjectWriterTests
{
    private static readonly ElectricalSystem High = ElectricalSystem.Find("480Y/277")!;
    private static readonly ElectricalSystem Low = ElectricalSystem.Find("208Y/120")!;

    [Fact]
    public void Write_SmallProject_ReadsBackWithEveryFigure()
    {
        var writer = Start();
        writer.Equipment("T1", EquipmentKind.Transformer, "MSB");
        writer.Transformer(112.5, Low, 4.5, 3.2, 2.5);
        writer.Feeder(new WrittenRun(40, ConductorSize.Parse("1/0 AWG"), 1, 175));
        writer.Equipment("LP1", EquipmentKind.Panelboard, "T1");
        writer.Feeder(new WrittenRun(10, ConductorSize.Parse("250 kcmil"), 2, 400));
        writer.Circuits();
        writer.Circuit(1, "EF-1 exhaust fan", 3, 15, new Load(LoadKind.Hp, 1.5, 0.84), false, new WrittenRun(100, ConductorSize.Parse("12 AWG"), 1, null));
        writer.Circuit(2, "Receptacles", 1, 20, new Load(LoadKind.Va, 1080, 0.9), true, new WrittenRun(55.5, ConductorSize.Parse("10 AWG"), 1, null));

        var project = ProjectLoader.Parse(writer.ToString(), "generated.yaml");

        Assert.Equal(UnitSystem.Imperial, project.Units);
        Assert.Equal(new ConductorDefaults(Material.Copper, 75, Raceway.Steel), project.Defaults);
        var transformer = project.Equipment.Single(e => e.Id == "T1").Transformer!;
        Assert.Equal((112.5, "208Y/120", 4.5, 3.2, 2.5), (transformer.Kva, transformer.Secondary.Name, transformer.ImpedancePercent, transformer.XOverR, transformer.TapPercent));
        var panel = project.Equipment.Single(e => e.Id == "LP1");
        Assert.Equal((2, 400.0, 10 * UnitFactors.MetresPerFoot), (panel.Feeder!.Sets, panel.Feeder.OcpdA!.Value, panel.Feeder.LengthM));
        Assert.Equal(new Load(LoadKind.Hp, 1.5, 0.84), panel.Circuits[0].Load);
        Assert.Equal(("2", 1080.0, true, 55.5 * UnitFactors.MetresPerFoot), (panel.Circuits[1].Id, panel.Circuits[1].Load.Value, panel.Circuits[1].Continuous, panel.Circuits[1].Run.LengthM));
    }

    [Fact]
    public void Transformer_NoTap_WritesNoTapKey()
    {
        var writer = Start();
        writer.Equipment("T1", EquipmentKind.Transformer, "MSB");
        writer.Transformer(75, Low, 4, 2, 0);
        Assert.DoesNotContain("tap_percent", writer.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Feeder_OneSetAndADevice_WritesNoSetsAndTheDevice()
    {
        var writer = Start();
        writer.Feeder(new WrittenRun(120.25, ConductorSize.Parse("4/0 AWG"), 1, 225));
        Assert.EndsWith("    feeder: { length: 120.25, size: 4/0 AWG, ocpd: 225, trip: 5 }\n", writer.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Circuit_EveryLoadQuantity_WritesItsWord()
    {
        foreach (var (word, kind) in Words.LoadQuantity.Pairs)
        {
            var writer = new GeneratedProjectWriter(256);
            writer.Circuit(1, "C", 3, 20, new Load(kind, 2, 0.9), false, new WrittenRun(10, ConductorSize.Parse("12 AWG"), 1, null));
            Assert.Contains($"load: {{ {word}: 2, pf: 0.9 }}", writer.ToString(), StringComparison.Ordinal);
        }
    }

    private static GeneratedProjectWriter Start()
    {
        var writer = new GeneratedProjectWriter(1024);
        writer.Comment("Invented for a test.");
        writer.Top("Test campus", UnitSystem.Imperial, "Invented.", new ConductorDefaults(Material.Copper, 75, Raceway.Steel), "SVC", High);
        writer.Equipment("MSB", EquipmentKind.Switchboard, "SVC");
        return writer;
    }
}
