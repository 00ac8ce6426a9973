using System.Text.Json;
using CrossCheck.Cli;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Cli;

public class ReviewCommandTests
{
    [Fact]
    public void Review_Demo_PrintsASummaryWritesTheMemoAndExitsWithOne()
    {
        using var t = new TempSubmission();
        string memo = Path.Combine(t.Folder, "memo.md");
        var r = CliRunner.Run("review", CliRunner.Demo("shed-frame"), "--out", memo, "--reviewer", "A. Checker");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        r.Out.ShouldContain("verdict: revise");
        r.Out.ShouldContain("SO-G+W  case G+W, whole structure: sidesway ignored");
        File.ReadAllText(memo).ShouldContain("Reviewed by | A. Checker");
    }

    [Fact]
    public void Review_ConcurringSubmission_ExitsWithZero()
    {
        using var t = new TempSubmission();
        // Propped cantilever, UDL: −wL²/8 = −81 kN·m (Hicks Fig. 2.2 case 10).
        string path = t.Write("ok.csv", SampleText.All);
        var r = CliRunner.Run("review", path, "--out", Path.Combine(t.Folder, "m.md"), "--quiet");
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        r.Out.ShouldBeEmpty();
    }

    [Fact]
    public void Review_Json_OnStandardOutput_CarriesTheJsonAlone_AndEveryContractField()
    {
        var r = CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--format", "json");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        r.Out.ShouldMatchReviewSchema(); // docs/review.schema.json
        using var doc = JsonDocument.Parse(r.Out); // nothing but JSON on standard output
        var root = doc.RootElement;
        root.GetProperty("schema").GetString().ShouldBe("crosscheck-review/1");
        root.GetProperty("tool").GetProperty("name").GetString().ShouldBe("crosscheck");
        root.GetProperty("tool").GetProperty("version").GetString().ShouldBe("0.1.0");
        var sub = root.GetProperty("submission");
        sub.GetProperty("title").GetString().ShouldBe("Alder Mill footbridge - main deck girder");
        sub.GetProperty("reference").GetString().ShouldBe("DEMO-FB-01");
        sub.GetProperty("source").GetString().ShouldBe(CliRunner.Demo("footbridge.csv"));
        sub.GetProperty("momentUnit").GetString().ShouldBe("kN·m");
        sub.GetProperty("signConvention").GetString().ShouldBe("clockwise");
        var tol = root.GetProperty("tolerance"); // the defaults of docs/REVIEW-JSON.md (0.1 moment units, 1 %, 5 %)
        tol.GetProperty("absolute").GetDouble().ShouldBe(0.1);
        tol.GetProperty("relative").GetDouble().ShouldBe(0.01);
        tol.GetProperty("minorRelative").GetDouble().ShouldBe(0.05);
        root.GetProperty("verdict").GetString().ShouldBe("revise");
        root.GetProperty("inputErrors").GetArrayLength().ShouldBe(0);
        var dl = root.GetProperty("cases")[0];
        dl.GetProperty("case").GetString().ShouldBe("DL");
        // Support moment of the demo girder under DL, by Clapeyron's three-moment equation with I per span (Timoshenko &
        // Young, Theory of Structures; general form from memory, docs/REFERENCE-CHECKS.md "3-moment"): spans 8, 10, 8 m,
        // I = 2400, 3200, 2400 (10⁶ mm⁴), w = 14 kN/m, ends pinned, M_B = M_C = M by symmetry. With L/I scaled by 9600
        // (32, 30): 2M(32 + 30) + 30M = (w/4)(8²·32 + 10²·30), so M = 3.5 × 5048 / 154 = 114.727 kN·m. The span moments
        // are smaller (centre span wL²/8 − M = 60.3 kN·m), so it is also the case's peak.
        double mB = 14.0 / 4 * ((8 * 8 * 32) + (10 * 10 * 30)) / ((2 * (32 + 30)) + 30);
        dl.GetProperty("peakMoment").GetDouble().ShouldBe(mB, 1e-6);
        var worst = dl.GetProperty("endMoments")[0];
        worst.GetProperty("member").GetString().ShouldBe("BC");
        worst.GetProperty("at").GetString().ShouldBe("C");
        worst.GetProperty("claimed").GetDouble().ShouldBe(141.7); // as written in the demo (114.7 miscopied)
        worst.GetProperty("recomputed").GetDouble().ShouldBe(mB, 1e-6);
        worst.GetProperty("difference").GetDouble().ShouldBe(141.7 - mB, 1e-6);
        worst.GetProperty("status").GetString().ShouldBe("discrepant");
        worst.GetProperty("source").GetString().ShouldBe("footbridge.csv:41");
        string[] statuses = ["agree", "minor", "discrepant", "missing", "unmatched"];
        string[] kinds = ["end-moment", "joint-equilibrium", "released-end", "storey-shear", "reaction", "displacement", "symmetry", "compatibility"];
        foreach (var c in root.GetProperty("cases").EnumerateArray())
        {
            foreach (var e in c.GetProperty("endMoments").EnumerateArray()) statuses.ShouldContain(e.GetProperty("status").GetString());
            foreach (var f in c.GetProperty("flags").EnumerateArray())
            {
                kinds.ShouldContain(f.GetProperty("kind").GetString());
                new[] { "info", "minor", "major" }.ShouldContain(f.GetProperty("severity").GetString());
                f.GetProperty("where").GetString().ShouldNotBeNullOrEmpty();
                f.GetProperty("message").GetString().ShouldNotBeNullOrEmpty();
                f.GetProperty("source").GetString().ShouldNotBeNullOrEmpty();
                f.TryGetProperty("value", out _).ShouldBeTrue();
            }
            c.GetProperty("causes").ValueKind.ShouldBe(JsonValueKind.Array);
        }
        var eq = dl.GetProperty("flags").EnumerateArray().First(f => f.GetProperty("kind").GetString() == "joint-equilibrium");
        eq.GetProperty("where").GetString().ShouldBe("joint C");
        eq.GetProperty("value").GetDouble().ShouldBe(141.7 - 114.7, 1e-9); // the claims at C: BC 141.7, CD −114.7
        eq.GetProperty("source").GetString().ShouldBe("footbridge.csv:41-42");
    }

