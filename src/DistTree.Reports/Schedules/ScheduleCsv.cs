using System.Globalization;
using System.Text;
using DistTree.Reports.Html;
using DistTree.Solving;

namespace DistTree.Reports.Schedules;

/// <summary>One panel's schedule as a CSV file: the file's name (made safe, unique in its folder) and its text.</summary>
/// <param name="PanelId">The panel's id, as the project gives it.</param>
/// <param name="FileName">The file's name: the id made safe for a file name, <c>.csv</c> (see <see cref="ScheduleCsv.FileNames"/>).</param>
/// <param name="Content">The CSV text (RFC 4180: comma-separated, CRLF line ends, a header line).</param>
public sealed record ScheduleFile(string PanelId, string FileName, string Content);

/// <summary>
/// Writes each panel's schedule as CSV (RFC 4180): a header line, a line per circuit in natural order of id, then
/// a line of the panel's totals; the figures are the HTML schedule's, at its rounding, with a point for a decimal
/// (invariant culture). Text is the project's exact text (as in the JSON results), quoted where it holds a comma,
/// a quote or a line break. The columns are docs/schedules.md's.
/// </summary>
public static class ScheduleCsv
{
    /// <summary>The header line's columns, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "row", "panel", "space", "side", "spaces", "circuit", "name", "poles", "device_a", "conductor", "lines",
        "load_va", "line_a_va", "line_b_va", "line_c_va", "connected_va", "neutral_a",
    ];

    /// <summary>A file per panel (every node with circuits), in network order.</summary>
    public static IReadOnlyList<ScheduleFile> Write(Solution solution)
    {
        ArgumentNullException.ThrowIfNull(solution);
        var schedules = PanelSchedules.Of(solution);
        var names = FileNames(schedules.Select(p => p.Panel.Id).ToArray());
        var files = new ScheduleFile[schedules.Length];
        for (var k = 0; k < schedules.Length; k++)
        {
            files[k] = new ScheduleFile(schedules[k].Panel.Id, names[k], Text(schedules[k]));
        }

        return files;
    }

    /// <summary>
    /// The file name for each panel id, in order: the id with every character but ASCII letters, digits, <c>-</c> and
    /// <c>_</c> made <c>_</c> (a name that would be empty or a device name on some systems, such as <c>CON</c>, gets a
    /// leading <c>_</c>), cut to 100 characters; a name already given (letter case aside) takes <c>-2</c>,
    /// <c>-3</c> … until it is unique; then <c>.csv</c>.
    /// </summary>
    public static string[] FileNames(IReadOnlyList<string> panelIds)
    {
        ArgumentNullException.ThrowIfNull(panelIds);
        var used = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        var names = new string[panelIds.Count];
        for (var k = 0; k < names.Length; k++)
        {
            var stem = SafeStem(panelIds[k]);
            var name = stem;
            for (var n = 2; !used.Add(name); n++)
            {
                name = string.Create(CultureInfo.InvariantCulture, $"{stem}-{n}");
            }

            names[k] = name + ".csv";
        }

        return names;
    }

    private static string SafeStem(string id)
    {
        var sb = new StringBuilder(Math.Min(id.Length, 100));
        foreach (var c in id.AsSpan(0, Math.Min(id.Length, 100)))
        {
            sb.Append(char.IsAsciiLetterOrDigit(c) || c is '-' or '_' ? c : '_');
        }

        var stem = sb.ToString();
        var device = stem.Length is 3 or 4 && (stem.ToUpperInvariant() is "CON" or "PRN" or "AUX" or "NUL"
            || (stem.Length == 4 && stem.ToUpperInvariant()[..3] is "COM" or "LPT" && stem[3] is >= '0' and <= '9'));
        return stem.Length == 0 || device ? "_" + stem : stem;
    }

    private static string Text(PanelSchedule p)
    {
        var sb = new StringBuilder();
        Line(sb, Columns);
        foreach (var c in p.Circuits)
        {
            string[] lineVa = [.. Enumerable.Range(0, 3).Select(x => x < c.LineVa.Count && c.IsOn(x) ? Va(c.LineVa[x]) : "")];
            Line(sb,
            [
                "circuit", p.Panel.Id, c.FirstSpace is { } f ? Count(f) : "", c.FirstSpace is { } s ? (s % 2 == 1 ? "left" : "right") : "",
                string.Join(' ', c.Spaces.Select(Count)), c.Id, c.Name, Count(c.Poles), c.DeviceA is { } d ? Number(d, "0.##") : "",
                RunText.ConductorText(c.Run), c.Lines, Va(c.LoadVa), lineVa[0], lineVa[1], lineVa[2], "", "",
            ]);
        }

        string[] totals = [.. Enumerable.Range(0, 3).Select(x => x < p.Panel.LineVa.Count ? Va(p.Panel.LineVa[x]) : "")];
        Line(sb,
        [
            "total", p.Panel.Id, "", "", "", "", "", "", "", "", "", "", totals[0], totals[1], totals[2], Va(p.Panel.ConnectedVa),
            p.Panel.NeutralCurrentA is { } n ? Number(n, "0.0") : "",
        ]);
        return sb.ToString();
    }

    private static void Line(StringBuilder sb, IReadOnlyList<string> fields)
    {
        for (var k = 0; k < fields.Count; k++)
        {
            if (k > 0)
            {
                sb.Append(',');
            }

            var f = fields[k];
            if (f.AsSpan().IndexOfAny(",\"\r\n") >= 0)
            {
                sb.Append('"').Append(f.Replace("\"", "\"\"", StringComparison.Ordinal)).Append('"');
            }
            else
            {
                sb.Append(f);
            }
        }

        sb.Append("\r\n");
    }

    // Volt-amperes, whole, as the HTML schedule shows them (without its thousands separator).
    private static string Va(double value) => Number(value, "0");

    private static string Count(int value) => value.ToString(CultureInfo.InvariantCulture);

    private static string Number(double value, string format)
    {
        var text = value.ToString(format, CultureInfo.InvariantCulture);
        return text is "-0" or "-0.0" ? text[1..] : text;
    }
}
