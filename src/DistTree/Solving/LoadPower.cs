using DistTree.Model;

namespace DistTree.Solving;

/// <summary>Turns a circuit's stated load into complex power at the circuit's nominal voltage.</summary>
public static class LoadPower
{
    /// <summary>
    /// The load's complex power: <c>va</c>/<c>kva</c> as apparent power, <c>kw</c> as real power,
    /// <c>amps</c> at nominal voltage (|S| = V·I single-phase, √3·V·I three-phase), <c>hp</c> through the
    /// motor full-load current tables (<see cref="MotorTables"/>). Throws <see cref="ArgumentException"/> for
    /// a motor rating the tables do not list.
    /// </summary>
    public static ComplexPower Of(Load load, CircuitSupply supply)
    {
        var pf = load.PowerFactor;
        return load.Kind switch
        {
            LoadKind.Va => ComplexPower.FromApparent(load.Value, pf),
            LoadKind.Kva => ComplexPower.FromApparent(load.Value * 1000, pf),
            LoadKind.Kw => ComplexPower.FromApparent(load.Value * 1000 / pf, pf),
            LoadKind.Amps or LoadKind.Fla => ComplexPower.FromApparent(ApparentFromCurrent(load.Value, supply), pf),
            LoadKind.Hp => ComplexPower.FromApparent(
                ApparentFromCurrent(
                    MotorTables.FullLoadCurrentA(load.Value, supply)
                        ?? throw new ArgumentException($"no full-load current is listed for a {load.Value} hp motor on {supply.Phases}-phase {supply.VoltageV} V"),
                    supply),
                pf),
            _ => throw new ArgumentOutOfRangeException(nameof(load), load.Kind, "unknown load kind"),
        };
    }

    /// <summary>The line current in amperes that <paramref name="voltAmperes"/> draws from <paramref name="supply"/>.</summary>
    public static double CurrentA(double voltAmperes, CircuitSupply supply) =>
        supply.Phases == 3 ? voltAmperes / (Math.Sqrt(3) * supply.VoltageV) : voltAmperes / supply.VoltageV;

    /// <summary>The apparent power in VA that <paramref name="currentA"/> draws at nominal voltage.</summary>
    public static double ApparentFromCurrent(double currentA, CircuitSupply supply) =>
        supply.Phases == 3 ? Math.Sqrt(3) * supply.VoltageV * currentA : supply.VoltageV * currentA;
}
