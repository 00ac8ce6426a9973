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

    private const string Beam = """
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
