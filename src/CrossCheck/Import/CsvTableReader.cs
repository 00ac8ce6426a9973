using System.Text.RegularExpressions;
using CrossCheck.Model;
using CsvHelper;

namespace CrossCheck.Import;

/// <summary>
/// Reads CSV files into <see cref="RawTable"/>s: a folder with one file per table, or one file holding several
/// tables, each introduced by a line such as <c>[members]</c>. RFC 4180 quoting (CsvHelper), UTF-8 with or
/// without BOM, blank lines and lines whose first cell starts with <c>#</c> ignored. A file whose header row
/// uses <c>;</c> is read as semicolon-separated with decimal commas.
/// </summary>
public static partial class CsvTableReader
{
    /// <summary>Reads one file that holds several <c>[table]</c> sections.</summary>
    public static List<RawTable> ReadSectioned(string path, string displayName, List<InputProblem> problems, InputLimits? limits = null)
    {
        var records = ReadRecords(path, displayName, problems, limits ?? InputLimits.Default, out bool decimalComma);
        if (records is null) return [];
        var tables = new List<RawTable>();
        string? name = null;
        RawRow? header = null;
        var rows = new List<RawRow>();
        int nameLine = 0;
        void Flush()
        {
            if (name is null) return;
            if (header is null) problems.Add(new InputProblem(new SourceRef(displayName, name, nameLine), Messages.EmptyTable(name)));
            else tables.Add(new RawTable(name, displayName, header, rows.ToList(), decimalComma));
        }
        bool sawData = false;
        foreach (var r in records)
        {
            var section = SectionName(r);
            if (section is not null)
            {
                Flush();
                name = section; header = null; rows.Clear(); nameLine = r.Line;
                continue;
            }
            if (name is null) { sawData = true; continue; }
            if (header is null) header = r; else rows.Add(r);
        }
        Flush();
        if (tables.Count == 0 && (sawData || records.Count == 0))
            problems.Add(new InputProblem(new SourceRef(displayName), Messages.NoSections));
        return tables;
    }

    /// <summary>Reads one file that holds a single table (the folder container); the table name is the file name.</summary>
    public static RawTable? ReadSingle(string path, string displayName, string tableName, List<InputProblem> problems, InputLimits? limits = null)
    {
        var records = ReadRecords(path, displayName, problems, limits ?? InputLimits.Default, out bool decimalComma);
        if (records is null) return null;
        if (records.Count == 0)
        {
            problems.Add(new InputProblem(new SourceRef(displayName, tableName), Messages.EmptyTable(tableName)));
            return null;
        }
        return new RawTable(tableName, displayName, records[0], records.Skip(1).ToList(), decimalComma);
    }

    private static string? SectionName(RawRow r)
    {
        if (r.Cells.Count == 0) return null;
        var m = SectionLine().Match(r.Cells[0]);
        if (!m.Success) return null;
        return r.Cells.Skip(1).All(c => c.Length == 0) ? m.Groups["name"].Value.Trim() : null;
    }

    /// <summary>The file's rows (blank and comment lines dropped); null when the file itself could not be read (already reported).</summary>
    private static List<RawRow>? ReadRecords(string path, string displayName, List<InputProblem> problems, InputLimits limits, out bool decimalComma)
    {
        decimalComma = false;
        var where = new SourceRef(displayName);
        // The bytes: opened once, a regular file inside the submission's folder, counted against the budget as read;
        // then decoded from whichever Unicode encoding they are in (InputText).
        if (InputFiles.ReadText(path, where, limits, limits.MaxFileBytes, problems, Messages.CsvTooLarge, Messages.NotACsv) is not { } text) return null;
        text = StripByteOrderMarks(text, displayName, problems);
        if (!LinesFit(text, displayName, limits, problems)) return null;
        var (separator, undecided) = DetectSeparator(text);
        if (undecided is { } why)
        {
            problems.Add(new InputProblem(where, why));
            return null;
        }
        decimalComma = separator == ';' || (separator == '\t' && TabDecimalComma(text));
        var records = new List<RawRow>();
        try
        {
            using var reader = CsvReader.FromText(text, new CsvReaderOptions
            {
                Separator = separator,
                HasHeader = false,
                TrackLineNumbers = true,
                SkipEmptyLines = true,
                MaxRecordSize = Math.Max(1024 * 1024, 2 * limits.MaxLineChars),
                MissingField = CsvMissingFieldHandling.ReturnEmpty,
                MalformedData = CsvMalformedDataHandling.Recover,
                OnMalformedRecord = m => problems.Add(new InputProblem(new SourceRef(displayName, null, (int)m.LineNumber),
                    Messages.BadQuoting(m.Reason.ToString()), ProblemSeverity.Warning)),
            });
            while (reader.Read())
            {
                var cells = new string[reader.FieldCount];
                for (int i = 0; i < cells.Length; i++) cells[i] = (reader.GetString(i) ?? "").Trim();
                var row = new RawRow((int)reader.LineNumber, cells);
                if (row.IsBlank) continue;
                if (cells.Length > 0 && cells[0].StartsWith('#')) continue;
                int wide = Array.FindIndex(cells, c => c.Length > limits.MaxCellChars);
                if (wide >= 0)
                {
                    problems.Add(new InputProblem(new SourceRef(displayName, null, row.Line), Messages.CellTooLong(wide + 1, cells[wide].Length, limits.MaxCellChars)));
                    continue;
                }
                records.Add(row);
            }
        }
        catch (Exception ex) when (ex is CsvFormatException or FormatException or InvalidOperationException or ArgumentException)
        {
            problems.Add(new InputProblem(where, Messages.NotACsv(ex.Message)));
        }
        return records;
    }

