using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

namespace DistTree.Benchmarks;

/// <summary>
/// Makes a second revision of a generated project the way a designer would revise one: every fifth
/// feeder 10 % longer (a re-routed riser), and a new sub-panel with lighting circuits under the first
/// 480Y/277 panelboard. Works on the text, so the revision goes through the loader like a real file.
/// </summary>
internal static partial class RevisionEdit
{
    /// <summary>The id of the sub-panel the revision adds.</summary>
    public const string SubPanelId = "BENCH-SUB";

    /// <summary>The branch circuits on the added sub-panel.</summary>
    public const int SubPanelCircuits = 6;

    /// <summary>The revised text, and how many feeders it lengthened.</summary>
    public static (string Text, int FeedersLengthened) Revise(string text) => Revise(text, every: 5, factor: 1.1);

    /// <summary>
    /// A stressed variant for the upsize comparison: every feeder three times as long, so that many end points
    /// are over the total limit and a shared feeder competes with the branch circuits below it.
    /// </summary>
    public static string Stress(string text) => Revise(text, every: 1, factor: 3.0).Text;

    private static (string Text, int FeedersLengthened) Revise(string text, int every, double factor)
    {
        var seen = 0;
        var lengthened = 0;
        var revised = FeederLength().Replace(text, m =>
        {
            if (seen++ % every != 0)
            {
                return m.Value;
            }

            lengthened++;
            var length = double.Parse(m.Groups["length"].Value, CultureInfo.InvariantCulture) * factor;
            return string.Create(CultureInfo.InvariantCulture, $"{m.Groups["head"].Value}{Math.Round(length, 1)}");
        });

        var parent = HighPanel().Match(revised);
        if (!parent.Success)
        {
            throw new InvalidOperationException("the generated project has no 480Y/277 panelboard to put a sub-panel under");
        }

        var sub = new StringBuilder(revised.EndsWith('\n') ? "" : "\n");
        sub.Append(CultureInfo.InvariantCulture, $"  - id: {SubPanelId}\n    kind: panelboard\n    from: {parent.Groups["id"].Value}\n");
        sub.Append("    feeder: { length: 80, size: 3 AWG, ocpd: 100 }\n    circuits:\n");
        for (var i = 1; i <= SubPanelCircuits; i++)
        {
            sub.Append(CultureInfo.InvariantCulture, $"      - id: \"{i}\"\n        name: Added lighting, zone {i}\n        poles: 1\n        ocpd: 20\n");
            sub.Append(CultureInfo.InvariantCulture, $"        load: {{ kw: 1.2, pf: 0.9 }}\n        continuous: true\n        run: {{ length: {40 + (10 * i)}, size: 12 AWG }}\n");
        }

        return (revised + sub, lengthened);
    }

    [GeneratedRegex(@"(?<head>feeder: \{ length: )(?<length>[0-9]+(\.[0-9]+)?)", RegexOptions.CultureInvariant)]
    private static partial Regex FeederLength();

    [GeneratedRegex(@"- id: (?<id>[A-Za-z0-9-]+-H)\n    kind: panelboard\n", RegexOptions.CultureInvariant)]
    private static partial Regex HighPanel();
}
