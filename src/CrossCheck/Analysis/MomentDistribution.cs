using CrossCheck.Model;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Analysis;

/// <summary>How a moment distribution is carried out: the choices a person makes doing it by hand.</summary>
/// <param name="ModifiedStiffness">Use 3EI/L (carry-over 0) for members whose far end is a pin or roller with no other
/// member, releasing that end at the start; otherwise 4EI/L and the pin is balanced each cycle.</param>
/// <param name="CarryOverFactor">The carry-over factor to a far end that is not released (½ for prismatic members).</param>
/// <param name="Cycles">Stop after this many balance + carry-over cycles (null: run to convergence).</param>
/// <param name="StopWhenCarryOversBelow">Stop after the first cycle whose carry-overs are all below this (N·m), as
/// is usual by hand; null: do not use this rule.</param>
/// <param name="FinalBalance">Balance once more after the last carry-over (hand practice).</param>
/// <param name="SwayCorrection">Correct for sidesway by superposing sway cases; false gives a no-sway (braced) answer.</param>
public sealed record DistributionOptions(
    bool ModifiedStiffness = true,
    double CarryOverFactor = 0.5,
    int? Cycles = null,
    double? StopWhenCarryOversBelow = null,
    bool FinalBalance = true,
    bool SwayCorrection = true)
{
    public static DistributionOptions Converged { get; } = new();
}

public enum DistributionStep
{
    DistributionFactor,
    FixedEndMoment,
    Balance,
    CarryOver,
    Final,
}

/// <summary>A row of a distribution working table; values by column (member end), in N·m except factors.</summary>
public sealed record DistributionRow(DistributionStep Step, int Cycle, IReadOnlyList<double?> Values);

/// <summary>A working table: one column per member end, rows in the order they are written.</summary>
public sealed record DistributionTable(string Title, IReadOnlyList<(string Member, MemberEnd End)> Columns, IReadOnlyList<DistributionRow> Rows)
{
    public IReadOnlyList<double?> Final => Rows.Last(r => r.Step == DistributionStep.Final).Values;
}

/// <summary>A sway case superposed to correct a no-sway distribution.</summary>
/// <param name="Label">Which joint and direction sways.</param>
/// <param name="Factor">The multiple of this sway case in the final answer.</param>
public sealed record SwayCorrection(string Label, double Factor, DistributionTable Table);

/// <summary>The result of a moment distribution: final clockwise member-end moments and the working.</summary>
public sealed record DistributionResult(
    IReadOnlyDictionary<(string Member, MemberEnd End), double> Moments,
    DistributionTable NoSway,
    IReadOnlyList<SwayCorrection> Sway,
    int Cycles,
    bool Converged)
{
    public double Moment(string member, MemberEnd end) => Moments[(member, end)];
}

/// <summary>
/// Hardy Cross moment distribution with simultaneous balancing, and sway correction by superposing one sway case
/// per independent translation (storey equations by virtual work). A second, independent method next to the
/// stiffness solver: it cross-checks the solver, reproduces what an author stopping early or using a wrong factor
/// would have written, and prints a reference working table. Axially rigid frames only (as hand methods assume).
/// </summary>
public static class MomentDistribution
{
    private const int MaxCycles = 2000;

