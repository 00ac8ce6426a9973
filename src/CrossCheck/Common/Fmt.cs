using System.Globalization;

namespace CrossCheck.Common;

/// <summary>Number formatting for memos and reports: invariant culture, no "-0".</summary>
public static class Fmt
{
    /// <summary>Formats <paramref name="value"/> with <paramref name="format"/>; a value that rounds to zero prints as 0.</summary>
    public static string Number(double value, string format = "0.00")
    {
        string s = value.ToString(format, CultureInfo.InvariantCulture);
        return s.StartsWith('-') && s.Trim('-', '0', '.', ',').Length == 0 ? s[1..] : s;
    }

    /// <summary>Removes the sign of a zero and rounds away round-off below 1e-9 of <paramref name="scale"/>.</summary>
    public static double Clean(double value, double scale = 1)
    {
        if (Math.Abs(value) <= 1e-12 * Math.Max(Math.Abs(scale), 1e-300)) return 0;
        return value + 0.0;
    }
}
