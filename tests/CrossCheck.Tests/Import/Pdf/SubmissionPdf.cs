using System.Globalization;
using System.Text.RegularExpressions;
using CrossCheck.Import;

namespace CrossCheck.Tests.Import.Pdf;

public enum UnitPlacement
{
    /// <summary><c>x [m]</c></summary>
    Brackets,
    /// <summary><c>x (m)</c></summary>
    Parentheses,
    /// <summary>A row of units under the header.</summary>
    UnitsRow,
    /// <summary>A <c>Units: m, kN</c> line above the table, one unit per kind of quantity.</summary>
    UnitsLine,
}

public enum NumberLook
{
    Plain,
    /// <summary>Negative numbers with the Unicode minus sign.</summary>
    UnicodeMinus,
    /// <summary>Thousands separated by commas (<c>160,000,000</c>).</summary>
    Thousands,
    /// <summary>Negative numbers in parentheses, with a note saying so.</summary>
    Parentheses,
}

/// <summary>How to lay out a submission as a calculation PDF.</summary>
public sealed record Layout(string Name)
{
    public Face Face { get; init; } = Face.Helvetica;
    public double Size { get; init; } = 9;
    public bool Synonyms { get; init; }
    public UnitPlacement Units { get; init; } = UnitPlacement.Brackets;
    public int? ShuffleVariant { get; init; }
    public NumberLook Numbers { get; init; } = NumberLook.Plain;
    public bool RightAlign { get; init; } = true;
    public Align HeaderAlign { get; init; } = Align.Left;
    public bool WideMoments { get; init; }
    public bool CaseLabels { get; init; }
    /// <summary>Start a new page halfway through the end-moment table.</summary>
    public bool BreakInTable { get; init; }
    public bool RepeatHeader { get; init; } = true;
    public bool Prose { get; init; }
    public bool Landscape { get; init; }
    public double? ColumnWidthEm { get; init; }
    public double GapEm { get; init; } = 1.5;
    public string? RunningHeader { get; init; }
    /// <summary>The header to print for a column of a table (null: as the other settings say).</summary>
    public Func<string, string, string?>? Rename { get; init; }

    public override string ToString() => Name;
}

/// <summary>
/// Renders a submission (its tables as read from CSV) as a calculation PDF in a given <see cref="Layout"/>: title
/// block as <c>key: value</c> lines, then each table with a caption, in the layout's fonts, header words, unit
/// placement, column order and number style. The fixtures of the round-trip tests.
/// </summary>
public static class SubmissionPdf
{
    public static IReadOnlyList<RawTable> ReadCsv(string path)
    {
        var problems = new List<InputProblem>();
        if (Directory.Exists(path))
        {
            return Directory.GetFiles(path, "*.csv").Order(StringComparer.Ordinal)
                .Select(f => CsvTableReader.ReadSingle(f, Path.GetFileName(f), Path.GetFileNameWithoutExtension(f), problems)!)
                .Where(t => t is not null).ToList();
        }
        return CsvTableReader.ReadSectioned(path, Path.GetFileName(path), problems);
    }

    private static readonly Dictionary<string, string> Words = new(StringComparer.Ordinal)
    {
        ["joint"] = "Joint", ["x"] = "x", ["y"] = "y", ["restraint"] = "Support type", ["settle x"] = "Settlement x", ["settle y"] = "Settlement y",
        ["settle rotation"] = "Settlement rotation", ["member"] = "Member", ["start"] = "Start joint", ["end"] = "End joint", ["E"] = "Elastic modulus",
        ["I"] = "Second moment of area", ["A"] = "Section area", ["hinge"] = "Releases", ["support"] = "Support", ["span"] = "Span",
        ["length"] = "Span length", ["case"] = "Load case", ["on"] = "Applied to", ["kind"] = "Load type", ["P"] = "Force", ["w"] = "Intensity",
        ["w end"] = "Intensity end", ["M"] = "Moment", ["a"] = "Position", ["b"] = "End at", ["dir"] = "Direction", ["at"] = "At joint",
        ["moment"] = "End moment", ["Rx"] = "H", ["Ry"] = "V", ["ux"] = "Sway", ["uy"] = "Deflection", ["rotation"] = "Rotation",
    };

