using System.Numerics;
using DistTree.Model;

namespace DistTree.Tests.Solving.Reference;

/// <summary>
/// The reference circuit solver against closed forms of textbook circuit laws (Ohm's and Kirchhoff's laws, the ideal
/// transformer, conservation of complex power): each test names its formula. Relative tolerance 1e-10.
/// </summary>
public sealed class NodalCircuitTests
{
    private const double Tolerance = 1e-10;

    private static readonly Complex A120 = Complex.FromPolarCoordinates(1, -2 * Math.PI / 3);

    [Fact]
    public void Solve_VoltageDivider_GivesSourceTimesZ2OverZ1PlusZ2()
    {
        // Voltage divider rule (Kirchhoff's voltage law and Ohm's law on two impedances in series): V2 = V·Z2/(Z1 + Z2).
        var c = new NodalCircuit();
        var (n1, n2) = (c.AddNode("1"), c.AddNode("2"));
        var (v, z1, z2) = (new Complex(120, 0), new Complex(0.3, 0.4), new Complex(5, 2));
        c.AddVoltageSource(n1, NodalCircuit.Ground, v);
        c.AddImpedance(n1, n2, z1);
        c.AddImpedance(n2, NodalCircuit.Ground, z2);

        var s = c.Solve();

        Near(v * z2 / (z1 + z2), s.Voltage(n2));
        Assert.Equal(0, s.Iterations);
    }

    [Fact]
    public void Solve_SinglePhaseLoop_DropsTwoIZ()
    {
        // A single-phase two-wire loop: the current I = V/(2Z + Z_L) (Ohm's law on the loop) flows out on the line and
        // back on the neutral, so the load sees V − 2·I·Z (Kirchhoff's voltage law round the loop).
        var c = new NodalCircuit();
        var (l0, l1, n1) = (c.AddNode("L0"), c.AddNode("L1"), c.AddNode("N1"));
        var (v, z) = (new Complex(120, 0), new Complex(0.2, 0.05));
        var load = new Complex(1500, 500);
        c.AddVoltageSource(l0, NodalCircuit.Ground, v);
        c.AddImpedance(l0, l1, z);
        c.AddImpedance(n1, NodalCircuit.Ground, z);
        c.AddLoad(l1, n1, LoadModel.ConstantImpedance, load, 120);

        var s = c.Solve();

        var zl = 120.0 * 120.0 / Complex.Conjugate(load);
        var i = v / ((2 * z) + zl);
        Near(v - (2 * i * z), s.Between(l1, n1));
        Near(i, s.LoadCurrent(0));
    }

    [Fact]
    public void Solve_BalancedThreePhaseFeeder_DropsRootThreeIZLineToLine()
    {
        // A balanced three-phase feeder into a delta of equal impedances Z_Δ: the equivalent star is Z_Δ/3 (the Δ–Y
        // transformation), the line current I = V_LN/(Z + Z_Δ/3), the neutral carries nothing, and each line-to-line
        // voltage drops by (I_a − I_b)·Z, of magnitude √3·|I|·|Z| (balanced phasors 120° apart).
        var c = new NodalCircuit();
        var vln = 480 / Math.Sqrt(3);
        var z = new Complex(0.05, 0.03);
        var loadEach = new Complex(20_000, 8_000);
        var (far, near) = (new int[3], new int[3]);
        for (var k = 0; k < 3; k++)
        {
            near[k] = c.AddNode($"S{k}");
            far[k] = c.AddNode($"L{k}");
            c.AddVoltageSource(near[k], NodalCircuit.Ground, vln * Complex.Pow(A120, k));
            c.AddImpedance(near[k], far[k], z);
        }

        var neutral = c.AddNode("N");
        c.AddImpedance(neutral, NodalCircuit.Ground, z);
        for (var k = 0; k < 3; k++)
        {
            c.AddLoad(far[k], far[(k + 1) % 3], LoadModel.ConstantImpedance, loadEach, 480);
        }

        var s = c.Solve();

        var zDelta = 480.0 * 480.0 / Complex.Conjugate(loadEach);
        var i = vln / (z + (zDelta / 3));
        Near(i, s.ImpedanceCurrent(0));
        Near(Complex.Zero, s.Voltage(neutral), scale: vln);
        var dropLineToLine = s.Between(near[0], near[1]) - s.Between(far[0], far[1]);
        Assert.Equal(Math.Sqrt(3) * i.Magnitude * z.Magnitude, dropLineToLine.Magnitude, 1e-10 * vln);
    }

