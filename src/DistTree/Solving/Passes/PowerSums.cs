using DistTree.Diagnostics;
using DistTree.Network;
using Flag = DistTree.Solving.Passes.Has;

namespace DistTree.Solving.Passes;

/// <summary>
/// The power pass, bottom-up: an end point's power is its load; a node's is the phasor sum of its children's
/// times its demand factor: S_node = d·ΣS_child. The continuous part of each is summed the same way (a motor is
/// never counted continuous: the motor rules give its 125 %, see <see cref="LargestMotors"/>). On the way
/// it notes what each node has (<see cref="Passes.Has"/>), and a motor's locked-rotor power and full-load current while
/// its load is at hand (an end point's demand factor is 1, so its power is the one the motor-start check would read).
/// </summary>
internal sealed class PowerSums : IDisposable
{
    private readonly int _n;

    /// <summary>Sums the power of <paramref name="network"/>. Throws <see cref="ProjectException"/> at a load that cannot be worked out.</summary>
    public PowerSums(DistributionNetwork network)
    {
        var nodes = network.NodeArray;
        _n = nodes.Length;

        // The power is the solution's own; the rest are scratch. The pass fills them whole, so they are made
        // without clearing and their memory is first written on every core.
        Power = Scratch.Uninitialized<ComplexPower>(_n);
        Continuous = Scratch.RentToFill<ComplexPower>(_n);
        Has = Scratch.RentToFill<Has>(_n);
        LockedRotor = Scratch.RentToFill<ComplexPower>(_n); // read only for a motor, and written there
        FullLoadA = Scratch.RentToFill<double>(_n); // the same
        var demand = Scratch.RentToFill<double>(_n);
        ReadNodes(nodes, demand);
        Sum(network.ParentIndices, demand);
        Scratch.Return(demand, _n);
    }

    /// <summary>Per node, the complex power it carries after demand factors.</summary>
    public ComplexPower[] Power { get; }

    /// <summary>Per node, the continuous part of <see cref="Power"/> (motors left out).</summary>
    public ComplexPower[] Continuous { get; }

    /// <summary>Per node, what it has.</summary>
    public Has[] Has { get; }

    /// <summary>Per node, a motor's locked-rotor power (written for motors only).</summary>
    public ComplexPower[] LockedRotor { get; }

    /// <summary>Per node, a motor's full-load current, amperes (written for motors only).</summary>
    public double[] FullLoadA { get; }

    /// <summary>Gives back the scratch arrays (all but <see cref="Power"/>).</summary>
    public void Dispose()
    {
        Scratch.Return(Continuous, _n);
        Scratch.Return(Has, _n);
        Scratch.Return(LockedRotor, _n);
        Scratch.Return(FullLoadA, _n);
    }

    // The end points' loads and the other nodes' demand factors first, each node on its own, on every core. Each
    // range runs from its last index down, so that on one thread the bad load met first is the same one the plain
    // bottom-up loop met first.
    private void ReadNodes(NetworkNode[] nodes, double[] demand)
    {
        var (power, continuous, has, lockedRotor, fullLoad) = (Power, Continuous, Has, LockedRotor, FullLoadA);
        ParallelRanges.For(nodes.Length, (start, end) =>
        {
            for (var i = end - 1; i >= start; i--)
            {
                var node = nodes[i];
                demand[i] = node.Equipment?.DemandFactor ?? 1.0;
                has[i] = (node.Circuit is null ? Flag.None : Flag.Circuit)
                    | (node.Circuit is { Load.IsMotor: true } ? Flag.Motor : Flag.None)
                    | (node.Circuit is { Load.MinimumCircuitA: not null } ? Flag.Nameplate : Flag.None)
                    | (node.Incoming is null ? Flag.None : Flag.Run)
                    | (node.Equipment?.Transformer is null ? Flag.None : Flag.Transformer);
                if (node.Circuit is { } circuit)
                {
                    try
                    {
                        power[i] = LoadPower.Of(circuit.Load, circuit.Supply);
                    }
                    catch (ArgumentException e)
                    {
                        throw ProjectException.At(circuit.Location, e.Message);
                    }

                    continuous[i] = circuit.Continuous && !circuit.Load.IsMotor ? power[i] : ComplexPower.Zero;
                    if (circuit.Load.IsMotor)
                    {
                        lockedRotor[i] = MotorStarting.LockedRotor(circuit.Load, power[i]);
                        fullLoad[i] = circuit.Load.FullLoadCurrentA(circuit.Supply) ?? 0.0;
                    }
                }
                else
                {
                    power[i] = ComplexPower.Zero;
                    continuous[i] = ComplexPower.Zero;
                }
            }
        });
    }

    // Then the sums, in flat arrays. An end point's factor is 1, and a product by 1 is exact: its load stays as it is.
    private void Sum(int[] parents, double[] demand)
    {
        var (power, continuous) = (Power, Continuous);
        for (var i = _n - 1; i >= 0; i--)
        {
            power[i] *= demand[i];
            continuous[i] *= demand[i];
            if (parents[i] >= 0)
            {
                power[parents[i]] += power[i];
                continuous[parents[i]] += continuous[i];
            }
        }
    }
}
