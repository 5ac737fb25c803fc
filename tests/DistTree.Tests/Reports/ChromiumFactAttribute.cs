namespace DistTree.Tests.Reports;

/// <summary>
/// A fact that needs headless Chromium at <see cref="Path"/>. It is skipped only when the browser is missing
/// and the environment variable CI is not "true"; in CI it runs, and fails when the browser is missing
/// (.ci/install-browser installs it).
/// </summary>
public sealed class ChromiumFactAttribute : FactAttribute
{
    /// <summary>Where Debian's chromium package puts the browser.</summary>
    public const string Path = "/usr/bin/chromium";

    public ChromiumFactAttribute()
    {
        var inCi = string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase);
        if (!File.Exists(Path) && !inCi)
        {
            Skip = $"{Path} is missing (run .ci/install-browser); required when CI=true";
        }
    }
}
