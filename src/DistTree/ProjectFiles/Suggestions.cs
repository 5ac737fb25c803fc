namespace DistTree.ProjectFiles;

/// <summary>"Did you mean" hints: the closest known word by optimal-string-alignment edit distance.</summary>
internal static class Suggestions
{
    /// <summary>The closest candidate when it is near enough to be a likely typo, else null.</summary>
    public static string? Closest(string word, IEnumerable<string> candidates)
    {
        var lower = word.ToLowerInvariant();
        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var candidate in candidates)
        {
            // The distance is at least the difference in length: a candidate more than two letters longer
            // or shorter cannot be near enough, so its (quadratic) distance is never computed.
            if (Math.Abs(candidate.Length - lower.Length) > 2)
            {
                continue;
            }

            var distance = Distance(lower, candidate.ToLowerInvariant());
            if (distance < bestDistance)
            {
                best = candidate;
                bestDistance = distance;
            }
        }

        // A typo is at most two edits, and fewer than half the word (so 'cu' does not suggest 'al').
        if (best is not null && bestDistance <= 2 && bestDistance * 2 < Math.Max(best.Length, lower.Length))
        {
            return best;
        }

        // A shortened word ('panel' for 'panelboard') when only one candidate starts with it.
        var prefixed = candidates.Where(c => lower.Length >= 3 && c.StartsWith(lower, StringComparison.OrdinalIgnoreCase)).Take(2).ToArray();
        return prefixed.Length == 1 ? prefixed[0] : null;
    }

    /// <summary>"; did you mean 'x'?" or "; expected one of: a, b, c".</summary>
    public static string Hint(string word, IReadOnlyList<string> candidates)
    {
        var closest = Closest(word, candidates);
        return closest is not null
            ? $"; did you mean '{closest}'?"
            : $"; expected {Join(candidates)}";
    }

    /// <summary>"'a'", "'a' or 'b'", "one of 'a', 'b', 'c'".</summary>
    public static string Join(IReadOnlyList<string> words) => words.Count switch
    {
        1 => $"'{words[0]}'",
        2 => $"'{words[0]}' or '{words[1]}'",
        _ => "one of " + string.Join(", ", words.Select(w => $"'{w}'")),
    };

    /// <summary>Optimal string alignment distance: insertions, deletions, substitutions, adjacent swaps.</summary>
    public static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (var i = 0; i <= a.Length; i++)
        {
            d[i, 0] = i;
        }

        for (var j = 0; j <= b.Length; j++)
        {
            d[0, j] = j;
        }

        for (var i = 1; i <= a.Length; i++)
        {
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                {
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
                }
            }
        }

        return d[a.Length, b.Length];
    }
}
