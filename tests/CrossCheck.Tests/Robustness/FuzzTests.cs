using System.Collections.Concurrent;
using System.Globalization;
using System.Text.RegularExpressions;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using CsCheck;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// Fuzzing: random mutations of the valid CSV and PDF fixtures, each reviewed from end to end (read, solve, review,
/// Markdown, HTML and JSON output). Every input must give a review or input errors — never another exception, never a
/// hang (each input has <see cref="PerInput"/>). CI tries a few hundred inputs; set <c>CROSSCHECK_FUZZ_COUNT</c> for
/// more (the CSV count; PDF counts are a fifth of it each), and the replay variable CsCheck prints with a failure to run that failure again.
/// </summary>
public class FuzzTests(ITestOutputHelper output)
{
    /// <summary>Mutated CSV inputs per run (default 300).</summary>
    public static int Count { get; } =
        int.TryParse(Environment.GetEnvironmentVariable("CROSSCHECK_FUZZ_COUNT"), NumberStyles.Integer, CultureInfo.InvariantCulture, out int n) && n > 0 ? n : 300;

    /// <summary>Longest one input may take (read, solve, review and render) before it counts as a hang.</summary>
    public static readonly TimeSpan PerInput = TimeSpan.FromSeconds(30);

    /// <summary>The valid inputs mutated: a sectioned file, or one file of a folder submission.</summary>
    private static readonly (string Submission, string? File)[] CsvSources =
    [
        ("fixtures/demo/footbridge.csv", null),
        ("fixtures/demo/school-hall.csv", null),
        ("tests/CrossCheck.Tests/Robustness/Samples/two-bay-shelter.csv", null),
        .. new[] { "info.csv", "joints.csv", "members.csv", "loads.csv", "end-moments.csv", "reactions.csv" }.Select(f => ("fixtures/demo/shed-frame", (string?)f)),
    ];

    private static readonly string[] PdfSources =
        [.. Directory.GetFiles(Path.Combine(RepoPaths.Root, "fixtures", "pdf"), "*.pdf").Concat(Directory.GetFiles(Path.Combine(RepoPaths.Root, "fixtures", "demo"), "*.pdf")).Order(StringComparer.Ordinal)];

    [Fact]
    public void MutatedCsv_GivesAReviewOrInputErrors_NeverAnotherException()
    {
        var gen = Gen.Select(Gen.Int[0, CsvSources.Length - 1], Mutations.Edits.Array[1, 4]);
        int tried = 0, reviewed = 0;
        gen.Sample((source, edits) =>
        {
            using var t = new TempSubmission();
            var (submission, file) = CsvSources[source];
            string from = Path.Combine(RepoPaths.Root, submission);
            string path;
            if (file is null)
            {
                path = t.WriteBytes(Path.GetFileName(from), Mutations.Apply(File.ReadAllBytes(from), edits));
            }
            else
            {
                path = t.CopyFolder(from, Path.GetFileName(from));
                File.WriteAllBytes(Path.Combine(path, file), Mutations.Apply(File.ReadAllBytes(Path.Combine(from, file)), edits));
            }
            if (Fuzz.Exercise(path, $"{submission}{(file is null ? "" : "/" + file)} {string.Join(" ", edits.Select(e => e.ToString()))}")) Interlocked.Increment(ref reviewed);
            Interlocked.Increment(ref tried);
        }, iter: Count, print: x => $"{CsvSources[x.Item1].Submission}/{CsvSources[x.Item1].File} {string.Join(" ", x.Item2.Select(e => e.ToString()))}");
        Report("CSV", tried);
        ShouldHaveRun("CSV", tried, reviewed, expected: Count);
    }

