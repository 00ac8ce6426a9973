using System.Diagnostics;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Review;
using CrossCheck.Review.Checks;
using CrossCheck.Review.Diagnosis;

namespace CrossCheck.Benchmarks;

/// <summary>
/// Where a review of one (large) submission spends its time, part by part (<c>-- review-profile PATH [ROUNDS]</c>):
/// read, solve, the comparison, each check of the claims, each hypothesis family of the diagnosis (with the hypotheses it
/// proposes), the whole review, JSON, memos and drawings. Least time over the rounds after one warm-up; the limits are
/// raised so that any size reads.
/// </summary>
public static class ReviewProfile
{
    public static void Run(string path, int rounds = 2)
    {
        var best = new Dictionary<string, double>();
        var counts = new Dictionary<string, int>();
        var order = new List<string>();
        var limits = InputLimits.Default with { MaxMembers = 1_000_000, MaxJoints = 1_000_000, MaxRows = 10_000_000, MaxFileBytes = 1L << 31 };
        for (int round = 0; round <= rounds; round++)
        {
            var sw = Stopwatch.StartNew();
            void Lap(string stage)
            {
                double ms = sw.Elapsed.TotalMilliseconds;
                if (round > 0) best[stage] = best.TryGetValue(stage, out double b) ? Math.Min(b, ms) : ms;
                if (!order.Contains(stage)) order.Add(stage);
                sw.Restart();
            }
            var s = SubmissionReader.Read(path, limits).Submission ?? throw new InvalidOperationException("the submission does not read");
            Lap("read");
            var a = new FrameSolver().Solve(s.Model, s.Cases);
            Lap("solve");
            var options = ReviewOptions.Default;
            var checks = new ClaimChecks(s, options);
            var solver = new DiagnosisSolver(s.Model);
            Lap("checks: set-up");
            foreach (var result in a.Cases)
            {
                var compared = Comparison.Compare(s, result, result.Case, options);
                Lap("comparison");
                var flags = new List<Flag>();
                foreach (var check in ClaimChecks.All)
                {
                    checks.RunOne(result.Case, check, flags);
                    Lap("check " + check.GetType().Name);
                }
                var review = compared with { Flags = [.. compared.Flags, .. flags] };
                var ends = review.EndMoments.Where(e => e.Claimed is not null && e.Recomputed is not null && e.End is not null).ToList();
                if (!review.EndMoments.Any(e => e.Status is EndStatus.Discrepant or EndStatus.Minor)) continue;
                var x = new DiagnosisContext(s, a, options, s.Case(result.Case)!, review, ends, solver);
                foreach (var family in Diagnoser.Families)
                {
                    int n;
                    try { n = family.Propose(x).Count(); }
                    catch (Exception ex) when (ex is StructureException or NotSupportedException or ArgumentException or InvalidOperationException) { n = -1; }
                    string stage = "family " + family.GetType().Name;
                    Lap(stage);
                    if (round == 1) counts[stage] = counts.GetValueOrDefault(stage) + n;
                }
            }
            var whole = ReviewEngine.Review(s, a);
            Lap("whole review");
            CrossCheck.Memo.ReviewJson.Write(whole);
            Lap("json");
            CrossCheck.Memo.MemoRenderer.Render(new CrossCheck.Memo.MemoModel(whole, null), CrossCheck.Memo.MemoFormat.Markdown);
            Lap("markdown memo");
            var diagrams = CrossCheck.Memo.Diagrams.MemoDiagrams.For(whole);
            Lap("diagrams");
            CrossCheck.Memo.MemoRenderer.Render(new CrossCheck.Memo.MemoModel(whole, diagrams), CrossCheck.Memo.MemoFormat.Html);
            Lap("html memo");
        }
        foreach (var stage in order)
            Console.WriteLine($"{stage,-40} {best[stage],10:0.0} ms{(counts.TryGetValue(stage, out int n) ? $"  ({n} hypotheses)" : "")}");
    }
}