    [Fact]
    public void Solve_ConstantPowerOnResistance_IsTheLargerRootOfTheQuadratic()
    {
        // A load of constant real power P behind a resistance R from a source V_s: V·(V_s − V)/R = P, so
        // V² − V·V_s + P·R = 0 and the operating point is the larger root V = (V_s + √(V_s² − 4·P·R))/2.
        var c = new NodalCircuit();
        var (src, bus) = (c.AddNode("S"), c.AddNode("B"));
        const double vs = 240, r = 0.5, p = 12_000;
        c.AddVoltageSource(src, NodalCircuit.Ground, vs);
        c.AddImpedance(src, bus, r);
        c.AddLoad(bus, NodalCircuit.Ground, LoadModel.ConstantPower, p, 240);

        var s = c.Solve();

        Near((vs + Math.Sqrt((vs * vs) - (4 * p * r))) / 2, s.Voltage(bus));
    }

    [Fact]
    public void Solve_ConstantPowerOnImpedance_MatchesTheTwoBusVoltageEquation()
    {
        // The two-bus load-flow equation (power-systems textbooks, voltage stability): a load S = P + jQ behind
        // Z = R + jX from V_s has |V|⁴ + (2(R·P + X·Q) − V_s²)·|V|² + |Z|²·|S|² = 0; the operating point is the larger root.
        var c = new NodalCircuit();
        var (src, bus) = (c.AddNode("S"), c.AddNode("B"));
        var (vs, z, load) = (277.0, new Complex(0.4, 0.3), new Complex(30_000, 15_000));
        c.AddVoltageSource(src, NodalCircuit.Ground, vs);
        c.AddImpedance(src, bus, z);
        c.AddLoad(bus, NodalCircuit.Ground, LoadModel.ConstantPower, load, 277);

        var s = c.Solve();

        var b = (vs * vs) - (2 * ((z.Real * load.Real) + (z.Imaginary * load.Imaginary)));
        var v2 = (b + Math.Sqrt((b * b) - (4 * z.Magnitude * z.Magnitude * load.Magnitude * load.Magnitude))) / 2;
        Assert.Equal(Math.Sqrt(v2), s.Voltage(bus).Magnitude, Tolerance * vs);
        Near(load, s.LoadPowerVa(0));
    }

    [Fact]
    public void Solve_ConstantCurrentOnResistance_DropsIR()
    {
        // A unity-power-factor load of constant current I behind a resistance R: its current is in phase with its
        // voltage, which stays in phase with the source, so V = V_s − I·R (Ohm's law); I = |S₀|/V_nom.
        var c = new NodalCircuit();
        var (src, bus) = (c.AddNode("S"), c.AddNode("B"));
        c.AddVoltageSource(src, NodalCircuit.Ground, 120);
        c.AddImpedance(src, bus, 0.3);
        c.AddLoad(bus, NodalCircuit.Ground, LoadModel.ConstantCurrent, 1200, 120);

        var s = c.Solve();

        Near(120 - (10 * 0.3), s.Voltage(bus));
    }

    [Fact]
    public void Solve_IdealTransformer_GivesTheTurnsRatioAndRefersImpedanceByItsSquare()
    {
        // Ideal transformer: V1/N1 = V2/N2 and N1·I1 + N2·I2 = 0. At no load the secondary stands at V1·N2/N1; with a
        // series impedance Z_p on the primary side and a load Z_L on the secondary, Z_p referred across is Z_p/a²
        // (a = N1/N2), so V2 = (V1/a)·Z_L/(Z_L + Z_p/a²).
        var (v1, zp, zl) = (new Complex(480, 0), new Complex(0.8, 2.4), new Complex(2, 0.5));
        var open = Transformer(v1, zp, null);
        Near(v1 * 120 / 480, open.Solution.Voltage(open.Secondary));

        var loaded = Transformer(v1, zp, zl);
        const double a = 480.0 / 120.0;
        Near(v1 / a * zl / (zl + (zp / (a * a))), loaded.Solution.Voltage(loaded.Secondary));
    }

