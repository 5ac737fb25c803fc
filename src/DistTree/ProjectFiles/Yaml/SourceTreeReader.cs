namespace DistTree.ProjectFiles.Yaml;

/// <summary>
/// Reads YAML text into a <see cref="SourceNode"/> tree: the one entry point of the YAML readers. By default
/// <see cref="FastYamlReader"/> reads the subset project files use and <see cref="YamlDotNetReader"/> the rest
/// (and every text with an error, so that every YAML message comes from YamlDotNet). One switch forces
/// YamlDotNet for every text: the environment variable <c>DISTTREE_YAML=yamldotnet</c>, read once per process.
/// Both paths give the same tree, node for node (a test holds them to it), so the switch changes no output,
/// only the time a load takes; it is there to rule the fast reader out when a file reads wrongly.
/// </summary>
internal static class SourceTreeReader
{
    /// <summary>The environment variable that chooses the path: <c>yamldotnet</c> forces YamlDotNet; any other value, or none, is the default.</summary>
    public const string SwitchVariable = "DISTTREE_YAML";

    /// <summary>The path this process reads with, from <see cref="SwitchVariable"/> when first asked.</summary>
    public static YamlPath DefaultPath { get; } = PathFrom(Environment.GetEnvironmentVariable(SwitchVariable));

    /// <summary>The path a value of <see cref="SwitchVariable"/> chooses: <c>yamldotnet</c> (any case, blanks around it ignored) forces YamlDotNet.</summary>
    public static YamlPath PathFrom(string? value) =>
        string.Equals(value?.Trim(), "yamldotnet", StringComparison.OrdinalIgnoreCase) ? YamlPath.YamlDotNet : YamlPath.Fast;

    /// <summary>The document's root node on <see cref="DefaultPath"/>, or null when the text holds none or cannot be parsed (reported).</summary>
    public static SourceNode? Read(string text, string file, DiagnosticBag bag) => Read(text, file, bag, DefaultPath, out _);

    /// <summary>
    /// The document's root node on <paramref name="path"/>, or null when the text holds none or cannot be parsed
    /// (reported); <paramref name="readBy"/> tells which reader built it (the fast path hands to YamlDotNet what it declines).
    /// </summary>
    public static SourceNode? Read(string text, string file, DiagnosticBag bag, YamlPath path, out YamlPath readBy)
    {
        if (path == YamlPath.Fast && FastYamlReader.TryRead(text, file) is { } root)
        {
            readBy = YamlPath.Fast;
            return root;
        }

        readBy = YamlPath.YamlDotNet;
        return YamlDotNetReader.Read(text, file, bag);
    }
}
