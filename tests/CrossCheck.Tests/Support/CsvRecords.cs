using System.Text;

namespace CrossCheck.Tests.Support;

/// <summary>Reads RFC 4180 text back into records (quoted fields, doubled quotes, line breaks inside quotes), to check CSV outputs.</summary>
public static class CsvRecords
{
    public static List<Dictionary<string, string>> Parse(string text)
    {
        var rows = Rows(text);
        var header = rows[0];
        return rows.Skip(1).Select(r =>
        {
            r.Count.ShouldBe(header.Count, "every record has as many fields as the header");
            return header.Zip(r).ToDictionary(p => p.First, p => p.Second);
        }).ToList();
    }

    public static List<List<string>> Rows(string text)
    {
        var rows = new List<List<string>>();
        var row = new List<string>();
        var field = new StringBuilder();
        bool quoted = false;
        for (int i = 0; i < text.Length; i++)
        {
            char c = text[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < text.Length && text[i + 1] == '"') { field.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else field.Append(c);
                continue;
            }
            switch (c)
            {
                case '"': quoted = true; break;
                case ',': row.Add(field.ToString()); field.Clear(); break;
                case '\n':
                    row.Add(field.ToString()); field.Clear();
                    rows.Add(row); row = [];
                    break;
                case '\r': break;
                default: field.Append(c); break;
            }
        }
        if (field.Length > 0 || row.Count > 0) { row.Add(field.ToString()); rows.Add(row); }
        return rows;
    }
}
