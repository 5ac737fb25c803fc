using System.Diagnostics;
using DistTree.Diagnostics;

namespace DistTree.Cli;

/// <summary>
/// A one-line progress display on standard error for work that runs longer than about a second. It stays
/// silent for the first second (short commands never show it), then rewrites one line in place ('\r'),
/// at most ten times a second, and clears it when disposed. Given no writer, it does nothing at all: standard
/// error that is redirected (a log, a pipe, a test) never sees it. What it shows is escaped (<see cref="DisplayText"/>):
/// only its own '\r' moves the cursor.
/// </summary>
public sealed class StatusLine : IProgress<string>, IDisposable
{
    private static readonly TimeSpan Delay = TimeSpan.FromSeconds(1);
    private static readonly TimeSpan Interval = TimeSpan.FromMilliseconds(100);

    private readonly TextWriter? _writer;
    private readonly Func<TimeSpan> _elapsed;
    private TimeSpan? _lastShown;
    private int _width;

    /// <summary>A status line written to <paramref name="writer"/>, or a silent one when it is null.</summary>
    public StatusLine(TextWriter? writer)
        : this(writer, null)
    {
    }

    /// <summary>As <see cref="StatusLine(TextWriter?)"/>, with the time since it was made read from <paramref name="elapsed"/> (tests).</summary>
    internal StatusLine(TextWriter? writer, Func<TimeSpan>? elapsed)
    {
        _writer = writer;
        if (elapsed is null)
        {
            var clock = Stopwatch.StartNew();
            elapsed = () => clock.Elapsed;
        }

        _elapsed = elapsed;
    }

    /// <summary>Shows <paramref name="value"/> (what is being done) once the first second has passed.</summary>
    public void Report(string value)
    {
        if (_writer is null)
        {
            return;
        }

        var now = _elapsed();
        if (now < Delay || (_lastShown is { } last && now - last < Interval))
        {
            return;
        }

        Show(value);
        _lastShown = now;
    }

    /// <summary>A progress that reports a share done (0 to 1) as "<paramref name="what"/> NN %".</summary>
    public IProgress<double> Share(string what) => new ShareProgress(this, what);

    /// <summary>Clears the line, if one was shown.</summary>
    public void Dispose()
    {
        if (_writer is not null && _width > 0)
        {
            _writer.Write('\r' + new string(' ', _width) + '\r');
            _writer.Flush();
            _width = 0;
        }
    }

    private void Show(string value)
    {
        value = DisplayText.Escape(value);
        var padded = value.Length < _width ? value.PadRight(_width) : value;
        _writer!.Write('\r' + padded);
        _writer.Flush();
        _width = Math.Max(_width, value.Length);
    }

    private sealed class ShareProgress(StatusLine line, string what) : IProgress<double>
    {
        public void Report(double value) => line.Report($"{what} {Math.Clamp(value, 0, 1) * 100:0} %");
    }
}
