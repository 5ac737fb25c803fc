using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Solving.Passes;

namespace DistTree.Tests.Solving.Passes;

public sealed class PowerSumsTests
{
    private const string Project = """
        disttree: 1
        project: { name: Test, units: metric }
        service: { id: SVC, system: 480Y/277, frequency_hz: 60 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            demand_factor: 0.8
            feeder: { length: 20, size: 1/0 AWG }
            circuits:
              - { id: "1", poles: 1, load: { va: 1000, pf: 1.0 }, run: { length: 10, size: 12 AWG } }
              - { id: "2", poles: 1, continuous: true, load: { va: 500, pf: 1.0 }, run: { length: 10, size: 12 AWG } }
              - { id: "3", poles: 3, load: { hp: 10, pf: 0.85 }, run: { length: 10, size: 10 AWG } }
        """;

    // A node carries the phasor sum of its children times its demand factor (common practice); the continuous part
    // is summed the same way. The motor's running power is its table current at the system voltage.
    [Fact]
    public void PowerSums_Panel_CarriesItsDemandFactorTimesItsCircuits()
    {
        var network = NetworkBuilder.Build(ProjectLoader.Parse(Project, "test.yaml"));
        using var sums = new PowerSums(network);
        var (panel, one, two, motor) = (Index(network, "P"), Index(network, "P/1"), Index(network, "P/2"), Index(network, "P/3"));
        var circuits = sums.Power[one] + sums.Power[two] + sums.Power[motor];
        Assert.Equal(1000, sums.Power[one].Watts, 9);
        Assert.Equal(0.8 * circuits.Watts, sums.Power[panel].Watts, 9);
        Assert.Equal(0.8 * circuits.Vars, sums.Power[panel].Vars, 9);
        Assert.Equal(0.8 * 500, sums.Continuous[panel].Watts, 9);
        Assert.Equal(sums.Power[panel].Watts, sums.Power[0].Watts, 9);
        Assert.Equal(6 * sums.Power[motor].VoltAmperes, sums.LockedRotor[motor].VoltAmperes, 6);
    }

    [Fact]
    public void PowerSums_Has_NotesWhatEachNodeHas()
    {
        var network = NetworkBuilder.Build(ProjectLoader.Parse(Project, "test.yaml"));
        using var sums = new PowerSums(network);
        Assert.Equal(Has.None, sums.Has[0]);
        Assert.Equal(Has.Run, sums.Has[Index(network, "P")]);
        Assert.Equal(Has.Circuit | Has.Run, sums.Has[Index(network, "P/1")]);
        Assert.Equal(Has.Circuit | Has.Run | Has.Motor, sums.Has[Index(network, "P/3")]);
    }

    private static int Index(DistributionNetwork network, string id) => network.NodeArray.Single(n => n.Id == id).Index;
}
