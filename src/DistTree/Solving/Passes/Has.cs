namespace DistTree.Solving.Passes;

/// <summary>
/// What a node has, read from its objects once by the power pass (see <see cref="PowerSums"/>): the passes that
/// need only this read a byte, and the end points' pass reads an end point's objects only for a finding.
/// </summary>
[Flags]
internal enum Has : byte
{
    None = 0,
    Circuit = 1,
    Run = 2,
    Transformer = 4,
    Motor = 8,

    /// <summary>Air-conditioning equipment given by its nameplate (<c>mca</c>, <c>mocp</c>).</summary>
    Nameplate = 16,
}
