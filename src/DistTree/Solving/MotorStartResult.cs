namespace DistTree.Solving;

/// <summary>
/// A motor's starting check: the voltage dip while it starts, at its terminals and at its panel, by superposing
/// the extra drop of (locked-rotor − running) power on every run and transformer of its whole path onto the
/// steady drops (demand factors do not reduce one motor's inrush).
/// </summary>
/// <param name="LockedRotorVa">Locked-rotor apparent power at nominal voltage, VA.</param>
/// <param name="TerminalDipPercent">Total drop at the motor's terminals while starting, percent.</param>
/// <param name="PanelDipPercent">Total drop at its panel's bus while it starts, percent.</param>
/// <param name="LimitPercent">The limit at the terminals, percent.</param>
public sealed record MotorStartResult(double LockedRotorVa, double TerminalDipPercent, double PanelDipPercent, double LimitPercent);
