namespace DistTree.Solving.Passes;

/// <summary>
/// The rows of a solve: a <see cref="RunRow"/> per run or transformer, in network order, each transformer's row
/// after its primary feeder's, and what the passes keep beside them. The runs' pass fills them (see
/// <see cref="RunDrops"/>); the load flow's drops, the end points and the reach read them after. The rows and their
/// findings are the solution's own; the rest are scratch, given back by <see cref="Dispose"/>.
/// </summary>
internal sealed class RunRows : IDisposable
{
    private readonly int _n;

    /// <summary>Numbers the rows of the <paramref name="n"/> nodes from what each has.</summary>
    public RunRows(Has[] has, int n)
    {
        _n = n;
        var incoming = IncomingRow = Scratch.RentToFill<int>(n);
        var transformer = TransformerRow = Scratch.RentToFill<int>(n);
        var count = 0;
        for (var i = 0; i < n; i++)
        {
            incoming[i] = (has[i] & Has.Run) == 0 ? -1 : count++;
            transformer[i] = (has[i] & Has.Transformer) == 0 ? -1 : count++;
        }

        Count = count;
        Rows = Scratch.Uninitialized<RunRow>(count);
        Findings = new IReadOnlyList<Finding>?[count];
        Moments = Scratch.RentToFill<System.Numerics.Complex>(count * 3);
        LengthM = Scratch.RentToFill<double>(count);
        LimitPercent = Scratch.RentToFill<double>(count);
    }

    /// <summary>How many rows there are.</summary>
    public int Count { get; }

    /// <summary>Per node, the row of its incoming run, or −1 without one.</summary>
    public int[] IncomingRow { get; }

    /// <summary>Per node, the row of its transformer, or −1 without one.</summary>
    public int[] TransformerRow { get; }

    /// <summary>Per row, its figures.</summary>
    public RunRow[] Rows { get; }

    /// <summary>Per row, the limits it exceeds, or null for none.</summary>
    public IReadOnlyList<Finding>?[] Findings { get; }

    /// <summary>
    /// Per row × 3, a run's current-lengths per set (A·km, lines A, B, C; see <see cref="RunDrops.Moments"/>): the
    /// drops along it are z·M on each line and z_N·(−ΣM) on the neutral. A transformer's row holds none.
    /// </summary>
    public System.Numerics.Complex[] Moments { get; }

    // What later passes read of a run, kept by its row: they read only a run's rows, and the runs' pass writes them.

    /// <summary>Per run's row, its length in metres, for the reach.</summary>
    public double[] LengthM { get; }

    /// <summary>Per run's row, its own drop limit in percent, for the reach.</summary>
    public double[] LimitPercent { get; }

    /// <summary>Gives back the scratch arrays.</summary>
    public void Dispose()
    {
        Scratch.Return(Moments, Count * 3);
        Scratch.Return(LengthM, Count);
        Scratch.Return(LimitPercent, Count);
        Scratch.Return(IncomingRow, _n);
        Scratch.Return(TransformerRow, _n);
    }
}
