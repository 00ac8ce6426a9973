using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>Builds the memo model, letting later stages add their appendices (diagrams, working tables).</summary>
public static class MemoExtensions
{
    /// <summary>Contributors of extra memo sections, called in order.</summary>
    public static List<Func<ReviewResult, MemoFormat, IEnumerable<MemoAppendix>>> Appendices { get; } = [];

    public static MemoModel Build(ReviewResult review, MemoFormat format) =>
        new(review) { Appendices = [.. Appendices.SelectMany(a => a(review, format)), .. WorkingAppendix.For(review, format)] };
}