    [Fact]
    public void MutatedPdfBytes_GiveAReviewOrInputErrors_NeverAnotherException()
    {
        var gen = Gen.Select(Gen.Int[0, PdfSources.Length - 1], Mutations.Edits.Array[1, 3]);
        int tried = 0, reviewed = 0;
        int iterations = Math.Max(20, Count / 5);
        gen.Sample((source, edits) =>
        {
            using var t = new TempSubmission();
            string path = t.WriteBytes("calc.pdf", Mutations.Apply(File.ReadAllBytes(PdfSources[source]), edits));
            if (Fuzz.Exercise(path, $"{Path.GetFileName(PdfSources[source])} {string.Join(" ", edits.Select(e => e.ToString()))}")) Interlocked.Increment(ref reviewed);
            Interlocked.Increment(ref tried);
        }, iter: iterations, print: x => $"{Path.GetFileName(PdfSources[x.Item1])} {string.Join(" ", x.Item2.Select(e => e.ToString()))}");
        Report("PDF bytes", tried);
        ShouldHaveRun("PDF bytes", tried, reviewed, expected: iterations);
    }

    /// <summary>Tokens a standard PDF font can print (the table finder, not the font, is under test).</summary>
    private static readonly int[] PrintableTokens =
        [.. Enumerable.Range(0, Mutations.Tokens.Length).Where(i => Mutations.Tokens[i].Length is > 0 and < 100 && Mutations.Tokens[i].All(c => c is >= ' ' and <= '~'))];

    private static readonly Layout[] Layouts =
    [
        new("plain"), new("synonyms") { Synonyms = true }, new("wide") { WideMoments = true, Synonyms = true },
        new("units-row") { Units = UnitPlacement.UnitsRow, CaseLabels = true }, new("prose") { Prose = true, BreakInTable = true },
    ];

    [Fact]
    public void PdfsOfMutatedTables_GiveAReviewOrInputErrors_NeverAnotherException()
    {
        var sources = new[] { "fixtures/demo/footbridge.csv", "fixtures/demo/school-hall.csv", "fixtures/demo/shed-frame" };
        var cellEdit = Gen.Select(Gen.Int[0, 20], Gen.Int[0, 40], Gen.Int[0, 12], Gen.Int[0, PrintableTokens.Length - 1]);
        var gen = Gen.Select(Gen.Int[0, sources.Length - 1], Gen.Int[0, Layouts.Length - 1], cellEdit.Array[1, 4]);
        int tried = 0, reviewed = 0;
        int iterations = Math.Max(20, Count / 5);
        gen.Sample((source, layout, edits) =>
        {
            var tables = SubmissionPdf.ReadCsv(Path.Combine(RepoPaths.Root, sources[source])).ToList();
            foreach (var (table, row, column, token) in edits)
            {
                var tb = tables[table % tables.Count];
                if (tb.Rows.Count == 0) continue;
                var rows = tb.Rows.ToList();
                var r = rows[row % rows.Count];
                var cells = r.Cells.ToArray();
                if (cells.Length == 0) continue;
                cells[column % cells.Length] = Mutations.Tokens[PrintableTokens[token]];
                rows[row % rows.Count] = r with { Cells = cells };
                tables[table % tables.Count] = tb with { Rows = rows };
            }
            byte[] pdf;
            try
            {
                pdf = SubmissionPdf.Render(tables, Layouts[layout]);
            }
            catch (Exception ex) when (ex is ArgumentException or InvalidOperationException or KeyNotFoundException or IndexOutOfRangeException)
            {
                return; // the test's own PDF writer cannot set this text: not an input for the reader
            }
            using var t = new TempSubmission();
            if (Fuzz.Exercise(t.WriteBytes("calc.pdf", pdf), $"{sources[source]} as {Layouts[layout]}, cells {string.Join(" ", edits)}")) Interlocked.Increment(ref reviewed);
            Interlocked.Increment(ref tried);
        }, iter: iterations, print: x => $"{sources[x.Item1]} as {Layouts[x.Item2]}, cells {string.Join(" ", x.Item3)}");
        Report("PDF tables", tried);
        // Inputs the test's own PDF writer cannot set are skipped above; most must still reach the reader.
        ShouldHaveRun("PDF tables", tried, reviewed, expected: (iterations + 1) / 2);
    }

    /// <summary>
    /// A fuzz test must have tested something: at least <paramref name="expected"/> inputs went through the reader, and
    /// some of them were reviewed and rendered (not every one refused at the door).
    /// </summary>
    private static void ShouldHaveRun(string what, int tried, int reviewed, int expected)
    {
        tried.ShouldBeGreaterThanOrEqualTo(Math.Max(1, expected), $"{what}: inputs that reached the reader");
        reviewed.ShouldBeGreaterThan(0, $"{what}: inputs reviewed and rendered (of {tried})");
    }

