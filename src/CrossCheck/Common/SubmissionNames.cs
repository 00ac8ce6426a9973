using System.Text.RegularExpressions;

namespace CrossCheck.Common;

/// <summary>
/// Names derived from a submission's path, and output file names that are safe to create: whatever a submission
/// is called, the file written for it stays inside the output folder.
/// </summary>
public static partial class SubmissionNames
{
    /// <summary>The file or folder name as given: <c>footbridge.csv</c>, <c>shed-frame</c>.</summary>
    public static string DisplayName(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        string name = Path.GetFileName(Path.TrimEndingDirectorySeparator(path));
        return name.Length > 0 ? name : path;
    }

    /// <summary>The name without the extension of a file (a folder keeps its whole name): <c>footbridge</c>, <c>shed-frame</c>.</summary>
    public static string BaseName(string path)
    {
        string name = DisplayName(path);
        return Directory.Exists(path) ? name : Path.GetFileNameWithoutExtension(name) is { Length: > 0 } stem ? stem : name;
    }

    /// <summary>
    /// A file-name stem made only of letters, digits and <c>. _ + -</c>, not starting with a dot, at most 80
    /// characters, never empty and never a device name: <c>../../etc</c> becomes <c>etc</c>, <c>Hall B (rev 2)</c>
    /// becomes <c>Hall_B_rev_2</c>, <c>Überführung</c> stays as it is.
    /// </summary>
    public static string SafeStem(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        string s = UnsafeRun().Replace(name, "_");
        s = s.Trim('.', '_', '-', '+');
        s = DotRun().Replace(s, ".");
        if (s.Length > 80) s = s[..80].TrimEnd('.', '_', '-', '+');
        if (s.Length == 0) s = "submission";
        if (DeviceName().IsMatch(s)) s = "_" + s;
        return s;
    }

    /// <summary>
    /// The full path of <paramref name="fileName"/> inside <paramref name="folder"/>, after checking that it is a
    /// plain name that resolves to a direct child of the folder.
    /// </summary>
    /// <exception cref="ArgumentException">The name has a directory part or would resolve outside the folder.</exception>
    public static string ChildPath(string folder, string fileName)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(fileName);
        if (fileName.Length == 0 || fileName is "." or ".." || fileName.IndexOfAny(['/', '\\', '\0']) >= 0 || Path.IsPathRooted(fileName))
            throw new ArgumentException($"'{fileName}' is not a plain file name.", nameof(fileName));
        string root = Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder));
        string full = Path.GetFullPath(Path.Combine(root, fileName));
        if (!string.Equals(Path.GetDirectoryName(full), root, StringComparison.Ordinal))
            throw new ArgumentException($"'{fileName}' would be written outside '{root}'.", nameof(fileName));
        return full;
    }

    [GeneratedRegex(@"[^\p{L}\p{M}\p{Nd}._+-]+")]
    private static partial Regex UnsafeRun();

    [GeneratedRegex(@"\.{2,}")]
    private static partial Regex DotRun();

    [GeneratedRegex(@"^(CON|PRN|AUX|NUL|COM[0-9]|LPT[0-9])(\..*)?$", RegexOptions.IgnoreCase)]
    private static partial Regex DeviceName();
}
