using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// One tested mistake: the claims the author would have written had they made it (<see cref="Predicted"/>, clockwise
/// N·m, in the order of <see cref="DiagnosisContext.Keys"/>) and the sentence that names it.
/// </summary>
/// <param name="Code">Which mistake.</param>
/// <param name="Simplicity">Rank among mistakes that reproduce the claims equally well: the lower, the simpler (ties go to the simpler mistake).</param>
/// <param name="Predicted">The claims the mistake predicts.</param>
/// <param name="Message">What the author appears to have done, quoting the author's figures as written.</param>
internal sealed record Hypothesis(CauseCode Code, int Simplicity, double[] Predicted, string Message)
{
    /// <summary>Supporting detail for the memo.</summary>
    public string Evidence { get; init; } = "";

    /// <summary>What identifies this one mistake across cases (see <see cref="Cause.Identity"/>).</summary>
    public string Identity { get; init; } = "";

    /// <summary>Where the mistake is, when it is at one place.</summary>
    public Place? Place { get; init; }

    /// <summary>What the correct working gives, in the trade's words.</summary>
    public string CorrectWorking { get; init; } = "";

    /// <summary>Upper bound on the confidence (for hypotheses that fit more easily than they should).</summary>
    public double ConfidenceCap { get; init; } = 1;
}

/// <summary>
/// A family of related mistakes (sidesway ignored, a wrong fixed-end moment, ...). Each proposes hypotheses for one
/// case; every hypothesis changes only its one thing and keeps the rest of the model as submitted (support movements,
/// hinges, the other loads). To add a family, add a class and a line in <see cref="Diagnoser"/>.
/// </summary>
internal interface IHypothesisFamily
{
    IEnumerable<Hypothesis> Propose(DiagnosisContext x);
}

/// <summary>What every hypothesis family of one case may use.</summary>
/// <param name="s">The submission.</param>
/// <param name="analysis">The independent analysis of it.</param>
/// <param name="options">The reviewer's tolerances.</param>
/// <param name="loadCase">The load case diagnosed.</param>
/// <param name="review">The case's review (statuses, flags, the table audit).</param>
/// <param name="ends">The ends compared: claimed, recomputed and with a resolved end.</param>
internal sealed class DiagnosisContext(Submission s, AnalysisResult analysis, ReviewOptions options, LoadCase loadCase, CaseReview review,
    List<EndMomentFinding> ends)
{
    private readonly FrameSolver _solver = new();
    private StructureModel? _still;

    public Submission S { get; } = s;
    public StructureModel Model => S.Model;
    public AnalysisResult Analysis { get; } = analysis;
    public ReviewOptions Options { get; } = options;
    public LoadCase Case { get; } = loadCase;
    public CaseReview Review { get; } = review;

    /// <summary>The ends compared, in the order of <see cref="Keys"/>, <see cref="Claimed"/> and <see cref="Recomputed"/>.</summary>
    public List<EndMomentFinding> Ends { get; } = ends;

    public List<EndKey> Keys { get; } = [.. ends.Select(e => e.Key!.Value)];
    public double[] Claimed { get; } = [.. ends.Select(e => e.Claimed!.Value)];
    public double[] Recomputed { get; } = [.. ends.Select(e => e.Recomputed!.Value)];
    public Quoting Quote { get; } = new(s);

    /// <summary>The agreement band of the case (N·m).</summary>
    public double Agree => Review.AgreeTolerance;

    /// <summary>The compared ends' moments in a result.</summary>
    public double[] From(CaseResult result) => Keys.Select(k => result.EndMoment(k.Member, k.End)).ToArray();

    public double[] From(IReadOnlyDictionary<(string Member, MemberEnd End), double> moments) => Keys.Select(k => moments[(k.Member, k.End)]).ToArray();

    /// <summary>One case on an altered model (support movements and everything else as given unless the model changes them).</summary>
    public CaseResult SolveAltered(StructureModel model, LoadCase loadCase, bool hold = false) => _solver.Solve(model, [loadCase], hold).Cases[0];

    /// <summary>
    /// The response of the structure to loads alone, for superposition: the submitted model without its support
    /// movements (which the solver applies in every case, and which the recomputed moments already hold once).
    /// </summary>
    public IReadOnlyList<CaseResult> SolveLoadsAlone(IReadOnlyList<LoadCase> cases) => _solver.Solve(Still, cases).Cases;

    private StructureModel Still => _still ??= Model.HasSupportMovements
        ? new StructureModel(Model.Joints.Select(j => j with { Movement = default }).ToList(), Model.Members, Model.Axial, Model.RelativeStiffness)
        : Model;

    /// <summary>A moment that belongs to no member end, in the author's unit.</summary>
    public string Moment(double si) => Quote.Moment(si);

    /// <summary>A clockwise end moment in the author's unit and convention.</summary>
    public string EndMoment(double clockwise, MemberEnd end) => Quote.EndMoment(clockwise, end);

    /// <summary>"point load 40 kN at 4 m (calc.csv line 33)", from the load's shape (any load kind).</summary>
    public string Describe(MemberLoad load)
    {
        string where = load.Source.Citation;
        return load.Shape() switch
        {
            ConcentratedForce p => $"point load {Quote.LoadForce(p.P)} at {Quote.Length(p.A)} ({where})",
            LinearlyVaryingLoad d when d.WStart == d.WEnd => $"uniform load {Quote.LineLoad(d.WStart)} ({where})",
            LinearlyVaryingLoad d => $"linear load {Quote.LineLoad(d.WStart)} to {Quote.LineLoad(d.WEnd)} ({where})",
            ConcentratedCouple c => $"couple {Quote.Moment(Math.Abs(c.M))} at {Quote.Length(c.A)} ({where})",
            _ => $"load ({where})",
        };
    }

    /// <summary>A load in words with its place: "point load 40 kN at 4 m (...) on member BC".</summary>
    public string LoadWords(Load l) => l switch
    {
        MemberLoad ml => $"{Describe(ml)} on member {ml.Member}",
        JointForce f => $"{Quote.LoadForce(f.P)} force at joint {f.Joint} ({l.Source.Citation})",
        JointCouple c => $"couple {Quote.Moment(Math.Abs(c.M))} at joint {c.Joint} ({l.Source.Citation})",
        _ => $"load ({l.Source.Citation})",
    };

    /// <summary>The fixed-end moments (clockwise, N·m) of one load on member <paramref name="m"/>, from statics of the member alone.</summary>
    public (double Start, double End) FixedEndMoments(Member m, MemberLoad load)
    {
        var single = new LoadCase("·", [load with { Case = "·" }]);
        return new ClaimStatics(S with { Cases = [single] }).FixedEndMoments("·", m);
    }

    /// <summary>"−57.6 kN·m at B and 38.4 kN·m at C" for a member's fixed-end moments in the author's convention.</summary>
    public string FemPair(Member m, double start, double end) =>
        $"{EndMoment(start, MemberEnd.Start)} at {m.Start} and {EndMoment(end, MemberEnd.End)} at {m.End}";

    public static string Number(double v, string format = "0.###") => Fmt.Number(v, format);
}