    [Fact]
    public void Solve_ThreeWindingTransformer_BalancesAmpereTurns()
    {
        // A centre-tapped secondary (two 120-turn halves, centre grounded) under a 480-turn primary: each half
        // stands at V1·120/480, the two ends in opposition, and the primary current is the halves' currents times
        // 120/480 (Σ N·I = 0 with the currents into the dotted ends).
        var c = new NodalCircuit();
        var (p, x1, x2) = (c.AddNode("P"), c.AddNode("X1"), c.AddNode("X2"));
        c.AddVoltageSource(p, NodalCircuit.Ground, 480);
        c.AddTransformer(new Winding(p, NodalCircuit.Ground, 480), new Winding(x1, NodalCircuit.Ground, 120), new Winding(NodalCircuit.Ground, x2, 120));
        c.AddImpedance(x1, NodalCircuit.Ground, 6);
        c.AddImpedance(x1, x2, new Complex(8, 6));

        var s = c.Solve();

        Near(120, s.Voltage(x1));
        Near(-120, s.Voltage(x2));
        var half1 = s.ImpedanceCurrent(0) + s.ImpedanceCurrent(1);
        var half2 = -s.ImpedanceCurrent(1);
        Near((half1 - half2) * 120 / 480, s.SourceCurrent(0));
    }

    [Fact]
    public void Solve_MixedUnbalancedCircuit_SourcePowerIsLossesPlusLoads()
    {
        // Conservation of complex power (Tellegen's theorem): what the sources give is what the impedances and loads
        // take; ideal transformers take nothing.
        var c = new NodalCircuit();
        var lines = new int[3];
        var ends = new int[3];
        for (var k = 0; k < 3; k++)
        {
            lines[k] = c.AddNode($"S{k}");
            ends[k] = c.AddNode($"P{k}");
            c.AddVoltageSource(lines[k], NodalCircuit.Ground, 277 * Complex.Pow(A120, k));
            c.AddImpedance(lines[k], ends[k], new Complex(0.02 * (k + 1), 0.01));
        }

        var x = c.AddNode("X");
        var y = c.AddNode("Y");
        c.AddTransformer(new Winding(ends[0], ends[2], 480), new Winding(x, NodalCircuit.Ground, 120));
        c.AddImpedance(x, y, new Complex(0.01, 0.03));
        c.AddLoad(y, NodalCircuit.Ground, LoadModel.ConstantPower, new Complex(9000, 3000), 120);
        c.AddLoad(ends[0], ends[1], LoadModel.ConstantCurrent, new Complex(20_000, 5000), 480);
        c.AddLoad(ends[1], NodalCircuit.Ground, LoadModel.ConstantImpedance, new Complex(7000, 0), 277);

        var s = c.Solve();

        Near(s.TotalLossVa + s.TotalLoadPowerVa, s.TotalSourcePowerVa);
        Near(new Complex(9000, 3000), s.LoadPowerVa(0));
        Assert.InRange(s.Iterations, 2, 100);
    }

    [Fact]
    public void Solve_FloatingNode_Throws()
    {
        var c = new NodalCircuit();
        var (a, b, d) = (c.AddNode("A"), c.AddNode("B"), c.AddNode("D"));
        c.AddVoltageSource(a, NodalCircuit.Ground, 120);
        c.AddImpedance(a, NodalCircuit.Ground, 1);
        c.AddImpedance(b, d, 1);

        Assert.Throws<InvalidOperationException>(() => c.Solve());
    }

    private static (NodalSolution Solution, int Secondary) Transformer(Complex v1, Complex zp, Complex? zl)
    {
        var c = new NodalCircuit();
        var (src, p, x) = (c.AddNode("S"), c.AddNode("P"), c.AddNode("X"));
        c.AddVoltageSource(src, NodalCircuit.Ground, v1);
        c.AddImpedance(src, p, zp);
        c.AddTransformer(new Winding(p, NodalCircuit.Ground, 480), new Winding(x, NodalCircuit.Ground, 120));
        if (zl is { } load)
        {
            c.AddImpedance(x, NodalCircuit.Ground, load);
        }

        return (c.Solve(), x);
    }

    private static void Near(Complex expected, Complex actual, double? scale = null)
    {
        var tolerance = Tolerance * (scale ?? Math.Max(expected.Magnitude, 1e-300));
        Assert.True((expected - actual).Magnitude <= tolerance, $"expected {expected}, got {actual} (difference {(expected - actual).Magnitude:G3})");
    }
}
