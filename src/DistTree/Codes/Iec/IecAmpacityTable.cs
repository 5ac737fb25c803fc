using System.Globalization;
using DistTree.Conductors;
using DistTree.Model;
using DistTree.Vocabulary;

namespace DistTree.Codes.Iec;

/// <summary>
/// IEC 60364-5-52's current-carrying capacities by material, insulation, loaded conductors and reference method, read
/// from the rule set's data file <c>Codes/Iec/Data/iec-ampacity.tsv</c> (embedded; its header names the source table of
/// each row; every figure recalled from memory, not read: verify against the edition in force).
/// </summary>
public sealed class IecAmpacityTable
{
    private const string ResourceName = "DistTree.Codes.Iec.Data.iec-ampacity.tsv";

    private readonly Dictionary<(Material Material, int InsulationC, int Loaded, InstallationMethod Method), double?[]> _columns;

    private IecAmpacityTable(Dictionary<(Material, int, int, InstallationMethod), double?[]> columns, IReadOnlyList<string> header)
    {
        _columns = columns;
        Header = header;
    }

    /// <summary>The table embedded in the library.</summary>
    public static IecAmpacityTable Standard { get; } = LoadEmbedded();

    /// <summary>The data file's header comment: what each column is and where its figures come from.</summary>
    public IReadOnlyList<string> Header { get; }

    /// <summary>
    /// The tabulated capacity, amperes (30 °C air, one circuit), of <paramref name="size"/> in <paramref name="material"/>
    /// with insulation <paramref name="insulationC"/> (75: PVC 70 °C; 90: XLPE) installed as <paramref name="installation"/>
    /// says (loaded conductors 2, or 3 for any other count); null where the table holds none (not a metric size, 60 °C,
    /// aluminium, a blank cell).
    /// </summary>
    public double? AmpacityA(ConductorSize size, Material material, int insulationC, Installation installation)
    {
        var loaded = installation.LoadedConductors == 2 ? 2 : 3;
        return size.Kind == SizeKind.Metric && _columns.TryGetValue((material, insulationC, loaded, installation.Method), out var column)
            ? column[size.Index]
            : null;
    }

    /// <summary>Reads a table in the embedded file's layout; throws <see cref="FormatException"/> naming the line.</summary>
    public static IecAmpacityTable Load(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var header = new List<string>();
        var columns = new Dictionary<(Material, int, int, InstallationMethod), double?[]>();
        ConductorSize[]? sizes = null;
        var lineNumber = 0;
        while (reader.ReadLine() is { } line)
        {
            lineNumber++;
            if (line.StartsWith('#'))
            {
                header.Add(line);
                continue;
            }

            if (line.Length == 0)
            {
                continue;
            }

            var cells = line.Split('\t');
            if (sizes is null)
            {
                sizes = [.. cells.Skip(4).Select(c => ConductorSize.TryParse(c, out var s, out _) ? s : throw Bad(lineNumber, $"'{c}' is not a size"))];
                continue;
            }

            if (cells.Length > sizes.Length + 4 || cells.Length < 5)
            {
                throw Bad(lineNumber, "a row needs its material, insulation, loaded conductors, method and figures");
            }

            var key = (
                Words.Material.TryRead(cells[0], out var material) ? material : throw Bad(lineNumber, $"'{cells[0]}' is not a material"),
                int.Parse(cells[1], CultureInfo.InvariantCulture),
                int.Parse(cells[2], CultureInfo.InvariantCulture),
                Words.InstallationMethod.TryRead(cells[3], out var method) ? method : throw Bad(lineNumber, $"'{cells[3]}' is not a reference method"));
            var column = new double?[ConductorSize.All.Count];
            for (var i = 4; i < cells.Length; i++)
            {
                column[sizes[i - 4].Index] = cells[i].Length == 0 ? null : double.Parse(cells[i], NumberStyles.Float, CultureInfo.InvariantCulture);
            }

            if (!columns.TryAdd(key, column))
            {
                throw Bad(lineNumber, "a second row for the same material, insulation, loaded conductors and method");
            }
        }

        return new IecAmpacityTable(columns, header);
    }

    private static FormatException Bad(int line, string message) => new($"iec-ampacity.tsv:{line}: {message}");

    private static IecAmpacityTable LoadEmbedded()
    {
        using var stream = typeof(IecAmpacityTable).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"embedded resource {ResourceName} is missing");
        using var reader = new StreamReader(stream);
        return Load(reader);
    }
}
