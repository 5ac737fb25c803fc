namespace DistTree.Vocabulary;

/// <summary>The unit factors every reader, writer and report shares, each defined once.</summary>
public static class UnitFactors
{
    /// <summary>Metres in one international foot: exactly 0.3048 (the international yard and pound agreement of 1959).</summary>
    public const double MetresPerFoot = 0.3048;

    /// <summary>Feet in a thousand feet: the length basis of conductor tables given per 1000 ft.</summary>
    public const double FeetPerKft = 1000.0;
}
