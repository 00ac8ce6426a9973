namespace CrossCheck.Review;

/// <summary>
/// The agreement and minor bands of one compared quantity in one case, computed once (SI units). A difference within
/// <see cref="Agree"/> agrees; within <see cref="Minor"/> it is a minor difference; beyond, it is discrepant. No code
/// sets a checking tolerance: the bands are the reviewer's choice (<see cref="ReviewOptions"/>).
/// </summary>
/// <param name="Agree">Largest difference that agrees.</param>
/// <param name="Minor">Largest difference that is minor (at least <paramref name="Agree"/>).</param>
public readonly record struct ToleranceBand(double Agree, double Minor)
{
    /// <summary>
    /// The bands of a quantity whose case peaks at <paramref name="peak"/>: the larger of the absolute floor and the
    /// relative share of the peak (docs/REVIEW-JSON.md, "status").
    /// </summary>
    /// <param name="options">The reviewer's tolerances.</param>
    /// <param name="peak">The case's peak of that quantity (SI).</param>
    /// <param name="floor">The absolute floor (SI), usually the option's absolute tolerance in the submission's unit.</param>
    public static ToleranceBand For(ReviewOptions options, double peak, double floor)
    {
        ArgumentNullException.ThrowIfNull(options);
        return new(Math.Max(floor, options.RelativeTolerance * peak), Math.Max(floor, options.MinorRelativeTolerance * peak));
    }

    /// <summary>The status of a claim that differs from the reference by <paramref name="difference"/>.</summary>
    public EndStatus Status(double difference)
    {
        double d = Math.Abs(difference);
        return d <= Agree ? EndStatus.Agree : d <= Minor ? EndStatus.Minor : EndStatus.Discrepant;
    }

    /// <summary>The severity of a check whose claims are out by <paramref name="error"/>: info within the agree band.</summary>
    public Severity Grade(double error)
    {
        double d = Math.Abs(error);
        return d <= Agree ? Severity.Info : d <= Minor ? Severity.Minor : Severity.Major;
    }

    /// <summary>True when <paramref name="difference"/> is within the agree band.</summary>
    public bool Agrees(double difference) => Math.Abs(difference) <= Agree;

    /// <summary>Both bands widened by the same amount (e.g. the rounding of the printed digits).</summary>
    public ToleranceBand Plus(double extra) => new(Agree + extra, Minor + extra);

    /// <summary>Both bands multiplied by <paramref name="factor"/>.</summary>
    public ToleranceBand Times(double factor) => new(Agree * factor, Minor * factor);
}
