namespace CrossCheck.Analysis;

/// <summary>
/// The Hardy Cross balancing itself: distribution factors, the one-off release of pins (modified stiffness), then
/// simultaneous balance and carry-over cycles under the stop rules of <see cref="DistributionOptions"/>, every row
/// written down as it would be by hand.
/// </summary>
internal static class BalancingEngine
{
    private const int MaxCycles = 2000;

    /// <summary>The state after one cycle of a distribution stopped there.</summary>
    /// <param name="Cycles">Balance + carry-over cycles done.</param>
    /// <param name="State">End moments by column (after the final balance when one is asked for).</param>
    /// <param name="LastCarryOver">The carry-over row of that cycle (null with a final balance).</param>
    /// <param name="Converged">The carry-overs of that cycle were round-off.</param>
    public sealed record Stage(int Cycles, double[] State, double[]? LastCarryOver, bool Converged);

    /// <summary>The state after each of 1..maxCycles cycles (with a final balance when asked), from one run.</summary>
    public static List<Stage> Stages(DistributionFrame frame, double[] fem, double[] applied, int maxCycles, bool finalBalance)
    {
        var table = Distribute(frame, fem, applied, "", out _, out _, maxCycles);
        var stages = new List<Stage>();
        int n = frame.Columns.Count;
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

    /// <summary>One distribution from the fixed-end moments <paramref name="fem"/> with couples <paramref name="applied"/> at the joints.</summary>
    /// <param name="record">Write every row down; without it the table holds the final row only (a large frame's many cycles are not kept).</param>
    public static DistributionTable Distribute(DistributionFrame frame, double[] fem, double[] applied, string title, out int cycles, out bool converged,
        int maxCycles = MaxCycles, bool record = true)
    {
        var o = frame.Options;
        var columns = frame.Columns;
        var jointOf = frame.JointOf;
        var balanced = frame.Balanced;
        var stiffness = frame.Stiffness;
        var carry = frame.Carry;
        int jointCount = frame.JointCount;
        int n = columns.Count;
        var rows = new List<DistributionRow>();
        var df = new double?[n];
        var sum = new double[jointCount];
        for (int i = 0; i < n; i++) if (balanced[jointOf[i]]) sum[jointOf[i]] += stiffness[i];
        for (int i = 0; i < n; i++) df[i] = balanced[jointOf[i]] && sum[jointOf[i]] > 0 ? stiffness[i] / sum[jointOf[i]] : 0;
        if (record) rows.Add(new DistributionRow(DistributionStep.DistributionFactor, 0, df));
        var current = (double[])fem.Clone();
        // Modified stiffness: release each pin once, carrying half of its release to the near end.
        for (int i = 0; i < n; i++)
        {
            if (!frame.PinnedFar[i]) continue;
            int far = DistributionFrame.FarColumn(i);
            var m = frame.Model.Member(columns[i].Member);
            double target = m.IsReleased(columns[far].End) ? 0 : applied[jointOf[far]];
            double release = target - current[far];
            current[far] = target;
            current[i] += release / 2;
        }
        if (record) rows.Add(new DistributionRow(DistributionStep.FixedEndMoment, 0, current.Select(v => (double?)v).ToArray()));
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
            var unbalance = new double[jointCount];
            for (int i = 0; i < n; i++) unbalance[jointOf[i]] += current[i];
            for (int i = 0; i < n; i++)
            {
                int j = jointOf[i];
                if (!balanced[j]) continue;
                bal[i] = -(df[i] ?? 0) * (unbalance[j] - applied[j]);
                maxBal = Math.Max(maxBal, Math.Abs(bal[i]));
            }
            if (maxBal <= tol) { converged = true; break; }
            bool stopHere = o.Cycles is int k && cycles >= k;
            if (stopHere && (!o.FinalBalance || !lastWasCarry)) break;
            for (int i = 0; i < n; i++) current[i] += bal[i];
            if (record) rows.Add(new DistributionRow(DistributionStep.Balance, cycles + 1, bal.Select(v => (double?)v).ToArray()));
            if (stopHere) break;
            // Carry over to far ends.
            var co = new double[n];
            double maxCo = 0;
            for (int i = 0; i < n; i++)
            {
                if (bal[i] == 0 || carry[i] == 0) continue;
                int far = DistributionFrame.FarColumn(i);
                co[far] += carry[i] * bal[i];
            }
            for (int i = 0; i < n; i++) { current[i] += co[i]; maxCo = Math.Max(maxCo, Math.Abs(co[i])); }
            cycles++;
            if (record) rows.Add(new DistributionRow(DistributionStep.CarryOver, cycles, co.Select(v => (double?)v).ToArray()));
            lastWasCarry = true;
            if (maxCo <= tol) { converged = true; break; }
            if (o.StopWhenCarryOversBelow is double limit && maxCo < limit)
            {
                if (o.FinalBalance)
                {
                    var fb = new double[n];
                    var ub = new double[jointCount];
                    for (int i = 0; i < n; i++) ub[jointOf[i]] += current[i];
                    for (int i = 0; i < n; i++)
                        if (balanced[jointOf[i]]) fb[i] = -(df[i] ?? 0) * (ub[jointOf[i]] - applied[jointOf[i]]);
                    for (int i = 0; i < n; i++) current[i] += fb[i];
                    if (record) rows.Add(new DistributionRow(DistributionStep.Balance, cycles + 1, fb.Select(v => (double?)v).ToArray()));
                }
                break;
            }
            if (o.Cycles is int kk && cycles >= kk && !o.FinalBalance) break;
            if (cycles >= maxCycles) break;
        }
        rows.Add(new DistributionRow(DistributionStep.Final, cycles, current.Select(v => (double?)v).ToArray()));
        return new DistributionTable(title, columns, rows);
    }
}
