using System.Text.Json;
using DistTree.Model;
using DistTree.Reports;
using DistTree.Solving;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Codes.Cec;

// One small project solved under `code: nec` and `code: cec`: the physics is the same, the judgement differs where the
// codes do. CEC rule numbers and figures are recalled from CSA C22.1:2021, not read; the NEC's from NFPA 70 2020 as
// each row says. The ampacities are the catalogue's NEC Table 310.16 figures under both codes (CSA Tables 2 and 4 are
// not held): 12 AWG copper at 75 °C 25 A, 6 AWG 65 A (read).
public sealed class CecProjectTests
{
    // Five 2-wire circuits share raceway R: ten current-carrying conductors. Circuit 6 is long (60 m of 12 AWG at 10 A,
    // about 6.6 %). The feeder is 6 AWG copper (65 A) on a 70 A device.
    private static string Project(string code) => $$"""
        disttree: 1
        project: { name: Two codes, units: metric }
        rules: { code: {{code}}, conductor_temperature: rated }
        service: { id: SVC, system: 208Y/120 }
        equipment:
          - id: P
            kind: panelboard
            from: SVC
            feeder: { length: 5, size: 6 AWG, ocpd: 70 }
            circuits:
              - { id: "1", poles: 1, ocpd: 15, load: { amps: 14 }, run: { length: 5, size: 12 AWG, raceway_id: R } }
              - { id: "2", poles: 1, ocpd: 15, load: { amps: 14 }, run: { length: 5, size: 12 AWG, raceway_id: R } }
              - { id: "3", poles: 1, ocpd: 15, load: { amps: 14 }, run: { length: 5, size: 12 AWG, raceway_id: R } }
              - { id: "4", poles: 1, ocpd: 15, load: { amps: 14 }, run: { length: 5, size: 12 AWG, raceway_id: R } }
              - { id: "5", poles: 1, ocpd: 15, load: { amps: 14 }, run: { length: 5, size: 12 AWG, raceway_id: R } }
              - { id: "6", poles: 1, ocpd: 15, load: { amps: 10 }, run: { length: 60, size: 12 AWG } }
        """;

    private static readonly Solution Nec = SolverHarness.Solve(Project("nec"));
    private static readonly Solution Cec = SolverHarness.Solve(Project("cec"));

    [Fact]
    public void Solve_CodeCec_EveryFindingCitesACecRule()
    {
        Assert.Equal(ElectricalCode.Cec, Cec.Code.Code);
        Assert.NotEmpty(Cec.AllFindings);
        Assert.All(Cec.AllFindings, f => Assert.StartsWith("CEC ", f.Reference, StringComparison.Ordinal));
        Assert.All(Nec.AllFindings, f => Assert.StartsWith("NEC ", f.Reference, StringComparison.Ordinal));
    }

    // Ten conductors in raceway R: the NEC's 310.15(C)(1) (read) takes 10–20 at 50 %, 25 × 0.5 = 12.5 A, below the
    // 14 A load (210.19(A)(1)(a), recalled); CSA Table 5C (recalled) takes 7–24 at 70 %, 25 × 0.7 = 17.5 A, which
    // carries it. The 15 A device: under the NEC the next standard rating above 12.5 A (240.4(B), recalled); under the
    // CEC at most 17.5 A (Rule 14-104(1), recalled).
    [Fact]
    public void Solve_TenConductorsInOneRaceway_Table5CCarriesWhatTheNecsTableDoesNot()
    {
        var nec = Nec.Runs.Single(r => r.Id == "P/1");
        var cec = Cec.Runs.Single(r => r.Id == "P/1");
        Assert.Equal((10, 10), (nec.CurrentCarryingConductors, cec.CurrentCarryingConductors));
        Assert.Equal(12.5, nec.AmpacityA!.Value, 9);
        Assert.Equal(17.5, cec.AmpacityA!.Value, 9);
        Assert.Equal(["P/1", "P/2", "P/3", "P/4", "P/5"], Nec.AllFindings.Where(f => f.Kind == FindingKind.Ampacity).Select(f => f.Subject).Order());
        Assert.All(Nec.AllFindings.Where(f => f.Kind == FindingKind.Ampacity), f => Assert.Equal("NEC 210.19(A)(1)(a)", f.Reference));
        Assert.DoesNotContain(Cec.AllFindings, f => f.Kind == FindingKind.Ampacity);
    }

    // The feeder's 70 A device on 65 A conductors: the NEC lets it take the next standard rating above (240.4(B),
    // recalled); the CEC rule set reads Rule 14-104(1) (recalled) strictly, so it is a finding.
    [Fact]
    public void Solve_DeviceAtTheNextRatingAbove_IsACecFindingOnly()
    {
        Assert.DoesNotContain(Nec.AllFindings, f => f.Kind == FindingKind.OcpdAboveAmpacity);
        var found = Assert.Single(Cec.AllFindings, f => f.Kind == FindingKind.OcpdAboveAmpacity);
        Assert.Equal(("P", "CEC Rule 14-104(1)", 70.0, 65.0), (found.Subject, found.Reference, found.Value, found.Limit));
    }

    // The long circuit: the same drop under both (the physics does not change), over 3 % per branch circuit and 5 % in
    // all under both (NEC 210.19(A)(1) Informational Note No. 4; CEC Rule 8-102(1)(c) and (b), recalled).
    [Fact]
    public void Solve_LongCircuit_SameDropDifferentRule()
    {
        Assert.Equal(Nec.Runs.Single(r => r.Id == "P/6").DropPercent, Cec.Runs.Single(r => r.Id == "P/6").DropPercent);
        Assert.Equal("NEC 210.19(A)(1) Informational Note No. 4", Assert.Single(Nec.AllFindings, f => f.Kind == FindingKind.BranchDrop).Reference);
        Assert.Equal("CEC Rule 8-102(1)(c)", Assert.Single(Cec.AllFindings, f => f.Kind == FindingKind.BranchDrop).Reference);
        Assert.Equal("CEC Rule 8-102(1)(b)", Assert.Single(Cec.AllFindings, f => f.Kind == FindingKind.TotalDrop).Reference);
    }

    // The results name the code by its word and edition, pass the results schema (whose code enum names cec), and the
    // caution names the code assumed.
    [Fact]
    public void JsonResults_CodeCec_NamedAndValid()
    {
        using var doc = JsonDocument.Parse(JsonResults.Write(Cec));
        var rules = doc.RootElement.GetProperty("rules");
        Assert.Equal(("cec", "CEC 2021"), (rules.GetProperty("code").GetString(), rules.GetProperty("code_edition").GetString()));
        Assert.True(DistTree.Tests.Reports.JsonResultsTests.Schema.Evaluate(doc.RootElement).IsValid);
        Assert.Contains("assume CEC 2021", Caution.For(ElectricalCode.Cec), StringComparison.Ordinal);
    }
}
