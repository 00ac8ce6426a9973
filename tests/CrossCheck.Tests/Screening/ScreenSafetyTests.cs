using CrossCheck.Common;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Screening;

/// <summary>What the screen finds in a folder, and that nothing it writes can land outside the output folder.</summary>
public class ScreenSafetyTests
{
    private static readonly ReviewOptions Options = new(Date: new DateOnly(2026, 12, 1));

    [Theory]
    [InlineData("../../etc", "etc")]
    [InlineData("..", "submission")]
    [InlineData("Hall B (rev 2)", "Hall_B_rev_2")]
    [InlineData("Überführung Nord", "Überführung_Nord")]
    [InlineData("tab\there\u0000nul", "tab_here_nul")]
    [InlineData(".hidden", "hidden")]
    [InlineData("a/b\\c", "a_b_c")]
    [InlineData("CON", "_CON")]
    [InlineData("  ", "submission")]
    public void SafeStem_KeepsOnlyPlainCharacters(string name, string stem) => SubmissionNames.SafeStem(name).ShouldBe(stem);

    [Fact]
    public void SafeStem_IsShort()
    {
        SubmissionNames.SafeStem(new string('x', 500)).Length.ShouldBeLessThanOrEqualTo(80);
    }

    [Theory]
    [InlineData("../x.html")]
    [InlineData("a/b.html")]
    [InlineData("/etc/passwd")]
    [InlineData("..")]
    [InlineData("")]
    public void ChildPath_RefusesAnythingButAPlainName(string name)
    {
        using var t = new TempSubmission();
        Should.Throw<ArgumentException>(() => SubmissionNames.ChildPath(t.Folder, name));
    }

    [Fact]
    public void Finder_TakesCsvPdfAndSubFolders_SkipsTheRest_AndGivesUniqueStems()
    {
        using var t = new TempSubmission();
        t.Write("a.csv", SampleText.All);
        t.Write("A/joints.csv", "joint,x,y\n");          // a folder of tables whose stem collides with a.csv ignoring case
        t.Write("calc one.pdf", "%PDF-1.4");
        t.Write("student 7/calc.csv", SampleText.All);     // one sectioned file in a sub-folder
        t.Write("student 8/scan.pdf", "%PDF-1.4");         // one PDF in a sub-folder
        t.Write("notes.txt", "not a submission");
        t.Write(".hidden.csv", SampleText.All);
        t.Write("out/old-review.html", "<p>");
        t.Write("reg.db", "");
        t.Write("reg.db-wal", "");
        var found = SubmissionFinder.Find(t.Folder, [Path.Combine(t.Folder, "out"), Path.Combine(t.Folder, "reg.db")]);
        found.Items.Select(i => i.Name).ShouldBe(["A", "a.csv", "calc one.pdf", "student 7", "student 8"]);
        found.Items.Select(i => i.Stem).ShouldBe(["A", "a-csv", "calc_one", "student_7", "student_8"]);
        found.Items.Single(i => i.Name == "student 7").Path.ShouldEndWith(Path.Combine("student 7", "calc.csv"));
        found.Items.Single(i => i.Name == "student 8").Path.ShouldEndWith(Path.Combine("student 8", "scan.pdf"));
        found.Items.Single(i => i.Name == "A").Path.ShouldEndWith("A");
        found.Skipped.ShouldHaveSingleItem().ShouldStartWith("notes.txt");
    }

