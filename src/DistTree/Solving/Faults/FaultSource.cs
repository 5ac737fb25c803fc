using System.Numerics;
using DistTree.Model;

namespace DistTree.Solving;

/// <summary>
/// The service's source impedance for faults (see <see cref="FaultSolver"/>), per phase in the sequence form of
/// <see cref="Sequences"/>:
/// <list type="bullet">
/// <item>the utility's available fault current I″k and X/R: Z = c_max·U_n/(√3·I″k) on three lines (IEC 60909-0's network
/// feeder), the loop c_max·V/I″k on a single-phase service, whose line-to-neutral loop is half of it (each line half the
/// loop, as the phase frame takes it); the zero sequence equal to the positive (common practice where the utility gives
/// the three-phase figure only);</item>
/// <item>the utility's transformer (kVA, %Z, X/R) on an infinite primary: Z = %Z·V²/S, positive and zero sequence alike
/// (Dyn), times K_T for the maximum; a single-phase one centre-tapped as a building's (1.5·R and 1.2·X for a half);</item>
/// <item>nothing: an infinite bus, the largest currents the tree's own impedances allow (the safe side for equipment
/// ratings, not for the far ends' minimum).</item>
/// </list>
/// A source without a neutral is taken as ungrounded: no line-to-ground current flows.
/// </summary>
internal readonly record struct FaultSource(FaultSourceKind Kind, Complex Cold, Complex Hot, ElectricalSystem System)
{
    /// <summary>The source of <paramref name="service"/> for the maximum voltage factor <paramref name="factorMax"/>.</summary>
    public static FaultSource Of(Service service, double factorMax)
    {
        var system = service.System;
        var lines = PhaseRules.Lines(system);
        if (service is { AvailableFaultCurrentKa: { } ka, FaultXOverR: { } xr })
        {
            // Three lines: the impedance per phase; otherwise the loop (two lines: between them; one line: to neutral).
            var v = lines == 3 ? LineVoltages.LineToNeutralV(system) : system.NominalV;
            var z = Complex.FromPolarCoordinates(factorMax * v / (ka * 1000.0), Math.Atan(xr));
            return new FaultSource(FaultSourceKind.Utility, z, z, system);
        }

        if (service is { UtilityTransformerKva: { } kva, UtilityTransformerImpedancePercent: { } percent, FaultXOverR: { } txr })
        {
            var v = system.NominalV;
            var z = Complex.FromPolarCoordinates(percent / 100.0 * v * v / (kva * 1000.0), Math.Atan(txr));
            var xT = percent / 100.0 * Math.Sin(Math.Atan(txr));
            var kT = 0.95 * factorMax / (1 + (0.6 * xT));
            return new FaultSource(FaultSourceKind.UtilityTransformer, kT * z, z, system);
        }

        return new FaultSource(FaultSourceKind.InfiniteBus, Complex.Zero, Complex.Zero, system);
    }

    /// <summary>Sets the service's node (0) in the maximum (<paramref name="cold"/>) and minimum (<paramref name="hot"/>) sequences.</summary>
    public void Seed(Sequences hot, Sequences cold)
    {
        Seed(cold, Cold);
        Seed(hot, Hot);
    }

    private void Seed(Sequences s, Complex z)
    {
        var lines = PhaseRules.Lines(System);
        var (z1, z0) = (Kind, lines) switch
        {
            (_, 3) => (z, z),
            (FaultSourceKind.UtilityTransformer, 2) => (z / 2, (3 * new Complex(0.375 * z.Real, 0.3 * z.Imaginary)) - z),
            (_, 2) => (z / 2, z / 2),
            _ => (z, z),
        };
        s.Z1[0] = z1;
        s.Z0n[0] = s.Z0g[0] = System.HasNeutral ? z0 : Sequences.None;
    }
}
