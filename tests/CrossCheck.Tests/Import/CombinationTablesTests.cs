using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import;

/// <summary>
/// The tables of docs/SUBMISSION-FORMAT.md for combinations, envelopes, span moments and shears: what is read, and every
/// input error the contract lists (exit 2 at file, line, column).
/// </summary>
public class CombinationTablesTests
{
    private const string Model = CombinationBeam.Sagging;

    private const string Good = Model + """
        [combinations]
        combination,case,factor,pattern,factor unloaded
        ULS,G,1.35,,
        ULS,Q,1.5,,
        ENV,G,1.35,,
        ENV,Q,1.5,spans,0

        [end-moments]
        case,member,at,moment
        ULS,AB,B,-147.42

        [span-moments]
        case,member,moment,x [m]
        ULS,AB,82.9,2.25

        [shears]
        case,member,at,V [kN]
        ULS,AB,A,73.7
        ULS,AB,end,-122.8

        [envelopes]
        combination,member,at,max [kN·m],min [kN·m]
        ENV,AB,B,-81.0,-147.42
        ENV,AB,span,99.5,
        """;

    private static ImportResult Read(string text) => TempSubmission.ReadText(text);

    [Fact]
    public void ReadsEveryNewTable()
    {
        var r = Read(Good);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var s = r.Submission!;
        s.Combinations.Select(c => c.Name).ShouldBe(["ULS", "ENV"]);
        s.Combination("ULS")!.IsPatterned.ShouldBeFalse();
        var env = s.Combination("ENV")!;
        env.IsPatterned.ShouldBeTrue();
        env.Terms[1].ShouldSatisfyAllConditions(t => t.Case.ShouldBe("Q"), t => t.Factor.ShouldBe(1.5), t => t.Patterned.ShouldBeTrue(), t => t.FactorUnloaded.ShouldBe(0));
        // Derived case: the factored loads under the combination's name (1.35 × 18 + 1.5 × 12 on each span).
        var derived = s.CasesWithCombinations().Single(c => c.Id == "ULS");
        derived.MemberLoads.Cast<DistributedLoad>().Where(l => l.Member == "AB").Sum(l => l.WStart).ShouldBe((1.35 * 18e3) + (1.5 * 12e3), 1e-6);
        s.CasesWithCombinations().Any(c => c.Id == "ENV").ShouldBeFalse();
        // A sagging end moment at an end is turned clockwise, as ever; span moments stay sagging positive.
        s.Claims.EndMoments.Single().Moment.ShouldBe(147.42e3, 1e-6);
        s.Claims.SpanMoments.Single().ShouldSatisfyAllConditions(m => m.Moment.ShouldBe(82.9e3, 1e-6), m => m.X.ShouldBe(2.25));
        s.Claims.Shears.Select(v => (v.End, v.V)).ShouldBe([(MemberEnd.Start, 73.7e3), (MemberEnd.End, -122.8e3)]);
        var rows = s.Claims.Envelopes;
        rows[0].ShouldSatisfyAllConditions(e => e.End.ShouldBe(MemberEnd.End), e => e.Max.ShouldBe(-81e3), e => e.Min.ShouldBe(-147.42e3), e => e.IsSpan.ShouldBeFalse());
        rows[1].ShouldSatisfyAllConditions(e => e.IsSpan.ShouldBeTrue(), e => e.Max.ShouldBe(99.5e3), e => e.Min.ShouldBeNull());
    }

    public static TheoryData<string, string, string, string> Errors => new()
    {
        // name, the replaced text, its replacement, the expected message fragment
        { "combination named like a case", "ULS,G,1.35,,\nULS,Q,1.5,,", "G,G,1.35,,\nULS,Q,1.5,,", "has the name of a load case" },
        { "case not in loads", "ULS,Q,1.5,,", "ULS,S,1.5,,", "load case 'S' is not in the loads table" },
        { "duplicate (combination, case)", "ULS,Q,1.5,,", "ULS,G,1.5,,", "takes case 'G' twice" },
        { "pattern word", "ENV,Q,1.5,spans,0", "ENV,Q,1.5,alternate,0", "'pattern' = \"alternate\" is not recognised" },
        { "unloaded factor without pattern", "ULS,Q,1.5,,", "ULS,Q,1.5,,0.5", "'factor unloaded' applies only to a patterned case" },
        { "envelope of a derived case", "ENV,AB,span,99.5,", "ULS,AB,span,99.5,", "has no patterned case" },
        { "claim naming a patterned combination", "ULS,AB,82.9,2.25", "ENV,AB,82.9,2.25", "its results go in the 'envelopes' table" },
        { "end moment naming a patterned combination", "ULS,AB,B,-147.42", "ENV,AB,B,-147.42", "its results go in the 'envelopes' table" },
        { "envelope row with no value", "ENV,AB,span,99.5,", "ENV,AB,span,,", "neither 'max' nor 'min'" },
        { "span moment twice", "ULS,AB,82.9,2.25", "ULS,AB,82.9,2.25\nULS,AB,80,2", "claimed twice" },
        { "shear twice", "ULS,AB,end,-122.8", "ULS,AB,end,-122.8\nULS,AB,B,-120", "claimed twice" },
    };

    [Theory]
    [MemberData(nameof(Errors))]
    public void InputErrors_NameTheCell(string name, string find, string replace, string message)
    {
        Good.ShouldContain(find, customMessage: name);
        var r = Read(Good.Replace(find, replace, StringComparison.Ordinal));
        r.Succeeded.ShouldBeFalse(name);
        var problem = r.Errors.FirstOrDefault(p => p.Message.Contains(message, StringComparison.Ordinal));
        problem.ShouldNotBeNull($"{name}: {string.Join("\n", r.Problems)}");
        problem.Where.File.ShouldBe("calc.csv");
        problem.Where.Row.ShouldNotBeNull();
    }

    [Fact]
    public void SpanMomentOnACantilever_IsLeftOutWithAWarning()
    {
        var text = Model.Replace("C,roller", "C,free", StringComparison.Ordinal) + """
            [span-moments]
            case,member,moment
            G,BC,-324
            """;
        var r = Read(text);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Claims.SpanMoments.ShouldBeEmpty();
        r.Warnings.ShouldContain(w => w.Message.Contains("free end", StringComparison.Ordinal));
    }

    [Fact]
    public void OnlySpanMoments_IsEnoughToReview()
    {
        var r = Read(Model + "[span-moments]\ncase,member,moment\nG,AB,45.6\n");
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
    }
}
