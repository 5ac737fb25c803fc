using DistTree.Solving;

namespace DistTree.Reports;

/// <summary>The short-circuit study in the console's analysis: a line per piece of equipment, and failing far ends on the worst paths.</summary>
public static partial class ConsoleReport
{
    // One line per switchboard, panelboard, transformer (at its secondary terminals) and splitter, after the source and
    // the method; the figures are the study's.
    private static void WriteFaults(TextWriter o, Solution s)
    {
        if (s.Faults is not { Equipment.Count: > 0 } faults)
        {
            return;
        }

        o.WriteLine("Fault currents (kA symmetrical rms: three-phase, or the largest bolted fault on a single-phase bus; line to ground; X/R; stated rating):");
        o.WriteLine($"  source  {FaultText.Source(faults, s.Project.Service)}");
        o.WriteLine($"  method  {FaultText.Method}; {FaultText.Factors(faults)}");
        foreach (var e in faults.Equipment)
        {
            var xr = e.XOverR is { } x ? F($"X/R {x,5:0.00}") : "X/R     –";
            o.WriteLine(F($"  {e.Id,-10} {Vocabulary.Words.EquipmentKind.Of(e.Kind),-11} {e.System,-9} {Ka(e.AvailableFaultCurrentKa, "unbounded"),9} {Ka(e.AvailableFaultCurrentLgKa),8}  {xr}  {Rating(e)}"));
        }

        o.WriteLine();
    }

    // The failing far ends of a path's runs: the minimum fault current against the current that trips the device.
    private static void WriteFarEnds(TextWriter o, Solution s, EndPointResult e)
    {
        var faults = s.Faults;
        var failing = e.RunIndices
            .Select(r => s.Runs[r])
            .Where(r => r.Kind != RunResultKind.Transformer)
            .Select(r => (Run: r, FarEnd: faults.FarEndAt(r.NodeIndex)))
            .Where(p => p.FarEnd is { Clears: false })
            .Select(p => F($"{p.Run.Id} {p.FarEnd!.Value.MinimumCurrentA:0} A {FaultText.KindShort(p.FarEnd.Value.Kind)} < trip {p.FarEnd.Value.TripCurrentA:0} A"))
            .ToArray();
        if (failing.Length > 0)
        {
            o.WriteLine($"        far-end fault  {string.Join("  +  ", failing)}");
        }
    }

    // A fault current in kA; "unbounded" where no impedance bounds it (an infinite bus with no conductor between).
    private static string Ka(double? ka, string none = "–") => ka is { } k ? F($"{k:0.00}") : none;

    private static string Rating(EquipmentFault e) => e.InterruptingKa switch
    {
        null => "no rating stated",
        { } r when e.Findings.Count > 0 => F($"rating {r:0.##} kA  OVER"),
        { } r => F($"rating {r:0.##} kA  ok"),
    };
}
