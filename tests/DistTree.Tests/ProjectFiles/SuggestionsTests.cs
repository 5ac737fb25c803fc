using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>Suggestions: the "did you mean" hints of unknown keys and words.</summary>
public sealed class SuggestionsTests
{
    // Optimal string alignment distance: a swap of two neighbours counts as one edit.
    [Theory]
    [InlineData("length", "length", 0)]
    [InlineData("lenght", "length", 1)]
    [InlineData("lengt", "length", 1)]
    [InlineData("kitten", "sitting", 3)]
    [InlineData("", "abc", 3)]
    public void Distance_KnownPairs_CountsEdits(string a, string b, int expected)
    {
        Assert.Equal(expected, Suggestions.Distance(a, b));
    }

    [Theory]
    [InlineData("lenght", "length")]
    [InlineData("Size", "size")]
    [InlineData("panel", "panelboard")]
    [InlineData("208/120", "208Y/120")]
    [InlineData("cu", null)]
    [InlineData("copper", null)]
    [InlineData("zzzzzz", null)]
    public void Closest_Word_SuggestsOnlyLikelyTypos(string word, string? expected)
    {
        string[] candidates = ["length", "size", "panelboard", "208Y/120", "al", "pvc"];

        Assert.Equal(expected, Suggestions.Closest(word, candidates));
    }

    [Fact]
    public void Hint_NoCloseWord_ListsTheChoices()
    {
        Assert.Equal("; expected 'cu' or 'al'", Suggestions.Hint("copper", ["cu", "al"]));
        Assert.Equal("; expected one of 'a1', 'b2', 'c3'", Suggestions.Hint("zzzz", ["a1", "b2", "c3"]));
        Assert.Equal("; did you mean 'rules'?", Suggestions.Hint("rule", ["rules", "service"]));
    }
}