    private void Report(string what, int tried)
    {
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{what}: {tried} mutated inputs tried; {Fuzz.Reviewed} reviewed and {Fuzz.Refused} refused so far in this run; {Fuzz.Messages.Count} distinct messages seen"));
        foreach (var (m, k) in Fuzz.Messages.OrderByDescending(kv => kv.Value).Take(60)) output.WriteLine($"  {k,5}  {m}");
    }
}

/// <summary>Runs one fuzzed input through everything a review does, within a time bound, and keeps count.</summary>
internal static partial class Fuzz
{
    public static readonly ConcurrentDictionary<string, int> Messages = new(StringComparer.Ordinal);
    private static int _reviewed, _refused;

    public static int Reviewed => _reviewed;
    public static int Refused => _refused;

    private static readonly InputLimits Limits = InputLimits.Default with { Pdf = PdfLimits.Default with { TimeBudget = TimeSpan.FromSeconds(10) } };

    /// <summary>
    /// Reviews <paramref name="path"/> and renders every output; fails (naming the input, which is kept on disk) on any
    /// exception or when it takes longer than <see cref="FuzzTests.PerInput"/>.
    /// </summary>
    /// <returns>True when the input was reviewed and rendered, false when it was refused with input errors.</returns>
    public static bool Exercise(string path, string description)
    {
        var task = Task.Run(() => Run(path));
        bool finished;
        try
        {
            finished = task.Wait(FuzzTests.PerInput);
        }
        catch (AggregateException ex)
        {
            throw new ShouldAssertException($"{description}: {ex.InnerException!.GetType().Name}: {ex.InnerException.Message} (input kept at {Keep(path)})\n{ex.InnerException}");
        }
        if (!finished) throw new ShouldAssertException($"{description}: no answer within {FuzzTests.PerInput.TotalSeconds:0} s (input kept at {Keep(path)})");
        return task.Result;
    }

    private static bool Run(string path)
    {
        var outcome = new ReviewJob().Review(path, ReviewOptions.Default, Limits);
        foreach (var p in outcome.Errors.Concat(outcome.Warnings)) Messages.AddOrUpdate(Shape(p.Message), 1, (_, k) => k + 1);
        if (outcome.Review is not { } review)
        {
            outcome.Errors.ShouldNotBeEmpty("a submission that is not reviewed must say why");
            outcome.Errors.ShouldAllBe(p => p.Message.Length > 0 && p.Where.File.Length > 0);
            ReviewJson.WriteInputErrors(path, outcome.Errors).ShouldMatchReviewSchema("input-error JSON");
            Interlocked.Increment(ref _refused);
            return false;
        }
        MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Markdown), MemoFormat.Markdown).ShouldNotBeEmpty();
        MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Html), MemoFormat.Html).ShouldNotBeEmpty();
        ReviewJson.Write(review).ShouldMatchReviewSchema();
        Interlocked.Increment(ref _reviewed);
        return true;
    }

    /// <summary>A message with its particulars (quoted text, numbers) taken out, to count kinds of message rather than instances.</summary>
    public static string Shape(string message) => Number().Replace(Quoted().Replace(message, "…"), "#");

    private static string Keep(string path)
    {
        string dir = Environment.GetEnvironmentVariable("CROSSCHECK_FUZZ_KEEP") is { Length: > 0 } d ? d : Path.Combine(Path.GetTempPath(), "crosscheck-fuzz-failures");
        Directory.CreateDirectory(dir);
        string target = Path.Combine(dir, $"{DateTime.UtcNow:yyyyMMddHHmmssfff}-{Path.GetFileName(path)}");
        if (Directory.Exists(path))
        {
            TempSubmission.CopyFiles(path, target);
        }
        else if (File.Exists(path))
        {
            File.Copy(path, target);
        }
        return target;
    }

    [GeneratedRegex("'[^']*'|\"[^\"]*\"")]
    private static partial Regex Quoted();

    [GeneratedRegex(@"\d+(\.\d+)?(e[+-]?\d+)?")]
    private static partial Regex Number();
}
