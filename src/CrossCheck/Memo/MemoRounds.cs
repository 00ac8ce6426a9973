using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>
/// What the memo says about earlier rounds of the same reference when the review was recorded in a register:
/// which comments were closed, which persist and which are new. <see cref="Recorded"/> is false otherwise.
/// </summary>
public sealed class MemoRounds
{
    public static MemoRounds None { get; } = new();

    private MemoRounds()
    {
        Summary = "";
        Reference = Round = PreviousRound = PreviousRevision = PreviousDate = PreviousVerdict = "";
    }

    public MemoRounds(RoundComparison comparison)
    {
        ArgumentNullException.ThrowIfNull(comparison);
        var r = comparison.Review;
        var p = comparison.Previous;
        Recorded = true;
        Reference = r.Reference;
        Round = R(r.Round);
        Repeat = comparison.Repeat;
        HasPrevious = p is not null;
        PreviousRound = p is null ? "" : R(p.Round);
        PreviousRevision = p?.Revision ?? "—";
        PreviousDate = p?.ReviewDate ?? "";
        PreviousVerdict = p is null ? "" : VerdictWords(p.Verdict);
        string repeat = comparison.Repeat ? $" These input files were already reviewed in round {Round}; this is a repeat review of that round." : "";
        Summary = p is null
            ? $"Recorded in the review register as round {Round} of reference {Reference}; there is no earlier round to compare with.{repeat}"
            : string.Create(CultureInfo.InvariantCulture,
                $"Recorded in the review register as round {Round} of reference {Reference}. Against round {PreviousRound} (revision {PreviousRevision}, reviewed {PreviousDate}, verdict: {PreviousVerdict}): {Words.Count(comparison.Closed.Count, "comment")} closed, {comparison.Persisting.Count} persisting, {comparison.New.Count} new.{repeat}");
        Closed = comparison.Closed.Select(c => Row(c, "closed")).ToList();
        Persisting = comparison.Persisting.Select(c => Row(c, "persisting")).ToList();
        New = comparison.New.Select(c => Row(c, "new")).ToList();
        Rows = HasPrevious ? [.. Closed, .. Persisting, .. New] : [];
    }

    public bool Recorded { get; }
    public string Reference { get; }
    public string Round { get; }
    public bool Repeat { get; }
    public bool HasPrevious { get; }
    public string PreviousRound { get; }
    public string PreviousRevision { get; }
    public string PreviousDate { get; }
    public string PreviousVerdict { get; }

    /// <summary>One sentence: the round, the round compared with and the counts.</summary>
    public string Summary { get; }

    public IReadOnlyList<MemoRoundComment> Closed { get; } = [];
    public IReadOnlyList<MemoRoundComment> Persisting { get; } = [];
    public IReadOnlyList<MemoRoundComment> New { get; } = [];

    /// <summary>Closed, then persisting, then new: the rows of the comparison table (empty for a first round).</summary>
    public IReadOnlyList<MemoRoundComment> Rows { get; } = [];

    private static MemoRoundComment Row(ComparedComment c, string status) => new(
        status, c.Id, c.Severity, c.PreviousSeverity is { } before && before != c.Severity && status == "persisting" ? $"{before} → {c.Severity}" : c.Severity,
        c.Case, c.Where, c.Text, R(c.FirstRaisedRound));

    private static string R(int round) => round.ToString(CultureInfo.InvariantCulture);

    private static string VerdictWords(string json) => json switch
    {
        "concur" => "Concur",
        "concur-with-comments" => "Concur with comments",
        "revise" => "Revise and resubmit",
        _ => json,
    };
}

/// <summary>A comment in the comparison with the previous round.</summary>
/// <param name="Status"><c>closed</c>, <c>persisting</c> or <c>new</c>.</param>
/// <param name="SeverityChange">The severity, or <c>minor → major</c> when it changed.</param>
/// <param name="Text">The comment as now raised; for a closed comment, as it was last raised.</param>
/// <param name="Since">The round it was first raised in (without a break).</param>
public sealed record MemoRoundComment(string Status, string Id, string Severity, string SeverityChange, string Case, string Where, string Text, string Since);
