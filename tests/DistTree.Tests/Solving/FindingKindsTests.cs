using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>The registry of finding kinds: every kind described once, with what every output needs.</summary>
public sealed class FindingKindsTests
{
    [Fact]
    public void All_EveryKind_InEnumOrder()
    {
        Assert.Equal(Enum.GetValues<FindingKind>(), FindingKinds.All.Select(k => k.Kind));
    }

    [Fact]
    public void All_EveryField_Written()
    {
        Assert.All(FindingKinds.All, k =>
        {
            Assert.False(string.IsNullOrWhiteSpace(k.Title));
            Assert.False(string.IsNullOrWhiteSpace(k.Check));
            Assert.False(string.IsNullOrWhiteSpace(k.Value));
            Assert.False(string.IsNullOrWhiteSpace(k.Limit));
            Assert.EndsWith(".", k.Description, StringComparison.Ordinal);
            Assert.Contains(k.Unit, new[] { "%", "A", "kA", "kVA", "mm2" });
        });
    }

    [Fact]
    public void All_CodesAndSarifNames_AreUniqueAndAgree()
    {
        Assert.Equal(FindingKinds.All.Count, FindingKinds.All.Select(k => k.Code).Distinct(StringComparer.Ordinal).Count());
        Assert.Equal(FindingKinds.All.Count, FindingKinds.All.Select(k => k.SarifName).Distinct(StringComparer.Ordinal).Count());

        // SARIF 2.1.0 (OASIS, 3.49.7): a rule's name is an identifier; ours is the code in Pascal case.
        Assert.All(FindingKinds.All, k => Assert.Equal(string.Concat(k.Code.Split('_').Select(p => char.ToUpperInvariant(p[0]) + p[1..])), k.SarifName));
    }

    [Fact]
    public void Code_OfAFinding_IsItsKindsCode()
    {
        var finding = new Finding(FindingKind.MotorStart, "starting voltage (common practice; no NEC clause)", "P1/3", 16, 15, "motor P1/3 dips", DistTree.Diagnostics.SourceLocation.None);

        Assert.Equal("motor_start", finding.Code);
        Assert.Equal(FindingKinds.Of(FindingKind.MotorStart).Code, finding.Code);
    }

    [Fact]
    public void Sarif_Rules_AreTheRegistry()
    {
        Assert.Equal(FindingKinds.All, DistTree.Reports.SarifResults.Rules);
    }
}