    /// <exception cref="NotSupportedException">Axial behaviour is elastic, or a sway case cannot be formed.</exception>
    public static DistributionResult Run(StructureModel model, LoadCase loadCase, DistributionOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(loadCase);
        options ??= DistributionOptions.Converged;
        if (model.Axial != AxialBehaviour.Rigid)
            throw new NotSupportedException("Moment distribution assumes axially rigid members.");
        var setup = new Setup(model, options);
        var kin = setup.Kinematics;

        // No-sway stage: loads, support movements, applied couples; translations held.
        var fem = setup.LoadFixedEndMoments(loadCase);
        var noSway = setup.Distribute(fem, setup.AppliedCouples(loadCase), "no sway", out int cycles, out bool converged);
        var final = noSway.Final.Select(v => v ?? 0).ToArray();

        var sway = new List<SwayCorrection>();
        var modes = kin.TranslationUnknowns.Where(u => setup.Members.Any(m => kin.ChordRotation(m).Terms.ContainsKey(u))).ToList();
        if (options.SwayCorrection && modes.Count > 0)
        {
            var tables = new List<(int Mode, DistributionTable Table, double Scale)>();
            foreach (var mode in modes)
            {
                // A sway of a size that gives fixed-end moments of order 100 units keeps the table readable.
                double peak = setup.Members.Max(m => Math.Abs(6 * m.E * m.I / setup.Length(m) * kin.ChordRotation(m).Terms.GetValueOrDefault(mode)));
                double scale = peak > 0 ? 1e5 / peak : 1;
                var swayFem = setup.SwayFixedEndMoments(mode, scale);
                var (joint, dir) = kin.Describe(mode);
                var table = setup.Distribute(swayFem, new double[setup.JointCount], $"sway of joint {joint} in {dir}", out int c2, out bool conv2);
                cycles = Math.Max(cycles, c2);
                converged &= conv2;
                tables.Add((mode, table, scale));
            }
            int n = modes.Count;
            var a = Matrix<double>.Build.Dense(n, n);
            var b = Vector<double>.Build.Dense(n);
            for (int t = 0; t < n; t++)
            {
                b[t] = -(setup.SwayResidual(modes[t], final) + setup.LoadWork(modes[t], loadCase));
                for (int s = 0; s < n; s++) a[t, s] = setup.SwayResidual(modes[t], tables[s].Table.Final.Select(v => v ?? 0).ToArray());
            }
            Vector<double> factors;
            try { factors = a.Solve(b); }
            catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
            {
                throw new NotSupportedException("The sway equations of this frame are singular.", ex);
            }
            for (int s = 0; s < n; s++)
            {
                var f = tables[s].Table.Final;
                for (int i = 0; i < final.Length; i++) final[i] += factors[s] * (f[i] ?? 0);
                sway.Add(new SwayCorrection(tables[s].Table.Title, factors[s], tables[s].Table));
            }
        }
        var moments = new Dictionary<(string, MemberEnd), double>();
        for (int i = 0; i < setup.Columns.Count; i++) moments[setup.Columns[i]] = final[i];
        return new DistributionResult(moments, noSway, sway, cycles, converged);
    }

    /// <summary>A distribution stopped after a given number of cycles.</summary>
    /// <param name="Cycles">Balance + carry-over cycles done.</param>
    /// <param name="LastCarryOver">The last carry-over row of the no-sway stage, by column (null after a final balance or with sway).</param>
    public sealed record Stopped(int Cycles, IReadOnlyDictionary<(string Member, MemberEnd End), double> Moments, IReadOnlyList<double>? LastCarryOver,
        IReadOnlyList<(string Member, MemberEnd End)> Columns);

