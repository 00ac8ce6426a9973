using System.Globalization;
using CrossCheck.Jobs;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using static CrossCheck.Tests.Support.HandMethods;

namespace CrossCheck.Tests.Review.Diagnosis;

/// <summary>
/// The audit of an author's moment-distribution table, on beam 4a of docs/REFERENCE-CHECKS.md distributed by hand
/// (<see cref="HandTable"/>, common practice) and written to two decimals: a clean table passes, and one wrong cell
/// at each kind of row is found as the first wrong cell with its knock-on on the final moments.
/// </summary>
public class WorkingTableAuditTests
{
    private static readonly double[] EI = [40000, 80000, 30000];
    private static readonly double[] L = [5, 7.5, 4];
    private static readonly (double, double)[] Fem = [Udl(20, 5), Sum(Udl(12, 7.5), Point(60, 3, 7.5)), Point(45, 1.5, 4)];

    internal const string Beam = """
        [info]
        key,value
        force unit,kN
        length unit,m

        [supports]
        support,restraint
        J0,pinned
        J1,roller
        J2,roller
        J3,roller

        [spans]
        span,length,E [GPa],I [mm^4]
        S1,5,200,200e6
        S2,7.5,200,400e6
        S3,4,200,150e6

        [loads]
        on,kind,w,P,a
        S1,udl,20,,
        S2,udl,12,,
        S2,point,,60,3
        S3,point,,45,1.5

        """;

    private static string Csv(List<(string Label, double[] Values)> rows, string header = "S1@J0,S1@J1,S2@J1,S2@J2,S3@J2,S3@J3")
    {
        var final = rows.Last().Values;
        var sb = new System.Text.StringBuilder(Beam);
        sb.Append("[end-moments]\nmember,at,moment\n");
        string[] ids = ["S1", "S2", "S3"];
        for (int i = 0; i < 3; i++)
            sb.Append(CultureInfo.InvariantCulture, $"{ids[i]},start,{final[2 * i]:0.00}\n{ids[i]},end,{final[(2 * i) + 1]:0.00}\n");
        sb.Append("\n[distribution]\nstep,").Append(header).Append('\n');
        foreach (var (label, values) in rows)
            sb.Append(label).Append(',').Append(string.Join(",", values.Select(v => v.ToString(label == "DF" ? "0.000" : "0.00", CultureInfo.InvariantCulture)))).Append('\n');
        return sb.ToString();
    }

    private static List<(string Label, double[] Values)> Table() => HandTable.Build(EI, L, [false, false, false, false], Fem, 4);

    [Fact]
    public void CleanHandTable_IsConsistent()
    {
        var r = Reviewing.Of(Csv(Table()));
        var audit = r.Cases[0].Audit.ShouldNotBeNull();
        audit.CellsWrong.ShouldBe(0);
        audit.CellsChecked.ShouldBeGreaterThan(40);
        audit.Variant.ShouldStartWith("plain");
        r.AllFlags.ShouldContain(f => f.Kind == FlagKind.DistributionTable && f.Severity == Severity.Info);
    }

    [Theory]
    [InlineData("DF", 2, 0.6)]
    [InlineData("FEM", 3, -60.0)]
    [InlineData("balance 2", 1, 5.0)]
    [InlineData("carry-over 1", 2, -7.7)]
    [InlineData("final", 4, -50.0)]
    public void OneWrongCell_IsTheFirstWrongCell(string row, int column, double value)
    {
        var clean = Table();
        double correct = clean.First(x => x.Label == row).Values[column];
        // The author writes the slip and carries on from it, as if it were right.
        var rows = HandTable.Build(EI, L, [false, false, false, false], Fem, 4, (row, column, value));
        var review = Reviewing.Of(Csv(rows));
        var audit = review.Cases[0].Audit.ShouldNotBeNull();
        var first = audit.First.ShouldNotBeNull();
        first.Row.ShouldBe(row);
        first.Column.ShouldBe(new[] { "S1@J0", "S1@J1", "S2@J1", "S2@J2", "S3@J2", "S3@J3" }[column]);
        double scale = row == "DF" ? 1 : 1000; // moments in N·m inside
        first.Found.ShouldBe(value * scale, 1e-6 * scale);
        first.Expected.ShouldBe(correct * scale, 0.02 * scale);
        // The slip carries through to the final row (for the final row itself, the knock-on is the slip).
        Math.Abs(audit.KnockOn).ShouldBeGreaterThan(0.05 * 1000);
        var flag = review.AllFlags.First(f => f.Kind == FlagKind.DistributionTable);
        flag.Message.ShouldContain($"row '{row}'");
        flag.Sources.ShouldHaveSingleItem().Column.ShouldBe(first.Column);
    }

