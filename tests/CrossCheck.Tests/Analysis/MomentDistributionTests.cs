using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Moment distribution (Hardy Cross, common practice) as a second method: run to convergence it must give the
/// stiffness solver's end moments on every reference case of docs/REFERENCE-CHECKS.md, with plain and with modified
/// stiffness; stopped early it must reproduce the hand working of case 7.4.
/// </summary>
public class MomentDistributionTests
{
    public static TheoryData<string> Cases => new(ReferenceModels.All().Select(c => c.Id));

    [Theory]
    [MemberData(nameof(Cases))]
    public void Converged_AgreesWithTheStiffnessSolver(string id)
    {
        var b = ReferenceModels.All().First(c => c.Id == id).Model;
        var stiffness = b.Solve().Cases[0];
        double scale = Math.Max(1, stiffness.PeakMoment);
        foreach (bool modified in new[] { true, false })
        {
            var md = MomentDistribution.Run(b.Model, b.Cases[0], new DistributionOptions(ModifiedStiffness: modified));
            md.Converged.ShouldBeTrue();
            foreach (var m in b.Model.Members)
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                    Near.Equal(md.Moment(m.Id, end), stiffness.EndMoment(m.Id, end), relative: 0, absolute: 1e-8 * scale,
                        what: $"{id} {m.Id} {end} (modified stiffness {modified})");
        }
    }

    [Fact]
    public void StoppedWhenCarryOversFallBelowATenth_ReproducesTheHandWorkingOf74()
    {
        // docs/REFERENCE-CHECKS.md 7.4 (common practice): beam 4a, simultaneous balancing, modified stiffness 3EI/L at the
        // pinned ends, stop when every carry-over is below 0.1 kN·m, then a final balance: 6 cycles,
        // M_BA = 94.611213, M_CB = 66.627079 kN·m (exact 94.623912 and 66.638413).
        var b = ReferenceModels.Unequal(Restraint.Pinned);
        var md = MomentDistribution.Run(b.Model, b.Cases[0], new DistributionOptions(StopWhenCarryOversBelow: 0.1));
        md.Cycles.ShouldBe(6);
        Near.Equal(md.Moment("AB", MemberEnd.End), 94.611213, relative: 0, absolute: 2e-6);
        Near.Equal(md.Moment("BC", MemberEnd.Start), -94.611213, relative: 0, absolute: 2e-6);
        Near.Equal(md.Moment("BC", MemberEnd.End), 66.627079, relative: 0, absolute: 2e-6);
        Near.Equal(md.Moment("CD", MemberEnd.Start), -66.627079, relative: 0, absolute: 2e-6);
        Near.Equal(md.Moment("AB", MemberEnd.Start), 0, absolute: 1e-9);
    }

    [Fact]
    public void DistributionFactors_AreStiffnessShares()
    {
        // docs/REFERENCE-CHECKS.md 7.3 (common practice): K = 4EI/L far end fixed, 3EI/L far end pinned; DF = 0.406780, 0.169492, 0.423729.
        var b = ReferenceModels.All().First(c => c.Id == "7.3").Model;
        var table = MomentDistribution.Run(b.Model, b.Cases[0]).NoSway;
        var df = table.Rows[0].Values;
        int Col(string m) => table.Columns.ToList().IndexOf((m, MemberEnd.Start));
        Near.Equal(df[Col("BA")]!.Value, 0.406780, relative: 0, absolute: 1e-6);
        Near.Equal(df[Col("BC")]!.Value, 0.169492, relative: 0, absolute: 1e-6);
        Near.Equal(df[Col("BD")]!.Value, 0.423729, relative: 0, absolute: 1e-6);
    }

    [Fact]
    public void NoSwayOption_GivesTheBracedAnswer()
    {
        // Portal 5.3 under a horizontal joint load: braced, the columns take nothing and every moment is zero (statics).
        var b = ReferenceModels.Portal(0.5, Restraint.Fixed).Force("B", 30, LoadDirection.Right);
        var md = MomentDistribution.Run(b.Model, b.Cases[0], new DistributionOptions(SwayCorrection: false));
        md.Moments.Values.ShouldAllBe(v => Math.Abs(v) < 1e-9);
        var sway = MomentDistribution.Run(b.Model, b.Cases[0]);
        sway.Sway.ShouldHaveSingleItem();
        Near.Equal(sway.Moment("AB", MemberEnd.Start), -37.5, absolute: 1e-8); // Kleinlogel (from memory): −Hh(3k+1)/(2(6k+1))
    }
}
