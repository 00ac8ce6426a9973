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
/// proposes), the whole review, JSON, memos and drawings. Least wall and CPU time (all threads, the collector's too) over
/// the rounds after one warm-up; the limits are raised so that any size reads.
/// </summary>
public static class ReviewProfile
{
    public static void Run(string path, int rounds = 2)
    {
        var best = new Dictionary<string, double>();
        var cpu = new Dictionary<string, double>();
        var counts = new Dictionary<string, int>();
        var order = new List<string>();
        var limits = InputLimits.Default with { MaxMembers = 1_000_000, MaxJoints = 1_000_000, MaxRows = 10_000_000, MaxFileBytes = 1L << 31 };
        for (int round = 0; round <= rounds; round++)
        {
            var sw = Stopwatch.StartNew();
            var process = Process.GetCurrentProcess();
            var cpu0 = process.TotalProcessorTime;
            void Lap(string stage)
            {
                double ms = sw.Elapsed.TotalMilliseconds;
                process.Refresh();
                double cms = (process.TotalProcessorTime - cpu0).TotalMilliseconds;
                if (round > 0)
                {
                    best[stage] = best.TryGetValue(stage, out double b) ? Math.Min(b, ms) : ms;
                    cpu[stage] = cpu.TryGetValue(stage, out double c) ? Math.Min(c, cms) : cms;
                }
                if (!order.Contains(stage)) order.Add(stage);
                sw.Restart();
                cpu0 = process.TotalProcessorTime;
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
                _ = solver.Factored;
                Lap("diagnosis: factorisation");
                _ = x.Evidence.Adjoint;
                Lap("diagnosis: adjoint");
                var one = x.Case.Loads[0];
                for (int k = 0; k < 10; k++) _ = x.LoadEffect([one]);
                Lap("diagnosis: 10 single-load effects");
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
            OutputStages.Write(whole, Lap);
        }
        foreach (var stage in order)
            Console.WriteLine($"{stage,-40} {best[stage],10:0.0} ms wall {cpu[stage],10:0.0} ms CPU{(counts.TryGetValue(stage, out int n) ? $"  ({n} hypotheses)" : "")}");
    }
}

/// <summary>
/// The diagnosis's work on one submission (<c>-- hypotheses PATH [exhaustive]</c>): hypotheses scored, linear solves and
/// factorisations, and the review's time, for the focused search and (when asked) the exhaustive one, which forms every
/// hypothesis the diagnosis formed before it searched where the evidence is.
/// </summary>
public static class HypothesisCount
{
    public static void Run(string path, bool exhaustive)
    {
        var limits = InputLimits.Default with { MaxMembers = 1_000_000, MaxJoints = 1_000_000, MaxRows = 10_000_000, MaxFileBytes = 1L << 31 };
        var s = SubmissionReader.Read(path, limits).Submission ?? throw new InvalidOperationException("the submission does not read");
        var a = new FrameSolver().Solve(s.Model, s.Cases);
        var searches = exhaustive ? new[] { DiagnosisSearch.Focused, DiagnosisSearch.Exhaustive } : [DiagnosisSearch.Focused];
        foreach (var search in searches)
        {
            var sw = Stopwatch.StartNew();
            var r = ReviewEngine.Review(s, a, ReviewOptions.Default with { Search = search });
            var w = r.DiagnosisWork;
            Console.WriteLine($"{search,-10} {s.Model.Members.Count} members: {w.Tried} hypotheses tried, {w.Solves} solves, {w.Factorisations} factorisations, " +
                              $"review {sw.ElapsedMilliseconds} ms; causes: {string.Join("; ", r.Cases.SelectMany(c => c.Causes.Select(x => $"{c.Case} {x.Code} {x.Identity}")))}");
        }
    }
}
