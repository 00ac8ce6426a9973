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

    /// <summary>
    /// Distributes every case of <paramref name="submission"/>. Where the author gave a working table for a case, the
    /// reference follows the author's method (plain 4EI/L or modified 3EI/L stiffness, as the audit found), so that the
    /// two tables can be compared row by row; otherwise modified stiffness.
    /// </summary>
    /// <param name="submission">The submission.</param>
    /// <param name="review">The review, whose table audits say which method the author used; null for modified stiffness throughout.</param>
    public static ReferenceWorking Compute(Submission submission, ReviewResult? review = null)
    {
        ArgumentNullException.ThrowIfNull(submission);
        if (submission.Model.Axial != AxialBehaviour.Rigid) return new ReferenceWorking(false, []);
        var cases = new List<ReferenceWorkingCase>();
        foreach (var c in submission.Cases)
        {
            var audit = review?.Cases.FirstOrDefault(x => x.Case == c.Id)?.Audit;
            bool modified = audit?.ModifiedStiffness ?? true;
            var options = new DistributionOptions(ModifiedStiffness: modified, StopWhenCarryOversBelow: StopBelow * submission.Info.Units.Moment.ToSi);
            try
            {
                var result = MomentDistribution.Run(submission.Model, c, options);
                cases.Add(new ReferenceWorkingCase(c.Id, result, [.. result.NoSway.Columns.Select(col => result.Moment(col.Member, col.End))], null)
                {
                    Method = Method(modified) + (audit is null ? "" : ", as in the author's table"),
                });
            }
            catch (NotSupportedException ex)
            {
                cases.Add(new ReferenceWorkingCase(c.Id, null, [], ex.Message));
            }
        }
        return new ReferenceWorking(true, cases);
    }

    private static string Method(bool modified) => modified ? "modified stiffness 3EI/L at pinned far ends" : "plain stiffness 4EI/L";
}

/// <summary>The reference distribution of one load case.</summary>
/// <param name="Case">The load case.</param>
/// <param name="Result">The distribution tables (no-sway, then one per sway correction); null when it could not be done.</param>
/// <param name="Final">The final member-end moments (N·m, clockwise), one per column of the no-sway table.</param>
/// <param name="Problem">Why the case could not be distributed, or null.</param>
public sealed record ReferenceWorkingCase(string Case, DistributionResult? Result, IReadOnlyList<double> Final, string? Problem)
{
    /// <summary>The stiffness the reference used: "plain stiffness 4EI/L, as in the author's table".</summary>
    public string Method { get; init; } = "modified stiffness 3EI/L at pinned far ends";
}
