using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>A cell of the author's working table that does not follow from the cells before it.</summary>
public sealed record WrongCell(string Row, int RowNumber, string Column, WorkingStep Step, double Found, double Expected, SourceRef Source);

/// <summary>The cell-by-cell audit of one working table.</summary>
/// <param name="Variant">Which stiffness the author's factors follow: plain 4EI/L or modified 3EI/L at pinned far ends.</param>
/// <param name="KnockOn">Largest change of a final moment (N·m) if the table is redone with correct arithmetic from its first wrong cell on.</param>
/// <param name="KnockOns">Per column of the table: the author's final moment minus the final moment with correct arithmetic.</param>
public sealed record WorkingAudit(string Case, string Variant, int CellsChecked, int CellsWrong, WrongCell? First, double KnockOn, string KnockOnColumn,
    IReadOnlyList<(string Member, MemberEnd End, double KnockOn)> KnockOns)
{
    /// <summary>True when the author's factors follow modified stiffness (3EI/L at pinned far ends).</summary>
    public bool ModifiedStiffness { get; init; }
}

/// <summary>
/// Audits an author's moment-distribution working table cell by cell: distribution factors against K/ΣK (plain 4EI/L
/// or modified 3EI/L), fixed-end moments against the loads, every balance against the unbalance at its joint split by
/// the factors, every carry-over against the balance at the member's other end, and the final row against the column
/// sums. Each cell is judged from the author's own previous cells, so one slip is found once, not everywhere after it.
/// </summary>
public static class WorkingTableAudit
{
    public static WorkingAudit Audit(Submission s, WorkingTable table, double absoluteTolerance)
    {
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(table);
        var ctx = new Ctx(s, table);
        // Which stiffness did the author use? The variant whose factors and fixed-end moments match more cells.
        var plain = ctx.Replay(modified: false, corrected: false, absoluteTolerance);
        var modified = ctx.Replay(modified: true, corrected: false, absoluteTolerance);
        bool useModified = modified.Wrong.Count <= plain.Wrong.Count;
        var audit = useModified ? modified : plain;
        var corrected = ctx.Replay(useModified, corrected: true, absoluteTolerance);
        double knock = 0;
        string knockColumn = "";
        // The author's final moments: the final row as written where there is one, else the column sums.
        var finalRow = table.Rows.LastOrDefault(r => r.Step == WorkingStep.Final);
        var authorFinal = audit.Final.Select((v, i) => finalRow?.Values[i] ?? v).ToArray();
        for (int i = 0; i < table.Columns.Count; i++)
        {
            double d = authorFinal[i] - corrected.Final[i];
            if (Math.Abs(d) > Math.Abs(knock)) { knock = d; knockColumn = table.Columns[i].Header; }
        }
        var knockOns = table.Columns.Select((c, i) => (c.Member, c.End, authorFinal[i] - corrected.Final[i])).ToList();
        return new WorkingAudit(table.Case, useModified ? "modified stiffness (3EI/L at pinned far ends)" : "plain stiffness (4EI/L)",
            audit.Checked, audit.Wrong.Count, audit.Wrong.FirstOrDefault(), knock, knockColumn, knockOns) { ModifiedStiffness = useModified };
    }

    private sealed class Ctx
    {
        private readonly Submission _s;
        private readonly WorkingTable _t;
        private readonly StructureModel _m;
        private readonly int[] _joint;        // joint index per column
        private readonly int[] _other;        // column of the member's other end, or −1
        private readonly Dictionary<string, int> _jointIndex;
        private readonly double[] _applied;
        private readonly (double S, double E)[] _fem; // clamped fixed-end moments per column's member

