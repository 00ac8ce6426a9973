using CrossCheck.Memo.Diagrams;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>Builds the memo model, letting later stages add their appendices (diagrams, working tables).</summary>
public static class MemoExtensions
{
    /// <summary>Contributors of extra memo sections, called in order.</summary>
    public static List<Func<ReviewResult, MemoFormat, IEnumerable<MemoAppendix>>> Appendices { get; } = [];

    /// <summary>The memo model; HTML memos of an analysed review also get the drawings (<see cref="MemoDiagrams"/>).</summary>
    public static MemoModel Build(ReviewResult review, MemoFormat format) =>
        new(review, format == MemoFormat.Html ? MemoDiagrams.For(review) : null)
        {
            Appendices = [.. Appendices.SelectMany(a => a(review, format)), .. WorkingAppendix.For(review, format)],
        };
}
