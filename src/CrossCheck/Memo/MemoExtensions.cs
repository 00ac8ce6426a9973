using CrossCheck.Memo.Diagrams;
using CrossCheck.Register;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>Builds the memo model, letting later stages add their appendices (diagrams, working tables).</summary>
public static class MemoExtensions
{
    /// <summary>Contributors of extra memo sections, called in order.</summary>
    public static List<Func<ReviewResult, MemoFormat, IEnumerable<MemoAppendix>>> Appendices { get; } = [];

    public static MemoModel Build(ReviewResult review, MemoFormat format) => Build(review, format, null);

    /// <param name="rounds">The comparison with the previous round, when the review was recorded in a register.</param>
    /// <remarks>HTML memos of an analysed review also get the drawings (<see cref="MemoDiagrams"/>).</remarks>
    public static MemoModel Build(ReviewResult review, MemoFormat format, RoundComparison? rounds) =>
        new(review, format == MemoFormat.Html ? MemoDiagrams.For(review) : null)
        {
            Appendices = [.. Appendices.SelectMany(a => a(review, format)), .. WorkingAppendix.For(review, format)],
            Rounds = rounds is null ? MemoRounds.None : new MemoRounds(rounds),
        };
}
