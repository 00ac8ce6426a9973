using CrossCheck.Import.Pdf;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>Reads a submission from a folder of CSV files, a single sectioned CSV file, or a text PDF.</summary>
public static class SubmissionReader
{
    /// <summary>Reads the submission at <paramref name="path"/>. Never throws for bad input: problems are returned.</summary>
    public static ImportResult Read(string path) => Read(path, null);

    /// <summary>Reads the submission at <paramref name="path"/>, reading a PDF within <paramref name="pdfLimits"/>.</summary>
    public static ImportResult Read(string path, PdfLimits? pdfLimits)
    {
        ArgumentNullException.ThrowIfNull(path);
        var problems = new List<InputProblem>();
        string display = Path.GetFileName(Path.TrimEndingDirectorySeparator(path));
        if (Directory.Exists(path)) return ReadFolder(path, problems);
        if (!File.Exists(path))
            return new ImportResult(null, [new InputProblem(new SourceRef(display.Length > 0 ? display : path), Messages.NotFound(path))]);
        string ext = Path.GetExtension(path).ToLowerInvariant();
        if (ext is ".csv" or ".txt")
        {
            var tables = CsvTableReader.ReadSectioned(path, display, problems);
            return SubmissionBuilder.Build(path, tables, problems);
        }
        if (ext == ".pdf") return PdfSubmissionReader.Read(path, pdfLimits);
        return new ImportResult(null, [new InputProblem(new SourceRef(display), Messages.Unsupported(path))]);
    }

    private static ImportResult ReadFolder(string folder, List<InputProblem> problems)
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
            var t = CsvTableReader.ReadSingle(file, display, name, problems);
            if (t is not null) tables.Add(t);
        }
        if (files.Count == 0)
            problems.Add(new InputProblem(new SourceRef(Path.GetFileName(Path.TrimEndingDirectorySeparator(folder))),
                "the folder holds no CSV tables (expected joints.csv, members.csv, loads.csv, end-moments.csv, ...)"));
        return SubmissionBuilder.Build(folder, tables, problems);
    }
}
