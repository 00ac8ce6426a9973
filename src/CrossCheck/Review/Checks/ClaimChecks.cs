using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// A check of the claimed numbers on their own: it uses statics, kinematics and the submission's own data, never the
/// recomputed answer, so that it tells the author what kind of error is in the claims.
/// </summary>
internal interface IClaimCheck
{
    /// <summary>Adds a flag for every place where the claims of <see cref="CheckContext.Case"/> fail this check.</summary>
    void Run(CheckContext context, List<Flag> flags);
}

/// <summary>What every check of one load case may use.</summary>
internal sealed class CheckContext
{
    public CheckContext(Submission submission, ReviewOptions options, ClaimStatics statics, Kinematics kinematics, LoadCase loadCase,
        IReadOnlyDictionary<EndKey, ClaimedEndMoment> claims, ToleranceBand band)
    {
        Submission = submission;
        Options = options;
        Statics = statics;
        Kinematics = kinematics;
        Case = loadCase;
        Claims = claims;
        Band = band;
        Quote = new Quoting(submission);
    }

    public Submission Submission { get; }
    public StructureModel Model => Submission.Model;
    public ReviewOptions Options { get; }
    public ClaimStatics Statics { get; }
    public Kinematics Kinematics { get; }
    public LoadCase Case { get; }

    /// <summary>The claimed member-end moments of the case that name an end the model has.</summary>
    public IReadOnlyDictionary<EndKey, ClaimedEndMoment> Claims { get; }

    /// <summary>The moment bands of the checks: the reviewer's tolerances on the largest claimed moment of the case.</summary>
    public ToleranceBand Band { get; }

    public Quoting Quote { get; }

    /// <summary>The couple applied at a joint in this case (clockwise, N·m).</summary>
    public double AppliedCouple(string joint) => Case.Loads.OfType<JointCouple>().Where(l => l.Joint == joint).Sum(l => l.M);
}

/// <summary>The checks of the claimed numbers, in the order the memo lists them. To add a check, add a class and a line here.</summary>
internal sealed class ClaimChecks
{
    private static readonly IClaimCheck[] All =
    [
        new JointEquilibriumCheck(),
        new ReleasedEndCheck(),
        new StoreyShearCheck(),
        new CompatibilityCheck(),
        new ReactionBalanceCheck(),
        new SymmetryCheck(),
        new SuperpositionCheck(),
        new SpanStaticsCheck(),
        new ShearStaticsCheck(),
        new EnvelopeCheck(),
    ];

    private readonly Submission _s;
    private readonly ReviewOptions _options;
    private readonly ClaimStatics _statics;
    private readonly Kinematics _kinematics;

    public ClaimChecks(Submission submission, ReviewOptions options)
    {
        _s = submission;
        _options = options;
        _statics = new ClaimStatics(submission);
        _kinematics = new Kinematics(submission.Model);
    }

    public List<Flag> Run(string caseId)
    {
        var claims = _s.Claims.EndMoments.Where(c => c.Case == caseId && c.End is not null)
            .ToDictionary(c => new EndKey(c.Member, c.End!.Value));
        var flags = new List<Flag>();
        var spans = _s.Claims.SpanMoments.Where(c => c.Case == caseId).ToList();
        bool others = spans.Count > 0 || _s.Claims.Shears.Any(c => c.Case == caseId) || _s.Claims.Envelopes.Any(c => c.Combination == caseId);
        if (claims.Count == 0 && !others) return flags;
        double peak = claims.Values.Select(c => Math.Abs(c.Moment)).Concat(spans.Select(c => Math.Abs(c.Moment))).DefaultIfEmpty(0).Max();
        var band = ToleranceBand.For(_options, peak, _options.AbsoluteTolerance * _s.Info.Units.Moment.ToSi);
        var context = new CheckContext(_s, _options, _statics, _kinematics, _s.Case(caseId) ?? new LoadCase(caseId, []), claims, band);
        foreach (var check in All) check.Run(context, flags);
        return flags;
    }
}
