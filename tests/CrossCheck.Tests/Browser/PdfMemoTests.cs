using CrossCheck.Cli;
using CrossCheck.Memo;
using CrossCheck.Tests.Support;
using UglyToad.PdfPig;

namespace CrossCheck.Tests.Browser;

/// <summary><c>review --format pdf</c>: the HTML memo printed by headless Chromium, read back with PdfPig.</summary>
[Collection("Browser")]
public class PdfMemoTests
{
    [TheoryNeeding("chromium")]
    [InlineData("footbridge.csv", "Alder Mill footbridge", "claim 141.7")]
    [InlineData("shed-frame", "Depot storage shed", "claim 20.9")]
    public void PdfMemo_ReadsBack_WithTitleVerdictDrawingsAndCautions(string demo, string title, string claimLabel)
    {
        using var t = new TempSubmission();
        string pdf = Path.Combine(t.Folder, "memo.pdf");
        var run = CliRunner.Run("review", CliRunner.Demo(demo), "--format", "pdf", "--out", pdf, "--quiet", "--reviewer", "R. Reviewer (demo)");
        run.ExitCode.ShouldBe(ExitCodes.Comments, run.Err);
        Directory.GetFiles(t.Folder).ShouldBe([pdf]); // no temporary left beside it

        using var doc = PdfDocument.Open(pdf);
        doc.NumberOfPages.ShouldBeGreaterThan(2);
        string first = string.Join(" ", doc.GetPage(1).GetWords().Select(w => w.Text));
        first.ShouldContain(title.Split(' ')[0]);
        first.ShouldContain("Verdict:");
        string all = string.Join(" ", doc.GetPages().Select(p => string.Join(" ", p.GetWords().Select(w => w.Text))));
        foreach (var expected in new[] { "Revise", "Figure", "bending", "moment", "tension", "engineer", "responsible", "licensed", "R.", "Reviewer" })
            all.ShouldContain(expected);
        // The drawings' text is real text in the PDF: joint labels and the claim labels of the moment diagrams.
        var words = doc.GetPages().SelectMany(p => p.GetWords()).Select(w => w.Text).ToList();
        words.ShouldContain(claimLabel.Split(' ')[1]);
        words.ShouldContain("claim");
        // A4 pages, as the memo's print style asks (595 × 842 pt).
        doc.GetPage(1).Width.ShouldBe(595, 2);
        doc.GetPage(1).Height.ShouldBe(842, 2);
    }

    [Fact]
    public void PdfMemo_WithoutTheBrowser_SaysHowToGetIt_AndWritesNothing()
    {
        using var t = new TempSubmission();
        string pdf = Path.Combine(t.Folder, "memo.pdf");
        string? before = Environment.GetEnvironmentVariable(PdfPrinter.BrowserVariable);
        try
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, Path.Combine(t.Folder, "no-such-browser"));
            var run = CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--format", "pdf", "--out", pdf);
            run.ExitCode.ShouldBe(ExitCodes.InputError);
            run.Err.ShouldContain("apt-get install chromium");
            run.Err.ShouldContain("--format html");
            run.Err.ShouldNotContain("   at ");
        }
        finally
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, before);
        }
        File.Exists(pdf).ShouldBeFalse();
        Directory.GetFiles(t.Folder).ShouldBeEmpty();
    }

    [Fact]
    public void PdfMemo_BrowserThatFails_IsAClearErrorAndWritesNothing()
    {
        using var t = new TempSubmission();
        string pdf = Path.Combine(t.Folder, "memo.pdf");
        string fake = t.Write("fake-browser", "#!/bin/sh\necho 'cannot print' >&2\nexit 7\n");
        if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(fake, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        string? before = Environment.GetEnvironmentVariable(PdfPrinter.BrowserVariable);
        try
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, fake);
            var run = CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--format", "pdf", "--out", pdf, "--quiet");
            run.ExitCode.ShouldBe(ExitCodes.InputError);
            run.Err.ShouldContain("could not be printed");
            run.Err.ShouldContain("code 7");
        }
        finally
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, before);
        }
        File.Exists(pdf).ShouldBeFalse();
    }
}
