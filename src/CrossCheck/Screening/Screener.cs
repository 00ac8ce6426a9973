using System.Text;
using System.Threading.Channels;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Register;
using CrossCheck.Review;

namespace CrossCheck.Screening;

/// <summary>Hears how a screen progresses. Calls come from one task at a time (never two at once).</summary>
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
/// Screens a folder of submissions with the review job's stages (<see cref="ReviewJob"/>): reviews them in parallel,
/// records each review in the register (in name order, one transaction each), writes a memo per submission as soon as
/// its review is recorded, and then <c>summary.csv</c> and <c>index.html</c>. A submission that cannot be read becomes a
/// row with its error; nothing stops the batch.
/// </summary>
/// <remarks>
/// The stages are joined by channels: the indices to review feed <c>--jobs</c> reviewers, whose results come back to
/// the calling task; the recorder takes the reviews in name order on a task of its own and passes each index on once
/// it is recorded; twice as many memo writers as reviewers take them from there (every file is flushed to disk before
/// it replaces the old one, and a core would idle while its writer waits for the disk), and their rows come back to
/// the calling task. Progress is reported only from the calling task, so its calls never overlap.
/// </remarks>
public static class Screener
{
    public const string SummaryFile = "summary.csv";
    public const string IndexFile = "index.html";

