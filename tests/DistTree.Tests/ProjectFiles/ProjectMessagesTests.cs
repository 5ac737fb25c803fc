using DistTree.ProjectFiles;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// ProjectMessages: the factories that build their text from a list (the vocabulary, the limits) give the texts the
/// bad-file corpus pins; the rest are checked there, message for message.
/// </summary>
public sealed class ProjectMessagesTests
{
    [Fact]
    public void NoQuantity_AnyLoad_ListsEveryQuantityWordInOrder()
    {
        Assert.Equal(
            "the load of circuit 'LP1/3' states no quantity; give exactly one of 'va', 'kva', 'kw', 'amps', 'hp' or 'fla'",
            ProjectMessages.NoQuantity(Subject.Circuit("LP1", "3").Of("the load of ")));
    }

    [Fact]
    public void TwoQuantities_VaAndKw_NamesBoth()
    {
        Assert.Equal(
            "the load gives both 'va' and 'kw'; give exactly one of 'va', 'kva', 'kw', 'amps', 'hp' or 'fla'",
            ProjectMessages.TwoQuantities("the load", "va", "kw"));
    }

    [Theory]
    [InlineData("estimatd", "estimated", "unknown conductor_temperature 'estimatd'; did you mean 'estimated'? (expected 'estimated', 'rated' or a number in °C)")]
    [InlineData("hot", null, "unknown conductor_temperature 'hot' (expected 'estimated', 'rated' or a number in °C)")]
    public void UnknownTemperature_WithOrWithoutNearWord_ListsTheWords(string text, string? near, string expected)
    {
        Assert.Equal(expected, ProjectMessages.UnknownTemperature(text, near));
    }

    [Fact]
    public void MotorOnlyKey_AnyKey_NamesTheMotorQuantities()
    {
        Assert.Equal("'code_letter' in the load applies to motors only (loads given as 'hp' or 'fla')", ProjectMessages.MotorOnlyKey("code_letter", "the load"));
    }

    [Fact]
    public void KindHint_EquipmentKinds_ListsEveryKind()
    {
        Assert.Equal(" (switchboard, panelboard, transformer or splitter)", ProjectMessages.KeyHints.Kind);
    }

    [Theory]
    [InlineData("", "the YAML cannot be read here")]
    [InlineData("While scanning a plain scalar, found a tab", "invalid YAML: while scanning a plain scalar, found a tab")]
    public void InvalidYaml_Detail_LowerCasedAfterThePrefix(string detail, string expected)
    {
        Assert.Equal(expected, ProjectMessages.InvalidYaml(detail));
    }

    [Fact]
    public void NotOneOf_ThreeRatings_JoinsTheLastWithOr()
    {
        Assert.Equal("'insulation_c' must be 60, 75 or 90; found 80", ProjectMessages.NotOneOf("'insulation_c'", [60, 75, 90], 80));
    }

    [Fact]
    public void More_AboveTheLimit_CountsTheRest()
    {
        Assert.Equal(
            "1,050 more errors from here on not shown (the first 200 of 1,250 are)",
            ProjectMessages.More(ProjectLimits.MaxDiagnostics + 1050, "errors"));
    }

    [Fact]
    public void NotAMapping_Sequence_DescribesWhatWasFound()
    {
        var found = new SourceSequence("a.yaml", 1, 1);
        Assert.Equal("'rules' must be a mapping of keys; found a sequence", ProjectMessages.NotAMapping("'rules'", found));
    }
}
