using System.Diagnostics.CodeAnalysis;
using CrossCheck.Common;

namespace CrossCheck.Jobs;

/// <summary>Writes a job's output file atomically; a path that cannot be written is a sentence for the user, not an exception.</summary>
public static class JobOutput
{
    /// <summary>Writes <paramref name="content"/> to <paramref name="path"/> (temporary file, then a move; a device or pipe is streamed into).</summary>
    /// <returns>False, with why, when the file cannot be written (a folder of that name, no permission, a missing drive).</returns>
    public static bool TryWrite(string path, string content, [NotNullWhen(false)] out string? problem) =>
        TryWrite(path, () => AtomicFile.WriteText(path, content), out problem);

    public static bool TryWrite(string path, byte[] content, [NotNullWhen(false)] out string? problem) =>
        TryWrite(path, () => AtomicFile.WriteBytes(path, content), out problem);

    /// <summary>Runs <paramref name="write"/>; nothing is left half-written when it fails, and temporary files a killed run left beside the target are removed.</summary>
    public static bool TryWrite(string path, Action write, [NotNullWhen(false)] out string? problem)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(write);
        try
        {
            if (!OutputTarget.IsStandardOutput(path) && Path.GetDirectoryName(Path.GetFullPath(path)) is { } dir) AtomicFile.CleanStale(dir);
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

    /// <summary>Null when <paramref name="output"/> may be written; else why not (it is one of <paramref name="inputs"/>).</summary>
    public static string? RefuseInput(string? output, params string?[] inputs) => output is null ? null : OutputTarget.ClashWithInput(output, inputs);
}
