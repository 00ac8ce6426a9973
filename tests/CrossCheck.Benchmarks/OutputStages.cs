using CrossCheck.Memo;
using CrossCheck.Memo.Diagrams;
using CrossCheck.Review;

namespace CrossCheck.Benchmarks;

/// <summary>The outputs of a review, one stage at a time, for the stage timers: JSON, the Markdown memo, the drawings, the HTML memo.</summary>
public static class OutputStages
{
    /// <summary>Writes each output of <paramref name="review"/> (to nowhere) and calls <paramref name="lap"/> with the stage's name after each.</summary>
    public static void Write(ReviewResult review, Action<string> lap)
    {
        ReviewJson.Write(review);
        lap("json");
        MemoRenderer.Render(new MemoModel(review, null), MemoFormat.Markdown);
        lap("markdown memo");
        var diagrams = MemoDiagrams.For(review);
        lap("diagrams");
        MemoRenderer.Render(new MemoModel(review, diagrams), MemoFormat.Html);
        lap("html memo");
    }
}
