using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A moment distribution stopped after a few cycles, with or without a final balance. A mistake of method: tried only when
/// the differences spread as one would (<see cref="Evidence.MethodMistakePlausible"/>).
/// </summary>
internal sealed class StoppedEarlyFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        // Many stopping points are tried: with fewer than five claimed ends one of them could match by chance.
        if (x.Model.Axial != AxialBehaviour.Rigid || x.Keys.Count < 5 || !x.Evidence.MethodMistakePlausible) yield break;
        // The signature of stopping early is in the joints: after a final balance every joint balances; stopped after a
        // carry-over, each joint is out by exactly its last carry-overs. Many stopping points are tried, so without the
        // signature a match could be chance.
        bool jointsBalance = !x.Review.Flags.Any(f => f.Kind is FlagKind.JointEquilibrium or FlagKind.ReleasedEnd && f.Severity != Severity.Info);
        // With a sway correction there is no last carry-over row to compare, so a distribution stopped without a final
        // balance has no signature to show: it is not formed (the same as forming it and finding no joint to compare).
        bool sways = new Kinematics(x.Model).CanSway;
        foreach (bool modified in new[] { true, false })
            foreach (bool finalBalance in new[] { true, false })
            {
                if ((finalBalance && !jointsBalance) || (!finalBalance && sways)) continue;
                foreach (var stop in MomentDistribution.StoppedAfterEachCycle(x.Model, x.Case, modified, finalBalance, 15))
                {
                    int k = stop.Cycles;
                    string ending = finalBalance ? "with a final balance" : "straight after the carry-over, without a final balance";
                    string evidence = "";
                    if (!finalBalance)
                    {
                        var (worst, joints) = CarryOverMismatch(x, stop);
                        if (joints == 0 || worst > x.Agree) continue;
                        evidence = $"The claimed joints are out of balance by the last carry-overs (to within {x.Moment(worst)}).";
                    }
                    yield return new Hypothesis(CauseCode.StoppedEarly, 4, x.From(stop.Moments),
                        string.Create(CultureInfo.InvariantCulture,
                            $"The claims match a moment distribution ({(modified ? "modified stiffness at pinned ends" : "plain stiffness")}) stopped after {k} cycle{(k == 1 ? "" : "s")}, {ending}."))
                    {
                        Evidence = evidence,
                        CorrectWorking = "Carry the distribution on until the carry-overs are negligible.",
                        Identity = $"stopped-early|{k}|{modified}|{finalBalance}",
                    };
                }
            }
    }

    /// <summary>How far the claimed joint unbalances are from the last carry-overs of a distribution, and over how many joints.</summary>
    private static (double Worst, int Joints) CarryOverMismatch(DiagnosisContext x, MomentDistribution.Stopped stop)
    {
        if (stop.LastCarryOver is not { } last) return (0, 0);
        var cols = stop.Columns.Select((c, i) => (c, i)).ToDictionary(t => t.c, t => t.i);
        double worst = 0;
        int joints = 0;
        foreach (var j in x.Model.Joints.Where(j => !j.Restraint.HasFlag(Restraint.Rotation)))
        {
            var at = x.Model.MembersAt(j.Id).Select(m => new EndKey(m.Id, m.EndAt(j.Id)!.Value)).ToList();
            if (!at.All(k => x.IndexOf(k) >= 0)) continue;
            double claimedSum = at.Sum(k => x.Claimed[x.IndexOf(k)]);
            double coSum = at.Sum(k => last[cols[(k.Member, k.End)]]);
            double applied = x.Case.Loads.OfType<JointCouple>().Where(l => l.Joint == j.Id).Sum(l => l.M);
            worst = Math.Max(worst, Math.Abs(claimedSum - applied - coSum));
            joints++;
        }
        return (worst, joints);
    }
}
