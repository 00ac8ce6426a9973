using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Memo;

/// <summary>
/// The Markdown memos of the demo submissions, pinned as golden files. After an intended change, regenerate them
/// with <c>CROSSCHECK_UPDATE_GOLDEN=1 dotnet test --filter MemoGoldenTests</c> and read the diff before committing.
/// </summary>
public class MemoGoldenTests
{
    [Theory]
    [InlineData("footbridge.csv", "footbridge.md")]
    [InlineData("shed-frame", "shed-frame.md")]
    [InlineData("school-hall.csv", "school-hall.md")]
    [InlineData("mezzanine-frame.csv", "mezzanine-frame.md")]
    public void DemoMemo_MatchesTheGoldenFile(string demo, string golden)
    {
        string memo = RenderDemo(demo, MemoFormat.Markdown);
        string path = Path.Combine(RepoPaths.Root, "tests", "CrossCheck.Tests", "Memo", "Golden", golden);
        if (Environment.GetEnvironmentVariable("CROSSCHECK_UPDATE_GOLDEN") == "1") File.WriteAllText(path, memo);
        File.Exists(path).ShouldBeTrue($"golden file {path} is missing; run with CROSSCHECK_UPDATE_GOLDEN=1 to create it");
        memo.ShouldBe(File.ReadAllText(path).ReplaceLineEndings("\n"));
    }

    [Theory]
    [InlineData("footbridge.csv")]
    [InlineData("shed-frame")]
    [InlineData("mezzanine-frame.csv")]
    public void DemoMemo_CarriesTheCautionsAndEverySection(string demo)
    {
        foreach (var format in new[] { MemoFormat.Markdown, MemoFormat.Html })
        {
            string memo = RenderDemo(demo, format);
            foreach (var section in new[] { "Scope, method and assumptions", "Claimed and recomputed end moments", "Checks of the claimed numbers",
                         "Likely causes", "Schedule of comments", "Input as read", "Limitations and cautions" })
                memo.ShouldContain(section);
            memo.ShouldContain("engineer of record remains responsible");
            memo.ShouldContain("licensed professional");
            memo.ShouldContain("No code of practice sets a checking");
        }
    }

    internal static string RenderDemo(string demo, MemoFormat format)
    {
        var imported = SubmissionReader.Read(CliRunner.Demo(demo));
        var s = imported.Submission!with { Source = $"fixtures/demo/{demo}" };
        var review = ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases),
            new ReviewOptions(Reviewer: "R. Reviewer (demo)", Date: new DateOnly(2026, 12, 1)));
        return MemoRenderer.Render(MemoExtensions.Build(review, format), format);
    }
}
