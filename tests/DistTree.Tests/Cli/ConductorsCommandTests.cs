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
    public void Conductors_AluminumRaceway_GivesTheAluminumConduitColumn()
    {
        static double Rac1000(string raceway)
        {
            var result = CliRunner.Run("conductors", "--raceway", raceway, "--json");
            Assert.Equal(0, result.ExitCode);
            using var doc = JsonDocument.Parse(result.Out);
            return doc.RootElement.GetProperty("conductors").EnumerateArray()
                .Single(r => r.GetProperty("size").GetString() == "1000 kcmil").GetProperty("resistance_ac_ohm_per_km").GetDouble();
        }

        var aluminum = Rac1000("aluminum");

        // NEC Chapter 9 Table 9: copper, 1000 kcmil, aluminium conduit 0.019 ohm/kft (REFERENCES.md, memory: verify
        // before relying), above steel conduit's 0.018 (read).
        Assert.InRange(aluminum * 0.3048, 0.019 * 0.95, 0.019 * 1.05);
        Assert.True(aluminum > Rac1000("steel"));
    }

    // Found by CommandFuzzTests: a negative frequency or a temperature near absolute zero gave NaN figures, and with
    // --json an internal error (JSON has no NaN).
    [Theory]
    [InlineData("--frequency", "-1", "--frequency must be between 40 and 70 Hz; found -1")]
    [InlineData("--frequency", "0", "--frequency must be between 40 and 70 Hz; found 0")]
    [InlineData("--frequency", "1000", "--frequency must be between 40 and 70 Hz; found 1,000")]
    [InlineData("--temperature", "-273.15", "--temperature must be greater than 0 and at most 250 °C; found -273.15")]
    [InlineData("--temperature", "250.5", "--temperature must be greater than 0 and at most 250 °C; found 250.5")]
    public void Conductors_OutOfRange_ExitsTwoNamingTheRange(string option, string value, string message)
    {
        foreach (var json in new[] { false, true })
        {
            var result = CliRunner.Run(json ? ["conductors", option, value, "--json"] : ["conductors", option, value]);
            Assert.Equal((2, "", $"disttree: error: {message}\n"), (result.ExitCode, result.Out, result.Error.ReplaceLineEndings("\n")));
        }
    }

    [Theory]
    [InlineData("--frequency", "70")]
    [InlineData("--frequency", "40")]
    [InlineData("--temperature", "250")]
    [InlineData("--temperature", "0.5")]
    [InlineData("--ambient", "90")] // at or above the rating the ampacity is zero (NEC 310.15(B)(1)'s relation)
    [InlineData("--ambient", "-60")]
    public void Conductors_AtTheEndsOfTheRange_GivesFiniteJson(string option, string value)
    {
        var result = CliRunner.Run("conductors", option, value, "--json");

        Assert.Equal(0, result.ExitCode);
        using var doc = JsonDocument.Parse(result.Out);
        Assert.All(doc.RootElement.GetProperty("conductors").EnumerateArray(), r => Assert.True(r.GetProperty("resistance_ac_ohm_per_km").GetDouble() > 0));
    }

    [Fact]
    public void Conductors_UnknownMaterial_ExitsTwo()
    {
        var result = CliRunner.Run("conductors", "--material", "gold");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("gold", result.Error, StringComparison.Ordinal);
    }

    // The figures take the project file's ranges: below about -234 °C copper's resistance by its temperature
    // coefficient (0.00393 per K, IEC 60028) would be negative.
    [Theory]
    [InlineData("--temperature", "-300", "--temperature must be greater than 0 and at most 250 °C; found -300")]
    [InlineData("--frequency", "1e6", "--frequency must be between 40 and 70 Hz; found 1,000,000")]
    [InlineData("--ambient", "-300", "--ambient must be between -60 and 90 °C; found -300")]
    public void Conductors_FigureOutOfRange_ExitsTwoNamingTheRange(string option, string value, string message)
    {
        var result = CliRunner.Run("conductors", option, value);
        Assert.Equal(2, result.ExitCode);
        Assert.Contains(message, result.Error, StringComparison.Ordinal);
        Assert.Equal("", result.Out);
    }
}
