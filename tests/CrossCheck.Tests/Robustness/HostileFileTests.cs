using System.Text;
using CrossCheck.Cli;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// Outputs replace regular files only (a device or pipe is streamed into, <c>-</c> is standard output), never an input;
/// inputs are regular files inside their folder, read within a byte budget from the stream, whatever size they report.
/// </summary>
public class HostileFileTests
{
    private static string ShedFrame => CliRunner.Demo("shed-frame");

    [Fact]
    public void OutDevNull_IsWrittenInto_AndStaysADevice()
    {
        var r = CliRunner.Run("review", ShedFrame, "--out", "/dev/null", "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        FileFacts.Of("/dev/null").Kind.ShouldBe(FileKind.CharacterDevice);
        File.Exists("/dev/.null.tmp").ShouldBeFalse();
    }

    [Fact]
    public async Task OutNamedPipe_IsStreamedInto_AndStaysAPipe()
    {
        using var t = new TempSubmission();
        string fifo = SpecialFiles.Fifo(Path.Combine(t.Folder, "memo.fifo"));
        var reader = Task.Run(() => File.ReadAllText(fifo));
        var r = SpecialFiles.Within(60, () => CliRunner.Run("review", ShedFrame, "--out", fifo, "--quiet"));
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        string memo = await reader.WaitAsync(TimeSpan.FromSeconds(30));
        memo.ShouldStartWith("# Analysis check — Depot storage shed");
        FileFacts.Of(fifo).Kind.ShouldBe(FileKind.Pipe);
    }

    [Theory]
    [InlineData("-")]
    [InlineData("/dev/stdout")]
    public void OutDash_OrDevStdout_WritesTheMemoToStandardOutput(string target)
    {
        var r = CliRunner.Run("review", ShedFrame, "--out", target);
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        r.Out.ShouldStartWith("# Analysis check — Depot storage shed");
        FileFacts.Of("/dev/stdout", followLinks: false).Kind.ShouldBe(FileKind.Link);
    }

    [Fact]
    public void Solve_OutDash_WritesToStandardOutput()
    {
        var r = CliRunner.Run("solve", ShedFrame, "--format", "csv", "--out", "-");
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        r.Out.ShouldStartWith("case,member,");
    }

    [Fact]
    public void OutputThatIsTheSubmission_IsRefused_ByName_ThroughALink_AndAsATableOfAFolder()
    {
        using var t = new TempSubmission();
        string calc = t.Write("calc.csv", SampleText.All);
        string link = SpecialFiles.Link(Path.Combine(t.Folder, "memo.md"), calc);
        string folder = t.CopyFolder(ShedFrame, "frame");
        foreach (var (submission, output) in new[] { (calc, calc), (calc, link), (folder, Path.Combine(folder, "members.csv")) })
        {
            string before = File.ReadAllText(output);
            var r = CliRunner.Run("review", submission, "--out", output, "--quiet");
            r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
            r.Err.ShouldContain("which this command reads; choose another output file");
            File.ReadAllText(output).ShouldBe(before);
        }
        var solve = CliRunner.Run("solve", calc, "--out", link);
        solve.ExitCode.ShouldBe(ExitCodes.InputError, solve.Err);
        File.ReadAllText(calc).ShouldBe(SampleText.All);
    }

    [Fact]
    public void ALegalLongOutputName_IsWritten()
    {
        using var t = new TempSubmission();
        string name = new string('m', 240) + ".md";
        string path = Path.Combine(t.Folder, name);
        var r = CliRunner.Run("review", ShedFrame, "--out", path, "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        File.Exists(path).ShouldBeTrue();
        Directory.GetFiles(t.Folder).ShouldBe([path]);
    }

    [Fact]
    public void StaleTemporaryFiles_OfEndedProcesses_AreRemoved_ThoseOfLiveOnesKept()
    {
        using var t = new TempSubmission();
        string stale = t.Write(".memo.md.999999999.0123abcd.tmp", "half a memo");
        string live = t.Write($".memo.md.1.{new string('a', 32)}.tmp", "being written by process 1");
        string other = t.Write(".notes.tmp", "not ours");
        var r = CliRunner.Run("review", ShedFrame, "--out", Path.Combine(t.Folder, "memo.md"), "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        File.Exists(stale).ShouldBeFalse();
        File.Exists(live).ShouldBeTrue();
        File.Exists(other).ShouldBeTrue();
    }

    [Fact]
    public void ATableLinkedToASystemFile_IsRefused_WithoutEchoingIt()
    {
        using var t = new TempSubmission();
        string folder = t.CopyFolder(ShedFrame, "frame");
        File.Delete(Path.Combine(folder, "joints.csv"));
        SpecialFiles.Link(Path.Combine(folder, "joints.csv"), "/etc/passwd");
        var r = CliRunner.Run("review", folder, "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
        r.Err.ShouldContain("joints.csv: 'joints.csv' is a link to '/etc/passwd', outside the folder 'frame'");
        r.Err.ShouldNotContain("root:");
    }

    [Theory]
    [InlineData("/dev/zero", "a character device")]
    [InlineData("/dev/urandom", "a character device")]
    public void ASubmissionLinkedToADevice_IsRefusedAtOnce(string device, string words)
    {
        using var t = new TempSubmission();
        foreach (var ext in new[] { ".csv", ".pdf" })
        {
            string link = SpecialFiles.Link(Path.Combine(t.Folder, "calc" + ext), device);
            var outcome = SpecialFiles.Within(30, () => new ReviewJob().Review(link, ReviewOptions.Default));
            outcome.Failure.ShouldBe(ReviewFailure.Unreadable);
            outcome.Errors.ShouldHaveSingleItem().Message.ShouldContain(words);
            outcome.Errors[0].Where.Compact.ShouldBe("calc" + ext);
        }
    }

    [Fact]
    public void NamedPipes_AsSubmission_Template_OrRegister_NeverHang()
    {
        using var t = new TempSubmission();
        string csv = SpecialFiles.Fifo(Path.Combine(t.Folder, "calc.csv"));
        string pdf = SpecialFiles.Fifo(Path.Combine(t.Folder, "calc.pdf"));
        string template = SpecialFiles.Fifo(Path.Combine(t.Folder, "memo.sbn"));
        string register = SpecialFiles.Fifo(Path.Combine(t.Folder, "register.db"));
        foreach (var args in new[]
                 {
                     new[] { "review", csv }, ["review", pdf], ["review", ShedFrame, "--template", template],
                     ["review", ShedFrame, "--register", register], ["history", "--register", register],
                     ["screen", ShedFrame, "--out", Path.Combine(t.Folder, "out"), "--template", template],
                 })
        {
            var r = SpecialFiles.Within(60, () => CliRunner.Run([.. args, "--quiet"]));
            r.ExitCode.ShouldBe(ExitCodes.InputError, string.Join(" ", args) + "\n" + r.Err);
            r.Err.ShouldContain("named pipe");
        }
    }

    [Fact]
    public void DevZeroAsRegister_IsRefused_AndNothingIsMadeBesideIt()
    {
        var r = CliRunner.Run("review", ShedFrame, "--register", "/dev/zero", "--out", "/dev/null");
        r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
        r.Err.ShouldContain("register '/dev/zero' is a character device");
        File.Exists("/dev/zero-wal").ShouldBeFalse();
    }

    [Fact]
    public void AFileLargerThanItsBudget_IsRefused_CountingBytesRead()
    {
        using var t = new TempSubmission();
        string path = t.Write("big.csv", new string('x', 5000));
        var ex = Should.Throw<InputFileException>(() => InputFile.Read(path, 4096));
        ex.Refusal.ShouldBe(InputRefusal.TooLarge);
        InputFile.Read(path, 5000).Length.ShouldBe(5000);
    }

    public static TheoryData<string> Encodings() => ["utf-16le-bom", "utf-16be-bom", "utf-32le-bom", "utf-32be-bom", "utf-16le", "utf-16be", "utf-32le"];

    [Theory]
    [MemberData(nameof(Encodings))]
    public void Utf16And32Files_AreRead_AsTheSameSubmission(string encoding)
    {
        using var t = new TempSubmission();
        var (enc, bom) = encoding switch
        {
            "utf-16le-bom" => ((Encoding)new UnicodeEncoding(false, false), true),
            "utf-16be-bom" => (new UnicodeEncoding(true, false), true),
            "utf-32le-bom" => (new UTF32Encoding(false, false), true),
            "utf-32be-bom" => (new UTF32Encoding(true, false), true),
            "utf-16le" => (new UnicodeEncoding(false, false), false),
            "utf-16be" => (new UnicodeEncoding(true, false), false),
            _ => (new UTF32Encoding(false, false), false),
        };
        byte[] text = enc.GetBytes(SampleText.All.Replace("Test beam", "Prüfträger", StringComparison.Ordinal));
        string path = t.WriteBytes("calc.csv", bom ? [.. enc.GetPreamble(), .. text] : text);
        var read = SubmissionReader.Read(path);
        read.Succeeded.ShouldBeTrue(string.Join("\n", read.Problems));
        read.Submission.Info.Title.ShouldBe("Prüfträger");
        read.Warnings.ShouldBeEmpty();
    }
}
