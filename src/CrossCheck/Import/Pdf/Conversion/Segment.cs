using System.Globalization;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>A column of a segment: the format's column (null = not part of the format), and its unit.</summary>
internal sealed record SegmentColumn(ColumnSpec? Column, string Header, string? Unit, string? External, string Printed)
{
    /// <summary>How the column's role was decided, for <c>crosscheck extract</c>.</summary>
    public Roles.RoleDecision? Decision { get; init; }

    public string? EffectiveUnit => Unit ?? External;
}

/// <summary>A row of a segment: its line, the cells as the importer reads them and as printed.</summary>
internal sealed record SegmentRow(TextLine Line, List<string> Cells, List<string> Printed);

/// <summary>A table (or a printed part of one) as text cells, ready to become a <see cref="RawTable"/>.</summary>
internal sealed class Segment
{
    public Segment(TableSpec spec, FoundTable source)
    {
        Spec = spec;
        Source = source;
        var lines = source.Header.Lines.Concat(source.RowLines).ToList();
        foreach (var g in lines.GroupBy(l => l.Page)) Parts.Add((g.Key, g.Min(l => l.Number), g.Max(l => l.Number)));
    }

    public TableSpec Spec { get; }
    public FoundTable Source { get; }
    public List<SegmentColumn> Columns { get; } = [];
    public List<SegmentRow> Rows { get; } = [];

    /// <summary>The printed headers of a wide table (one column per member end) this segment was turned from.</summary>
    public List<string>? WideFrom { get; set; }

    public List<(int Page, int First, int Last)> Parts { get; } = [];

    public IEnumerable<SegmentColumn> Known => Columns.Where(c => c.Column is not null);

    public string Where => string.Create(CultureInfo.InvariantCulture, $"p.{Source.First.Page} line {Source.First.Number}");

    public int Index(string column) => Columns.FindIndex(c => c.Column?.Name == column);

    public void Append(Segment other)
    {
        var map = Columns.Select(c => c.Column is null ? -1 : other.Columns.FindIndex(o => o.Column == c.Column)).ToList();
        foreach (var r in other.Rows)
            Rows.Add(new SegmentRow(r.Line, map.Select(i => i < 0 ? "" : r.Cells[i]).ToList(), map.Select(i => i < 0 ? "" : r.Printed[i]).ToList()));
        if (other.WideFrom is { } w) WideFrom = [.. WideFrom ?? [], .. w];
        Parts.AddRange(other.Parts);
    }

    public RawTable ToRaw(string file)
    {
        var header = Columns.Select(c => c.Unit is { } u ? $"{c.Header} [{u}]" : c.Header).ToList();
        var units = new Dictionary<int, string>();
        for (int k = 0; k < Columns.Count; k++) if (Columns[k].Unit is null && Columns[k].External is { } e) units[k] = e;
        var rows = Rows.Select(r => new RawRow(r.Line.Number, r.Cells, r.Line.Page, r.Printed)).ToList();
        return new RawTable(Spec.Name, file, new RawRow(Source.First.Number, header, Source.First.Page), rows, false, units.Count > 0 ? units : null);
    }
}
