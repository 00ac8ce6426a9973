using CrossCheck.Cli;
using CrossCheck.Import;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// The bounds of <see cref="InputLimits"/>: each is an input error with its place and how to raise it, each can be set,
/// and just under a bound nothing is refused. Also the input problems found while building the catalogue, each with the
/// behaviour that fixed it.
/// </summary>
public class InputLimitsTests
{
    private static ImportResult Read(string text, InputLimits limits, string name = "calc.csv")
    {
        using var t = new TempSubmission();
        return SubmissionReader.Read(t.Write(name, text), limits);
    }

    private static InputProblem SingleError(ImportResult r)
    {
        r.Succeeded.ShouldBeFalse();
        return r.Errors.ShouldHaveSingleItem(string.Join("\n", r.Problems));
    }

    private static string Loads(int rows) => SampleText.With(loads: "[loads]\ncase,on,kind,w\n" + string.Concat(Enumerable.Repeat("1,AB,udl,6\n", rows)));

    [Fact]
    public void Rows_OverTheLimit_AreRefusedAtTheTableHeader_AndTheLimitCanBeRaised()
    {
        var e = SingleError(Read(Loads(4), InputLimits.Default with { MaxRows = 3 }));
        e.Message.ShouldBe("table 'loads' has 4 rows; CrossCheck reads at most 3 rows per table (raise the limit with --max-rows)");
        e.Where.Compact.ShouldBe("calc.csv:17");
        Read(Loads(4), InputLimits.Default with { MaxRows = 4 }).Succeeded.ShouldBeTrue();
    }

    [Fact]
    public void Members_OverTheLimit_AreRefused_AndTheLimitCanBeRaised()
    {
        string beam = HostileInputs.Beam(5);
        SingleError(Read(beam, InputLimits.Default with { MaxMembers = 4 })).Message
            .ShouldBe("the submission has 5 members; CrossCheck analyses at most 4 (raise the limit with --max-members)");
        Read(beam, InputLimits.Default with { MaxMembers = 5 }).Errors.ShouldBeEmpty();
        SingleError(Read(beam, InputLimits.Default with { MaxJoints = 5 })).Message.ShouldStartWith("the submission has 6 joints; CrossCheck analyses at most 5");
    }

    [Fact]
    public void LoadCases_OverTheLimit_AreRefused()
    {
        string text = SampleText.With(loads: "[loads]\ncase,on,kind,w\nG,AB,udl,5\nQ,AB,udl,3\nW,AB,udl,1\n");
        SingleError(Read(text, InputLimits.Default with { MaxLoadCases = 2 })).Message
            .ShouldBe("the loads table has 3 load cases; CrossCheck reviews at most 2 in one submission (split the submission)");
    }

    [Fact]
    public void FileSize_LineLength_AndCellLength_AreBounded()
    {
        SingleError(Read(SampleText.All, InputLimits.Default with { MaxFileBytes = 100 })).Message
            .ShouldStartWith("the file is 1 KB; CSV files larger than 1 KB are not read (raise the limit with --max-file-mb)");
        var line = SingleError(Read(SampleText.All, InputLimits.Default with { MaxLineChars = 20 }));
        line.Message.ShouldBe("this line is 33 characters long; lines longer than 20 characters are not read (a table row is a few hundred; is the file a table?)");
        line.Where.Compact.ShouldBe("calc.csv:13");
        var cell = SingleError(Read(SampleText.All.Replace("Test beam", "Test beam over the east door", StringComparison.Ordinal), InputLimits.Default with { MaxCellChars = 25 }));
        cell.Message.ShouldStartWith("cell 2 of this row holds 28 characters; cells longer than 25 are not read");
        cell.Where.Compact.ShouldBe("calc.csv:3");
    }

    [Theory]
    [InlineData("1e31", "'P' = \"1e31\" is too large or too small to compute with")]     // over MaxMagnitude (1e30 N)
    [InlineData("4.9e-324", "'P' = \"4.9e-324\" is too large or too small to compute with")] // a denormal double
    [InlineData("1e-300", "'P' = \"1e-300\" is too large or too small to compute with")]     // 1e-297 N: below MinMagnitude
    public void Magnitudes_OutsideWhatArithmeticCanCarry_AreRefusedAtTheirCell(string p, string message)
    {
        var e = SingleError(Read(SampleText.With(loads: $"[loads]\ncase,on,kind,P,a\n1,AB,point,{p},3\n"), InputLimits.Default));
        e.Message.ShouldBe(message);
        e.Where.Compact.ShouldBe("calc.csv:18:P");
    }

    [Fact]
    public void Denormal_IInMm4_IsOutOfRange_NotZero()
    {
        // Regression: 4.9e-324 mm⁴ underflowed to 0 m⁴ and was reported as "must be greater than zero".
        var e = SingleError(Read(SampleText.With(frame: SampleText.Frame.Replace("250e6", "4.9e-324", StringComparison.Ordinal)), InputLimits.Default));
        e.Message.ShouldBe("'I' = \"4.9e-324\" is too large or too small to compute with");
    }

    [Fact]
    public void CoordinatesAndMembers_BeyondMaxLength_AreRefused()
    {
        var coordinate = SingleError(Read(SampleText.With(frame: SampleText.Frame.Replace("B,6,0,roller", "B,6e6,0,roller", StringComparison.Ordinal)), InputLimits.Default));
        coordinate.Message.ShouldStartWith("'x' = \"6e6\" is 6e+6 m; CrossCheck reads lengths and coordinates up to 1e+5 m");
        coordinate.Where.Compact.ShouldBe("calc.csv:10:x");
        var member = SingleError(Read(SampleText.With(frame: SampleText.Frame.Replace("A,0,0,fixed", "A,-5e4,0,fixed", StringComparison.Ordinal)
            .Replace("B,6,0,roller", "B,6e4,0,roller", StringComparison.Ordinal)), InputLimits.Default));
        member.Message.ShouldStartWith("member 'AB' is 1.1e+5 m long; CrossCheck analyses members up to 1e+5 m long");
    }