    /// <summary>Where the outputs go when no folder is given: <c>&lt;folder name&gt;-screen</c> in the current folder.</summary>
    public static string DefaultOutputFolder(string folder)
    {
        string full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder));
        string name = Path.GetFileName(full) is { Length: > 0 } n ? n : "submissions";
        return $"{SubmissionNames.SafeStem(name)}-screen";
    }

    /// <summary>The register when none is given: <see cref="ReviewRegister.DefaultFileName"/> beside the folder screened.</summary>
    public static string DefaultRegisterPath(string folder)
    {
        string full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder));
        return Path.Combine(Path.GetDirectoryName(full) ?? full, ReviewRegister.DefaultFileName);
    }

    /// <summary>True when <paramref name="outputFolder"/> is the folder screened (its summary would be taken for a submission next time).</summary>
    public static bool IsScreenedFolder(string folder, string outputFolder) =>
        string.Equals(Path.TrimEndingDirectorySeparator(Path.GetFullPath(outputFolder)), Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder)),
            StringComparison.Ordinal);

    /// <exception cref="DirectoryNotFoundException">The folder does not exist.</exception>
    /// <exception cref="RegisterException">The register cannot be opened.</exception>
    /// <exception cref="IOException">The output folder cannot be created or the summary cannot be written.</exception>
    /// <exception cref="ArgumentException">The output folder is the folder screened.</exception>
    public static ScreenReport Run(string folder, ScreenOptions options, IScreenProgress? progress = null, CancellationToken cancel = default)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(options);
        // The stages run on the thread pool; this thread only waits (no synchronisation context is involved).
        return Task.Run(() => RunAsync(folder, options, progress, cancel), CancellationToken.None).GetAwaiter().GetResult();
    }

    private static async Task<ScreenReport> RunAsync(string folder, ScreenOptions options, IScreenProgress? progress, CancellationToken cancel)
    {
        var time = options.Time;
        long start = time.GetTimestamp();
        string outDir = Path.TrimEndingDirectorySeparator(Path.GetFullPath(options.OutputFolder));
        if (IsScreenedFolder(folder, outDir))
            throw new ArgumentException("the output folder must not be the folder screened (its summary.csv would be taken for a submission next time).", nameof(options));
        var exclude = new List<string> { outDir };
        if (options.RegisterPath is not null) exclude.Add(options.RegisterPath);
        var found = SubmissionFinder.Find(folder, exclude);
        Directory.CreateDirectory(outDir);
        // Temporary files of a screen that was killed while writing go; a screen that was interrupted is resumed.
        AtomicFile.CleanStale(outDir);
        var job = new ReviewJob(time);
        // One date for the whole batch, even one that runs past midnight (or is resumed the next day).
        options = options with { Review = job.Dated(options.Review) };
        using var register = options.RegisterPath is null ? null : ReviewRegister.Open(options.RegisterPath, time);
        var journal = ScreenJournal.Begin(outDir, Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder)), register?.Path, options.Review.Date!.Value, time);
        options = options with { Review = options.Review with { Date = journal.Date } };
        // Every file read must stay inside the folder screened, and each review within its time budget.
        var limits = (options.Limits ?? InputLimits.Default) with { Within = RealPath.Of(folder) };
        int parallelism = options.Parallelism > 0 ? options.Parallelism : Environment.ProcessorCount;
        var items = found.Items;
        progress?.Begin(items.Count);

        // 1. Review every submission, in parallel; the results come back here (in the order they finish).
        long stage = time.GetTimestamp();
        var reviews = new Reviewed[items.Count];
        var toReview = Channel.CreateBounded<int>(new BoundedChannelOptions(Math.Max(1, items.Count)) { SingleWriter = true });
        for (int i = 0; i < items.Count; i++) toReview.Writer.TryWrite(i);
        toReview.Writer.Complete();
        var reviewed = Channel.CreateUnbounded<(int Index, Reviewed Result)>(new UnboundedChannelOptions { SingleReader = true });
        // Interrupted (Ctrl-C, SIGTERM): the reviewers take no more, a review under way is dropped (nothing of it recorded).
        var reviewers = Workers(parallelism, reviewed.Writer, async () =>
        {
            await foreach (int i in toReview.Reader.ReadAllAsync(CancellationToken.None).ConfigureAwait(false))
            {
                if (cancel.IsCancellationRequested || ReviewOne(job, items[i], options.Review, limits, cancel) is not { } one) break;
                await reviewed.Writer.WriteAsync((i, one), CancellationToken.None).ConfigureAwait(false);
            }
        });
        int done = 0;
        await foreach (var (i, result) in reviewed.Reader.ReadAllAsync(CancellationToken.None).ConfigureAwait(false))
        {
            reviews[i] = result;
            progress?.Reviewed(items[i], result.Outcome, ++done);
        }
        await reviewers.ConfigureAwait(false);
        // The register keys need every review (a shared reference is qualified by name), so an interruption before the
        // reviews are all in records nothing: the next screen does them again.
        bool interrupted = cancel.IsCancellationRequested;
        var reviewTime = time.GetElapsedTime(stage);
        stage = time.GetTimestamp();

        // 2. The key each one's rounds are tracked by; a reference several submissions share is qualified by their names.
        var notes = new List<string>(found.Skipped);
        var keys = new string?[items.Count];
        for (int i = 0; i < items.Count; i++) keys[i] = reviews[i]?.Review?.Review is { } rv ? rv.ReferenceOr(TextSafety.Clean(items[i].BaseName)) : null;
        foreach (var shared in Enumerable.Range(0, items.Count).Where(i => keys[i] is not null).GroupBy(i => keys[i]!, StringComparer.Ordinal)
                     .Where(g => g.Count() > 1).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            notes.Add($"reference '{shared.Key}' is given by {shared.Count()} submissions; each is tracked in the register as '{shared.Key} / <submission name>'.");
            foreach (int i in shared) keys[i] = $"{shared.Key} / {TextSafety.Clean(items[i].Name)}";
        }

        // 3. Record in the register, one transaction per review, in name order (items are sorted) so that ids follow the
        // names, on a task of its own; each index goes on to the memo writers once its review is recorded (the memo shows
        // the comparison with the previous round).
        var rounds = new RoundComparison?[items.Count];
        var problems = new string?[items.Count];
        var resumed = new bool[items.Count];
        var recorded = Channel.CreateUnbounded<int>(new UnboundedChannelOptions { SingleWriter = true });
        var registerTime = TimeSpan.Zero;
        var recorder = Workers(1, recorded.Writer, () =>
        {
            for (int i = 0; i < items.Count && !interrupted; i++)
            {
                // Interrupted: what is recorded gets its memo; the rest waits for the next screen.
                if (cancel.IsCancellationRequested) { interrupted = true; break; }
                if (register is not null && reviews[i].Review?.Review is { } review)
                {
                    try
                    {
                        // Resuming: a review the interrupted screen recorded (same key, same files) is not recorded twice.
                        var earlier = journal.Resuming ? RecordedSince(register, keys[i]!, reviews[i].Hash, journal.Since!) : null;
                        resumed[i] = earlier is not null;
                        rounds[i] = earlier ?? register.Record(review, keys[i]!, TextSafety.Clean(items[i].Name), reviews[i].Hash);
                    }
                    catch (RegisterException ex)
                    {
                        problems[i] = $"not recorded in the register: {ex.Message}";
                    }
                }
                recorded.Writer.TryWrite(i);
            }
            registerTime = time.GetElapsedTime(stage);
            return Task.CompletedTask;
        });

        // 4. Write the memos (or the lists of input errors) as their reviews are recorded; the rows come back here.
        var rows = new ScreenRow[items.Count];
        var written = Channel.CreateUnbounded<int>(new UnboundedChannelOptions { SingleReader = true });
        var writers = Workers(2 * parallelism, written.Writer, async () =>
        {
            await foreach (int i in recorded.Reader.ReadAllAsync(CancellationToken.None).ConfigureAwait(false))
            {
                rows[i] = WriteOne(items[i], reviews[i], keys[i], rounds[i], problems[i], outDir, options, resumed[i]);
                await written.Writer.WriteAsync(i, CancellationToken.None).ConfigureAwait(false);
            }
        });
        done = 0;
        await foreach (int i in written.Reader.ReadAllAsync(CancellationToken.None).ConfigureAwait(false)) progress?.Written(rows[i], ++done);
        await recorder.ConfigureAwait(false);
        await writers.ConfigureAwait(false);
        var memoTime = time.GetElapsedTime(stage);
        stage = time.GetTimestamp();

        var pending = Enumerable.Range(0, items.Count).Where(i => rows[i] is null).Select(i => items[i].Name).ToList();
        if (pending.Count > 0)
            notes.Add($"the screen was interrupted: {pending.Count} of {items.Count} submissions were not screened ({string.Join(", ", pending.Take(5))}{(pending.Count > 5 ? ", ..." : "")}); run the same command again to finish it.");
        var ordered = rows.Where(r => r is not null).OrderByDescending(r => r.Outcome).ThenBy(r => r.Name, StringComparer.Ordinal).ToList();
        var report = new ScreenReport(Path.GetFullPath(folder), outDir, register?.Path, options, ordered, ScreenGrouping.Groups(ordered), notes,
            time.GetElapsedTime(start), parallelism) { Pending = pending };
        AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, SummaryFile), ScreenOutputs.SummaryCsv(report), replaceSpecial: true);
        AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, IndexFile), ScreenOutputs.IndexHtml(report), replaceSpecial: true);
        if (pending.Count == 0) journal.Finish();
        return report with { Elapsed = time.GetElapsedTime(start), Stages = new ScreenStages(reviewTime, registerTime, memoTime, time.GetElapsedTime(stage)) };
    }

    /// <summary>
    /// Runs <paramref name="count"/> copies of <paramref name="work"/> on the thread pool and completes
    /// <paramref name="output"/> when the last has finished (with the first fault, so that its reader sees it too).
    /// </summary>
    private static async Task Workers<T>(int count, ChannelWriter<T> output, Func<Task> work)
    {
        var tasks = Enumerable.Range(0, count).Select(_ => Task.Run(work)).ToArray();
        try
        {
            await Task.WhenAll(tasks).ConfigureAwait(false);
            output.TryComplete();
        }
        catch (Exception ex)
        {
            output.TryComplete(ex);
            throw;
        }
    }

    private sealed record Reviewed(ReviewOutcome? Review, string? Hash, string? Fault)
    {
        public ScreenOutcome Outcome => Fault is not null ? ScreenOutcome.InternalError
            : Review!.Review is not { } r ? ScreenOutcome.InputError
            : r.Verdict switch { Verdict.Concur => ScreenOutcome.Concur, Verdict.ConcurWithComments => ScreenOutcome.Comments, _ => ScreenOutcome.Revise };
    }

    /// <summary>The latest review of <paramref name="key"/> with these input files recorded since <paramref name="since"/> (by the interrupted screen), with its comparison.</summary>
    private static RoundComparison? RecordedSince(ReviewRegister register, string key, string? hash, string since) =>
        hash is null ? null
            : register.History(key).LastOrDefault(h => h.Review.InputHash == hash && string.CompareOrdinal(h.Review.RecordedAt, since) >= 0);

    /// <summary>The review of one submission; null when the screen was interrupted during it (nothing of it is kept).</summary>
    private static Reviewed? ReviewOne(ReviewJob job, ScreenItem item, ReviewOptions options, InputLimits limits, CancellationToken cancel)
    {
        if (item.Refusal is not null)
        {
            var where = new SourceRef(item.Name);
            return new Reviewed(new ReviewOutcome(item.Path, null, [new InputProblem(where, item.Refusal)], [], ReviewFailure.Unreadable), null, null);
        }
        try
        {
            var outcome = job.Review(item.Path, options, limits, cancel);
            return new Reviewed(outcome, outcome.Succeeded ? InputHash.Compute(item.Path) : null, null);
        }
        catch (OperationCanceledException) when (cancel.IsCancellationRequested)
        {
            return null;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // A fault in CrossCheck on one submission must not stop the batch; the row says what happened.
            return new Reviewed(null, null, $"internal error: {ex.GetType().Name}: {ex.Message}");
        }
    }

    private static ScreenRow WriteOne(ScreenItem item, Reviewed r, string? key, RoundComparison? rounds, string? problem, string outDir, ScreenOptions options,
        bool resumed)
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
                AtomicFile.WriteText(SubmissionNames.ChildPath(outDir, file), sb.ToString(), replaceSpecial: true);
                written = file;
            }
            catch (IOException ex)
            {
                problem = $"could not write {file}: {ex.Message}";
            }
            return new ScreenRow(item, outcome, null, r.Review.Errors, null, null, written, new ScreenGroupKey(ScreenGroupKind.InputError, "input-error"), problem);
        }
        var format = options.Format == MemoFormat.Html ? ReviewFormat.Html : ReviewFormat.Markdown;
        string memoFile = $"{item.Stem}-review.{ReviewJob.Extension(format)}";
        string? memo = null;
        try
        {
            string path = SubmissionNames.ChildPath(outDir, memoFile);
            // Resuming: the interrupted screen wrote this memo whole (or not at all); only a missing one is written.
            if (!resumed || FileFacts.Of(path).Kind != FileKind.Regular)
                AtomicFile.WriteText(path, ReviewJob.Render(review, format, options.MemoTemplate, rounds), replaceSpecial: true);
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
