using CrossCheck.Model;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Analysis;

/// <summary>
/// Hardy Cross moment distribution with simultaneous balancing, and sway correction by superposing one sway case
/// per independent translation (storey equations by virtual work). A second, independent method next to the
/// stiffness solver: it cross-checks the solver, reproduces what an author stopping early or using a wrong factor
/// would have written, and prints a reference working table. Axially rigid frames only (as hand methods assume).
/// </summary>
/// <remarks>
/// The set-out (<see cref="DistributionFrame"/>), the fixed-end moments (<see cref="DistributionLoads"/>), the
/// balancing and its stop rules (<see cref="BalancingEngine"/>) and the sway correction (<see cref="SwayEquations"/>)
/// live in files of their own; this class puts them together.
/// </remarks>
public static class MomentDistribution
{
    /// <exception cref="NotSupportedException">Axial behaviour is elastic, or a sway case cannot be formed.</exception>
    public static DistributionResult Run(StructureModel model, LoadCase loadCase, DistributionOptions? options = null) => Run(model, loadCase, options, record: true);

    /// <summary>The same distribution with its tables holding only their final rows: the answer of a large frame without its many rows.</summary>
    /// <exception cref="NotSupportedException">Axial behaviour is elastic, or a sway case cannot be formed.</exception>
    internal static DistributionResult Answer(StructureModel model, LoadCase loadCase, DistributionOptions options) => Run(model, loadCase, options, record: false);

    private static DistributionResult Run(StructureModel model, LoadCase loadCase, DistributionOptions? options, bool record)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(loadCase);
        options ??= DistributionOptions.Converged;
        if (model.Axial != AxialBehaviour.Rigid)
            throw new NotSupportedException("Moment distribution assumes axially rigid members.");
        var frame = new DistributionFrame(model, options);

        // No-sway stage: loads, support movements, applied couples; translations held.
        var fem = DistributionLoads.FixedEndMoments(frame, loadCase);
        var noSway = BalancingEngine.Distribute(frame, fem, DistributionLoads.AppliedCouples(frame, loadCase), "no sway", out int cycles, out bool converged, record: record);
        var final = noSway.Final.Select(v => v ?? 0).ToArray();

        var sway = new List<SwayCorrection>();
        var modes = SwayEquations.Modes(frame);
        if (options.SwayCorrection && modes.Count > 0)
        {
            var tables = new List<DistributionTable>();
            foreach (var mode in modes)
            {
                var swayFem = SwayEquations.FixedEndMoments(frame, mode, SwayEquations.Scale(frame, mode));
                var (joint, dir) = frame.Kinematics.Describe(mode);
                var table = BalancingEngine.Distribute(frame, swayFem, new double[frame.JointCount], $"sway of joint {joint} in {dir}", out int c2, out bool conv2, record: record);
                cycles = Math.Max(cycles, c2);
                converged &= conv2;
                tables.Add(table);
            }
            var loadWork = modes.Select(m => SwayEquations.LoadWork(frame, m, loadCase)).ToArray();
            Vector<double> factors;
            try { factors = SwayEquations.Factors(frame, modes, final, tables.Select(t => t.Final.Select(v => v ?? 0).ToArray()).ToList(), loadWork); }
            catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
            {
                throw new NotSupportedException("The sway equations of this frame are singular.", ex);
            }
            for (int s = 0; s < modes.Count; s++)
            {
                var f = tables[s].Final;
                for (int i = 0; i < final.Length; i++) final[i] += factors[s] * (f[i] ?? 0);
                sway.Add(new SwayCorrection(tables[s].Title, factors[s], tables[s]));
            }
        }
        return new DistributionResult(MomentsByEnd(frame, final), noSway, sway, cycles, converged);
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
        var frame = new DistributionFrame(model, options);
        var main = BalancingEngine.Stages(frame, DistributionLoads.FixedEndMoments(frame, loadCase), DistributionLoads.AppliedCouples(frame, loadCase), maxCycles, finalBalance);
        var modes = SwayEquations.Modes(frame);
        var swayStages = modes.Select(mode =>
            BalancingEngine.Stages(frame, SwayEquations.FixedEndMoments(frame, mode, SwayEquations.Scale(frame, mode)), new double[frame.JointCount], maxCycles, finalBalance)).ToList();
        var loadWork = modes.Select(m => SwayEquations.LoadWork(frame, m, loadCase)).ToArray();
        var list = new List<Stopped>();
        for (int k = 0; k < main.Count; k++)
        {
            var final = (double[])main[k].State.Clone();
            if (modes.Count > 0)
            {
                var sway = swayStages.Select(st => st[Math.Min(k, st.Count - 1)].State).ToList();
                Vector<double> factors;
                try { factors = SwayEquations.Factors(frame, modes, final, sway, loadWork); }
                catch (Exception ex) when (ex is ArgumentException or InvalidOperationException) { break; }
                for (int s = 0; s < modes.Count; s++)
                    for (int i = 0; i < final.Length; i++) final[i] += factors[s] * sway[s][i];
            }
            list.Add(new Stopped(main[k].Cycles, MomentsByEnd(frame, final), modes.Count == 0 && !finalBalance ? main[k].LastCarryOver : null, frame.Columns));
            if (main[k].Converged) break;
        }
        return list;
    }

    private static Dictionary<(string, MemberEnd), double> MomentsByEnd(DistributionFrame frame, double[] final)
    {
        var moments = new Dictionary<(string, MemberEnd), double>();
        for (int i = 0; i < frame.Columns.Count; i++) moments[frame.Columns[i]] = final[i];
        return moments;
    }
}
