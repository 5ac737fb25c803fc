namespace DistTree.Solving;

/// <summary>
/// A motor's starting check: the voltage dip while it starts, at its terminals, at its panel and at every bus of its
/// path, by superposing the extra current of (locked-rotor − running) power on its own lines through every run and
/// transformer of its whole path onto the running drops (demand factors do not reduce one motor's inrush).
/// </summary>
/// <param name="LockedRotorVa">Locked-rotor apparent power at nominal voltage, VA.</param>
/// <param name="TerminalDipPercent">Total drop at the motor's terminals while starting, percent.</param>
/// <param name="PanelDipPercent">Total drop at its panel's bus while it starts, percent.</param>
/// <param name="LimitPercent">The limit at the terminals, percent.</param>
public sealed record MotorStartResult(double LockedRotorVa, double TerminalDipPercent, double PanelDipPercent, double LimitPercent)
{
    /// <summary>The dip at each bus of the motor's path while it starts, its panel's first, up to the last before the service.</summary>
    public IReadOnlyList<BusDip> PathDips { get; init; } = [];
}

/// <summary>The drop at one bus of a starting motor's path while it starts, in the motor's own voltage read there.</summary>
/// <param name="Id">The equipment whose bus it is.</param>
/// <param name="DipPercent">The total drop there while the motor starts, percent of nominal.</param>
public sealed record BusDip(string Id, double DipPercent);