    [Fact]
    public void ByteOrderMark_InTheMiddle_IsRemovedWithAWarning_AndItsTableIsRead()
    {
        // Regression: two files joined left "\uFEFF[loads]", which was not taken for a section line.
        var r = Read(SampleText.All.Replace("[loads]", "\uFEFF[loads]", StringComparison.Ordinal), InputLimits.Default);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var w = r.Warnings.ShouldHaveSingleItem();
        w.Where.Compact.ShouldBe("calc.csv:16");
        w.Message.ShouldStartWith("this line holds an invisible byte-order mark");
    }

    [Fact]
    public void InfoSetting_GivenTwiceWithDifferentValues_IsAnError_TheSameValueTwiceIsNot()
    {
        var e = SingleError(Read(SampleText.All.Replace("length unit,m", "length unit,m\nlength unit,mm", StringComparison.Ordinal), InputLimits.Default));
        e.Message.ShouldBe("info key 'length unit' is given twice with different values: \"m\" (at calc.csv:5) and \"mm\"; give it once");
        e.Where.Compact.ShouldBe("calc.csv:6:value");
        Read(SampleText.All.Replace("length unit,m", "length unit,m\nLength Unit, m ", StringComparison.Ordinal), InputLimits.Default).Succeeded.ShouldBeTrue();
    }

    [Theory]
    [InlineData("B,6,0,roller", "B,six,0,roller", "calc.csv:10:x")]                 // joint B left out: not also "not in the joints table"
    [InlineData("AB,A,B,200,250e6", "AB,A,B,200,NaN", "calc.csv:14:I [mm^4]")]     // member AB left out: its joints not also "not connected"
    public void RowLeftOutForAnError_IsNotReportedAgainWhereItIsUsed(string from, string to, string where)
    {
        // Regression: one bad cell gave four or five messages, the later ones about the rows that referred to it.
        var e = SingleError(Read(SampleText.With(frame: SampleText.Frame.Replace(from, to, StringComparison.Ordinal)), InputLimits.Default));
        e.Where.Compact.ShouldBe(where);
    }

    [Fact]
    public void LoadLeftOutForAnError_DoesNotMakeItsCaseLookEmpty()
    {
        var e = SingleError(Read(SampleText.With(loads: "[loads]\ncase,on,kind,w\n1,AB,udl,heavy\n"), InputLimits.Default));
        e.Message.ShouldStartWith("'w' must be a number, got \"heavy\"");
    }

    [Fact]
    public void MissingRequiredColumn_IsReportedOnce_AtTheHeader()
    {
        var e = SingleError(Read(SampleText.With(frame: SampleText.Frame.Replace(",I [mm^4]", "", StringComparison.Ordinal).Replace(",250e6", "", StringComparison.Ordinal)), InputLimits.Default));
        e.Message.ShouldBe("table 'members' needs a column 'I'");
        e.Where.Compact.ShouldBe("calc.csv:13:I");
    }

    [Fact]
    public void StructureInTwoSupportedParts_IsReviewed_WithAWarningNamingTheParts()
    {
        string frame = SampleText.Frame.Replace("B,6,0,roller", "B,6,0,roller\nC,10,0,fixed\nD,14,0,roller", StringComparison.Ordinal) + "\nCD,C,D,200,250e6\n";
        var r = Read(SampleText.With(frame: frame), InputLimits.Default);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Warnings.ShouldHaveSingleItem().Message.ShouldStartWith("the members form 2 separate structures that share no joint (joints A, B; joints C, D)");
    }

    [Fact]
    public void EmptyFile_SaysSo_AndNothingElse()
    {
        var e = SingleError(Read("", InputLimits.Default));
        e.Message.ShouldBe("the file is empty (0 bytes)");
    }

    [Fact]
    public void Cli_LimitOptions_RaiseAndLowerTheBounds()
    {
        using var t = new TempSubmission();
        string path = t.Write("calc.csv", Loads(4));
        var low = CliRunner.Run("review", path, "--max-rows", "3", "--out", Path.Combine(t.Folder, "m.md"));
        low.ExitCode.ShouldBe(ExitCodes.InputError);
        low.Err.ShouldContain("calc.csv:17 (table loads): table 'loads' has 4 rows; CrossCheck reads at most 3 rows per table (raise the limit with --max-rows)");
        CliRunner.Run("solve", path, "--max-rows", "4").ExitCode.ShouldBe(ExitCodes.Concur);
        var members = CliRunner.Run("solve", t.Write("beam.csv", HostileInputs.Beam(5)), "--max-members", "4");
        members.ExitCode.ShouldBe(ExitCodes.InputError);
        members.Err.ShouldContain("the submission has 5 members; CrossCheck analyses at most 4");
        var size = CliRunner.Run("solve", path, "--max-file-mb", "0.0001");
        size.ExitCode.ShouldBe(ExitCodes.InputError);
        size.Err.ShouldContain("CSV files larger than 1 KB are not read");
        var nonsense = CliRunner.Run("solve", path, "--max-members", "0");
        nonsense.ExitCode.ShouldBe(ExitCodes.InputError);
        nonsense.Err.ShouldContain("--max-rows and --max-members must be at least 1");
    }
}
