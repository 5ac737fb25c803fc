using System.CommandLine.Parsing;
using System.Globalization;

namespace DistTree.Cli;

/// <summary>
/// Parses a number option with a decimal point whatever the culture (System.CommandLine's own parsing follows
/// the current culture, under which <c>82.5</c> may read as 825). Set as an option's <c>CustomParser</c>.
/// </summary>
internal static class InvariantNumber
{
    /// <summary>The option's one token as a finite number; an error on the option otherwise.</summary>
    public static double Parse(ArgumentResult result)
    {
        var text = result.Tokens.Count == 1 ? result.Tokens[0].Value : "";
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && double.IsFinite(value))
        {
            return value;
        }

        result.AddError($"'{text}' is not a number; write it with a decimal point, as 82.5");
        return 0;
    }
}
