using System.Diagnostics;
using CrossCheck.Analysis;

namespace CrossCheck.Benchmarks;

/// <summary>Solve time and allocated memory against frame size, to show near-linear growth (one run, ratios matter).</summary>
public static class Scaling
{
    public static void Run()
    {
        Console.WriteLine("joint DOF | storeys x bays | solve [ms] | allocated [MB] | ms per 1000 DOF");
        foreach (int dof in new[] { 3_000, 10_000, 30_000, 100_000 })
        {
            var (storeys, bays) = FrameGenerator.ForDof(dof, 20);
            var (model, cases) = FrameGenerator.Regular(storeys, bays);
            new FrameSolver().Solve(model, cases); // warm-up
            GC.Collect();
            long before = GC.GetTotalAllocatedBytes(true);
            var sw = Stopwatch.StartNew();
            new FrameSolver().Solve(model, cases);
            sw.Stop();
            long bytes = GC.GetTotalAllocatedBytes(true) - before;
            int actual = 3 * model.Joints.Count;
            Console.WriteLine($"{actual,9} | {storeys} x {bays} | {sw.Elapsed.TotalMilliseconds,10:0} | {bytes / 1e6,14:0} | {sw.Elapsed.TotalMilliseconds / (actual / 1000.0),6:0.00}");
        }
    }
}

/// <summary>Review time of one submission in a warm process, stage by stage (to separate start-up from work).</summary>
public static class WarmReview
{
    /// <summary>
    /// Stage times of one review repeated in a warm process (least of the rounds after 3 warm-ups; default 20): where a
    /// batch spends its time. Many rounds make a steady load for a profiler.
    /// </summary>
    public static void Run(string path, int rounds = 20)
    {
        var best = new Dictionary<string, double>();
        for (int round = 0; round < rounds + 3; round++)
        {
            var times = new List<(string Stage, double Ms)>();
            var sw = Stopwatch.StartNew();
            void Lap(string stage) { times.Add((stage, sw.Elapsed.TotalMilliseconds)); sw.Restart(); }
            var imported = CrossCheck.Import.SubmissionReader.Read(path);
            Lap("read");
            var s = imported.Submission ?? throw new InvalidOperationException("the submission does not read");
            var a = new FrameSolver().Solve(s.Model, s.Cases);
            Lap("solve");
            var r = CrossCheck.Review.ReviewEngine.Review(s, a);
            Lap("review + diagnosis");
            OutputStages.Write(r, Lap);
            if (round < 3) continue;
            foreach (var (stage, ms) in times)
                best[stage] = best.TryGetValue(stage, out double b) ? Math.Min(b, ms) : ms;
        }
        foreach (var (stage, ms) in best) Console.WriteLine($"{stage,-30} {ms,8:0.00} ms");
    }
}

/// <summary>
/// A screening run's stages (<c>-- screen-stages FOLDER [ROUNDS]</c>): review, register, memos, summary, for each
/// round (the first pays for compilation). Shows which stage leaves a core idle.
/// </summary>
public static class ScreenStagesRun
{
    public static void Run(string folder, int rounds = 3)
    {
        for (int round = 0; round < rounds; round++)
        {
            string work = Directory.CreateTempSubdirectory("crosscheck-screen-stages-").FullName;
            try
            {
                var options = new CrossCheck.Screening.ScreenOptions(new CrossCheck.Review.ReviewOptions(Date: new DateOnly(2026, 12, 1)),
                    Path.Combine(work, "out"), RegisterPath: Path.Combine(work, "register.db"));
                var r = CrossCheck.Screening.Screener.Run(folder, options);
                var s = r.Stages;
                Console.WriteLine($"round {round}: {r.Rows.Count} submissions in {r.Elapsed.TotalMilliseconds:0} ms — review {s.Review.TotalMilliseconds:0}, " +
                    $"register {s.Register.TotalMilliseconds:0}, memos {s.Memos.TotalMilliseconds:0}, summary {s.Summary.TotalMilliseconds:0} ms");
            }
            finally
            {
                Directory.Delete(work, recursive: true);
            }
        }
    }
}
