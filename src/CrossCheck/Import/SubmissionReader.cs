using CrossCheck.Common;
using CrossCheck.Import.Pdf;
using CrossCheck.Import.Roles;
using CrossCheck.Import.Workbook;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// Reads a submission from a folder of CSV (or tab-separated) files, a single sectioned CSV or tab-separated file, a
/// text PDF, or an <c>.xlsx</c> workbook. Tables read as text cells go through <see cref="RawTableRoles"/> (column roles
/// from headers and contents) before they are built.
/// </summary>
public static class SubmissionReader
{
    /// <summary>Reads the submission at <paramref name="path"/> within the default <see cref="InputLimits"/>. Never throws for bad input: problems are returned.</summary>
    public static ImportResult Read(string path) => Read(path, InputLimits.Default);

    /// <summary>Reads the submission at <paramref name="path"/>, reading a PDF within <paramref name="pdfLimits"/>.</summary>
    public static ImportResult Read(string path, PdfLimits? pdfLimits) =>
        Read(path, pdfLimits is null ? InputLimits.Default : InputLimits.Default with { Pdf = pdfLimits });

    /// <summary>Reads the submission at <paramref name="path"/> within <paramref name="limits"/> (see <see cref="InputLimits"/>).</summary>
    public static ImportResult Read(string path, InputLimits limits)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(limits);
        var problems = new List<InputProblem>();
        string display = Path.GetFileName(Path.TrimEndingDirectorySeparator(path));
        // A folder's tables must lie in it (a table linked to a system file is not read), or in the folder screened.
        if (Directory.Exists(path)) return ReadFolder(path, problems, limits with { Within = limits.Within ?? path });
        if (!File.Exists(path) && FileFacts.Of(path).Kind == FileKind.Missing)
            return new ImportResult(null, [new InputProblem(new SourceRef(display.Length > 0 ? display : path), Messages.NotFound(path))]);
        string ext = Path.GetExtension(path).ToLowerInvariant();
        if (ext is ".csv" or ".txt" or ".tsv")
        {
            var tables = CsvTableReader.ReadSectioned(path, display, problems, limits);
            return SubmissionBuilder.Build(path, RawTableRoles.Apply(tables, problems), problems, limits);
        }
        if (ext == ".pdf") return PdfSubmissionReader.Read(path, limits);
        if (ext == ".xlsx")
        {
            var bytes = ReadBytes(path, display, limits, problems);
            return bytes is null ? new ImportResult(null, problems) : WorkbookSubmissionReader.Read(bytes, path, limits);
        }
        return new ImportResult(null, [new InputProblem(new SourceRef(display), Messages.Unsupported(path))]);
    }

    /// <summary>The extensions of the files a submission may be, besides a folder.</summary>
    public static IReadOnlyList<string> FileExtensions { get; } = [".csv", ".txt", ".tsv", ".pdf", ".xlsx"];

    /// <summary>
    /// The bytes of an input file within <see cref="InputLimits.MaxFileBytes"/> (null, with the problem reported, when it
    /// is too large, not a regular file, outside the folder read, or cannot be read): the one place a workbook is opened.
    /// </summary>
    internal static byte[]? ReadBytes(string path, string display, InputLimits limits, List<InputProblem> problems) =>
        InputFiles.ReadBytes(path, new SourceRef(display), limits.Within, limits.MaxFileBytes, problems, Messages.FileTooLarge, Messages.WorkbookDamaged);

    private static ImportResult ReadFolder(string folder, List<InputProblem> problems, InputLimits limits)
    {
        var tables = new List<RawTable>();
        var files = Directory.GetFiles(folder).Where(f => Path.GetExtension(f).ToLowerInvariant() is ".csv" or ".tsv")
            .Order(StringComparer.Ordinal).ToList();
        foreach (var file in files)
        {
            string name = Path.GetFileNameWithoutExtension(file);
            string display = Path.GetFileName(file);
            if (TableSchema.Find(name) is null)
            {
                problems.Add(new InputProblem(new SourceRef(display), Messages.UnknownTable(name), ProblemSeverity.Warning));
                continue;
            }
            var t = CsvTableReader.ReadSingle(file, display, name, problems, limits);
            if (t is not null) tables.Add(t);
        }
        if (files.Count == 0)
            problems.Add(new InputProblem(new SourceRef(Path.GetFileName(Path.TrimEndingDirectorySeparator(folder))), Messages.NoCsvInFolder));
        return SubmissionBuilder.Build(folder, RawTableRoles.Apply(tables, problems), problems, limits);
    }
}
