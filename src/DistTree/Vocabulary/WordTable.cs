namespace DistTree.Vocabulary;

/// <summary>
/// The words for the values of one enum: each value's one word, as the project file and every output write it.
/// A value may be written otherwise (a number) and then has no word; the table says which.
/// </summary>
/// <typeparam name="T">The enum the words name.</typeparam>
public sealed class WordTable<T>
    where T : struct, Enum
{
    private readonly (string Word, T Value)[] _pairs;

    internal WordTable(string noun, (string Word, T Value)[] pairs, params T[] writtenOtherwise)
    {
        Noun = noun;
        _pairs = pairs;
        Words = Array.ConvertAll(pairs, p => p.Word);
        WrittenOtherwise = writtenOtherwise;
    }

    /// <summary>What the words name, for messages: <c>material</c>, <c>raceway</c>, …</summary>
    public string Noun { get; }

    /// <summary>Each word with its value, in the order the documentation lists them.</summary>
    public IReadOnlyList<(string Word, T Value)> Pairs => _pairs;

    /// <summary>The words, in the order the documentation lists them.</summary>
    public IReadOnlyList<string> Words { get; }

    /// <summary>The values with no word of their own (written as a number, for example).</summary>
    public IReadOnlyList<T> WrittenOtherwise { get; }

    /// <summary>The word for <paramref name="value"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value has no word (see <see cref="WrittenOtherwise"/>).</exception>
    public string Of(T value)
    {
        foreach (var (word, v) in _pairs)
        {
            if (EqualityComparer<T>.Default.Equals(v, value))
            {
                return word;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(value), value, $"no {Noun} word for this value");
    }

    /// <summary>The position of <paramref name="word"/> in <see cref="Words"/> (case-sensitive), or −1.</summary>
    public int IndexOf(string word)
    {
        for (var i = 0; i < _pairs.Length; i++)
        {
            if (string.Equals(_pairs[i].Word, word, StringComparison.Ordinal))
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>The value whose word is exactly <paramref name="word"/> (case-sensitive), if any.</summary>
    public bool TryRead(string word, out T value)
    {
        var i = IndexOf(word);
        value = i < 0 ? default : _pairs[i].Value;
        return i >= 0;
    }
}
