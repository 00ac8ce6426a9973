using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// Independent linear-elastic stiffness analysis of plane frames and continuous beams
/// (three DOF per joint, prismatic Euler–Bernoulli members, small displacements).
/// </summary>
/// <remarks>
/// Supports, prescribed movements and axially rigid members are constraints eliminated exactly
/// (<see cref="ConstraintSet"/>); end hinges are condensed out of the member stiffness. A free movement
/// that no load drives (for example a beam on rollers only, under vertical load) is restrained and noted;
/// a free movement that a load drives is reported as a mechanism naming the joint and direction.
/// </remarks>
public sealed class FrameSolver
{
    private static readonly string[] DirectionNames = ["x", "y", "rotation"];

    /// <summary>Scaled pivots below this send the structure to the mechanism check.</summary>
    private const double SuspectPivotRatio = 1e-6;

    private readonly ILinearSolver _linear;

    public FrameSolver(ILinearSolver? linear = null) => _linear = linear ?? AutoSolver.Instance;

    /// <summary>Analyses every load case.</summary>
    /// <param name="model">The structure.</param>
    /// <param name="cases">Load cases to analyse.</param>
    /// <param name="holdTranslations">Hold every joint translation the supports and rigid members leave free: a braced
    /// (no-sway) analysis, as an author who ignored sidesway would have made.</param>
    /// <exception cref="StructureException">The structure is a mechanism or otherwise cannot be analysed.</exception>
    public AnalysisResult Solve(StructureModel model, IReadOnlyList<LoadCase> cases, bool holdTranslations = false)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(cases);
        return new Run(model, cases, _linear, holdTranslations).Execute();
    }

    /// <summary>Analyses every load case, returning false with the reason instead of throwing.</summary>
    public bool TrySolve(StructureModel model, IReadOnlyList<LoadCase> cases, [NotNullWhen(true)] out AnalysisResult? result,
        [NotNullWhen(false)] out StructureException? problem)
    {
        try
        {
            result = Solve(model, cases);
            problem = null;
            return true;
        }
        catch (StructureException ex)
        {
            result = null;
            problem = ex;
            return false;
        }
    }

    private sealed class Run
    {
        private readonly StructureModel _model;
        private readonly IReadOnlyList<LoadCase> _cases;
        private readonly ILinearSolver _linear;
        private readonly Dictionary<string, int> _jointIndex;
        private readonly Element[] _elements;
        private readonly Dictionary<string, int> _elementIndex;
        private readonly List<string> _notes = [];
        private readonly int _n;

        private readonly bool _holdTranslations;

        public Run(StructureModel model, IReadOnlyList<LoadCase> cases, ILinearSolver linear, bool holdTranslations = false)
        {
            _holdTranslations = holdTranslations;
            _model = model;
            _cases = cases;
            _linear = linear;
            _jointIndex = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(t => t.Id, t => t.i, StringComparer.Ordinal);
            _n = 3 * model.Joints.Count;
            _elements = model.Members.Select(BuildElement).ToArray();
            _elementIndex = _elements.Select((e, i) => (e.Member.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        }

        private Element BuildElement(Member m)
        {
            if (!_jointIndex.TryGetValue(m.Start, out int s) || !_jointIndex.TryGetValue(m.End, out int e))
                throw new StructureException($"Member {m.Id} refers to a joint that does not exist.");
            var a = _model.Joint(m.Start);
            var b = _model.Joint(m.End);
            double dx = b.X - a.X, dy = b.Y - a.Y;
            double L = Math.Sqrt((dx * dx) + (dy * dy));
            if (!(L > 0)) throw new StructureException($"Member {m.Id} has zero length.");
            double ea = _model.Axial == AxialBehaviour.Elastic
                ? m.E * (m.A ?? throw new StructureException($"Member {m.Id} has no area A, needed for elastic axial behaviour."))
                : 0;
            var k = ElementMatrices.LocalStiffness(m.E * m.I, ea, L);
            var released = ElementMatrices.Released(m.Hinge);
            var (kc, _) = ElementMatrices.Condense(k, new double[6], released);
            return new Element(m, s, e, L, dx / L, dy / L, k, released, ElementMatrices.ToGlobal(kc, dx / L, dy / L), _model.Axial == AxialBehaviour.Elastic);
        }

        public AnalysisResult Execute()
        {
            CheckConnectivity();
            var perCase = _cases.Select(c => (Case: c, Local: LocalActions(c))).ToList();

            var extra = new List<(int Dof, string Note)>();
            for (int attempt = 0; ; attempt++)
            {
                var held = new HashSet<int>();
                var constraints = BuildConstraints(extra, held);
                var t = constraints.Build();
                var k = Reduce(t);
                var loads = perCase.Select(pc => ReducedLoad(t, pc.Case, pc.Local)).ToList();
                ILinearFactor? factor = null;
                SingularMatrixException? singular = null;
                try
                {
                    factor = _linear.Factor(k);
                }
                catch (SingularMatrixException ex)
                {
                    singular = ex;
                }
                // A tiny pivot may be a mechanism drowned in round-off or just very different stiffnesses: decide on
                // the unit-stiffness copy, whose only near-zero modes are mechanisms.
                if (singular is not null || factor!.MinPivotRatio < SuspectPivotRatio)
                {
                    var mode = MechanismMode(Reduce(t, unit: true));
                    if (mode is not null)
                    {
                        if (attempt > 3 * _model.Joints.Count) throw new StructureException("The structure could not be stabilised: it is a mechanism.", singular!);
                        extra.AddRange(FreeMovements(mode.Value.Vector, mode.Value.Scale, t, loads, perCase.Select(p => p.Case.Id).ToList()));
                        continue;
                    }
                    if (singular is not null)
                        throw new StructureException(
                            "The stiffness matrix is numerically singular although the structure is not a mechanism: the member stiffnesses differ too much " +
                            "(by more than about 10¹² between neighbours) for double precision. Check E, I and A for typing errors.", singular);
                }
                foreach (var (_, note) in extra) _notes.Add(note);
                var results = new List<CaseResult>();
                var balance = new List<CaseEquilibrium>();
                for (int c = 0; c < perCase.Count; c++)
                {
                    var q = factor!.Solve(loads[c].Reduced);
                    var d = t.Expand(q);
                    var (result, equilibrium) = Recover(perCase[c].Case, perCase[c].Local, d, constraints, held);
                    results.Add(result);
                    balance.Add(equilibrium);
                }
                double condition = 1 / Math.Max(factor!.MinPivotRatio, 1e-300);
                var report = new NumericalReport(condition, StiffnessContrast.Of(_model), balance);
                Verify(report);
                return new AnalysisResult(_model, results, _notes, condition) { Numerics = report };
            }
        }

        /// <summary>
        /// The numerical sanity layer: an ill-conditioned matrix is noted with its condition estimate and the stiffest
        /// contrast; results whose forces are out of balance beyond <see cref="NumericalLimits.EquilibriumResidual"/>
        /// are not returned at all, since the claims must not be judged against them.
        /// </summary>
        private void Verify(NumericalReport report)
        {
            var worst = report.WorstCase;
            string contrast = report.Contrast is { } k && k.Ratio >= NumericalLimits.StiffnessContrast
                ? $" Member {k.Stiffer} is {NumericalReport.Scientific(k.Ratio)} times stiffer ({k.Measure}) than member {k.Softer}, which meets it at joint {k.Joint}."
                : "";
            if (worst is not null && !report.Trusted)
            {
                string where = worst.Joint >= worst.Global && worst.AtJoint is not null
                    ? $"at joint {worst.AtJoint} ({worst.Direction}) the recovered member forces leave {NumericalReport.Scientific(worst.Joint)} of the applied load unbalanced"
                    : $"the recovered forces of the whole structure leave {NumericalReport.Scientific(worst.Global)} of the applied load unbalanced";
                throw new StructureException(
                    $"The independent analysis failed its own equilibrium check: in case {worst.Case}, {where} " +
                    $"(the limit is {NumericalReport.Scientific(NumericalLimits.EquilibriumResidual)}; condition estimate of the stiffness matrix " +
                    $"{NumericalReport.Scientific(report.ConditionEstimate)}).{contrast} Its results cannot be trusted, so the claims were not judged against them. " +
                    "Check E, I and A (and their units) for typing errors.", worst.AtJoint, worst.Direction);
            }
            if (report.IllConditioned)
                _notes.Add(report.Describe());
        }

        private void CheckConnectivity()
        {
            var touched = new HashSet<string>(StringComparer.Ordinal);
            foreach (var m in _model.Members) { touched.Add(m.Start); touched.Add(m.End); }
            foreach (var j in _model.Joints)
                if (!touched.Contains(j.Id))
                    throw new StructureException($"Joint {j.Id} is not connected to any member.", j.Id, null);
        }

        /// <summary>A case's member loads in local axes by element, with their fixed-end actions (computed once).</summary>
        private sealed record CaseLoads(LocalAction[][] Actions, double[]?[] Fixed);

        private static readonly LocalAction[] NoActions = [];

        private CaseLoads LocalActions(LoadCase loadCase)
        {
            var lists = new List<LocalAction>?[_elements.Length];
            foreach (var load in loadCase.MemberLoads)
            {
                if (!_elementIndex.TryGetValue(load.Member, out int i))
                    throw new StructureException($"A load of case {loadCase.Id} acts on member {load.Member}, which does not exist.");
                var e = _elements[i];
                (lists[i] ??= []).Add(LocalLoads.Resolve(load, e.Cos, e.Sin));
            }
            var actions = new LocalAction[_elements.Length][];
            var fixedActions = new double[]?[_elements.Length];
            for (int i = 0; i < _elements.Length; i++)
            {
                if (lists[i] is not { } list) { actions[i] = NoActions; continue; }
                actions[i] = [.. list];
                fixedActions[i] = FixedEndActions.Compute(list, _elements[i].Length);
            }
            return new CaseLoads(actions, fixedActions);
        }

        private ConstraintSet BuildConstraints(List<(int Dof, string Note)> extra, HashSet<int> held)
        {
            // A couple on a joint that cannot carry moment is an error before anything else.
            foreach (var joint in Kinematics.MomentFreeJoints(_model))
                foreach (var c in _cases)
                    if (c.Loads.OfType<JointCouple>().Any(l => l.Joint == joint.Id && l.M != 0))
                        throw new StructureException(
                            $"Case {c.Id} applies a couple at joint {joint.Id}, but every member is hinged there and no support holds its rotation, so nothing can resist it.",
                            joint.Id, "rotation");
            var cs = Kinematics.Constraints(_model);
            if (_holdTranslations)
                foreach (int dof in cs.Build().Masters.Where(d => d % 3 != 2))
                {
                    cs.Add(new Dictionary<int, double> { [dof] = 1 }, 0, ("braced", dof, 0), out _);
                    held.Add(dof);
                }
            foreach (var (dof, _) in extra)
            {
                cs.Add(new Dictionary<int, double> { [dof] = 1 }, 0, ("added", dof, 0), out _);
                held.Add(dof);
            }
            return cs;
        }

        private SparseSymmetricMatrix Reduce(Transformation t, bool unit = false)
        {
            var k = new SparseSymmetricMatrix(t.MasterCount);
            foreach (var e in _elements)
            {
                var dofs = e.Dofs;
                for (int a = 0; a < 6; a++)
                {
                    var ta = t.Terms[dofs[a]];
                    if (ta.Length == 0) continue;
                    for (int b = 0; b < 6; b++)
                    {
                        double kab = unit ? e.UnitGlobalK[a, b] : e.GlobalK[a, b];
                        if (kab == 0) continue;
                        var tb = t.Terms[dofs[b]];
                        foreach (var (ma, ca) in ta)
                            foreach (var (mb, cb) in tb)
                                if (ma >= mb) k.Add(ma, mb, ca * kab * cb);
                    }
                }
            }
            return k;
        }

        /// <summary>Full load vector F − Σ Tᵀ·f_fixed and its reduction Tᵀ(F − K·d0).</summary>
        private (double[] Full, double[] Reduced) ReducedLoad(Transformation t, LoadCase loadCase, CaseLoads local)
        {
            var f = new double[_n];
            foreach (var jl in loadCase.JointLoads)
            {
                if (!_jointIndex.TryGetValue(jl.Joint, out int j))
                    throw new StructureException($"A load of case {loadCase.Id} acts on joint {jl.Joint}, which does not exist.");
                switch (jl)
                {
                    case JointForce p:
                        var (ux, uy) = p.Direction.Vector();
                        f[3 * j] += p.P * ux;
                        f[(3 * j) + 1] += p.P * uy;
                        break;
                    case JointCouple c:
                        f[(3 * j) + 2] += -c.M;
                        break;
                }
            }
            for (int i = 0; i < _elements.Length; i++)
            {
                var e = _elements[i];
                if (local.Fixed[i] is not { } fixedLocal) continue;
                var (_, condensed) = ElementMatrices.Condense(e.LocalK, fixedLocal, e.Released);
                var g = ElementMatrices.ToGlobal(condensed, e.Cos, e.Sin);
                for (int a = 0; a < 6; a++) f[e.Dofs[a]] -= g[a];
            }
            // Subtract K·d0 for prescribed movements.
            var full = (double[])f.Clone();
            if (t.Constants.Any(c => c != 0))
            {
                foreach (var e in _elements)
                {
                    var d0 = e.Dofs.Select(i => t.Constants[i]).ToArray();
                    if (d0.All(v => v == 0)) continue;
                    for (int a = 0; a < 6; a++)
                    {
                        double s = 0;
                        for (int b = 0; b < 6; b++) s += e.GlobalK[a, b] * d0[b];
                        f[e.Dofs[a]] -= s;
                    }
                }
            }
            return (full, t.Reduce(f));
        }

        /// <summary>
        /// The mechanism mode of the unit-stiffness matrix, if it has one: inverse iteration on a slightly shifted,
        /// Jacobi-scaled copy, confirmed by its Rayleigh quotient. Null when the structure is stable.
        /// </summary>
        private (double[] Vector, double[] Scale)? MechanismMode(SparseSymmetricMatrix k)
        {
            int n = k.Size;
            var scale = new double[n];
            for (int i = 0; i < n; i++) { double d = k.Diagonal(i); scale[i] = d > 0 ? 1 / Math.Sqrt(d) : 1; }
            // A unknown with no stiffness at all is a mode on its own.
            for (int i = 0; i < n; i++)
                if (!(k.Diagonal(i) > 0)) { var v = new double[n]; v[i] = 1; return (v, scale); }
            var shifted = new SparseSymmetricMatrix(n);
            for (int i = 0; i < n; i++)
                foreach (var (j, val) in k.LowerRow(i)) shifted.Add(i, j, val * scale[i] * scale[j]);
            for (int i = 0; i < n; i++) shifted.Add(i, i, 1e-10);
            ILinearFactor f;
            try { f = _linear.Factor(shifted); }
            catch (SingularMatrixException) { return null; }
            var rnd = new Random(12345);
            var x = Enumerable.Range(0, n).Select(_ => rnd.NextDouble() - 0.5).ToArray();
            for (int it = 0; it < 8; it++)
            {
                x = f.Solve(x);
                double norm = Math.Sqrt(x.Sum(v => v * v));
                if (!(norm > 0) || !double.IsFinite(norm)) return null;
                for (int i = 0; i < n; i++) x[i] /= norm;
            }
            // Rayleigh quotient on the scaled unit matrix: a mechanism gives round-off, a stable frame at least ~1e-7.
            var kx = new double[n];
            for (int i = 0; i < n; i++)
                foreach (var (j, val) in k.LowerRow(i))
                {
                    double sv = val * scale[i] * scale[j];
                    kx[i] += sv * x[j];
                    if (i != j) kx[j] += sv * x[i];
                }
            double rq = 0;
            for (int i = 0; i < n; i++) rq += x[i] * kx[i];
            return rq < 1e-9 ? (x, scale) : null;
        }

        /// <summary>
        /// A free movement of the structure: restrained with a note when no load drives it, a mechanism error when one does.
        /// </summary>
        private List<(int Dof, string Note)> FreeMovements(double[] mode, double[] scale, Transformation t,
            List<(double[] Full, double[] Reduced)> loads, List<string> caseIds)
        {
            int n = mode.Length;
            var modes = new List<double[]> { mode };
            var result = new List<(int, string)>();
            var taken = new HashSet<int>();
            foreach (var scaledMode in modes)
            {
                // Does any load case do work on this movement?
                for (int c = 0; c < loads.Count; c++)
                {
                    double work = 0, norm = 0;
                    for (int i = 0; i < n; i++)
                    {
                        double fs = loads[c].Reduced[i] * scale[i];
                        work += scaledMode[i] * fs;
                        norm += fs * fs;
                    }
                    if (Math.Abs(work) > 1e-9 * Math.Sqrt(norm) && norm > 0)
                    {
                        var (joint, dir, others) = Describe(scaledMode, scale, t);
                        string also = others.Count > 0 ? $" (together with joint{(others.Count > 1 ? "s" : "")} {string.Join(", ", others)})" : "";
                        throw new StructureException(
                            $"The structure is a mechanism: joint {joint} can {Motion(dir)}{also} without any member or support resisting it, " +
                            $"and the loads of case {caseIds[c]} push it that way. Check the supports, the hinges and the member connections.",
                            joint, dir);
                    }
                }
                int best = -1; double bestVal = 0;
                for (int i = 0; i < n; i++)
                    if (!taken.Contains(i) && Math.Abs(scaledMode[i]) > bestVal + 1e-12) { bestVal = Math.Abs(scaledMode[i]); best = i; }
                if (best < 0) continue;
                taken.Add(best);
                int dof = t.Masters[best];
                string jointId = _model.Joints[dof / 3].Id;
                result.Add((dof, string.Create(CultureInfo.InvariantCulture,
                    $"Joint {jointId} is free to {Motion(DirectionNames[dof % 3])} but no load drives that movement; it was held for the analysis (no effect on the results).")));
            }
            return result;
        }

        private static string Motion(string dir) => dir switch
        {
            "x" => "move horizontally (x)",
            "y" => "move vertically (y)",
            _ => "rotate",
        };

        private (string Joint, string Direction, List<string> Others) Describe(double[] scaledMode, double[] scale, Transformation t)
        {
            var q = scaledMode.Select((v, i) => v * scale[i]).ToArray();
            var d = t.Expand(q);
            for (int i = 0; i < d.Length; i++) d[i] -= t.Constants[i];
            double lref = _elements.Length > 0 ? _elements.Average(e => e.Length) : 1;
            // Prefer naming a translation (what an engineer calls sway or a falling joint) over a rotation.
            double maxTrans = 0;
            for (int i = 0; i < d.Length; i++) if (i % 3 != 2) maxTrans = Math.Max(maxTrans, Math.Abs(d[i]));
            int best = 0; double bestVal = -1;
            var moving = new List<(int Joint, double Size)>();
            for (int j = 0; j < _model.Joints.Count; j++)
            {
                double size = 0;
                for (int dir = 0; dir < 3; dir++)
                {
                    double v = Math.Abs(d[(3 * j) + dir]) * (dir == 2 ? lref : 1);
                    size = Math.Max(size, v);
                    bool eligible = dir != 2 || maxTrans <= 1e-9 * Math.Abs(d[(3 * j) + dir]) * lref;
                    if (eligible && v > bestVal) { bestVal = v; best = (3 * j) + dir; }
                }
                moving.Add((j, size));
            }
            string joint = _model.Joints[best / 3].Id;
            var others = moving.Where(m => m.Joint != best / 3 && m.Size > 1e-3 * bestVal)
                .Select(m => _model.Joints[m.Joint].Id).Take(6).ToList();
            return (joint, DirectionNames[best % 3], others);
        }

        private (CaseResult Result, CaseEquilibrium Equilibrium) Recover(LoadCase loadCase, CaseLoads local, double[] d,
            ConstraintSet constraints, HashSet<int> held)
        {
            var endForces = new double[_elements.Length][];
            var localDisp = new double[_elements.Length][];
            var residual = new double[_n];
            for (int i = 0; i < _elements.Length; i++)
            {
                var e = _elements[i];
                var dofs = e.Dofs;
                double[] dg = [d[dofs[0]], d[dofs[1]], d[dofs[2]], d[dofs[3]], d[dofs[4]], d[dofs[5]]];
                var dl = ElementMatrices.ToLocal(dg, e.Cos, e.Sin);
                var fixedLocal = local.Fixed[i] ?? new double[6];
                ElementMatrices.RecoverReleased(e.LocalK, fixedLocal, e.Released, dl);
                var f = new double[6];
                for (int a = 0; a < 6; a++)
                {
                    double s = fixedLocal[a];
                    for (int b = 0; b < 6; b++) s += e.LocalK[a, b] * dl[b];
                    f[a] = s;
                }
                endForces[i] = f;
                localDisp[i] = dl;
                var g = ElementMatrices.ToGlobal(f, e.Cos, e.Sin);
                for (int a = 0; a < 6; a++) residual[e.Dofs[a]] += g[a];
            }
            // Joint loads: the residual Σ member forces − applied joint loads must be carried by constraints.
            foreach (var jl in loadCase.JointLoads)
            {
                int j = _jointIndex[jl.Joint];
                switch (jl)
                {
                    case JointForce p:
                        var (ux, uy) = p.Direction.Vector();
                        residual[3 * j] -= p.P * ux;
                        residual[(3 * j) + 1] -= p.P * uy;
                        break;
                    case JointCouple c:
                        residual[(3 * j) + 2] -= -c.M;
                        break;
                }
            }
            if (_model.Axial == AxialBehaviour.Rigid) AddRigidAxialForces(constraints, residual, endForces);

            var members = new Dictionary<string, MemberResult>(StringComparer.Ordinal);
            var reactionVec = new double[_n];
            for (int i = 0; i < _elements.Length; i++)
            {
                var e = _elements[i];
                members[e.Member.Id] = new MemberResult(e.Member, e.Length, e.Cos, e.Sin, endForces[i], localDisp[i], local.Actions[i]);
                var g = ElementMatrices.ToGlobal(endForces[i], e.Cos, e.Sin);
                for (int a = 0; a < 6; a++) reactionVec[e.Dofs[a]] += g[a];
            }
            foreach (var jl in loadCase.JointLoads)
            {
                int j = _jointIndex[jl.Joint];
                if (jl is JointForce p) { var (ux, uy) = p.Direction.Vector(); reactionVec[3 * j] -= p.P * ux; reactionVec[(3 * j) + 1] -= p.P * uy; }
                else if (jl is JointCouple c) reactionVec[(3 * j) + 2] += c.M;
            }
            var displacements = new Dictionary<string, JointDisplacement>(StringComparer.Ordinal);
            var reactions = new Dictionary<string, Reaction>(StringComparer.Ordinal);
            for (int j = 0; j < _model.Joints.Count; j++)
            {
                var joint = _model.Joints[j];
                displacements[joint.Id] = new JointDisplacement(d[3 * j], d[(3 * j) + 1], -d[(3 * j) + 2]);
                if (joint.IsSupport)
                {
                    reactions[joint.Id] = new Reaction(
                        joint.Restraint.HasFlag(Restraint.X) ? reactionVec[3 * j] : 0,
                        joint.Restraint.HasFlag(Restraint.Y) ? reactionVec[(3 * j) + 1] : 0,
                        joint.Restraint.HasFlag(Restraint.Rotation) ? -reactionVec[(3 * j) + 2] : 0);
                }
            }
            var result = new CaseResult(loadCase.Id, members, displacements, reactions);
            return (result, Balance(loadCase, reactionVec, endForces, reactions, held));
        }

        /// <summary>
        /// Joint and global equilibrium of the recovered forces. At every joint direction that no support or hold
        /// restrains, the member end forces must balance the joint loads; over the whole structure, the loads (taken
        /// from the submission's load records, not from the fixed-end actions) and the reactions must balance.
        /// Both are measured as fractions of the applied loads.
        /// </summary>
        private CaseEquilibrium Balance(LoadCase loadCase, double[] outOfBalance, double[][] endForces, Dictionary<string, Reaction> reactions, HashSet<int> held)
        {
            double size = StructureSize();
            double x0 = _model.Joints.Average(j => j.X), y0 = _model.Joints.Average(j => j.Y);
            double loadForce = 0, loadMoment = 0, fx = 0, fy = 0, m = 0;
            foreach (var load in loadCase.Loads)
            {
                switch (load)
                {
                    case JointForce p:
                    {
                        var j = _model.Joint(p.Joint);
                        var (gx, gy) = p.Direction.Vector();
                        fx += p.P * gx; fy += p.P * gy; m += ((j.X - x0) * p.P * gy) - ((j.Y - y0) * p.P * gx);
                        loadForce += Math.Abs(p.P);
                        break;
                    }
                    case JointCouple c:
                        m -= c.M;
                        loadMoment += Math.Abs(c.M);
                        break;
                    case MemberLoad ml:
                    {
                        var e = _elements[_elementIndex[ml.Member]];
                        var start = _model.Joint(e.Member.Start);
                        switch (ml)
                        {
                            case PointLoad p:
                            {
                                var (gx, gy) = p.Direction.Vector();
                                double px = start.X + (e.Cos * p.A) - x0, py = start.Y + (e.Sin * p.A) - y0;
                                fx += p.P * gx; fy += p.P * gy; m += (px * p.P * gy) - (py * p.P * gx);
                                loadForce += Math.Abs(p.P);
                                break;
                            }
                            case DistributedLoad w:
                            {
                                var (gx, gy) = w.Direction.Vector();
                                double t = w.B - w.A;
                                double total = (w.WStart + w.WEnd) / 2 * t;
                                double first = (w.A * total) + (w.WStart * t * t / 2) + ((w.WEnd - w.WStart) * t * t / 3); // ∫ w(s)·s ds
                                double mx = ((start.X - x0) * total) + (e.Cos * first), my = ((start.Y - y0) * total) + (e.Sin * first);
                                fx += total * gx; fy += total * gy; m += (mx * gy) - (my * gx);
                                loadForce += (Math.Abs(w.WStart) + Math.Abs(w.WEnd)) / 2 * t;
                                break;
                            }
                            case MemberCouple c:
                                m -= c.M;
                                loadMoment += Math.Abs(c.M);
                                break;
                            case LockedEndMoments locked:
                                // Self-equilibrated: no resultant, but it sets the scale of the case.
                                loadMoment += Math.Abs(locked.StartMoment) + Math.Abs(locked.EndMoment);
                                break;
                        }
                        break;
                    }
                }
            }
            foreach (var (id, r) in reactions)
            {
                var j = _model.Joint(id);
                fx += r.Rx; fy += r.Ry; m += ((j.X - x0) * r.Ry) - ((j.Y - y0) * r.Rx) - r.M;
            }
            double forceScale = Math.Max(loadForce, loadMoment / size);
            if (!(forceScale > 0))
            {
                // Support movements only: the reactions they cause set the scale.
                foreach (var r in reactions.Values) forceScale = Math.Max(forceScale, Math.Max(Math.Max(Math.Abs(r.Rx), Math.Abs(r.Ry)), Math.Abs(r.M) / size));
                foreach (var f in endForces) forceScale = Math.Max(forceScale, Math.Max(Math.Abs(f[2]), Math.Abs(f[5])) / size);
            }
            if (!(forceScale > 0)) return new CaseEquilibrium(loadCase.Id, 0, null, null, 0);
            double momentScale = forceScale * size;

            double worst = 0;
            int worstDof = -1;
            for (int j = 0; j < _model.Joints.Count; j++)
            {
                var restraint = _model.Joints[j].Restraint;
                for (int dir = 0; dir < 3; dir++)
                {
                    int dof = (3 * j) + dir;
                    var flag = dir switch { 0 => Restraint.X, 1 => Restraint.Y, _ => Restraint.Rotation };
                    if (restraint.HasFlag(flag) || held.Contains(dof)) continue;
                    double r = Math.Abs(outOfBalance[dof]) / (dir == 2 ? momentScale : forceScale);
                    if (!(r <= worst)) { worst = r; worstDof = dof; }
                }
            }
            // A braced analysis holds the structure against sway with external restraints: its reactions alone do not balance the loads.
            double global = _holdTranslations ? 0 : Math.Max(Math.Max(Math.Abs(fx), Math.Abs(fy)) / forceScale, Math.Abs(m) / momentScale);
            if (double.IsNaN(global)) global = double.PositiveInfinity;
            return new CaseEquilibrium(loadCase.Id, worst, worstDof < 0 ? null : _model.Joints[worstDof / 3].Id,
                worstDof < 0 ? null : DirectionNames[worstDof % 3], global);
        }

        private double _size;

        /// <summary>The larger of the joints' bounding-box diagonal and the longest member (m); lever arm of the moment scale.</summary>
        private double StructureSize()
        {
            if (_size > 0) return _size;
            double w = _model.Joints.Max(j => j.X) - _model.Joints.Min(j => j.X), h = _model.Joints.Max(j => j.Y) - _model.Joints.Min(j => j.Y);
            _size = Math.Max(Math.Sqrt((w * w) + (h * h)), _elements.Select(e => e.Length).DefaultIfEmpty(1).Max());
            if (!(_size > 0)) _size = 1;
            return _size;
        }

        /// <summary>
        /// Axial forces of axially rigid members are constraint forces: find λ with Σ λ_k·c_k = r (the
        /// out-of-balance joint forces of the bending solution), minimum norm where rigid members form a
        /// self-straining loop, by iterated Tikhonov on C·Cᵀ.
        /// </summary>
        private void AddRigidAxialForces(ConstraintSet constraints, double[] residual, double[][] endForces)
        {
            var rows = constraints.Rows;
            int m = rows.Count;
            if (m == 0) return;
            // Constraint rows by DOF (compressed), then C·Cᵀ from the rows that share a DOF.
            var perDof = new int[_n + 1];
            foreach (var row in rows) foreach (var dof in row.Coefficients.Keys) perDof[dof + 1]++;
            for (int i = 0; i < _n; i++) perDof[i + 1] += perDof[i];
            var entryRow = new int[perDof[_n]];
            var entryCoef = new double[perDof[_n]];
            var next = (int[])perDof.Clone();
            for (int r = 0; r < m; r++)
                foreach (var (dof, c) in rows[r].Coefficients) { entryRow[next[dof]] = r; entryCoef[next[dof]++] = c; }
            var cct = new SparseSymmetricMatrix(m);
            for (int dof = 0; dof < _n; dof++)
                for (int p1 = perDof[dof]; p1 < perDof[dof + 1]; p1++)
                    for (int p2 = perDof[dof]; p2 < perDof[dof + 1]; p2++)
                        if (entryRow[p1] >= entryRow[p2]) cct.Add(entryRow[p1], entryRow[p2], entryCoef[p1] * entryCoef[p2]);
            double maxDiag = Enumerable.Range(0, m).Max(cct.Diagonal);
            double delta = 1e-10 * maxDiag;
            for (int r = 0; r < m; r++) cct.Add(r, r, delta);
            var b = new double[m];
            for (int r = 0; r < m; r++)
                foreach (var (dof, c) in rows[r].Coefficients) b[r] += c * residual[dof];
            ILinearFactor factor;
            try { factor = _linear.Factor(cct); }
            catch (SingularMatrixException) { return; }
            var lambda = new double[m];
            for (int iter = 0; iter < 2; iter++)
            {
                // r_k = b − (C·Cᵀ)·λ, without the regularisation term.
                var mv = cct.Multiply(lambda);
                var rhs = new double[m];
                for (int r = 0; r < m; r++) rhs[r] = b[r] - (mv[r] - (delta * lambda[r]));
                var step = factor.Solve(rhs);
                for (int r = 0; r < m; r++) lambda[r] += step[r];
            }
            for (int r = 0; r < m; r++)
            {
                if (rows[r].Tag is not ValueTuple<string, string, int> { Item1: "rigid" } tag) continue;
                int i = _elementIndex[tag.Item2];
                double tension = -lambda[r];
                endForces[i][0] += -tension;
                endForces[i][3] += tension;
            }
        }
    }

    private sealed record Element(Member Member, int StartJoint, int EndJoint, double Length, double Cos, double Sin,
        Mat6 LocalK, int[] Released, Mat6 GlobalK, bool Elastic)
    {
        private Mat6? _unit;

        /// <summary>
        /// The same member with stiffness of unit size (4EI/L = 1, EA/L = 1): its null space is the structure's
        /// mechanisms, free of the conditioning that very different real stiffnesses bring. Built when first needed.
        /// </summary>
        public Mat6 UnitGlobalK => _unit ??= Unit();

        private Mat6 Unit()
        {
            var ku = ElementMatrices.LocalStiffness(Length / 4, Elastic ? Length : 0, Length);
            var (kuc, _) = ElementMatrices.Condense(ku, new double[6], Released);
            return ElementMatrices.ToGlobal(kuc, Cos, Sin);
        }

        public int[] Dofs { get; } =
        [
            3 * StartJoint, (3 * StartJoint) + 1, (3 * StartJoint) + 2,
            3 * EndJoint, (3 * EndJoint) + 1, (3 * EndJoint) + 2,
        ];
    }
}
