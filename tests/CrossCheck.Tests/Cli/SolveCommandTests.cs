using System.Text.Json;
using CrossCheck.Cli;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Cli;

public class SolveCommandTests
{
    [Fact]
    public void Solve_PrintsATableOfEndMoments()
    {
        var r = CliRunner.Run("solve", CliRunner.Demo("footbridge.csv"));
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        r.Out.ShouldContain("load case DL");
        // Support moment under DL by the three-moment equation (Clapeyron, I per span; see ReviewCommandTests):
        // 3.5 × (8²·32 + 10²·30) / 154 = 114.727 kN·m, printed to two decimals.
        r.Out.ShouldContain("114.73");
        r.Out.ShouldContain("kN·m");
    }

    [Fact]
    public void Solve_Json_IsValidAndInTheSubmissionsUnits()
    {
        var r = CliRunner.Run("solve", CliRunner.Demo("shed-frame"), "--format", "json");
        r.ExitCode.ShouldBe(0, r.Err);
        using var doc = JsonDocument.Parse(r.Out.ShouldMatchSolveSchema());
        doc.RootElement.GetProperty("schema").GetString().ShouldBe("crosscheck-solve/1");
        var g = doc.RootElement.GetProperty("cases")[0];
        g.GetProperty("case").GetString().ShouldBe("G");
        var ab = g.GetProperty("endMoments").EnumerateArray().First(e => e.GetProperty("member").GetString() == "AB" && e.GetProperty("at").GetString() == "B");
        // Hand moment distribution at B (symmetric frame, C does not rotate): DF_BA = 128/(128 + 111.1) → 108 × 0.5353 = 57.81 kN·m.
        ab.GetProperty("moment").GetDouble().ShouldBe(57.81, 0.01);
    }

    [Fact]
    public void Solve_Csv_ToAFile_WritesTheFileOnly()
    {
        using var t = new TempSubmission();
        string outFile = Path.Combine(t.Folder, "out", "moments.csv");
        var r = CliRunner.Run("solve", CliRunner.Demo("footbridge.csv"), "-f", "csv", "--out", outFile);
        r.ExitCode.ShouldBe(0, r.Err);
        r.Out.ShouldBeEmpty();
        File.ReadAllText(outFile).ShouldStartWith("case,member,at,moment [kN·m]\n");
        Directory.GetFiles(Path.GetDirectoryName(outFile)!).ShouldHaveSingleItem();
    }

    [Fact]
    public void Solve_PrintsCombinationsAndEnvelopes_InEveryFormat()
    {
        // Mezzanine demo: ULS-2 is a derived case; ULS-1 has Q patterned bay by bay. The outer bays' largest span moments come with
        // the outer bays loaded and the middle one not (alternate spans: EN 1992-1-1 5.1.3, docs/REFERENCE-CHECKS.md group 9).
        string demo = CliRunner.Demo("mezzanine-frame.csv");
        var table = CliRunner.Run("solve", demo);
        table.ExitCode.ShouldBe(0, table.Err);
        table.Out.ShouldContain("combination ULS-2 = 1.35 G + 1.5 W + 1.05 Q");
        table.Out.ShouldContain("envelope of combination ULS-1");
        var csv = CliRunner.Run("solve", demo, "--format", "csv");
        csv.Out.ShouldStartWith("case,member,at,moment [kN·m],bound,loaded\n");
        csv.Out.ShouldContain("ULS-1,M1,span,");
        csv.Out.ShouldContain(",max,M1 M3\n");
        var json = CliRunner.Run("solve", demo, "--format", "json").Out.ShouldMatchSolveSchema();
        var doc = JsonDocument.Parse(json).RootElement;
        doc.GetProperty("cases").EnumerateArray().Single(c => c.GetProperty("case").GetString() == "ULS-2").GetProperty("combination").GetString()
            .ShouldBe("1.35 G + 1.5 W + 1.05 Q");
        var env = doc.GetProperty("envelopes").EnumerateArray().ShouldHaveSingleItem();
        env.GetProperty("rows").EnumerateArray().Single(r => r.GetProperty("member").GetString() == "M1" && r.GetProperty("at").GetString() == "span")
            .GetProperty("maxLoaded").EnumerateArray().Select(x => x.GetString()).ShouldBe(["M1", "M3"]);
    }

    [Fact]
    public void Solve_BadInput_ExitsWithTwoAndNamesThePlace()
    {
        var r = CliRunner.Run("solve", TempFile("[joints]\njoint,x,y\nA,0,zero"));
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("calc.csv:3:y (table joints): 'y' must be a number, got \"zero\"");
        r.Err.ShouldNotContain("   at ");
        r.Out.ShouldBeEmpty();
    }

    [Fact]
    public void Solve_Mechanism_ExitsWithTwo()
    {
        var r = CliRunner.Run("solve", TempFile(SampleText.With(frame: """
            [joints]
            joint,x,y,restraint
            A,0,0,roller
            B,6,0,roller

            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,250e6
            """, loads: "[loads]\non,kind,P,dir\nB,force,3,right")));
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("mechanism");
    }

    [Fact]
    public void UnknownOption_IsAnInputError()
    {
        var r = CliRunner.Run("solve", CliRunner.Demo("footbridge.csv"), "--colour", "red");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
    }

    [Theory]
    [InlineData]
    [InlineData("solve")]
    public void HelpAndVersion_WorkEverywhere(params string[] prefix)
    {
        var help = CliRunner.Run([.. prefix, "--help"]);
        help.ExitCode.ShouldBe(0);
        help.Out.ShouldContain("Usage");
        var version = CliRunner.Run([.. prefix, "--version"]);
        version.ExitCode.ShouldBe(0, version.Err);
        version.Out.Trim().ShouldStartWith("0.1.0");
    }

    [Fact]
    public void Solve_NeedsNoClaims_ButReviewDoes()
    {
        var dir = Directory.CreateTempSubdirectory("crosscheck-cli-").FullName;
        foreach (var f in Directory.GetFiles(CliRunner.Demo("shed-frame"), "*.csv"))
            if (Path.GetFileName(f) is not ("end-moments.csv" or "distribution.csv")) File.Copy(f, Path.Combine(dir, Path.GetFileName(f)));

        var solve = CliRunner.Run("solve", dir, "--format", "csv");
        solve.ExitCode.ShouldBe(ExitCodes.Concur, solve.Err);
        // Hand moment distribution at B of the symmetric shed frame (see Solve_Json_IsValidAndInTheSubmissionsUnits): 57.81 kN·m.
        solve.Out.ShouldContain("G,AB,B,57.81");

        var review = CliRunner.Run("review", dir, "--quiet");
        review.ExitCode.ShouldBe(ExitCodes.InputError);
        review.Err.ShouldContain("no 'end-moments' table");
    }

    private static string TempFile(string text)
    {
        var dir = Directory.CreateTempSubdirectory("crosscheck-cli-").FullName;
        string p = Path.Combine(dir, "calc.csv");
        File.WriteAllText(p, text);
        return p;
    }
}
