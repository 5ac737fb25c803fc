using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// What the section readers share while one project is read: the diagnostics, the typed-value reader, the
/// draft (whose units and conductor defaults the runs read), and the small checks every section makes.
/// </summary>
internal sealed class SectionContext(DiagnosticBag bag)
{
    /// <summary>The temperature ratings a conductor's insulation or a terminal may have, °C.</summary>
    public static readonly int[] TemperatureRatings = [60, 75, 90];

    /// <summary>Where every error and warning goes.</summary>
    public DiagnosticBag Bag => bag;

    /// <summary>Typed values from scalars.</summary>
    public ValueReader Values { get; } = new(bag);

    /// <summary>The project read so far (the main file's sections, then its included files' equipment).</summary>
    public ProjectDraft Draft { get; set; } = new();

    /// <summary>
    /// The node as a mapping with its allowed keys checked, or null when absent or not a mapping (then reported as
    /// <paramref name="what"/> unless already reported); <paramref name="context"/> names it in messages about its keys.
    /// </summary>
    public MappingReader? Map(SourceNode? node, Subject what, Subject context, string[] keys)
    {
        if (node is null)
        {
            return null;
        }

        if (node is SourceMapping mapping)
        {
            return new MappingReader(mapping, context, keys, bag);
        }

        if (!node.IsInvalid)
        {
            bag.Error(node.Location, ProjectMessages.NotAMapping(what, node));
        }

        return null;
    }

    /// <summary>An optional key's value as a number in <paramref name="range"/>, named <c>'key'</c> in messages.</summary>
    public double? InRange(in MappingReader m, string key, NumberRange range) =>
        m.Optional(key) is { } node ? Values.InRange(node, $"'{key}'", range) : null;

    /// <summary>
    /// An id: text without '/' (which joins a panel's id and a circuit's), of at most
    /// <see cref="ProjectLimits.MaxIdLength"/> characters, and without the characters an output would show escaped
    /// (<see cref="Diagnostics.DisplayText"/>: control characters, line separators, direction marks).
    /// </summary>
    public string? Id(SourceNode node, string what)
    {
        var id = IdReference(node, what);
        if (id is not null && id.Contains('/', StringComparison.Ordinal))
        {
            bag.Error(node.Location, ProjectMessages.IdWithSlash(id));
            return null;
        }

        if (id is not null && Diagnostics.DisplayText.NeedsEscape(id))
        {
            bag.Error(node.Location, ProjectMessages.IdWithControl(id));
            return null;
        }

        return id;
    }

    /// <summary>Text naming an id (<c>from</c>), of at most <see cref="ProjectLimits.MaxIdLength"/> characters.</summary>
    public string? IdReference(SourceNode node, Subject what)
    {
        var id = Values.Text(node, what);
        if (id is { Length: > ProjectLimits.MaxIdLength })
        {
            bag.Error(node.Location, ProjectMessages.IdTooLong(what, id.Length));
            return null;
        }

        return id;
    }

    /// <summary>The id a mapping gives, before its keys are checked (to name it in their messages); null when none.</summary>
    public static string? PeekId(SourceMapping mapping)
    {
        foreach (var entry in mapping.Entries)
        {
            if (entry.Key.Value == "id")
            {
                // An id too long to be one (reported where it is read) is named by its start in messages about its entry.
                return entry.Value is SourceScalar { IsNull: false } scalar && scalar.Value.Trim() is { Length: > 0 } id
                    ? (id.Length > ProjectLimits.MaxIdLength ? scalar.Echo() : id)
                    : null;
            }
        }

        return null;
    }
}
