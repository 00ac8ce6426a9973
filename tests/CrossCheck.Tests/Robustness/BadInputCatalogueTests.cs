using CrossCheck.Cli;
using CrossCheck.Jobs;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// Every entry of the catalogue of bad submissions (<c>fixtures/bad/manifest.csv</c>) gives its expected message at its
/// expected place, through the library and through the command line: exit code 2 and no stack trace for what cannot be
/// reviewed, nothing written when there is no review.
/// </summary>
public class BadInputCatalogueTests
{
    public static TheoryData<string> Ids()
    {
        var data = new TheoryData<string>();
        foreach (var e in BadInputCatalogue.Entries) data.Add(e.Id);
        return data;
    }

    /// <summary>The entry and the path of its input (a generated input is written into <paramref name="scratch"/>).</summary>
    private static (BadInput Entry, string Path) Input(string id, TempSubmission scratch)
    {
        var entry = BadInputCatalogue.Get(id);
        return (entry, entry.Path(scratch.Folder));
    }

    [Fact]
    public void Catalogue_HasFortyEntriesOrMore_OfCsvAndPdf_EveryFileListedOnce()
    {
        var entries = BadInputCatalogue.Entries;
        entries.Count.ShouldBeGreaterThanOrEqualTo(40);
        entries.Select(e => e.Id).ShouldBeUnique();
        entries.Count(e => e.IsPdf).ShouldBeGreaterThanOrEqualTo(10);
        entries.Count(e => !e.IsPdf).ShouldBeGreaterThanOrEqualTo(30);
        entries.ShouldAllBe(e => e.Message.Length > 0 && e.Where.Length > 0);
        // Every committed input is in the manifest, and every input the manifest names exists.
        var listed = entries.Where(e => !e.Generated).Select(e => Path.GetFullPath(Path.Combine(BadInputCatalogue.Folder, e.Input))).ToHashSet();
        var committed = Directory.EnumerateFileSystemEntries(BadInputCatalogue.Folder)
            .Where(p => Path.GetFileName(p) is not ("manifest.csv" or "README.md")).Select(Path.GetFullPath);
        committed.Where(p => !listed.Contains(p)).ShouldBeEmpty("files in fixtures/bad that the manifest does not list");
        listed.Where(p => !File.Exists(p) && !Directory.Exists(p)).ShouldBeEmpty("inputs the manifest lists that do not exist");
        // What the issue asks for is there.
        foreach (var id in new[] { "no-loads-table", "missing-column-I", "text-in-number", "unknown-joint", "duplicate-member", "contradictory-units",
                     "empty-file", "binary-garbage", "bom-in-middle", "very-long-line", "huge-number", "denormal", "zero-length-member", "enormous-member",
                     "mechanism", "disconnected-floating-part", "load-on-nothing", "claim-end-not-on-member", "pdf-scanned", "pdf-encrypted", "pdf-truncated",
                     "pdf-bomb-deflate", "pdf-bomb-nesting" })
            entries.ShouldContain(e => e.Id == id);
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void Entry_GivesItsMessage_AtItsPlace(string id)
    {
        using var t = new TempSubmission();
        var (entry, path) = Input(id, t);
        string where = entry.IsPdf ? entry.ResolvedWhere(path) : entry.Where;
        var outcome = new ReviewJob().Review(path, ReviewOptions.Default);
        string all = string.Join("\n", outcome.Errors.Concat(outcome.Warnings).Select(p => $"{p.Where.Compact}: {p.Message}"));
        Func<string, bool> Says = text => entry.Messages.Any(m => text.Contains(m, StringComparison.Ordinal));
        switch (entry.Outcome)
        {
            case BadOutcome.InputError:
                outcome.Failure.ShouldBe(ReviewFailure.Unreadable, all);
                outcome.Errors.Any(p => p.Where.Compact == where && Says(p.Message)).ShouldBeTrue($"expected at {where}: {entry.Message}\nfound:\n{all}");
                break;
            case BadOutcome.NotAnalysable:
                outcome.Failure.ShouldBe(ReviewFailure.NotAnalysable, all);
                outcome.Errors.ShouldHaveSingleItem().Where.Compact.ShouldBe(where);
                Says(outcome.StructureProblem!).ShouldBeTrue(outcome.StructureProblem);
                break;
            case BadOutcome.Finding:
            {
                var review = outcome.Review.ShouldNotBeNull(all);
                var flags = review.AllFlags.Where(f => f.Sources.Any(s => s.RowCompact == where) && Says(f.Message)).ToList();
                flags.ShouldNotBeEmpty($"no finding at {where} saying '{entry.Message}'; flags:\n{string.Join("\n", review.AllFlags.Select(f => $"{f.SourceText}: {f.Message}"))}");
                break;
            }
            case BadOutcome.Warning:
                outcome.Review.ShouldNotBeNull(all);
                outcome.Warnings.Any(p => p.Where.Compact == where && Says(p.Message)).ShouldBeTrue($"expected a warning at {where}: {entry.Message}\nfound:\n{all}");
                break;
        }
    }

    [Theory]
    [MemberData(nameof(Ids))]
    public void Cli_ExitsAsExpected_WithoutAStackTrace_AndWritesNoMemoWithoutAReview(string id)
    {
        using var t = new TempSubmission();
        var (entry, path) = Input(id, t);
        string memo = Path.Combine(t.Folder, "out", "memo.md");
        var r = CliRunner.Run("review", path, "--out", memo, "--quiet");
        r.Err.ShouldNotContain("   at ", Case.Sensitive, "no stack trace");
        r.Err.ShouldNotContain("internal error");
        if (entry.Outcome is BadOutcome.InputError or BadOutcome.NotAnalysable)
        {
            r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
            entry.Messages.Any(m => r.Err.Contains(m, StringComparison.Ordinal)).ShouldBeTrue(r.Err);
            File.Exists(memo).ShouldBeFalse("nothing is written for a submission that could not be reviewed");
            Directory.Exists(Path.Combine(t.Folder, "out")).ShouldBeFalse();
        }
        else
        {
            r.ExitCode.ShouldBeOneOf(ExitCodes.Concur, ExitCodes.Comments);
            File.Exists(memo).ShouldBeTrue();
        }
    }
}
