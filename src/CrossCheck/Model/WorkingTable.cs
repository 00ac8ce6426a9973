namespace CrossCheck.Model;

/// <summary>A step of a moment-distribution working table.</summary>
public enum WorkingStep
{
    DistributionFactor,
    FixedEndMoment,
    Balance,
    CarryOver,
    Final,
}

/// <summary>A column of the author's working table: one member end.</summary>
public sealed record WorkingColumn(string Member, MemberEnd End, string Header, SourceRef Source, UnitChoice Unit);

/// <summary>
/// A row of the author's working table. Moments are N·m, clockwise member-end convention; distribution factors are
/// plain numbers. Blank cells are null. <see cref="Texts"/> keeps each cell as written (for its rounding).
/// </summary>
public sealed record WorkingRow(WorkingStep Step, string Label, IReadOnlyList<double?> Values, IReadOnlyList<string> Texts, SourceRef Source);

/// <summary>The moment-distribution working table an author submitted for one load case (optional table <c>distribution</c>).</summary>
public sealed record WorkingTable(string Case, IReadOnlyList<WorkingColumn> Columns, IReadOnlyList<WorkingRow> Rows);
