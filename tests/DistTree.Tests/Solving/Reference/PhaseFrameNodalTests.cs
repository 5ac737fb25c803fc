using System.Globalization;
using System.Text;

namespace DistTree.Tests.Solving.Reference;

/// <summary>
/// Issue 17: the solver's end-point figures against an independent nodal solution of the same circuit
/// (<see cref="ProjectCircuit"/> on <see cref="NodalCircuit"/>, MathNet.Numerics' LU), on small invented projects
/// covering every connection kind (<see cref="PhaseFrameCases"/>). The load flow must equal the reference within
/// 1e-4 percentage points; the percent sum, its linearisation, within 3 % of the reference or 0.01 points on lightly
/// loaded trees. These fail until the phase-frame solver of issue 17 lands (the solver before it is balanced).
/// </summary>
public sealed class PhaseFrameNodalTests
{
    private const double LoadFlowTolerancePoints = 1e-4;
    private const double PercentSumRelative = 0.03;
    private const double PercentSumFloorPoints = 0.01;

    public static TheoryData<string> Cases => [.. PhaseFrameCases.All.Keys];

    // A heavily loaded tree is left out of the percent sum's comparison: a constant-power load there draws visibly
    // more than at nominal voltage (about the drop itself, near 10 %), so its linearisation is not expected within 3 %.
    public static TheoryData<string> LightCases => [.. PhaseFrameCases.All.Where(c => c.Value.Light).Select(c => c.Key)];

    [Theory]
    [MemberData(nameof(Cases))]
    public void LoadFlow_Case_EqualsNodalReference(string name)
    {
        var (analysis, reference) = Solve(name);
        var failures = new StringBuilder();
        foreach (var end in analysis.Solution.EndPoints)
        {
            var expected = reference[end.Id];
            if (end.LoadFlowTotalDropPercent is not { } actual || Math.Abs(actual - expected) > LoadFlowTolerancePoints)
            {
                failures.AppendLine(CultureInfo.InvariantCulture, $"{end.Id}: load flow {Text(end.LoadFlowTotalDropPercent)} %, reference {expected:F6} %");
            }
        }

        Assert.True(failures.Length == 0, $"{name} (issue 17):\n{failures}");
    }

    [Theory]
    [MemberData(nameof(LightCases))]
    public void PercentSum_LightlyLoadedCase_WithinThreePercentOfNodalReference(string name)
    {
        var (analysis, reference) = Solve(name);
        var failures = new StringBuilder();
        foreach (var end in analysis.Solution.EndPoints)
        {
            var expected = reference[end.Id];
            var actual = end.PercentSumTotalDropPercent;
            if (Math.Abs(actual - expected) > Math.Max(PercentSumRelative * Math.Abs(expected), PercentSumFloorPoints))
            {
                failures.AppendLine(CultureInfo.InvariantCulture, $"{end.Id}: percent sum {actual:F6} %, reference {expected:F6} %");
            }
        }

        Assert.True(failures.Length == 0, $"{name} (issue 17):\n{failures}");
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Reference_Case_IsLightOnlyWhereItsDropsAreSmall(string name)
    {
        // Keeps the table honest: in a case marked light every end point's drop from its no-load voltage (the taps'
        // offset, 1 − Π 1/(1 + tap/100) of the transformers on its path, taken off) is at most 2.5 %, so a
        // constant-power load's current is within about 2.5 % of its nominal one; a heavy case has one above 5 %.
        // Every end point of the project is in the reference.
        var (analysis, reference) = Solve(name);
        Assert.Equal(analysis.Solution.EndPoints.Select(e => e.Id).Order(StringComparer.Ordinal), reference.Keys.Order(StringComparer.Ordinal));
        var equipment = analysis.Project.Equipment.ToDictionary(e => e.Id, StringComparer.Ordinal);
        var worst = analysis.Solution.EndPoints.Max(end =>
        {
            var noLoad = end.Path.Aggregate(1.0, (v, id) => equipment.TryGetValue(id, out var e) && e.Transformer is { } t ? v / (1 + (t.TapPercent / 100)) : v);
            return reference[end.Id] - ((1 - noLoad) * 100);
        });
        if (PhaseFrameCases.All[name].Light)
        {
            Assert.InRange(worst, 0.0, 2.5);
        }
        else
        {
            Assert.True(worst > 5, $"worst drop {worst} %");
        }
    }

    private static (AnalysisResult Analysis, IReadOnlyDictionary<string, double> Reference) Solve(string name)
    {
        var c = PhaseFrameCases.All[name];
        var analysis = ReferenceHarness.Analyse(c.Yaml, c.Edit);
        return (analysis, ProjectCircuit.Of(analysis).EndPointDropsPercent());
    }

    private static string Text(double? value) => value is { } v ? v.ToString("F6", CultureInfo.InvariantCulture) : "none";
}
