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
    public static MemoModel Build(ReviewResult review, MemoFormat format, RoundComparison? rounds) =>
        new(review)
        {
            Appendices = Appendices.SelectMany(a => a(review, format)).ToList(),
            Rounds = rounds is null ? MemoRounds.None : new MemoRounds(rounds),
        };
}
