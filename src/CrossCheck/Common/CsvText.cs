using System.Globalization;
using System.Text;

namespace CrossCheck.Common;

/// <summary>
/// Writes RFC 4180 CSV for reports (the screening summary, the register export). Text that came from a submission is
/// written with <see cref="Text"/>, which keeps a spreadsheet from taking it for a formula.
/// </summary>
public sealed class CsvText
{
    private readonly StringBuilder _sb = new();

    /// <summary>Appends one record; null cells are empty.</summary>
    public CsvText Row(params string?[] cells)
    {
        for (int i = 0; i < cells.Length; i++)
        {
            if (i > 0) _sb.Append(',');
            _sb.Append(Quote(cells[i] ?? ""));
        }
        _sb.Append('\n');
        return this;
    }

    public override string ToString() => _sb.ToString();

    /// <summary>
    /// A text cell from untrusted input: a leading <c>= + - @</c>, tab or carriage return gets a <c>'</c> in front,
    /// so that a spreadsheet shows the text rather than evaluating it.
    /// </summary>
    public static string? Text(string? s) =>
        s is { Length: > 0 } && s[0] is '=' or '+' or '-' or '@' or '\t' or '\r' ? "'" + s : s;

    public static string Number(double v, string format = "0.######") => Fmt.Number(v, format);

    public static string Number(int v) => v.ToString(CultureInfo.InvariantCulture);

    public static string Number(long v) => v.ToString(CultureInfo.InvariantCulture);

    private static string Quote(string s) =>
        s.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : s;
}