    public static byte[] Render(IReadOnlyList<RawTable> tables, Layout layout) => RenderWithTruth(tables, layout).Pdf;

    /// <summary>
    /// The PDF, and what it prints in the form of the submission format (the reference for measuring how many cells
    /// a reader gets right): a wide end-moment table as its long form, row by row in printed order; load-case labels as a
    /// case column; units in the headers wherever they were printed.
    /// </summary>
    public static (byte[] Pdf, List<RawTable> Printed) RenderWithTruth(IReadOnlyList<RawTable> tables, Layout layout)
    {
        var printed = new List<RawTable>();
        var w = new PdfFixtureWriter(layout.Face, layout.Size, layout.Landscape, layout.RunningHeader);
        w.Text("Structural calculation (test fixture)", 1.5 * layout.Size, bold: true).Gap(0.5);
        var info = tables.FirstOrDefault(t => TableSchema.Find(t.Name) == TableSchema.Info);
        if (info is not null)
        {
            var rows = info.Rows.Where(r => !r.IsBlank && r.Cell(1).Length > 0).ToList();
            foreach (var r in rows) w.Text($"{r.Cell(0)}: {r.Cell(1)}");
            printed.Add(Truth("info", ["key", "value"], rows.Select(r => (IReadOnlyList<string>)[r.Cell(0), r.Cell(1)])));
        }
        if (layout.Numbers == NumberLook.Parentheses) w.Text("Negative values are shown in brackets.");
        if (layout.Prose)
            w.Paragraph("The analysis below is a linear elastic analysis of the structure described by the following tables. " +
                        "Every value is in the units stated with its table; the moments carried forward are listed last.");
        var geometry = Geometry(tables);
        int n = 0;
        foreach (var t in tables)
        {
            var spec = TableSchema.Find(t.Name);
            if (spec is null || spec == TableSchema.Info) continue;
            n++;
            w.Heading($"{n}. {Capital(spec.Name.Replace('-', ' '))}");
            if (layout.Prose && n % 2 == 0) w.Paragraph($"Table {n} lists the {spec.Name.Replace('-', ' ')} as used in the calculation, row by row.");
            if (spec == TableSchema.EndMoments && layout.WideMoments && Wide(t, geometry, layout) is var (wide, wideEnds) && wide is not null)
            {
                // Six member ends to a table, as a page-wide calc sheet would print them.
                int parts = 0;
                var longRows = new List<IReadOnlyList<string>>();
                for (int from = 1; from < wide.Header.Count; from += 6)
                {
                    int count = Math.Min(6, wide.Header.Count - from);
                    var part = new FixtureTable(
                        [wide.Header[0], .. wide.Header.Skip(from).Take(count)],
                        wide.Rows.Select(r => (IReadOnlyList<string>)[r[0], .. r.Skip(from).Take(count)]).ToList());
                    string title = parts++ == 0 ? $"Table {n}: final end moments{wide.Caption}" : $"Table {n} (continued){wide.Caption}";
                    w.Table(Style(part, layout) with { Caption = title });
                    foreach (var row in wide.Rows)
                        for (int k = from; k < from + count; k++)
                            if (row[k].Length > 0) longRows.Add([row[0], wideEnds[k - 1].Member, wideEnds[k - 1].At, Plain(row[k])]);
                }
                string unit = wide.Caption is { Length: > 0 } cap ? $" {cap.Trim()}" : "";
                printed.Add(Truth("end-moments", ["case", "member", "at", $"moment{unit}"], longRows));
                continue;
            }
            var (fixture, truth) = Fixture(t, spec, layout);
            w.Table(fixture with { Caption = fixture.Caption ?? $"Table {n}: {spec.Name.Replace('-', ' ')}" });
            printed.Add(truth);
        }
        return (w.Build(), printed);
    }

