using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using DistTree.Codes;
using DistTree.Conductors;
using DistTree.ProjectFiles;
using DistTree.Vocabulary;

namespace DistTree.Cli.Commands;

/// <summary><c>disttree conductors</c>: prints the conductor catalogue the program computes with, and its sources.</summary>
internal static class ConductorsCommand
{
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    public static Command Create(CliContext context)
    {
        var material = new Option<string>("--material") { Description = Words.Listed(Words.Material, "or"), DefaultValueFactory = _ => Words.Material.Of(Material.Copper) };
        material.AcceptOnlyFromAmong([.. Words.Material.Words]);
        var temperature = new Option<double>("--temperature") { CustomParser = InvariantNumber.Parse, Description = "conductor temperature in °C for resistance, above 0 and at most 250", DefaultValueFactory = _ => 75 };
        var raceway = new Option<string>("--raceway") { Description = Words.Listed(Words.Raceway, "or"), DefaultValueFactory = _ => Words.Raceway.Of(Raceway.Pvc) };
        raceway.AcceptOnlyFromAmong([.. Words.Raceway.Words]);
        var frequency = new Option<double>("--frequency") { CustomParser = InvariantNumber.Parse, Description = "supply frequency in Hz, 40 to 70", DefaultValueFactory = _ => 60 };
        var ambient = new Option<double>("--ambient") { CustomParser = InvariantNumber.Parse, Description = "ambient temperature in °C for ampacity, -60 to 90", DefaultValueFactory = _ => 30 };
        var json = new Option<bool>("--json") { Description = "write the catalogue as JSON to standard output" };
        var command = new Command("conductors", "Print the conductor catalogue: size, area, R, X, ampacities, and the source of each column.\n" +
            "Example: disttree conductors --material al --temperature 90 --raceway steel")
        {
            material, temperature, raceway, frequency, ambient, json,
        };
        command.SetAction(parse =>
        {
            // The project file's ranges for the same figures (rules: conductor_temperature, service: frequency_hz, rules: ambient_c).
            var temperatureC = OptionChecks.InRange(parse.GetValue(temperature), ValueRanges.ConductorTemperatureC, "--temperature");
            var frequencyHz = OptionChecks.InRange(parse.GetValue(frequency), ValueRanges.FrequencyHz, "--frequency");
            var ambientC = OptionChecks.InRange(parse.GetValue(ambient), ValueRanges.AmbientC, "--ambient");
            var rows = Rows(
                Words.Material.TryRead(parse.GetValue(material)!, out var metal) ? metal : Material.Copper,
                temperatureC,
                Words.Raceway.TryRead(parse.GetValue(raceway)!, out var kind) ? kind : Raceway.Pvc,
                frequencyHz,
                ambientC);
            if (parse.GetValue(json))
            {
                WriteJson(context.Out, rows, temperatureC, frequencyHz, ambientC);
            }
            else
            {
                WriteTable(context.Out, rows, temperatureC, frequencyHz, ambientC);
            }

            return ExitCodes.Ok;
        });
        return command;
    }

    private static List<CatalogLine> Rows(Material material, double temperatureC, Raceway raceway, double frequencyHz, double ambientC)
    {
        var catalog = ConductorCatalog.Standard;
        var nec = CodeRules.For(Model.ElectricalCode.Nec, catalog); // the catalogue's columns are NEC Table 310.16's
        return catalog.Sizes.Select(size => new CatalogLine(
            size.Text,
            size.AreaMm2,
            size.AreaCmil / 1000.0,
            catalog.DcResistance20OhmPerKm(size, material),
            catalog.DcResistanceBasis(size, material),
            catalog.AcResistanceOhmPerKm(size, material, raceway, temperatureC, frequencyHz),
            catalog.ReactanceOhmPerKm(size, raceway, frequencyHz),
            nec.ThermalAmpacityA(size, material, 60, ambientC),
            nec.ThermalAmpacityA(size, material, 75, ambientC),
            nec.ThermalAmpacityA(size, material, 90, ambientC))).ToList();
    }

    private static void WriteTable(TextWriter o, List<CatalogLine> rows, double temperatureC, double frequencyHz, double ambientC)
    {
        static string F(double? v, string format) => v?.ToString(format, CultureInfo.InvariantCulture) ?? "-";
        o.WriteLine($"Conductor catalogue: R at {F(temperatureC, "0.#")} °C, {F(frequencyHz, "0.#")} Hz; ampacity at {F(ambientC, "0.#")} °C ambient, ≤ 3 current-carrying conductors");
        o.WriteLine($"{"size",-11}{"mm2",9}{"kcmil",9}{"Rdc20",10}{"Rac",10}{"X",9}{"A 60",7}{"A 75",7}{"A 90",7}  R20 basis");
        o.WriteLine($"{"",-11}{"",9}{"",9}{"ohm/km",10}{"ohm/km",10}{"ohm/km",9}");
        foreach (var r in rows)
        {
            o.WriteLine($"{r.Size,-11}{F(r.AreaMm2, "0.00"),9}{F(r.AreaKcmil, "0.00"),9}{F(r.R20OhmPerKm, "0.0000"),10}{F(r.RacOhmPerKm, "0.0000"),10}{F(r.XOhmPerKm, "0.0000"),9}{F(r.Ampacity60A, "0.#"),7}{F(r.Ampacity75A, "0.#"),7}{F(r.Ampacity90A, "0.#"),7}  {r.R20Basis}");
        }

        o.WriteLine();
        o.WriteLine($"Sources ({ConductorCatalog.Standard.SourceName}):");
        foreach (var line in ConductorCatalog.Standard.Header)
        {
            o.WriteLine("  " + line);
        }

        o.WriteLine("Physics: R20 = ρ20/A × 1.02 stranding (IACS copper 1/58, aluminium 61 % IACS); R(T) = R20·(1 + α20·(T − 20)),");
        o.WriteLine("α20 copper 0.00393, aluminium 0.00403; AC resistance by IEC 60287-1-1 skin and proximity effect.");
        o.WriteLine("A design aid: the code in force and the authority having jurisdiction decide; a qualified person reviews the design.");
    }

    private static void WriteJson(TextWriter o, List<CatalogLine> rows, double temperatureC, double frequencyHz, double ambientC)
    {
        var document = new
        {
            format = "disttree-conductors/1",
            temperature_c = temperatureC,
            frequency_hz = frequencyHz,
            ambient_c = ambientC,
            source = ConductorCatalog.Standard.SourceName,
            sources = ConductorCatalog.Standard.Header,
            conductors = rows.Select(r => new
            {
                size = r.Size,
                area_mm2 = r.AreaMm2,
                area_kcmil = r.AreaKcmil,
                resistance_dc_20c_ohm_per_km = r.R20OhmPerKm,
                resistance_dc_20c_basis = r.R20Basis,
                resistance_ac_ohm_per_km = r.RacOhmPerKm,
                reactance_ohm_per_km = r.XOhmPerKm,
                ampacity_60c_a = r.Ampacity60A,
                ampacity_75c_a = r.Ampacity75A,
                ampacity_90c_a = r.Ampacity90A,
            }),
        };
        o.WriteLine(JsonSerializer.Serialize(document, Indented));
    }

    private sealed record CatalogLine(
        string Size, double AreaMm2, double AreaKcmil, double R20OhmPerKm, string R20Basis, double RacOhmPerKm, double XOhmPerKm,
        double? Ampacity60A, double? Ampacity75A, double? Ampacity90A);
}
