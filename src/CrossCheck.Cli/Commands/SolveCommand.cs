using System.CommandLine;
using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary><c>crosscheck solve SUBMISSION</c>: prints the recomputed end moments.</summary>
internal static class SolveCommand
{
    public static Command Create(CliIo io)
    {
        var submission = new Argument<string>("submission") { Description = "A folder of CSV tables, a single CSV file with [table] sections, or a text PDF." };
        var format = new Option<string>("--format", "-f") { Description = "Output format.", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong("table", "csv", "json");
        var output = new Option<string?>("--out", "-o") { Description = "Write to this file instead of standard output." };
        var limitOptions = new LimitOptions(SolveJob.Limits);
        var cmd = new Command("solve", "Recompute every member end moment of a submission with the independent stiffness solver.")
        {
            submission, format, output,
        };
        limitOptions.AddTo(cmd);
        cmd.SetAction(pr =>
        {
            var limits = limitOptions.Read(pr, io);
            return limits is null ? ExitCodes.InputError : Run(pr.GetValue(submission)!, pr.GetValue(format)!, pr.GetValue(output), limits, io);
        });
        return cmd;
    }

    private static int Run(string path, string format, string? outPath, Import.InputLimits limits, CliIo io)
    {
        if (JobOutput.RefuseInput(outPath, path) is { } clash)
        {
            CommandSupport.Fail(clash, io);
            return ExitCodes.InputError;
        }
        var outcome = SolveJob.Run(path, limits);
        CommandSupport.Warnings(outcome.Warnings, io);
        if (outcome.Report is not { } report)
        {
            CommandSupport.ReportErrors(path, outcome.Errors, outcome.StructureProblem, io);
            return ExitCodes.InputError;
        }
        foreach (var note in report.Result.Notes) io.Error.WriteLine(CommandSupport.Clean($"note: {note}"));
        string content;
        switch (format)
        {
            case "csv":
                content = report.ToCsv();
                break;
            case "json":
                content = report.ToJson();
                break;
            default:
                if (outPath is null)
                {
                    RenderTable(report, io);
                    return ExitCodes.Concur;
                }
                var sw = new StringWriter(CultureInfo.InvariantCulture);
                RenderTable(report, new CliIo(sw, io.Error, false));
                content = sw.ToString();
                break;
        }
        return CommandSupport.Emit(outPath, content, io) ? ExitCodes.Concur : ExitCodes.InputError;
    }

    private static void RenderTable(SolveReport report, CliIo io)
    {
        var console = CommandSupport.Console(io);
        var s = report.Submission;
        console.WriteLine(CommandSupport.Clean($"{s.Info.Title ?? Path.GetFileName(s.Source)}: recomputed member end moments"));
        console.WriteLine($"moments in {report.MomentUnit}, {report.ConventionName}");
        foreach (var c in report.Result.Cases)
        {
            string title = report.CombinationWords(c.Case) is { } words ? $"combination {c.Case} = {words}" : $"load case {c.Case}";
            CommandSupport.Line(console, (title, null));
            var table = new Table().Border(TableBorder.Simple);
            table.AddColumn("member");
            table.AddColumn("at joint");
            table.AddColumn(new TableColumn(Markup.Escape($"moment [{report.MomentUnit}]")).RightAligned());
            foreach (var r in report.EndMoments.Where(e => e.Case == c.Case))
                table.AddRow(CommandSupport.Cell(r.Member), CommandSupport.Cell(r.At), CommandSupport.Cell(Fmt.Number(r.Moment)));
            console.Write(table);
        }
        foreach (var g in report.Envelopes.GroupBy(r => r.Combination))
        {
            console.WriteLine($"envelope of combination {g.Key} = {report.Submission.Combination(g.Key)?.Words}");
            console.WriteLine("at a joint: the end moments, largest and least; at span: the largest span moment, sagging positive");
            var table = new Table().Border(TableBorder.Simple).Title(Markup.Escape($"envelope of {g.Key}"));
            table.AddColumn("member");
            table.AddColumn("at");
            table.AddColumn(new TableColumn(Markup.Escape($"max [{report.MomentUnit}]")).RightAligned());
            table.AddColumn("loaded for max");
            table.AddColumn(new TableColumn(Markup.Escape($"min [{report.MomentUnit}]")).RightAligned());
            table.AddColumn("loaded for min");
            foreach (var r in g)
                table.AddRow(Markup.Escape(r.Member), Markup.Escape(r.At), Fmt.Number(r.Max), Markup.Escape(Loaded(r.MaxLoaded)),
                    r.Min is double min ? Fmt.Number(min) : "", r.Min is null ? "" : Markup.Escape(Loaded(r.MinLoaded)));
            console.Write(table);
        }
    }

    private static string Loaded(IReadOnlyList<string> members) => members.Count == 0 ? "none" : string.Join(" ", members);
}
