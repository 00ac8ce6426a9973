using CrossCheck.Model;

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
