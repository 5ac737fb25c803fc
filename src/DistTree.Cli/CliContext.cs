namespace DistTree.Cli;

/// <summary>Where a command writes: standard output and standard error, replaceable in tests.</summary>
/// <param name="Out">Standard output.</param>
/// <param name="Error">Standard error.</param>
public sealed record CliContext(TextWriter Out, TextWriter Error);
