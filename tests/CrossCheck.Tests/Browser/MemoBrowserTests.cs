using CrossCheck.Analysis;
using CrossCheck.Cli;
using CrossCheck.Import;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using OpenQA.Selenium;

namespace CrossCheck.Tests.Browser;

/// <summary>The HTML memos of the demos opened in a real browser from disk: drawings present, sized, labelled, and not blank.</summary>
[Collection("Browser")]
public class MemoBrowserTests(BrowserFixture browser)
{
    private readonly BrowserFixture _browser = browser;

    public static TheoryData<string> Demos => new() { "footbridge.csv", "shed-frame" };

    [TheoryNeeding("chromium", "chromedriver")]
    [MemberData(nameof(Demos))]
    public void DemoMemo_OpensWithoutConsoleErrors_WithEveryDrawingSizedAndLabelled(string demo)
    {
        using var t = new TempSubmission();
        string html = Path.Combine(t.Folder, "memo.html");
        var run = CliRunner.Run("review", CliRunner.Demo(demo), "--format", "html", "--out", html, "--quiet", "--date", "2026-12-01");
        run.ExitCode.ShouldBe(ExitCodes.Comments, run.Err);

        var review = Expected(demo);
        var model = review.Submission.Model;
        int cases = review.Analysis!.Cases.Count;
        int withLoads = review.Cases.Count(c => review.Submission.Case(c.Case) is not null);
        int flagged = review.Cases.Sum(c => c.EndMoments.Where(e => e.End is not null && e.Status is EndStatus.Discrepant or EndStatus.Minor or EndStatus.Missing)
            .Select(e => e.Member).Distinct().Count());

        _browser.ConsoleErrors(); // drop anything from an earlier page
        var d = _browser.Driver;
        d.Navigate().GoToUrl(new Uri(html).AbsoluteUri);
        d.Title.ShouldContain(review.Submission.Info.Title!);
        _browser.ConsoleErrors().ShouldBeEmpty();
        ((IJavaScriptExecutor)d).ExecuteScript("return document.scripts.length").ShouldBe(0L); // nothing to run: the memo is static

        var svgs = d.FindElements(By.CssSelector("svg"));
        svgs.Count.ShouldBe(1 + withLoads + cases + flagged);
        foreach (var svg in svgs)
        {
            svg.Size.Width.ShouldBeGreaterThan(100);
            svg.Size.Height.ShouldBeGreaterThan(40);
        }
        d.FindElements(By.CssSelector("svg.cc-moments path.cc-bmd")).Count.ShouldBe(model.Members.Count * cases);
        d.FindElements(By.CssSelector("svg.cc-moments")).Count.ShouldBe(cases);
        d.FindElements(By.CssSelector("svg.cc-detail")).Count.ShouldBe(flagged);

        var structure = d.FindElement(By.CssSelector("svg.cc-elevation"));
        var jointLabels = structure.FindElements(By.CssSelector("text.cc-joint-label")).Select(e => e.Text).ToList();
        jointLabels.ShouldBe(model.Joints.Select(j => j.Id), ignoreOrder: true);
        structure.FindElements(By.CssSelector("text.cc-member-label")).Select(e => e.Text).ShouldBe(model.Members.Select(m => m.Id), ignoreOrder: true);
        foreach (var bmd in d.FindElements(By.CssSelector("svg.cc-moments")))
        {
            bmd.FindElements(By.CssSelector("text.cc-value")).Count.ShouldBeGreaterThan(0);
            bmd.FindElements(By.CssSelector("text.cc-joint-label")).Count.ShouldBe(model.Joints.Count);
        }
        int discrepant = review.AllEndMoments.Count(e => e.Status == EndStatus.Discrepant && e.End is not null);
        d.FindElements(By.CssSelector("svg.cc-moments circle.cc-claim-discrepant")).Count.ShouldBe(discrepant);
        d.FindElements(By.CssSelector("svg.cc-loads text.cc-load-label")).Count.ShouldBeGreaterThan(0);

        // A picture of the first moment diagram and of the page as it opens: neither blank.
        var first = d.FindElement(By.CssSelector("svg.cc-moments"));
        ((IJavaScriptExecutor)d).ExecuteScript("arguments[0].scrollIntoView({block: 'center'})", first);
        var shot = ((ITakesScreenshot)first).GetScreenshot();
        string name = Path.GetFileNameWithoutExtension(demo);
        shot.SaveAsFile(Path.Combine(_browser.Screenshots, $"{name}-moments.png"));
        var png = Png.Read(shot.AsByteArray);
        png.Width.ShouldBeGreaterThan(300);
        png.InkShare().ShouldBeGreaterThan(0.03);
        png.DistinctColours().ShouldBeGreaterThan(20); // tint, outline, ink, status colours and their anti-aliasing
        var page = ((ITakesScreenshot)d).GetScreenshot();
        page.SaveAsFile(Path.Combine(_browser.Screenshots, $"{name}-page.png"));
        Png.Read(page.AsByteArray).InkShare().ShouldBeGreaterThan(0.02);
    }

