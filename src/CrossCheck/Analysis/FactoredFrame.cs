using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>A member end by element index (the order of the model's members).</summary>
internal readonly record struct EndRef(int Element, MemberEnd End);

/// <summary>
/// One factorisation of a structure's reduced stiffness matrix, kept and reused: any number of load sets solved against
/// it and superposed, the adjoint of a weighted sum of end moments (<see cref="Adjoint"/>), and small changes of the
/// structure as low-rank updates of the same factor (<see cref="FrameUpdates"/>). It gives end moments only — no
/// reactions, axial forces or equilibrium report — which is what a search over many variants of one structure needs.
/// </summary>
/// <remarks>
/// It is built only for a structure the full solver would analyse without a second look: when a pivot is small enough
/// to send <see cref="FrameSolver"/> to the mechanism search, or the constraints or the factorisation fail,
/// <see cref="TryBuild"/> returns null and the caller solves with <see cref="FrameSolver"/>, which decides.
/// </remarks>
internal sealed class FactoredFrame
{
    /// <summary>Scaled pivots below this send <see cref="FrameSolver"/> to the mechanism search (as <see cref="FrameSolution"/>).</summary>
    internal const double SuspectPivotRatio = 1e-6;

    private readonly Transformation _still;
    private readonly ILinearFactor _factor;
    private List<int>[]? _elementsAt;

    private FactoredFrame(FrameLayout frame, FrameConstraints constraints, SparseSymmetricMatrix k, ILinearFactor factor)
    {
        Frame = frame;
        Transformation = constraints.Transformation;
        Stiffness = k;
        _factor = factor;
        _still = Transformation with { Constants = new double[frame.DofCount] };
        Still = new double[frame.DofCount];
    }

    public FrameLayout Frame { get; }

    /// <summary>d = T·q + d0, with the support movements as d0.</summary>
    public Transformation Transformation { get; }

    /// <summary>The reduced stiffness matrix that was factorised.</summary>
    public SparseSymmetricMatrix Stiffness { get; }

    /// <summary>Zero joint displacements (read only).</summary>
    internal double[] Still { get; }

    /// <summary>Solves made with the factor (for measurements).</summary>
    public int Solves { get; private set; }

    /// <summary>Factorises the structure, or null when the full solver must decide (see the remarks).</summary>
    /// <param name="model">The structure.</param>
    /// <param name="loadCase">A case whose loads the constraints must accept (a couple at a moment-free joint is refused), or null.</param>
    /// <param name="holdTranslations">A braced analysis (see <see cref="FrameSolver.Solve"/>).</param>
    public static FactoredFrame? TryBuild(StructureModel model, LoadCase? loadCase = null, bool holdTranslations = false)
    {
        ArgumentNullException.ThrowIfNull(model);
        try
        {
            var frame = new FrameLayout(model);
            frame.CheckConnectivity();
            MechanismSearch.RefuseLooseParts(frame);
            var constraints = FrameConstraints.Build(model, loadCase is null ? [] : [loadCase], holdTranslations);
            var k = StiffnessAssembly.Reduce(frame, constraints.Transformation);
            var factor = AutoSolver.Instance.Factor(k);
            return factor.MinPivotRatio < SuspectPivotRatio ? null : new FactoredFrame(frame, constraints, k, factor);
        }
        catch (Exception ex) when (ex is StructureException or SingularMatrixException)
        {
            return null;
        }
    }

    /// <summary>Solves K·q = rhs with the factor.</summary>
    public double[] Solve(double[] rhs)
    {
        Solves++;
        return _factor.Solve(rhs);
    }

    /// <summary>The case's member loads by element with their fixed-end actions.</summary>
    public CaseLoads Local(LoadCase loadCase) => LoadAssembly.LocalActions(Frame, loadCase);

    /// <summary>The reduced load vector of a case, with the support movements (Tᵀ(F − K·d0)) or without them.</summary>
    public double[] ReducedLoad(LoadCase loadCase, CaseLoads local, bool movements) =>
        LoadAssembly.ReducedLoad(Frame, movements ? Transformation : _still, loadCase, local);

    /// <summary>Joint displacements d = T·q (+ d0 with the support movements).</summary>
    public double[] Expand(double[] q, bool movements) => (movements ? Transformation : _still).Expand(q);

    /// <summary>The solution of a whole case (support movements included): its reduced displacements q.</summary>
    public double[] SolveCase(LoadCase loadCase, CaseLoads local) => Solve(ReducedLoad(loadCase, local, movements: true));

    /// <summary>Clockwise end moments at <paramref name="ends"/> from joint displacements and the case's member loads.</summary>
    /// <param name="replaced">An element to use in place of the model's own (a member altered by a hypothesis), or null.</param>
    public double[] Moments(double[] d, CaseLoads local, IReadOnlyList<EndRef> ends, MemberElement? replaced = null) =>
        Moments(d, i => local.Fixed[i], ends, replaced);

    private double[] Moments(double[] d, Func<int, double[]?> fixedOf, IReadOnlyList<EndRef> ends, MemberElement? replaced)
    {
        var result = new double[ends.Count];
        int last = -1;
        double start = 0, endMoment = 0;
        for (int i = 0; i < ends.Count; i++)
        {
            var (element, end) = ends[i];
            if (element != last)
            {
                var e = replaced is not null && replaced.Member.Id == Frame.Elements[element].Member.Id ? replaced : Frame.Elements[element];
                (start, endMoment) = EndMoments(e, d, fixedOf(element));
                last = element;
            }
            result[i] = end == MemberEnd.Start ? start : endMoment;
        }
        return result;
    }

    private readonly double[] _local = new double[6];
    private static readonly double[] NoFixed = new double[6];

    /// <summary>
    /// The clockwise end moments of one member, as <see cref="FrameRecovery.EndForces"/> gives them (the same arithmetic
    /// in the same order), without its allocations: the search asks for thousands.
    /// </summary>
    internal (double Start, double End) EndMoments(MemberElement e, double[] d, double[]? fixedLocal)
    {
        var dofs = e.Dofs;
        double c = e.Cos, s = e.Sin;
        var dl = _local;
        dl[0] = (c * d[dofs[0]]) + (s * d[dofs[1]]);
        dl[1] = (-s * d[dofs[0]]) + (c * d[dofs[1]]);
        dl[2] = d[dofs[2]];
        dl[3] = (c * d[dofs[3]]) + (s * d[dofs[4]]);
        dl[4] = (-s * d[dofs[3]]) + (c * d[dofs[4]]);
        dl[5] = d[dofs[5]];
        var f = fixedLocal ?? NoFixed;
        ElementMatrices.RecoverReleased(e.LocalK, f, e.Released, dl);
        double m1 = f[2], m2 = f[5];
        for (int b = 0; b < 6; b++)
        {
            m1 += e.LocalK[2, b] * dl[b];
            m2 += e.LocalK[5, b] * dl[b];
        }
        return (-m1, -m2);
    }

    /// <summary>
    /// The end moments at <paramref name="ends"/> caused by <paramref name="loads"/> alone, without the support movements:
    /// one solve with the factor. For superposing the effect of a load added, left out or moved.
    /// </summary>
    public double[] LoadEffect(IReadOnlyList<Load> loads, IReadOnlyList<EndRef> ends)
    {
        // The loads' joint forces and fixed-end actions gathered where they act, not over the whole structure.
        var f = new double[Frame.DofCount];
        var fixedLocal = new Dictionary<int, double[]>();
        foreach (var load in loads)
        {
            var (actions, element) = Scatter(load, (dof, v) => f[dof] += v);
            if (actions is null) continue;
            if (fixedLocal.TryGetValue(element, out var sum)) for (int a = 0; a < 6; a++) sum[a] += actions[a];
            else fixedLocal[element] = actions;
        }
        var d = _still.Expand(Solve(_still.Reduce(f)));
        return Moments(d, i => fixedLocal.GetValueOrDefault(i), ends, null);
    }

    /// <summary>
    /// The adjoint of Σ wᵢ·Mᵢ over <paramref name="ends"/>: one solve, after which the weighted sum of the end moments any
    /// load causes is a few multiplications (<see cref="Adjoint.Of(Load)"/>).
    /// </summary>
    public Adjoint AdjointOf(IReadOnlyList<EndRef> ends, double[] weights)
    {
        var g = new double[Frame.DofCount];
        var zero = new double[Frame.DofCount];
        var byElement = new Dictionary<int, (double Start, double End)>();
        for (int i = 0; i < ends.Count; i++)
        {
            if (weights[i] == 0) continue;
            var (element, end) = ends[i];
            var old = byElement.GetValueOrDefault(element);
            byElement[element] = end == MemberEnd.Start ? (old.Start + weights[i], old.End) : (old.Start, old.End + weights[i]);
        }
        foreach (var (element, (ws, we)) in byElement)
        {
            // The end moments are linear in the member's six joint displacements: their gradient, one unit displacement at a time.
            var e = Frame.Elements[element];
            for (int a = 0; a < 6; a++)
            {
                zero[e.Dofs[a]] = 1;
                var f = FrameRecovery.EndForces(e, zero, null, out _);
                zero[e.Dofs[a]] = 0;
                g[e.Dofs[a]] += (ws * -f[2]) + (we * -f[5]);
            }
        }
        var w = Solve(_still.Reduce(g));
        return new Adjoint(this, _still.Expand(w), byElement);
    }

    /// <summary>Elements meeting at each joint (by joint index).</summary>
    public List<int>[] ElementsAt()
    {
        if (_elementsAt is not null) return _elementsAt;
        var at = new List<int>[Frame.Model.Joints.Count];
        for (int j = 0; j < at.Length; j++) at[j] = [];
        for (int i = 0; i < Frame.Elements.Length; i++)
        {
            var e = Frame.Elements[i];
            at[e.StartJoint].Add(i);
            if (e.EndJoint != e.StartJoint) at[e.EndJoint].Add(i);
        }
        return _elementsAt = at;
    }

    /// <summary>The global load vector of one load (joint loads, and member loads through their condensed fixed-end actions), and those actions.</summary>
    internal (double[]? Fixed, int Element) Scatter(Load load, Action<int, double> add)
    {
        switch (load)
        {
            case JointForce p:
            {
                int j = Frame.JointIndex[p.Joint];
                var (ux, uy) = p.Direction.Vector();
                add(3 * j, p.P * ux);
                add((3 * j) + 1, p.P * uy);
                return (null, -1);
            }
            case JointCouple c:
                add((3 * Frame.JointIndex[c.Joint]) + 2, -c.M);
                return (null, -1);
            case MemberLoad ml:
            {
                int i = Frame.ElementIndex[ml.Member];
                var e = Frame.Elements[i];
                var fixedLocal = FixedEndActions.Compute([LocalLoads.Resolve(ml, e.Cos, e.Sin)], e.Length);
                var (_, condensed) = ElementMatrices.Condense(e.LocalK, fixedLocal, e.Released);
                var g = ElementMatrices.ToGlobal(condensed, e.Cos, e.Sin);
                for (int a = 0; a < 6; a++) add(e.Dofs[a], -g[a]);
                return (fixedLocal, i);
            }
            default:
                throw new NotSupportedException($"Load kind {load.GetType().Name} is not supported.");
        }
    }
}

/// <summary>
/// The adjoint of a weighted sum of end moments Σ wᵢ·Mᵢ: the weighted sum for any load, without solving for it
/// (reciprocity: the joint displacements of the adjoint load, dotted with the load's joint forces, plus the load's own
/// fixed-end moments at the weighted ends of its member).
/// </summary>
internal sealed class Adjoint
{
    private readonly FactoredFrame _frame;
    private readonly double[] _w;
    private readonly Dictionary<int, (double Start, double End)> _weights;

    internal Adjoint(FactoredFrame frame, double[] w, Dictionary<int, (double Start, double End)> weights)
    {
        _frame = frame;
        _w = w;
        _weights = weights;
    }

    /// <summary>Σ wᵢ·Mᵢ(load): the weighted end moments caused by one load alone (no support movements).</summary>
    public double Of(Load load)
    {
        double sum = 0;
        var (fixedLocal, element) = _frame.Scatter(load, (dof, v) => sum += _w[dof] * v);
        if (element >= 0 && _weights.TryGetValue(element, out var ws))
        {
            var (start, end) = _frame.EndMoments(_frame.Frame.Elements[element], _frame.Still, fixedLocal);
            sum += (ws.Start * start) + (ws.End * end);
        }
        return sum;
    }
}
