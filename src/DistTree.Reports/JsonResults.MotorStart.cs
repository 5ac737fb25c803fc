using System.Text.Json;
using DistTree.Solving;

namespace DistTree.Reports;

/// <summary>The results document's motor-start check of an end point (see <see cref="JsonResults"/>).</summary>
public static partial class JsonResults
{
    // The check: the locked-rotor power, the dips at the terminals and the panel, the limit, and the dip at each bus
    // of the motor's path, its panel first.
    private static void WriteMotorStart(Utf8JsonWriter w, MotorStartResult m)
    {
        w.WriteStartObject("motor_start"u8);
        Number(w, "locked_rotor_kva"u8, m.LockedRotorVa / 1000.0, 3);
        Number(w, "terminal_dip_percent"u8, m.TerminalDipPercent, 4);
        Number(w, "panel_dip_percent"u8, m.PanelDipPercent, 4);
        Number(w, "limit_percent"u8, m.LimitPercent, 4);
        w.WriteStartArray("path_dips"u8);
        foreach (var dip in m.PathDips)
        {
            w.WriteStartObject();
            w.WriteString("id"u8, dip.Id);
            Number(w, "dip_percent"u8, dip.DipPercent, 4);
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteEndObject();
    }
}
