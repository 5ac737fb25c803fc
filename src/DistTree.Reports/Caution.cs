using DistTree.Codes;
using DistTree.Model;

namespace DistTree.Reports;

/// <summary>The caution every output carries, naming the code and edition the checks assumed.</summary>
public static class Caution
{
    /// <summary>The caution for results checked under <paramref name="code"/>.</summary>
    public static string For(ElectricalCode code) => For(code, code);

    /// <summary>
    /// One short paragraph: a design aid; the code and edition the checks assumed (both, where two revisions were
    /// checked under different codes); the code in force and the authority having jurisdiction decide; a qualified
    /// person reviews.
    /// </summary>
    public static string For(ElectricalCode before, ElectricalCode after)
    {
        var assumed = before == after ? CodeRules.Describe(after) : $"{CodeRules.Describe(before)} before and {CodeRules.Describe(after)} after";
        return "DistTree is a design aid. Its results depend on the input data and the conductor data shown; " +
            $"its code checks assume {assumed}, with clause numbers recalled rather than read, to be verified against the edition in force. " +
            "The electrical code in force and the authority having jurisdiction decide what is required, " +
            "and a qualified person must review the design.";
    }
}
