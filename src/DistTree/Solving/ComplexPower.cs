namespace DistTree.Solving;

/// <summary>Complex power S = P + jQ: real power in watts and reactive power in vars (lagging positive).</summary>
/// <param name="Watts">Real power P in W.</param>
/// <param name="Vars">Reactive power Q in var; positive for a lagging (inductive) load.</param>
public readonly record struct ComplexPower(double Watts, double Vars)
{
    /// <summary>No power.</summary>
    public static ComplexPower Zero => default;

    /// <summary>Apparent power |S| in VA.</summary>
    public double VoltAmperes => Math.Sqrt((Watts * Watts) + (Vars * Vars));

    /// <summary>Power factor P/|S|; 1 for no load.</summary>
    public double PowerFactor => VoltAmperes > 0 ? Watts / VoltAmperes : 1.0;

    /// <summary>sin θ = Q/|S|; 0 for no load.</summary>
    public double SinTheta => VoltAmperes > 0 ? Vars / VoltAmperes : 0.0;

    /// <summary>Power of <paramref name="voltAmperes"/> at a lagging power factor <paramref name="powerFactor"/>.</summary>
    public static ComplexPower FromApparent(double voltAmperes, double powerFactor) =>
        new(voltAmperes * powerFactor, voltAmperes * Math.Sqrt(Math.Max(0, 1 - (powerFactor * powerFactor))));

    /// <summary>Phasor sum.</summary>
    public static ComplexPower operator +(ComplexPower a, ComplexPower b) => new(a.Watts + b.Watts, a.Vars + b.Vars);

    /// <summary>Scaling, e.g. by a demand factor.</summary>
    public static ComplexPower operator *(ComplexPower a, double factor) => new(a.Watts * factor, a.Vars * factor);

    /// <summary>Phasor sum (for languages without operators).</summary>
    public static ComplexPower Add(ComplexPower a, ComplexPower b) => a + b;

    /// <summary>Scaling (for languages without operators).</summary>
    public static ComplexPower Multiply(ComplexPower a, double factor) => a * factor;
}
