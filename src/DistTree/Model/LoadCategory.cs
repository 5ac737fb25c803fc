namespace DistTree.Model;

/// <summary>
/// What a load is, as a branch circuit's <c>category</c> states it: for the rules that treat kinds of load
/// differently (a motor's), and for code demand loads later. Unstated, a motor load (<c>hp</c> or <c>fla</c>) is
/// <see cref="Motor"/> and any other load <see cref="Other"/>.
/// </summary>
public enum LoadCategory
{
    /// <summary>Lighting.</summary>
    Lighting,

    /// <summary>Receptacle outlets.</summary>
    Receptacle,

    /// <summary>A motor.</summary>
    Motor,

    /// <summary>Heating, ventilating and air-conditioning equipment (a motor load may be this).</summary>
    Hvac,

    /// <summary>Commercial kitchen equipment.</summary>
    Kitchen,

    /// <summary>An electric vehicle charger.</summary>
    EvCharger,

    /// <summary>Any other load; the category of an unstated load that is not a motor.</summary>
    Other,
}
