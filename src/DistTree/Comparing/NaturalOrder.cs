namespace DistTree.Comparing;

/// <summary>
/// The order of ids as people count them: a run of ASCII digits compares by its number (<c>LP1/2</c> before
/// <c>LP1/10</c>, <c>LP2</c> before <c>LP10</c>), other characters ordinally, and <c>/</c> (between a panel's id and its
/// circuit's) before any other character, so a circuit sorts by its panel's id, then by its own. Ids equal so (<c>01</c>
/// and <c>1</c>) fall back to the ordinal order: a total order, so sorting is deterministic.
/// </summary>
public sealed class NaturalOrder : IComparer<string>
{
    private NaturalOrder()
    {
    }

    /// <summary>The one instance.</summary>
    public static NaturalOrder Instance { get; } = new();

    /// <inheritdoc/>
    public int Compare(string? x, string? y)
    {
        if (x is null || y is null)
        {
            return x is null ? (y is null ? 0 : -1) : 1;
        }

        var natural = CompareNatural(x, y);
        return natural != 0 ? natural : string.CompareOrdinal(x, y);
    }

    private static int CompareNatural(ReadOnlySpan<char> x, ReadOnlySpan<char> y)
    {
        int i = 0, j = 0;
        while (i < x.Length && j < y.Length)
        {
            if (char.IsAsciiDigit(x[i]) && char.IsAsciiDigit(y[j]))
            {
                var a = Digits(x, ref i);
                var b = Digits(y, ref j);
                var byNumber = a.Length != b.Length ? a.Length.CompareTo(b.Length) : a.SequenceCompareTo(b);
                if (byNumber != 0)
                {
                    return byNumber;
                }

                continue;
            }

            var byChar = Rank(x[i]).CompareTo(Rank(y[j]));
            if (byChar != 0)
            {
                return byChar;
            }

            i++;
            j++;
        }

        return (x.Length - i).CompareTo(y.Length - j);
    }

    // A run of digits from `start`, its leading zeros left off; `start` moves past it.
    private static ReadOnlySpan<char> Digits(ReadOnlySpan<char> text, ref int start)
    {
        var end = start;
        while (end < text.Length && char.IsAsciiDigit(text[end]))
        {
            end++;
        }

        var first = start;
        while (first < end - 1 && text[first] == '0')
        {
            first++;
        }

        start = end;
        return text[first..end];
    }

    // The separator first, then every character in ordinal order.
    private static int Rank(char c) => c == '/' ? -1 : c;
}