    private static RawTable Truth(string name, IReadOnlyList<string> header, IEnumerable<IReadOnlyList<string>> rows) =>
        new(name, "printed", new RawRow(1, header), rows.Select((r, i) => new RawRow(i + 2, r)).ToList());

    /// <summary>A number as printed, back in its plain form (the reference for a reader).</summary>
    private static string Plain(string printed)
    {
        string s = printed.Replace('−', '-').Replace(",", "", StringComparison.Ordinal);
        return s.StartsWith('(') && s.EndsWith(')') ? "-" + s[1..^1] : s;
    }

    private static string Capital(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];

    private sealed record Column(ColumnSpec? Spec, string Name, string? Unit, int Index);

    private static (FixtureTable Table, RawTable Truth) Fixture(RawTable t, TableSpec spec, Layout layout)
    {
        var cols = new List<Column>();
        for (int i = 0; i < t.Header.Cells.Count; i++)
        {
            var (name, unit) = TableSchema.SplitHeader(t.Header.Cells[i]);
            var c = TableSchema.ResolveColumn(spec, name);
            if (c is null) continue;
            string printedName = layout.Rename?.Invoke(spec.Name, c.Name) ?? (layout.Synonyms ? Words.GetValueOrDefault(c.Name, c.Name) : name);
            cols.Add(new Column(c, printedName, string.IsNullOrEmpty(unit) ? null : unit, i));
        }
        if (layout.ShuffleVariant is int variant) cols = cols.Shuffled(variant);
        var rows = t.Rows.Where(r => !r.IsBlank).ToList();
        Dictionary<int, string>? labels = null;
        int caseCol = cols.FindIndex(c => c.Spec?.Name == "case");
        if (layout.CaseLabels && caseCol >= 0 && Contiguous(rows.Select(r => r.Cell(cols[caseCol].Index)).ToList()))
        {
            labels = [];
            for (int r = 0; r < rows.Count; r++)
                if (r == 0 || rows[r].Cell(cols[caseCol].Index) != rows[r - 1].Cell(cols[caseCol].Index))
                    labels[r] = $"Load case {rows[r].Cell(cols[caseCol].Index)}";
            cols.RemoveAt(caseCol);
        }
        var header = cols.Select(c => c.Unit is null || layout.Units is UnitPlacement.UnitsRow or UnitPlacement.UnitsLine ? c.Name
            : layout.Units == UnitPlacement.Parentheses ? $"{c.Name} ({Sup(c.Unit)})" : $"{c.Name} [{Sup(c.Unit)}]").ToList();
        var cells = rows.Select(r => (IReadOnlyList<string>)cols.Select(c => Number(r.Cell(c.Index), c.Spec, layout)).ToList()).ToList();
        var table = new FixtureTable(header, cells)
        {
            Units = layout.Units == UnitPlacement.UnitsRow && cols.Any(c => c.Unit is not null) ? cols.Select(c => c.Unit is null ? "" : $"[{Sup(c.Unit)}]").ToList() : null,
            Labels = labels,
            BreakBeforeRow = layout.BreakInTable && spec == TableSchema.EndMoments && rows.Count > 3 ? rows.Count / 2 : null,
        };
        if (layout.Units == UnitPlacement.UnitsLine && cols.Any(c => c.Unit is not null))
        {
            // A units line names one unit per kind of quantity; a table with two units of one kind keeps them in its header.
            bool oneUnitPerKind = cols.Where(c => c.Unit is not null).GroupBy(c => c.Spec!.Kind).All(g => g.Select(c => c.Unit).Distinct().Count() == 1);
            var units = cols.Where(c => c.Unit is not null).Select(c => Sup(c.Unit!)).Distinct().ToList();
            table = oneUnitPerKind
                ? table with { Caption = $"Units: {string.Join(", ", units)}" }
                : table with { Header = cols.Select(c => c.Unit is null ? c.Name : $"{c.Name} [{Sup(c.Unit)}]").ToList() };
        }
        var truthHeader = cols.Select(c => c.Unit is null ? c.Spec!.Name : $"{c.Spec!.Name} [{c.Unit}]").ToList();
        var truthRows = rows.Select(r => (IReadOnlyList<string>)cols.Select(c => r.Cell(c.Index)).ToList()).ToList();
        if (labels is not null)
        {
            truthHeader.Add("case");
            string current = "";
            for (int r = 0; r < truthRows.Count; r++)
            {
                if (labels.TryGetValue(r, out var l)) current = l["Load case ".Length..];
                truthRows[r] = [.. truthRows[r], current];
            }
        }
        return (Style(table, layout), Truth(spec.Name, truthHeader, truthRows));
    }

