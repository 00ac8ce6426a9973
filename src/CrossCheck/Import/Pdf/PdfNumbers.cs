using System.Text;
using System.Text.RegularExpressions;

namespace CrossCheck.Import.Pdf;

/// <summary>How a document writes its numbers.</summary>
/// <param name="DecimalComma">Decimal commas (and dots or spaces between thousands).</param>
/// <param name="ParenthesesNegative">The document says that a number in parentheses is negative.</param>
/// <param name="DecimalPointSeen">The document shows decimal points, so <c>1,250</c> is twelve hundred and fifty.</param>
internal sealed record NumberStyle(bool DecimalComma, bool ParenthesesNegative, bool DecimalPointSeen = false);

/// <summary>
/// Turns a number as printed in a calculation into the plain form the importer parses: the Unicode minus and other
/// dashes become <c>-</c>, thousands separators (<c>1,250.5</c>, <c>1 250.5</c>, <c>1'250.5</c>; with decimal commas
/// <c>1.250,5</c>) are removed, <c>2.4×10⁶</c> becomes <c>2.4e6</c>, and <c>(12.5)</c> becomes <c>-12.5</c> when the
/// document says parentheses mean negative. Text that does not become a valid number is left as printed, so that
/// the importer reports it.
/// </summary>
internal static partial class PdfNumbers
{
    /// <summary>What was noticed while reading a number.</summary>
    [Flags]
    internal enum Notice
    {
        None = 0,
        /// <summary>In parentheses, and the document does not say what parentheses mean.</summary>
        Parentheses = 1,
        /// <summary><c>1,250</c>: a comma read as a thousands separator with nothing in the document to confirm it.</summary>
        AmbiguousThousands = 2,
    }

    /// <summary>True for a cell that means "no value": a dash or n/a.</summary>
    public static bool IsBlank(string printed) => Geometry.Collapse(printed) is "" or "-" or "–" or "—" or "−" or "n/a" or "N/A" or "n.a." or "/";

    public static string Normalize(string printed, NumberStyle style, out Notice notice)
    {
        notice = Notice.None;
        string s = Dashes(Geometry.Collapse(printed));
        if (s.Length == 0) return "";
        bool negative = false;
        var paren = Parenthesised().Match(s);
        if (paren.Success)
        {
            if (!style.ParenthesesNegative) { notice |= Notice.Parentheses; return printed.Trim(); }
            s = paren.Groups["n"].Value.Trim();
            negative = true;
        }
        s = SignSpace().Replace(s, "$1");
        string exponent = "";
        var power = PowerOfTen().Match(s);
        if (power.Success)
        {
            string e = power.Groups["e"].Success ? power.Groups["e"].Value : FromSuperscript(power.Groups["es"].Value);
            if (e.Length == 0) return printed.Trim();
            exponent = "e" + e;
            s = power.Groups["m"].Value.Trim();
        }
        string? plain = style.DecimalComma ? CommaDecimal(s) : PointDecimal(s, style.DecimalPointSeen, ref notice);
        if (plain is null) return printed.Trim();
        plain += exponent;
        if (negative)
        {
            if (plain.StartsWith('-') || plain.StartsWith('+')) return printed.Trim();
            plain = "-" + plain;
        }
        return NumberText.TryParse(plain, false, out _) ? plain : printed.Trim();
    }

    private static string? PointDecimal(string s, bool pointSeen, ref Notice notice)
    {
        if (PlainNumber().IsMatch(s)) return s;
        if (CommaThousands().IsMatch(s))
        {
            if (!s.Contains('.', StringComparison.Ordinal) && !s.Contains('e', StringComparison.OrdinalIgnoreCase) && !pointSeen) notice |= Notice.AmbiguousThousands;
            return s.Replace(",", "", StringComparison.Ordinal);
        }
        if (SpaceThousands().IsMatch(s) || ApostropheThousands().IsMatch(s)) return s.Replace(" ", "", StringComparison.Ordinal).Replace("'", "", StringComparison.Ordinal);
        return null;
    }

    private static string? CommaDecimal(string s)
    {
        if (IntegerOnly().IsMatch(s)) return s;
        if (CommaNumber().IsMatch(s)) return s.Replace(',', '.');
        if (DotThousands().IsMatch(s) || SpaceThousandsComma().IsMatch(s))
            return s.Replace(".", "", StringComparison.Ordinal).Replace(" ", "", StringComparison.Ordinal).Replace(',', '.');
        return null;
    }

