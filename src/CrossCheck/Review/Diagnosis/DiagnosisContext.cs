using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>What every hypothesis family of one case may use: the compared ends, the shared solves and the evidence.</summary>
internal sealed class DiagnosisContext : CaseClaimsContext
{
    private readonly Dictionary<EndKey, int> _index;
    private Dictionary<string, List<int>>? _byMember;

    public DiagnosisContext(Submission submission, AnalysisResult analysis, ReviewOptions options, LoadCase loadCase, CaseReview review,
        List<EndMomentFinding> ends, DiagnosisSolver solver)
        : base(submission, analysis, review, ends.Select(e => e.Claimed!.Value).ToArray(), ends.Select(e => e.Recomputed!.Value).ToArray())
    {
        Options = options;
        Case = loadCase;
        Ends = ends;
        Solver = solver;
        Keys = ends.Select(e => e.Key!.Value).ToList();
        _index = new Dictionary<EndKey, int>(Keys.Count);
        for (int i = 0; i < Keys.Count; i++) _index.TryAdd(Keys[i], i);
        Evidence = new Evidence(this);
    }

    public ReviewOptions Options { get; }
    public LoadCase Case { get; }

    /// <summary>The ends compared, in the order of <see cref="Keys"/>, <see cref="CaseClaimsContext.Claimed"/> and <see cref="CaseClaimsContext.Recomputed"/>.</summary>
    public List<EndMomentFinding> Ends { get; }

    public List<EndKey> Keys { get; }

    /// <summary>The solves of the review, shared by every case and hypothesis.</summary>
    public DiagnosisSolver Solver { get; }

    /// <summary>Where the claims differ from the analysis, and the screens that use it.</summary>
    public Evidence Evidence { get; }

    /// <summary>Every hypothesis is formed and scored, none screened out (to check the focused search against).</summary>
    public bool Exhaustive => Options.Search == DiagnosisSearch.Exhaustive;

    /// <summary>The agreement band of the case (N·m).</summary>
    public double Agree => Review.AgreeTolerance;

    /// <summary>Position of a compared end in <see cref="Keys"/> (the first, if it is claimed twice), or −1.</summary>
    public int IndexOf(EndKey key) => _index.TryGetValue(key, out int i) ? i : -1;

    /// <summary>Positions in <see cref="Keys"/> of every compared end of a member.</summary>
    public IReadOnlyList<int> IndicesOf(string member)
    {
        if (_byMember is null)
        {
            _byMember = new Dictionary<string, List<int>>(StringComparer.Ordinal);
            for (int i = 0; i < Keys.Count; i++)
            {
                if (!_byMember.TryGetValue(Keys[i].Member, out var list)) _byMember[Keys[i].Member] = list = [];
                list.Add(i);
            }
        }
        return _byMember.TryGetValue(member, out var found) ? found : [];
    }

    /// <summary>The compared ends' moments in a result.</summary>
    public double[] From(CaseResult result) => Keys.Select(k => result.EndMoment(k.Member, k.End)).ToArray();

    public double[] From(IReadOnlyDictionary<(string Member, MemberEnd End), double> moments) => Keys.Select(k => moments[(k.Member, k.End)]).ToArray();

    /// <summary>The case on an altered structure (support movements and everything else as that structure has them).</summary>
    public double[] SolveAltered(StructureModel model) => Solver.Altered(model, Case, Keys);

    /// <summary>
    /// The compared end moments caused by <paramref name="loads"/> alone on the structure without its support movements (which the
    /// solver applies in every case, and which the recomputed moments already hold once), for superposition.
    /// </summary>
    public double[] LoadEffect(IReadOnlyList<Load> loads) => Solver.LoadEffect(loads, Keys);

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
