using System.Diagnostics.CodeAnalysis;
using CrossCheck.Common;

namespace CrossCheck.Jobs;

/// <summary>Writes a job's output file atomically; a path that cannot be written is a sentence for the user, not an exception.</summary>
public static class JobOutput
{
    /// <summary>Writes <paramref name="content"/> to <paramref name="path"/> (temporary file, then a move).</summary>
    /// <returns>False, with why, when the file cannot be written (a folder of that name, no permission, a missing drive).</returns>
    public static bool TryWrite(string path, string content, [NotNullWhen(false)] out string? problem) =>
        TryWrite(path, () => AtomicFile.WriteText(path, content), out problem);

    public static bool TryWrite(string path, byte[] content, [NotNullWhen(false)] out string? problem) =>
        TryWrite(path, () => AtomicFile.WriteBytes(path, content), out problem);

    /// <summary>Runs <paramref name="write"/>; nothing is left half-written when it fails.</summary>
    public static bool TryWrite(string path, Action write, [NotNullWhen(false)] out string? problem)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(write);
        try
        {
            write();
            problem = null;
            return true;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            problem = $"cannot write '{path}': {ex.Message}";
            return false;
        }
    }
}