    private static FixtureTable Style(FixtureTable t, Layout layout)
    {
        var right = t.Header.Select((_, k) => layout.RightAlign && t.Rows.Count > 0 && t.Rows.All(r => k >= r.Count || r[k].Length == 0 || IsNumber(r[k]))).ToList();
        var notes = layout.Numbers == NumberLook.Parentheses ? new[] { "Note: negative values in brackets." } : null;
        return t with
        {
            RightAligned = right,
            HeaderAlign = layout.HeaderAlign,
            RepeatHeader = layout.RepeatHeader,
            ColumnWidthEm = layout.ColumnWidthEm,
            GapEm = layout.GapEm,
            Notes = notes,
        };
    }

    private static bool IsNumber(string s) => Regex.IsMatch(s, @"^[(\-−+]?[\d.,]+(?:[eE][+-]?\d+)?\)?$");

    private static bool Contiguous(List<string> keys)
    {
        var seen = new HashSet<string>();
        for (int i = 0; i < keys.Count; i++)
            if ((i == 0 || keys[i] != keys[i - 1]) && !seen.Add(keys[i])) return false;
        return true;
    }

    private static string Sup(string unit) => unit.Replace("^2", "²").Replace("^3", "³").Replace("^4", "⁴").Replace("mm4", "mm⁴");

