using System.Buffers;
using System.Runtime.CompilerServices;

namespace DistTree.Solving;

/// <summary>
/// Scratch arrays of a solve, taken from the shared array pool. A solve of a large tree needs many arrays of
/// one element per node or run that it drops at its end; made afresh, they go to the large object heap and
/// bring on full collections. A rented array may be longer than asked for: only its first elements are used.
/// An array smaller than the large object heap's threshold is made afresh and never pooled: it costs the young
/// generation little, and a short run (a <c>check</c>) does not compile the pool's generic code for each of the
/// solver's element types (see DEVELOPERS.md, Start-up).
/// </summary>
internal static class Scratch
{
    // The runtime's large object heap threshold in bytes: arrays of this size and more are pooled.
    private const long LargeObjectBytes = 85_000;

    /// <summary>
    /// The size in bytes from which arrays are pooled: the large object heap's threshold, or 0 (every array pooled)
    /// for the tests that check a solve against a pool full of stale data.
    /// </summary>
    internal static long PooledFromBytes { get; set; } = LargeObjectBytes;

    /// <summary>An array of at least <paramref name="length"/> elements whose first <paramref name="length"/> are zero.</summary>
    public static T[] Rent<T>(int length)
    {
        if (!Pooled<T>(length))
        {
            return new T[length];
        }

        var array = ArrayPool<T>.Shared.Rent(length);
        array.AsSpan(0, length).Clear();
        return array;
    }

    /// <summary>
    /// An array of at least <paramref name="length"/> elements of any content, for a pass that writes each of the
    /// first <paramref name="length"/> before it reads it: the clearing is left out, and the writing is spread over
    /// the cores with the pass.
    /// </summary>
    public static T[] RentToFill<T>(int length) => Pooled<T>(length) ? ArrayPool<T>.Shared.Rent(length) : new T[length];

    /// <summary>
    /// An array of exactly <paramref name="length"/> elements, of any content when it is large (a pass writes each
    /// element before reading it): <see cref="GC.AllocateUninitializedArray"/>, but a small array is made plainly,
    /// as that method does itself, without compiling its generic code for each element type.
    /// </summary>
    public static T[] Uninitialized<T>(int length) => Pooled<T>(length) ? GC.AllocateUninitializedArray<T>(length) : new T[length];

    /// <summary>Gives back an array from <see cref="Rent"/>, clearing the first <paramref name="length"/> elements when they hold references.</summary>
    public static void Return<T>(T[] array, int length)
    {
        // An array from the pool is at least as long as it was asked for, so it is pooled by its own length too; the
        // pool's lengths are powers of two from 16 up (an array made while the tests pooled nothing, shorter or of another
        // length, is not given to the pool, which would refuse it).
        if (!Pooled<T>(array.Length) || array.Length < SmallestPooledLength || !System.Numerics.BitOperations.IsPow2(array.Length))
        {
            return;
        }

        if (RuntimeHelpers.IsReferenceOrContainsReferences<T>())
        {
            array.AsSpan(0, length).Clear();
        }

        ArrayPool<T>.Shared.Return(array);
    }

    // The shortest array the shared pool hands out and takes back (System.Buffers.ArrayPool<T>.Shared: its buckets are the
    // powers of two from 16 elements up).
    private const int SmallestPooledLength = 16;

    private static bool Pooled<T>(int length) => (long)Unsafe.SizeOf<T>() * length >= PooledFromBytes;
}