        public Ctx(Submission s, WorkingTable t)
        {
            _s = s;
            _t = t;
            _m = s.Model;
            _jointIndex = _m.Joints.Select((j, i) => (j.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
            int n = t.Columns.Count;
            _joint = new int[n];
            _other = new int[n];
            for (int i = 0; i < n; i++)
            {
                var c = t.Columns[i];
                _joint[i] = _jointIndex[_m.Member(c.Member).JointAt(c.End)];
                var far = c.End == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;
                _other[i] = t.Columns.ToList().FindIndex(x => x.Member == c.Member && x.End == far);
            }
            var loadCase = s.Case(t.Case) ?? new LoadCase(t.Case, []);
            _applied = new double[_m.Joints.Count];
            foreach (var l in loadCase.Loads.OfType<JointCouple>()) _applied[_jointIndex[l.Joint]] += l.M;
            var statics = new ClaimStatics(s);
            var kin = new Kinematics(_m);
            _fem = t.Columns.Select(c =>
            {
                var mem = _m.Member(c.Member);
                if (Overhang(mem, loadCase, statics) is { } cantilever) return cantilever;
                var (fs, fe) = statics.FixedEndMoments(t.Case, mem);
                // Support movements: the prescribed parts of the joint and chord rotations (slope-deflection).
                double L = _m.Length(mem), ei = mem.E * mem.I;
                double psi = kin.ChordRotation(mem).Constant, ta = kin.JointRotation(mem.Start).Constant, tb = kin.JointRotation(mem.End).Constant;
                return (fs + (2 * ei / L * ((2 * ta) + tb - (3 * psi))), fe + (2 * ei / L * (ta + (2 * tb) - (3 * psi))));
            }).ToArray();
        }

        /// <summary>The end moments of an overhang from statics alone: the cantilever moment of its own loads at the root, zero at the tip.</summary>
        private (double S, double E)? Overhang(Member m, LoadCase loadCase, ClaimStatics statics)
        {
            foreach (var tipEnd in new[] { MemberEnd.Start, MemberEnd.End })
            {
                if (!Tip(m, tipEnd) || Tip(m, Far(tipEnd))) continue;
                var root = _m.Joint(m.JointAt(Far(tipEnd)));
                string tip = m.JointAt(tipEnd);
                double moment = loadCase.Loads.Where(l => l is MemberLoad ml && ml.Member == m.Id || l is JointLoad jl && jl.Joint == tip)
                    .Sum(l => statics.Resultant(l, root.X, root.Y).Moment);
                return tipEnd == MemberEnd.End ? (moment, 0) : (0, moment);
            }
            return null;
        }

        private Member MemberOf(int i) => _m.Member(_t.Columns[i].Member);

        private bool PinLike(Member m, MemberEnd end)
        {
            var j = _m.Joint(m.JointAt(end));
            return !j.Restraint.HasFlag(Restraint.Rotation) && _m.MembersAt(j.Id).Count() == 1;
        }

        private static MemberEnd Far(MemberEnd e) => e == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;

        /// <summary>
        /// True for the free tip of an overhang: a joint with no support and this member alone. A cantilever has no
        /// rotational stiffness at its root (its tip moves freely), so it takes no distributed moment (DF 0) and its root
        /// moment is statical (common practice in hand distribution).
        /// </summary>
        private bool Tip(Member m, MemberEnd end)
        {
            var j = _m.Joint(m.JointAt(end));
            return j.Restraint == Restraint.Free && _m.MembersAt(j.Id).Count() == 1;
        }

        /// <summary>Rotational stiffness of a member end in the chosen variant (0 when released, or for an overhang).</summary>
        private double Stiffness(Member m, MemberEnd end, bool modified)
        {
            if (m.IsReleased(end) || Tip(m, Far(end)) || Tip(m, end)) return 0;
            double k = m.E * m.I / _m.Length(m);
            bool farPinned = m.IsReleased(Far(end)) || (modified && PinLike(m, Far(end)) && !PinLike(m, end));
            return farPinned ? 3 * k : 4 * k;
        }

        /// <summary>Expected distribution factor of column i, or null when any of 0, 1 or blank is acceptable (a released pin).</summary>
        private double? Factor(int i, bool modified)
        {
            var c = _t.Columns[i];
            var m = MemberOf(i);
            var joint = _m.Joints[_joint[i]];
            if (joint.Restraint.HasFlag(Restraint.Rotation)) return 0;
            if (Tip(m, c.End) || (modified && PinLike(m, c.End))) return null;
            double sum = _m.MembersAt(joint.Id).Sum(x => Stiffness(x, x.EndAt(joint.Id)!.Value, modified));
            return sum > 0 ? Stiffness(m, c.End, modified) / sum : 0;
        }

        private double Cof(int from, bool modified)
        {
            var m = MemberOf(from);
            var near = _t.Columns[from].End;
            if (m.IsReleased(Far(near))) return 0;
            if (modified && PinLike(m, Far(near)) && !PinLike(m, near)) return 0;
            return 0.5;
        }

        public sealed record Outcome(int Checked, List<WrongCell> Wrong, double[] Final);

        /// <summary>
        /// Walks the table row by row. With <paramref name="corrected"/> false every cell is checked against what the
        /// author's own earlier cells imply; with it true the table is redone with correct values throughout, keeping
        /// the author's pattern of rows and blank cells.
        /// </summary>
        public Outcome Replay(bool modified, bool corrected, double absTol)
        {
            int n = _t.Columns.Count;
            var state = new double[n];
            var df = new double?[n];
            for (int i = 0; i < n; i++) df[i] = Factor(i, modified);
            var wrong = new List<WrongCell>();
            int checkedCells = 0;
            var balSinceCarry = new double[n];
            for (int r = 0; r < _t.Rows.Count; r++)
            {
                var row = _t.Rows[r];
                var values = new double[n];
                var present = new bool[n];
                for (int i = 0; i < n; i++)
                {
                    double? found = row.Values[i];
                    if (found is null) continue;
                    double? expected = Expected(row.Step, i, state, df, balSinceCarry, modified, row, found.Value);
                    double use = found.Value;
                    if (expected is double e)
                    {
                        checkedCells++;
                        if (Math.Abs(found.Value - e) > Tolerance(row, i, e, absTol))
                            wrong.Add(new WrongCell(row.Label, r + 1, _t.Columns[i].Header, row.Step, found.Value, e,
                                row.Source with { Column = _t.Columns[i].Header, Text = row.Texts[i] }));
                        if (corrected) use = e;
                    }
                    values[i] = use;
                    present[i] = true;
                }
                switch (row.Step)
                {
                    case WorkingStep.DistributionFactor:
                        if (!corrected) for (int i = 0; i < n; i++) if (present[i]) df[i] = values[i];
                        break;
                    case WorkingStep.FixedEndMoment:
                        for (int i = 0; i < n; i++) state[i] = present[i] ? values[i] : _fem[i].Pick(_t.Columns[i].End);
                        break;
                    case WorkingStep.Balance:
                        for (int i = 0; i < n; i++) if (present[i]) { state[i] += values[i]; balSinceCarry[i] += values[i]; }
                        break;
                    case WorkingStep.CarryOver:
                        for (int i = 0; i < n; i++) if (present[i]) state[i] += values[i];
                        Array.Clear(balSinceCarry);
                        break;
                    case WorkingStep.Final:
                        break;
                }
            }
            return new Outcome(checkedCells, wrong, state);
        }

        private double? Expected(WorkingStep step, int i, double[] state, double?[] df, double[] balSinceCarry, bool modified, WorkingRow row, double found)
        {
            switch (step)
            {
                case WorkingStep.DistributionFactor:
                {
                    var f = Factor(i, modified);
                    if (f is null) return found is 0 or 1 ? found : 1; // a released pin: 0 or 1 both fine
                    return f;
                }
                case WorkingStep.FixedEndMoment:
                {
                    var (fs, fe) = _fem[i];
                    var end = _t.Columns[i].End;
                    double clamped = end == MemberEnd.Start ? fs : fe;
                    // The author may show the modified value (far pin released, half carried) instead.
                    var m = MemberOf(i);
                    if (m.IsReleased(Far(end)) || (modified && PinLike(m, Far(end)) && !PinLike(m, end)))
                    {
                        double far = end == MemberEnd.Start ? fe : fs;
                        double farTarget = m.IsReleased(Far(end)) ? 0 : _applied[_jointIndex[m.JointAt(Far(end))]];
                        double modifiedValue = clamped + ((farTarget - far) / 2);
                        if (Math.Abs(found - modifiedValue) < Math.Abs(found - clamped)) return modifiedValue;
                    }
                    if ((modified && PinLike(m, end) && !PinLike(m, Far(end))) || m.IsReleased(end))
                    {
                        double target = m.IsReleased(end) ? 0 : _applied[_joint[i]];
                        if (Math.Abs(found - target) < Math.Abs(found - clamped)) return target;
                    }
                    return clamped;
                }
                case WorkingStep.Balance:
                {
                    int j = _joint[i];
                    var joint = _m.Joints[j];
                    if (joint.Restraint.HasFlag(Restraint.Rotation)) return 0;
                    // Every stiff member end at the joint must be a column, or the unbalance is unknown.
                    var ends = _m.MembersAt(joint.Id).Where(x => !x.IsReleased(x.EndAt(joint.Id)!.Value)).ToList();
                    var cols = Enumerable.Range(0, state.Length).Where(k => _joint[k] == j).ToList();
                    if (cols.Count < ends.Count) return null;
                    double unbalance = cols.Sum(k => state[k]) - _applied[j];
                    var m = MemberOf(i);
                    double factor = df[i] ?? (PinLike(m, _t.Columns[i].End) ? 1 : 0);
                    if (modified && PinLike(m, _t.Columns[i].End) && df[i] is null or 0) factor = 1; // releasing the pin
                    return -factor * unbalance;
                }
                case WorkingStep.CarryOver:
                {
                    int from = _other[i];
                    if (from < 0) return null;
                    var m = MemberOf(from);
                    double cof = Cof(from, modified);
                    // Releasing a pin carries half to the near end even with modified stiffness.
                    if (modified && PinLike(m, _t.Columns[from].End) && !m.IsReleased(_t.Columns[i].End)) cof = 0.5;
                    return cof * balSinceCarry[from];
                }
                case WorkingStep.Final:
                    return state[i];
                default:
                    return null;
            }
        }

        private double Tolerance(WorkingRow row, int i, double expected, double absTol)
        {
            int decimals = Decimals(row.Texts[i]);
            if (row.Step == WorkingStep.DistributionFactor) return (0.51 * Math.Pow(10, -decimals)) + 0.002;
            double unit = _t.Columns[i].Unit.ToSi;
            double rounding = 0.5 * Math.Pow(10, -decimals) * unit;
            // Rounded entries accumulate: allow a few roundings, a small relative band, and half the review's floor.
            return Math.Max(Math.Max(3 * rounding, 0.005 * Math.Abs(expected)), 0.25 * absTol);
        }

        private static int Decimals(string text)
        {
            int dot = text.LastIndexOfAny(['.', ',']);
            if (dot < 0) return 0;
            int d = 0;
            for (int k = dot + 1; k < text.Length && char.IsAsciiDigit(text[k]); k++) d++;
            return d;
        }
    }

    private static double Pick(this (double S, double E) fem, MemberEnd end) => end == MemberEnd.Start ? fem.S : fem.E;

    /// <summary>The audit as a review flag: the first wrong cell and its effect on the final moments.</summary>
    public static Flag ToFlag(WorkingAudit a, Submission s, double agreeTolerance)
    {
        var mu = s.Info.Units.Moment;
        string M(double v) => $"{Fmt.Number(mu.FromSi(v), "0.0#")} {mu.Symbol}";
        if (a.First is null)
        {
            string ok = string.Create(CultureInfo.InvariantCulture, $"The moment-distribution table of case {a.Case} ({a.Variant}) was checked cell by cell ({a.CellsChecked} cells): its arithmetic is consistent.");
            return new Flag(FlagKind.DistributionTable, Severity.Info, new WorkingCellPlace(a.Case, null, null), null, ok, []) { Brief = ok };
        }
        var w = a.First;
        bool factor = w.Step == WorkingStep.DistributionFactor;
        string found = factor ? Fmt.Number(w.Found, "0.###") : M(w.Found);
        string expected = factor ? Fmt.Number(w.Expected, "0.###") : M(w.Expected);
        string why = w.Step switch
        {
            WorkingStep.DistributionFactor => "the member's share K/ΣK of the joint stiffness",
            WorkingStep.FixedEndMoment => "the fixed-end moment of the member's loads",
            WorkingStep.Balance => "the unbalance at the joint times the distribution factor, with the sign reversed",
            WorkingStep.CarryOver => "the carry-over factor times the balance at the member's other end",
            _ => "the sum of the column above",
        };
        var sev = Math.Abs(a.KnockOn) > agreeTolerance ? Severity.Major : Severity.Minor;
        string more = a.CellsWrong > 1 ? $" In all, {a.CellsWrong} of the {a.CellsChecked} cells checked do not follow from the cells before them." : "";
        return new Flag(FlagKind.DistributionTable, sev, new WorkingCellPlace(a.Case, w.Row, w.Column), w.Found - w.Expected,
            $"The moment-distribution table of case {a.Case} first goes wrong in row '{w.Row}', column {w.Column} ({w.Source.Citation}): it shows {found} where {why} gives {expected}. " +
            $"Redone with correct arithmetic from there on, the table's final moments change by up to {M(Math.Abs(a.KnockOn))} (column {a.KnockOnColumn}).{more}",
            [w.Source])
        {
            Brief = $"distribution table, case {a.Case}: row '{w.Row}', column {w.Column} shows {found} where {expected} follows",
        };
    }
}
