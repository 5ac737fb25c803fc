using System.Reflection;
using DistTree.Vocabulary;

namespace DistTree.Tests.Vocabulary;

/// <summary>
/// The one vocabulary of the file format and the outputs: every enum value a table covers has one word (or is
/// declared as written otherwise), no word names two values, and the words are those the format documents
/// (docs/project-file.md, schema/project.schema.json; the format is ours).
/// </summary>
public sealed class WordsTests
{
    public static TheoryData<string> Tables() => [.. TableProperties().Select(p => p.Name)];

    [Theory]
    [MemberData(nameof(Tables))]
    public void Table_EveryEnumValue_HasOneWordOrIsWrittenOtherwise(string table)
    {
        var (values, words, otherwise) = Read(table);

        foreach (var value in values)
        {
            var worded = words.Count(w => Equals(w.Value, value));
            var declared = otherwise.Contains(value);
            Assert.True(worded + (declared ? 1 : 0) == 1, $"Words.{table}: {value} has {worded} words{(declared ? " and is declared as written otherwise" : "")}");
        }
    }

    [Theory]
    [MemberData(nameof(Tables))]
    public void Table_Words_AreUniqueLowerSnakeCase(string table)
    {
        var (_, words, _) = Read(table);

        Assert.Equal(words.Count, words.Select(w => w.Word).Distinct(StringComparer.Ordinal).Count());
        Assert.All(words, w => Assert.Matches("^[a-z][a-z0-9_]*$", w.Word));
    }

    [Fact]
    public void Of_EveryPair_ReadsBack()
    {
        foreach (var (word, value) in Words.Raceway.Pairs)
        {
            Assert.Equal(word, Words.Raceway.Of(value));
            Assert.True(Words.Raceway.TryRead(word, out var read));
            Assert.Equal(value, read);
        }
    }

    [Fact]
    public void TryRead_OtherCase_IsNotAWord()
    {
        Assert.False(Words.Material.TryRead("CU", out _));
        Assert.Equal(-1, Words.Material.IndexOf("copper"));
    }

