using System.Globalization;
using System.Text;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;
using static CrossCheck.Tests.Support.HandMethods;

namespace CrossCheck.Tests.Review.Diagnosis;

/// <summary>
/// How often the diagnosis is right, and how often it names a cause that is not there: per cause, on the planted
/// submissions of <see cref="DiagnosisTests"/> (ranked first / found), on correct claims of every reference case and on
/// random single slips — one claim of a correct submission changed by an arbitrary amount that is no recognisable
/// mistake (false causes). The table is printed (run with <c>--logger "console;verbosity=detailed"</c>).
/// </summary>
public class DiagnosisQualityTests(ITestOutputHelper output)
{
    private const MemberEnd S = MemberEnd.Start, En = MemberEnd.End;

    private static (string Member, MemberEnd End, double M)[] Exact(FrameBuilder b)
    {
        var r = b.Solve().Cases[0];
        return b.Model.Members.SelectMany(m => new[] { (m.Id, S, r.EndMoment(m.Id, S)), (m.Id, En, r.EndMoment(m.Id, En)) }).ToArray();
    }

    [Fact]
    public void PerCause_RankedFirstAndFound_AndNoFalseCauses()
    {
        var rows = new SortedDictionary<string, (int Planted, int First, int Found)>(StringComparer.Ordinal);
        var notOneComment = new List<string>();
        foreach (var planted in ((IEnumerable<object[]>)DiagnosisTests.All).Select(d => (DiagnosisTests.PlantedMistake)d[0]))
        {
            var review = DiagnosisTests.Review(planted.Model(), planted.Claims());
            var causes = review.Cases[0].Causes;
            // One mistake, one major comment, with every finding it explains beneath it.
            var majors = review.Comments.Where(c => c.Severity == Severity.Major).ToList();
            if (majors.Count != 1 || majors[0].Cause is null)
                notOneComment.Add($"{planted}: {string.Join("; ", review.Comments.Select(c => $"{c.Id} {c.Severity}"))}");
            var (n, first, found) = rows.GetValueOrDefault(planted.Code);
            rows[planted.Code] = (n + 1, first + (causes.FirstOrDefault()?.Code == planted.Code ? 1 : 0), found + (causes.Any(c => c.Code == planted.Code) ? 1 : 0));
        }

        // Correct claims: no cause at all.
        var references = ReferenceModels.All().Where(c => c.Model.Model.Members.Count >= 2).ToList();
        int correctFalse = 0;
        foreach (var (_, b) in references)
            correctFalse += DiagnosisTests.Review(b, Exact(b)).Cases[0].Causes.Count;

        // Random single slips: one end off by 5–60 % of the case's peak, rounded to 0.1 kN·m as a hand calculation writes
        // it, and no miscopy of the right value (no digits exchanged, sign lost or decimal point moved).
        int slips = 0, slipFalse = 0;
        var falseCodes = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var rnd = new Random(20261205);
        foreach (var (id, b) in references)
        {
            var exact = Exact(b);
            double peak = exact.Max(e => Math.Abs(e.M));
            for (int k = 0; k < exact.Length; k++)
            {
                double delta = peak * (0.05 + (0.55 * rnd.NextDouble())) * (rnd.Next(2) == 0 ? -1 : 1);
                double written = Math.Round(exact[k].M + delta, 1);
                if (IsMiscopy(written, exact[k].M)) continue;
                var claims = exact.Select((e, i) => i == k ? (e.Member, e.End, written) : (e.Member, e.End, Math.Round(e.M, 2))).ToArray();
                var causes = DiagnosisTests.Review(b, claims).Cases[0].Causes;
                slips++;
                if (causes.Count == 0) continue;
                slipFalse++;
                foreach (var c in causes) falseCodes[c.Code] = falseCodes.GetValueOrDefault(c.Code) + 1;
                output.WriteLine($"false cause on {id}, {exact[k].Member} {exact[k].End} written {written} for {exact[k].M:0.###}: {string.Join(", ", causes.Select(c => c.Code))}");
            }
        }

        var table = new StringBuilder("cause                     planted  ranked first  found\n");
        foreach (var (code, (n, first, found)) in rows)
            table.Append(CultureInfo.InvariantCulture, $"{code,-26} {n,6}  {first,12}  {found,5}\n");
        table.Append(CultureInfo.InvariantCulture, $"correct submissions: {references.Count}, false causes: {correctFalse}\n");
        table.Append(CultureInfo.InvariantCulture, $"random single slips: {slips}, with a false cause: {slipFalse} ({string.Join(", ", falseCodes.Select(kv => $"{kv.Key} {kv.Value}"))})\n");
        output.WriteLine(table.ToString());

        output.WriteLine($"planted mistakes not given exactly one major comment naming the mistake: {notOneComment.Count}");
        foreach (var n in notOneComment) output.WriteLine("  " + n);
        rows.Values.ShouldAllBe(r => r.First == r.Planted, table.ToString());
        notOneComment.ShouldBeEmpty();
        correctFalse.ShouldBe(0, table.ToString());
        slips.ShouldBeGreaterThan(100);
        slipFalse.ShouldBe(0, table.ToString());
    }

