using System.Globalization;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>How each table was read, for <c>crosscheck extract</c>: where it was printed, its rows, and how each header was read.</summary>
internal static class ExtractReport
{
    public static PdfTableReport Info(RawTable info)
    {
        var pages = info.Rows.GroupBy(r => r.Page).Select(g => string.Create(CultureInfo.InvariantCulture,
            $"p.{g.Key} line{(g.Count() > 1 ? "s" : "")} {string.Join(", ", g.Select(r => r.Line).Distinct())}"));
        var keys = info.Rows.Select(r => $"{r.Cell(0)} → {TableSchema.InfoKey(r.Cell(0)) ?? TableSchema.Normalize(r.Cell(0))}").ToList();
        return new PdfTableReport("info", string.Join("; ", pages), info.Rows.Count, keys, "title block and settings from 'key: value' lines");
    }

    public static PdfTableReport Of(Segment s)
    {
        string where = string.Join("; ", s.Parts.GroupBy(p => p.Page).Select(g =>
        {
            int first = g.Min(p => p.First), last = g.Max(p => p.Last);
            return first == last
                ? string.Create(CultureInfo.InvariantCulture, $"p.{g.Key} line {first}")
                : string.Create(CultureInfo.InvariantCulture, $"p.{g.Key} lines {first}-{last}");
        }));
        var columns = new List<string>();
        if (s.WideFrom is { } wide && s.Spec == TableSchema.Distribution)
        {
            columns.Add($"{string.Join(", ", wide)} → {string.Join(", ", s.Columns.Skip(2).Select(c => c.Header))}{(s.Columns.Count > 2 && s.Columns[2].EffectiveUnit is { } du ? $" [{du}]" : "")}");
        }
        else if (s.WideFrom is { } wide2)
        {
            columns.Add($"{string.Join(", ", wide2)} → case, member, at, moment{(s.Columns[3].EffectiveUnit is { } u ? $" [{u}]" : "")}");
        }
        else
        {
            foreach (var c in s.Columns)
            {
                string how = c.Decision is { } d ? $" ({d.Describe()})" : "";
                if (c.Column is null) { columns.Add($"{c.Printed} → ignored{how}"); continue; }
                string unit = c.EffectiveUnit is { } eu ? $" [{eu}]" : "";
                string from = c.External is not null ? " (unit from outside the header)" : "";
                columns.Add($"{c.Printed} → {c.Column.Name}{unit}{from}{how}");
            }
        }
        string? note = s.Spec == TableSchema.Distribution ? "a moment-distribution working table, one column per member end"
            : s.WideFrom is not null ? "one column per member end, turned into one row per member end"
            : s.Source.RowCase.Count > 0 ? "load case taken from the labels between rows" : null;
        return new PdfTableReport(s.Spec.Name, where, s.Rows.Count, columns, note);
    }
}
