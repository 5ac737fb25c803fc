using DistTree.Comparing;
using DistTree.Sizing;

namespace DistTree.Reports;

/// <summary>What the HTML review report shows beyond the solution itself.</summary>
public sealed record HtmlReportOptions
{
    /// <summary>How many worst paths to draw (default 10); 0 draws none.</summary>
    public int Worst { get; init; } = 10;

    /// <summary>A date (or any text) shown in the header; null shows none, so the same input gives the same bytes.</summary>
    public string? Date { get; init; }

    /// <summary>An upsize plan to show in its own section, or null.</summary>
    public UpsizePlan? Plan { get; init; }

    /// <summary>
    /// A comparison whose new revision is the solution rendered, shown in its own section near the top, or null.
    /// End points it lists link to their panel tables in the page.
    /// </summary>
    public Comparison? Comparison { get; init; }

    /// <summary>The page title; null gives "<c>project name</c> · voltage-drop review".</summary>
    public string? Title { get; init; }

    /// <summary>The options every default gives.</summary>
    public static HtmlReportOptions Default { get; } = new();
}
