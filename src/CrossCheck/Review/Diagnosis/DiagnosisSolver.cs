using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// Every solve of one review's diagnosis, shared by its cases and hypotheses. The submitted structure is factorised once
/// (<see cref="FactoredFrame"/>): load hypotheses are superposed from the effects of single loads solved against that
/// factor, member-local changes (a hinge, a support's fixity, the braced structure) are low-rank updates of it
/// (<see cref="FrameUpdates"/>), and only a change of the whole structure (every stiffness, every hinge) is factorised
/// anew. Where the factor cannot be trusted for a change, the full solver decides, as it always did.
/// </summary>
internal sealed class DiagnosisSolver
{
    private readonly StructureModel _model;
    private readonly FrameSolver _solver = new();
    private readonly Lazy<FactoredFrame?> _factored;
    private FrameUpdates.Braced? _braced;
    private bool _bracedTried;
    private int _factorisations;
    private int _otherSolves;

    public DiagnosisSolver(StructureModel model)
    {
        _model = model;
        _factored = new Lazy<FactoredFrame?>(() => FactoredFrame.TryBuild(model));
    }

    /// <summary>The submitted structure factorised, or null when the full solver must be used throughout.</summary>
    public FactoredFrame? Factored => _factored.Value;

    /// <summary>Linear solves made (with a factor, plus whole analyses and new factorisations), for measurements.</summary>
    public int Solves => (_factored.IsValueCreated ? _factored.Value?.Solves ?? 0 : 0) + _factorisations + _otherSolves;

    /// <summary>Factorisations made (the submitted structure's, the braced one's, a changed structure's, a whole analysis), for measurements.</summary>
    public int Factorisations => _factorisations + (_factored.IsValueCreated ? 1 : 0);

    /// <summary>The ends as element references of the factorised structure.</summary>
    public EndRef[] Refs(IReadOnlyList<EndKey> keys)
    {
        var index = Factored!.Frame.ElementIndex;
        var refs = new EndRef[keys.Count];
        for (int i = 0; i < refs.Length; i++) refs[i] = new EndRef(index[keys[i].Member], keys[i].End);
        return refs;
    }

    /// <summary>The end moments of one case on another structure (support movements as that structure has them).</summary>
    public double[] Altered(StructureModel model, LoadCase loadCase, IReadOnlyList<EndKey> keys, bool hold = false)
    {
        var f = FactoredFrame.TryBuild(model, loadCase, hold);
        if (f is null) return Full(model, loadCase, keys, hold);
        _factorisations++;
        var local = f.Local(loadCase);
        var moments = f.Moments(f.Expand(f.SolveCase(loadCase, local), movements: true), local, Refs(f, keys));
        _otherSolves += f.Solves;
        return moments;
    }

    /// <summary>The end moments of a case on the braced structure (sway prevented).</summary>
    public double[] Braced(LoadCase loadCase, IReadOnlyList<EndKey> keys)
    {
        if (!_bracedTried && Factored is { } f)
        {
            _braced = FrameUpdates.Brace(f);
            _bracedTried = true;
            _factorisations++;
        }
        if (_braced is null) return Altered(_model, loadCase, keys, hold: true);
        _otherSolves++;
        return _braced.Moments(loadCase, Refs(keys));
    }

    /// <summary>The end moments caused by <paramref name="loads"/> alone on the structure without its support movements.</summary>
    public double[] LoadEffect(IReadOnlyList<Load> loads, IReadOnlyList<EndKey> keys)
    {
        if (Factored is { } f) return f.LoadEffect(loads, Refs(keys));
        return Full(Still(_model), new LoadCase("·", loads), keys, hold: false);
    }

    /// <summary>A whole case (its loads and the structure's support movements) on the structure without its support movements.</summary>
    public double[] WithoutMovements(LoadCase loadCase, IReadOnlyList<EndKey> keys) => LoadEffect(loadCase.Loads, keys);

    /// <summary>The case with the hinges of one member removed.</summary>
    public double[] WithoutHinges(LoadCase loadCase, Member member, IReadOnlyList<EndKey> keys)
    {
        if (Factored is { } f && FrameUpdates.WithoutHinges(f, f.Frame.ElementIndex[member.Id], loadCase, Refs(keys)) is { } moments) return moments;
        var altered = new StructureModel(_model.Joints, _model.Members.Select(m => m.Id == member.Id ? m with { Hinge = Hinge.None } : m).ToList(), _model.Axial, _model.RelativeStiffness);
        return Altered(altered, loadCase, keys);
    }

    /// <summary>The case with the rotation restraint of a support changed to <paramref name="restraint"/>.</summary>
    public double[] WithRestraint(LoadCase loadCase, Joint joint, Restraint restraint, IReadOnlyList<EndKey> keys)
    {
        if (Factored is { } f)
        {
            int j = f.Frame.JointIndex[joint.Id];
            bool holds = restraint.HasFlag(Restraint.Rotation);
            // Only the rotation changes: the update covers that, anything else goes to the full solver.
            if ((restraint & ~Restraint.Rotation) == (joint.Restraint & ~Restraint.Rotation) && holds != joint.Restraint.HasFlag(Restraint.Rotation)
                && (holds ? FrameUpdates.WithRotationHeld(f, j, loadCase, Refs(keys)) : FrameUpdates.WithRotationReleased(f, j, loadCase, Refs(keys))) is { } moments)
                return moments;
        }
        var joints = _model.Joints.Select(k => k.Id == joint.Id ? k with { Restraint = restraint } : k).ToList();
        return Altered(new StructureModel(joints, _model.Members, _model.Axial, _model.RelativeStiffness), loadCase, keys);
    }

    /// <summary>The adjoint of Σ eᵢ·Mᵢ over the compared ends (one solve), or null without a factor.</summary>
    public Adjoint? AdjointOf(IReadOnlyList<EndKey> keys, double[] weights) => Factored?.AdjointOf(Refs(keys), weights);

    private static EndRef[] Refs(FactoredFrame f, IReadOnlyList<EndKey> keys) =>
        keys.Select(k => new EndRef(f.Frame.ElementIndex[k.Member], k.End)).ToArray();

    private double[] Full(StructureModel model, LoadCase loadCase, IReadOnlyList<EndKey> keys, bool hold)
    {
        _factorisations++;
        var result = _solver.Solve(model, [loadCase], hold).Cases[0];
        return keys.Select(k => result.EndMoment(k.Member, k.End)).ToArray();
    }

    /// <summary>The structure without its support movements.</summary>
    public static StructureModel Still(StructureModel model) => model.HasSupportMovements
        ? new StructureModel(model.Joints.Select(j => j with { Movement = default }).ToList(), model.Members, model.Axial, model.RelativeStiffness)
        : model;
}
