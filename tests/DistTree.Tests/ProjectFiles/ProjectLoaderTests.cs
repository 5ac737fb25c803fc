using System.Security.Cryptography;
using System.Text;
using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>ProjectLoader's mapping of good files into the model.</summary>
public sealed class ProjectLoaderTests
{
    // 1 ft = 0.3048 m exactly: international yard and pound agreement (1959), common practice.
    [Theory]
    [InlineData("imperial", "100", 30.48)]
    [InlineData("metric", "100", 100.0)]
    [InlineData("metric", "\"92 ft\"", 28.0416)]
    [InlineData("imperial", "\"28 m\"", 28.0)]
    [InlineData("imperial", "10ft", 3.048)]
    [InlineData("metric", "2.5e1", 25.0)]
    public void Parse_Length_ConvertsToMetres(string units, string length, double expectedM)
    {
        var project = ProjectLoader.Parse(ProjectText.Minimal(units: units, feeder: $"{{ length: {length}, size: 2 AWG }}"), "t.yaml");

        Assert.Equal(expectedM, project.Equipment[0].Feeder!.LengthM, 9);
        Assert.Equal(units == "imperial" ? UnitSystem.Imperial : UnitSystem.Metric, project.Units);
    }

    [Fact]
    public void Parse_Defaults_AppliedToEveryRunUnlessTheRunSaysOtherwise()
    {
        var text = ProjectText.Minimal(
            extraTop: "defaults: { material: al, insulation_c: 90, raceway: steel }\n",
            circuit: "poles: 1\n        load: { va: 1000 }\n        run: { length: 20, size: 12 AWG, material: cu, raceway: pvc }");

        var project = ProjectLoader.Parse(text, "t.yaml");
        var feeder = project.Equipment[0].Feeder!;
        var branch = project.Equipment[0].Circuits[0].Run;

        Assert.Equal((Material.Aluminum, 90, Raceway.Steel), (feeder.Material, feeder.InsulationC, feeder.Raceway));
        Assert.Equal((Material.Copper, 90, Raceway.Pvc), (branch.Material, branch.InsulationC, branch.Raceway));
        Assert.Equal(new ConductorDefaults(Material.Aluminum, 90, Raceway.Steel), project.Defaults);
    }

    [Fact]
    public void Parse_NoDefaults_UsesCopper75Pvc()
    {
        var run = ProjectLoader.Parse(ProjectText.Minimal(), "t.yaml").Equipment[0].Feeder!;

        Assert.Equal((Material.Copper, 75, Raceway.Pvc, 1), (run.Material, run.InsulationC, run.Raceway, run.Sets));
    }

    [Fact]
    public void Parse_CircuitOcpd_GoesIntoItsRun()
    {
        var circuit = ProjectLoader.Parse(ProjectText.Minimal(), "t.yaml").Equipment[0].Circuits[0];

        Assert.Equal(20.0, circuit.Run.OcpdA);
        Assert.Equal("LP1/1", circuit.FullId);
    }

    // Circuit voltages of a 208Y/120 system: 120 V line-to-neutral, 208 V line-to-line (common practice).
    [Theory]
    [InlineData("208Y/120", 1, 120.0, 1)]
    [InlineData("208Y/120", 2, 208.0, 1)]
    [InlineData("208Y/120", 3, 208.0, 3)]
    [InlineData("120/240", 1, 120.0, 1)]
    [InlineData("120/240", 2, 240.0, 1)]
    [InlineData("480D", 3, 480.0, 3)]
    [InlineData("480D", 2, 480.0, 1)]
    public void Parse_CircuitSupply_FollowsPanelSystemAndPoles(string system, int poles, double volts, int phases)
    {
        var text = ProjectText.Minimal(system: system, circuit: $"poles: {poles}\n        load: {{ va: 1000 }}\n        run: {{ length: 20, size: 12 AWG }}");

        var circuit = ProjectLoader.Parse(text, "t.yaml").Equipment[0].Circuits[0];

        Assert.Equal(new CircuitSupply(volts, phases), circuit.Supply);
    }

