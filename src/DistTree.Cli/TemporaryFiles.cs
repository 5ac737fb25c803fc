using System.Runtime.InteropServices;

namespace DistTree.Cli;

/// <summary>
/// The temporary files an output is written to before it is renamed into place, kept in a registry until renamed or
/// removed, so that none is left behind: <see cref="OutputFile"/> removes its own on every error and exception, and
/// a termination signal (SIGTERM, SIGINT, SIGHUP) removes every one still pending before the process ends. Only
/// a kill that cannot be caught (SIGKILL, a power cut) can leave one, named <c>.NAME.PID.N.tmp</c> beside the output.
/// </summary>
internal sealed class TemporaryFiles
{
    private static readonly PosixSignal[] Signals = [PosixSignal.SIGTERM, PosixSignal.SIGINT, PosixSignal.SIGHUP];
    private static readonly Lazy<PosixSignalRegistration[]> Registrations = new(Register);
    private readonly Lock _gate = new();
    private readonly HashSet<string> _pending = new(StringComparer.Ordinal);
    private bool _stopping;
    private int _counter;

    /// <summary>The process's registry, whose files a termination signal removes.</summary>
    public static TemporaryFiles Process { get; } = new();

    /// <summary>The signals whose handlers are registered (on the first temporary file made): none where the platform has none.</summary>
    public static IReadOnlyList<PosixSignal> HandledSignals =>
        Registrations.IsValueCreated ? Signals[..Registrations.Value.Length] : [];

    /// <summary>The temporary files made and not yet renamed into place or removed.</summary>
    public IReadOnlyList<string> Pending
    {
        get
        {
            lock (_gate)
            {
                return [.. _pending.Order(StringComparer.Ordinal)];
            }
        }
    }

    /// <summary>
    /// Makes a new, empty temporary file beside <paramref name="target"/> (a name that no file has yet, so nothing is
    /// ever opened that was there before) and registers it; the caller writes it, then <see cref="Commit"/> or
    /// <see cref="Discard"/>.
    /// </summary>
    /// <exception cref="IOException">The folder cannot be written, or the process is stopping.</exception>
    public (string Path, FileStream Stream) Create(string target)
    {
        if (this == Process)
        {
            _ = Registrations.Value;
        }

        var folder = Path.GetDirectoryName(Path.GetFullPath(target))!;
        var name = Path.GetFileName(target);
        for (var attempt = 0; ; attempt++)
        {
            var path = Path.Combine(folder, $".{name}.{Environment.ProcessId}.{Interlocked.Increment(ref _counter)}.tmp");
            lock (_gate)
            {
                ThrowIfStopping();
                try
                {
                    var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16);
                    _pending.Add(path);
                    return (path, stream);
                }
                catch (IOException) when (attempt < 100 && Taken(path))
                {
                    // A file of that name is there already (left by another process): try the next name.
                }
            }
        }
    }

    /// <summary>Renames <paramref name="temporary"/> over <paramref name="target"/> (or onto a new name only, without <paramref name="replace"/>) and forgets it.</summary>
    /// <exception cref="IOException">The rename failed, or the process is stopping; the temporary file is still registered.</exception>
    public void Commit(string temporary, string target, bool replace)
    {
        lock (_gate)
        {
            ThrowIfStopping();
            File.Move(temporary, target, overwrite: replace);
            _pending.Remove(temporary);
        }
    }

    /// <summary>Removes <paramref name="temporary"/>, if it is still there, and forgets it.</summary>
    public void Discard(string temporary)
    {
        lock (_gate)
        {
            _pending.Remove(temporary);
            DeleteQuietly(temporary);
        }
    }

    /// <summary>
    /// Removes every pending temporary file and makes no more; what a termination signal runs. Whatever is still
    /// being written goes on into a file that no longer has a name, and is never renamed into place.
    /// </summary>
    public void Stop()
    {
        lock (_gate)
        {
            _stopping = true;
            foreach (var path in _pending)
            {
                DeleteQuietly(path);
            }

            _pending.Clear();
        }
    }

    private void ThrowIfStopping()
    {
        if (_stopping)
        {
            throw new IOException("the command is stopping on a signal");
        }
    }

    // The handlers, kept for the life of the process: each removes the pending files and lets the signal take its
    // usual course (the process ends).
    private static PosixSignalRegistration[] Register()
    {
        var made = new List<PosixSignalRegistration>();
        foreach (var signal in Signals)
        {
            try
            {
                made.Add(PosixSignalRegistration.Create(signal, _ => Process.Stop()));
            }
            catch (PlatformNotSupportedException)
            {
                break;
            }
        }

        return [.. made];
    }

    // True when something (a file, a folder, a link to nothing) already has the name.
    private static bool Taken(string path) => Path.Exists(path) || new FileInfo(path).LinkTarget is not null;

    private static void DeleteQuietly(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // It cannot be removed: the error already reported is the one that matters.
        }
    }
}
