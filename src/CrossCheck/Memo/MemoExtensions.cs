using CrossCheck.Memo.Diagrams;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>Builds the memo model of a review: drawings for HTML, the working appendix when the review carries one, the register rounds.</summary>
public static class MemoExtensions
{
    public static MemoModel Build(ReviewResult review, MemoFormat format) => Build(review, format, null);

    /// <param name="review">The review, with its analysis (for the drawings) and reference working (for the appendix) when there are.</param>
    /// <param name="format">The memo's format.</param>
    /// <param name="rounds">The comparison with the previous round, when the review was recorded in a register.</param>
    /// <remarks>HTML memos of an analysed review also get the drawings (<see cref="MemoDiagrams"/>).</remarks>
    public static MemoModel Build(ReviewResult review, MemoFormat format, RoundComparison? rounds) =>
        new(review, format == MemoFormat.Html ? MemoDiagrams.For(review) : null)
        {
            Appendices = [.. WorkingAppendix.For(review)],
            Rounds = rounds is null ? MemoRounds.None : new MemoRounds(rounds),
            Format = format,
        };
}