    [Fact]
    public void DoubleSubscriptHeaders_AreResolvedToMemberEnds()
    {
        var r = Reviewing.Of(Csv(Table(), "M_J0J1,M(J1J0),MJ1J2,M J2J1,M_J2J3,M_J3J2"));
        r.Cases[0].Audit.ShouldNotBeNull().CellsWrong.ShouldBe(0);
    }

    [Fact]
    public void UnknownColumn_IsAnInputErrorAtTheHeader()
    {
        var text = Csv(Table(), "S1@J0,S1@J1,S2@J1,S2@J2,S3@J2,S9@J3");
        var result = TempSubmission.ReadText(text);
        result.Succeeded.ShouldBeFalse();
        result.Errors.ShouldContain(e => e.Where.Column == "S9@J3" && e.Where.Table == "distribution");
    }
}

/// <summary>The school-hall demo: a student's table with a carry-over written with the wrong sign, as CSV and as a PDF.</summary>
public class WorkingTableDemoTests
{
    [Theory]
    [InlineData("school-hall.csv", "carry-over 2", "school-hall.csv line 49")]
    [InlineData("school-hall.pdf", "C.O. 2", "school-hall.pdf p.2 line 11")]
    public void StudentTable_FirstWrongCellAndCause(string demo, string row, string citation)
    {
        var outcome = new ReviewJob().Review(CliRunner.Demo(demo), new ReviewOptions(Date: new DateOnly(2026, 12, 1)));
        var review = outcome.Review.ShouldNotBeNull(string.Join("\n", outcome.Errors));
        var c = review.Cases.ShouldHaveSingleItem();
        var first = c.Audit.ShouldNotBeNull().First.ShouldNotBeNull();
        first.Row.ShouldBe(row);
        first.Column.ShouldBe("BC@C");
        first.Source.Citation.ShouldBe(citation);
        // Carry-over = ½ × the balance at B of member BC in the row before (4.45 kN·m): +2.23, written −2.23 (common practice).
        first.Found.ShouldBe(-2230, 1e-6);
        first.Expected.ShouldBe(0.5 * 4450, 1e-6);
        c.Causes[0].Code.ShouldBe("distribution-arithmetic");
    }
}

