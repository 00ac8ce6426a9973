using System.Globalization;

namespace CrossCheck.Common;

/// <summary>Small helpers for text read by people: counts with the right plural, and columns of numbers with one number of decimals.</summary>
public static class Words
{
    /// <summary>"1 comment", "3 comments", "1 reaction row", "2 reaction rows".</summary>
    public static string Count(int n, string singular, string? plural = null) =>
        string.Create(CultureInfo.InvariantCulture, $"{n} {(n == 1 ? singular : plural ?? singular + "s")}");

    /// <summary>"is" or "are" for <paramref name="n"/> things.</summary>
    public static string Is(int n) => n == 1 ? "is" : "are";

    /// <summary>
    /// Formats a column of values with the same number of decimals throughout — the fewest (at most
    /// <paramref name="maxDecimals"/>) that show every value of the column exactly to that precision — so that a
    /// column reads 8.0, 10.0, 8.5 rather than 8, 10, 8.5.
    /// </summary>
    public static IReadOnlyList<string> FixedColumn(IReadOnlyList<double> values, int maxDecimals)
    {
        ArgumentNullException.ThrowIfNull(values);
        int decimals = 0;
        foreach (double v in values)
            while (decimals < maxDecimals && Math.Abs(Math.Round(v, decimals) - v) > 1e-9 * Math.Max(1, Math.Abs(v))) decimals++;
        string format = decimals == 0 ? "0" : "0." + new string('0', decimals);
        return values.Select(v => Fmt.Number(v, format)).ToList();
    }
}
