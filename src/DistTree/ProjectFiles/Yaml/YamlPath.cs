namespace DistTree.ProjectFiles.Yaml;

/// <summary>Which reader builds the tree of a YAML text.</summary>
internal enum YamlPath
{
    /// <summary>The fast reader for the subset project files use, and YamlDotNet for anything else or anything wrong (the default).</summary>
    Fast,

    /// <summary>YamlDotNet alone, for every text (forced with <c>DISTTREE_YAML=yamldotnet</c>).</summary>
    YamlDotNet,
}
