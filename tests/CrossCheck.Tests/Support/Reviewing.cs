using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Tests.Support;

/// <summary>Reads a sectioned CSV submission from text, solves it and reviews it.</summary>
public static class Reviewing
{
    public static ReviewResult Of(string csv, ReviewOptions? options = null)
    {
        var (s, analysis) = ReadAndSolve(csv);
        return ReviewEngine.Review(s, analysis, options ?? new ReviewOptions(Date: new DateOnly(2026, 12, 1)));
    }

    /// <summary>The submission read from the text (which must read without problems) and CrossCheck's analysis of it.</summary>
    public static (Submission Submission, AnalysisResult Analysis) ReadAndSolve(string csv)
    {
        var r = TempSubmission.ReadText(csv);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var s = r.Submission!;
        return (s, new FrameSolver().Solve(s.Model, s.Cases));
    }

    public static IReadOnlyList<Flag> Flags(this ReviewResult r, FlagKind kind) => r.AllFlags.Where(f => f.Kind == kind && f.Severity != Severity.Info).ToList();

    /// <summary>A claims table from (member, at, moment) rows.</summary>
    public static string Claims(params (string Member, string At, double Moment)[] rows) =>
        "[end-moments]\nmember,at,moment\n" + string.Join("\n", rows.Select(r => FormattableString.Invariant($"{r.Member},{r.At},{r.Moment:R}")));

    public const string KnM = "[info]\nkey,value\nforce unit,kN\nlength unit,m\n";
}
