using System.Globalization;
using DistTree.Comparing;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>The codes and short phrases that comparison outputs share.</summary>
public static class ComparisonText
{
    /// <summary><c>added</c>, <c>removed</c> or <c>changed</c>.</summary>
    public static string Change(ChangeKind change) => Words.Change.Of(change);

    /// <summary><c>none</c>, <c>newly_failing</c>, <c>newly_passing</c> or <c>findings_changed</c>.</summary>
    public static string Status(StatusChange status) => Words.Status.Of(status);

    /// <summary><c>feeder</c>, <c>branch</c> or <c>transformer</c>.</summary>
    public static string RunKind(RunResultKind kind) => Words.RunKind.Of(kind);

    /// <summary>For people: "newly failing (branch_drop, total_drop)", "fails (ampacity)", "passes" and so on.</summary>
    public static string StatusPhrase(StatusChange status, IReadOnlyList<string> before, IReadOnlyList<string> after) => status switch
    {
        StatusChange.NewlyFailing => $"newly failing ({string.Join(", ", after)})",
        StatusChange.NewlyPassing => $"newly passing (was {string.Join(", ", before)})",
        StatusChange.FindingsChanged => $"fails ({string.Join(", ", before)} → {string.Join(", ", after)})",
        _ => after.Count > 0 ? $"fails ({string.Join(", ", after)})" : "passes",
    };

    /// <summary>A signed change with the given decimals: <c>+0.25</c>, <c>-1.10</c>, <c>0.00</c>.</summary>
    public static string Signed(double value, int decimals)
    {
        var format = "0." + new string('0', decimals);
        var rounded = Math.Round(value, decimals, MidpointRounding.AwayFromZero) + 0.0;
        var text = rounded.ToString(format, CultureInfo.InvariantCulture);
        return rounded > 0 ? "+" + text : text;
    }

    /// <summary>One line of counts: equipment and circuits added, removed, changed; end points affected; findings.</summary>
    public static string Summary(ComparisonSummary s) => string.Create(
        CultureInfo.InvariantCulture,
        $"equipment {s.EquipmentAdded} added, {s.EquipmentRemoved} removed, {s.EquipmentChanged} changed; " +
        $"circuits {s.CircuitsAdded} added, {s.CircuitsRemoved} removed, {s.CircuitsChanged} changed; " +
        $"{s.EndPointsAffected} of {s.EndPointsCompared} end points affected ({s.EndPointsNewlyFailing} newly failing, {s.EndPointsNewlyPassing} newly passing); " +
        $"findings {s.NewFindings} new, {s.ResolvedFindings} resolved");
}
