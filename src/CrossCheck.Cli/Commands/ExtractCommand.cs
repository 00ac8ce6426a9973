using System.CommandLine;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;

namespace CrossCheck.Cli.Commands;

/// <summary>
/// <c>crosscheck extract FILE.pdf --out DIR</c>: writes the tables read from a PDF as a folder of CSV files of the
/// submission format, and says what was read and what was not, so that a reviewer can correct a misread cell and
/// review the folder.
/// </summary>
internal static class ExtractCommand
{
    public static Command Create(CliIo io)
    {
        var pdf = new Argument<string>("pdf") { Description = "A text PDF of the calculation." };
        var output = new Option<string>("--out", "-o") { Description = "Folder to write the CSV tables into.", Required = true };
        var force = new Option<bool>("--force") { Description = "Replace the CSV tables of a folder that already holds some." };
        var limitOptions = new LimitOptions();
        var cmd = new Command("extract", "Read the tables of a text PDF and write them as CSV files of the submission format.")
        {
            pdf, output, force,
        };
        limitOptions.AddTo(cmd);
        cmd.SetAction(pr =>
        {
            var limits = limitOptions.Read(pr, io);
            return limits is null ? ExitCodes.InputError : Run(pr.GetValue(pdf)!, pr.GetValue(output)!, pr.GetValue(force), limits, io);
        });
        return cmd;
    }

    private static int Run(string path, string outDir, bool force, InputLimits limits, CliIo io)
    {
        if (!File.Exists(path))
        {
            io.Error.WriteLine($"crosscheck: '{path}' does not exist.");
            return ExitCodes.InputError;
        }
        if (!Path.GetExtension(path).Equals(".pdf", StringComparison.OrdinalIgnoreCase))
        {
            io.Error.WriteLine($"crosscheck: '{path}' is not a .pdf file; extract reads text PDFs (CSV submissions need no extracting).");
            return ExitCodes.InputError;
        }
        var x = PdfSubmissionReader.Extract(path, limits.Pdf);
        if (x.Tables.Count == 0)
        {
            io.Error.WriteLine($"crosscheck: no tables were read from '{path}':");
            foreach (var e in x.Problems.Where(p => p.IsError)) io.Error.WriteLine($"  {e.Where.Compact}: {e.Message}");
            return ExitCodes.InputError;
        }
        if (Directory.Exists(outDir) && Directory.EnumerateFileSystemEntries(outDir).Any() && !force
            && Directory.EnumerateFiles(outDir, "*.csv").Any())
        {
            io.Error.WriteLine($"crosscheck: '{outDir}' already holds CSV files; give --force to replace the tables in it, or choose another folder.");
            return ExitCodes.InputError;
        }

        var built = SubmissionBuilder.Build(path, x.Tables, x.Problems, limits);
        var files = ContractCsv.Render(x.Tables);
        PrintFound(x, io);
        if (!CommandSupport.TryWrite(outDir, () => WriteFolder(outDir, files), io)) return ExitCodes.InputError;
        io.Output.WriteLine($"wrote {files.Count} table{(files.Count == 1 ? "" : "s")} to {outDir}: {string.Join(", ", files.Select(f => f.FileName))}");

        foreach (var w in built.Warnings) io.Error.WriteLine($"warning: {w}");
        var errors = built.Errors.ToList();
        if (errors.Count == 0)
        {
            io.Output.WriteLine($"check the tables against the PDF, then run: crosscheck review {outDir}");
            return ExitCodes.Concur;
        }
        io.Error.WriteLine($"crosscheck: the tables read from '{path}' have {errors.Count} problem{(errors.Count == 1 ? "" : "s")}; correct them in {outDir} and review the folder:");
        foreach (var e in errors) io.Error.WriteLine($"  {e.Where.Compact}: {e.Message}");
        return ExitCodes.InputError;
    }

    private static void PrintFound(PdfExtraction x, CliIo io)
    {
        io.Output.WriteLine($"{Path.GetFileName(x.Source)}: {x.Found.Count} table{(x.Found.Count == 1 ? "" : "s")} read");
        foreach (var f in x.Found)
        {
            io.Output.WriteLine($"  {f.Table}: {f.Rows} row{(f.Rows == 1 ? "" : "s")}, {f.Where}{(f.Note is null ? "" : $" ({f.Note})")}");
            foreach (var c in f.Columns) io.Output.WriteLine($"      {c}");
        }
        foreach (var n in x.Notes) io.Output.WriteLine($"note: {n.What} ({n.Where.Citation})");
        if (x.Ignored.Count == 0) return;
        io.Output.WriteLine("not read:");
        foreach (var i in x.Ignored) io.Output.WriteLine($"  {i.Where.Citation}: {i.What}");
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