    /// <summary>True when <paramref name="written"/> is <paramref name="right"/> miscopied at one decimal (digits exchanged, sign lost, point moved).</summary>
    private static bool IsMiscopy(double written, double right)
    {
        string w = Math.Abs(written).ToString("0.0", CultureInfo.InvariantCulture).Replace(".", "", StringComparison.Ordinal);
        string r = Math.Abs(right).ToString("0.0", CultureInfo.InvariantCulture).Replace(".", "", StringComparison.Ordinal);
        if (w == r) return true; // sign lost, or no slip at all
        if (w.Length == r.Length)
            for (int i = 0; i + 1 < w.Length; i++)
                if (w[i] == r[i + 1] && w[i + 1] == r[i] && w.Remove(i, 2) == r.Remove(i, 2)) return true;
        foreach (double shift in new[] { 10.0, 100.0, 0.1, 0.01 })
            if (Math.Abs(written - (right * shift)) <= 0.05 + (1e-9 * Math.Abs(written))) return true;
        return false;
    }

    /// <summary>
    /// An author who takes the distribution factors from I instead of I/L and writes a consistent table: the table audit
    /// finds the factor row wrong (an "arithmetic slip" would reproduce any table by construction), but the systematic
    /// mistake is the one the designer must hear, so it ranks first. Beam 4a of REFERENCE-CHECKS.md (spans 5 / 7.5 / 4 m)
    /// distributed by hand (<see cref="HandTable"/>, common practice) with every length taken as 1.
    /// </summary>
    [Fact]
    public void FactorsFromIInsteadOfIOverL_WithATable_RankTheSystematicMistakeFirst()
    {
        double[] ei = [40000, 80000, 30000];
        (double, double)[] fem = [Udl(20, 5), Sum(Udl(12, 7.5), Point(60, 3, 7.5)), Point(45, 1.5, 4)];
        var rows = HandTable.Build(ei, [1, 1, 1], [false, false, false, false], fem, 8);
        var final = rows.Last().Values;
        // Beam 4a as the table-audit tests write it, then the author's claims and table.
        var csv = new StringBuilder(WorkingTableAuditTests.Beam).Append("[end-moments]\nmember,at,moment\n");
        string[] ids = ["S1", "S2", "S3"];
        for (int i = 0; i < 3; i++)
            csv.Append(CultureInfo.InvariantCulture, $"{ids[i]},start,{final[2 * i]:0.00}\n{ids[i]},end,{final[(2 * i) + 1]:0.00}\n");
        csv.Append("\n[distribution]\nstep,S1@J0,S1@J1,S2@J1,S2@J2,S3@J2,S3@J3\n");
        foreach (var (label, values) in rows)
            csv.Append(label).Append(',').Append(string.Join(",", values.Select(v => v.ToString(label == "DF" ? "0.000" : "0.00", CultureInfo.InvariantCulture)))).Append('\n');
        var review = Reviewing.Of(csv.ToString());
        var causes = review.Cases[0].Causes;
        output.WriteLine(string.Join("\n", causes.Select(c => $"{c.Code} {c.Confidence} {c.Explains}")));
        causes.ShouldNotBeEmpty();
        causes[0].Kind.ShouldBe(CauseCode.StiffnessWithoutLength);
        review.Comments.Count(c => c.Severity == Severity.Major).ShouldBe(1, string.Join("\n", review.Comments.Select(c => $"{c.Id}: {c.Text}")));
    }
}
