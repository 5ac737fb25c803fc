using DistTree.Model;

namespace DistTree.Solving;

/// <summary>Turns a circuit's stated load into complex power at the circuit's nominal voltage.</summary>
public static class LoadPower
{
    /// <summary>
    /// The load's complex power: its apparent power (<see cref="Load.VoltAmperes"/>, which works out every kind of
    /// load) at its power factor, lagging. Throws <see cref="ArgumentException"/> for a motor rating the tables do not list.
    /// </summary>
    public static ComplexPower Of(Load load, CircuitSupply supply) => ComplexPower.FromApparent(load.VoltAmperes(supply), load.PowerFactor);

    /// <summary>The line current in amperes that <paramref name="voltAmperes"/> draws from <paramref name="supply"/>.</summary>
    public static double CurrentA(double voltAmperes, CircuitSupply supply) =>
        supply.Phases == 3 ? voltAmperes / (Math.Sqrt(3) * supply.VoltageV) : voltAmperes / supply.VoltageV;
}
