using CrossCheck.Import.Pdf;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>
/// Cell-level accuracy (cells read right / cells present) over every PDF fixture: the calc packages printed by
/// chromium (against the tables they print, kept next to them as <c>*.expected.csv</c>) and the fixtures the writer
/// sets in every layout (against what it printed). Run with <c>--logger "console;verbosity=detailed"</c> to see the
/// numbers.
/// </summary>
public class PdfAccuracyTests(ITestOutputHelper output)
{
    public static IEnumerable<object[]> Committed() =>
    [
        ["demo/footbridge"], ["demo/shed-frame"], ["demo/mezzanine-frame"],
        ["pdf/four-span-floor-beam"], ["pdf/portal-frame-decimal-comma"], ["pdf/propped-cantilever-plain-text"], ["pdf/sideways-two-span-beam"], ["pdf/us-canopy-beam-grid"],
    ];

    [Theory]
    [MemberData(nameof(Committed))]
    public void CommittedFixture_EveryCellIsReadRight(string name)
    {
        string stem = Path.Combine(RepoPaths.Root, "fixtures", name);
        var reference = SubmissionPdf.ReadCsv(stem + ".expected.csv");
        var reading = PdfSubmissionReader.Extract(stem + ".pdf");
        var score = CellAccuracy.Compare(reference, reading.Tables);
        output.WriteLine($"{name}.pdf: {score}");
        score.Misses.ShouldBeEmpty();
        score.Right.ShouldBe(score.Present);
        score.Present.ShouldBeGreaterThan(30);
    }

    [Fact]
    public void GeneratedFixtures_EveryCellIsReadRight_InEveryLayout()
    {
        using var t = new TempSubmission();
        int right = 0, present = 0;
        var failures = new List<string>();
        foreach (var layout in PdfRoundTripTests.Layouts)
        {
            foreach (var submission in PdfRoundTripTests.Submissions)
            {
                string csv = PdfRoundTripTests.Source(submission, t);
                var (pdf, printed) = SubmissionPdf.RenderWithTruth(SubmissionPdf.ReadCsv(csv), layout);
                string path = PdfTestData.Save(t, $"{submission}-{layout.Name}.pdf", pdf);
                var score = CellAccuracy.Compare(printed, PdfSubmissionReader.Extract(path).Tables);
                output.WriteLine($"{submission} / {layout.Name}: {score}");
                right += score.Right;
                present += score.Present;
                if (score.Misses.Count > 0) failures.Add($"{submission} / {layout.Name}: {string.Join("; ", score.Misses.Take(5))}");
            }
        }
        output.WriteLine($"all generated fixtures: {right}/{present}");
        failures.ShouldBeEmpty();
        right.ShouldBe(present);
    }
}