    [Fact]
    public void Of_ValueWrittenOtherwise_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Words.Temperature.Of(DistTree.Model.TemperatureMode.Fixed));
    }

    [Theory]
    [InlineData("project.schema.json", "units", nameof(Words.Units))]
    [InlineData("project.schema.json", "branch_current", nameof(Words.BranchCurrent))]
    [InlineData("project.schema.json", "transformer_drop", nameof(Words.TransformerDrop))]
    [InlineData("project.schema.json", "method", nameof(Words.Method))]
    [InlineData("project.schema.json", "material", nameof(Words.Material))]
    [InlineData("project.schema.json", "raceway", nameof(Words.Raceway))]
    [InlineData("project.schema.json", "model", nameof(Words.LoadModel))]
    [InlineData("project.schema.json", "kind", nameof(Words.EquipmentKind))]
    [InlineData("project.schema.json", "category", nameof(Words.LoadCategory))]
    [InlineData("results.schema.json", "category", nameof(Words.LoadCategory))]
    [InlineData("results.schema.json", "method", nameof(Words.Method))]
    [InlineData("results.schema.json", "branch_current", nameof(Words.BranchCurrent))]
    [InlineData("results.schema.json", "transformer_drop", nameof(Words.TransformerDrop))]
    [InlineData("results.schema.json", "material", nameof(Words.Material))]
    [InlineData("results.schema.json", "raceway", nameof(Words.Raceway))]
    public void Table_Words_AreTheSchemasEnum(string schema, string key, string table)
    {
        using var document = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", schema)));
        var (_, words, _) = Read(table);

        var listed = FirstEnum(document.RootElement, key, words.Select(w => w.Word).ToArray());

        Assert.Equal(words.Select(w => w.Word).Order(StringComparer.Ordinal), listed.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void RunKindAndFindingKind_AreTheResultsSchemasEnums()
    {
        using var document = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "results.schema.json")));

        Assert.Equal(Words.RunKind.Words, FirstEnum(document.RootElement, "kind", ["feeder"]));
        Assert.Equal(Words.FindingKind.Words, FirstEnum(document.RootElement, "kind", ["feeder_drop"]));
    }

    [Fact]
    public void TemperatureOf_Fixed_IsTheNumber()
    {
        var rules = new DistTree.Model.Rules { Temperature = DistTree.Model.TemperatureMode.Fixed, FixedTemperatureC = 62.5 };

        Assert.Equal("62.5", Words.TemperatureOf(rules));
    }

    [Theory]
    [InlineData(DistTree.Network.RunKind.Feeder, "feeder")]
    [InlineData(DistTree.Network.RunKind.Branch, "branch circuit")]
    public void Noun_EveryRunKind_IsTheTradesName(DistTree.Network.RunKind kind, string expected)
    {
        Assert.Equal(expected, Words.Noun(kind));
    }

    [Fact]
    public void Listed_TwoAndThreeWords_JoinsTheLastWithTheConjunction()
    {
        Assert.Equal("cu or al", Words.Listed(Words.Material, "or"));
        Assert.Equal("pvc, aluminum or steel", Words.Listed(Words.Raceway, "or"));
    }

    [Fact]
    public void MetresPerFoot_IsTheInternationalFoot()
    {
        // The international foot is 0.3048 m exactly (international yard and pound agreement, 1959).
        Assert.Equal(0.3048, UnitFactors.MetresPerFoot);
    }

    // The string members of the first "KEY": { "enum": [...] } in the schema that shares a word with the table.
    private static string[] FirstEnum(System.Text.Json.JsonElement root, string key, IReadOnlyCollection<string> some)
    {
        var pending = new Stack<System.Text.Json.JsonElement>([root]);
        while (pending.Count > 0)
        {
            var element = pending.Pop();
            if (element.ValueKind == System.Text.Json.JsonValueKind.Array)
            {
                foreach (var item in element.EnumerateArray().Reverse())
                {
                    pending.Push(item);
                }

                continue;
            }

            if (element.ValueKind != System.Text.Json.JsonValueKind.Object)
            {
                continue;
            }

            foreach (var property in element.EnumerateObject().Reverse())
            {
                if (property.Name == key && property.Value.ValueKind == System.Text.Json.JsonValueKind.Object
                    && property.Value.TryGetProperty("enum", out var list))
                {
                    var strings = list.EnumerateArray().Where(v => v.ValueKind == System.Text.Json.JsonValueKind.String).Select(v => v.GetString()!).ToArray();
                    if (strings.Any(w => some.Contains(w, StringComparer.Ordinal)))
                    {
                        return strings;
                    }
                }

                pending.Push(property.Value);
            }
        }

        throw new Xunit.Sdk.XunitException($"no '{key}' enum sharing a word with the table");
    }

    private static IEnumerable<PropertyInfo> TableProperties() =>
        typeof(Words).GetProperties(BindingFlags.Public | BindingFlags.Static)
            .Where(p => p.PropertyType.IsGenericType && p.PropertyType.GetGenericTypeDefinition() == typeof(WordTable<>));

    private static (object[] Values, List<(string Word, object Value)> Words, object[] Otherwise) Read(string table)
    {
        var property = typeof(Words).GetProperty(table)!;
        var instance = property.GetValue(null)!;
        var enumType = property.PropertyType.GetGenericArguments()[0];
        var values = Enum.GetValues(enumType).Cast<object>().ToArray();
        var words = ((System.Collections.IEnumerable)property.PropertyType.GetProperty("Pairs")!.GetValue(instance)!)
            .Cast<object>()
            .Select(pair => (Word: (string)pair.GetType().GetField("Item1")!.GetValue(pair)!, Value: pair.GetType().GetField("Item2")!.GetValue(pair)!))
            .ToList();
        var otherwise = ((System.Collections.IEnumerable)property.PropertyType.GetProperty("WrittenOtherwise")!.GetValue(instance)!).Cast<object>().ToArray();
        return (values, words, otherwise);
    }
}
