using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Import.Workbook;

namespace CrossCheck.Jobs;

/// <summary>What <c>crosscheck extract</c> did.</summary>
/// <param name="Extraction">What was read from the PDF (null when it was refused before reading).</param>
/// <param name="Files">The CSV files written (empty when nothing was written).</param>
/// <param name="Problem">Why nothing (or not everything) was written, a sentence for the user; null when the tables were written.</param>
/// <param name="Built">The tables interpreted as a submission: their errors and warnings, for the reviewer to correct.</param>
public sealed record ExtractOutcome(PdfExtraction? Extraction, IReadOnlyList<ContractFile> Files, string? Problem, ImportResult? Built)
{
    /// <summary>True when the tables were written.</summary>
    public bool Written => Problem is null;
}

/// <summary>
/// Reads the tables of a text PDF and writes them as a folder of CSV files of the submission format, so that a reviewer
/// can correct a misread cell and review the folder.
/// </summary>
public static class ExtractJob
{
    public static ExtractOutcome Run(string pdf, string outDir, bool force, InputLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(pdf);
        ArgumentNullException.ThrowIfNull(outDir);
        limits ??= InputLimits.Default;
        if (!File.Exists(pdf)) return new ExtractOutcome(null, [], $"'{pdf}' does not exist.", null);
        string ext = Path.GetExtension(pdf).ToLowerInvariant();
        if (ext is not ".pdf" and not ".xlsx")
            return new ExtractOutcome(null, [], $"'{pdf}' is not a .pdf file or an .xlsx workbook; extract reads text PDFs and workbooks (CSV submissions need no extracting).", null);
        var x = ext == ".pdf" ? PdfSubmissionReader.Extract(pdf, limits.Pdf) : WorkbookExtract(pdf, limits);
        if (x.Tables.Count == 0) return new ExtractOutcome(x, [], $"no tables were read from '{pdf}':", null);
        if (Directory.Exists(outDir) && Directory.EnumerateFileSystemEntries(outDir).Any() && !force && Directory.EnumerateFiles(outDir, "*.csv").Any())
            return new ExtractOutcome(x, [], $"'{outDir}' already holds CSV files; give --force to replace the tables in it, or choose another folder.", null);

        var built = SubmissionBuilder.Build(pdf, x.Tables, x.Problems, limits);
        var files = ContractCsv.Render(x.Tables);
        return JobOutput.TryWrite(outDir, () => WriteFolder(outDir, files), out var problem)
            ? new ExtractOutcome(x, files, null, built)
            : new ExtractOutcome(x, [], problem, built);
    }

    private static PdfExtraction WorkbookExtract(string path, InputLimits limits)
    {
        var problems = new List<InputProblem>();
        var bytes = SubmissionReader.ReadBytes(path, Path.GetFileName(path), limits, problems);
        return bytes is null ? new PdfExtraction(path, [], [], [], problems) : WorkbookSubmissionReader.Extract(bytes, path);
    }

    /// <summary>Writes every file atomically, then removes tables of the format the folder held from an earlier run.</summary>
    private static void WriteFolder(string dir, IReadOnlyList<ContractFile> files)
    {
        Directory.CreateDirectory(dir);
        // The file names are the format's table names; ChildPath makes sure each stays a plain name inside the folder.
        foreach (var f in files) AtomicFile.WriteText(SubmissionNames.ChildPath(dir, f.FileName), f.Content);
        var written = files.Select(f => f.FileName).ToHashSet(StringComparer.OrdinalIgnoreCase);
        foreach (var stale in Directory.EnumerateFiles(dir, "*.csv"))
        {
            string name = Path.GetFileName(stale);
            if (!written.Contains(name) && ContractCsv.IsTableName(Path.GetFileNameWithoutExtension(name))) File.Delete(stale);
        }
    }
}