    /// <summary>A number cell in the layout's style; other cells as they are.</summary>
    internal static string Number(string text, ColumnSpec? spec, Layout layout)
    {
        if (spec?.Type != ColumnType.Number || text.Length == 0) return text;
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v)) return text;
        bool negative = text.TrimStart().StartsWith('-');
        string magnitude = negative ? text.TrimStart()[1..] : text.Trim();
        switch (layout.Numbers)
        {
            case NumberLook.UnicodeMinus:
                return negative ? "−" + magnitude : magnitude;
            case NumberLook.Parentheses:
                return negative ? $"({magnitude})" : magnitude;
            case NumberLook.Thousands:
                if (magnitude.Contains('e', StringComparison.OrdinalIgnoreCase) && Math.Abs(v) >= 1000 && Math.Abs(v) < 1e15 && v == Math.Round(v))
                    magnitude = Math.Abs(v).ToString("0", CultureInfo.InvariantCulture);
                var m = Regex.Match(magnitude, @"^(\d+)(\.\d*)?$");
                if (!m.Success || m.Groups[1].Value.Length <= 3) return text;
                string grouped = long.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture).ToString("#,0", CultureInfo.InvariantCulture);
                return (negative ? "-" : "") + grouped + m.Groups[2].Value;
            default:
                return text;
        }
    }

    // ---- wide end-moment tables ------------------------------------------------------------------------

    private sealed record Ends(string Member, string Start, string End);

    private static List<Ends> Geometry(IReadOnlyList<RawTable> tables)
    {
        var list = new List<Ends>();
        var members = tables.FirstOrDefault(t => TableSchema.Find(t.Name) == TableSchema.Members);
        if (members is not null)
        {
            int m = Index(members, TableSchema.Members, "member"), s = Index(members, TableSchema.Members, "start"), e = Index(members, TableSchema.Members, "end");
            list.AddRange(members.Rows.Where(r => !r.IsBlank).Select(r => new Ends(r.Cell(m), r.Cell(s), r.Cell(e))));
        }
        var spans = tables.FirstOrDefault(t => TableSchema.Find(t.Name) == TableSchema.Spans);
        var supports = tables.FirstOrDefault(t => TableSchema.Find(t.Name) == TableSchema.Supports);
        if (spans is not null && supports is not null)
        {
            int si = Index(spans, TableSchema.Spans, "span"), pi = Index(supports, TableSchema.Supports, "support");
            var sp = spans.Rows.Where(r => !r.IsBlank).ToList();
            var su = supports.Rows.Where(r => !r.IsBlank).ToList();
            for (int i = 0; i < sp.Count && i + 1 < su.Count; i++) list.Add(new Ends(sp[i].Cell(si), su[i].Cell(pi), su[i + 1].Cell(pi)));
        }
        return list;
    }

    private static int Index(RawTable t, TableSpec spec, string column) =>
        t.Header.Cells.Select((c, i) => (c, i)).First(x => TableSchema.ResolveColumn(spec, TableSchema.SplitHeader(x.c).Name)?.Name == column).i;

    /// <summary>The claims as one row per load case and one column per member end (<c>M_{AB}</c>).</summary>
    private static (FixtureTable? Table, List<(string Member, string At)> Ends) Wide(RawTable t, List<Ends> geometry, Layout layout)
    {
        var spec = TableSchema.EndMoments;
        int c = t.Header.Cells.Select((h, i) => (h, i)).FirstOrDefault(x => TableSchema.ResolveColumn(spec, TableSchema.SplitHeader(x.h).Name)?.Name == "case", (h: "", i: -1)).i;
        int m = Index(t, spec, "member"), a = Index(t, spec, "at"), v = Index(t, spec, "moment");
        string? unit = TableSchema.SplitHeader(t.Header.Cells[v]).Unit;
        var rows = t.Rows.Where(r => !r.IsBlank).ToList();
        var ends = new List<(string Member, string At)>();
        foreach (var r in rows)
        {
            var g = geometry.FirstOrDefault(e => e.Member == r.Cell(m));
            if (g is null) return (null, []);
            string at = r.Cell(a) switch { "start" => g.Start, "end" => g.End, var j => j };
            if (!ends.Contains((g.Member, at))) ends.Add((g.Member, at));
        }
        var cases = rows.Select(r => c >= 0 ? r.Cell(c) : "1").Distinct().ToList();
        var header = new List<string> { "Load case" };
        foreach (var (member, at) in ends)
        {
            var g = geometry.First(e => e.Member == member);
            string far = at == g.Start ? g.End : g.Start;
            header.Add($"M_{{{at}{far}}}");
        }
        var cells = new List<IReadOnlyList<string>>();
        foreach (var cs in cases)
        {
            var row = new List<string> { cs };
            foreach (var (member, at) in ends)
            {
                var r = rows.FirstOrDefault(r => (c < 0 ? "1" : r.Cell(c)) == cs && r.Cell(m) == member
                    && (r.Cell(a) == at || (r.Cell(a) == "start" && geometry.First(e => e.Member == member).Start == at)
                        || (r.Cell(a) == "end" && geometry.First(e => e.Member == member).End == at)));
                row.Add(r is null ? "" : Number(r.Cell(v), spec.Column("moment"), layout));
            }
            cells.Add(row);
        }
        return (new FixtureTable(header, cells) { Caption = unit is null ? null : $" [{unit}]" }, ends);
    }

    private static List<T> Shuffled<T>(this List<T> list, int variant)
    {
        var rnd = new Random(variant);
        return list.OrderBy(_ => rnd.Next()).ToList();
    }
}
