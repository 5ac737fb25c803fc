namespace DistTree.Cli;

/// <summary>The exit codes of every command (DESIGN.md section 5).</summary>
public static class ExitCodes
{
    /// <summary>Within all limits.</summary>
    public const int Ok = 0;

    /// <summary>A limit is exceeded (or, for compare, a new finding appeared).</summary>
    public const int LimitExceeded = 1;

    /// <summary>Bad input or usage.</summary>
    public const int BadInput = 2;

    /// <summary>An internal error: a defect of the program, told in one line with where to report it.</summary>
    public const int InternalError = 3;
}
