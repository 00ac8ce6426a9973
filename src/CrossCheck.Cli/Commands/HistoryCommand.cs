using System.CommandLine;
using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Jobs;
using CrossCheck.Register;
using CrossCheck.Review;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary>
/// <c>crosscheck history [REFERENCE]</c>: the rounds of one reference in the register (or every reference), and
/// the register's maintenance commands (<c>crosscheck register export|check</c>).
/// </summary>
internal static class HistoryCommand
{
    public static Command Create(CliIo io)
    {
        var reference = new Argument<string?>("reference") { Description = "The submission reference (or name, when it states none). Without it: every reference.", Arity = ArgumentArity.ZeroOrOne };
        var register = RegisterOption();
        var cmd = new Command("history", "Print the review rounds of a reference from the register: verdicts, and the comments closed, persisting and new in each.")
        {
            reference, register,
        };
        cmd.SetAction(pr => Run(pr.GetValue(reference), pr.GetValue(register)!, io));
        return cmd;
    }

    public static Command CreateRegister(CliIo io)
    {
        var register = RegisterOption();
        var findings = new Option<bool>("--findings") { Description = "One row per finding (with its review) instead of one row per review." };
        var output = new Option<string?>("--out", "-o") { Description = "Write to this file instead of standard output." };
        var export = new Command("export", "Export the register as CSV.") { register, findings, output };
        export.SetAction(pr => Export(pr.GetValue(register)!, pr.GetValue(findings), pr.GetValue(output), io));

        var register2 = RegisterOption();
        var check = new Command("check", "Check the register file: SQLite integrity, every review's findings complete, rounds without gaps.") { register2 };
        check.SetAction(pr => Check(pr.GetValue(register2)!, io));

        return new Command("register", "Work with the review register file (export it, check it).") { export, check };
    }

    private static Option<string> RegisterOption() => new("--register")
    {
        Description = $"The register file (default: {ReviewRegister.DefaultFileName} in the current folder).",
        DefaultValueFactory = _ => ReviewRegister.DefaultFileName,
    };

    private static ReviewRegister? OpenExisting(string path, CliIo io)
    {
        if (RegisterJob.TryOpenExisting(path, out var register, out var problem)) return register;
        CommandSupport.Fail(problem, io);
        return null;
    }

    private static int Run(string? reference, string path, CliIo io)
    {
        using var register = OpenExisting(path, io);
        if (register is null) return ExitCodes.InputError;
        var console = CommandSupport.Console(io);
        if (reference is null)
        {
            var refs = register.References();
            if (refs.Count == 0) { console.WriteLine("The register holds no reviews yet."); return ExitCodes.Concur; }
            var t = new Table().Border(TableBorder.Simple);
            foreach (var (h, right) in new[] { ("reference", false), ("rounds", true), ("reviews", true), ("latest", true), ("date", false), ("verdict", false), ("open comments", true) })
                t.AddColumn(right ? new TableColumn(h).RightAligned() : new TableColumn(h));
            foreach (var r in refs)
                t.AddRow(Markup.Escape(r.Reference), N(r.Rounds), N(r.Reviews), N(r.Latest.Round), Markup.Escape(r.Latest.ReviewDate),
                    Markup.Escape(r.Latest.Verdict), N(r.Latest.FindingCount));
            console.Write(t);
            return ExitCodes.Concur;
        }

        var history = register.History(reference);
        if (history.Count == 0)
        {
            io.Error.WriteLine($"crosscheck: the register '{path}' has no reviews of reference '{reference}' (run 'crosscheck history' for the list).");
            return ExitCodes.InputError;
        }
        int rounds = history.Select(h => h.Review.Round).Distinct().Count();
        console.MarkupLine($"[bold]{Markup.Escape(reference)}[/]: {Words.Count(rounds, "round")}, {Words.Count(history.Count, "review")}");
        // Fits a 100-column terminal: short headers, one column for closed / persisting / new, the input hash shortened.
        var table = new Table().Border(TableBorder.Simple);
        foreach (var (h, right) in new[] { ("round", false), ("rev", false), ("date", false), ("reviewer", false), ("verdict", false), ("disc", true),
                                            ("cmts", true), ("cl/pe/new", true), ("input", false) })
        {
            var column = new TableColumn(h).Padding(0, 0, 1, 0);
            table.AddColumn(right ? column.RightAligned() : column);
        }
        foreach (var h in history)
        {
            var r = h.Review;
            string changes = h.Previous is null ? "—" : $"{N(h.Closed.Count)}/{N(h.Persisting.Count)}/{N(h.New.Count)}";
            table.AddRow(N(r.Round) + (h.Repeat ? " rpt" : ""), Markup.Escape(Cut(r.Revision ?? "—", 4)), Markup.Escape(r.ReviewDate),
                Markup.Escape(Cut(r.Reviewer ?? "—", 14)), Markup.Escape(r.Verdict), N(r.EndsDiscrepant), N(r.FindingCount), changes, Markup.Escape(Short(r.InputHash)));
        }
        console.Write(table);
        foreach (var h in history)
        {
            string head = $"round {h.Review.Round}{(h.Repeat ? " (repeat)" : "")}{(h.Review.ToolVersion != ToolInfo.Version ? $" (CrossCheck {h.Review.ToolVersion})" : "")}";
            if (h.Previous is null)
            {
                console.WriteLine($"{head}: raised {Ids(h.New)}");
                continue;
            }
            console.WriteLine($"{head} against round {h.Previous.Round}: closed {Ids(h.Closed)}; persisting {Ids(h.Persisting)}; new {Ids(h.New)}");
        }
        return ExitCodes.Concur;
    }

    private static int Export(string path, bool findings, string? outPath, CliIo io)
    {
        var (text, written, problem) = RegisterJob.Export(path, findings, outPath);
        if (problem is not null)
        {
            CommandSupport.Fail(problem, io);
            return ExitCodes.InputError;
        }
        if (text is not null) io.Output.Write(text);
        if (written is not null) io.Error.WriteLine($"wrote {written}");
        return ExitCodes.Concur;
    }

    private static int Check(string path, CliIo io)
    {
        using var register = OpenExisting(path, io);
        if (register is null) return ExitCodes.InputError;
        var problems = register.Check();
        if (problems.Count == 0)
        {
            io.Output.WriteLine($"{register.Path}: sound (schema version {register.SchemaVersion}, {register.Reviews().Count} reviews).");
            return ExitCodes.Concur;
        }
        foreach (var p in problems) io.Output.WriteLine($"{register.Path}: {p}");
        return ExitCodes.Comments;
    }

    private static string Ids(IReadOnlyList<ComparedComment> list) => list.Count == 0 ? "none" : string.Join(", ", list.Select(c => c.Id));

    private static string Short(string hash) => hash.StartsWith("sha256:", StringComparison.Ordinal) && hash.Length > 15 ? hash[7..15] : hash;

    private static string Cut(string text, int max) => text.Length <= max ? text : text[..(max - 1)] + "…";

    private static string N(int v) => v.ToString(CultureInfo.InvariantCulture);
}
