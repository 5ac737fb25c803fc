using DistTree.Conductors;
using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Generating;

/// <summary>A branch circuit of a generated project as it is invented and sized, before it is written.</summary>
internal sealed class PlannedCircuit(string name, int poles, LoadKind kind, double value, double pf, bool continuous, double minimumOcpdA, double lengthFt)
{
    public int Id { get; set; }

    public string Name { get; } = name;

    public int Poles { get; } = poles;

    /// <summary>The load as the file states it.</summary>
    public Load Load { get; } = new(kind, value, pf);

    public bool Continuous { get; } = continuous;

    public double MinimumOcpdA { get; } = minimumOcpdA;

    public double LengthFt { get; set; } = lengthFt;

    public CircuitSupply Supply { get; set; }

    public ComplexPower Power { get; set; }

    public double CurrentA { get; set; }

    public bool Failing { get; set; }

    public double FailPercent { get; set; }

    public double OcpdA { get; set; }

    public ConductorSize Size { get; set; }

    public int Sets { get; set; } = 1;
}