    /// <summary>
    /// Removes byte-order marks found after the start of the text (two files joined end to end leave one at the start of
    /// the second): invisible, they would hide a <c>[table]</c> line or a column name. Each line that had one is named in a warning.
    /// </summary>
    private static string StripByteOrderMarks(string text, string displayName, List<InputProblem> problems)
    {
        if (!text.Contains('\uFEFF', StringComparison.Ordinal)) return text;
        int line = 1;
        var lines = new List<int>();
        foreach (char c in text)
        {
            if (c == '\n') line++;
            else if (c == '\uFEFF' && (lines.Count == 0 || lines[^1] != line)) lines.Add(line);
        }
        foreach (int l in lines.Take(5))
            problems.Add(new InputProblem(new SourceRef(displayName, null, l), Messages.StrayByteOrderMark, ProblemSeverity.Warning));
        return text.Replace("\uFEFF", "", StringComparison.Ordinal);
    }

    /// <summary>False (with the problem reported) when a line is longer than <see cref="InputLimits.MaxLineChars"/>.</summary>
    private static bool LinesFit(string text, string displayName, InputLimits limits, List<InputProblem> problems)
    {
        int line = 1, start = 0;
        for (int i = 0; i <= text.Length; i++)
        {
            if (i < text.Length && text[i] != '\n') continue;
            if (i - start > limits.MaxLineChars)
            {
                problems.Add(new InputProblem(new SourceRef(displayName, null, line), Messages.LineTooLong(i - start, limits.MaxLineChars)));
                return false;
            }
            line++;
            start = i + 1;
        }
        return true;
    }

    /// <summary>
    /// The delimiter, decided once for the file: tabs when every line that has a delimiter has a tab (a copy from a
    /// spreadsheet; commas in it are then part of the cells), else the header row decides (<c>;</c> in the first header
    /// line means a semicolon file). A file with lines split by tabs and other lines split by commas or semicolons
    /// cannot be decided: the reason, once, instead of a message per column.
    /// </summary>
    private static (char Separator, string? Undecided) DetectSeparator(string text)
    {
        int? tabLine = null, otherLine = null, number = 0;
        char? header = null;
        foreach (var rawLine in text.Split('\n'))
        {
            number++;
            string line = rawLine.Trim('\r', ' ');
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            if (SectionLine().IsMatch(line.Trim().TrimEnd(',', ';', '\t'))) continue;
            header ??= line.Contains(';') ? ';' : ',';
            if (line.Contains('\t')) tabLine ??= number;
            else if (line.Contains(',') || line.Contains(';')) otherLine ??= number;
        }
        if (tabLine is int t && otherLine is int o) return (',', Messages.UndecidableDelimiter(t, o));
        if (tabLine is not null) return ('\t', null);
        return (header ?? ',', null);
    }

    /// <summary>A tab-separated copy from a spreadsheet set to decimal commas: its numbers say so (<c>12,5</c>, and no <c>12.5</c>).</summary>
    private static bool TabDecimalComma(string text) =>
        Pdf.PdfNumbers.Detect(text.Split('\n').SelectMany(l => l.Split('\t')).Select(c => c.Trim().Trim('"'))).DecimalComma;

    [GeneratedRegex(@"^\s*\[(?<name>[^\]]+)\]\s*$")]
    private static partial Regex SectionLine();
}
