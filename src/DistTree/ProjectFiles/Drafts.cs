using DistTree.Diagnostics;
using DistTree.Model;

namespace DistTree.ProjectFiles;

/// <summary>What the reader took from the file before the tree checks; null fields were missing or wrong (reported).</summary>
internal sealed class ProjectDraft
{
    public string? Name { get; set; }

    public string Description { get; set; } = "";

    public UnitSystem Units { get; set; } = UnitSystem.Metric;

    public Rules Rules { get; set; } = Rules.Default;

    public ConductorDefaults Defaults { get; set; } = ConductorDefaults.Standard;

    public SizingOptions Sizing { get; set; } = SizingOptions.Default;

    public Service? Service { get; set; }

    public List<EquipmentDraft> Equipment { get; } = [];

    /// <summary>The main file's <c>include</c> entries, in file order.</summary>
    public List<IncludeEntry> Includes { get; } = [];

    /// <summary><c>rules: conductor_catalog:</c>, the path as written and where its key is; null when not given.</summary>
    public IncludeEntry? CatalogFile { get; set; }

    /// <summary><c>rules: grounding_table:</c>, the path as written and where its key is; null when not given.</summary>
    public IncludeEntry? GroundingTableFile { get; set; }

    /// <summary><c>sizing: terminal_table:</c>, the path as written and where its key is; null when not given.</summary>
    public IncludeEntry? TerminalTableFile { get; set; }
}

/// <summary>One entry of an <c>include</c> list: the path as written and where it is written.</summary>
internal sealed record IncludeEntry(string Path, SourceLocation Location);

/// <summary>One equipment entry as read.</summary>
internal sealed class EquipmentDraft(SourceLocation location)
{
    public SourceLocation Location { get; } = location;

    public string? Id { get; set; }

    public SourceLocation IdLocation { get; set; } = location;

    public EquipmentKind? Kind { get; set; }

    public string? From { get; set; }

    public SourceLocation FromLocation { get; set; } = location;

    /// <summary>False when the feeder was given but could not be read.</summary>
    public bool FeederOk { get; set; } = true;

    public Run? Feeder { get; set; }

    /// <summary>Where the feeder states its 'neutral_size' (the key), or null when it states none.</summary>
    public SourceLocation? FeederNeutralLocation { get; set; }

    public double DemandFactor { get; set; } = 1.0;

    public double? InterruptingKa { get; set; }

    public double? MainA { get; set; }

    /// <summary>Transformer data; null when not a transformer or when it could not be read.</summary>
    public TransformerData? Transformer { get; set; }

    public ElectricalSystem? Primary { get; set; }

    public SourceLocation PrimaryLocation { get; set; } = location;

    /// <summary>Where a transformer states its 'secondary' (the key).</summary>
    public SourceLocation SecondaryLocation { get; set; } = location;

    /// <summary>Where a transformer states its primary lines, 'phase' (the key), or null when it states none.</summary>
    public SourceLocation? PrimaryPhasesLocation { get; set; }

    public List<CircuitDraft> Circuits { get; } = [];

    /// <summary>The system its feeder carries, set by the tree checks once its source is known.</summary>
    public ElectricalSystem? System { get; set; }

    /// <summary>What it distributes: a transformer's secondary, else its own system.</summary>
    public ElectricalSystem? OutputSystem => Kind == EquipmentKind.Transformer ? Transformer?.Secondary : System;
}

/// <summary>One circuit entry as read.</summary>
internal sealed class CircuitDraft(SourceLocation location)
{
    public SourceLocation Location { get; } = location;

    public string? Id { get; set; }

    public string Name { get; set; } = "";

    public int? Poles { get; set; }

    public SourceLocation PolesLocation { get; set; } = location;

    public Phases? StatedPhases { get; set; }

    public SourceLocation PhaseLocation { get; set; } = location;

    public Load? Load { get; set; }

    /// <summary>The <c>category</c> stated, when it is.</summary>
    public LoadCategory? Category { get; set; }

    /// <summary>Loads along the run, when given instead of a load at the end.</summary>
    public IReadOnlyList<LoadPoint> Points { get; set; } = [];

    public SourceLocation? PointsLocation { get; set; }

    public bool Continuous { get; set; }

    public Run? Run { get; set; }
}
