using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace DistTree.ProjectFiles;

/// <summary>What stands at a path, as the system sees it after following symbolic links.</summary>
public enum FileKind
{
    /// <summary>Nothing (or a path through something that is not a folder).</summary>
    Missing,

    /// <summary>A regular file.</summary>
    Regular,

    /// <summary>A folder.</summary>
    Folder,

    /// <summary>A pipe (FIFO).</summary>
    Pipe,

    /// <summary>A character or block device (<c>/dev/null</c>, a terminal, a disk).</summary>
    Device,

    /// <summary>A socket.</summary>
    Socket,

    /// <summary>Something that exists but could not be examined (no permission, say), or of another kind.</summary>
    Unknown,
}

/// <summary>
/// Which file a path or an open file is, whatever it is called: the device that holds it and its inode
/// number. Two names of one file (a hard link, a symbolic link, a path through a linked folder) give the
/// same identity. Known on Linux (from <c>statx</c>); elsewhere <see cref="Of(string)"/> gives no identity,
/// and callers compare paths with every link followed instead.
/// </summary>
/// <param name="Device">The device number (major in the high 32 bits, minor in the low).</param>
/// <param name="Inode">The inode number on that device.</param>
public readonly record struct FileIdentity(ulong Device, ulong Inode)
{
    /// <summary>What stands at <paramref name="path"/> (links followed) and, on Linux, its identity.</summary>
    public static (FileKind Kind, FileIdentity? Identity) Of(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (NativeStat.TryStat(NativeStat.CurrentFolder, path, 0, out var mode, out var identity) is { } error)
        {
            return (error is NativeStat.NoSuchFile or NativeStat.NotAFolder ? FileKind.Missing : FileKind.Unknown, null);
        }

        if (mode is null)
        {
            // No statx here: what .NET can tell without it.
            return (Directory.Exists(path) ? FileKind.Folder : File.Exists(path) ? FileKind.Regular : FileKind.Missing, null);
        }

        return (KindOf(mode.Value), identity);
    }

    /// <summary>The identity of an open file, on Linux; null elsewhere or when the system does not say.</summary>
    public static FileIdentity? Of(SafeFileHandle handle)
    {
        ArgumentNullException.ThrowIfNull(handle);
        if (!OperatingSystem.IsLinux() || handle.IsInvalid)
        {
            return null;
        }

        var added = false;
        try
        {
            handle.DangerousAddRef(ref added);
            var descriptor = (int)handle.DangerousGetHandle();
            return NativeStat.TryStat(descriptor, "", NativeStat.EmptyPath, out _, out var identity) is null ? identity : null;
        }
        finally
        {
            if (added)
            {
                handle.DangerousRelease();
            }
        }
    }

    private static FileKind KindOf(int mode) => (mode & 0xF000) switch
    {
        0x8000 => FileKind.Regular,
        0x4000 => FileKind.Folder,
        0x1000 => FileKind.Pipe,
        0x2000 or 0x6000 => FileKind.Device,
        0xC000 => FileKind.Socket,
        _ => FileKind.Unknown,
    };

    // statx(2): the one stat call whose structure is the same on every Linux architecture (256 bytes,
    // fields at fixed offsets), so it is read from a plain buffer.
    private static class NativeStat
    {
        public const int CurrentFolder = -100; // AT_FDCWD
        public const int EmptyPath = 0x1000;   // AT_EMPTY_PATH: the descriptor itself
        public const int NoSuchFile = 2;       // ENOENT
        public const int NotAFolder = 20;      // ENOTDIR
        private const uint BasicStats = 0x7FF; // STATX_BASIC_STATS
        private static bool _unavailable = !OperatingSystem.IsLinux();

        // Null on success (mode and identity set, or both null where statx is not to be had); else the errno.
        public static int? TryStat(int folder, string path, int flags, out int? mode, out FileIdentity? identity)
        {
            mode = null;
            identity = null;
            if (_unavailable)
            {
                return null;
            }

            var buffer = new byte[256];
            try
            {
                if (Statx(folder, path, flags, BasicStats, buffer) != 0)
                {
                    var error = Marshal.GetLastPInvokeError();
                    // ENOSYS: a kernel without statx; EPERM: a sandbox that forbids it (stat itself never says EPERM).
                    return error is 38 or 1 ? Unavailable() : error;
                }
            }
            catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
            {
                return Unavailable();
            }

            mode = BitConverter.ToUInt16(buffer, 28);
            var device = ((ulong)BitConverter.ToUInt32(buffer, 136) << 32) | BitConverter.ToUInt32(buffer, 140);
            identity = new FileIdentity(device, BitConverter.ToUInt64(buffer, 32));
            return null;
        }

        private static int? Unavailable()
        {
            _unavailable = true;
            return null;
        }

        [DllImport("libc", EntryPoint = "statx", SetLastError = true)]
        [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
        private static extern int Statx(int folder, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, [Out] byte[] buffer);
    }
}
