namespace CrossCheck.Import.Pdf;

/// <summary>A table found in a PDF: its header, columns, the lines of its rows, and the lines around it that speak about it.</summary>
internal sealed class FoundTable(HeaderMatch header)
{
    public HeaderMatch Header { get; } = header;
    public TableSpec Spec => Header.Spec;
    public List<FoundColumn> Columns { get; } = header.Cells.Select(c => new FoundColumn(c, c.Left, c.Right)).ToList();

    /// <summary>The lines of the rows, top to bottom (across pages when the table continues).</summary>
    public List<TextLine> RowLines { get; } = [];

    /// <summary>Load-case labels printed between rows (<c>Load case DL</c>): the label in force for each row line.</summary>
    public Dictionary<TextLine, (string Case, TextLine Label)> RowCase { get; } = [];

    /// <summary>Caption and group-header lines just above the header.</summary>
    public List<TextLine> Above { get; } = [];

    /// <summary>Note lines just below the last row (units, what parentheses mean).</summary>
    public List<TextLine> Below { get; } = [];

    /// <summary>
    /// The part of the same table printed before this one, when this part continues it on the next page under its header
    /// repeated: the caption's load case and the units of the first part hold for this one.
    /// </summary>
    public FoundTable? ContinuationOf { get; set; }

    /// <summary>The first printed part of the table this part belongs to.</summary>
    public FoundTable Origin => ContinuationOf?.Origin ?? this;

    /// <summary>The load-case label in force where this part of a table begins (printed in the part before).</summary>
    public (string Case, TextLine Label)? InheritedCase { get; set; }

    /// <summary>Second lines of wrapped text cells, by the row they belong to, with their column.</summary>
    public Dictionary<TextLine, List<(TextLine Line, int Column)>> Wrapped { get; } = [];

    /// <summary>Units from a units row under the header, by column index.</summary>
    public Dictionary<int, string>? UnitsRow { get; set; }

    /// <summary>True while the table ran to the foot of its page and may continue on the next.</summary>
    public bool Open { get; set; }

    /// <summary>The rows placed in columns (set when the document has been read).</summary>
    public List<TableLayout.Placed> Placed { get; set; } = [];

    public TextLine First => Header.Lines[0];
    public int LastPage => RowLines.Count > 0 ? RowLines[^1].Page : Header.Lines[^1].Page;
}