    [FactNeeding("chromium", "chromedriver")]
    public void EnvelopeMemo_DrawsEveryMembersLargestAndLeastMoment_AndIsNotBlank()
    {
        using var t = new TempSubmission();
        string html = Path.Combine(t.Folder, "memo.html");
        var run = CliRunner.Run("review", CliRunner.Demo("mezzanine-frame.csv"), "--format", "html", "--out", html, "--quiet", "--date", "2026-12-01");
        run.ExitCode.ShouldBe(ExitCodes.Comments, run.Err);
        var members = SubmissionReader.Read(CliRunner.Demo("mezzanine-frame.csv")).Submission!.Model.Members.Count;
        _browser.ConsoleErrors();
        var d = _browser.Driver;
        d.Navigate().GoToUrl(new Uri(html).AbsoluteUri);
        _browser.ConsoleErrors().ShouldBeEmpty();
        var envelope = d.FindElements(By.CssSelector("svg.cc-envelope")).ShouldHaveSingleItem();
        envelope.FindElements(By.CssSelector("path.cc-env-max")).Count.ShouldBe(members);
        envelope.FindElements(By.CssSelector("path.cc-env-min")).Count.ShouldBe(members);
        envelope.FindElements(By.CssSelector("text.cc-claim-label")).Count.ShouldBeGreaterThan(0);
        ((IJavaScriptExecutor)d).ExecuteScript("arguments[0].scrollIntoView({block: 'center'})", envelope);
        var shot = ((ITakesScreenshot)envelope).GetScreenshot();
        shot.SaveAsFile(Path.Combine(_browser.Screenshots, "mezzanine-frame-envelope.png"));
        var png = Png.Read(shot.AsByteArray);
        png.InkShare().ShouldBeGreaterThan(0.03);
        png.DistinctColours().ShouldBeGreaterThan(20);
    }

    [FactNeeding("chromium", "chromedriver")]
    public void ConsoleCheck_SeesAnErrorWhenThereIsOne()
    {
        // The console check above is only worth something if it can fail.
        using var t = new TempSubmission();
        string page = t.Write("bad.html", "<!DOCTYPE html><html><body><script>console.error('drawing failed')</script></body></html>");
        _browser.ConsoleErrors();
        _browser.Driver.Navigate().GoToUrl(new Uri(page).AbsoluteUri);
        _browser.ConsoleErrors().ShouldContain(m => m.Contains("drawing failed", StringComparison.Ordinal));
    }

    [FactNeeding("chromium", "chromedriver")]
    public void BlankCheck_SeesABlankPicture()
    {
        using var t = new TempSubmission();
        string page = t.Write("blank.html", "<!DOCTYPE html><html><body style='background:#fff'></body></html>");
        _browser.Driver.Navigate().GoToUrl(new Uri(page).AbsoluteUri);
        var png = Png.Read(((ITakesScreenshot)_browser.Driver).GetScreenshot().AsByteArray);
        png.InkShare().ShouldBe(0);
        png.DistinctColours().ShouldBe(1);
    }

    private static ReviewResult Expected(string demo)
    {
        var s = SubmissionReader.Read(CliRunner.Demo(demo)).Submission!;
        return ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases));
    }
}
