using DistTree.Network;
using DistTree.ProjectFiles;
using DistTree.Reports;
using DistTree.Solving;

namespace DistTree.Tests.Solving;

/// <summary>
/// The solver's scratch arrays come from a shared pool: a solve that reuses them gives the same results. The test
/// projects are small, so every array is pooled here (<see cref="Scratch.PooledFromBytes"/> 0), not only the large ones.
/// That setting is the process's, so these tests run alone (a solve elsewhere would make arrays under one setting and
/// give them back under the other).
/// </summary>
[Collection(Name)]
public sealed class ScratchReuseTests : IDisposable
{
    /// <summary>The collection these tests run in, alone.</summary>
    public const string Name = "scratch pool";

    private readonly long _pooledFromBytes = Scratch.PooledFromBytes;

    public ScratchReuseTests() => Scratch.PooledFromBytes = 0;

    public void Dispose() => Scratch.PooledFromBytes = _pooledFromBytes;

    [Fact]
    public void Rent_BelowTheLargeObjectThreshold_MakesAnArrayOfItsOwn()
    {
        Scratch.PooledFromBytes = 85_000;

        // 10,000 doubles (80,000 bytes) are made afresh and exactly as long; 20,000 (160,000 bytes) come from the pool,
        // whose arrays are powers of two long (System.Buffers.ArrayPool<T>.Shared).
        var (small, large) = (Scratch.Rent<double>(10_000), Scratch.Rent<double>(20_000));

        Assert.Equal(10_000, small.Length);
        Assert.Equal(32_768, large.Length);
        Scratch.Return(small, 10_000);
        Scratch.Return(large, 20_000);
    }

    [Fact]
    public void Solve_AfterALargerSolve_GivesTheSameResults()
    {
        var small = Build("small-office.yaml");
        var large = Build(Path.Combine("campus", "campus.yaml"));
        var first = JsonResults.Write(DropSolver.Standard.Solve(small));

        DropSolver.Standard.Solve(large);
        var again = JsonResults.Write(DropSolver.Standard.Solve(small));

        Assert.Equal(first, again);
    }

    [Fact]
    public void Solve_TwiceOnOneNetwork_GivesTheSameResults()
    {
        var network = Build(Path.Combine("campus", "campus.yaml"));

        Assert.Equal(JsonResults.Write(DropSolver.Standard.Solve(network)), JsonResults.Write(DropSolver.Standard.Solve(network)));
    }

    // Scratch arrays rented for filling are not cleared, and the solve's own arrays are made without clearing: every
    // element must be written before it is read. Arrays of the pool's sizes full of NaN and -1 must change nothing.
    [Fact]
    public void Solve_WithThePoolFullOfGarbage_GivesTheSameResults()
    {
        var network = Build(Path.Combine("campus", "campus.yaml"));
        var before = JsonResults.Write(DropSolver.Standard.Solve(network));

        for (var length = 16; length <= 1 << 16; length *= 2)
        {
            Poison(length, double.NaN);
            Poison(length, -1);
            Poison(length, new System.Numerics.Complex(double.NaN, double.NaN));
            Poison(length, new ComplexPower(double.NaN, double.NaN));
        }

        Assert.Equal(before, JsonResults.Write(DropSolver.Standard.Solve(network)));
    }

    private static void Poison<T>(int length, T garbage)
    {
        var arrays = Enumerable.Range(0, 8).Select(_ => System.Buffers.ArrayPool<T>.Shared.Rent(length)).ToList();
        foreach (var array in arrays)
        {
            array.AsSpan().Fill(garbage);
            System.Buffers.ArrayPool<T>.Shared.Return(array);
        }
    }

    private static DistributionNetwork Build(string name) =>
        NetworkBuilder.Build(ProjectLoader.Load(Path.Combine(TestPaths.RepoRoot, "projects", name)));
}

/// <summary>The tests that change the scratch pool's setting for the whole process run in this collection, alone.</summary>
[CollectionDefinition(ScratchReuseTests.Name, DisableParallelization = true)]
public sealed class ScratchPoolCollection;
