using System.Diagnostics;
using System.Text;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Register;
using CrossCheck.Review;

namespace CrossCheck.Screening;

/// <summary>Hears how a screen progresses. Calls are serialised by the screener (never two at once).</summary>
public interface IScreenProgress
{
    /// <summary>The folder holds <paramref name="submissions"/> submissions.</summary>
    void Begin(int submissions);

    /// <summary>One submission has been read, analysed and reviewed (or failed); <paramref name="done"/> so far.</summary>
    void Reviewed(ScreenItem item, ScreenOutcome outcome, int done);

    /// <summary>One submission's memo has been written (or its input errors listed); <paramref name="done"/> so far.</summary>
    void Written(ScreenRow row, int done);
}

/// <summary>
/// Screens a folder of submissions: reviews them in parallel, records each review in the register (in name order,
/// one transaction each), writes a memo per submission and then <c>summary.csv</c> and <c>index.html</c>. A
/// submission that cannot be read becomes a row with its error; nothing stops the batch.
/// </summary>
public static class Screener
{
    public const string SummaryFile = "summary.csv";
    public const string IndexFile = "index.html";

    /// <exception cref="DirectoryNotFoundException">The folder does not exist.</exception>
    /// <exception cref="RegisterException">The register cannot be opened.</exception>
    /// <exception cref="IOException">The output folder cannot be created or the summary cannot be written.</exception>
    /// <exception cref="ArgumentException">The output folder is the folder screened.</exception>
    public static ScreenReport Run(string folder, ScreenOptions options, IScreenProgress? progress = null, CancellationToken cancel = default)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(options);
        var clock = Stopwatch.StartNew();
        string outDir = Path.TrimEndingDirectorySeparator(Path.GetFullPath(options.OutputFolder));
        if (string.Equals(outDir, Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder)), StringComparison.Ordinal))
            throw new ArgumentException("the output folder must not be the folder screened (its summary.csv would be taken for a submission next time).", nameof(options));
        var exclude = new List<string> { outDir };
        if (options.RegisterPath is not null) exclude.Add(options.RegisterPath);
        var found = SubmissionFinder.Find(folder, exclude);
        Directory.CreateDirectory(outDir);
        using var register = options.RegisterPath is null ? null : ReviewRegister.Open(options.RegisterPath);
        int parallelism = options.Parallelism > 0 ? options.Parallelism : Environment.ProcessorCount;
        var items = found.Items;
        var gate = new Lock();
        int reviewed = 0, written = 0;
        lock (gate) progress?.Begin(items.Count);

        var stage = Stopwatch.StartNew();
        var timings = new List<TimeSpan>();

        // 1. Review every submission, in parallel.
        var reviews = new Reviewed[items.Count];
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = parallelism, CancellationToken = cancel };
        Parallel.For(0, items.Count, parallel, i =>
        {
            reviews[i] = ReviewOne(items[i], options.Review, options.Limits);
            lock (gate) progress?.Reviewed(items[i], reviews[i].Outcome, ++reviewed);
        });

        timings.Add(stage.Elapsed);
        stage.Restart();

        // 2. The key each one's rounds are tracked by; a reference several submissions share is qualified by their names.
        var notes = new List<string>(found.Skipped);
        var keys = new string?[items.Count];
        for (int i = 0; i < items.Count; i++) keys[i] = reviews[i].Review?.Review?.ReferenceOr(items[i].BaseName);
        foreach (var shared in Enumerable.Range(0, items.Count).Where(i => keys[i] is not null).GroupBy(i => keys[i]!, StringComparer.Ordinal)
                     .Where(g => g.Count() > 1).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            notes.Add($"reference '{shared.Key}' is given by {shared.Count()} submissions; each is tracked in the register as '{shared.Key} / <submission name>'.");
            foreach (int i in shared) keys[i] = $"{shared.Key} / {items[i].Name}";
        }

        // 3 and 4. Record in the register, one transaction per review, in name order (items are sorted) so ids follow the
        // names, on a thread of its own; meanwhile write the memos (or the lists of input errors) in parallel, taking the
        // items in order, each memo as soon as its review is recorded (the memo shows the comparison with the previous
        // round). Every file is flushed to disk before it replaces the old one, and a core would idle while its worker
        // waits for the disk: twice as many writers as cores keep both busy.
        var rounds = new RoundComparison?[items.Count];
        var problems = new string?[items.Count];
        var recordGate = new object();
        int recordedUpTo = register is null ? items.Count : 0;
        bool recorderStopped = register is null;
        Exception? recorderFault = null;
        var registerTime = TimeSpan.Zero;
        var recorder = register is null ? null : new Thread(() =>
        {
            try
            {
                for (int i = 0; i < items.Count; i++)
                {
                    cancel.ThrowIfCancellationRequested();
                    if (reviews[i].Review?.Review is { } review)
                    {
                        try
                        {
                            rounds[i] = register.Record(review, keys[i]!, items[i].Name, reviews[i].Hash);
                        }
                        catch (RegisterException ex)
                        {
                            problems[i] = $"not recorded in the register: {ex.Message}";
                        }
                    }
                    lock (recordGate) { recordedUpTo = i + 1; Monitor.PulseAll(recordGate); }
                }
            }
            catch (Exception ex)
            {
                recorderFault = ex;
            }
            finally
            {
                lock (recordGate) { recorderStopped = true; registerTime = stage.Elapsed; Monitor.PulseAll(recordGate); }
            }
        })
        { IsBackground = true, Name = "register" };
        recorder?.Start();

        var rows = new ScreenRow[items.Count];
        var writers = new ParallelOptions { MaxDegreeOfParallelism = 2 * parallelism, CancellationToken = cancel };
        try
        {
            Parallel.ForEach(System.Collections.Concurrent.Partitioner.Create(Enumerable.Range(0, items.Count),
                System.Collections.Concurrent.EnumerablePartitionerOptions.NoBuffering), writers, i =>
            {
                if (reviews[i].Review?.Review is not null)
                    lock (recordGate)
                        while (recordedUpTo <= i && !recorderStopped) Monitor.Wait(recordGate);
                rows[i] = WriteOne(items[i], reviews[i], keys[i], rounds[i], problems[i], outDir, options);
                lock (gate) progress?.Written(rows[i], ++written);
            });
        }
        finally
        {
            recorder?.Join();
        }
        if (recorderFault is not null)
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(recorderFault).Throw();
        timings.Add(registerTime);

        timings.Add(stage.Elapsed);
        stage.Restart();
        var ordered = rows.OrderByDescending(r => r.Outcome).ThenBy(r => r.Name, StringComparer.Ordinal).ToList();
        var report = new ScreenReport(Path.GetFullPath(folder), outDir, register?.Path, options, ordered, ScreenGrouping.Groups(ordered), notes,
            clock.Elapsed, parallelism);
        AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, SummaryFile), ScreenOutputs.SummaryCsv(report));
        AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, IndexFile), ScreenOutputs.IndexHtml(report));
        return report with { Elapsed = clock.Elapsed, Stages = new ScreenStages(timings[0], timings[1], timings[2], stage.Elapsed) };
    }

    private sealed record Reviewed(ReviewOutcome? Review, string? Hash, string? Fault)
    {
        public ScreenOutcome Outcome => Fault is not null ? ScreenOutcome.InternalError
            : Review!.Review is not { } r ? ScreenOutcome.InputError
            : r.Verdict switch { Verdict.Concur => ScreenOutcome.Concur, Verdict.ConcurWithComments => ScreenOutcome.Comments, _ => ScreenOutcome.Revise };
    }

    private static Reviewed ReviewOne(ScreenItem item, ReviewOptions options, InputLimits? limits)
    {
        try
        {
            var outcome = ReviewPipeline.Run(item.Path, options, limits ?? InputLimits.Default);
            return new Reviewed(outcome, outcome.Succeeded ? InputHash.Compute(item.Path) : null, null);
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // A fault in CrossCheck on one submission must not stop the batch; the row says what happened.
            return new Reviewed(null, null, $"internal error: {ex.GetType().Name}: {ex.Message}");
        }
    }

    private static ScreenRow WriteOne(ScreenItem item, Reviewed r, string? key, RoundComparison? rounds, string? problem, string outDir, ScreenOptions options)
    {
        var outcome = r.Outcome;
        if (r.Fault is not null)
            return new ScreenRow(item, outcome, null, [new InputProblem(new SourceRef(item.Name), r.Fault)], null, null, null,
                new ScreenGroupKey(ScreenGroupKind.InternalError, "internal-error"));
        var review = r.Review!.Review;
        if (review is null)
        {
            string file = item.Stem + "-input-errors.txt";
            string? written = null;
            try
            {
                var sb = new StringBuilder();
                sb.Append(item.Name).Append(" could not be reviewed (").Append(r.Review.Errors.Count).Append(" problem")
                    .Append(r.Review.Errors.Count == 1 ? "" : "s").Append("):\n");
                foreach (var e in r.Review.Errors) sb.Append("  ").Append(e.Where.Describe()).Append(": ").Append(e.Message).Append('\n');
                if (r.Review.Warnings.Count > 0) sb.Append("Warnings:\n");
                foreach (var w in r.Review.Warnings) sb.Append("  ").Append(w.Where.Describe()).Append(": ").Append(w.Message).Append('\n');
                AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, file), sb.ToString());
                written = file;
            }
            catch (IOException ex)
            {
                problem = $"could not write {file}: {ex.Message}";
            }
            return new ScreenRow(item, outcome, null, r.Review.Errors, null, null, written, new ScreenGroupKey(ScreenGroupKind.InputError, "input-error"), problem);
        }
        string ext = options.Format == MemoFormat.Html ? "html" : "md";
        string memoFile = $"{item.Stem}-review.{ext}";
        string? memo = null;
        try
        {
            var model = MemoExtensions.Build(review, options.Format, rounds);
            string text = options.MemoTemplate is { } t ? MemoRenderer.Render(model, t.Text, t.Name) : MemoRenderer.Render(model, options.Format);
            AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, memoFile), text);
            memo = memoFile;
        }
        catch (MemoTemplateException ex)
        {
            problem = Join(problem, $"memo not written: the template has an error: {ex.Message}");
        }
        catch (IOException ex)
        {
            problem = Join(problem, $"memo not written: {ex.Message}");
        }
        catch (UnauthorizedAccessException ex)
        {
            problem = Join(problem, $"memo not written: {ex.Message}");
        }
        return new ScreenRow(item, outcome, review, [], key, rounds, memo, ScreenGrouping.Classify(review), problem);
    }

    private static string Join(string? a, string b) => a is null ? b : $"{a}; {b}";
}
