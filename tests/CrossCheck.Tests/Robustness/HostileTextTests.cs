using CrossCheck.Cli;
using CrossCheck.Cli.Commands;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using CsCheck;
using Spectre.Console;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// Text from a submission reaches the terminal, the register and the memos as text: no control characters (escape sequences),
/// no console markup or emoji shortcodes read in data, no raw HTML or links in the Markdown memo; and the model's oddities are
/// warned about in the memo and the JSON.
/// </summary>
public class HostileTextTests
{
    private static string Catalogue(string name) => Path.Combine(RepoPaths.Root, "fixtures", "bad", name);

    [Fact]
    public void EscapesMarkupAndEmojiInTitleAndReference_ReachTheTerminalAsText_AndTheRegisterWithoutControls()
    {
        using var t = new TempSubmission();
        string register = Path.Combine(t.Folder, "reg.db");
        var r = CliRunner.Run("review", Catalogue("markup-and-escapes-in-ids.csv"), "--out", Path.Combine(t.Folder, "memo.md"), "--register", register);
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        (r.Out + r.Err).ShouldNotContain("\u001b");
        (r.Out + r.Err).ShouldNotContain("\u0007");
        r.Out.ShouldContain("[red]Lintel[/] :warning: <img src=x onerror=alert(1)>");
        r.Out.ShouldNotContain("⚠");

        var h = CliRunner.Run("history", "--register", register);
        h.ExitCode.ShouldBe(ExitCodes.Concur, h.Err);
        h.Out.ShouldContain("info.csv:1:key:");
        h.Out.ShouldNotContain("🔑");
        using var reg = ReviewRegister.Open(register);
        reg.Reviews().Single().Title!.ShouldNotContain("\u001b");
        reg.Reviews().Single().Title!.ShouldStartWith("]0;pwned[2J[red]Lintel[/]");
    }

    [Fact]
    public void MarkdownMemo_CarriesNoRawHtmlAndNoLinkFromTheSubmission()
    {
        using var t = new TempSubmission();
        string memo = Path.Combine(t.Folder, "memo.md");
        CliRunner.Run("review", Catalogue("markup-and-escapes-in-ids.csv"), "--out", memo, "-q").ExitCode.ShouldBe(ExitCodes.Concur);
        string md = File.ReadAllText(memo);
        md.ShouldNotContain("<img");
        md.ShouldNotContain("](javascript");
        md.ShouldContain("&lt;img src=x onerror=alert(1)>");
        md.ShouldContain("[open]\\(javascript:alert(1))");
    }

    [Fact]
    public void ControlCharactersInFileNames_NeverReachTheTerminal()
    {
        using var t = new TempSubmission();
        string name = "calc\u001b[31m\u0007.csv";
        string path = t.Write(name, "not,a,submission\n");
        var r = CliRunner.Run("review", path);
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldNotContain("\u001b");
        r.Err.ShouldContain("calc[31m.csv");
    }

    [Fact]
    public void ModelOddities_AreWarnedAbout_InTheMemoAndTheJson()
    {
        foreach (var (file, words) in new[]
                 {
                     ("coincident-joints.csv", "are at the same place"), ("member-through-joint.csv", "lies on member 'AB' between its ends"),
                     ("parallel-members.csv", "both join 'A' and 'B'"), ("lookalike-cyrillic-joint.csv", "look alike but are different ids"),
                 })
        {
            var outcome = new ReviewJob().Run(new ReviewRequest(Catalogue(file), ReviewOptions.Default, ReviewFormat.Json));
            outcome.Text.ShouldNotBeNull(file + ": " + outcome.Problem);
            outcome.Text.ShouldContain(words);
            var memo = ReviewJob.Render(outcome.Review!, ReviewFormat.Markdown);
            memo.ShouldContain(words);
        }
    }

    [Fact]
    public void ABadMemberRow_RaisesNoSeparateStructuresWarning()
    {
        var read = SubmissionReader.Read(Catalogue("bad-member-row-two-parts.csv"));
        read.Errors.ShouldHaveSingleItem().Message.ShouldContain("'I' must be greater than zero");
        read.Warnings.ShouldNotContain(w => w.Message.Contains("separate structures", StringComparison.Ordinal));
    }

