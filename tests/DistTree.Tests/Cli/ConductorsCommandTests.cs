using System.Text.Json;

namespace DistTree.Tests.Cli;

public sealed class ConductorsCommandTests
{
    [Fact]
    public void Conductors_Default_PrintsEverySizeAndTheSources()
    {
        var result = CliRunner.Run("conductors");
        Assert.Equal(0, result.ExitCode);
        Assert.Contains("12 AWG", result.Out, StringComparison.Ordinal);
        Assert.Contains("2000 kcmil", result.Out, StringComparison.Ordinal);
        Assert.Contains("630 mm2", result.Out, StringComparison.Ordinal);
        Assert.Contains("NEC Chapter 9 Table 9", result.Out, StringComparison.Ordinal);
        Assert.Contains("authority having jurisdiction", result.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Conductors_Json_GivesFiguresForTheOptions()
    {
        var result = CliRunner.Run("conductors", "--material", "al", "--temperature", "75", "--raceway", "steel", "--json");
        Assert.Equal(0, result.ExitCode);
        using var doc = JsonDocument.Parse(result.Out);
        var rows = doc.RootElement.GetProperty("conductors").EnumerateArray().ToArray();
        var al1000 = rows.Single(r => r.GetProperty("size").GetString() == "1000 kcmil");
        // NEC Chapter 9 Table 9: aluminium, steel conduit, 1000 kcmil: 0.025 ohm/kft (REFERENCES.md, read).
        Assert.InRange(al1000.GetProperty("resistance_ac_ohm_per_km").GetDouble() * 0.3048, 0.025 * 0.95, 0.025 * 1.05);
        Assert.Equal(445, al1000.GetProperty("ampacity_75c_a").GetDouble());
    }

    [Fact]
    public void Conductors_UnknownMaterial_ExitsTwo()
    {
        var result = CliRunner.Run("conductors", "--material", "gold");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("gold", result.Error, StringComparison.Ordinal);
    }
}
