using System.Text.Json;
using DistTree.Solving;
using DistTree.Vocabulary;

namespace DistTree.Reports;

/// <summary>The short-circuit study in the JSON results: the <c>faults</c> method, the <c>equipment</c> array, each run's far end.</summary>
public static partial class JsonResults
{
    // The method and the source, then one entry per switchboard, panelboard, transformer (at its secondary terminals)
    // and splitter, in node order.
    private static void WriteEquipment(Utf8JsonWriter w, FaultStudy faults)
    {
        w.WriteStartObject("faults"u8);
        w.WriteString("method"u8, FaultText.Method);
        w.WriteString("source"u8, FaultText.SourceWord(faults.Source));
        Number(w, "voltage_factor_max"u8, faults.VoltageFactorMax, 3);
        Number(w, "voltage_factor_min"u8, faults.VoltageFactorMin, 3);
        Number(w, "motor_multiple"u8, faults.MotorMultiple, 2);
        w.WriteEndObject();
        w.WriteStartArray("equipment"u8);
        foreach (var e in faults.Equipment)
        {
            w.WriteStartObject();
            w.WriteString("id"u8, e.Id);
            w.WriteString("kind"u8, Words.EquipmentKind.Of(e.Kind));
            w.WriteString("system"u8, e.System);
            Number(w, "available_fault_current_ka"u8, e.AvailableFaultCurrentKa, 3);
            Number(w, "available_fault_current_lg_ka"u8, e.AvailableFaultCurrentLgKa, 3);
            Number(w, "fault_x_r"u8, e.XOverR, 2);
            Number(w, "interrupting_ka"u8, e.InterruptingKa, 2);
            WriteFindings(w, e.Findings);
            w.WriteEndObject();
            FlushEvery(w);
        }

        w.WriteEndArray();
    }

    // A feeder's or branch circuit's far end: the minimum fault current, which fault, and the device's instantaneous trip.
    private static void WriteFarEnd(Utf8JsonWriter w, FarEndFault? farEnd)
    {
        if (farEnd is not { } f)
        {
            return;
        }

        Number(w, "fault_min_a"u8, f.MinimumCurrentA, 1);
        w.WriteString("fault_min_kind"u8, FaultText.KindWord(f.Kind));
        Number(w, "trip_a"u8, f.TripCurrentA, 1);
        w.WriteString("trip_basis"u8, f.TripBasis);
        w.WriteString("fault_ground_size"u8, f.GroundSize);
    }
}