    [Fact]
    public void Parse_Transformer_FeedsItsSecondaryToWhatItFeeds()
    {
        var text = """
            disttree: 1
            project: { name: T }
            service: { id: SVC, system: 480Y/277 }
            equipment:
              - id: LP1
                kind: panelboard
                from: T1
                feeder: { length: 3, size: 250 kcmil }
                circuits:
                  - { id: 1, poles: 1, load: { kva: 1.2, pf: 0.9 }, run: { length: 10, size: 12 AWG } }
              - id: T1
                kind: transformer
                from: MSB
                kva: 75
                primary: 480Y/277
                secondary: 208Y/120
                impedance_percent: 5
                x_r: 4
                tap_percent: 2.5
                feeder: { length: 40, size: 1 AWG, ocpd: 125 }
              - { id: MSB, kind: switchboard, from: SVC }
            """;

        var project = ProjectLoader.Parse(text, "t.yaml");
        var panel = project.Equipment.Single(e => e.Id == "LP1");
        var transformer = project.Equipment.Single(e => e.Id == "T1");

        Assert.Equal("480Y/277", transformer.System.Name);
        Assert.Equal("208Y/120", transformer.OutputSystem.Name);
        Assert.Equal(new TransformerData(75, ElectricalSystem.Find("208Y/120")!, 5, 4, 2.5), transformer.Transformer);
        Assert.Equal("208Y/120", panel.System.Name);
        Assert.Equal(new CircuitSupply(120, 1), panel.Circuits[0].Supply);
        Assert.Equal(new Load(LoadKind.Kva, 1.2, 0.9), panel.Circuits[0].Load);
        Assert.Null(project.Equipment.Single(e => e.Id == "MSB").Feeder);
        Assert.Equal(["LP1", "T1", "MSB"], project.Equipment.Select(e => e.Id));
    }

    [Fact]
    public void Parse_Rules_ReadsEveryRule()
    {
        var text = ProjectText.Minimal(extraTop: """
            rules:
              feeder_limit_percent: 2
              branch_limit_percent: 2.5
              total_limit_percent: 4
              branch_current: lesser
              conductor_temperature: 60
              transformer_drop: new_origin
              ambient_c: 40
              terminal_c: 60

            """);

        var rules = ProjectLoader.Parse(text, "t.yaml").Rules;

        Assert.Equal(new Rules
        {
            FeederLimitPercent = 2,
            BranchLimitPercent = 2.5,
            TotalLimitPercent = 4,
            BranchCurrent = BranchCurrentBasis.Lesser,
            Temperature = TemperatureMode.Fixed,
            FixedTemperatureC = 60,
            TransformerDrop = TransformerDropMode.NewOrigin,
            AmbientC = 40,
            TerminalC = 60,
        }, rules);
    }

    [Fact]
    public void Parse_RunOptions_AreRead()
    {
        var run = ProjectLoader.Parse(ProjectText.Minimal(feeder: "{ length: 20, size: 500 kcmil, sets: 2, ocpd: 800, limit_percent: 1.5, fixed: true }"), "t.yaml")
            .Equipment[0].Feeder!;

        Assert.Equal((ConductorSize.Parse("500 kcmil"), 2, 800.0, 1.5, true), (run.Size, run.Sets, run.OcpdA!.Value, run.LimitPercent!.Value, run.Fixed));
    }

    [Fact]
    public void Parse_SizeLocation_PointsAtTheSizeScalar()
    {
        var text = ProjectText.Minimal();
        var project = ProjectLoader.Parse(text, "t.yaml");
        var lines = text.Split('\n');

        foreach (var run in new[] { project.Equipment[0].Feeder!, project.Equipment[0].Circuits[0].Run })
        {
            var at = run.SizeLocation;
            Assert.Equal("t.yaml", at.File);
            Assert.StartsWith(run.Size.Text, lines[at.Line - 1][(at.Column - 1)..], StringComparison.Ordinal);
            Assert.Equal('{', lines[run.Location.Line - 1][run.Location.Column - 1]);
        }
    }

    [Fact]
    public void Parse_Locations_AreOneBasedLineAndColumn()
    {
        var project = ProjectLoader.Parse(ProjectText.Minimal(), "t.yaml");

        Assert.Equal(new SourceLocation("t.yaml", 6, 3), project.Service.Location);
        Assert.Equal(new SourceLocation("t.yaml", 9, 5), project.Equipment[0].Location);
        Assert.Equal(new SourceLocation("t.yaml", 14, 9), project.Equipment[0].Circuits[0].Location);
    }

