using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review.Diagnosis.Families;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// Explains the discrepancies of a load case by testing hypotheses about the author's mistake. Every hypothesis
/// recomputes the moments the author would have claimed had they made that mistake — from an altered model, an
/// altered method (moment distribution stopped early, a wrong carry-over factor), or a transformation of the
/// correct answer — and is scored by how much of the difference between claims and recomputed moments it
/// accounts for. Nothing is looked up or hard-coded: a cause is reported only when its recomputation matches.
/// </summary>
public sealed class Diagnoser
{
    /// <summary>The families of mistakes tried, in order. To add one, add a class and a line here.</summary>
    internal static readonly IHypothesisFamily[] Families =
    [
        new WorkingSlipFamily(),
        new SignConventionFamily(),
        new EndsSwappedFamily(),
        new UnitScaleFamily(),
        new CopyingSlipFamily(),
        new SwayOmittedFamily(),
        new StiffnessWithoutLengthFamily(),
        new FarEndFixityFamily(),
        new FixedEndMomentFamily(),
        new CarryOverFamily(),
        new StoppedEarlyFamily(),
        new LoadMisplacedFamily(),
        new HingeIgnoredFamily(),
        new SettlementIgnoredFamily(),
        new CombinationFactorFamily(),
        new CombinationCaseMissingFamily(),
    ];

    private readonly Submission _s;
    private readonly AnalysisResult _analysis;
    private readonly ReviewOptions _o;
    private readonly DiagnosisSolver _solver;

    /// <summary>A diagnoser for every case of one review: the structure is factorised once and shared by all of them.</summary>
    public Diagnoser(Submission submission, AnalysisResult analysis, ReviewOptions options)
    {
        ArgumentNullException.ThrowIfNull(submission);
        _s = submission;
        _analysis = analysis;
        _o = options;
        _solver = new DiagnosisSolver(submission.Model);
    }

    /// <summary>Hypotheses scored against the claims by this diagnoser so far (the others were screened out unformed).</summary>
    internal int Tried { get; private set; }

    /// <summary>Linear solves and factorisations this diagnoser made (for measurements).</summary>
    internal (int Solves, int Factorisations) Work => (_solver.Solves, _solver.Factorisations);

    /// <summary>Likely causes of the case's discrepancies, best first; empty when nothing explains them.</summary>
    /// <exception cref="OperationCanceledException"><paramref name="cancel"/> was cancelled (checked before every hypothesis).</exception>
    public IReadOnlyList<Cause> Diagnose(CaseReview review, CancellationToken cancel = default)
    {
        ArgumentNullException.ThrowIfNull(review);
        var ends = review.EndMoments.Where(e => e.Claimed is not null && e.Recomputed is not null && e.End is not null).ToList();
        if (ends.Count < 2) return [];
        var loadCase = _s.Case(review.Case);
        if (loadCase is null) return [];
        var x = new DiagnosisContext(_s, _analysis, _o, loadCase, review, ends, _solver);
        double[] c = x.Claimed, r = x.Recomputed;
        double res0 = HypothesisRanking.SquaredDistance(c, r);
        if (HypothesisRanking.LargestDistance(c, r) <= review.AgreeTolerance) return [];

        // Each hypothesis is scored as it is formed, and kept only when it passes: no family's predictions pile up.
        double agree = review.AgreeTolerance, minor = review.MinorTolerance;
        var kept = new List<HypothesisRanking.Fit>();
        int index = 0;
        for (int f = 0; f < Families.Length; f++)
        {
            cancel.ThrowIfCancellationRequested();
            try
            {
                foreach (var h in Families[f].Propose(x))
                {
                    cancel.ThrowIfCancellationRequested();
                    Tried++;
                    if (HypothesisRanking.Score(h, c, res0, agree, minor, f, index++) is { } fit) kept.Add(fit);
                }
            }
            catch (Exception ex) when (ex is StructureException or NotSupportedException or ArgumentException or InvalidOperationException)
            {
                // A hypothesis that cannot be formed for this structure (e.g. a mechanism) simply does not apply.
            }
        }
        return HypothesisRanking.Best(kept, agree, minor).Select(r => ToCause(r, x)).ToList();
    }

    private static Cause ToCause(HypothesisRanking.Ranked s, DiagnosisContext x)
    {
        double agree = x.Agree;
        string fit = s.Worst <= agree
            ? "Redoing the analysis with this mistake reproduces every claimed moment within tolerance."
            : string.Create(CultureInfo.InvariantCulture,
                $"Redoing the analysis with this mistake accounts for {s.Explains * 100:0} % of the differences (largest remaining difference {x.Moment(s.Worst)}).");
        var explained = new List<EndKey>();
        for (int i = 0; i < x.Keys.Count; i++)
            if (Math.Abs(x.Claimed[i] - x.Recomputed[i]) > agree && Math.Abs(x.Claimed[i] - s.H.Predicted[i]) <= agree) explained.Add(x.Keys[i]);
        return new Cause(s.H.Code, Math.Round(s.Confidence, 3), Math.Round(s.Explains, 3), s.H.Message, (fit + " " + s.H.Evidence).Trim())
        {
            Identity = s.H.Identity.Length > 0 ? s.H.Identity : s.H.Code.Json(),
            CorrectWorking = s.H.CorrectWorking,
            Place = s.H.Place,
            Reproduces = s.Worst <= agree,
            Explained = explained,
        };
    }
}
