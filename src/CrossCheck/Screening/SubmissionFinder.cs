using CrossCheck.Common;

namespace CrossCheck.Screening;

/// <summary>A submission found in a folder to screen.</summary>
/// <param name="Name">The entry's name in the folder (<c>hall-b.csv</c>, <c>student-07</c>).</param>
/// <param name="Path">What is reviewed: the CSV or PDF file, the sub-folder of CSV tables, or the single PDF inside a sub-folder.</param>
/// <param name="Stem">A safe, unique file-name stem for its outputs (<see cref="SubmissionNames.SafeStem"/>).</param>
/// <param name="IsFolder">True for a sub-folder.</param>
public sealed record ScreenItem(string Name, string Path, string Stem, bool IsFolder)
{
    /// <summary>The name without a file's extension: what the submission is called when it states no reference.</summary>
    public string BaseName => IsFolder ? Name : System.IO.Path.GetFileNameWithoutExtension(Name) is { Length: > 0 } b ? b : Name;
}

/// <summary>What a folder to screen holds: the submissions, and the entries passed over (with why).</summary>
public sealed record FoundSubmissions(IReadOnlyList<ScreenItem> Items, IReadOnlyList<string> Skipped);

/// <summary>
/// Finds the submissions in a folder: every <c>.csv</c> and <c>.pdf</c> file directly in it, and every sub-folder
/// (a folder of CSV tables, or a folder holding one sectioned CSV file or one PDF). Hidden entries (starting with
/// <c>.</c>) and the paths in <c>exclude</c> (the output folder, the register) are passed over; so are other files.
/// Sub-folders are not searched further: each one is one submission.
/// </summary>
public static class SubmissionFinder
{
    /// <exception cref="DirectoryNotFoundException">The folder does not exist.</exception>
    public static FoundSubmissions Find(string folder, IEnumerable<string>? exclude = null)
    {
        ArgumentNullException.ThrowIfNull(folder);
        if (!Directory.Exists(folder)) throw new DirectoryNotFoundException($"the folder '{folder}' does not exist.");
        var excluded = (exclude ?? []).Select(p => Path.TrimEndingDirectorySeparator(Path.GetFullPath(p))).ToHashSet(StringComparer.Ordinal);
        var items = new List<(string Name, string Path, bool Folder)>();
        var skipped = new List<string>();
        foreach (var entry in Directory.EnumerateFileSystemEntries(folder).Order(StringComparer.Ordinal))
        {
            string name = Path.GetFileName(entry);
            string full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(entry));
            if (excluded.Contains(full) || excluded.Any(x => full.StartsWith(x + "-", StringComparison.Ordinal) && IsSqliteCompanion(full[x.Length..])))
                continue;
            if (name.StartsWith('.')) continue;
            if (Directory.Exists(entry))
            {
                items.Add((name, FolderTarget(entry), true));
                continue;
            }
            string ext = Path.GetExtension(name).ToLowerInvariant();
            if (ext is ".csv" or ".pdf") items.Add((name, entry, false));
            else skipped.Add($"{name}: not a submission (screening reads .csv and .pdf files and sub-folders)");
        }
        return new FoundSubmissions(AssignStems(items), skipped);
    }

    /// <summary>
    /// A sub-folder is read as a folder of CSV tables. One holding a single CSV file that is not named after a table
    /// (<c>calc.csv</c>) is read from that file, as a CSV with <c>[table]</c> sections; one holding no CSV file but
    /// exactly one PDF is read from that PDF.
    /// </summary>
    private static string FolderTarget(string dir)
    {
        var files = Directory.GetFiles(dir).Where(f => !Path.GetFileName(f).StartsWith('.')).ToList();
        var csvs = files.Where(f => Path.GetExtension(f).Equals(".csv", StringComparison.OrdinalIgnoreCase)).ToList();
        if (csvs.Count == 1 && Import.TableSchema.Find(Path.GetFileNameWithoutExtension(csvs[0])) is null) return csvs[0];
        var pdfs = files.Where(f => Path.GetExtension(f).Equals(".pdf", StringComparison.OrdinalIgnoreCase)).ToList();
        return csvs.Count == 0 && pdfs.Count == 1 ? pdfs[0] : dir;
    }

    private static bool IsSqliteCompanion(string suffix) => suffix is "-wal" or "-shm" or "-journal";

    /// <summary>
    /// Safe stems, made unique ignoring case (so outputs do not collide on case-insensitive disks either). Files whose
    /// names differ only in their extension (<c>hall.csv</c> and <c>hall.pdf</c>) keep the extension in the stem
    /// (<c>hall-csv</c>, <c>hall-pdf</c>), so each memo says which file it reviews; any other clash is numbered.
    /// </summary>
    private static List<ScreenItem> AssignStems(List<(string Name, string Path, bool Folder)> items)
    {
        string Plain((string Name, string Path, bool Folder) x) => SubmissionNames.SafeStem(x.Folder ? x.Name : Path.GetFileNameWithoutExtension(x.Name));
        var shared = items.GroupBy(Plain, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1).Select(g => g.Key).ToHashSet(StringComparer.OrdinalIgnoreCase);
        var used = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        var result = new List<ScreenItem>();
        foreach (var item in items)
        {
            string stem = Plain(item);
            if (shared.Contains(stem) && !item.Folder && Path.GetExtension(item.Name) is { Length: > 1 } ext)
                stem = SubmissionNames.SafeStem($"{stem}-{ext[1..].ToLowerInvariant()}");
            string candidate = stem;
            for (int k = 2; !used.Add(candidate); k++) candidate = $"{stem}-{k}";
            result.Add(new ScreenItem(item.Name, item.Path, candidate, item.Folder));
        }
        return result;
    }
}
