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
/// the register's maintenance commands (<c>crosscheck register export|check|copy</c>).
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
        cmd.SetAction(pr => Run(pr.GetValue(reference), RegisterChoice.Resolve(pr.GetValue(register), io), io));
        return cmd;
    }

    public static Command CreateRegister(CliIo io)
    {
        var register = RegisterOption();
        var findings = new Option<bool>("--findings") { Description = "One row per finding (with its review) instead of one row per review." };
        var output = new Option<string?>("--out", "-o") { Description = "Write to this file instead of standard output." };
        var export = new Command("export", "Export the register as CSV.") { register, findings, output };
        export.SetAction(pr => Export(RegisterChoice.Resolve(pr.GetValue(register), io), pr.GetValue(findings), pr.GetValue(output), io));

        var register2 = RegisterOption();
        var check = new Command("check", "Check the register: the database's own checks, every review's findings complete, rounds without gaps; prints a digest of its contents.") { register2 };
        check.SetAction(pr => Check(RegisterChoice.Resolve(pr.GetValue(register2), io), io));

        var from = new Argument<string>("from") { Description = "The register to copy: an SQLite file, or a PostgreSQL URI or connection string." };
        var to = new Argument<string>("to") { Description = "The register to copy into (created if needed; it must hold no reviews)." };
        var copy = new Command("copy", "Copy a register into another, between SQLite and PostgreSQL either way, and check both hold the same rounds, comments and hashes.") { from, to };
        copy.SetAction(pr => Copy(pr.GetValue(from)!, pr.GetValue(to)!, io));

        return new Command("register", "Work with the review register (export it, check it, copy it between SQLite and PostgreSQL).") { export, check, copy };
    }

    private static Option<string?> RegisterOption() => new("--register")
    {
        Description = RegisterChoice.Description($"{ReviewRegister.DefaultFileName} in the current folder"),
    };

    private static ReviewRegister? OpenExisting(string path, CliIo io)
    {
        if (RegisterJob.TryOpenExisting(path, out var register, out var problem)) return register;
        CommandSupport.Fail(problem, io);
        return null;
    }

    /// <summary>A register that cannot be read (damaged, bad values, locked) is the user's to fix: a sentence and exit code 2.</summary>
    private static int Guarded(CliIo io, Func<int> body)
    {
        try
        {
            return body();
        }
        catch (RegisterException ex)
        {
            CommandSupport.Fail(ex.Message, io);
            return ExitCodes.InputError;
        }
    }

    private static int Run(string? reference, string path, CliIo io) => Guarded(io, () => History(reference, path, io));

    private static int History(string? reference, string path, CliIo io)
    {
        using var register = OpenExisting(path, io);
        if (register is null) return ExitCodes.InputError;
        try
        {
            return Print(reference, register, io);
        }
        catch (RegisterException ex)
        {
            CommandSupport.Fail(ex.Message, io);
            return ExitCodes.InputError;
        }
    }

    private static int Print(string? reference, ReviewRegister register, CliIo io)
    {
        var console = CommandSupport.Console(io);
        if (reference is null)
        {
            var refs = register.References();
            if (refs.Count == 0) { console.WriteLine("The register holds no reviews yet."); return ExitCodes.Concur; }
            var t = new Table().Border(TableBorder.Simple);
            foreach (var (h, right) in new[] { ("reference", false), ("rounds", true), ("reviews", true), ("latest", true), ("date", false), ("verdict", false), ("open comments", true) })
                t.AddColumn(right ? new TableColumn(h).RightAligned() : new TableColumn(h));
            foreach (var r in refs)
                t.AddRow(C(r.Reference), C(N(r.Rounds)), C(N(r.Reviews)), C(N(r.Latest.Round)), C(r.Latest.ReviewDate), C(r.Latest.Verdict),
                    C(N(r.Latest.FindingCount)));
            console.Write(t);
            return ExitCodes.Concur;
        }

        var history = register.History(reference);
        if (history.Count == 0)
        {
            io.Error.WriteLine($"crosscheck: the register {Quoted(register)} has no reviews of reference '{reference}' (run 'crosscheck history' for the list).");
            return ExitCodes.InputError;
        }
        int rounds = history.Select(h => h.Review.Round).Distinct().Count();
        CommandSupport.Line(console, (reference, new Style(decoration: Decoration.Bold)), ($": {Words.Count(rounds, "round")}, {Words.Count(history.Count, "review")}", null));
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
            table.AddRow(C(N(r.Round) + (h.Repeat ? " rpt" : "")), C(Cut(r.Revision ?? "—", 4)), C(r.ReviewDate),
                C(Cut(r.Reviewer ?? "—", 14)), C(r.Verdict), C(N(r.EndsDiscrepant)), C(N(r.FindingCount)), C(changes), C(Short(r.InputHash)));
        }
        console.Write(table);
        foreach (var h in history)
        {
            string head = $"round {h.Review.Round}{(h.Repeat ? " (repeat)" : "")}{(h.Review.ToolVersion != ToolInfo.Version ? $" (CrossCheck {h.Review.ToolVersion})" : "")}";
            if (h.Previous is null)
            {
                console.WriteLine(CommandSupport.Clean($"{head}: raised {Ids(h.New)}"));
                continue;
            }
            console.WriteLine(CommandSupport.Clean($"{head} against round {h.Previous.Round}: closed {Ids(h.Closed)}; persisting {Ids(h.Persisting)}; new {Ids(h.New)}"));
        }
        return ExitCodes.Concur;
    }

    private static int Export(string path, bool findings, string? outPath, CliIo io) => Guarded(io, () => ExportTo(path, findings, outPath, io));

    private static int ExportTo(string path, bool findings, string? outPath, CliIo io)
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

    private static int Check(string path, CliIo io) => Guarded(io, () => CheckRegister(path, io));

    private static int CheckRegister(string path, CliIo io)
    {
        using var register = OpenExisting(path, io);
        if (register is null) return ExitCodes.InputError;
        IReadOnlyList<string> problems;
        RegisterTally? tally = null;
        try
        {
            problems = register.Check();
            // The counts and digest read every value: only for a register whose values are sound.
            if (problems.Count == 0) tally = register.Tally();
        }
        catch (RegisterException ex)
        {
            CommandSupport.Fail(ex.Message, io);
            return ExitCodes.InputError;
        }
        if (problems.Count == 0)
        {
            io.Output.WriteLine($"{register.Path}: sound (schema version {register.SchemaVersion}, {Words.Count(register.Reviews().Count, "review")}).");
            io.Output.WriteLine($"{register.Path}: {Tally(tally!)}");
            return ExitCodes.Concur;
        }
        foreach (var p in problems) io.Output.WriteLine(CommandSupport.Clean($"{register.Path}: {p}"));
        return ExitCodes.Comments;
    }

    private static int Copy(string from, string to, CliIo io)
    {
        var outcome = RegisterJob.Copy(from, to);
        if (outcome.Problem is not null)
        {
            CommandSupport.Fail(outcome.Problem, io);
            return ExitCodes.InputError;
        }
        io.Output.WriteLine($"copied {Words.Count(outcome.Reviews, "review")} and {Words.Count(outcome.Findings, "finding")} from {outcome.From} to {outcome.To}.");
        io.Output.WriteLine($"  from: {Tally(outcome.FromTally!)}");
        io.Output.WriteLine($"  to:   {Tally(outcome.ToTally!)}");
        foreach (var p in outcome.Problems) io.Output.WriteLine($"  check: {p}");
        if (outcome.Verified)
        {
            io.Output.WriteLine("Both registers check sound and hold the same rounds, comments and hashes.");
            return ExitCodes.Concur;
        }
        io.Output.WriteLine(outcome.Problems.Count > 0 ? "The copy does not check sound (above)." : "The two registers differ (another process wrote to the source meanwhile?).");
        return ExitCodes.Comments;
    }

    private static string Tally(RegisterTally t) =>
        $"{Words.Count(t.Reviews, "review")} of {Words.Count(t.References, "reference")}, {Words.Count(t.Findings, "finding")}; contents {t.Digest[..23]}";

    private static string Quoted(ReviewRegister r) => r.Location.Kind == RegisterKind.SqliteFile ? $"'{r.Location.Display}'" : r.Path;

    private static string Ids(IReadOnlyList<ComparedComment> list) => list.Count == 0 ? "none" : string.Join(", ", list.Select(c => c.Id));

    private static string Short(string hash) => hash.StartsWith("sha256:", StringComparison.Ordinal) && hash.Length > 15 ? hash[7..15] : hash;

    private static string Cut(string text, int max) => text.Length <= max ? text : text[..(max - 1)] + "…";

    private static string N(int v) => v.ToString(CultureInfo.InvariantCulture);

    private static Spectre.Console.Rendering.IRenderable C(string? text) => CommandSupport.Cell(text);
}
