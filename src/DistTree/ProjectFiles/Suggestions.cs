namespace DistTree.ProjectFiles;

/// <summary>
/// "Did you mean" hints: the closest known word by optimal-string-alignment edit distance, case ignored. A typo is at
/// most <see cref="MaxEdits"/> edits, so only a band of that width around the diagonal is worked out, and a word is
/// given up as soon as it is farther: the work is linear in the word's length, never quadratic.
/// </summary>
internal static class Suggestions
{
    /// <summary>The most edits (insertions, deletions, substitutions, swaps of neighbours) a likely typo has: 2.</summary>
    public const int MaxEdits = 2;

    /// <summary>The closest candidate when it is near enough to be a likely typo, else null.</summary>
    public static string? Closest(string word, IReadOnlyList<string> candidates)
    {
        var unlimited = long.MaxValue;
        return Closest(word, candidates, ref unlimited);
    }

    /// <summary>
    /// The closest candidate when it is near enough to be a likely typo, else null. <paramref name="budget"/> is the work
    /// left (cells of the distance's table worked out); once it runs out the answer is null,
    /// whatever is left unlooked at, so that hints over many long ids cost a bounded time. A word longer than
    /// <see cref="ProjectLimits.MaxIdLength"/> (no key, word or id is) gets no hint.
    /// </summary>
    public static string? Closest(string word, IReadOnlyList<string> candidates, ref long budget)
    {
        if (word.Length > ProjectLimits.MaxIdLength)
        {
            return null;
        }

        var lower = word.ToLowerInvariant();
        var rows = new Rows(lower.Length + MaxEdits + 1);
        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var candidate in candidates)
        {
            // The distance is at least the difference in length: a candidate more than two letters longer or
            // shorter cannot be near enough, so its distance is never worked out.
            if (Math.Abs(candidate.Length - lower.Length) > MaxEdits)
            {
                continue;
            }

            if (budget <= 0)
            {
                return null;
            }

            var distance = Distance(lower, candidate, MaxEdits, rows, ref budget);
            if (distance < bestDistance)
            {
                best = candidate;
                bestDistance = distance;
            }
        }

        // A typo is at most two edits, and fewer than half the word (so 'cu' does not suggest 'al').
        if (best is not null && bestDistance <= MaxEdits && bestDistance * 2 < Math.Max(best.Length, lower.Length))
        {
            return best;
        }

        // A shortened word ('panel' for 'panelboard') when only one candidate starts with it.
        return lower.Length >= 3 ? OnlyExtension(lower, candidates, ref budget) : null;
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

    /// <summary>
    /// Optimal string alignment distance (insertions, deletions, substitutions, swaps of neighbours), case ignored,
    /// when it is at most <paramref name="max"/>; <paramref name="max"/> + 1 when it is more.
    /// </summary>
    public static int Distance(string a, string b, int max)
    {
        var unlimited = long.MaxValue;
        return Distance(a.ToLowerInvariant(), b, max, new Rows(Math.Max(a.Length, b.Length) + 1), ref unlimited);
    }

    // The distance in a band of |i − j| ≤ max around the diagonal, row by row over a (rows i − 2, i − 1 and i kept);
    // a cell outside the band reads as max + 1. Every row's least cell bounds all later rows' from below, so a row
    // whose least cell is above max ends the work. Each cell worked out is taken from the budget.
    private static int Distance(string lower, string b, int max, Rows rows, ref long budget)
    {
        var far = max + 1;
        if (Math.Abs(lower.Length - b.Length) > max)
        {
            return far;
        }

        var n = b.Length;
        var lowerB = rows.Text.AsSpan(0, n);
        b.AsSpan().ToLowerInvariant(lowerB);
        var (before, previous, current) = (rows.A, rows.B, rows.C);
        for (var j = 0; j <= n; j++)
        {
            previous[j] = Math.Min(j, far);
        }

        for (var i = 1; i <= lower.Length; i++)
        {
            var low = Math.Max(1, i - max);
            var high = Math.Min(n, i + max);
            budget -= high - low + 1;
            current[0] = Math.Min(i, far);
            current[low - 1] = low > 1 ? far : current[0];
            var rowLeast = current[low - 1];
            var ai = lower[i - 1];
            for (var j = low; j <= high; j++)
            {
                var bj = lowerB[j - 1];
                var d = Math.Min(Math.Min(previous[j] + 1, current[j - 1] + 1), previous[j - 1] + (ai == bj ? 0 : 1));
                if (i > 1 && j > 1 && ai == lowerB[j - 2] && lower[i - 2] == bj)
                {
                    d = Math.Min(d, before[j - 2] + 1);
                }

                current[j] = Math.Min(d, far);
                rowLeast = Math.Min(rowLeast, current[j]);
            }

            if (high < n)
            {
                current[high + 1] = far;
            }

            if (rowLeast > max)
            {
                return far;
            }

            (before, previous, current) = (previous, current, before);
        }

        return Math.Min(previous[n], far);
    }

    // The one candidate that starts with the word, or null (none, or two or more).
    private static string? OnlyExtension(string lower, IReadOnlyList<string> candidates, ref long budget)
    {
        string? found = null;
        foreach (var candidate in candidates)
        {
            budget -= lower.Length;
            if (budget < 0)
            {
                return null;
            }

            if (candidate.StartsWith(lower, StringComparison.OrdinalIgnoreCase))
            {
                if (found is not null)
                {
                    return null;
                }

                found = candidate;
            }
        }

        return found;
    }

    // The three rows of the distance's table and the candidate in lower case, each of the given length, made once per
    // word and reused for every candidate.
    private sealed class Rows(int length)
    {
        public char[] Text { get; } = new char[length];

        public int[] A { get; } = new int[length];

        public int[] B { get; } = new int[length];

        public int[] C { get; } = new int[length];
    }
}
