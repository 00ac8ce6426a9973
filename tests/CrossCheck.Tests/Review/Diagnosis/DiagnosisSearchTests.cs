using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.TestTools;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Review.Diagnosis;

/// <summary>
/// The focused search (screens, candidates where the evidence is, a stated bound) must give the same review as the
/// exhaustive one, which forms and scores every hypothesis of every family: on every planted mistake of
/// <see cref="DiagnosisTests"/>, on the reference cases of <see cref="DiagnosisQualityTests"/> (correct claims, noise,
/// single slips), on the demo and fixture submissions, on a generated batch, and on frames with planted changes of the
/// structure. Compared as the whole review JSON (verdict, findings, causes, comments) and the causes in full.
/// </summary>
public class DiagnosisSearchTests(ITestOutputHelper output)
{
    private static readonly ReviewOptions Focused = new(Date: new DateOnly(2026, 12, 1));
    private static readonly ReviewOptions Exhaustive = Focused with { Search = DiagnosisSearch.Exhaustive };
    private const MemberEnd S = MemberEnd.Start, En = MemberEnd.End;

    /// <summary>Every field of every cause, so that a change of confidence, wording or order shows.</summary>
    private static string Causes(ReviewResult r) => string.Join("\n", r.Cases.SelectMany(c => c.Causes.Select(x =>
        string.Create(CultureInfo.InvariantCulture,
            $"{c.Case}|{x.Code}|{x.Confidence:R}|{x.Explains:R}|{x.Identity}|{x.Place?.Words}|{x.Reproduces}|{string.Join(",", x.Explained)}|{x.Message}|{x.Evidence}|{x.CorrectWorking}"))));

    private static (int Focused, int Exhaustive) Same(Func<ReviewOptions, ReviewResult> review, string what)
    {
        var focused = review(Focused);
        var exhaustive = review(Exhaustive);
        Causes(focused).ShouldBe(Causes(exhaustive), what);
        ReviewJson.Write(focused).ShouldBe(ReviewJson.Write(exhaustive), what);
        focused.DiagnosisWork.Tried.ShouldBeLessThanOrEqualTo(exhaustive.DiagnosisWork.Tried, what);
        return (focused.DiagnosisWork.Tried, exhaustive.DiagnosisWork.Tried);
    }

    public static TheoryData<DiagnosisTests.PlantedMistake> Mistakes => DiagnosisTests.All;

    [Theory]
    [MemberData(nameof(Mistakes))]
    public void PlantedMistakes(DiagnosisTests.PlantedMistake planted) =>
        Same(o => DiagnosisTests.Review(planted.Model(), planted.Claims(), o), planted.ToString());

    [Fact]
    public void ReferenceCases_CorrectClaimsNoiseAndSingleSlips()
    {
        int reviews = 0, focused = 0, exhaustive = 0;
        void Count((int F, int E) t) { reviews++; focused += t.F; exhaustive += t.E; }
        var rnd = new Random(20261205);
        foreach (var (id, b) in ReferenceModels.All().Where(c => c.Model.Model.Members.Count >= 2))
        {
            var r = b.Solve().Cases[0];
            var exact = b.Model.Members.SelectMany(m => new[] { (m.Id, S, r.EndMoment(m.Id, S)), (m.Id, En, r.EndMoment(m.Id, En)) }).ToArray();
            double peak = exact.Max(e => Math.Abs(e.Item3));
            Count(Same(o => DiagnosisTests.Review(b, exact, o), $"{id}, correct"));
            for (int variant = 0; variant < 3; variant++)
            {
                var noisy = exact.Select(e => (e.Item1, e.Item2, e.Item3 + (peak * (0.03 + (0.05 * rnd.NextDouble())) * (rnd.Next(2) == 0 ? -1 : 1)))).ToArray();
                Count(Same(o => DiagnosisTests.Review(b, noisy, o), $"{id}, noise {variant}"));
            }
            for (int k = 0; k < exact.Length; k++)
            {
                double written = Math.Round(exact[k].Item3 + (peak * (0.05 + (0.55 * rnd.NextDouble())) * (rnd.Next(2) == 0 ? -1 : 1)), 1);
                var slipped = exact.Select((e, i) => i == k ? (e.Item1, e.Item2, written) : (e.Item1, e.Item2, Math.Round(e.Item3, 2))).ToArray();
                Count(Same(o => DiagnosisTests.Review(b, slipped, o), $"{id}, slip at {exact[k].Item1} {exact[k].Item2}"));
            }
        }
        output.WriteLine($"{reviews} reviews: {focused} hypotheses tried focused, {exhaustive} exhaustive");
        reviews.ShouldBeGreaterThan(100);
    }

    /// <summary>The demo submissions, the timing fixture, the PDF fixtures and every catalogue entry that reads and analyses.</summary>
    public static TheoryData<string> Fixtures
    {
        get
        {
            string root = RepoPaths.Root;
            var files = new[] { "fixtures/demo", "fixtures/pdf", "fixtures/bad", "tests/CrossCheck.Benchmarks/fixtures" }
                .SelectMany(d => Directory.GetFiles(Path.Combine(root, d)))
                .Where(f => f.EndsWith(".pdf", StringComparison.Ordinal) || (f.EndsWith(".csv", StringComparison.Ordinal) && !f.EndsWith(".expected.csv", StringComparison.Ordinal)
                    && !f.EndsWith("manifest.csv", StringComparison.Ordinal)))
                .Select(f => Path.GetRelativePath(root, f)).Order(StringComparer.Ordinal);
            return new TheoryData<string>(files);
        }
    }