    private static string Dashes(string s)
    {
        var sb = new StringBuilder(s.Length);
        foreach (char c in s) sb.Append(c is '\u2212' or '\u2012' or '\u2013' or '\u2010' or '\u2011' or '\uFE63' or '\uFF0D' ? '-' : c);
        return sb.ToString();
    }

    private static string FromSuperscript(string s)
    {
        var sb = new StringBuilder();
        foreach (char c in s)
        {
            int d = "⁰¹²³⁴⁵⁶⁷⁸⁹".IndexOf(c, StringComparison.Ordinal);
            if (d >= 0) sb.Append((char)('0' + d));
            else if (c == '⁻') sb.Append('-');
            else if (c == '⁺') sb.Append('+');
            else return "";
        }
        return sb.ToString();
    }

    /// <summary>A number followed by a unit in one cell (<c>8.0 m</c>, <c>−81.0 kN·m</c>): the two parts, or null.</summary>
    public static (string Number, string Unit)? SplitUnit(string printed)
    {
        var m = NumberAndUnit().Match(Geometry.Collapse(printed));
        return m.Success ? (m.Groups["n"].Value, m.Groups["u"].Value) : null;
    }

    /// <summary>
    /// Decides whether a document writes decimal commas, from its number cells: <c>12,5</c> or <c>1.250,5</c> say
    /// yes, <c>12.5</c> or <c>1,250.5</c> say no; <c>1,250</c> and <c>1.250</c> say nothing. Decimal commas only when
    /// something says yes and nothing says no. Also tells whether decimal points were seen.
    /// </summary>
    public static (bool DecimalComma, bool PointSeen) Detect(IEnumerable<string> cells)
    {
        int comma = 0, point = 0;
        foreach (var raw in cells)
        {
            string c = Dashes(Geometry.Collapse(raw)).Trim('(', ')');
            if (CommaEvidence().IsMatch(c)) comma++;
            else if (PointEvidence().IsMatch(c)) point++;
        }
        return (comma > 0 && point == 0, point > 0);
    }

    [GeneratedRegex(@"^\((?<n>[^()]+)\)$")]
    private static partial Regex Parenthesised();

    [GeneratedRegex(@"^(?<n>\(?[+\-−–]?\s?[\d.,' ]*\d(?:\s*[x×]\s*10(?:\^[+\-−]?\d+|[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))?\)?)\s*(?<u>[A-Za-zµ°][A-Za-z0-9µ°²³⁴·*./\-^]*(?:\s?[·*]\s?[A-Za-z][A-Za-z0-9²³⁴]*)?)$")]
    private static partial Regex NumberAndUnit();

    [GeneratedRegex(@"^([+-])\s+")]
    private static partial Regex SignSpace();

    [GeneratedRegex(@"^(?<m>[+-]?[\d.,' ]+?)\s*[x×·*]\s*10\s*(?:\^\s*(?<e>[+-]?\d+)|(?<es>[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))$")]
    private static partial Regex PowerOfTen();

    [GeneratedRegex(@"^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$")]
    private static partial Regex PlainNumber();

    [GeneratedRegex(@"^[+-]?\d{1,3}(?:,\d{3})+(?:\.\d*)?(?:[eE][+-]?\d+)?$")]
    private static partial Regex CommaThousands();

    [GeneratedRegex(@"^[+-]?\d{1,3}(?: \d{3})+(?:\.\d*)?$")]
    private static partial Regex SpaceThousands();

    [GeneratedRegex(@"^[+-]?\d{1,3}(?:'\d{3})+(?:\.\d*)?$")]
    private static partial Regex ApostropheThousands();

    [GeneratedRegex(@"^[+-]?\d+(?:[eE][+-]?\d+)?$")]
    private static partial Regex IntegerOnly();

    [GeneratedRegex(@"^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$")]
    private static partial Regex CommaNumber();

    [GeneratedRegex(@"^[+-]?\d{1,3}(?:\.\d{3})+(?:,\d*)?$")]
    private static partial Regex DotThousands();

    [GeneratedRegex(@"^[+-]?\d{1,3}(?: \d{3})+(?:,\d*)?$")]
    private static partial Regex SpaceThousandsComma();

    [GeneratedRegex(@"^[+-]?(?:\d+,\d{1,2}|\d+,\d{4,}|\d{1,3}(?:\.\d{3})+,\d+|0,\d+)$")]
    private static partial Regex CommaEvidence();

    [GeneratedRegex(@"^[+-]?(?:\d+\.\d{1,2}|\d+\.\d{4,}|\d{1,3}(?:,\d{3})+\.\d+|0\.\d+)(?:[eE][+-]?\d+)?$")]
    private static partial Regex PointEvidence();
}
