using System.Buffers;
using System.Runtime.CompilerServices;

namespace DistTree.Solving;

/// <summary>
/// Scratch arrays of a solve, taken from the shared array pool. A solve of a large tree needs many arrays of
/// one element per node or run that it drops at its end; made afresh, they go to the large object heap and
/// bring on full collections. A rented array may be longer than asked for: only its first elements are used.
/// </summary>
internal static class Scratch
{
    /// <summary>An array of at least <paramref name="length"/> elements whose first <paramref name="length"/> are zero.</summary>
    public static T[] Rent<T>(int length)
    {
        var array = ArrayPool<T>.Shared.Rent(length);
        array.AsSpan(0, length).Clear();
        return array;
    }

    /// <summary>
    /// An array of at least <paramref name="length"/> elements of any content, for a pass that writes each of the
    /// first <paramref name="length"/> before it reads it: the clearing is left out, and the writing is spread over
    /// the cores with the pass.
    /// </summary>
    public static T[] RentToFill<T>(int length) => ArrayPool<T>.Shared.Rent(length);

    /// <summary>Gives back an array from <see cref="Rent"/>, clearing the first <paramref name="length"/> elements when they hold references.</summary>
    public static void Return<T>(T[] array, int length)
    {
        if (RuntimeHelpers.IsReferenceOrContainsReferences<T>())
        {
            array.AsSpan(0, length).Clear();
        }

        ArrayPool<T>.Shared.Return(array);
    }
}
