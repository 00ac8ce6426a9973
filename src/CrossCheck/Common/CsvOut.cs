using System.Globalization;
using CsvHelper;

namespace CrossCheck.Common;

/// <summary>
/// The one CSV writer of the tool (on CsvHelper): <c>solve --format csv</c>, the tables <c>extract</c> writes, the
/// screen's <c>summary.csv</c> and the register export. RFC 4180, comma separated, <c>\n</c> line ends, fields quoted
/// only when they need it, every record as wide as the first.
/// </summary>
/// <remarks>
/// Text goes in through <see cref="Text"/>, which defuses a cell a spreadsheet would run as a formula (CSV injection,
/// as the OWASP guidance describes it): a cell starting with <c>=</c>, <c>+</c>, <c>@</c>, a tab, a carriage return,
/// or <c>-</c> not followed by a digit gets a <c>'</c> in front (a spreadsheet then shows the text) and is quoted. A
/// negative number such as <c>-12.5</c> stays as it is. Numbers the tool formats itself (<see cref="Number(double, string)"/>)
/// are never defused.
/// </remarks>
public sealed class CsvOut : IDisposable
{
    private readonly StringWriter _text = new(CultureInfo.InvariantCulture);
    private readonly CsvWriter _csv;

    /// <param name="commentPrefix">
    /// The character that starts a comment line (<see cref="Comment"/>); a record whose first cell starts with it has that
    /// cell quoted. Null for no comments.
    /// </param>
    /// <param name="quoteWhen">Extra cells to quote (beyond those RFC 4180 requires), such as cells a reader might split.</param>
    public CsvOut(char? commentPrefix = null, Func<string, bool>? quoteWhen = null)
    {
        var options = CsvWriterOptions.Default with { NewLine = "\n", CommentPrefix = commentPrefix };
        if (quoteWhen is not null) options = options with { ShouldQuote = (field, _, _, _) => quoteWhen(field.ToString()) };
        _csv = CsvWriter.Create(_text, options);
    }

    /// <summary>True when a spreadsheet would take <paramref name="cell"/> for a formula (see the remarks on <see cref="CsvOut"/>).</summary>
    public static bool IsFormulaLike(string? cell) =>
        cell is { Length: > 0 } && (cell[0] is '=' or '+' or '@' or '\t' or '\r' || (cell[0] == '-' && !(cell.Length > 1 && char.IsAsciiDigit(cell[1]))));

    /// <summary>The cell as a spreadsheet should show it: with a <c>'</c> in front when it looks like a formula.</summary>
    public static string? Defuse(string? cell) => IsFormulaLike(cell) ? "'" + cell : cell;

    /// <summary>A record of column names (written like any text cell).</summary>
    public CsvOut Header(params string[] names) => Row(names);

    /// <summary>A record of text cells (<see cref="Text"/>); null cells are empty.</summary>
    public CsvOut Row(params string?[] cells)
    {
        foreach (var c in cells) Text(c);
        return End();
    }

    /// <summary>A text cell, defused when it looks like a formula; null is an empty cell.</summary>
    public CsvOut Text(string? cell)
    {
        if (IsFormulaLike(cell)) _csv.WriteField("'" + cell, CsvQuoting.Always);
        else _csv.WriteField(cell);
        return this;
    }

    /// <summary>A number the tool formats itself (invariant culture, no <c>-0</c>).</summary>
    public CsvOut Number(double value, string format = "0.######") => Plain(Fmt.Number(value, format));

    public CsvOut Number(long value) => Plain(value.ToString(CultureInfo.InvariantCulture));

    /// <summary>A number, or an empty cell.</summary>
    public CsvOut Number(long? value) => value is long v ? Number(v) : Plain("");

    /// <summary>
    /// A number as it was written in the input, which the caller has checked is one (digits, a sign, a point, an
    /// exponent): written as it is, so that reading the file back gives the same text.
    /// </summary>
    /// <exception cref="ArgumentException"><paramref name="numeral"/> is not made of the characters of a number.</exception>
    public CsvOut Numeral(string numeral)
    {
        ArgumentNullException.ThrowIfNull(numeral);
        if (numeral.Length == 0 || !numeral.All(c => char.IsAsciiDigit(c) || c is '.' or '-' or '+' or 'e' or 'E') || !numeral.Any(char.IsAsciiDigit))
            throw new ArgumentException($"'{numeral}' is not a number.", nameof(numeral));
        return Plain(numeral);
    }

    /// <summary>Ends the current record.</summary>
    public CsvOut End()
    {
        _csv.EndRecord();
        return this;
    }

    /// <summary>A comment line (the writer must have been made with a comment prefix).</summary>
    public CsvOut Comment(string text)
    {
        _csv.WriteComment(text);
        return this;
    }

    /// <summary>Everything written so far.</summary>
    public override string ToString()
    {
        _csv.Flush();
        return _text.ToString();
    }

    public void Dispose()
    {
        _csv.Dispose();
        _text.Dispose();
    }

    private CsvOut Plain(string text)
    {
        _csv.WriteField(text);
        return this;
    }
}
