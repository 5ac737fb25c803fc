namespace DistTree.Reports;

/// <summary>The caution every output carries.</summary>
public static class Caution
{
    /// <summary>One short paragraph: a design aid; the code in force and the authority having jurisdiction decide; a qualified person reviews.</summary>
    public const string Text =
        "DistTree is a design aid. Its results depend on the input data and the conductor data shown; " +
        "the electrical code in force and the authority having jurisdiction decide what is required, " +
        "and a qualified person must review the design.";
}