    [Fact]
    public void Review_BadInput_AsJson_HasNullVerdictAndTheErrors_AndExitsWithTwo()
    {
        using var t = new TempSubmission();
        string path = t.Write("bad.csv", SampleText.With(frame: SampleText.Frame.Replace("AB,A,B,200,250e6", "AB,A,B,200,-1")));
        var r = CliRunner.Run("review", path, "--format", "json");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Out.ShouldMatchReviewSchema();
        using var doc = JsonDocument.Parse(r.Out);
        doc.RootElement.GetProperty("verdict").ValueKind.ShouldBe(JsonValueKind.Null);
        var e = doc.RootElement.GetProperty("inputErrors")[0];
        e.GetProperty("source").GetString().ShouldBe("bad.csv:14:I [mm^4]");
        e.GetProperty("message").GetString()!.ShouldContain("greater than zero");
        r.Err.ShouldContain("bad.csv:14:I [mm^4]");
    }

    [Fact]
    public void Review_BadInput_WritesNoMemo()
    {
        using var t = new TempSubmission();
        string path = t.Write("bad.csv", "[joints]\njoint,x\nA,1");
        string memo = Path.Combine(t.Folder, "memo.md");
        CliRunner.Run("review", path, "--out", memo).ExitCode.ShouldBe(ExitCodes.InputError);
        File.Exists(memo).ShouldBeFalse();
        Directory.GetFiles(t.Folder).ShouldHaveSingleItem(); // no temporary leftovers either
    }

    [Fact]
    public void Review_Html_IsWritten()
    {
        using var t = new TempSubmission();
        string memo = Path.Combine(t.Folder, "memo.html");
        CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "-f", "html", "-o", memo, "-q").ExitCode.ShouldBe(ExitCodes.Comments);
        File.ReadAllText(memo).ShouldStartWith("<!DOCTYPE html>");
    }

    [Fact]
    public void Review_OwnTemplate_IsUsed_AndABrokenOneIsAnInputError()
    {
        using var t = new TempSubmission();
        string good = t.Write("firm.sbn", "Check of {{ model.Reference }}: {{ model.Verdict }}");
        string bad = t.Write("broken.sbn", "{{ model.NoSuchThing }}");
        string memo = Path.Combine(t.Folder, "memo.md");
        CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--template", good, "-o", memo, "-q").ExitCode.ShouldBe(ExitCodes.Comments);
        File.ReadAllText(memo).ShouldBe("Check of DEMO-FB-01: Revise and resubmit");
        var r = CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--template", bad, "-o", memo, "-q");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("broken.sbn");
    }

    [Fact]
    public void Review_Tolerances_ChangeTheStatus()
    {
        // With a 30 % agreement band the copying slip of the demo (27 of 115 kN·m) becomes agreement.
        var r = CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "-f", "json", "--tolerance", "0.3", "--minor-tolerance", "0.4");
        using var doc = JsonDocument.Parse(r.Out.ShouldMatchReviewSchema());
        doc.RootElement.GetProperty("cases")[0].GetProperty("endMoments").EnumerateArray()
            .ShouldAllBe(e => e.GetProperty("status").GetString() == "agree");
    }

    [Fact]
    public void Review_Mechanism_IsAnInputError()
    {
        using var t = new TempSubmission();
        // The sample beam with A on a roller too: nothing holds it horizontally.
        string path = t.Write("m.csv", SampleText.With(frame: SampleText.Frame.Replace("A,0,0,fixed", "A,0,0,roller", StringComparison.Ordinal),
            loads: "[loads]\non,kind,P,dir\nB,force,3,right"));
        var r = CliRunner.Run("review", path, "-f", "json");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        JsonDocument.Parse(r.Out.ShouldMatchReviewSchema()).RootElement.GetProperty("inputErrors")[0].GetProperty("message").GetString()!.ShouldContain("mechanism");
    }
}
