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

    /// <summary>For people: what happened to a piece of equipment's fault current: <c>added</c>, <c>removed</c>, <c>rose</c>, <c>fell</c> or <c>unchanged</c>.</summary>
    public static string FaultStatus(FaultDelta d)
    {
        ArgumentNullException.ThrowIfNull(d);
        return d switch
        {
            { IsAdded: true } => "added",
            { IsRemoved: true } => "removed",
            { Rose: true } => "rose",
            { Moved: true } => "fell",
            _ => "unchanged",
        };
    }

    /// <summary>A fault current in kA to 0.01 kA, or a dash where the study has none.</summary>
    public static string Ka(double? ka) => ka is { } k ? k.ToString("0.00", CultureInfo.InvariantCulture) : "-";

    /// <summary>A change of fault current: <c>+4.18 kA, +41.3 %</c>, or a dash where either revision has no figure.</summary>
    public static string KaChange(double? changeKa, double? changePercent) => changeKa is { } c
        ? Signed(c, 2) + " kA" + (changePercent is { } p ? ", " + Signed(p, 1) + " %" : "")
        : "-";

    /// <summary>
    /// The stated rating against the new revision's current: <c>rating 10 kA, over</c>, <c>rating 22 kA, ok</c>; empty
    /// where none is stated.
    /// </summary>
    public static string FaultRating(FaultDelta d)
    {
        ArgumentNullException.ThrowIfNull(d);
        var e = d.After ?? d.Before;
        if (e?.InterruptingKa is not { } rating)
        {
            return "";
        }

        var over = d.IsRemoved ? d.OverRatingBefore : d.OverRatingAfter;
        var verdict = over ? (d.OverRatingBefore || d.IsAdded ? "over" : "newly over") : "ok";
        return string.Create(CultureInfo.InvariantCulture, $"rating {rating:0.##} kA, {verdict}");
    }
}
