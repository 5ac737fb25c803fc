using System.Numerics;
using DistTree.Model;

namespace DistTree.Tests.Solving.Reference;

/// <summary>Transformers as ideal windings and leakage impedances (issue 17's conventions).</summary>
internal sealed partial class ProjectCircuit
{
    // A transformer between its primary bus and a new secondary bus whose neutral (a delta's or a 240 V two-wire
    // system's virtual star point or midpoint) is grounded. The primary turns carry the nameplate tap: +2.5 % more
    // turns, so 1/1.025 of the rated secondary voltage at rated primary voltage.
    private Bus AddTransformer(Equipment equipment, TransformerData transformer, Bus primary)
    {
        var secondary = transformer.Secondary;
        var lines = new int[PhaseRules.Lines(secondary)];
        for (var k = 0; k < lines.Length; k++)
        {
            lines[k] = Circuit.AddNode($"{equipment.Id}.x{k + 1}");
        }

        var bus = new Bus(lines, NodalCircuit.Ground);
        var tap = 1 + (transformer.TapPercent / 100);
        var angle = Complex.FromPolarCoordinates(1, Math.Atan(transformer.XOverR));
        var va = transformer.Kva * 1000;
        if (secondary.Phases == 3)
        {
            AddDyn1(equipment, transformer, primary, bus, tap, angle, va);
        }
        else
        {
            AddSinglePhase(equipment, transformer, primary, bus, tap, angle, va);
        }

        return bus;
    }

    // Dyn1: primary windings a across A–C, b across B–A, c across C–B; secondary winding x from the grounded neutral
    // to line x, so E_a = (V_A − V_C)·(V_LN,sec/V_LL,pri)/(1 + tap/100) with V_LN,sec = V_LL,sec/√3, the line-to-neutral
    // base (so 208 V line to line at no load and tap 0), lagging the primary by 30°; leakage per phase
    // on the secondary side (%Z/100)·V_LL,sec²/S at angle atan(X/R).
    private void AddDyn1(Equipment equipment, TransformerData transformer, Bus primary, Bus secondary, double tap, Complex angle, double va)
    {
        if (primary.Lines.Length != 3)
        {
            throw new NotSupportedException($"'{equipment.Id}': a three-phase transformer on a single-phase primary");
        }

        var primaryTurns = equipment.System.LineToLineV!.Value * tap;
        var secondaryLineToLine = transformer.Secondary.LineToLineV!.Value;
        var secondaryTurns = secondaryLineToLine / Math.Sqrt(3);
        var leakage = transformer.ImpedancePercent / 100 * secondaryLineToLine * secondaryLineToLine / va * angle;
        for (var k = 0; k < 3; k++)
        {
            var emf = Circuit.AddNode($"{equipment.Id}.e{k + 1}");
            Circuit.AddTransformer(
                new Winding(primary.Lines[k], primary.Lines[(k + 2) % 3], primaryTurns),
                new Winding(emf, NodalCircuit.Ground, secondaryTurns));
            Circuit.AddImpedance(emf, secondary.Lines[k], leakage);
        }
    }

    // One core: the primary across two primary lines (stated, AB by default, on a three-phase primary; lines 1–2 of a
    // two-line primary; line to neutral of a one-line primary), and the secondary as its system says.
    private void AddSinglePhase(Equipment equipment, TransformerData transformer, Bus primary, Bus secondary, double tap, Complex angle, double va)
    {
        var (p, q, ratedV) = PrimaryTerminals(equipment, transformer, primary);
        var primaryTurns = ratedV * tap;
        var system = transformer.Secondary;
        var volts = system.NominalV;
        var full = transformer.ImpedancePercent / 100 * volts * volts / va * angle;
        var x = secondary.Lines;
        switch (x.Length)
        {
            case 2 when system.HasNeutral:
                {
                    // Centre-tapped 120/240: a primary-side impedance of 0.5·R + j0.8·X referred to the full winding
                    // (so scaled by the turns ratio squared on the primary side) and 0.25·R + j0.1·X in each half winding:
                    // 240 V loads see R + jX, 120 V loads 1.5·%R and 1.2·%X on the rating (common practice, no source).
                    var ratio = primaryTurns / volts;
                    var inner = Circuit.AddNode($"{equipment.Id}.p");
                    Circuit.AddImpedance(p, inner, new Complex(0.5 * full.Real, 0.8 * full.Imaginary) * ratio * ratio);
                    var (e1, e2) = (Circuit.AddNode($"{equipment.Id}.e1"), Circuit.AddNode($"{equipment.Id}.e2"));
                    Circuit.AddTransformer(
                        new Winding(inner, q, primaryTurns),
                        new Winding(e1, NodalCircuit.Ground, volts / 2),
                        new Winding(NodalCircuit.Ground, e2, volts / 2));
                    var half = new Complex(0.25 * full.Real, 0.1 * full.Imaginary);
                    Circuit.AddImpedance(e1, x[0], half);
                    Circuit.AddImpedance(e2, x[1], half);
                    break;
                }

            case 2:
                {
                    // 240 V two-wire: one winding about a grounded virtual midpoint (two halves), its leakage split between the lines.
                    var (e1, e2) = (Circuit.AddNode($"{equipment.Id}.e1"), Circuit.AddNode($"{equipment.Id}.e2"));
                    Circuit.AddTransformer(
                        new Winding(p, q, primaryTurns),
                        new Winding(e1, NodalCircuit.Ground, volts / 2),
                        new Winding(NodalCircuit.Ground, e2, volts / 2));
                    Circuit.AddImpedance(e1, x[0], full / 2);
                    Circuit.AddImpedance(e2, x[1], full / 2);
                    break;
                }

            default:
                {
                    // A one-line secondary (120, 230): line to the grounded neutral, the whole leakage in the line.
                    var e1 = Circuit.AddNode($"{equipment.Id}.e1");
                    Circuit.AddTransformer(new Winding(p, q, primaryTurns), new Winding(e1, NodalCircuit.Ground, volts));
                    Circuit.AddImpedance(e1, x[0], full);
                    break;
                }
        }
    }

    private static (int P, int Q, double RatedV) PrimaryTerminals(Equipment equipment, TransformerData transformer, Bus primary)
    {
        var system = equipment.System;
        var lines = primary.Lines;
        switch (lines.Length)
        {
            case 3:
                var (first, second) = transformer.PrimaryPhases switch
                {
                    Phases.AB => (0, 1),
                    Phases.BC => (1, 2),
                    Phases.CA => (2, 0),
                    var other => throw new NotSupportedException($"'{equipment.Id}': primary lines {other}"),
                };
                return (lines[first], lines[second], system.LineToLineV!.Value);
            case 2:
                return (lines[0], lines[1], system.LineToLineV!.Value);
            default:
                if (primary.Neutral < 0)
                {
                    throw new InvalidOperationException($"'{equipment.Id}': a one-line primary without a neutral");
                }

                return (lines[0], primary.Neutral, system.LineToNeutralV!.Value);
        }
    }
}
