using System.Globalization;

namespace CrossCheck.Common;

/// <summary>Why <see cref="InputFile"/> would not read a file.</summary>
public enum InputRefusal
{
    /// <summary>Nothing is there (or a link leads nowhere).</summary>
    Missing,
    /// <summary>A folder, device, named pipe or socket: not a regular file.</summary>
    NotAFile,
    /// <summary>A link that leads out of the folder the input must stay in.</summary>
    OutsideFolder,
    /// <summary>More bytes than the budget allows (counted while reading, whatever size the file reports).</summary>
    TooLarge,
    /// <summary>No permission, or an error while reading.</summary>
    Unreadable,
}

/// <summary>A file <see cref="InputFile"/> would not read, with a sentence that names it and says why (never its content).</summary>
public sealed class InputFileException : IOException
{
    public InputFileException() { }
    public InputFileException(string message) : base(message) { }
    public InputFileException(string message, Exception inner) : base(message, inner) { }

    public InputFileException(InputRefusal refusal, string message, FileKind kind = FileKind.Regular, long bytes = 0) : base(message)
    {
        Refusal = refusal;
        Kind = kind;
        Bytes = bytes;
    }

    public InputRefusal Refusal { get; }

    /// <summary>What the path named, for <see cref="InputRefusal.NotAFile"/>.</summary>
    public FileKind Kind { get; }

    /// <summary>For <see cref="InputRefusal.TooLarge"/>: the size the file reports, or the bytes read before giving up.</summary>
    public long Bytes { get; }
}

/// <summary>
/// Every file CrossCheck reads from a submission, a template or a register path goes through here: the file is opened
/// once (a named pipe does not block the opening), the opened handle must be a regular file, a link must not lead out of
/// the folder given (the submission's, or the screened folder), and the bytes are counted as they are read from the
/// stream against a budget — a device or a growing file reports a size of 0, so the reported size is never trusted.
/// </summary>
public static class InputFile
{
    /// <summary>Reads the whole file at <paramref name="path"/>, at most <paramref name="maxBytes"/> bytes.</summary>
    /// <param name="path">The file.</param>
    /// <param name="maxBytes">The budget: a file with more bytes is refused (<see cref="InputRefusal.TooLarge"/>).</param>
    /// <param name="within">A folder the file must lie in once every link is resolved; null for none.</param>
    /// <exception cref="InputFileException">The file is not read; the message says why.</exception>
    public static byte[] Read(string path, long maxBytes, string? within = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        string name = Path.GetFileName(Path.TrimEndingDirectorySeparator(path)) is { Length: > 0 } n ? n : path;
        if (within is not null) CheckInside(path, within, name);
        Microsoft.Win32.SafeHandles.SafeFileHandle? handle;
        FileKind kind;
        try
        {
            handle = FileFacts.OpenRegular(path, out kind);
        }
        catch (FileNotFoundException)
        {
            throw new InputFileException(InputRefusal.Missing, $"'{name}' does not exist", FileKind.Missing);
        }
        catch (UnauthorizedAccessException)
        {
            throw new InputFileException(InputRefusal.Unreadable, $"'{name}' may not be read (permission denied)");
        }
        catch (IOException ex)
        {
            throw new InputFileException(InputRefusal.Unreadable, $"'{name}' cannot be opened: {ex.Message}");
        }
        if (handle is null)
            throw new InputFileException(InputRefusal.NotAFile, $"'{name}' is {FileFacts.Describe(kind)}; CrossCheck reads regular files only", kind);
        using (handle)
        {
            try
            {
                using var stream = new FileStream(handle, FileAccess.Read, 1);
                long reported = stream.Length;
                if (reported > maxBytes) throw new InputFileException(InputRefusal.TooLarge, TooLargeMessage(name, reported, maxBytes), FileKind.Regular, reported);
                var buffer = new byte[(int)Math.Min(Math.Max(reported, 0) + 1, Math.Min(maxBytes + 1, Array.MaxLength))];
                int total = 0;
                while (true)
                {
                    if (total == buffer.Length)
                    {
                        if (total > maxBytes) throw new InputFileException(InputRefusal.TooLarge, TooLargeMessage(name, total, maxBytes), FileKind.Regular, total);
                        Array.Resize(ref buffer, (int)Math.Min((long)buffer.Length * 2, Math.Min(maxBytes + 1, Array.MaxLength)));
                    }
                    int read = stream.Read(buffer, total, buffer.Length - total);
                    if (read == 0) break;
                    total += read;
                }
                if (total > maxBytes) throw new InputFileException(InputRefusal.TooLarge, TooLargeMessage(name, total, maxBytes), FileKind.Regular, total);
                return total == buffer.Length ? buffer : buffer[..total];
            }
            catch (IOException ex) when (ex is not InputFileException)
            {
                throw new InputFileException(InputRefusal.Unreadable, $"'{name}' could not be read: {ex.Message}");
            }
        }
    }

    /// <summary>Refuses a path whose links lead out of <paramref name="folder"/> (compared after resolving every link on both).</summary>
    /// <exception cref="InputFileException">They do.</exception>
    public static void CheckInside(string path, string folder, string? name = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(folder);
        name ??= Path.GetFileName(Path.TrimEndingDirectorySeparator(path));
        string real = RealPath.Of(path);
        string root = RealPath.Of(folder);
        if (!RealPath.IsInside(real, root))
            throw new InputFileException(InputRefusal.OutsideFolder,
                $"'{name}' is a link to '{real}', outside the folder '{Path.GetFileName(root)}'; CrossCheck reads only files inside the folder it is given, so it was not read");
    }

    private static string TooLargeMessage(string name, long bytes, long max) =>
        string.Create(CultureInfo.InvariantCulture, $"'{name}' holds more than {max} bytes (at least {bytes} were found), more than CrossCheck reads");
}

/// <summary>Paths with every symbolic link resolved, to tell whether a file lies in a folder and whether two paths are one file.</summary>
public static class RealPath
{
    /// <summary>
    /// The absolute path of <paramref name="path"/> with every link along it resolved (the part that does not exist is kept as
    /// written); loops and chains of more than 40 links stop resolving.
    /// </summary>
    public static string Of(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        return Resolve(Path.GetFullPath(path), 0);
    }

    /// <summary>True when <paramref name="realPath"/> is <paramref name="realFolder"/> or lies under it (both already resolved).</summary>
    public static bool IsInside(string realPath, string realFolder)
    {
        ArgumentNullException.ThrowIfNull(realPath);
        ArgumentNullException.ThrowIfNull(realFolder);
        string folder = Path.TrimEndingDirectorySeparator(realFolder);
        return string.Equals(realPath, folder, StringComparison.Ordinal)
               || realPath.StartsWith(folder.EndsWith(Path.DirectorySeparatorChar) ? folder : folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);
    }

    private static string Resolve(string full, int depth)
    {
        string root = Path.GetPathRoot(full) ?? "/";
        string current = root;
        var parts = full[root.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries);
        for (int i = 0; i < parts.Length; i++)
        {
            string next = Path.Combine(current, parts[i]);
            string? target = null;
            try
            {
                target = depth < 40 ? new FileInfo(next).LinkTarget : null;
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                target = null;
            }
            if (target is null)
            {
                current = next;
                continue;
            }
            string resolved = Path.GetFullPath(Path.IsPathRooted(target) ? target : Path.Combine(current, target));
            current = Resolve(resolved, depth + 1);
        }
        return current;
    }
}
