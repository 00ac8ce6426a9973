using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Memo;
using CrossCheck.Review;

namespace CrossCheck.Screening;

/// <summary>The screen's summary files: <c>summary.csv</c> (one row per submission) and <c>index.html</c> (linking the memos).</summary>
public static class ScreenOutputs
{
    public static string OutcomeWord(ScreenOutcome o) => o switch
    {
        ScreenOutcome.Concur => "concur",
        ScreenOutcome.Comments => "concur-with-comments",
        ScreenOutcome.Revise => "revise",
        ScreenOutcome.InputError => "input-error",
        _ => "internal-error",
    };

    public static string OutcomeWords(ScreenOutcome o) => o switch
    {
        // One set of verdict words for the terminal, the screen, the history and the CSV: the contract codes.
        ScreenOutcome.Concur => Verdict.Concur.Json(),
        ScreenOutcome.Comments => Verdict.ConcurWithComments.Json(),
        ScreenOutcome.Revise => Verdict.Revise.Json(),
        ScreenOutcome.InputError => "input error",
        _ => "internal error",
    };

    /// <summary><c>2 closed, 1 persisting, 1 new</c>, <c>first round</c>, and <c>(files unchanged)</c> for a repeat review; empty without a register.</summary>
    public static string RoundsText(RoundComparison? c)
    {
        if (c is null) return "";
        string unchanged = c.Repeat ? " (files unchanged)" : "";
        return c.Previous is null
            ? "first round" + unchanged
            : string.Create(CultureInfo.InvariantCulture, $"{c.Closed.Count} closed, {c.Persisting.Count} persisting, {c.New.Count} new{unchanged}");
    }

    public static string SummaryCsv(ScreenReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        using var csv = new CsvOut();
        csv.Header("submission", "outcome", "title", "reference", "revision", "round", "discrepant_ends", "minor_ends", "missing_ends",
            "unmatched_ends", "major_flags", "minor_flags", "comments", "top_finding", "group", "closed", "persisting", "new", "memo", "error");
        foreach (var r in report.Rows)
        {
            var v = r.Review;
            csv.Text(r.Name).Text(OutcomeWord(r.Outcome)).Text(v?.Submission.Info.Title).Text(r.Reference).Text(v?.Submission.Info.Revision)
                .Number(r.Rounds?.Review.Round)
                .Number(v?.CountEnds(EndStatus.Discrepant)).Number(v?.CountEnds(EndStatus.Minor)).Number(v?.CountEnds(EndStatus.Missing))
                .Number(v?.CountEnds(EndStatus.Unmatched)).Number(v?.CountFlags(Severity.Major)).Number(v?.CountFlags(Severity.Minor)).Number(v?.Comments.Count)
                .Text(v is null ? "" : r.TopFinding).Text(r.Group.Label).Number(r.Rounds?.Closed.Count).Number(r.Rounds?.Persisting.Count)
                .Number(r.Rounds?.New.Count).Text(r.MemoFile).Text(r.ErrorText).End();
        }
        return csv.ToString();
    }

    public static string IndexHtml(ScreenReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return MemoRenderer.RenderObject(new ScreenIndexModel(report), MemoRenderer.BuiltInTemplate("screen-index.html.sbn"), "screen-index.html.sbn");
    }
}

/// <summary>What <c>templates/screen-index.html.sbn</c> sees: every value preformatted; strings as read (the template escapes them).</summary>
public sealed class ScreenIndexModel
{
    internal ScreenIndexModel(ScreenReport report)
    {
        var o = report.Options.Review;
        Folder = Path.GetFileName(Path.TrimEndingDirectorySeparator(report.Folder));
        FolderPath = report.Folder;
        ReviewDate = Clock.Iso(o.Date ?? Clock.Today(TimeProvider.System));
        Reviewer = o.Reviewer ?? "—";
        ToolVersion = ToolInfo.Version;
        AbsoluteTolerance = Fmt.Number(o.AbsoluteTolerance, "0.0##");
        RelativeTolerancePercent = Fmt.Number(o.RelativeTolerance * 100, "0.##");
        MinorTolerancePercent = Fmt.Number(o.MinorRelativeTolerance * 100, "0.##");
        Register = report.RegisterPath ?? "";
        Total = report.Rows.Count;
        Concur = report.Count(ScreenOutcome.Concur);
        Comments = report.Count(ScreenOutcome.Comments);
        Revise = report.Count(ScreenOutcome.Revise);
        InputErrors = report.Count(ScreenOutcome.InputError);
        InternalErrors = report.Count(ScreenOutcome.InternalError);
        Groups = report.Groups.Select(g => new ScreenIndexGroup(g.Key.Label, g.Count, string.Join(", ", g.Submissions.Take(12)) + (g.Count > 12 ? ", …" : ""),
            g.Key.Kind.ToString().ToLowerInvariant())).ToList();
        Rows = report.Rows.Select(Row).ToList();
        Notes = report.Notes.ToList();
    }

    private static ScreenIndexRow Row(ScreenRow r)
    {
        var v = r.Review;
        string N(int? x) => x is int i ? i.ToString(CultureInfo.InvariantCulture) : "";
        string rounds = ScreenOutputs.RoundsText(r.Rounds);
        return new ScreenIndexRow(
            r.Name,
            r.MemoFile is null ? "" : Uri.EscapeDataString(r.MemoFile),
            v?.Submission.Info.Title ?? "",
            r.Reference ?? "",
            v?.Submission.Info.Revision ?? "",
            N(r.Rounds?.Review.Round),
            ScreenOutputs.OutcomeWords(r.Outcome),
            ScreenOutputs.OutcomeWord(r.Outcome),
            N(v?.CountEnds(EndStatus.Discrepant)),
            N(v?.Comments.Count(c => c.Severity == Severity.Major)),
            N(v?.Comments.Count(c => c.Severity == Severity.Minor)),
            v is null ? "" : r.TopFinding,
            rounds,
            r.ErrorText ?? "");
    }

    public string Folder { get; }
    public string FolderPath { get; }
    public string ReviewDate { get; }
    public string Reviewer { get; }
    public string ToolVersion { get; }
    public string AbsoluteTolerance { get; }
    public string RelativeTolerancePercent { get; }
    public string MinorTolerancePercent { get; }
    public string Register { get; }
    public int Total { get; }
    public int Concur { get; }
    public int Comments { get; }
    public int Revise { get; }
    public int InputErrors { get; }
    public int InternalErrors { get; }
    public IReadOnlyList<ScreenIndexGroup> Groups { get; }
    public IReadOnlyList<ScreenIndexRow> Rows { get; }
    public IReadOnlyList<string> Notes { get; }
}

public sealed record ScreenIndexGroup(string Label, int Count, string Submissions, string Kind);

/// <param name="Href">The memo's (or error list's) file name, URL-encoded; empty when none was written.</param>
public sealed record ScreenIndexRow(string Name, string Href, string Title, string Reference, string Revision, string Round,
    string Verdict, string VerdictCode, string Discrepant, string MajorFlags, string MinorFlags, string TopFinding, string Rounds, string Error);
