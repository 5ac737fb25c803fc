using System.Text.Json.Nodes;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// ValueRanges: the schema and docs/project-file.md state the table's ranges; a value just outside a range is a
/// located error naming it; a project at the edges of the ranges loads and solves to finite figures.
/// </summary>
public sealed class ValueRangesTests
{
    private static readonly JsonNode Schema = JsonNode.Parse(File.ReadAllText(Path.Combine(TestPaths.RepoRoot, "schema", "project.schema.json")))!;

    // The sections the schema holds under its top-level properties; the others are under $defs.
    private static readonly string[] TopSections = ["rules", "sizing", "service"];

    public static TheoryData<string, string> RangedKeys()
    {
        var data = new TheoryData<string, string>();
        foreach (var (section, key, _) in ValueRanges.All)
        {
            data.Add(section, key);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(RangedKeys))]
    public void Schema_RangedKey_StatesTheTablesBounds(string section, string key)
    {
        var range = RangeOf(section, key);
        var node = NumberSchema(KeySchema(section, key));

        Assert.Equal(range.Whole ? "integer" : "number", (string?)node["type"]);
        Assert.Equal(range.MinExclusive ? null : range.Min, (double?)node["minimum"]);
        Assert.Equal(range.MinExclusive ? range.Min : null, (double?)node["exclusiveMinimum"]);

        // A bare length may be in feet: the schema states the bound in feet, the larger number (ValueRanges.MaxLengthFt).
        var max = key is "length" or "at" ? ValueRanges.MaxLengthFt : range.Max;
        Assert.Equal(range.MaxExclusive ? null : max, (double?)node["maximum"]);
        Assert.Equal(range.MaxExclusive ? max : null, (double?)node["exclusiveMaximum"]);
    }

    [Fact]
    public void Schema_EveryNumericKey_HasARange()
    {
        var numeric = new List<string>();
        foreach (var section in TopSections.Concat(["project", "defaults"]))
        {
            numeric.AddRange(NumericKeys(section, Schema["properties"]![section]!["properties"]!));
        }

        foreach (var section in new[] { "equipment", "circuit", "run", "load", "point" })
        {
            numeric.AddRange(NumericKeys(section, Schema["$defs"]![section]!["properties"]!));
        }

        numeric.Add("sizing.prices");
        var ranged = ValueRanges.All.Select(r => $"{r.Section}.{r.Key}").ToArray();
        Assert.Equal(numeric.Order(StringComparer.Ordinal), ranged.Order(StringComparer.Ordinal));
    }

    [Theory]
    [MemberData(nameof(RangedKeys))]
    public void Docs_RangedKey_StatesTheRangeInItsRow(string section, string key)
    {
        var range = RangeOf(section, key);
        var rows = File.ReadAllLines(Path.Combine(TestPaths.RepoRoot, "docs", "project-file.md"))
            .Where(l => l.StartsWith('|') && l.Contains($"`{key}`", StringComparison.Ordinal));

        Assert.Contains(rows, row => row.Contains(range.ToString(), StringComparison.Ordinal));
    }

    [Fact]
    public void EdgeProject_EveryRangedKey_HasAMarker()
    {
        var markers = ValueRanges.All.Select(r => EdgeProject.Marker(r.Section, r.Key)).Order(StringComparer.Ordinal);
        Assert.Equal(markers, EdgeProject.Markers.Order(StringComparer.Ordinal));
    }

    [Theory]
    [MemberData(nameof(RangedKeys))]
    public void Parse_JustOutsideTheRange_IsALocatedErrorNamingIt(string section, string key)
    {
        var range = RangeOf(section, key);
        var marker = EdgeProject.Marker(section, key);
        foreach (var outside in Outside(range))
        {
            var values = new Dictionary<string, double> { [marker] = outside };
            var text = EdgeProject.Text(values);
            var (line, column) = EdgeProject.Where(values, marker);

            var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));