    [Fact]
    public void Parse_Sha256_IsLowerHexOfTheUtf8Bytes()
    {
        var text = ProjectText.Minimal();
        var expected = Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(text))).ToLowerInvariant();

        var project = ProjectLoader.Parse(text, "t.yaml");

        Assert.Equal(expected, project.Sha256);
        Assert.Matches("^[0-9a-f]{64}$", project.Sha256);
    }

    [Fact]
    public void Load_File_HashesItsBytesAndNamesThePathAsGiven()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.yaml");
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(ProjectText.Minimal())).ToArray();
        File.WriteAllBytes(path, bytes);
        try
        {
            var project = ProjectLoader.Load(path);

            Assert.Equal(Convert.ToHexString(SHA256.HashData(bytes)).ToLowerInvariant(), project.Sha256);
            Assert.Equal(path, project.File);
            Assert.Equal(path, project.Service.Location.File);
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Load_AnyFile_NeverWritesIt()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.yaml");
        File.WriteAllText(path, ProjectText.Minimal(units: "metrik"));
        var written = new DateTime(2020, 1, 2, 3, 4, 5, DateTimeKind.Utc);
        File.SetLastWriteTimeUtc(path, written);
        var before = File.ReadAllBytes(path);
        try
        {
            Assert.Throws<ProjectException>(() => ProjectLoader.Load(path));
            File.WriteAllText(path, ProjectText.Minimal());
            File.SetLastWriteTimeUtc(path, written);
            before = File.ReadAllBytes(path);
            ProjectLoader.Load(path);

            Assert.Equal(before, File.ReadAllBytes(path));
            Assert.Equal(written, File.GetLastWriteTimeUtc(path));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Load_NotUtf8_ReportsAtTheFirstBadByte()
    {
        var path = Path.Combine(Path.GetTempPath(), $"disttree-{Guid.NewGuid():N}.yaml");
        File.WriteAllBytes(path, [0x64, 0xff, 0xfe, 0x0a]);
        try
        {
            var error = Assert.Throws<ProjectException>(() => ProjectLoader.Load(path));
            Assert.Equal(
                $"{path}:1:2: error: the file is not UTF-8 text: the byte 0xFF at offset 1 does not decode; save the file as UTF-8",
                Assert.Single(error.Diagnostics).ToString());
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Parse_LongBranchAndHighDemandFactor_AreWarningsNotErrors()
    {
        var text = ProjectText.Minimal(
            units: "imperial",
            extraPanel: "    demand_factor: 1.25\n",
            circuit: "poles: 1\n        load: { va: 1000 }\n        run: { length: 2100, size: 12 AWG }");

        var project = ProjectLoader.Parse(text, "t.yaml");

        Assert.Equal(
            [
                "t.yaml:13:20: warning: the demand factor of 'LP1' is 1.25, above 1: it raises the load it applies to",
                // 2100 ft as written (640.08 m, 1 ft = 0.3048 m exactly, NIST SP 811 Appendix B.8), in the project's feet.
                "t.yaml:18:24: warning: the run of circuit 'LP1/1' is 2100 ft long, more than 2000 ft (609.6 m); check the length",
            ],
            project.Warnings.Select(w => w.ToString()));
    }

    [Fact]
    public void Parse_BranchOfExactly2000Feet_HasNoWarning()
    {
        var text = ProjectText.Minimal(units: "imperial", circuit: "poles: 1\n        load: { va: 1000 }\n        run: { length: 2000, size: 12 AWG }");

        Assert.Empty(ProjectLoader.Parse(text, "t.yaml").Warnings);
    }

    [Fact]
    public void Parse_ErrorsWithWarnings_ReportsBothInFileOrder()
    {
        var text = ProjectText.Minimal(units: "metrik", extraPanel: "    demand_factor: 2\n");

        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));

        Assert.Equal([Severity.Error, Severity.Warning], error.Diagnostics.Select(d => d.Severity));
    }

    [Theory]
    [InlineData("load: { amps: 16, pf: 0.8 }", LoadKind.Amps, 16, 0.8)]
    [InlineData("load: { kw: 1.5 }", LoadKind.Kw, 1.5, 1.0)]
    [InlineData("load: { hp: 2, pf: 0.85 }", LoadKind.Hp, 2, 0.85)]
    [InlineData("load: { va: 0 }", LoadKind.Va, 0, 1.0)]
    public void Parse_Load_ReadsItsOneQuantity(string load, LoadKind kind, double value, double pf)
    {
        var text = ProjectText.Minimal(system: "208Y/120", circuit: $"poles: 3\n        {load}\n        run: {{ length: 20, size: 10 AWG }}");

        Assert.Equal(new Load(kind, value, pf), ProjectLoader.Parse(text, "t.yaml").Equipment[0].Circuits[0].Load);
    }

    [Fact]
    public void Parse_ManyMistakes_ReportsEveryOneNotOnlyTheFirst()
    {
        var text = ProjectText.Minimal(units: "metrik", system: "208/120", feeder: "{ length: -1, size: 13 AWG }");

        var error = Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "t.yaml"));

        Assert.Equal(4, error.Diagnostics.Count);
    }
}
