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
    public static void Run(string path)
    {
        for (int round = 0; round < 4; round++)
        {
            var sw = Stopwatch.StartNew();
            var imported = CrossCheck.Import.SubmissionReader.Read(path);
            long read = sw.ElapsedMilliseconds; sw.Restart();
            var s = imported.Submission!;
            var a = new FrameSolver().Solve(s.Model, s.Cases);
            long solve = sw.ElapsedMilliseconds; sw.Restart();
            var r = CrossCheck.Review.ReviewEngine.Review(s, a);
            long review = sw.ElapsedMilliseconds; sw.Restart();
            var json = CrossCheck.Memo.ReviewJson.Write(r);
            long render = sw.ElapsedMilliseconds;
            Console.WriteLine($"round {round}: read {read} ms, solve {solve} ms, review {review} ms, json {render} ms ({json.Length} chars)");
        }
    }
}
