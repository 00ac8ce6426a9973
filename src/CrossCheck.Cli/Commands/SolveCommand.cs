using System.CommandLine;
using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Memo;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary><c>crosscheck solve SUBMISSION</c>: prints the recomputed end moments.</summary>
internal static class SolveCommand
{
    /// <summary>
    /// Recomputing a model needs no claims, and without a diagnosis to run a large frame costs little (the skyline
    /// solver handles 100,000 unknowns in about a second), so solve reads far bigger structures than review.
    /// </summary>
    private static readonly Import.InputLimits SolveLimits = Import.InputLimits.Default with
    {
        ClaimsRequired = false, MaxMembers = 50_000, MaxJoints = 100_000, MaxRows = 200_000,
    };

    public static Command Create(CliIo io)
    {
        var submission = new Argument<string>("submission") { Description = "A folder of CSV tables, a single CSV file with [table] sections, or a text PDF." };
        var format = new Option<string>("--format", "-f") { Description = "Output format.", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong("table", "csv", "json");
        var output = new Option<string?>("--out", "-o") { Description = "Write to this file instead of standard output." };
        var limitOptions = new LimitOptions(SolveLimits);
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
        var s = CommandSupport.Read(path, io, limits: limits);
        if (s is null) return ExitCodes.InputError;
        var result = CommandSupport.Solve(s, io);
        if (result is null) return ExitCodes.InputError;
        var report = new SolveReport(s, result);
        foreach (var note in result.Notes) io.Error.WriteLine($"note: {note}");
        switch (format)
        {
            case "csv":
                if (!CommandSupport.Emit(outPath, report.ToCsv(), io)) return ExitCodes.InputError;
                break;
            case "json":
                if (!CommandSupport.Emit(outPath, report.ToJson(), io)) return ExitCodes.InputError;
                break;
            default:
                if (outPath is not null)
                {
                    var sw = new StringWriter(CultureInfo.InvariantCulture);
                    RenderTable(report, new CliIo(sw, io.Error, false));
                    if (!CommandSupport.Emit(outPath, sw.ToString(), io)) return ExitCodes.InputError;
                }
                else
                {
                    RenderTable(report, io);
                }
                break;
        }
        return ExitCodes.Concur;
    }

    private static void RenderTable(SolveReport report, CliIo io)
    {
        var console = CommandSupport.Console(io);
        var s = report.Submission;
        console.WriteLine($"{s.Info.Title ?? Path.GetFileName(s.Source)}: recomputed member end moments");
        console.WriteLine($"moments in {report.MomentUnit}, {report.ConventionName}");
        foreach (var c in report.Result.Cases)
        {
            var table = new Table().Border(TableBorder.Simple).Title(Markup.Escape($"load case {c.Case}"));
            table.AddColumn("member");
            table.AddColumn("at joint");
            table.AddColumn(new TableColumn(Markup.Escape($"moment [{report.MomentUnit}]")).RightAligned());
            foreach (var r in report.EndMoments.Where(e => e.Case == c.Case))
                table.AddRow(Markup.Escape(r.Member), Markup.Escape(r.At), Fmt.Number(r.Moment));
            console.Write(table);
        }
    }
}
