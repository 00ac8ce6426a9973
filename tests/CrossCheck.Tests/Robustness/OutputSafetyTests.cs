using CrossCheck.Cli;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// What CrossCheck writes stays where it was asked to write it, is replaced in one step, and is never half-written;
/// an output path that cannot be written is the user's error (exit 2), not a crash.
/// </summary>
public class OutputSafetyTests
{
    private static string ShedFrame => CliRunner.Demo("shed-frame");

    private static HashSet<string> Everything(string root) =>
        Directory.EnumerateFileSystemEntries(root, "*", SearchOption.AllDirectories).Select(p => Path.GetRelativePath(root, p)).ToHashSet(StringComparer.Ordinal);

    [Fact]
    public void SubmissionReachedAs_DotDotEtc_WritesItsDefaultMemoInTheWorkingFolder_AndNowhereElse()
    {
        using var t = new TempSubmission();
        t.CopyFolder(ShedFrame, "etc");
        string work = t.MakeFolder(Path.Combine("a", "b"));
        var before = Everything(t.Folder);
        var (code, _, err) = ChildProcess.Finish(ChildProcess.CliIn(work, "review", "../../etc", "--quiet"));
        code.ShouldBe(ExitCodes.Comments, err);
        Everything(t.Folder).Except(before).ShouldBe([Path.Combine("a", "b", "etc-review.md")]);
    }

    [Fact]
    public void ReferenceAndTitle_DotDotEtc_NameNoFile()
    {
        using var t = new TempSubmission();
        string work = t.MakeFolder(Path.Combine("a", "b"));
        string path = t.Write(Path.Combine("a", "b", "calc.csv"),
            SampleText.With(info: "[info]\nkey,value\ntitle,../../etc\nreference,../../etc/passwd\nforce unit,kN\nlength unit,m"));
        var before = Everything(t.Folder);
        var (code, _, err) = ChildProcess.Finish(ChildProcess.CliIn(work, "review", "calc.csv", "--format", "html", "--quiet"));
        code.ShouldBe(ExitCodes.Concur, err);
        Everything(t.Folder).Except(before).ShouldBe([Path.Combine("a", "b", "calc-review.html")]);
        File.Exists(path).ShouldBeTrue();
    }

    [Fact]
    public void Screen_OfOddlyNamedSubmissions_WritesOnlyPlainFilesInsideItsOutputFolder()
    {
        using var t = new TempSubmission();
        string inbox = t.MakeFolder(Path.Combine("in", "box"));
        string hostile = SampleText.With(info: "[info]\nkey,value\ntitle,../../../etc\nreference,..\\..\\windows\nforce unit,kN\nlength unit,m");
        foreach (var name in new[] { "...csv", "-rf.csv", "a\\..\\b.csv", "CON.csv", "~.csv", " .csv" }) File.WriteAllText(Path.Combine(inbox, name), hostile);
        TempSubmission.CopyFiles(ShedFrame, Path.Combine(inbox, "..."));
        string output = Path.Combine(t.Folder, "out");
        var before = Everything(t.Folder);
        var r = CliRunner.Run("screen", inbox, "--out", output, "--no-register", "--quiet");
        r.ExitCode.ShouldBeOneOf(ExitCodes.Concur, ExitCodes.Comments);
        var added = Everything(t.Folder).Except(before).ToList();
        added.ShouldAllBe(p => p == "out" || (Path.GetDirectoryName(p) == "out" && !Path.GetFileName(p).StartsWith('.') && !Path.GetFileName(p).StartsWith('-')));
        // Entries whose names start with a dot ("...csv", the folder "...") are hidden and skipped by design.
        added.Count(p => p.EndsWith("-review.html", StringComparison.Ordinal)).ShouldBe(5);
    }

    [Fact]
    public void Extract_WritesOnlyTheFormatsTableFiles_InsideItsOutputFolder()
    {
        using var t = new TempSubmission();
        string output = Path.Combine(t.Folder, "tables");
        var r = CliRunner.Run("extract", CliRunner.Demo("shed-frame.pdf"), "--out", output);
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        var files = Everything(t.Folder);
        files.ShouldAllBe(p => p == "tables" || Path.GetDirectoryName(p) == "tables");
        files.Where(p => p != "tables").Select(p => Path.GetFileNameWithoutExtension(p)).ShouldAllBe(n => TableSchema.Find(n!) != null);
    }

    [Fact]
    public void ExistingMemo_IsReplacedWhole_AndNoTemporaryFileIsLeft()
    {
        using var t = new TempSubmission();
        string memo = t.Write(Path.Combine("memos", "memo.md"), "an earlier memo");
        var r = CliRunner.Run("review", ShedFrame, "--out", memo, "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        File.ReadAllText(memo).ShouldStartWith("# Analysis check — Depot storage shed");
        Directory.GetFiles(Path.GetDirectoryName(memo)!).ShouldBe([memo]);
    }

    [Fact]
    public void MemoThatCannotBeRendered_LeavesTheEarlierMemoAsItWas()
    {
        using var t = new TempSubmission();
        string memo = t.Write("memo.md", "an earlier memo");
        string template = t.Write("broken.sbn", "{{ model.Title }} {{ model.NoSuchThing }}");
        var r = CliRunner.Run("review", ShedFrame, "--out", memo, "--template", template, "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("the memo template has an error");
        File.ReadAllText(memo).ShouldBe("an earlier memo");
    }

    [Fact]
    public async Task AtomicFile_ReadersSeeTheOldFileOrTheNewOne_NeverHalfOfOne()
    {
        using var t = new TempSubmission();
        string path = Path.Combine(t.Folder, "memo.html");
        string a = new('a', 3_000_000), b = new('b', 2_000_000);
        AtomicFile.WriteText(path, a);
        var writer = Task.Run(() =>
        {
            for (int i = 0; i < 40; i++) AtomicFile.WriteText(path, i % 2 == 0 ? b : a);
        });
        int reads = 0;
        while (!writer.IsCompleted || reads < 20)
        {
            string seen = File.ReadAllText(path);
            (seen == a || seen == b).ShouldBeTrue($"read {seen.Length} characters: neither whole version");
            reads++;
        }
        await writer;
        Directory.GetFiles(t.Folder).ShouldBe([path]);
    }

    [Fact]
    public void SolveOutputPathThatIsAFolder_IsAnInputError_NotACrash()
    {
        using var t = new TempSubmission();
        string folder = t.MakeFolder("taken");
        var r = CliRunner.Run("solve", ShedFrame, "--out", folder);
        r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
        r.Err.ShouldContain($"crosscheck: cannot write '{folder}'");
        r.Err.ShouldNotContain("internal error");
        r.Err.ShouldNotContain("   at ");
        Directory.GetFileSystemEntries(folder).ShouldBeEmpty();
    }

    [Fact]
    public void ReviewOutputPathThatIsAFolder_WritesTheMemoIntoIt()
    {
        using var t = new TempSubmission();
        string folder = t.MakeFolder("memos");
        var r = CliRunner.Run("review", ShedFrame, "--out", folder);
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        Directory.GetFileSystemEntries(folder).Select(Path.GetFileName).ShouldBe(["shed-frame-review.md"]);
        r.Out.ShouldContain(Path.Combine(folder, "shed-frame-review.md"));
    }
}
