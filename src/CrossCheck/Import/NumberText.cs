using System.Globalization;

namespace CrossCheck.Import;

/// <summary>Parses numbers as written in tables: invariant culture, or decimal commas in <c>;</c>-separated files.</summary>
public static class NumberText
{
    /// <summary>
    /// Parses a finite number. Accepts a leading + or −, the Unicode minus sign, exponents, and (with
    /// <paramref name="decimalComma"/>) a comma as the decimal point with dots as thousands separators.
    /// NaN, infinity and anything else are refused.
    /// </summary>
    public static bool TryParse(string text, bool decimalComma, out double value)
    {
        value = 0;
        string s = text.Trim().Replace('\u2212', '-').Replace('\u2013', '-').Replace("\u00A0", "").Replace("\u202F", "");
        if (s.Length == 0) return false;
        if (decimalComma)
        {
            if (s.Contains(',')) s = s.Replace(".", "").Replace(',', '.');
        }
        else if (s.Contains(','))
        {
            return false;
        }
        foreach (char c in s)
            if (!(char.IsAsciiDigit(c) || c is '.' or '-' or '+' or 'e' or 'E')) return false;
        if (!double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out value)) return false;
        return double.IsFinite(value);
    }
}