    [Theory]
    [MemberData(nameof(Fixtures))]
    public void FixtureSubmissions(string path)
    {
        var read = SubmissionReader.Read(Path.Combine(RepoPaths.Root, path));
        if (read.Submission is not { } s) return; // an input error: nothing to diagnose
        if (!new FrameSolver().TrySolve(s.Model, s.Cases, out var analysis, out _)) return;
        Same(o => ReviewEngine.Review(s, analysis, o), path);
    }

    [Fact]
    public void GeneratedSubmissions()
    {
        using var batch = new GeneratedBatch(BatchPlan.For(60), variant: 17);
        int reviewed = 0;
        foreach (var g in batch.Submissions)
        {
            var read = SubmissionReader.Read(g.Path);
            if (read.Submission is not { } s || !new FrameSolver().TrySolve(s.Model, s.Cases, out var analysis, out _)) continue;
            Same(o => ReviewEngine.Review(s, analysis, o), $"{g.Name} ({g.Planted})");
            reviewed++;
        }
        reviewed.ShouldBeGreaterThan(40);
    }

    /// <summary>Office frames with one planted mistake: the same review, from far fewer hypotheses.</summary>
    [Theory]
    [InlineData(BuildingMistake.FixedEndMoment, 1)]
    [InlineData(BuildingMistake.CopyingSlip, 2)]
    [InlineData(BuildingMistake.LoadMoved, 3)]
    [InlineData(BuildingMistake.WrongClaim, 4)]
    [InlineData(BuildingMistake.None, 5)]
    public void BuildingFrames_SameReviewFromFewerHypotheses(BuildingMistake mistake, int variant)
    {
        using var temp = new TempSubmission();
        string path = Path.Combine(temp.Folder, "frame.csv");
        BuildingFrame.Write(path, storeys: 6, bays: 5, mistake, variant);
        var s = SubmissionReader.Read(path).Submission!;
        var analysis = new FrameSolver().Solve(s.Model, s.Cases);
        var (focused, exhaustive) = Same(o => ReviewEngine.Review(s, analysis, o), mistake.ToString());
        output.WriteLine($"{mistake}: {focused} hypotheses tried focused, {exhaustive} exhaustive");
        if (mistake != BuildingMistake.None) focused.ShouldBeLessThan(exhaustive / 4);
    }

    /// <summary>
    /// Random frames with hinges and pinned bases, claimed from the frame with one change — a hinge ignored, a support's
    /// fixity mistaken, a load left out — so that the member-local families and their bounds are exercised.
    /// </summary>
    [Fact]
    public void RandomFramesWithAPlantedChange()
    {
        int compared = 0;
        for (int variant = 0; variant < 24; variant++)
        {
            var b = RandomFrames.Build(new FrameShape(2 + (variant % 3), 2 + (variant % 2), variant % 2 == 0, Elastic: false, Hinges: true, variant));
            var model = b.Model;
            var c = b.Cases[0];
            var rnd = new Random(variant);
            StructureModel author = model;
            var authorCase = c;
            switch (variant % 3)
            {
                case 0 when model.Members.Any(m => m.Hinge != Hinge.None):
                {
                    var hinged = model.Members.Where(m => m.Hinge != Hinge.None).ToList();
                    string id = hinged[rnd.Next(hinged.Count)].Id;
                    author = new StructureModel(model.Joints, model.Members.Select(m => m.Id == id ? m with { Hinge = Hinge.None } : m).ToList(), model.Axial, false);
                    break;
                }
                case 1:
                {
                    var supports = model.Joints.Where(j => j.IsSupport).ToList();
                    var j0 = supports[rnd.Next(supports.Count)];
                    var flipped = j0.Restraint.HasFlag(Restraint.Rotation) ? j0.Restraint & ~Restraint.Rotation : j0.Restraint | Restraint.Rotation;
                    author = new StructureModel(model.Joints.Select(j => j.Id == j0.Id ? j with { Restraint = flipped } : j).ToList(), model.Members, model.Axial, false);
                    break;
                }
                default:
                    authorCase = c with { Loads = c.Loads.Where((_, i) => i != rnd.Next(c.Loads.Count)).ToList() };
                    break;
            }
            if (!new FrameSolver().TrySolve(author, [authorCase], out var claimed, out _)) continue;
            var r = claimed.Cases[0];
            var claims = model.Members.SelectMany(m => new[] { (m.Id, S, Math.Round(r.EndMoment(m.Id, S), 3)), (m.Id, En, Math.Round(r.EndMoment(m.Id, En), 3)) }).ToArray();
            Same(o => DiagnosisTests.Review(b, claims, o), $"variant {variant}");
            compared++;
        }
        compared.ShouldBeGreaterThan(15);
    }
}
