using System.Diagnostics;
using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Jobs;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.TestTools;

// Test and measurement helpers; see DEVELOPERS.md ("Screening and the review register").
//   generate DIR N [VARIANT]                   write N invented submissions (mixed correct, wrong, broken)
//   time-screen N [VARIANT]                     screening throughput, one at a time and on every core
//   register-pause REGISTER SUBMISSION          record a review and stop inside its transaction (to be killed)
//   register-write REGISTER SUBMISSION N TAG    record N reviews as N rounds of reference TAG
//   register-stats REGISTER                      reviews, references, rounds, duplicates and check problems (for the benchmark)
// REGISTER is a file path or a PostgreSQL URI or connection string.
//   hostile CLI_DLL [VARIANT]                   make a fresh set of hostile inputs, run each through the CLI, print the counts
//   building FILE MEMBERS|STOREYSxBAYS [MISTAKE] [VARIANT]
//                                               write a multi-storey frame with one planted mistake (MISTAKE: none,
//                                               fem (default), slip, moved, wrong, all-wrong; MEMBERS: 300, 1000 or 5000)
var inv = CultureInfo.InvariantCulture;
if (args.Length == 0)
{
    Console.Error.WriteLine("usage: generate DIR N [VARIANT] | time-screen N [VARIANT] | register-pause REGISTER SUBMISSION | register-write REGISTER SUBMISSION N TAG | register-stats REGISTER | hostile CLI_DLL [VARIANT] | building FILE MEMBERS [MISTAKE] [VARIANT]");
    return 2;
}
switch (args[0])
{
    case "generate" when args.Length >= 3:
    {
        int n = int.Parse(args[2], inv);
        var batch = SubmissionFactory.WriteBatch(args[1], BatchPlan.For(n), args.Length > 3 ? int.Parse(args[3], inv) : 1);
        foreach (var b in batch) Console.WriteLine($"{Path.GetFileName(b.Path)}\t{b.Planted}\t{b.Expected}\t{b.Scenario}");
        return 0;
    }
    case "time-screen" when args.Length >= 2:
        return TimeScreen(int.Parse(args[1], inv), args.Length > 2 ? int.Parse(args[2], inv) : 1);
    case "register-pause" when args.Length == 3:
    {
        var review = ReviewOf(args[2]);
        using var register = ReviewRegister.Open(args[1]);
        register.AfterReviewRow = id =>
        {
            Console.WriteLine($"in-transaction {id}");
            Console.Out.Flush();
            Thread.Sleep(Timeout.Infinite);
        };
        register.Record(review, "PAUSED", SubmissionNames.DisplayName(args[2]), "sha256:paused");
        return 1; // not reached: the parent kills this process inside the transaction
    }
    case "register-write" when args.Length == 5:
    {
        var review = ReviewOf(args[2]);
        int n = int.Parse(args[3], inv);
        using var register = ReviewRegister.Open(args[1]);
        var clock = Stopwatch.StartNew();
        for (int i = 0; i < n; i++) register.Record(review, args[4], SubmissionNames.DisplayName(args[2]), $"{args[4]}-{Environment.ProcessId}-{i}");
        Console.WriteLine($"recorded {n} in {clock.Elapsed.TotalSeconds.ToString("0.000", inv)} s ({register.Retries} run again after colliding with another writer)");
        return 0;
    }
    case "register-stats" when args.Length == 2:
        return RegisterStats(args[1]);
    case "hostile" when args.Length >= 2:
        return HostileReport.Run(Path.GetFullPath(args[1]), args.Length > 2 ? int.Parse(args[2], inv) : 1,
            Path.GetFullPath(Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "fixtures", "demo", "shed-frame")));
    case "building" when args.Length >= 3:
    {
        var size = args[2].Split('x');
        var (storeys, bays) = size.Length == 2 ? (int.Parse(size[0], inv), int.Parse(size[1], inv)) : BuildingFrame.ForMembers(int.Parse(args[2], inv));
        var mistake = (args.Length > 3 ? args[3] : "fem") switch
        {
            "none" => BuildingMistake.None,
            "fem" => BuildingMistake.FixedEndMoment,
            "slip" => BuildingMistake.CopyingSlip,
            "moved" => BuildingMistake.LoadMoved,
            "wrong" => BuildingMistake.WrongClaim,
            "all-wrong" => BuildingMistake.EveryClaimWrong,
            var other => throw new ArgumentException($"unknown mistake {other}: none, fem, slip, moved, wrong, all-wrong"),
        };
        string planted = BuildingFrame.Write(args[1], storeys, bays, mistake, args.Length > 4 ? int.Parse(args[4], inv) : 1);
        Console.WriteLine($"{args[1]}: {storeys} storeys x {bays} bays, {storeys * ((2 * bays) + 1)} members; planted: {planted}");
        return 0;
    }
    default:
        Console.Error.WriteLine($"unknown or incomplete command: {string.Join(' ', args)}");
        return 2;
}

