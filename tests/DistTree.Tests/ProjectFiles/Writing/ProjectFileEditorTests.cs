using DistTree.Diagnostics;
using DistTree.ProjectFiles.Writing;
using DistTree.Sizing;
using DistTree.Solving;

namespace DistTree.Tests.ProjectFiles.Writing;

public sealed class ProjectFileEditorTests
{
    private static UpsizeChange Change(int line, int column, string before, string after, int setsBefore = 1, int setsAfter = 1) => new()
    {
        RunId = "X",
        Kind = RunResultKind.Feeder,
        SizeBefore = before,
        SizeAfter = after,
        SetsBefore = setsBefore,
        SetsAfter = setsAfter,
        DropPercentBefore = 4,
        DropPercentAfter = 2,
        CostAdded = 1,
        SizeLocation = new SourceLocation("p.yaml", line, column),
    };

    [Fact]
    public void Apply_FlowMapping_EditsOnlyTheSize()
    {
        var text = "a: 1\n    feeder: { length: 40, size: 1 AWG, ocpd: 125 }   # primary\nb: 2\n";
        var edited = ProjectFileEditor.Apply(text, [Change(2, 33, "1 AWG", "2/0 AWG")]);
        Assert.Equal("a: 1\n    feeder: { length: 40, size: 2/0 AWG, ocpd: 125 }   # primary\nb: 2\n", edited);
    }

    [Fact]
    public void Apply_FlowMappingWithSets_ReplacesOrAddsSets()
    {
        var with = ProjectFileEditor.Apply("f: { size: 500 kcmil, sets: 1 }\n", [Change(1, 12, "500 kcmil", "600 kcmil", 1, 2)]);
        Assert.Equal("f: { size: 600 kcmil, sets: 2 }\n", with);
        var without = ProjectFileEditor.Apply("f: { size: 500 kcmil }\n", [Change(1, 12, "500 kcmil", "500 kcmil", 1, 3)]);
        Assert.Equal("f: { size: 500 kcmil, sets: 3 }\n", without);
    }

    [Fact]
    public void Apply_BlockMapping_KeepsCommentsAndAddsSetsBelow()
    {
        var text = "    feeder:\n      length: 40   # measured\n      size: \"1 AWG\"\n    demand_factor: 1\n";
        var edited = ProjectFileEditor.Apply(text, [Change(3, 13, "1 AWG", "1/0 AWG", 1, 2)]);
        Assert.Equal("    feeder:\n      length: 40   # measured\n      size: \"1/0 AWG\"\n      sets: 2\n    demand_factor: 1\n", edited);
    }

    [Fact]
    public void Apply_WrongLocation_Throws() =>
        Assert.Throws<InvalidOperationException>(() => ProjectFileEditor.Apply("f: { size: 6 AWG }\n", [Change(1, 12, "4 AWG", "2 AWG")]));
}