            var named = key is "length" or "at" ? $"{range} (328,084 ft)" : range.ToString();
            var diagnostic = Assert.Single(error.Diagnostics, d => d.Severity == Severity.Error);
            Assert.Equal((line, column), (diagnostic.Location.Line, diagnostic.Location.Column));
            Assert.EndsWith($" must be {named}; found {EdgeProject.Number(outside)}", diagnostic.Message, StringComparison.Ordinal);
        }
    }

    // Every figure a solve gives is a finite number with each key at either end of its range (the edge itself where
    // it is allowed, else the nearest number inside), the others as in the plain project; with the conductor
    // temperature as stated and as estimated from the ambient and the loading.
    [Theory]
    [MemberData(nameof(RangedKeys))]
    public void Solve_KeyAtEachEdge_GivesFiniteFigures(string section, string key)
    {
        var marker = EdgeProject.Marker(section, key);
        foreach (var edge in Inside(section, key))
        {
            foreach (var text in Both(EdgeProject.Text(new Dictionary<string, double> { [marker] = edge })))
            {
                var solution = Analysis.Parse(text, "t.yaml").Solution;

                Assert.True(EdgeProject.NotFinite(solution) is [], $"{marker} = {edge}: {string.Join("; ", EdgeProject.NotFinite(solution))}");
            }
        }
    }

    // All keys at their lower edges at once (where 0 is allowed, the smallest number above it too), then all at
    // their upper edges.
    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(-1)]
    public void Solve_EveryKeyAtOneEnd_GivesFiniteFigures(int end)
    {
        var values = ValueRanges.All.ToDictionary(r => EdgeProject.Marker(r.Section, r.Key), r => Inside(r.Section, r.Key)[end < 0 ? ^1 : end], StringComparer.Ordinal);

        foreach (var text in Both(EdgeProject.Text(values)))
        {
            var solution = Analysis.Parse(text, "t.yaml").Solution;

            Assert.True(EdgeProject.NotFinite(solution) is [], string.Join("; ", EdgeProject.NotFinite(solution)));
        }
    }

    // The check above can fail: past the loader, an ambient of -300 °C makes copper's resistance negative (its
    // temperature coefficient, 0.00393 per K from 20 °C, IEC 60028, reaches zero at about -234.5 °C) and the totals NaN.
    [Fact]
    public void NotFinite_AmbientBelowTheRange_FindsTheFigures()
    {
        var project = ProjectLoader.Parse(EdgeProject.Text(new Dictionary<string, double>()), "t.yaml");
        var cold = project with { Rules = project.Rules with { AmbientC = -300, Temperature = DistTree.Model.TemperatureMode.Estimated } };

        Assert.NotEmpty(EdgeProject.NotFinite(Analysis.Run(cold).Solution));
    }

    [Theory]
    [InlineData(-300)]
    [InlineData(91)]
    public void Parse_AmbientOutOfRange_NamesTheRange(double ambient)
    {
        var text = ProjectText.Minimal(extraTop: $"rules: {{ ambient_c: {EdgeProject.Number(ambient)} }}\n");

        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));

        Assert.Equal($"t.yaml:5:21: error: 'ambient_c' must be between -60 and 90 °C; found {EdgeProject.Number(ambient)}", Assert.Single(error.Diagnostics).ToString());
    }

    [Theory]
    [InlineData("{ length: 100001 m, size: 2 AWG }", "100001 m")]
    [InlineData("{ length: 328085 ft, size: 2 AWG }", "328085 ft")]
    [InlineData("{ length: 0, size: 2 AWG }", "0")]
    public void Parse_LengthOutOfRange_NamesTheRangeInBothUnits(string feeder, string shown)
    {
        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(ProjectText.Minimal(feeder: feeder), "t.yaml"));

        Assert.EndsWith($"'length' of the feeder of 'LP1' must be greater than 0 and at most 100,000 m (328,084 ft); found {shown}", Assert.Single(error.Diagnostics).Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("metric", "{ length: 100000, size: 2 AWG }")]
    [InlineData("imperial", "{ length: 328084, size: 2 AWG }")]
    [InlineData("metric", "{ length: 328084 ft, size: 2 AWG }")]
    public void Parse_LengthAtTheBound_Loads(string units, string feeder)
    {
        Assert.NotNull(ProjectLoader.Parse(ProjectText.Minimal(units: units, feeder: feeder), "t.yaml"));
    }

    [Fact]
    public void Parse_WholeRangeWithAFraction_SaysWhole()
    {
        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(ProjectText.Minimal(feeder: "{ length: 20, size: 2 AWG, sets: 1.5 }"), "t.yaml"));

        Assert.EndsWith("'sets' of the feeder of 'LP1' must be a whole number; found 1.5", Assert.Single(error.Diagnostics).Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0, 0, 1, 0, "between 0 and 1")]
    [InlineData(0, 1, 100, 1, "greater than 0 and less than 100")]
    [InlineData(0, 1, 6000, 0, "greater than 0 and at most 6,000")]
    [InlineData(1, 0, 20, 1, "at least 1 and less than 20")]
    public void ToString_EachKindOfEnd_ReadsAsWords(double min, int minOpen, double max, int maxOpen, string expected)
    {
        Assert.Equal(expected, new NumberRange(min, minOpen == 1, max, maxOpen == 1, "").ToString());
    }

    // The project as given (a stated conductor temperature) and with the temperature estimated from the loading.
    private static string[] Both(string text) =>
        [text, System.Text.RegularExpressions.Regex.Replace(text, "conductor_temperature: [^,]+,", "conductor_temperature: estimated,")];

    private static NumberRange RangeOf(string section, string key) =>
        ValueRanges.All.Single(r => r.Section == section && r.Key == key).Range;

    // The nearest numbers outside the range on each side.
    private static double[] Outside(NumberRange range) => range.Whole
        ? [range.Min - 1, range.Max + 1]
        : [range.MinExclusive ? range.Min : Math.BitDecrement(range.Min), range.MaxExclusive ? range.Max : Math.BitIncrement(range.Max)];

    // The two ends of the range, or the nearest numbers inside an open end, and last where 0 is allowed the smallest
    // number above it (a load of 5e-324 VA drops next to nothing: its reach must stay finite). A motor's ends are the
    // tables' smallest and largest three-phase ratings (NEC Table 430.250 lists 1/2 to 200 hp), the ratings the
    // circuit can take.
    private static double[] Inside(string section, string key)
    {
        if (section == "load" && key == "hp")
        {
            return [0.5, 200, 0.5];
        }

        if (section == "equipment" && key == "tap_range_percent")
        {
            return [0, 5, 2.5]; // in 2.5 % steps (docs/project-file.md)
        }

        var range = RangeOf(section, key);
        var low = range.MinExclusive ? Math.BitIncrement(range.Min) : range.Min;
        var high = range.MaxExclusive ? Math.BitDecrement(range.Max) : range.Max;
        return range is { Min: 0, MinExclusive: false, Whole: false } ? [low, high, double.Epsilon] : [low, high, low];
    }

    private static JsonNode KeySchema(string section, string key)
    {
        if (section == "sizing" && key == "prices")
        {
            return Schema["properties"]!["sizing"]!["properties"]!["prices"]!["additionalProperties"]!;
        }

        var sections = TopSections.Contains(section) ? Schema["properties"]! : Schema["$defs"]!;
        return sections[section]!["properties"]![key]!;
    }

    // The schema of the number itself: through a $ref, and the number's branch of a oneOf or anyOf.
    private static JsonNode NumberSchema(JsonNode node)
    {
        if ((string?)node["$ref"] is { } reference)
        {
            return NumberSchema(Schema["$defs"]![reference["#/$defs/".Length..]]!);
        }

        var branches = node["oneOf"] ?? node["anyOf"];
        return branches is null ? node : branches.AsArray().Select(b => NumberSchema(b!)).Single(IsNumber);
    }

    // A schema of a number: its type is "number" or "integer" (text, which may be written as a number, is not).
    private static bool IsNumber(JsonNode node) =>
        node["type"] is JsonValue type && (string?)type is "number" or "integer";

    private static IEnumerable<string> NumericKeys(string section, JsonNode properties)
    {
        foreach (var (key, value) in properties.AsObject())
        {
            var node = value!;
            if ((string?)node["$ref"] is "#/$defs/id" or "#/$defs/text" or "#/$defs/system" or "#/$defs/size")
            {
                // Text: an id or a system may be written as a plain number (id: 1, system: 120); a size is text with its unit.
                continue;
            }

            var resolved = (string?)node["$ref"] is { } r ? Schema["$defs"]![r["#/$defs/".Length..]]! : node;
            var branches = resolved["oneOf"] ?? resolved["anyOf"];
            var all = branches is null ? [resolved] : branches.AsArray().Select(b => (string?)b!["$ref"] is { } br ? Schema["$defs"]![br["#/$defs/".Length..]]! : b!).ToArray();
            if (all.Any(IsNumber))
            {
                yield return $"{section}.{key}";
            }
        }
    }
}
