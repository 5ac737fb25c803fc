using DistTree.Reports.Schedules;

namespace DistTree.Tests.Reports.Schedules;

/// <summary>
/// The schedule's layout, against the usual panelboard numbering (odd spaces down the left, even down the right, row by
/// row; a p-pole circuit numbered n takes n, n + 2 … on its side, as docs/project-file.md states for the phases).
/// </summary>
public sealed class PanelSchedulesTests
{
    // Invented circuits: ids out of order, a 3-pole, a 2-pole, one far down the panel and one without a number.
    internal static readonly string[] Circuits =
    [
        "{ id: '10', name: 'Ten, \"quoted\"', poles: 1, ocpd: 20, load: { va: 1000 }, run: { length: 10, size: 12 AWG } }",
        "{ id: '2', name: Two, poles: 1, ocpd: 20, load: { va: 500 }, run: { length: 10, size: 12 AWG } }",
        "{ id: '1', name: Three-pole, poles: 3, ocpd: 30, load: { va: 9000 }, run: { length: 10, size: 10 AWG } }",
        "{ id: '11', name: Two-pole, poles: 2, ocpd: 20, load: { va: 2000 }, run: { length: 10, size: 12 AWG } }",
        "{ id: '31', name: Far, poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 10, size: 12 AWG } }",
        "{ id: 'EV', name: Charger, poles: 2, ocpd: 40, load: { va: 7000 }, run: { length: 10, size: 8 AWG } }",
    ];

    internal static PanelSchedule Small() => Assert.Single(PanelSchedules.Of(ReportFixtures.SolveText(ReportFixtures.OnePanel("Schedule", Circuits))));

    [Fact]
    public void Of_Circuits_InNaturalOrder()
    {
        Assert.Equal(["1", "2", "10", "11", "31", "EV"], Small().Circuits.Select(c => c.Id));
    }

    [Fact]
    public void Of_Rows_OddSpacesLeftEvenRight()
    {
        foreach (var row in Small().Rows)
        {
            Assert.Equal(1, row.LeftSpace % 2);
            Assert.Equal(row.LeftSpace, row.Left.Space);
            Assert.Equal(row.LeftSpace + 1, row.Right.Space);
        }
    }

    [Fact]
    public void Of_MultiPoleCircuits_ShowOnTheirFirstSpaceAndTakeTheNextOnTheirSide()
    {
        var rows = Small().Rows.Where(r => r.GapEndSpace is null).ToDictionary(r => r.LeftSpace);

        Assert.Equal("1", rows[1].Left.Circuit!.Id);
        Assert.Equal("1", rows[3].Left.TakenBy!.Id);
        Assert.Equal("1", rows[5].Left.TakenBy!.Id);
        Assert.Null(rows[3].Left.Circuit);
        Assert.Equal("2", rows[1].Right.Circuit!.Id);
        Assert.True(rows[7].IsEmpty);
        Assert.Equal("10", rows[9].Right.Circuit!.Id);
        Assert.Equal("11", rows[11].Left.Circuit!.Id);
        Assert.Equal("11", rows[13].Left.TakenBy!.Id);
        Assert.Equal("31", rows[31].Left.Circuit!.Id);
        Assert.Equal([1, 3, 5], Small().Circuits[0].Spaces);
    }

    [Fact]
    public void Of_ALongRunOfEmptyRows_IsOneGapRow()
    {
        var rows = Small().Rows;
        // Rows 1 to 7 (spaces 1-14), then spaces 15-30 as one gap, then row 16 (spaces 31-32).
        Assert.Equal([1, 3, 5, 7, 9, 11, 13, 15, 31], rows.Select(r => r.LeftSpace));
        Assert.Equal(30, rows[^2].GapEndSpace);
        Assert.All(rows.Where(r => r.GapEndSpace is null && r.LeftSpace != 7), r => Assert.False(r.IsEmpty));
    }

    [Fact]
    public void Of_AnIdThatIsNoWholeNumber_FollowsTheRows()
    {
        var schedule = Small();
        Assert.Equal(["EV"], schedule.Unnumbered.Select(c => c.Id));
        Assert.DoesNotContain(schedule.Rows, r => r.Left.Circuit?.Id == "EV" || r.Right.Circuit?.Id == "EV");
    }

    [Fact]
    public void Of_Lines_AreTheSolversAssignment()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Schedule", Circuits));
        foreach (var c in PanelSchedules.Of(s)[0].Circuits)
        {
            Assert.Equal(s.IncomingRun(s.EndPointById("P/" + c.Id)!.Value.NodeIndex)!.Value.Lines, c.Lines);
        }

        // Under the usual numbering (docs/project-file.md): 11 is on row 6, line C, and a 2-pole takes the next line, A.
        Assert.Equal("CA", Small().Circuits.Single(c => c.Id == "11").Lines);
    }

    [Theory]
    [InlineData("7", 1, new[] { 7 })]
    [InlineData("8", 3, new[] { 8, 10, 12 })]
    [InlineData("007", 2, new[] { 7, 9 })]
    [InlineData("L1", 1, new int[0])]
    [InlineData("-1", 1, new int[0])]
    [InlineData("0", 1, new int[0])]
    [InlineData("1000001", 1, new int[0])]
    public void SpacesOf_Id_TakesItsNumberAndOnePerFurtherPole(string id, int poles, int[] expected)
    {
        Assert.Equal(expected, PanelSchedules.SpacesOf(id, poles));
    }

    [Fact]
    public void Of_TwoIdsNamingOneSpace_TheFirstInOrderTakesItAndTheOtherFollowsTheRows()
    {
        var s = ReportFixtures.SolveText(ReportFixtures.OnePanel("Clash",
        [
            "{ id: '1', name: One, poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 10, size: 12 AWG } }",
            "{ id: '01', name: Zero-one, poles: 1, ocpd: 20, load: { va: 100 }, run: { length: 10, size: 12 AWG } }",
        ]));
        var schedule = PanelSchedules.Of(s)[0];
        Assert.Equal("01", schedule.Rows[0].Left.Circuit!.Id);
        Assert.Equal(["1"], schedule.Unnumbered.Select(c => c.Id));
    }
}
