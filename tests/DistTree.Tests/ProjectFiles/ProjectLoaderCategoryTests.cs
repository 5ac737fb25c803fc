using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// ProjectLoader on a circuit's and a point's <c>category</c> (docs/project-file.md, Circuits; the words are the
/// format's own): each word read, the default by the load (a motor is motor, anything else other), a motor load
/// only motor or hvac, an unknown word with its nearest, each error located at the value.
/// </summary>
public sealed class ProjectLoaderCategoryTests
{
    [Theory]
    [InlineData("lighting", LoadCategory.Lighting)]
    [InlineData("receptacle", LoadCategory.Receptacle)]
    [InlineData("motor", LoadCategory.Motor)]
    [InlineData("hvac", LoadCategory.Hvac)]
    [InlineData("kitchen", LoadCategory.Kitchen)]
    [InlineData("ev_charger", LoadCategory.EvCharger)]
    [InlineData("other", LoadCategory.Other)]
    public void Parse_CategoryWord_IsTheCircuitsCategory(string word, LoadCategory expected)
    {
        var circuit = OnlyCircuit($"{{ id: 1, poles: 1, category: {word}, load: {{ va: 1000 }}, run: {{ length: 20, size: 12 AWG }} }}");

        Assert.Equal(expected, circuit.Category);
    }

    [Theory]
    [InlineData("{ hp: 2, pf: 0.8 }", 3, LoadCategory.Motor)]
    [InlineData("{ fla: 9, pf: 0.8 }", 3, LoadCategory.Motor)]
    [InlineData("{ va: 1000 }", 1, LoadCategory.Other)]
    [InlineData("{ kw: 2 }", 3, LoadCategory.Other)]
    public void Parse_NoCategory_MotorIfTheLoadIsAMotorElseOther(string load, int poles, LoadCategory expected)
    {
        var circuit = OnlyCircuit($"{{ id: 1, poles: {poles}, load: {load}, run: {{ length: 20, size: 12 AWG }} }}");

        Assert.Equal(expected, circuit.Category);
    }

    [Theory]
    [InlineData("motor", LoadCategory.Motor)]
    [InlineData("hvac", LoadCategory.Hvac)]
    public void Parse_MotorLoadAsMotorOrHvac_IsRead(string word, LoadCategory expected)
    {
        var circuit = OnlyCircuit($"{{ id: 1, poles: 3, category: {word}, load: {{ hp: 5, pf: 0.85 }}, run: {{ length: 20, size: 12 AWG }} }}");

        Assert.Equal(expected, circuit.Category);
    }

    [Theory]
    [InlineData("lighting")]
    [InlineData("receptacle")]
    [InlineData("kitchen")]
    [InlineData("ev_charger")]
    [InlineData("other")]
    public void Parse_MotorLoadOfAnotherCategory_IsAnErrorAtTheCategory(string word)
    {
        var text = Project($"{{ id: 1, poles: 3, category: {word}, load: {{ fla: 12, pf: 0.85 }}, run: {{ length: 20, size: 12 AWG }} }}");

        ProjectText.AssertOneError(text, word, $"'category' of circuit 'P/1' is {word}, but its load is a motor (given in 'hp' or 'fla'): a motor's category is motor or hvac");
    }

    [Fact]
    public void Parse_UnknownCategory_NamesTheNearestWord()
    {
        var text = Project("{ id: 1, poles: 1, category: lightning, load: { va: 1000 }, run: { length: 20, size: 12 AWG } }");

        ProjectText.AssertOneError(text, "lightning", "unknown load category 'lightning'; did you mean 'lighting'?");
    }

    [Fact]
    public void Parse_PointCategory_ItsOwnElseTheCircuits()
    {
        var circuit = OnlyCircuit("{ id: 1, poles: 1, category: receptacle, points: [ { at: 5, load: { va: 300 } }, "
            + "{ at: 10, category: lighting, load: { va: 200 } } ], run: { length: 20, size: 12 AWG } }");

        Assert.Equal(LoadCategory.Receptacle, circuit.Category);
        Assert.Equal([LoadCategory.Receptacle, LoadCategory.Lighting], circuit.Points.Select(p => p.Category));
    }

    [Fact]
    public void Parse_PointsWithoutCategory_AreOther()
    {
        var circuit = OnlyCircuit("{ id: 1, poles: 1, points: [ { at: 5, load: { va: 300 } } ], run: { length: 20, size: 12 AWG } }");

        Assert.Equal((LoadCategory.Other, LoadCategory.Other), (circuit.Category, Assert.Single(circuit.Points).Category));
    }

    [Fact]
    public void Parse_UnknownPointCategory_IsAnErrorAtIt()
    {
        var text = Project("{ id: 1, poles: 1, points: [ { at: 5, category: kichen, load: { va: 300 } } ], run: { length: 20, size: 12 AWG } }");

        ProjectText.AssertOneError(text, "kichen", "unknown load category 'kichen'; did you mean 'kitchen'?");
    }

    private static Circuit OnlyCircuit(string circuit) =>
        Assert.Single(ProjectLoader.Parse(Project(circuit), "t.yaml").Equipment[0].Circuits);

    private static string Project(string circuit) =>
        "disttree: 1\nproject: { name: Categories }\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n"
        + $"  - {{ id: P, kind: panelboard, from: SVC, feeder: {{ length: 20, size: 2/0 AWG }}, circuits: [ {circuit} ] }}\n";
}
