using System.Globalization;
using DistTree.Diagnostics;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>A finding the solver makes writes its sentence when it is first read; it reads the same as one given its sentence.</summary>
public sealed class FindingTests
{
    [Fact]
    public void Written_ReadsInTheInvariantCulture_WhateverTheCurrentOne()
    {
        var before = CultureInfo.CurrentCulture;
        try
        {
            // A comma decimal separator where the culture is German (common practice in its number formats).
            CultureInfo.CurrentCulture = new CultureInfo("de-DE");
            var dropPercent = 3.456;
            var finding = Finding.Written(FindingKind.BranchDrop, "NEC 210.19(A)(1) Informational Note No. 4", "LP-1/3", dropPercent, 3, $"drop {dropPercent:0.00} %", SourceLocation.None);

            Assert.Equal("drop 3.46 %", finding.Message);
        }
        finally
        {
            CultureInfo.CurrentCulture = before;
        }
    }

    [Fact]
    public void Written_EqualsTheSameFindingGivenItsSentence()
    {
        var limit = 3.0;
        var written = Finding.Written(FindingKind.FeederDrop, "NEC 215.2(A)(1) Informational Note No. 2", "F-1", 3.5, limit, $"over {limit:0.##} %", SourceLocation.None);
        var given = new Finding(FindingKind.FeederDrop, "NEC 215.2(A)(1) Informational Note No. 2", "F-1", 3.5, limit, "over 3 %", SourceLocation.None);

        Assert.Equal(given, written);
        Assert.Equal(given.GetHashCode(), written.GetHashCode());
    }
}