    /// <summary>
    /// The answers of one distribution stopped after 1, 2, … <paramref name="maxCycles"/> cycles (each stage, sway
    /// cases included, stopped at the same cycle), computed in one pass. Ends early once the distribution converges.
    /// </summary>
    public static IReadOnlyList<Stopped> StoppedAfterEachCycle(StructureModel model, LoadCase loadCase, bool modifiedStiffness, bool finalBalance, int maxCycles)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(loadCase);
        if (model.Axial != AxialBehaviour.Rigid) throw new NotSupportedException("Moment distribution assumes axially rigid members.");
        var options = new DistributionOptions(ModifiedStiffness: modifiedStiffness, FinalBalance: finalBalance);
        var setup = new Setup(model, options);
        var kin = setup.Kinematics;
        var main = setup.Stages(setup.LoadFixedEndMoments(loadCase), setup.AppliedCouples(loadCase), maxCycles, finalBalance);
        var modes = kin.TranslationUnknowns.Where(u => setup.Members.Any(m => kin.ChordRotation(m).Terms.ContainsKey(u))).ToList();
        var swayStages = modes.Select(mode =>
        {
            double peak = setup.Members.Max(m => Math.Abs(6 * m.E * m.I / setup.Length(m) * kin.ChordRotation(m).Terms.GetValueOrDefault(mode)));
            double scale = peak > 0 ? 1e5 / peak : 1;
            return setup.Stages(setup.SwayFixedEndMoments(mode, scale), new double[setup.JointCount], maxCycles, finalBalance);
        }).ToList();
        var loadWork = modes.Select(m => setup.LoadWork(m, loadCase)).ToArray();
        var list = new List<Stopped>();
        for (int k = 0; k < main.Count; k++)
        {
            var final = (double[])main[k].State.Clone();
            if (modes.Count > 0)
            {
                int n = modes.Count;
                var a = Matrix<double>.Build.Dense(n, n);
                var b = Vector<double>.Build.Dense(n);
                var sway = swayStages.Select(st => st[Math.Min(k, st.Count - 1)].State).ToList();
                for (int t = 0; t < n; t++)
                {
                    b[t] = -(setup.SwayResidual(modes[t], final) + loadWork[t]);
                    for (int s2 = 0; s2 < n; s2++) a[t, s2] = setup.SwayResidual(modes[t], sway[s2]);
                }
                Vector<double> factors;
                try { factors = a.Solve(b); }
                catch (Exception ex) when (ex is ArgumentException or InvalidOperationException) { break; }
                for (int s2 = 0; s2 < n; s2++)
                    for (int i = 0; i < final.Length; i++) final[i] += factors[s2] * sway[s2][i];
            }
            var moments = new Dictionary<(string, MemberEnd), double>();
            for (int i = 0; i < setup.Columns.Count; i++) moments[setup.Columns[i]] = final[i];
            list.Add(new Stopped(main[k].Cycles, moments, modes.Count == 0 && !finalBalance ? main[k].LastCarryOver : null, setup.Columns));
            if (main[k].Converged) break;
        }
        return list;
    }

    private sealed class Setup
    {
        private readonly StructureModel _model;
        private readonly DistributionOptions _o;
        private readonly Dictionary<string, int> _joint;
        private readonly double[] _stiffness;      // rotational stiffness at each column's end (0 when released)
        private readonly double[] _carry;          // carry-over factor from each column to its far end
        private readonly bool[] _pinnedFar;        // the member's far end is a released pin (modified stiffness)
        private readonly int[] _jointOf;           // joint index of each column
        private readonly bool[] _balanced;         // joint is balanced (rotation free and stiff)

        public Setup(StructureModel model, DistributionOptions o)
        {
            _model = model;
            _o = o;
            Kinematics = new Kinematics(model);
            Members = model.Members;
            _joint = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
            Columns = Members.SelectMany(m => new[] { (m.Id, MemberEnd.Start), (m.Id, MemberEnd.End) }).ToList();
            int n = Columns.Count;
            _stiffness = new double[n];
            _carry = new double[n];
            _pinnedFar = new double[n].Select(_ => false).ToArray();
            _jointOf = new int[n];
            for (int i = 0; i < n; i++)
            {
                var (mid, end) = Columns[i];
                var m = model.Member(mid);
                _jointOf[i] = _joint[m.JointAt(end)];
                var far = end == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;
                double L = Length(m), ei = m.E * m.I;
                if (m.IsReleased(end)) continue;
                // Modified stiffness when the far end is hinged, or is a lone pin (unless this end is one too:
                // a member pinned at both ends is simply balanced at both).
                if (m.IsReleased(far) || (o.ModifiedStiffness && IsPinLike(m, far) && !IsPinLike(m, end)))
                {
                    _stiffness[i] = 3 * ei / L;
                    _carry[i] = 0;
                    _pinnedFar[i] = true;
                }
                else
                {
                    _stiffness[i] = 4 * ei / L;
                    _carry[i] = o.CarryOverFactor;
                }
            }
            _balanced = new bool[model.Joints.Count];
            for (int j = 0; j < model.Joints.Count; j++)
            {
                var joint = model.Joints[j];
                if (joint.Restraint.HasFlag(Restraint.Rotation)) continue;
                double k = 0;
                for (int i = 0; i < n; i++) if (_jointOf[i] == j) k += _stiffness[i];
                bool released = o.ModifiedStiffness && IsReleasedPin(joint) && !IsPinLike(model.MembersAt(joint.Id).First(), OtherEnd(model.MembersAt(joint.Id).First(), joint.Id));
                _balanced[j] = k > 0 && !released;
            }
        }

        public Kinematics Kinematics { get; }
        public IReadOnlyList<Member> Members { get; }
        public List<(string Member, MemberEnd End)> Columns { get; }
        public int JointCount => _model.Joints.Count;

        public double Length(Member m) => _model.Length(m);

        /// <summary>A pin or roller (or free end) with this member alone: released once at the start when using modified stiffness.</summary>
        private bool IsPinLike(Member m, MemberEnd end)
        {
            var j = _model.Joint(m.JointAt(end));
            return !j.Restraint.HasFlag(Restraint.Rotation) && _model.MembersAt(j.Id).Count() == 1 && !m.IsReleased(end);
        }

        private static MemberEnd OtherEnd(Member m, string joint) => m.EndAt(joint) == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;

        private bool IsReleasedPin(Joint j)
        {
            var members = _model.MembersAt(j.Id).ToList();
            return members.Count == 1 && IsPinLike(members[0], members[0].EndAt(j.Id)!.Value);
        }

        public double[] AppliedCouples(LoadCase c)
        {
            var a = new double[JointCount];
            foreach (var l in c.Loads.OfType<JointCouple>()) a[_joint[l.Joint]] += l.M;
            return a;
        }

        /// <summary>Clamped-end moments of the loads plus the effect of prescribed support movements.</summary>
        public double[] LoadFixedEndMoments(LoadCase c)
        {
            var fem = new double[Columns.Count];
            var byMember = c.MemberLoads.GroupBy(l => l.Member).ToDictionary(g => g.Key, g => g.ToList());
            for (int mi = 0; mi < Members.Count; mi++)
            {
                var m = Members[mi];
                var a = _model.Joint(m.Start);
                var b = _model.Joint(m.End);
                double L = Length(m), cos = (b.X - a.X) / L, sin = (b.Y - a.Y) / L;
                if (byMember.TryGetValue(m.Id, out var loads))
                {
                    var f = FixedEndActions.Compute(loads.Select(l => LocalLoads.Resolve(l, cos, sin)), L);
                    fem[2 * mi] += -f[2];
                    fem[(2 * mi) + 1] += -f[5];
                }
                // Support movements: slope-deflection with the prescribed parts of θ and ψ.
                double ei = m.E * m.I;
                double psi = Kinematics.ChordRotation(m).Constant;
                double ta = Kinematics.JointRotation(m.Start).Constant, tb = Kinematics.JointRotation(m.End).Constant;
                fem[2 * mi] += 2 * ei / L * ((2 * ta) + tb - (3 * psi));
                fem[(2 * mi) + 1] += 2 * ei / L * (ta + (2 * tb) - (3 * psi));
            }
            return fem;
        }

        /// <summary>Fixed-end moments of a sway of unknown <paramref name="mode"/> by <paramref name="scale"/> with joints held.</summary>
        public double[] SwayFixedEndMoments(int mode, double scale)
        {
            var fem = new double[Columns.Count];
            for (int mi = 0; mi < Members.Count; mi++)
            {
                var m = Members[mi];
                double psi = Kinematics.ChordRotation(m).Terms.GetValueOrDefault(mode) * scale;
                if (psi == 0) continue;
                double v = -6 * m.E * m.I * psi / Length(m); // slope-deflection: −6EIψ/L at both ends
                fem[2 * mi] = v;
                fem[(2 * mi) + 1] = v;
            }
            return fem;
        }

        /// <summary>Virtual work of the member-end moments in a sway mode: Σ (M_ab + M_ba)·ψ.</summary>
        public double SwayResidual(int mode, double[] moments)
        {
            double r = 0;
            for (int mi = 0; mi < Members.Count; mi++)
            {
                double psi = Kinematics.ChordRotation(Members[mi]).Terms.GetValueOrDefault(mode);
                if (psi != 0) r += (moments[2 * mi] + moments[(2 * mi) + 1]) * psi;
            }
            return r;
        }

        /// <summary>Virtual work of the loads in a sway mode (joints translate, members move as rigid bodies).</summary>
        public double LoadWork(int mode, LoadCase c)
        {
            double w = 0;
            foreach (var load in c.Loads)
            {
                switch (load)
                {
                    case JointForce f:
                    {
                        var (ux, uy) = Kinematics.JointTranslation(f.Joint);
                        var (gx, gy) = f.Direction.Vector();
                        w += f.P * ((gx * ux.Terms.GetValueOrDefault(mode)) + (gy * uy.Terms.GetValueOrDefault(mode)));
                        break;
                    }
                    case MemberLoad ml:
                    {
                        var m = _model.Member(ml.Member);
                        var a = _model.Joint(m.Start);
                        var b = _model.Joint(m.End);
                        double L = Length(m), cos = (b.X - a.X) / L, sin = (b.Y - a.Y) / L;
                        var (ux, uy) = Kinematics.JointTranslation(m.Start);
                        double dux = ux.Terms.GetValueOrDefault(mode), duy = uy.Terms.GetValueOrDefault(mode);
                        double ua = (dux * cos) + (duy * sin), va = (-dux * sin) + (duy * cos);
                        double psi = Kinematics.ChordRotation(m).Terms.GetValueOrDefault(mode);
                        switch (LocalLoads.Resolve(ml, cos, sin))
                        {
                            case LocalPoint p: w += (p.Qx * ua) + (p.Qy * (va - (psi * p.A))); break;
                            case LocalDistributed d:
                            {
                                double len = d.B - d.A;
                                double qx = (d.Qx1 + d.Qx2) / 2 * len, qy = (d.Qy1 + d.Qy2) / 2 * len;
                                // ∫ qy·s ds for a linear load between A and B.
                                double qys = (d.Qy1 * ((d.B * d.B) - (d.A * d.A)) / 2) + ((d.Qy2 - d.Qy1) / len * ((((d.B * d.B * d.B) - (d.A * d.A * d.A)) / 3) - (d.A * ((d.B * d.B) - (d.A * d.A)) / 2)));
                                w += (qx * ua) + (qy * va) - (psi * qys);
                                break;
                            }
                            case LocalCouple cp: w += cp.C * -psi; break;
                        }
                        break;
                    }
                }
            }
            return w;
        }

        public sealed record Stage(int Cycles, double[] State, double[]? LastCarryOver, bool Converged);

        /// <summary>The state after each of 1..maxCycles cycles (with a final balance when asked), from one run.</summary>
        public List<Stage> Stages(double[] fem, double[] applied, int maxCycles, bool finalBalance)
        {
            var table = Distribute(fem, applied, "", out _, out _, maxCycles);
            var stages = new List<Stage>();
            int n = Columns.Count;
            var state = new double[n];
            double[]? lastCo = null;
            var rows = table.Rows.Where(r => r.Step is not DistributionStep.DistributionFactor and not DistributionStep.Final).ToList();
            for (int r = 0; r < rows.Count; r++)
            {
                for (int i = 0; i < n; i++) state[i] += rows[r].Values[i] ?? 0;
                if (rows[r].Step != DistributionStep.CarryOver) continue;
                lastCo = rows[r].Values.Select(v => v ?? 0).ToArray();
                var snapshot = (double[])state.Clone();
                bool converged = lastCo.All(v => Math.Abs(v) <= 1e-12 * Math.Max(1, snapshot.Max(Math.Abs)));
                if (finalBalance && r + 1 < rows.Count && rows[r + 1].Step == DistributionStep.Balance)
                    for (int i = 0; i < n; i++) snapshot[i] += rows[r + 1].Values[i] ?? 0;
                stages.Add(new Stage(rows[r].Cycle, snapshot, finalBalance ? null : lastCo, converged));
                if (converged) break;
            }
            if (stages.Count == 0) stages.Add(new Stage(0, table.Final.Select(v => v ?? 0).ToArray(), null, true));
            return stages;
        }

        public DistributionTable Distribute(double[] fem, double[] applied, string title, out int cycles, out bool converged, int maxCycles = MaxCycles)
        {
            int n = Columns.Count;
            var rows = new List<DistributionRow>();
            var df = new double?[n];
            var sum = new double[JointCount];
            for (int i = 0; i < n; i++) if (_balanced[_jointOf[i]]) sum[_jointOf[i]] += _stiffness[i];
            for (int i = 0; i < n; i++) df[i] = _balanced[_jointOf[i]] && sum[_jointOf[i]] > 0 ? _stiffness[i] / sum[_jointOf[i]] : 0;
            rows.Add(new DistributionRow(DistributionStep.DistributionFactor, 0, df));
            var current = (double[])fem.Clone();
            // Modified stiffness: release each pin once, carrying half of its release to the near end.
            for (int i = 0; i < n; i++)
            {
                if (!_pinnedFar[i]) continue;
                int far = FarColumn(i);
                var m = _model.Member(Columns[i].Member);
                double target = m.IsReleased(Columns[far].End) ? 0 : applied[_jointOf[far]];
                double release = target - current[far];
                current[far] = target;
                current[i] += release / 2;
            }
            rows.Add(new DistributionRow(DistributionStep.FixedEndMoment, 0, current.Select(v => (double?)v).ToArray()));
            double scale = Math.Max(current.Select(Math.Abs).DefaultIfEmpty(0).Max(), applied.Select(Math.Abs).DefaultIfEmpty(0).Max());
            double tol = 1e-12 * Math.Max(scale, 1e-300);
            cycles = 0;
            converged = false;
            bool lastWasCarry = false;
            while (true)
            {
                // Balance every joint at once.
                var bal = new double[n];
                double maxBal = 0;
                var unbalance = new double[JointCount];
                for (int i = 0; i < n; i++) unbalance[_jointOf[i]] += current[i];
                for (int i = 0; i < n; i++)
                {
                    int j = _jointOf[i];
                    if (!_balanced[j]) continue;
                    bal[i] = -(df[i] ?? 0) * (unbalance[j] - applied[j]);
                    maxBal = Math.Max(maxBal, Math.Abs(bal[i]));
                }
                if (maxBal <= tol) { converged = true; break; }
                bool stopHere = _o.Cycles is int k && cycles >= k;
                if (stopHere && (!_o.FinalBalance || !lastWasCarry)) break;
                for (int i = 0; i < n; i++) current[i] += bal[i];
                rows.Add(new DistributionRow(DistributionStep.Balance, cycles + 1, bal.Select(v => (double?)v).ToArray()));
                if (stopHere) break;
                // Carry over to far ends.
                var co = new double[n];
                double maxCo = 0;
                for (int i = 0; i < n; i++)
                {
                    if (bal[i] == 0 || _carry[i] == 0) continue;
                    int far = FarColumn(i);
                    co[far] += _carry[i] * bal[i];
                }
                for (int i = 0; i < n; i++) { current[i] += co[i]; maxCo = Math.Max(maxCo, Math.Abs(co[i])); }
                cycles++;
                rows.Add(new DistributionRow(DistributionStep.CarryOver, cycles, co.Select(v => (double?)v).ToArray()));
                lastWasCarry = true;
                if (maxCo <= tol) { converged = true; break; }
                if (_o.StopWhenCarryOversBelow is double limit && maxCo < limit)
                {
                    if (_o.FinalBalance)
                    {
                        var fb = new double[n];
                        var ub = new double[JointCount];
                        for (int i = 0; i < n; i++) ub[_jointOf[i]] += current[i];
                        for (int i = 0; i < n; i++)
                            if (_balanced[_jointOf[i]]) fb[i] = -(df[i] ?? 0) * (ub[_jointOf[i]] - applied[_jointOf[i]]);
                        for (int i = 0; i < n; i++) current[i] += fb[i];
                        rows.Add(new DistributionRow(DistributionStep.Balance, cycles + 1, fb.Select(v => (double?)v).ToArray()));
                    }
                    break;
                }
                if (_o.Cycles is int kk && cycles >= kk && !_o.FinalBalance) break;
                if (cycles >= maxCycles) break;
            }
            rows.Add(new DistributionRow(DistributionStep.Final, cycles, current.Select(v => (double?)v).ToArray()));
            return new DistributionTable(title, Columns, rows);
        }

        private int FarColumn(int i) => i % 2 == 0 ? i + 1 : i - 1;
    }
}
