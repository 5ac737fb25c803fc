using DistTree.Conductors;
using DistTree.Sizing;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Sizing;

/// <summary>
/// A feeder lands on terminals at both its ends: its own device's at the source, the main device's or main lugs' of the
/// equipment it feeds (<c>main_a</c>) at the far end; the plan proposes no size either refuses, and names the end that does.
/// </summary>
/// <remarks>
/// The limits are the embedded table's, src/DistTree/Conductors/Data/terminal-limits.tsv, whose header states its source:
/// recalled common practice for moulded-case breakers and fusible switches with their standard 75 °C lugs, not a maker's
/// data. Its rows read here: a 125 A device takes the 225 A band, one conductor up to 300 kcmil; a 100 A main the 100 A
/// band, up to 1/0 AWG; a 200 A main the 225 A band again.
/// </remarks>
public sealed class UpsizerFarEndTerminalTests
{
    // A 90 A three-phase load at 208 V on a 2 AWG feeder (115 A at 75 °C, on a 125 A breaker by NEC 240.4(B)); at 100 m its
    // own 3 % needs 2/0 AWG or larger (the solver's figure, with NEC Chapter 9 Table 8 resistances: 1/0 AWG drops 3.0 %
    // and more, 2/0 AWG less), beyond what a 100 A main's terminals take and within a 125 A device's. Invented demo data.
    private static string Feeder(double lengthM, string mainKey, double ocpdA = 125) => SolverHarness.PanelOnFeeder(
            FormattableString.Invariant($"length: {lengthM}, size: 2 AWG, ocpd: {ocpdA}"),
            "{ id: \"1\", poles: 3, ocpd: 100, load: { amps: 90 }, run: { length: 5, size: 1 AWG } }")
        .Replace("    from: SVC\n", $"    from: SVC\n{mainKey}", StringComparison.Ordinal);

    private static UpsizePlan PlanFor(string yaml) => Upsizer.Standard.Plan(SolverHarness.Solve(yaml));

    private static ConductorSize FeederAfter(UpsizePlan plan) =>
        plan.Changes.SingleOrDefault(c => c.RunId == "P") is { } change ? ConductorSize.Parse(change.SizeAfter) : ConductorSize.Parse("2 AWG");

    [Fact]
    public void Plan_FeederBeyondItsFarEndsMainLugs_NotProposedAndTheFarEndNamed()
    {
        var plan = PlanFor(Feeder(100, "    main_a: 100\n"));

        Assert.True(FeederAfter(plan) <= ConductorSize.Parse("1/0 AWG"), FeederAfter(plan).ToString());
        var u = Assert.Single(plan.Unresolvable, u => u.Subject == "P" && u.Message.Contains("terminal limit", StringComparison.Ordinal));
        Assert.Contains(
            "is beyond the terminal limit of the 100 A main (main_a) of panelboard P at its far end (1×1/0 AWG; terminal-limits.tsv (embedded)); it needs a main whose terminals take it (in the table, a main of 225 A takes it)",
            u.Message,
            StringComparison.Ordinal);
        Assert.DoesNotContain("its 125 A device", u.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("    main_a: 200\n")]
    [InlineData("")]
    public void Plan_FarEndsMainTakesTheSizeOrIsNotStated_ProposesIt(string mainKey)
    {
        var plan = PlanFor(Feeder(100, mainKey));

        var after = FeederAfter(plan);
        Assert.True(after >= ConductorSize.Parse("2/0 AWG") && after <= ConductorSize.Parse("300 kcmil"), after.ToString());
        Assert.DoesNotContain(plan.Unresolvable, u => u.Subject == "P");
        Assert.False(plan.After.HasFindings);
    }

    // The present size stays allowed where the far end's main would not take it (3/0 AWG on a 100 A main: beyond 1/0 AWG).
    [Fact]
    public void Plan_PresentSizeBeyondTheFarEndsMain_StaysAllowed()
    {
        var plan = PlanFor(Feeder(60, "    main_a: 100\n").Replace("size: 2 AWG, ocpd", "size: 3/0 AWG, ocpd", StringComparison.Ordinal));

        Assert.DoesNotContain(plan.Changes, c => c.RunId == "P");
        Assert.DoesNotContain(plan.Unresolvable, u => u.Subject == "P");
    }

    // Both ends refuse it: a 100 A device and a 100 A main (both the 100 A band, up to 1/0 AWG): both are named.
    [Fact]
    public void Plan_BothEndsRefuseTheSize_NamesBoth()
    {
        var plan = PlanFor(Feeder(100, "    main_a: 100\n", ocpdA: 100));

        var u = Assert.Single(plan.Unresolvable, u => u.Subject == "P" && u.Message.Contains("terminal limit", StringComparison.Ordinal));
        Assert.Contains(
            "is beyond the terminal limits of its 100 A device (1×1/0 AWG) and of the 100 A main (main_a) of panelboard P at its far end (1×1/0 AWG; terminal-limits.tsv (embedded)); it needs a device and a main whose terminals take it (in the table, one of 225 A takes it)",
            u.Message,
            StringComparison.Ordinal);
    }

    // At 80 m the drop alone takes the feeder to 1/0 AWG; its far-end fault (line to ground, 10 × 125 A to trip) then needs
    // a larger loop: lines the far-end repair takes only where the far end's main accepts them (the same table rows), or a
    // larger grounding conductor (which lands on the panel's grounding bar, not its main). Either way it clears.
    [Theory]
    [InlineData("    main_a: 100\n", "1/0 AWG")]
    [InlineData("    main_a: 200\n", "300 kcmil")]
    public void Plan_FarEndFaultRepair_StaysWithinTheFarEndsMain(string mainKey, string largest)
    {
        var plan = PlanFor(Feeder(80, mainKey));

        var after = FeederAfter(plan);
        Assert.True(after <= ConductorSize.Parse(largest), after.ToString());
        Assert.DoesNotContain(plan.After.AllFindings, f => f.Kind == DistTree.Solving.FindingKind.FaultClearing);
        var change = Assert.Single(plan.Changes, c => c.RunId == "P");
        Assert.NotNull(change.FaultClearingNote);
    }
}
