using DistTree.ProjectFiles.Yaml;

namespace DistTree.Tests.ProjectFiles.Yaml;

/// <summary>Compares two <see cref="SourceNode"/> trees node for node, iteratively (an explicit stack).</summary>
internal static class SourceTreeComparer
{
    /// <summary>The first difference found, described with its path; null when the trees are equal.</summary>
    public static string? Difference(SourceNode expected, SourceNode actual)
    {
        var stack = new Stack<(SourceNode Expected, SourceNode Actual, string Path)>();
        stack.Push((expected, actual, "root"));
        while (stack.Count > 0)
        {
            var (e, a, path) = stack.Pop();
            if (e.GetType() != a.GetType())
            {
                return $"{path}: expected {e.Describe()}, got {a.Describe()}";
            }

            if (e.Location != a.Location || e.IsInvalid != a.IsInvalid)
            {
                return $"{path}: expected at {e.Location} (invalid {e.IsInvalid}), got {a.Location} (invalid {a.IsInvalid})";
            }

            switch (e)
            {
                case SourceScalar es:
                    var sa = (SourceScalar)a;
                    if (es.Value != sa.Value || es.IsPlain != sa.IsPlain)
                    {
                        return $"{path}: expected '{es.Value}' (plain {es.IsPlain}), got '{sa.Value}' (plain {sa.IsPlain})";
                    }

                    break;
                case SourceMapping em:
                    var ma = (SourceMapping)a;
                    if (em.Entries.Count != ma.Entries.Count)
                    {
                        return $"{path}: expected {em.Entries.Count} entries, got {ma.Entries.Count}";
                    }

                    for (var i = em.Entries.Count - 1; i >= 0; i--)
                    {
                        var entryPath = $"{path}.{em.Entries[i].Key.Value}[{i}]";
                        stack.Push((em.Entries[i].Value, ma.Entries[i].Value, entryPath));
                        stack.Push((em.Entries[i].Key, ma.Entries[i].Key, entryPath + "(key)"));
                    }

                    break;
                case SourceSequence eq:
                    var qa = (SourceSequence)a;
                    if (eq.Items.Count != qa.Items.Count)
                    {
                        return $"{path}: expected {eq.Items.Count} items, got {qa.Items.Count}";
                    }

                    for (var i = eq.Items.Count - 1; i >= 0; i--)
                    {
                        stack.Push((eq.Items[i], qa.Items[i], $"{path}[{i}]"));
                    }

                    break;
            }
        }

        return null;
    }
}
