using System.Numerics;

using DistTree.Network;

namespace DistTree.Solving;

/// <summary>The result of a load flow.</summary>
/// <param name="Converged">True when the sweeps reached the tolerance.</param>
/// <param name="Iterations">Sweeps made.</param>
/// <param name="WeakestId">Where it did not converge: the node whose voltage fell furthest (or first stopped being a number); null when it converged.</param>
public sealed record LoadFlowResult(bool Converged, int Iterations, string? WeakestId = null);

/// <summary>
/// The reference solution of the tree in the phase frame (see <see cref="PhaseFrame"/>), by backward/forward sweep
/// (common practice for radial distribution networks), in volts and amperes. Each run is its lines and its neutral,
/// each conductor R(T) + jX per length, sets in parallel, no mutual coupling; loads are line to neutral, line to
/// line or across the three pairs (see <see cref="PhaseLoads"/>), at constant power, current or impedance, points
/// along a run span by span; transformers by their connection (see <see cref="TransformerModel"/>); the neutral is
/// grounded at the service and at each secondary; the service is a stiff source, or stands behind the utility's
/// impedance where the project gives its available fault current (see <see cref="PhaseFrame.SourceImpedance"/>). Backward: the loads' currents at the present voltages, summed up
/// the tree times each node's demand factor, through each transformer's connection. Forward: V_child = V_parent − I·Z
/// on each line and the neutral, each secondary from its primary. Repeats until no conductor voltage moves by more
/// than the tolerance (per unit of its bus's line-to-neutral base); a voltage that stops being a number, or no
/// convergence in <see cref="MaxIterations"/> sweeps, is a collapse.
/// </summary>
public static class LoadFlow
{
    /// <summary>Convergence tolerance on every conductor voltage, per unit of its bus's line-to-neutral base.</summary>
    public const double TolerancePu = 1e-6;

    /// <summary>Most sweeps before giving up.</summary>
    public const int MaxIterations = 100;

    /// <summary>Solves the tree whose runs' figures are in <paramref name="runs"/> and loads in <paramref name="power"/>.</summary>
    internal static (LoadFlowResult Result, PhaseVoltages Voltages) Solve(DistributionNetwork network, PhaseFlow phases, ComplexPower[] power, Passes.RunRows runs)
    {
        using var sweeps = new PhaseSweeps(network, phases, power, runs);
        var levels = network.Levels;
        Action<int, int> backward = sweeps.Backward;
        Action<int, int> forward = sweeps.Forward;
        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            ParallelRanges.BottomUp(levels.Steps, backward);
            sweeps.MovedSquared = 0.0;
            sweeps.Finite = true;
            sweeps.Source();
            ParallelRanges.TopDown(levels.Steps, forward);
            if (!sweeps.Finite)
            {
                return (new LoadFlowResult(false, iteration, sweeps.Weakest()), sweeps.TakeVoltages());
            }

            if (sweeps.MovedSquared < TolerancePu * TolerancePu)
            {
                return (new LoadFlowResult(true, iteration), sweeps.TakeVoltages());
            }
        }

        return (new LoadFlowResult(false, MaxIterations, sweeps.Weakest()), sweeps.TakeVoltages());
    }
}

/// <summary>
/// The voltages of a load flow: per node its bus's four conductor voltages (A, B, C, N; volts, the phase frame's
/// angles) and, for a transformer, its primary terminals'. Scratch arrays, given back by <see cref="Dispose"/>.
/// </summary>
internal sealed class PhaseVoltages : IDisposable
{
    private readonly int _n;
    private readonly Complex[] _bus;
    private readonly Dictionary<int, Complex[]> _primary;
    private readonly TransformerModel?[] _models;

    public PhaseVoltages(int n, Complex[] bus, Dictionary<int, Complex[]> primary, TransformerModel?[] models)
    {
        _n = n;
        _bus = bus;
        _primary = primary;
        _models = models;
    }

    /// <summary>The four conductor voltages on node <paramref name="node"/>'s bus (an end point's: at its far end).</summary>
    public ReadOnlySpan<Complex> Bus(int node) => _bus.AsSpan(node * 4, 4);

    /// <summary>The four conductor voltages where node <paramref name="node"/>'s run ends: a transformer's primary terminals, else its bus.</summary>
    public ReadOnlySpan<Complex> Input(int node) => _models[node] is null ? Bus(node) : _primary[node];

    /// <summary>Gives back the scratch array.</summary>
    public void Dispose() => Scratch.Return(_bus, _n * 4);
}