    [Fact]
    public void ClaimsEqualToTheSolveOfAnIllConditionedFrame_AgreeEverywhere_WithOneMinorComment()
    {
        var outcome = new ReviewJob().Review(Catalogue("ill-conditioned-claims-as-solved.csv"), ReviewOptions.Default);
        var review = outcome.Review.ShouldNotBeNull();
        review.AllEndMoments.ShouldAllBe(e => e.Status == EndStatus.Agree);
        review.Verdict.ShouldBe(Verdict.ConcurWithComments);
        review.AllFlags.Where(f => f.Severity != Severity.Info).ShouldHaveSingleItem().Kind.ShouldBe(FlagKind.Conditioning);
        review.Comments.ShouldHaveSingleItem().Severity.ShouldBe(Severity.Minor);
    }

    [Fact]
    public void ThePdfLibrarysOwnWords_AreNeverShown()
    {
        using var t = new TempSubmission();
        string path = HostileInputs.Make("pdf-unparsable.pdf", t.Folder);
        var read = SubmissionReader.Read(path);
        read.Errors.ShouldHaveSingleItem().Message.ShouldBe(Messages.PdfUnreadable);
    }

    // ---- properties ---------------------------------------------------------------------------------

    private static readonly Gen<string> Hostile = Gen.OneOf(
        Gen.String[Gen.Char, 0, 40],
        Gen.Const("\u001b]0;title\u0007"), Gen.Const("\u001b[2J"), Gen.Const("[red]x[/]"), Gen.Const(":warning:"), Gen.Const("info.csv:1:key:"),
        Gen.Const("[link=http://x]y[/]"), Gen.Const("\u202Eevil"), Gen.Const("a\u200Bb"), Gen.Const("\r\n\t"), Gen.Const("\u009b31m")).Array[1, 5]
        .Select(parts => string.Concat(parts));

    [Fact]
    public void Property_TerminalText_HasNoControls_AndIsPrintedExactlyAsCleaned()
    {
        Hostile.Sample(text =>
        {
            string clean = TextSafety.Clean(text);
            clean.ShouldAllBe(c => !TextSafety.Unsafe(c) && c != '\n' && c != '\r' && c != '\t');
            var sw = new StringWriter();
            var console = CommandSupport.Console(new CliIo(sw, TextWriter.Null, false));
            console.Profile.Width = 100_000;
            CommandSupport.Line(console, (text, null));
            sw.ToString().TrimEnd('\n', '\r', ' ').ShouldBe(clean.TrimEnd(' '));
        }, iter: 300);
    }

    [Fact]
    public void Property_MarkdownValues_CarryNoTagAndNoLink_AndEscapingTwiceChangesNothing()
    {
        Hostile.Select(Gen.OneOf(Gen.Const("<script>"), Gen.Const("[a](javascript:b)"), Gen.Const("![i](x)"), Gen.Const("<http://x>"), Gen.Const("")),
            (a, b) => a + b).Sample(text =>
        {
            string inert = MarkdownText.Inert(text);
            inert.ShouldNotContain("<");
            inert.ShouldNotContain("](");
            MarkdownText.Inert(inert).ShouldBe(inert);
        }, iter: 500);
    }

    private static readonly (char Latin, char Other)[] LookAlikes = [('A', 'А'), ('B', 'В'), ('C', 'С'), ('E', 'Е'), ('H', 'Н'), ('O', 'О'), ('P', 'Р'), ('X', 'Х'), ('A', 'Α'), ('B', 'Β')];

    [Fact]
    public void Property_IdsThatLookAlike_HaveOneSkeleton_AndDistinctAsciiIdsDoNot()
    {
        var id = Gen.String[Gen.Char['A', 'Z'], 1, 6];
        Gen.Select(id, Gen.Int[0, LookAlikes.Length - 1], Gen.Int[0, 3]).Sample((s, k, how) =>
        {
            var (latin, other) = LookAlikes[k];
            string a = latin + s, b = how switch
            {
                0 => other + s,
                1 => latin + "\u200B" + s,
                2 => ((char)(latin + 0xFEE0)) + s,
                _ => latin + "\u2060" + s,
            };
            IdSkeleton.Of(a).ShouldBe(IdSkeleton.Of(b));
        }, iter: 300);
        Gen.Select(id, id).Where((a, b) => a != b).Sample((a, b) => IdSkeleton.Of(a).ShouldNotBe(IdSkeleton.Of(b)), iter: 300);
    }
}
