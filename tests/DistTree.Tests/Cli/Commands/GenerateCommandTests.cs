using DistTree.ProjectFiles;

namespace DistTree.Tests.Cli.Commands;

/// <summary>disttree generate: text on standard output or in a file, the same bytes for the same seed, exit 2 for bad options.</summary>
public sealed class GenerateCommandTests
{
    [Fact]
    public void Generate_NoOutput_WritesAValidProjectToStandardOutput()
    {
        var result = CliRunner.Run("generate", "--end-points", "250", "--seed", "9");

        Assert.Equal(0, result.ExitCode);
        Assert.Equal("", result.Error);
        Assert.Equal(250, ProjectLoader.Parse(result.Out, "g.yaml").Equipment.Sum(e => e.Circuits.Count));
    }

    [Fact]
    public void Generate_SameSeedTwice_SameBytesInTheFile()
    {
        var folder = Directory.CreateTempSubdirectory("disttree-generate-");
        try
        {
            var a = Path.Combine(folder.FullName, "a.yaml");
            var b = Path.Combine(folder.FullName, "b.yaml");
            Assert.Equal(0, CliRunner.Run("generate", "--end-points", "1200", "--depth", "2", "--seed", "77", "--output", a).ExitCode);
            Assert.Equal(0, CliRunner.Run("generate", "--end-points", "1200", "--depth", "2", "--seed", "77", "--output", b).ExitCode);

            Assert.Equal(File.ReadAllBytes(a), File.ReadAllBytes(b));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Theory]
    [InlineData("0", "3")]
    [InlineData("10", "9")]
    public void Generate_OutOfRange_ExitsTwo(string endPoints, string depth)
    {
        var result = CliRunner.Run("generate", "--end-points", endPoints, "--depth", depth);

        Assert.Equal(2, result.ExitCode);
        Assert.StartsWith("disttree: error: --", result.Error, StringComparison.Ordinal);
        Assert.Equal("", result.Out);
    }
}
