using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;

namespace CrossCheck.Common;

/// <summary>
/// Writes output files so that a reader never sees half a file: the content goes to a temporary file in the same folder,
/// which is then moved over the target in one step. Only regular files are replaced: a device or a named pipe (<c>/dev/null</c>,
/// a FIFO another program reads) is written into as a stream, never replaced by a file, and <c>-</c>, <c>/dev/stdout</c> and
/// <c>/dev/fd/1</c> mean standard output. The temporary name is bounded in length (a legal long name works), and temporary files
/// left by a process that was killed are removed (<see cref="CleanStale"/>).
/// </summary>
public static partial class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(false);

    /// <summary>The longest file name in bytes most file systems allow.</summary>
    public const int MaxNameBytes = 255;

    public static void WriteText(string path, string content, bool replaceSpecial = false) => WriteBytes(path, Utf8NoBom.GetBytes(content), replaceSpecial);

    /// <summary>
    /// Writes <paramref name="content"/> to <paramref name="path"/>: replaced whole when it is (or will be) a regular file,
    /// streamed into when it is a device or pipe (unless <paramref name="replaceSpecial"/>, for names CrossCheck chose itself in
    /// its own output folder, where a pipe must not make it wait).
    /// </summary>
    /// <exception cref="IOException">The path is a folder, or cannot be written.</exception>
    public static void WriteBytes(string path, byte[] content, bool replaceSpecial = false)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(content);
        if (OutputTarget.IsStandardOutput(path))
        {
            using var stdout = Console.OpenStandardOutput();
            stdout.Write(content);
            stdout.Flush();
            return;
        }
        string full = Path.GetFullPath(path);
        var facts = FileFacts.Of(full);
        if (facts.Kind == FileKind.Directory) throw new IOException($"'{path}' is a folder");
        if (facts.Kind is FileKind.Socket) throw new IOException($"'{path}' is {FileFacts.Describe(facts.Kind)}");
        if (!replaceSpecial && facts.Kind is FileKind.CharacterDevice or FileKind.BlockDevice or FileKind.Pipe or FileKind.Other)
        {
            // Written into, as a shell's '>' would: a device stays a device.
            using var stream = new FileStream(full, FileMode.Open, FileAccess.Write, FileShare.ReadWrite);
            stream.Write(content);
            stream.Flush();
            return;
        }
        string dir = Path.GetDirectoryName(full) ?? ".";
        Directory.CreateDirectory(dir);
        string temp = Path.Combine(dir, TemporaryName(Path.GetFileName(full), Environment.ProcessId));
        try
        {
            using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                fs.Write(content);
                fs.Flush(flushToDisk: true);
            }
            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp)) File.Delete(temp);
        }
    }

    /// <summary>
    /// <c>.NAME.PID.RANDOM.tmp</c>, with NAME shortened (on a character boundary) so that the whole is at most
    /// <see cref="MaxNameBytes"/> bytes in UTF-8.
    /// </summary>
    public static string TemporaryName(string fileName, int processId)
    {
        ArgumentNullException.ThrowIfNull(fileName);
        string suffix = string.Create(CultureInfo.InvariantCulture, $".{processId}.{Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(4))}.tmp");
        int budget = MaxNameBytes - 1 - suffix.Length;
        var sb = new StringBuilder();
        int bytes = 0;
        for (int i = 0; i < fileName.Length; i++)
        {
            int width = char.IsHighSurrogate(fileName[i]) && i + 1 < fileName.Length ? 2 : 1;
            int size = Utf8NoBom.GetByteCount(fileName.AsSpan(i, width));
            if (bytes + size > budget) break;
            sb.Append(fileName, i, width);
            bytes += size;
            i += width - 1;
        }
        return "." + sb + suffix;
    }

    /// <summary>
    /// Removes the temporary files that writers killed before their move left in <paramref name="folder"/>: names of the
    /// form <see cref="TemporaryName"/> whose process has ended (or, where that cannot be told, older than a day).
    /// </summary>
    /// <returns>How many were removed.</returns>
    public static int CleanStale(string folder)
    {
        ArgumentNullException.ThrowIfNull(folder);
        if (!Directory.Exists(folder)) return 0;
        int removed = 0;
        try
        {
            foreach (var file in Directory.EnumerateFiles(folder, ".*.tmp"))
            {
                var m = TemporaryPattern().Match(Path.GetFileName(file));
                if (!m.Success || !int.TryParse(m.Groups["pid"].Value, NumberStyles.None, CultureInfo.InvariantCulture, out int pid)) continue;
                if (pid == Environment.ProcessId || Alive(pid, file)) continue;
                try
                {
                    File.Delete(file);
                    removed++;
                }
                catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
                {
                    // Another cleaner got there first, or it is not ours to remove.
                }
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // A folder that cannot be listed has nothing we can clean.
        }
        return removed;
    }

    private static bool Alive(int pid, string file)
    {
        if (OperatingSystem.IsLinux()) return Directory.Exists(string.Create(CultureInfo.InvariantCulture, $"/proc/{pid}"));
        return DateTime.UtcNow - File.GetLastWriteTimeUtc(file) < TimeSpan.FromDays(1);
    }

    [GeneratedRegex(@"^\..*\.(?<pid>[0-9]{1,10})\.(?:[0-9a-f]{8}|[0-9a-f]{32})\.tmp$")]
    private static partial Regex TemporaryPattern();
}

/// <summary>Where an output path leads, and whether it is one of the command's inputs.</summary>
public static class OutputTarget
{
    /// <summary><c>-</c>, <c>/dev/stdout</c>, <c>/dev/fd/1</c> and <c>/proc/self/fd/1</c>: standard output.</summary>
    public static bool IsStandardOutput(string path) => path is "-" or "/dev/stdout" or "/dev/fd/1" or "/proc/self/fd/1";

    /// <summary>
    /// A sentence when writing <paramref name="output"/> would replace one of <paramref name="inputs"/> (the same file by any
    /// path, link or hard link; for an input folder, a CSV file directly in it), else null.
    /// </summary>
    public static string? ClashWithInput(string output, IEnumerable<string?> inputs)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(inputs);
        if (IsStandardOutput(output)) return null;
        var target = FileFacts.Of(output);
        if (target.Kind is not (FileKind.Regular or FileKind.Missing)) return null;
        string real = RealPath.Of(output);
        foreach (var input in inputs)
        {
            if (input is null) continue;
            var facts = FileFacts.Of(input);
            string realInput = RealPath.Of(input);
            bool same = target.SameFileAs(facts) || string.Equals(real, realInput, StringComparison.Ordinal);
            bool tableOfFolder = facts.Kind == FileKind.Directory
                                 && string.Equals(Path.GetDirectoryName(real), Path.TrimEndingDirectorySeparator(realInput), StringComparison.Ordinal)
                                 && Path.GetExtension(real).Equals(".csv", StringComparison.OrdinalIgnoreCase);
            if (same || tableOfFolder)
                return $"the output '{output}' is {(same ? "" : "a table of ")}'{input}', which this command reads; choose another output file";
        }
        return null;
    }
}