    [Fact]
    public void Screen_HostileNamesAndTitles_WriteOnlyInsideTheOutputFolder_AndAreEscaped()
    {
        using var t = new TempSubmission();
        string subs = Path.Combine(t.Folder, "deep", "subs");
        string hostile = SampleText.With(info: """
            [info]
            key,value
            title,<script>alert(1)</script> ../../etc
            reference,=HYPERLINK("http://example.invalid")
            force unit,kN
            length unit,m
            """);
        Directory.CreateDirectory(subs);
        File.WriteAllText(Path.Combine(subs, "etc...csv"), hostile);
        File.WriteAllText(Path.Combine(subs, "<b>bold.csv"), hostile.Replace("-81", "-90", StringComparison.Ordinal));
        File.WriteAllText(Path.Combine(subs, "& broken.csv"), "[info]\nkey,value\ntitle,<img src=x>\n");
        string outDir = Path.Combine(t.Folder, "deep", "out");
        var before = AllFiles(t.Folder);

        var report = Screener.Run(subs, new ScreenOptions(Options, outDir, MemoFormat.Html, RegisterPath: Path.Combine(t.Folder, "deep", "reg.db")));

        report.Rows.Count.ShouldBe(3);
        var added = AllFiles(t.Folder).Except(before).ToList();
        added.ShouldAllBe(f => f.StartsWith(outDir + Path.DirectorySeparatorChar, StringComparison.Ordinal) || f.StartsWith(Path.Combine(t.Folder, "deep", "reg.db"), StringComparison.Ordinal));
        Directory.GetFiles(outDir).Select(Path.GetFileName).ShouldBe(
            ["b_bold-review.html", "broken-input-errors.txt", "etc-review.html", "index.html", "summary.csv"], ignoreOrder: true);

        string index = File.ReadAllText(Path.Combine(outDir, Screener.IndexFile));
        index.ShouldNotContain("<script>alert");
        index.ShouldNotContain("<b>bold");
        index.ShouldNotContain("<img src=x>");
        index.ShouldContain("&lt;b&gt;bold.csv");
        string memo = File.ReadAllText(Path.Combine(outDir, "etc-review.html"));
        memo.ShouldNotContain("<script>alert");

        // A spreadsheet opening the summary sees text, not a formula.
        var csv = CsvRecords.Parse(File.ReadAllText(Path.Combine(outDir, Screener.SummaryFile)));
        csv.Where(r => r["outcome"] != "input-error").ShouldAllBe(r => r["reference"].StartsWith("'=HYPERLINK", StringComparison.Ordinal));
    }

    [Fact]
    public void Screen_ReferenceSharedBySeveralSubmissions_IsTrackedPerSubmission()
    {
        using var t = new TempSubmission();
        string subs = Path.Combine(t.Folder, "class");
        string shared = SampleText.With(info: SampleText.Info + "\nreference,HW-3");
        Directory.CreateDirectory(subs);
        File.WriteAllText(Path.Combine(subs, "ana.csv"), shared);
        File.WriteAllText(Path.Combine(subs, "ben.csv"), shared);
        File.WriteAllText(Path.Combine(subs, "cai.csv"), SampleText.With(info: SampleText.Info + "\nreference,HW-3-cai"));
        var report = Screener.Run(subs, new ScreenOptions(Options, Path.Combine(t.Folder, "out"), RegisterPath: Path.Combine(t.Folder, "reg.db")));
        report.Rows.Select(r => r.Reference).ShouldBe(["HW-3 / ana.csv", "HW-3 / ben.csv", "HW-3-cai"], ignoreOrder: true);
        report.Rows.ShouldAllBe(r => r.Rounds!.Review.Round == 1);
        report.Notes.ShouldContain(n => n.Contains("reference 'HW-3' is given by 2 submissions", StringComparison.Ordinal));
    }

    [Fact]
    public void Screen_EmptyFolder_WritesAnEmptySummaryAndConcurs()
    {
        using var t = new TempSubmission();
        Directory.CreateDirectory(Path.Combine(t.Folder, "none"));
        var report = Screener.Run(Path.Combine(t.Folder, "none"), new ScreenOptions(Options, Path.Combine(t.Folder, "out")));
        report.Rows.ShouldBeEmpty();
        report.Worst.ShouldBe(ScreenOutcome.Concur);
        CsvRecords.Parse(File.ReadAllText(Path.Combine(t.Folder, "out", Screener.SummaryFile))).ShouldBeEmpty();
    }

    private static HashSet<string> AllFiles(string root) => Directory.GetFiles(root, "*", SearchOption.AllDirectories).ToHashSet(StringComparer.Ordinal);
}
