namespace DistTree.Generating;

/// <summary>
/// SplitMix64 (Steele, Lea and Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014):
/// a tiny seeded generator written out here so that a seed gives the same project on every runtime
/// (System.Random's algorithm may change between versions).
/// </summary>
internal sealed class SplitMix64(ulong seed)
{
    private ulong _state = seed;

    /// <summary>The next 64 random bits.</summary>
    public ulong Next()
    {
        _state += 0x9E3779B97F4A7C15UL;
        var z = _state;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>A number in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (Next() >> 11) * (1.0 / (1UL << 53));

    /// <summary>A whole number in [<paramref name="min"/>, <paramref name="max"/>], both included.</summary>
    public int Between(int min, int max) => min + (int)(Next() % (ulong)(max - min + 1));

    /// <summary>One of <paramref name="items"/>, each equally likely.</summary>
    public T Pick<T>(IReadOnlyList<T> items) => items[(int)(Next() % (ulong)items.Count)];

    /// <summary>True with probability <paramref name="p"/>.</summary>
    public bool Chance(double p) => NextDouble() < p;
}
