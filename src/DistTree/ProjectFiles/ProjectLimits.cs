namespace DistTree.ProjectFiles;

/// <summary>
/// The bounds within which the loader reads any input, however hostile, in bounded time and memory
/// (docs/limits.md). Input beyond a bound is a located error, never a hang or a crash.
/// </summary>
public static class ProjectLimits
{
    /// <summary>The largest project file read, in bytes (64 MiB); a larger file is refused before it is read.</summary>
    public const long MaxFileBytes = 64L * 1024 * 1024;

    /// <summary>
    /// The deepest nesting of YAML mappings and sequences (64 levels). A project needs six
    /// (file, equipment, item, circuits, circuit, run); deeper input stops the read with an error.
    /// </summary>
    public const int MaxDepth = 64;

    /// <summary>The longest scalar (a name, an id, a number), in characters (65,536).</summary>
    public const int MaxScalarLength = 65_536;

    /// <summary>
    /// The most characters of a value a message repeats (40), from the value's first line only: a message shows
    /// where the file is wrong, never the file itself (a key file included by mistake, say).
    /// </summary>
    public const int MaxEchoedLength = 40;

    /// <summary>
    /// The longest id (of the service, of equipment, of a circuit, and in <c>from</c>), in characters (200). Ids are
    /// compared with one another for "did you mean" hints and shown in every message about their entry.
    /// </summary>
    public const int MaxIdLength = 200;

    /// <summary>
    /// The work the "did you mean" hints for sources that are not defined may do in all: 20,000,000 cells of the
    /// distances' tables (and characters compared for a shortened word), about a fifth of a second; the errors past it
    /// carry no hint.
    /// </summary>
    public const long MaxHintWork = 20_000_000;

    /// <summary>How many members of a feed cycle its error names (10); the rest are counted.</summary>
    public const int MaxCycleNames = 10;

    /// <summary>
    /// How many errors, and separately how many warnings, are reported (200 each); the rest are counted
    /// in one closing diagnostic.
    /// </summary>
    public const int MaxDiagnostics = 200;
}
