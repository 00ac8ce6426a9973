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
/// <param name="Submission">The submission under review.</param>
/// <param name="Options">The reviewer's tolerances.</param>
/// <param name="Statics">Statics of single members from the claimed moments and the member's loads.</param>
/// <param name="Kinematics">The joint and chord rotations the supports and rigid members allow.</param>
/// <param name="Case">The load case checked.</param>
/// <param name="Claims">The claimed member-end moments of the case that name an end the model has.</param>
/// <param name="Band">The moment bands of the checks: the reviewer's tolerances on the largest claimed moment of the case.</param>
internal sealed record CheckContext(Submission Submission, ReviewOptions Options, ClaimStatics Statics, Kinematics Kinematics, LoadCase Case,
    IReadOnlyDictionary<EndKey, ClaimedEndMoment> Claims, ToleranceBand Band)
{
    public StructureModel Model => Submission.Model;

    public Quoting Quote { get; } = new(Submission);

    private Dictionary<string, double>? _couples;

    /// <summary>The couple applied at a joint in this case (clockwise, N·m).</summary>
    public double AppliedCouple(string joint)
    {
        if (_couples is null)
        {
            _couples = new Dictionary<string, double>(StringComparer.Ordinal);
            foreach (var l in Case.Loads.OfType<JointCouple>()) _couples[l.Joint] = _couples.GetValueOrDefault(l.Joint) + l.M;
        }
        return _couples.GetValueOrDefault(joint);
    }
}

/// <summary>The checks of the claimed numbers, in the order the memo lists them. To add a check, add a class and a line here.</summary>
internal sealed class ClaimChecks
{
    internal static readonly IClaimCheck[] All =
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

    public List<Flag> Run(string caseId, CancellationToken cancel = default)
    {
        var flags = new List<Flag>();
        if (Context(caseId) is not { } context) return flags;
        foreach (var check in All)
        {
            cancel.ThrowIfCancellationRequested();
            check.Run(context, flags);
        }
        return flags;
    }

    /// <summary>One check of one case (for measurements).</summary>
    internal void RunOne(string caseId, IClaimCheck check, List<Flag> flags)
    {
        if (Context(caseId) is { } context) check.Run(context, flags);
    }

    private CheckContext? Context(string caseId)
    {
        var claims = _s.Claims.EndMoments.Where(c => c.Case == caseId && c.End is not null)
            .ToDictionary(c => new EndKey(c.Member, c.End!.Value));
        var spans = _s.Claims.SpanMoments.Where(c => c.Case == caseId).ToList();
        bool others = spans.Count > 0 || _s.Claims.Shears.Any(c => c.Case == caseId) || _s.Claims.Envelopes.Any(c => c.Combination == caseId);
        if (claims.Count == 0 && !others) return null;
        double peak = claims.Values.Select(c => Math.Abs(c.Moment)).Concat(spans.Select(c => Math.Abs(c.Moment))).DefaultIfEmpty(0).Max();
        var band = ToleranceBand.For(_options, peak, _options.AbsoluteTolerance * _s.Info.Units.Moment.ToSi);
        return new CheckContext(_s, _options, _statics, _kinematics, _s.Case(caseId) ?? new LoadCase(caseId, []), claims, band);
    }
}
