using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// A raw table bound to its <see cref="TableSpec"/>: columns found by header name, units resolved from the
/// header (or a units row) or from the <c>info</c> defaults, and typed access to cells that records every
/// problem with its file, table, line and column.
/// </summary>
internal sealed class TableView
{
    private readonly Dictionary<string, int> _index = new(StringComparer.Ordinal);
    private readonly Dictionary<string, UnitChoice?> _units = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> _headerText = new(StringComparer.Ordinal);
    private readonly List<InputProblem> _problems;
    private readonly InputLimits _limits;

    public TableView(RawTable raw, TableSpec spec, UnitDefaults defaults, List<InputProblem> problems, bool relativeStiffness = false, InputLimits? limits = null)
    {
        Raw = raw;
        Spec = spec;
        _problems = problems;
        _limits = limits ?? InputLimits.Default;
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 0; i < raw.Header.Cells.Count; i++)
        {
            string cell = raw.Header.Cells[i];
            if (cell.Length == 0) continue;
            var (name, unitText) = TableSchema.SplitHeader(cell);
            if (unitText is null && raw.ColumnUnits?.TryGetValue(i, out var u) == true) unitText = u;
            var col = TableSchema.ResolveColumn(spec, name);
            var where = HeaderCellRef(cell);
            if (col is null)
            {
                problems.Add(new InputProblem(where, Messages.UnknownColumn(cell, spec), ProblemSeverity.Warning));
                continue;
            }
            if (!seen.Add(col.Name))
            {
                problems.Add(new InputProblem(where, Messages.DuplicateColumn(col.Name)));
                continue;
            }
            _index[col.Name] = i;
            _headerText[col.Name] = cell;
            if (col.Type != ColumnType.Number) continue;
            _units[col.Name] = ResolveUnit(col, unitText, defaults, where, relativeStiffness);
        }
        foreach (var col in spec.Columns.Where(c => c.Required && !_index.ContainsKey(c.Name)))
            problems.Add(new InputProblem(raw.HeaderAt(spec.Name, col.Name),
                Messages.MissingColumn(col, spec)));
    }

    public RawTable Raw { get; }
    public TableSpec Spec { get; }

    public IEnumerable<RawRow> Rows => Raw.Rows.Where(r => !r.IsBlank);

    public bool Has(string column) => _index.ContainsKey(column);

    public UnitChoice? Unit(string column) => _units.GetValueOrDefault(column);

    /// <summary>Whether the column had a unit of its own (not a default from <c>info</c>).</summary>
    public bool HasOwnUnit(string column)
    {
        if (!_index.TryGetValue(column, out int i)) return false;
        return TableSchema.SplitHeader(Raw.Header.Cells[i]).Unit is not null || Raw.ColumnUnits?.ContainsKey(i) == true;
    }

    public SourceRef RowRef(RawRow row) => Raw.RowAt(Spec.Name, row);

    public SourceRef CellRef(RawRow row, string column) =>
        Raw.CellAt(Spec.Name, row, _index.GetValueOrDefault(column, -1), _headerText.GetValueOrDefault(column, column), Printed(row, column));

    /// <summary>The cell as printed in the source (PDF cells are read in a normalised form; see <see cref="RawRow.Printed"/>).</summary>
    private string Printed(RawRow row, string column) =>
        _index.TryGetValue(column, out int i) && row.Printed is { } p && i < p.Count ? p[i] : Text(row, column);

    private SourceRef HeaderCellRef(string cell) => Raw.HeaderAt(Spec.Name, cell, Raw.Header.Cells.ToList().IndexOf(cell));

    /// <summary>The header cell of a column of the format (or the header row when the column is absent).</summary>
    public SourceRef HeaderRef(string column) =>
        Raw.HeaderAt(Spec.Name, _headerText.GetValueOrDefault(column), _index.TryGetValue(column, out int i) ? i : null);

    /// <summary>Trimmed cell text; empty when the column is absent.</summary>
    public string Text(RawRow row, string column) => _index.TryGetValue(column, out int i) ? row.Cell(i).Trim() : "";

    /// <summary>
    /// A length or coordinate cell (see <see cref="Number"/>) that must lie within <see cref="InputLimits.MaxLength"/>;
    /// null (with the problem reported) when it does not.
    /// </summary>
    public double? Length(RawRow row, string column, bool required = false)
    {
        double? v = Number(row, column, required);
        if (v is double x && Math.Abs(x) > _limits.MaxLength)
        {
            _problems.Add(new InputProblem(CellRef(row, column), Messages.TooLong(column, Text(row, column), Math.Abs(x), _limits.MaxLength)));
            return null;
        }
        return v;
    }

    /// <summary>An id cell; reports a problem when a required id is empty.</summary>
    public string? Id(RawRow row, string column, bool required = true)
    {
        string s = Text(row, column);
        if (s.Length > 0) return s;
        if (required && Has(column)) _problems.Add(new InputProblem(CellRef(row, column), Messages.EmptyId(column)));
        return null;
    }

    /// <summary>A number cell converted to SI; null when empty (or the column is absent). Reports text, NaN and overflow.</summary>
    public double? Number(RawRow row, string column, bool required = false, string? requiredBecause = null)
    {
        string s = Text(row, column);
        if (s.Length == 0)
        {
            // A required column that is missing altogether was reported once, at the header.
            if (required && (Has(column) || !Spec.Columns.Any(c => c.Required && c.Name == column)))
                _problems.Add(new InputProblem(CellRef(row, column), Has(column)
                    ? Messages.MissingValue(column, requiredBecause)
                    : Messages.MissingColumnForRow(column, requiredBecause)));
            return null;
        }
        if (!NumberText.TryParse(s, Raw.DecimalComma, out double v))
        {
            _problems.Add(new InputProblem(CellRef(row, column), Messages.NotANumber(column, s, Raw.DecimalComma)));
            return null;
        }
        if (!_units.TryGetValue(column, out var unit)) return v; // unit problem already reported at the header
        if (unit is null) return null;
        double si = v * unit.ToSi;
        if (!double.IsFinite(si) || Math.Abs(si) > _limits.MaxMagnitude || (v != 0 && Math.Abs(si) < _limits.MinMagnitude))
        {
            _problems.Add(new InputProblem(CellRef(row, column), Messages.OutOfRange(column, s)));
            return null;
        }
        return si;
    }

    private UnitChoice? ResolveUnit(ColumnSpec col, string? unitText, UnitDefaults defaults, SourceRef where, bool relativeStiffness)
    {
        if (unitText is { Length: > 0 })
        {
            if (col.Kind == QuantityKind.Number) return new UnitChoice(unitText, 1);
            var parsed = UnitReader.TryRead(unitText, col.Kind);
            if (parsed is null && col.Kind == QuantityKind.SecondMoment && (relativeStiffness || IsRelativeWord(unitText)) && IsRelativeWord(unitText))
                return new UnitChoice("", 1);
            if (parsed is null) _problems.Add(new InputProblem(where, Messages.BadUnit(unitText, col)));
            return parsed;
        }
        if (col.Kind == QuantityKind.Angle) return UnitReader.Radian;
        if (col.Kind == QuantityKind.Number) return new UnitChoice("", 1);
        if (col.Kind == QuantityKind.SecondMoment && relativeStiffness) return new UnitChoice("", 1);
        var d = defaults.For(col.Kind);
        if (d is null) _problems.Add(new InputProblem(where, Messages.NoUnit(col)));
        return d;
    }

    private static bool IsRelativeWord(string s) => TableSchema.IsRelativeUnit(s);
}

/// <summary>Default units from the <c>info</c> table (<c>force unit</c>, <c>length unit</c>).</summary>
internal sealed record UnitDefaults(UnitChoice? Force, UnitChoice? Length)
{
    public UnitChoice? For(QuantityKind kind) => kind switch
    {
        QuantityKind.Force => Force,
        QuantityKind.Length => Length,
        _ when Force is null || Length is null => null,
        _ => UnitReader.Derive(kind, Force, Length),
    };
}
