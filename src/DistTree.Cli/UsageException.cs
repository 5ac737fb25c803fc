namespace DistTree.Cli;

/// <summary>A command line that parses but cannot be carried out (a missing file, a bad option value).</summary>
public sealed class UsageException : Exception
{
    /// <summary>Creates the exception with the message the user sees.</summary>
    public UsageException(string message)
        : base(message)
    {
    }
}
