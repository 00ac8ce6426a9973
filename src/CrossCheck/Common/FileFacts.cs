using System.Runtime.InteropServices;
using System.Text;
using Microsoft.Win32.SafeHandles;

namespace CrossCheck.Common;

/// <summary>What kind of thing a path names (after following links, unless asked not to).</summary>
public enum FileKind
{
    Missing,
    Regular,
    Directory,
    CharacterDevice,
    BlockDevice,
    Pipe,
    Socket,
    Link,
    Other,
}

/// <summary>
/// The kind of a file and which file it is (device and inode), read from the operating system: .NET reports a device,
/// a named pipe and a regular file alike ("Normal", length 0), and opening a named pipe to look at it blocks until a
/// writer comes. On Linux these come from <c>statx(2)</c> (its layout is the same on every architecture) and files are
/// opened with <c>O_NONBLOCK</c>; elsewhere, from what .NET can tell.
/// </summary>
/// <param name="Kind">Regular file, folder, device, pipe, ...</param>
/// <param name="Device">The file system's device number (0 when unknown).</param>
/// <param name="Inode">The file's number on that device (0 when unknown).</param>
public readonly record struct FileFacts(FileKind Kind, ulong Device, ulong Inode)
{
    public bool Exists => Kind != FileKind.Missing;

    /// <summary>True when both name the same file (same device and inode), whatever the path or link used.</summary>
    public bool SameFileAs(FileFacts other) => Exists && other.Exists && Inode != 0 && Device == other.Device && Inode == other.Inode;

    /// <summary>The kind in a few words: "a character device (such as /dev/null or /dev/zero)", "a named pipe".</summary>
    public static string Describe(FileKind kind) => kind switch
    {
        FileKind.Missing => "missing",
        FileKind.Regular => "a regular file",
        FileKind.Directory => "a folder",
        FileKind.CharacterDevice => "a character device (such as /dev/null or /dev/zero), not a file",
        FileKind.BlockDevice => "a block device (a disk), not a file",
        FileKind.Pipe => "a named pipe, not a file",
        FileKind.Socket => "a socket, not a file",
        FileKind.Link => "a symbolic link",
        _ => "not a regular file",
    };

    /// <summary>What is at <paramref name="path"/>, following links (a broken link is <see cref="FileKind.Missing"/>).</summary>
    public static FileFacts Of(string path, bool followLinks = true)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (path.Length == 0) return new(FileKind.Missing, 0, 0);
        if (Native.Available && Native.Stat(Native.AtFdCwd, Native.Bytes(path), followLinks ? 0 : Native.AtSymlinkNoFollow) is { } facts) return facts;
        return Managed(path, followLinks);
    }

    private static FileFacts Managed(string path, bool followLinks)
    {
        try
        {
            var info = new FileInfo(path);
            if (!followLinks && info.LinkTarget is not null) return new(FileKind.Link, 0, 0);
            if (Directory.Exists(path)) return new(FileKind.Directory, 0, 0);
            return File.Exists(path) ? new(FileKind.Regular, 0, 0) : new(FileKind.Missing, 0, 0);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return new(FileKind.Missing, 0, 0);
        }
    }

    /// <summary>
    /// Opens <paramref name="path"/> for reading without blocking on a named pipe, and says what it opened: the handle
    /// only when it is a regular file (the caller reads it), else null with the kind. Opened once, checked on the handle.
    /// </summary>
    /// <exception cref="FileNotFoundException">Nothing is there.</exception>
    /// <exception cref="UnauthorizedAccessException">It may not be read.</exception>
    /// <exception cref="IOException">It cannot be opened for another reason.</exception>
    internal static SafeFileHandle? OpenRegular(string path, out FileKind kind)
    {
        if (!Native.Available)
        {
            var facts = Managed(path, followLinks: true);
            kind = facts.Kind;
            if (kind == FileKind.Missing) throw new FileNotFoundException($"'{path}' does not exist.", path);
            return kind == FileKind.Regular ? File.OpenHandle(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete) : null;
        }
        int fd = Native.OpenRead(Native.Bytes(path));
        if (fd < 0)
        {
            int errno = Marshal.GetLastPInvokeError();
            kind = FileKind.Missing;
            throw errno switch
            {
                Native.ENOENT or Native.ENOTDIR or Native.ELOOP => new FileNotFoundException($"'{path}' does not exist.", path),
                Native.EACCES or Native.EPERM => new UnauthorizedAccessException($"permission to read '{path}' is denied."),
                _ => new IOException($"'{path}' cannot be opened ({Marshal.GetPInvokeErrorMessage(errno)})."),
            };
        }
        var handle = new SafeFileHandle(fd, ownsHandle: true);
        var opened = Native.Stat(fd, [0], Native.AtEmptyPath);
        kind = opened?.Kind ?? FileKind.Other;
        if (kind == FileKind.Regular) return handle;
        handle.Dispose();
        return null;
    }

    /// <summary>The Linux system calls this needs; <see cref="Available"/> is false elsewhere or when they cannot be reached.</summary>
    private static class Native
    {
        public const int AtFdCwd = -100;
        public const int AtSymlinkNoFollow = 0x100;
        public const int AtEmptyPath = 0x1000;
        public const int ENOENT = 2, EACCES = 13, EPERM = 1, ENOTDIR = 20, ELOOP = 40;
        private const int ORdOnly = 0, ONoCtty = 0x100, ONonBlock = 0x800, OCloExec = 0x80000;
        private const uint StatxType = 0x1, StatxIno = 0x100;

        public static readonly bool Available = OperatingSystem.IsLinux() && Probe();

        private static bool Probe()
        {
            try
            {
                return Stat(AtFdCwd, Bytes("/"), 0) is { Kind: FileKind.Directory };
            }
            catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException or MarshalDirectiveException)
            {
                return false;
            }
        }

        public static byte[] Bytes(string path)
        {
            int n = Encoding.UTF8.GetByteCount(path);
            var bytes = new byte[n + 1];
            Encoding.UTF8.GetBytes(path, bytes);
            return bytes;
        }

        public static FileFacts? Stat(int dirfd, byte[] path, int flags)
        {
            var buffer = new byte[256];
            if (statx(dirfd, path, flags, StatxType | StatxIno, buffer) != 0)
            {
                int errno = Marshal.GetLastPInvokeError();
                return errno is ENOENT or ENOTDIR or ELOOP ? new FileFacts(FileKind.Missing, 0, 0) : null;
            }
            // struct statx: stx_mode (u16) at 28, stx_ino (u64) at 32, stx_dev_major/minor (u32) at 136/140.
            int mode = BitConverter.ToUInt16(buffer, 28);
            ulong inode = BitConverter.ToUInt64(buffer, 32);
            ulong device = ((ulong)BitConverter.ToUInt32(buffer, 136) << 32) | BitConverter.ToUInt32(buffer, 140);
            var kind = (mode & 0xF000) switch
            {
                0x8000 => FileKind.Regular,
                0x4000 => FileKind.Directory,
                0x2000 => FileKind.CharacterDevice,
                0x6000 => FileKind.BlockDevice,
                0x1000 => FileKind.Pipe,
                0xC000 => FileKind.Socket,
                0xA000 => FileKind.Link,
                _ => FileKind.Other,
            };
            return new FileFacts(kind, device, inode);
        }

        public static int OpenRead(byte[] path) => open(path, ORdOnly | ONonBlock | OCloExec | ONoCtty);

        [DllImport("libc", SetLastError = true)]
        private static extern int statx(int dirfd, byte[] pathname, int flags, uint mask, [Out] byte[] statxbuf);

        [DllImport("libc", SetLastError = true)]
        private static extern int open(byte[] pathname, int flags);
    }
}
