using CrossCheck.Import;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// Property: how a calc package lays its tables out does not change its review. A demo submission printed with its
/// columns in a random order, each header a random one of its names and synonyms (or <c>Load</c> for the load kinds, a
/// synonym of <c>P</c> that only the cells can settle), and prose between the tables, reviews to the same findings as
/// the CSV. <c>CROSSCHECK_PROPERTY_COUNT</c> sets the number of layouts tried (CI: 24).
/// </summary>
public partial class ColumnRolePropertyTests
{
    private static readonly string[] Demos = ["footbridge.csv", "shed-frame"];

    /// <summary>Spellings outside the synonym list that the cells settle (the header names another column, or none).</summary>
    private static readonly Dictionary<(string Table, string Column), string[]> ByContents = new()
    {
        [("loads", "kind")] = ["Load"],
    };

    [Fact]
    public void ShuffledColumns_SynonymHeaders_AndProse_DoNotChangeTheReview()
    {
        var expected = Demos.ToDictionary(d => d, d => Findings(CliRunner.Demo(d)));
        int count = int.TryParse(Environment.GetEnvironmentVariable("CROSSCHECK_PROPERTY_COUNT"), out int n) ? n : 24;
        Gen.Select(Gen.Int[0, Demos.Length - 1], Gen.Int[0, 1_000_000], Gen.Bool).Sample((demo, variant, prose) =>
        {
            var rng = new Random(variant);
            var layout = new Layout($"property-{variant}") { ShuffleVariant = variant, Prose = prose, Rename = (table, column) => Pick(table, column, rng) };
            using var t = new TempSubmission();
            string pdf = PdfTestData.Save(t, $"{Path.GetFileNameWithoutExtension(Demos[demo])}-{variant}.pdf",
                SubmissionPdf.Render(SubmissionPdf.ReadCsv(CliRunner.Demo(Demos[demo])), layout));
            Findings(pdf).ShouldBe(expected[Demos[demo]], $"{Demos[demo]}, variant {variant}, prose {prose}");
        }, iter: count, threads: 1);
    }

    /// <summary>The review's findings, with round-off zeros (a moment of 10⁻¹¹ N·m at a pinned end) written as 0: the order of a table's columns may change the last bits.</summary>
    private static List<string> Findings(string path) =>
        PdfFixtureReviewTests.Findings(PdfFixtureReviewTests.ReviewOf(path)).Select(f => RoundOff().Replace(f, "0")).ToList();

    [System.Text.RegularExpressions.GeneratedRegex(@"-?\d(?:\.\d+)?E-\d+|-0(?=\s|$)")]
    private static partial System.Text.RegularExpressions.Regex RoundOff();

    /// <summary>A name of the column: its own, a synonym that reads back as it, or a spelling its cells settle.</summary>
    private static string Pick(string table, string column, Random rng)
    {
        var spec = TableSchema.Find(table)!;
        var c = spec.Column(column);
        var names = new[] { c.Name }.Concat(c.Synonyms)
            .Where(s => TableSchema.ResolveColumn(spec, s) == c && !TableSchema.IsRelativeStiffness(s))
            .Concat(ByContents.GetValueOrDefault((spec.Name, c.Name), []))
            .ToList();
        string pick = names[rng.Next(names.Count)];
        return rng.Next(3) == 0 ? pick.ToUpperInvariant() : pick;
    }
}
