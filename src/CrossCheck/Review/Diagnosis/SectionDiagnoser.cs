using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review.Diagnosis.Families;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// Explains differing span-moment, shear and envelope claims of a case as <see cref="Diagnoser"/> explains end moments:
/// every hypothesis recomputes the claims the author would have written with one mistake (a wrong factor or a case left out
/// of a combination, pattern loading ignored, the span moment taken at mid-span or as the free moment, the shears of a
/// simple beam), scored by the share of the squared differences it removes and ranked by <see cref="HypothesisRanking"/>.
/// Each kind of claim is diagnosed on its own (its own unit and band).
/// </summary>
public sealed class SectionDiagnoser
{
    /// <summary>The families tried, in order. To add one, add a class and a line here.</summary>
    private static readonly ISectionFamily[] Families =
    [
        new CombinationFactorFamily(),
        new CombinationCaseMissingFamily(),
        new PatternIgnoredFamily(),
        new MidspanNotMaximumFamily(),
        new FreeMomentFamily(),
        new ShearWithoutMomentFamily(),
    ];

    private readonly Submission _s;
    private readonly AnalysisResult _analysis;

    public SectionDiagnoser(Submission submission, AnalysisResult analysis, ReviewOptions options)
    {
        _s = submission;
        _analysis = analysis;
        _ = options;
    }

    /// <summary>True when the case has a span-moment or shear claim that differs, or an envelope claim on the unsafe side.</summary>
    public static bool HasDifferences(CaseReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.SpanMoments.Any(x => x.Status is EndStatus.Minor or EndStatus.Discrepant)
               || review.Shears.Any(x => x.Status is EndStatus.Minor or EndStatus.Discrepant)
               || review.Envelope.Any(x => x.Side == EnvelopeSide.Unsafe);
    }

    /// <summary>Likely causes, best first for each kind of claim (span moments, shears, envelope).</summary>
    public IReadOnlyList<Cause> Diagnose(CaseReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var causes = new List<Cause>();
        var kinds = new (SectionKind Kind, List<SectionClaim> Claims, ToleranceBand Band, bool Differs)[]
        {
            (SectionKind.SpanMoment, review.SpanMoments.Where(f => f.Recomputed is not null).Select(f => new SectionClaim(f.Key, f.Claimed, f.Recomputed!.Value)).ToList(),
                review.Band, review.SpanMoments.Any(f => f.Status is EndStatus.Minor or EndStatus.Discrepant)),
            (SectionKind.Shear, review.Shears.Where(f => f.Recomputed is not null).Select(f => new SectionClaim(f.Key, f.Claimed, f.Recomputed!.Value)).ToList(),
                review.ShearBand, review.Shears.Any(f => f.Status is EndStatus.Minor or EndStatus.Discrepant)),
            (SectionKind.Envelope, review.Envelope.Where(f => f.Recomputed is not null).Select(f => new SectionClaim(f.Key, f.Claimed, f.Recomputed!.Value, f.AllLoaded)).ToList(),
                review.Band, review.Envelope.Any(f => f.Side == EnvelopeSide.Unsafe)),
        };
        foreach (var (kind, claims, band, differs) in kinds)
        {
            if (!differs || claims.Count == 0) continue;
            var x = new SectionContext(_s, _analysis, review, kind, claims, band);
            var hypotheses = new List<Hypothesis>();
            foreach (var family in Families)
            {
                try { hypotheses.AddRange(family.Propose(x)); }
                catch (Exception ex) when (ex is StructureException or NotSupportedException or ArgumentException or InvalidOperationException)
                {
                    // A hypothesis that cannot be formed for this structure does not apply.
                }
            }
            foreach (var r in HypothesisRanking.Rank(hypotheses, x.Claimed, x.Recomputed, band.Agree, band.Minor))
                causes.Add(ToCause(r, x));
        }
        return causes;
    }

    private static Cause ToCause(HypothesisRanking.Ranked r, SectionContext x)
    {
        string fit = r.Reproduces
            ? $"Redoing the {Words(x.Kind)} with this mistake reproduces every claimed figure within tolerance."
            : string.Create(CultureInfo.InvariantCulture, $"Redoing the {Words(x.Kind)} with this mistake accounts for {r.Explains * 100:0} % of the differences.");
        var explained = new List<SectionKey>();
        for (int i = 0; i < x.Claims.Count; i++)
            if (Math.Abs(x.Claimed[i] - x.Recomputed[i]) > x.Band.Agree && Math.Abs(x.Claimed[i] - r.H.Predicted[i]) <= x.Band.Agree) explained.Add(x.Claims[i].Key);
        return new Cause(r.H.Code, Math.Round(r.Confidence, 3), Math.Round(r.Explains, 3), r.H.Message, (fit + " " + r.H.Evidence).Trim())
        {
            Identity = r.H.Identity.Length > 0 ? r.H.Identity : r.H.Code.Json(),
            CorrectWorking = r.H.CorrectWorking,
            Place = r.H.Place,
            Reproduces = r.Reproduces,
            Claims = x.Kind switch { SectionKind.SpanMoment => "span-moments", SectionKind.Shear => "shears", _ => "envelope" },
            ExplainedSections = explained,
        };
    }

    private static string Words(SectionKind kind) => kind switch
    {
        SectionKind.SpanMoment => "span moments",
        SectionKind.Shear => "shears",
        _ => "envelope",
    };
}