/// <summary>
/// A beam with an overhang distributed the way engineers do it by hand: the cantilever takes no distributed moment
/// (distribution factor 0) and its root moment is statical, w·a²/2 = 18 × 2² / 2 = 36 kN·m (common practice). Spans
/// AB = BC = 6 m (A fixed or pinned), overhang CD = 2 m, w = 18 kN/m everywhere, EI equal; plain stiffness 4EI/L, or
/// modified 3EI/L at the pinned end. A correct table concurs.
/// </summary>
public class OverhangTableTests
{
    private static string Csv(string restraintA, bool modified)
    {
        // Columns: AB@A, AB@B, BC@B, BC@C, CD@C, CD@D. Fixed-end moments wL²/12 = 54 (Hicks, Fig. 2.2 case 5).
        double[] fem = [-54, 54, -54, 54, -36, 0];
        bool pinned = restraintA == "pinned";
        double kAB = modified && pinned ? 3 : 4, kBC = 4;
        double[] df = [pinned ? 1 : 0, kAB / (kAB + kBC), kBC / (kAB + kBC), 1, 0, 0];
        if (modified && pinned) { fem[1] += 54 / 2.0; fem[0] = 0; df[0] = 0; } // A released once: half carried to B
        int[] other = [1, 0, 3, 2, 5, 4];
        double[] cof = [modified && pinned ? 0 : 0.5, modified && pinned ? 0 : 0.5, 0.5, 0.5, 0, 0];
        int[] joint = [0, 1, 1, 2, 2, 3];
        var rows = new List<(string, double[])> { ("DF", df), ("FEM", (double[])fem.Clone()) };
        var state = (double[])fem.Clone();
        for (int cycle = 1; cycle <= 14; cycle++)
        {
            var bal = new double[6];
            for (int i = 0; i < 6; i++)
            {
                double unbalance = Enumerable.Range(0, 6).Where(k => joint[k] == joint[i]).Sum(k => state[k]);
                bal[i] = -df[i] * unbalance;
            }
            for (int i = 0; i < 6; i++) state[i] += bal[i];
            rows.Add(($"balance {cycle}", bal));
            if (cycle == 14) break;
            var co = new double[6];
            for (int i = 0; i < 6; i++) co[other[i]] += cof[i] * bal[i];
            for (int i = 0; i < 6; i++) state[i] += co[i];
            rows.Add(($"carry-over {cycle}", co));
        }
        rows.Add(("final", state));
        var sb = new System.Text.StringBuilder($"""
            [info]
            key,value
            force unit,kN
            length unit,m
            sign convention,clockwise

            [joints]
            joint,x,y,restraint
            A,0,0,{restraintA}
            B,6,0,roller
            C,12,0,roller
            D,14,0,free

            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,250e6
            BC,B,C,200,250e6
            CD,C,D,200,250e6

            [loads]
            on,kind,w
            AB,udl,18
            BC,udl,18
            CD,udl,18

            [end-moments]
            member,at,moment

            """);
        string[] cols = ["AB,A", "AB,B", "BC,B", "BC,C", "CD,C", "CD,D"];
        for (int i = 0; i < 6; i++) sb.Append(cols[i]).Append(',').Append(state[i].ToString("0.00", System.Globalization.CultureInfo.InvariantCulture)).Append('\n');
        sb.Append("\n[distribution]\nstep,AB@A,AB@B,BC@B,BC@C,CD@C,CD@D\n");
        foreach (var (label, values) in rows)
            sb.Append(label).Append(',').Append(string.Join(",", values.Select(v => v.ToString(label == "DF" ? "0.000" : "0.00", System.Globalization.CultureInfo.InvariantCulture)))).Append('\n');
        return sb.ToString();
    }

    [Theory]
    [InlineData("fixed", false)]
    [InlineData("pinned", false)]
    [InlineData("pinned", true)]
    public void CorrectOverhangTable_Concurs(string restraintA, bool modified)
    {
        var review = Reviewing.Of(Csv(restraintA, modified));
        var audit = review.Cases[0].Audit.ShouldNotBeNull();
        audit.First.ShouldBeNull($"first wrong cell: {audit.First}");
        review.Verdict.ShouldBe(Verdict.Concur, string.Join("\n", review.Comments.Select(c => $"{c.Id}: {c.Text}")));
    }

    [Theory]
    [InlineData("pinned", false)]
    [InlineData("pinned", true)]
    public void ReferenceWorking_FollowsTheAuthorsMethod_AndGivesTheOverhangNoDistributedMoment(string restraintA, bool modified)
    {
        var review = Reviewing.Of(Csv(restraintA, modified));
        var working = ReferenceWorking.Compute(review.Submission, review).Cases.ShouldHaveSingleItem();
        working.Method.ShouldBe((modified ? "modified stiffness 3EI/L at pinned far ends" : "plain stiffness 4EI/L") + ", as in the author's table");
        var table = working.Result.ShouldNotBeNull().NoSway;
        var df = table.Rows.First(r => r.Step == CrossCheck.Analysis.DistributionStep.DistributionFactor);
        int cdAtC = table.Columns.ToList().IndexOf(("CD", CrossCheck.Model.MemberEnd.Start));
        (df.Values[cdAtC] ?? 0).ShouldBe(0, "the overhang takes no distributed moment");
        // Root of the overhang: w·a²/2 = 36 kN·m hogging, −36 kN·m clockwise on CD at C (statics, common practice).
        working.Final[cdAtC].ShouldBe(-36000, 1);
        working.Result.Sway.ShouldBeEmpty("an overhang's tip needs no sway case");
    }
}
