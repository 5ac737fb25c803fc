using DistTree.Model;
using DistTree.Reports;
using DistTree.Tests.Solving;

namespace DistTree.Tests.Reports;

public sealed class CautionTests
{
    // The caution names the code and edition the checks assumed, says the clauses are recalled, and leaves the
    // decision to the code in force, the authority having jurisdiction and a qualified person.
    [Fact]
    public void For_Nec_NamesTheCodeAndEditionAndWhoDecides()
    {
        var text = Caution.For(ElectricalCode.Nec);
        Assert.Contains("NEC 2020", text, StringComparison.Ordinal);
        Assert.Contains("recalled", text, StringComparison.Ordinal);
        Assert.Contains("authority having jurisdiction", text, StringComparison.Ordinal);
        Assert.Contains("qualified person", text, StringComparison.Ordinal);
    }

    // The JSON results name the code and edition in their rules and in their caution.
    [Fact]
    public void Write_Json_NamesTheCode()
    {
        var s = SolverHarness.Solve(SolverHarness.OneCircuit("120/240", "imperial",
            "{ id: \"1\", poles: 1, load: { amps: 10 }, run: { length: 10, size: 12 AWG } }", "code: nec"));
        using var json = System.Text.Json.JsonDocument.Parse(JsonResults.Write(s));
        var rules = json.RootElement.GetProperty("rules");
        Assert.Equal("nec", rules.GetProperty("code").GetString());
        Assert.Equal("NEC 2020", rules.GetProperty("code_edition").GetString());
        Assert.Equal(Caution.For(ElectricalCode.Nec), json.RootElement.GetProperty("caution").GetString());
    }
}
