using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary>
/// A row of the <c>loads</c> table whose case, target and direction are read: what a <see cref="LoadKind"/> needs to
/// read its own columns, check them and report what is wrong with them.
/// </summary>
internal sealed class LoadRow(TableView view, RawRow row, List<InputProblem> problems, UnitChoice? defaultLength,
    string caseId, string on, bool onMember, double length, LoadDirection direction)
{
    public string Case { get; } = caseId;

    /// <summary>The member or joint id the load acts on.</summary>
    public string On { get; } = on;

    public bool OnMember { get; } = onMember;

    /// <summary>Length of the member (m); 0 for a load on a joint.</summary>
    public double Length { get; } = length;

    public LoadDirection Direction { get; } = direction;

    /// <summary>The row, as the load's source.</summary>
    public SourceRef Where { get; } = view.RowRef(row);

    /// <summary>A number cell in SI (see <see cref="TableView.Number"/>).</summary>
    public double? Number(string column, bool required = false, string? requiredBecause = null) =>
        view.Number(row, column, required, requiredBecause);

    public void Error(string column, string message) => problems.Add(new InputProblem(view.CellRef(row, column), message));

    /// <summary>Whether a position (m) lies on the member; reports it in the column's unit when it does not.</summary>
    public bool InMember(string column, double value)
    {
        double tol = 1e-9 * Math.Max(1, Length);
        if (value >= -tol && value <= Length + tol) return true;
        string unit = view.Unit("a")?.Symbol ?? defaultLength?.Symbol ?? "m";
        double toSi = view.Unit("a")?.ToSi ?? 1;
        Error(column, Messages.LoadOutside(column, value / toSi, Length / toSi, unit));
        return false;
    }

    /// <summary>Warns about a negative magnitude (a load against its stated direction is legal, but often a slip).</summary>
    public void WarnNegative(string column, double value)
    {
        if (value < 0) problems.Add(new InputProblem(view.CellRef(row, column), Messages.NegativeMagnitude(column), ProblemSeverity.Warning));
    }
}
