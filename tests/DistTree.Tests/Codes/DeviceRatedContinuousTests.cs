using DistTree.Comparing;
using DistTree.Solving;
using DistTree.Tests.ProjectFiles;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes;

// device_rated_continuous: true says the device and its assembly are marked for continuous operation at 100 % of their
// rating, so the continuous load counts at 100 %, not 125 % (NEC 210.19(A)(1) and 215.2(A)(1) Exception No. 1;
// CEC Rule 8-104; both recalled, not read).
public sealed class DeviceRatedContinuousTests
{
    // A 17 A continuous load on a 20 A device, 120 V line to neutral: counted at 125 %, 21.25 A, above the device (NEC
    // 210.20(A); CEC Rule 8-104: at most 80 % of a device not so marked, 16 A; both recalled); under a device marked for
    // 100 %, 17 A, within it.
    [Theory]
    [InlineData("nec", false, 21.25, "NEC 210.20(A)")]
    [InlineData("nec", true, 17.0, null)]
    [InlineData("cec", false, 21.25, "CEC Rule 8-104")]
    [InlineData("cec", true, 17.0, null)]
    public void Solve_ContinuousBranchLoad_CountsAt100PercentUnderAMarkedDevice(string code, bool marked, double designA, string? reference)
    {
        var flag = marked ? "true" : "false";
        var solution = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "metric",
            $"{{ id: \"1\", poles: 1, ocpd: 20, continuous: true, load: {{ amps: 17 }}, run: {{ length: 5, size: 10 AWG, device_rated_continuous: {flag} }} }}",
            $"code: {code}"));
        Assert.Equal(designA, solution.Branch().DesignCurrentA, 6);
        var device = solution.AllFindings.Where(f => f.Kind == FindingKind.DeviceBelowLoad).ToList();
        Assert.Equal(reference is null ? [] : [reference], device.Select(f => f.Reference));
        if (reference is not null)
        {
            Assert.Contains("(125 % of continuous load plus the rest)", device[0].Message, StringComparison.Ordinal);
        }
    }

    // On a feeder: every load below it continuous, so its design current without the mark is 1.25 times the one with it
    // (the same 125 % rule; 215.2(A)(1)(a) and Exception No. 1, Rule 8-104; recalled).
    [Theory]
    [InlineData("nec")]
    [InlineData("cec")]
    public void Solve_ContinuousFeederLoad_MarkTakesOffTheQuarter(string code)
    {
        double FeederDesignA(string flag) => SolverHarness.Solve(
            "disttree: 1\nproject: { name: F, units: metric }\n" + $"rules: {{ code: {code} }}\n"
            + "service: { id: SVC, system: 208Y/120 }\nequipment:\n  - id: P\n    kind: panelboard\n    from: SVC\n"
            + $"    feeder: {{ length: 10, size: 4 AWG, ocpd: 100, device_rated_continuous: {flag} }}\n    circuits:\n"
            + "      - { id: \"1\", poles: 3, ocpd: 60, continuous: true, load: { kva: 15 }, run: { length: 5, size: 6 AWG } }\n")
            .Runs.Single(r => r.Id == "P").DesignCurrentA;
        var unmarked = FeederDesignA("false");
        var marked = FeederDesignA("true");
        Assert.Equal(15000 / (Math.Sqrt(3) * 208), marked, 1); // about 41.6 A
        Assert.Equal(1.25 * marked, unmarked, 9);
    }

    // A motor's branch circuit takes its design current from the motor (125 % of its full-load current) whatever the
    // mark says: 5 hp at 208 V three-phase, 16.7 A (NEC Table 430.250, recalled), 20.9 A.
    [Fact]
    public void Solve_MotorCircuit_MarkChangesNothing()
    {
        double DesignA(string flag) => SolverHarness.Solve(SolverHarness.OneCircuit("208Y/120", "metric",
            $"{{ id: \"1\", poles: 3, ocpd: 40, load: {{ hp: 5, pf: 0.85 }}, run: {{ length: 5, size: 10 AWG, device_rated_continuous: {flag} }} }}", "code: cec"))
            .Branch().DesignCurrentA;
        Assert.Equal(DesignA("false"), DesignA("true"));
        Assert.Equal(1.25 * 16.7, DesignA("true"), 6);
    }

    [Fact]
    public void Load_NotABoolean_IsOneLocatedError() =>
        ProjectText.AssertOneError(
            ProjectText.Minimal(circuit: "poles: 1\n        ocpd: 20\n        load: { va: 1000 }\n        run: { length: 20, size: 12 AWG, device_rated_continuous: often }"),
            "often",
            "'device_rated_continuous' of the run of circuit 'LP1/1' must be true or false; found 'often'");

    // A revision that marks a circuit's device names the change in the comparison; an unmarked run writes no field, so
    // comparisons of projects that never use the key read as before.
    [Fact]
    public void Compare_MarkAdded_IsAFieldChange()
    {
        static string Project(string extra) => SolverHarness.OneCircuit("120/240", "metric",
            $"{{ id: \"1\", poles: 1, ocpd: 20, continuous: true, load: {{ amps: 10 }}, run: {{ length: 5, size: 10 AWG{extra} }} }}");
        var comparison = RevisionComparer.Compare(
            SolverHarness.Solve(Project(""), "old.yaml"), SolverHarness.Solve(Project(", device_rated_continuous: true"), "new.yaml"));
        var circuit = Assert.Single(comparison.Circuits);
        var field = Assert.Single(circuit.Fields);
        Assert.Equal((null, "true"), (field.Before, field.After));
        Assert.EndsWith("device_rated_continuous", field.Field, StringComparison.Ordinal);
    }
}
