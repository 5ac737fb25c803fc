using System.Reflection;
using DistTree.Reports.Html;
using DistTree.Solving;
using Scriban;
using Scriban.Runtime;

namespace DistTree.Reports;

/// <summary>
/// Renders a solution as one self-contained HTML page for design review: header and caution, summary,
/// worst paths as stacked bars, the equipment tree, per-panel circuit tables, findings, an optional
/// upsize plan, and the method and data. Inline CSS and SVG only: no script, and nothing is fetched.
/// The same solution and options always give the same bytes (no clock unless <see cref="HtmlReportOptions.Date"/> is given).
/// </summary>
public static class HtmlReport
{
    private static readonly Lazy<Template> Page = new(() => Parse("report.sbn-html"));
    private static readonly Lazy<string> Css = new(() => Resource("report.css"));

    /// <summary>The page as HTML text (UTF-8 when written), ending in a newline.</summary>
    /// <param name="solution">The solved project.</param>
    /// <param name="options">What to show beyond the solution.</param>
    public static string Render(Solution solution, HtmlReportOptions options)
    {
        ArgumentNullException.ThrowIfNull(solution);
        ArgumentNullException.ThrowIfNull(options);
        var view = ReportViewBuilder.Build(solution, options, Css.Value);
        var globals = new ScriptObject();
        globals.SetValue("r", view, true);
        var context = new TemplateContext
        {
            LoopLimit = 0,
            LimitToString = 0,
            OutputLimit = 0,
            StrictVariables = true,
            NewLine = "\n",
            EnableRelaxedMemberAccess = false,
        };
        context.PushGlobal(globals);
        return Page.Value.Render(context);
    }

    private static Template Parse(string name)
    {
        var template = Template.Parse(Resource(name), name);
        if (template.HasErrors)
        {
            throw new InvalidOperationException($"report template {name}: {string.Join("; ", template.Messages)}");
        }

        return template;
    }

    private static string Resource(string name)
    {
        var full = "DistTree.Reports.Templates." + name;
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream(full)
            ?? throw new InvalidOperationException($"embedded resource {full} is missing");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd().Replace("\r\n", "\n", StringComparison.Ordinal);
    }
}