// One line the benchmark reads: what the register holds and whether any round was lost or taken twice.
static int RegisterStats(string location)
{
    using var register = ReviewRegister.OpenExisting(RegisterLocation.Parse(location));
    var reviews = register.Reviews();
    var problems = register.Check();
    var byReference = reviews.GroupBy(r => r.Reference, StringComparer.Ordinal).ToList();
    // A round taken twice: two reviews of one round with different input files. A lost round: a gap in 1..n.
    int doubled = reviews.GroupBy(r => (r.Reference, r.Round)).Count(g => g.Select(r => r.InputHash).Distinct(StringComparer.Ordinal).Count() > 1);
    int gaps = byReference.Count(g => !g.Select(r => r.Round).Distinct().Order().SequenceEqual(Enumerable.Range(1, g.Select(r => r.Round).Distinct().Count())));
    var rounds = byReference.Select(g => g.Max(r => r.Round)).ToList();
    Console.WriteLine($"reviews {reviews.Count} references {byReference.Count} rounds-per-reference {(rounds.Count == 0 ? 0 : rounds.Min())}..{(rounds.Count == 0 ? 0 : rounds.Max())} " +
                      $"doubled-rounds {doubled} references-with-gaps {gaps} check-problems {problems.Count}");
    foreach (var p in problems.Take(5)) Console.WriteLine("  " + p);
    return problems.Count == 0 && doubled == 0 && gaps == 0 ? 0 : 1;
}

static ReviewResult ReviewOf(string path)
{
    var outcome = new ReviewJob().Review(path, new ReviewOptions(Reviewer: "Probe", Date: new DateOnly(2026, 12, 1)));
    return outcome.Review ?? throw new InvalidOperationException("the probe's submission does not review: " + string.Join("; ", outcome.Errors));
}

// Screens N generated submissions with one worker and with one per processor, five times each, and prints medians and best runs.
static int TimeScreen(int n, int variant)
{
    var inv = CultureInfo.InvariantCulture;
    string root = Directory.CreateTempSubdirectory("crosscheck-timing-").FullName;
    try
    {
        string subs = Path.Combine(root, "subs");
        var batch = SubmissionFactory.WriteBatch(subs, BatchPlan.For(n), variant);
        Console.WriteLine($"{batch.Count} submissions ({string.Join(", ", batch.GroupBy(b => b.Expected).Select(g => $"{g.Count()} {g.Key}"))}), " +
                          $"{batch.Count(b => b.Path.EndsWith(".csv", StringComparison.Ordinal))} single CSV files, {Environment.ProcessorCount} processors");
        var options = new ReviewOptions(Reviewer: "Timing", Date: new DateOnly(2026, 12, 1));

        // Warm-up: the first screen of a process pays for JIT compilation.
        var warm = Stopwatch.StartNew();
        Screener.Run(subs, new ScreenOptions(options, Path.Combine(root, "warm"), RegisterPath: Path.Combine(root, "warm.db")));
        Console.WriteLine($"first screen in this process (includes JIT): {warm.Elapsed.TotalSeconds.ToString("0.00", inv)} s");

        // One worker and one per processor, alternated so that both see the same background load; five runs each.
        int all = Environment.ProcessorCount;
        var times = new Dictionary<int, List<double>> { [1] = [], [all] = [] };
        for (int k = 0; k < 5; k++)
            foreach (int jobs in k % 2 == 0 ? new[] { 1, all } : new[] { all, 1 })
            {
                string tag = $"j{jobs}-{k}";
                var sw = Stopwatch.StartNew();
                var report = Screener.Run(subs, new ScreenOptions(options, Path.Combine(root, tag), Parallelism: jobs, RegisterPath: Path.Combine(root, tag + ".db")));
                times[jobs].Add(sw.Elapsed.TotalSeconds);
                var st = report.Stages;
                Console.WriteLine($"  jobs {jobs}: {sw.Elapsed.TotalSeconds.ToString("0.000", inv)} s = review {st.Review.TotalSeconds.ToString("0.000", inv)} + register " +
                                  $"{st.Register.TotalSeconds.ToString("0.000", inv)} + memos {st.Memos.TotalSeconds.ToString("0.000", inv)} + summary {st.Summary.TotalSeconds.ToString("0.000", inv)}");
                if (report.Rows.Count != batch.Count) throw new InvalidOperationException("rows missing");
            }
        foreach (var (jobs, list) in times)
        {
            double median = list.Order().ElementAt(list.Count / 2), best = list.Min();
            Console.WriteLine($"jobs {jobs}: median {median.ToString("0.000", inv)} s, best {best.ToString("0.000", inv)} s " +
                              $"(runs {string.Join(", ", list.Select(t => t.ToString("0.000", inv)))}) -> {(batch.Count / median).ToString("0.0", inv)} submissions/s median, " +
                              $"{(batch.Count / best).ToString("0.0", inv)} best");
        }
        if (all > 1)
            Console.WriteLine($"speed-up with {all} workers: {(times[1].Order().ElementAt(2) / times[all].Order().ElementAt(2)).ToString("0.00", inv)}x (medians), " +
                              $"{(times[1].Min() / times[all].Min()).ToString("0.00", inv)}x (best runs)");
        return 0;
    }
    finally
    {
        Directory.Delete(root, recursive: true);
    }
}
