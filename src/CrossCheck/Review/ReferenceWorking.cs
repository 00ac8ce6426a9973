using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// CrossCheck's own moment distribution of every load case (<c>--show-working</c>), carried until the carry-overs fall
/// below <see cref="StopBelow"/> moment units as is usual by hand, with the sway corrections, so that an author can compare
/// it row by row with their own. Computed here, with the review; the memo only formats it.
/// </summary>
/// <param name="Available">False when moment distribution does not apply to the submission (elastic axial behaviour).</param>
/// <param name="Cases">One per load case, in the submission's order (empty when not available).</param>
public sealed record ReferenceWorking(bool Available, IReadOnlyList<ReferenceWorkingCase> Cases)
{
    /// <summary>Distribution stops when every carry-over is below this many of the submission's moment units.</summary>
    public const double StopBelow = 0.1;

    /// <summary>Distributes every case of <paramref name="submission"/>.</summary>
    public static ReferenceWorking Compute(Submission submission)
    {
        ArgumentNullException.ThrowIfNull(submission);
        if (submission.Model.Axial != AxialBehaviour.Rigid) return new ReferenceWorking(false, []);
        var options = new DistributionOptions(StopWhenCarryOversBelow: StopBelow * submission.Info.Units.Moment.ToSi);
        var cases = new List<ReferenceWorkingCase>();
        foreach (var c in submission.Cases)
        {
            try
            {
                var result = MomentDistribution.Run(submission.Model, c, options);
                cases.Add(new ReferenceWorkingCase(c.Id, result, [.. result.NoSway.Columns.Select(col => result.Moment(col.Member, col.End))], null));
            }
            catch (NotSupportedException ex)
            {
                cases.Add(new ReferenceWorkingCase(c.Id, null, [], ex.Message));
            }
        }
        return new ReferenceWorking(true, cases);
    }
}

/// <summary>The reference distribution of one load case.</summary>
/// <param name="Case">The load case.</param>
/// <param name="Result">The distribution tables (no-sway, then one per sway correction); null when it could not be done.</param>
/// <param name="Final">The final member-end moments (N·m, clockwise), one per column of the no-sway table.</param>
/// <param name="Problem">Why the case could not be distributed, or null.</param>
public sealed record ReferenceWorkingCase(string Case, DistributionResult? Result, IReadOnlyList<double> Final, string? Problem);
