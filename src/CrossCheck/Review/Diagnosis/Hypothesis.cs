namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// One tested mistake: the claims the author would have written had they made it (<see cref="Predicted"/>, clockwise
/// N·m, in the order of <see cref="DiagnosisContext.Keys"/>) and the sentence that names it.
/// </summary>
/// <param name="Code">Which mistake.</param>
/// <param name="Simplicity">Rank among mistakes that reproduce the claims equally well: the lower, the simpler (ties go to the simpler mistake).</param>
/// <param name="Predicted">The claims the mistake predicts.</param>
/// <param name="Message">What the author appears to have done, quoting the author's figures as written.</param>
internal sealed record Hypothesis(CauseCode Code, int Simplicity, double[] Predicted, string Message)
{
    /// <summary>Supporting detail for the memo.</summary>
    public string Evidence { get; init; } = "";

    /// <summary>What identifies this one mistake across cases (see <see cref="Cause.Identity"/>).</summary>
    public string Identity { get; init; } = "";

    /// <summary>Where the mistake is, when it is at one place.</summary>
    public Place? Place { get; init; }

    /// <summary>What the correct working gives, in the trade's words.</summary>
    public string CorrectWorking { get; init; } = "";

    /// <summary>Upper bound on the confidence (for hypotheses that fit more easily than they should).</summary>
    public double ConfidenceCap { get; init; } = 1;

    /// <summary>
    /// Place among the family's hypotheses in the order of the whole search (joint or member order), for a family that tries
    /// its candidates by evidence: equally good hypotheses rank in this order, whatever order they were tried in.
    /// </summary>
    public int Order { get; init; }
}

/// <summary>
/// A family of related mistakes (sidesway ignored, a wrong fixed-end moment, ...). Each proposes hypotheses for one
/// case; every hypothesis changes only its one thing and keeps the rest of the model as submitted (support movements,
/// hinges, the other loads). To add a family, add a class and a line in <see cref="Diagnoser"/>.
/// </summary>
internal interface IHypothesisFamily
{
    IEnumerable<Hypothesis> Propose(DiagnosisContext x);
}
