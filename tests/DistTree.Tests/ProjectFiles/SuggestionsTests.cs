using DistTree.ProjectFiles;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace DistTree.Tests.ProjectFiles;

/// <summary>Suggestions: the "did you mean" hints of unknown keys and words.</summary>
public sealed class SuggestionsTests
{
    // Optimal string alignment distance: a swap of two neighbours counts as one edit (the textbook examples:
    // kitten/sitting 3 edits).
    [Theory]
    [InlineData("length", "length", 0)]
    [InlineData("lenght", "length", 1)]
    [InlineData("lengt", "length", 1)]
    [InlineData("kitten", "sitting", 3)]
    [InlineData("", "abc", 3)]
    [InlineData("LENGTH", "length", 0)]
    public void Distance_KnownPairs_CountsEdits(string a, string b, int expected)
    {
        Assert.Equal(expected, Suggestions.Distance(a, b, 10));
    }

    [Theory]
    [InlineData("kitten", "sitting", 2)]
    [InlineData("abcdef", "badcfe", 2)]
    [InlineData("", "abc", 1)]
    public void Distance_FartherThanTheMost_IsOneMore(string a, string b, int max)
    {
        Assert.Equal(max + 1, Suggestions.Distance(a, b, max));
    }

    // The banded distance against the whole table (Wagner–Fischer with the adjacent-swap step), on words over a
    // small alphabet so that near pairs are common.
    [Property(MaxTest = 2000)]
    public Property Distance_Banded_EqualsTheWholeTableCappedAtMaxPlusOne(byte[] a, byte[] b, byte max)
    {
        var x = new string([.. a.Take(12).Select(c => (char)('a' + (c % 3)))]);
        var y = new string([.. b.Take(12).Select(c => (char)('a' + (c % 3)))]);
        var m = max % 4;
        return (Suggestions.Distance(x, y, m) == Math.Min(WholeTable(x, y), m + 1)).ToProperty();
    }

    // Two ids of 20,000 characters that differ at the end took the whole table 8 s and 1.6 GB; the band takes
    // a few arrays of the word's length.
    [Fact]
    public void Distance_LongNearWords_CostsLinearWork()
    {
        var word = new string('x', 20_000) + "a";
        var candidate = new string('x', 20_000) + "b";
        var before = GC.GetAllocatedBytesForCurrentThread();

        Assert.Equal(1, Suggestions.Distance(word, candidate, Suggestions.MaxEdits));

        Assert.InRange(GC.GetAllocatedBytesForCurrentThread() - before, 0, 1_000_000);
    }

    [Fact]
    public void Closest_WordLongerThanAnId_HasNoHint()
    {
        var id = new string('p', ProjectLimits.MaxIdLength + 1);

        Assert.Null(Suggestions.Closest(id, [id + "x"]));
    }

    [Fact]
    public void Closest_BudgetSpent_HasNoHint()
    {
        long budget = 0;
        Assert.Null(Suggestions.Closest("lenght", ["length"], ref budget));

        budget = 1_000;
        Assert.Equal("length", Suggestions.Closest("lenght", ["length"], ref budget));
        Assert.True(budget < 1_000);
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
    public void Closest_TwoCandidatesStartWithTheWord_HasNoHint()
    {
        Assert.Null(Suggestions.Closest("panel", ["panelboard", "panelized"]));
    }

    [Fact]
    public void Hint_NoCloseWord_ListsTheChoices()
    {
        Assert.Equal("; expected 'cu' or 'al'", Suggestions.Hint("copper", ["cu", "al"]));
        Assert.Equal("; expected one of 'a1', 'b2', 'c3'", Suggestions.Hint("zzzz", ["a1", "b2", "c3"]));
        Assert.Equal("; did you mean 'rules'?", Suggestions.Hint("rule", ["rules", "service"]));
    }

    private static int WholeTable(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (var i = 0; i <= a.Length; i++)
        {
            d[i, 0] = i;
        }

        for (var j = 0; j <= b.Length; j++)
        {
            d[0, j] = j;
        }

        for (var i = 1; i <= a.Length; i++)
        {
            for (var j = 1; j <= b.Length; j++)
            {
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                {
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
                }
            }
        }

        return d[a.Length, b.Length];
    }
}
