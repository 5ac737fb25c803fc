using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Tests;

/// <summary>The library's entry point: the three stages in one call, each stage's result kept.</summary>
public sealed class AnalysisTests
{
    private static string SmallOffice => Path.Combine(TestPaths.RepoRoot, "projects", "small-office.yaml");

    [Theory]
    [InlineData("quillfeather-medical.yaml")]
    [InlineData("riverside-clinic-metric.yaml")]
    [InlineData("campus/campus.yaml")]
    public void Run_ProjectFile_GivesTheBytesOfTheStagesRunByHand(string name)
    {
        var path = Path.Combine(TestPaths.RepoRoot, "projects", name);
        var byHand = DropSolver.Standard.Solve(NetworkBuilder.Build(ProjectLoader.Load(path)));

        Assert.Equal(JsonResults.Write(byHand), JsonResults.Write(Analysis.Run(path).Solution));
    }

    [Fact]
    public void Run_ProjectFile_KeepsEachStageOfTheOneRun()
    {
        var result = Analysis.Run(SmallOffice);

        Assert.Same(result.Project, result.Network.Project);
        Assert.Same(result.Network, result.Solution.Network);
        Assert.Same(result.Project, result.Solution.Project);
        Assert.Equal("small-office.yaml", Path.GetFileName(result.Project.File));
    }

    [Fact]
    public void Parse_Text_GivesTheSameBytesAsTheFile()
    {
        var text = File.ReadAllText(SmallOffice);

        Assert.Equal(JsonResults.Write(Analysis.Run(SmallOffice).Solution), JsonResults.Write(Analysis.Parse(text, SmallOffice).Solution));
    }

    [Fact]
    public void Run_LoadedProject_SolvesThatProjectWithoutLoadingAgain()
    {
        var project = ProjectLoader.Load(SmallOffice);

        var result = Analysis.Run(project);

        Assert.Same(project, result.Project);
        Assert.Equal(JsonResults.Write(Analysis.Run(SmallOffice).Solution), JsonResults.Write(result.Solution));
    }

    [Fact]
    public void Run_WithProgress_ReportsBuildingThenSolvingWithTheirCounts()
    {
        var progress = new Recorder();

        var result = Analysis.Run(SmallOffice, new AnalysisOptions { Progress = progress });

        Assert.Equal(
            [$"building the tree of {result.Project.Equipment.Count} equipment", $"solving {result.Network.Nodes.Count} nodes"],
            progress.Reports);
    }

    [Fact]
    public void Run_OtherCatalog_SolvesWithIt()
    {
        using var reader = new StreamReader(Path.Combine(TestPaths.RepoRoot, "src", "DistTree", "Conductors", "Data", "conductors.tsv"));
        var catalog = ConductorCatalog.Load(reader, "mine.tsv");

        var solution = Analysis.Run(SmallOffice, new AnalysisOptions { Catalog = catalog }).Solution;

        Assert.Equal("mine.tsv", solution.CatalogName);
        Assert.Equal(ConductorCatalog.Standard.SourceName, Analysis.Run(SmallOffice).Solution.CatalogName);
    }

    [Fact]
    public void Parse_BadProject_ThrowsLocatedProjectException()
    {
        var e = Assert.Throws<ProjectException>(() => Analysis.Parse("disttree: 1\nproject: [\n", "bad.yaml"));

        Assert.All(e.Diagnostics, d => Assert.Equal("bad.yaml", d.Location.File));
    }

    [Fact]
    public void Run_MissingFile_ThrowsIOException()
    {
        Assert.ThrowsAny<IOException>(() => Analysis.Run(Path.Combine(TestPaths.RepoRoot, "projects", "no-such-project.yaml")));
    }

    // Records reports as they are made (Progress<T> would post them to a synchronisation context).
    private sealed class Recorder : IProgress<string>
    {
        public List<string> Reports { get; } = [];

        public void Report(string value) => Reports.Add(value);
    }
}
