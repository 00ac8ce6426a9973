using System.CommandLine;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Jobs;

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
        var outcome = ExtractJob.Run(path, outDir, force, limits);
        if (outcome.Extraction is not { } x || outcome.Built is null && x.Tables.Count > 0)
        {
            CommandSupport.Fail(outcome.Problem!, io);
            return ExitCodes.InputError;
        }
        if (x.Tables.Count == 0)
        {
            CommandSupport.Fail(outcome.Problem!, io);
            foreach (var e in x.Problems.Where(p => p.IsError)) io.Error.WriteLine(CommandSupport.Clean($"  {e.Where.Located}: {e.Message}"));
            return ExitCodes.InputError;
        }
        PrintFound(x, io);
        if (!outcome.Written)
        {
            CommandSupport.Fail(outcome.Problem!, io);
            return ExitCodes.InputError;
        }
        var files = outcome.Files;
        io.Output.WriteLine(CommandSupport.Clean($"wrote {files.Count} table{(files.Count == 1 ? "" : "s")} to {outDir}: {string.Join(", ", files.Select(f => f.FileName))}"));

        var built = outcome.Built!;
        CommandSupport.Warnings(built.Warnings, io);
        var errors = built.Errors.ToList();
        if (errors.Count == 0)
        {
            io.Output.WriteLine(CommandSupport.Clean($"check the tables against the {(path.EndsWith(".xlsx", StringComparison.OrdinalIgnoreCase) ? "workbook" : "PDF")}, then run: crosscheck review {outDir}"));
            return ExitCodes.Concur;
        }
        CommandSupport.Fail($"the tables read from '{path}' have {errors.Count} problem{(errors.Count == 1 ? "" : "s")}; correct them in {outDir} and review the folder:", io);
        foreach (var e in errors) io.Error.WriteLine(CommandSupport.Clean($"  {e.Where.Located}: {e.Message}"));
        return ExitCodes.InputError;
    }

    private static void PrintFound(PdfExtraction x, CliIo io)
    {
        io.Output.WriteLine(CommandSupport.Clean($"{Path.GetFileName(x.Source)}: {x.Found.Count} table{(x.Found.Count == 1 ? "" : "s")} read"));
        foreach (var f in x.Found)
        {
            io.Output.WriteLine(CommandSupport.Clean($"  {f.Table}: {f.Rows} row{(f.Rows == 1 ? "" : "s")}, {f.Where}{(f.Note is null ? "" : $" ({f.Note})")}"));
            foreach (var c in f.Columns) io.Output.WriteLine(CommandSupport.Clean($"      {c}"));
        }
        foreach (var n in x.Notes) io.Output.WriteLine(CommandSupport.Clean($"note: {n.What} ({n.Where.Citation})"));
        if (x.Ignored.Count == 0) return;
        io.Output.WriteLine("not read:");
        foreach (var i in x.Ignored) io.Output.WriteLine(CommandSupport.Clean($"  {i.Where.Citation}: {i.What}"));
    }
}
