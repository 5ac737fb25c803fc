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

    [Fact]
    public void FeedCycle_ThreeMembers_FollowsFromBackToTheFirst()
    {
        Assert.Equal(
            "feed cycle: 'P1' is fed from 'P2', which is fed from 'P3', which is fed from 'P1'; the service reaches none of them",
            ProjectMessages.FeedCycle("P1", ["P2", "P3", "P1"]));
    }

    [Fact]
    public void FeedCycle_ElevenMembers_NamesEveryOne()
    {
        var rest = Enumerable.Range(2, 10).Select(i => $"P{i}").Append("P1").ToArray();

        var message = ProjectMessages.FeedCycle("P1", rest);

        Assert.EndsWith("which is fed from 'P11', which is fed from 'P1'; the service reaches none of them", message, StringComparison.Ordinal);
    }

    [Fact]
    public void FeedCycle_TwelveMembers_NamesTenAndCountsTheRest()
    {
        var rest = Enumerable.Range(2, 11).Select(i => $"P{i}").Append("P1").ToArray();

        var message = ProjectMessages.FeedCycle("P1", rest);

        Assert.EndsWith("which is fed from 'P11', and so on through 1 more back to 'P1' (12 in all); the service reaches none of them", message, StringComparison.Ordinal);
    }

    [Fact]
    public void UndefinedSource_WithNearId_AsksDidYouMean()
    {
        Assert.Equal("'LP2' is fed from 'MSB9', which is not defined; did you mean 'MSB'?", ProjectMessages.UndefinedSource("LP2", "MSB9", "MSB"));
        Assert.Equal("'LP2' is fed from 'X', which is not defined", ProjectMessages.UndefinedSource("LP2", "X", null));
    }

    [Theory]
    [InlineData(1, "480D", "circuit 'LP1/4' has 1 pole, which needs a neutral; 'LP1' is on 480D, which has none")]
    [InlineData(3, "120/240", "circuit 'LP1/4' has 3 poles, which need a three-phase system; 'LP1' is on 120/240, which is single-phase")]
    public void PolesNotGiven_ByPoles_SaysWhatTheSystemLacks(int poles, string system, string expected)
    {
        Assert.Equal(expected, ProjectMessages.PolesNotGiven("circuit 'LP1/4'", poles, "LP1", DistTree.Model.ElectricalSystem.Find(system)!));
    }
}
