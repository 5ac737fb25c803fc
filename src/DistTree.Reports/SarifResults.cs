using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using DistTree.Solving;

namespace DistTree.Reports;

/// <summary>
/// Writes a solution's findings as a SARIF 2.1.0 log (the OASIS Static Analysis Results Interchange Format),
/// for code-review tools that show findings beside the lines of the project file: one run, the tool
/// <c>DistTree</c> with one rule per finding kind, one result per finding at its line and column.
/// The same solution always gives the same bytes.
/// </summary>
public static class SarifResults
{
    /// <summary>The SARIF version written.</summary>
    public const string Version = "2.1.0";

    /// <summary>The schema of SARIF 2.1.0, as published by OASIS.</summary>
    public const string Schema = "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json";

    /// <summary>The rules: one per finding kind, from the registry (<see cref="FindingKinds"/>), in the order of <see cref="FindingKind"/>.</summary>
    public static IReadOnlyList<FindingKindInfo> Rules => FindingKinds.All;

    private static readonly JsonWriterOptions Options = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The log as UTF-8 text, ending in a newline.</summary>
    /// <param name="solution">The solved project.</param>
    /// <param name="artifactUri">The project file as a URI reference: relative to the working folder, forward slashes.</param>
    public static string Write(Solution solution, string artifactUri)
    {
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, Options))
        {
            w.WriteStartObject();
            w.WriteString("$schema", Schema);
            w.WriteString("version", Version);
            w.WriteStartArray("runs");
            w.WriteStartObject();
            WriteTool(w);
            w.WriteStartArray("artifacts");
            w.WriteStartObject();
            WriteUri(w, "location", artifactUri);
            w.WriteEndObject();
            w.WriteEndArray();
            w.WriteStartArray("results");
            foreach (var finding in solution.AllFindings)
            {
                WriteResult(w, finding, artifactUri);
            }

            w.WriteEndArray();
            w.WriteString("columnKind", "utf16CodeUnits");
            w.WriteStartObject("properties");
            w.WriteString("caution", Caution.For(solution.Project.Rules.Code));
            w.WriteString("project", solution.Project.Name);
            w.WriteString("sha256", solution.Project.Sha256);
            w.WriteEndObject();
            w.WriteEndObject();
            w.WriteEndArray();
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray()) + "\n";
    }

    private static void WriteTool(Utf8JsonWriter w)
    {
        var version = typeof(SarifResults).Assembly.GetName().Version ?? new Version(0, 0, 0);
        w.WriteStartObject("tool");
        w.WriteStartObject("driver");
        w.WriteString("name", "DistTree");
        w.WriteString("semanticVersion", version.ToString(3));
        w.WriteStartArray("rules");
        foreach (var rule in Rules)
        {
            w.WriteStartObject();
            w.WriteString("id", rule.Code);
            w.WriteString("name", rule.SarifName);
            w.WriteStartObject("shortDescription");
            w.WriteString("text", rule.Description);
            w.WriteEndObject();
            w.WriteStartObject("defaultConfiguration");
            w.WriteString("level", "error");
            w.WriteEndObject();
            w.WriteEndObject();
        }

        w.WriteEndArray();
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static void WriteResult(Utf8JsonWriter w, Finding finding, string artifactUri)
    {
        w.WriteStartObject();
        w.WriteString("ruleId", finding.Code);
        w.WriteNumber("ruleIndex", (int)finding.Kind);
        w.WriteString("level", "error");
        w.WriteStartObject("message");
        w.WriteString("text", finding.Message);
        w.WriteEndObject();
        w.WriteStartArray("locations");
        w.WriteStartObject();
        w.WriteStartObject("physicalLocation");
        WriteUri(w, "artifactLocation", artifactUri);
        if (finding.Location.Line >= 1)
        {
            w.WriteStartObject("region");
            w.WriteNumber("startLine", finding.Location.Line);
            w.WriteNumber("startColumn", Math.Max(finding.Location.Column, 1));
            w.WriteEndObject();
        }

        w.WriteEndObject();
        w.WriteEndObject();
        w.WriteEndArray();
        w.WriteStartObject("properties");
        w.WriteString("subject", finding.Subject);
        w.WriteString("reference", finding.Reference);
        JsonResults.Number(w, "value", finding.Value, 4);
        JsonResults.Number(w, "limit", finding.Limit, 4);
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static void WriteUri(Utf8JsonWriter w, string name, string artifactUri)
    {
        w.WriteStartObject(name);
        w.WriteString("uri", artifactUri);
        w.WriteEndObject();
    }
}
