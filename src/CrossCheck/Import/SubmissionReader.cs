using CrossCheck.Common;
using CrossCheck.Import.Pdf;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>Reads a submission from a folder of CSV files, a single sectioned CSV file, or a text PDF.</summary>
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
        if (ext is ".csv" or ".txt")
        {
            var tables = CsvTableReader.ReadSectioned(path, display, problems, limits);
            return SubmissionBuilder.Build(path, tables, problems, limits);
        }
        if (ext == ".pdf") return PdfSubmissionReader.Read(path, limits);
        return new ImportResult(null, [new InputProblem(new SourceRef(display), Messages.Unsupported(path))]);
    }

    private static ImportResult ReadFolder(string folder, List<InputProblem> problems, InputLimits limits)
    {
        var tables = new List<RawTable>();
        var files = Directory.GetFiles(folder).Where(f => Path.GetExtension(f).Equals(".csv", StringComparison.OrdinalIgnoreCase))
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
        return SubmissionBuilder.Build(folder, tables, problems, limits);
    }
}
