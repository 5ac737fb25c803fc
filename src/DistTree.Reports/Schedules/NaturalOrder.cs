namespace DistTree.Reports.Schedules;

/// <summary>
/// The natural order of ids: runs of digits compare by their value (2 before 10), other text ordinally, so
/// <c>1, 2, 3 … 10, 11</c> and <c>L2</c> before <c>L10</c>; ids equal so (<c>1</c> and <c>01</c>) fall back to the
/// ordinal order, so the order is total and the same on every run.
/// </summary>
internal sealed class NaturalOrder : IComparer<string>
{
    /// <summary>The one comparer.</summary>
    public static NaturalOrder Instance { get; } = new();

    private NaturalOrder()
    {
    }

    /// <inheritdoc/>
    public int Compare(string? x, string? y)
    {
        if (x is null || y is null)
        {
            return x is null ? (y is null ? 0 : -1) : 1;
        }

        int i = 0, j = 0;
        while (i < x.Length && j < y.Length)
        {
            var order = char.IsAsciiDigit(x[i]) && char.IsAsciiDigit(y[j])
                ? CompareDigits(x, ref i, y, ref j)
                : x[i++].CompareTo(y[j++]);
            if (order != 0)
            {
                return order;
            }
        }

        var byLength = (x.Length - i).CompareTo(y.Length - j);
        return byLength != 0 ? byLength : string.CompareOrdinal(x, y);
    }

    // Compares the runs of digits at x[i] and y[j] by value (leading zeros skipped: the longer run is the larger,
    // then digit by digit), and moves both past their runs.
    private static int CompareDigits(string x, ref int i, string y, ref int j)
    {
        var (xs, xe) = Run(x, ref i);
        var (ys, ye) = Run(y, ref j);
        var order = (xe - xs).CompareTo(ye - ys);
        for (var k = 0; order == 0 && k < xe - xs; k++)
        {
            order = x[xs + k].CompareTo(y[ys + k]);
        }

        return order;
    }

    // The run of digits starting at s[i] without its leading zeros (start, end), with i moved past the run.
    private static (int Start, int End) Run(string s, ref int i)
    {
        while (i < s.Length - 1 && s[i] == '0' && char.IsAsciiDigit(s[i + 1]))
        {
            i++;
        }

        var start = i;
        while (i < s.Length && char.IsAsciiDigit(s[i]))
        {
            i++;
        }

        return (start, i);
    }
}
