using System.Globalization;
using System.Text;

namespace CrossCheck.Common;

/// <summary>
/// Text from a submission or a file name made safe to print on a terminal or to store: control characters (an escape
/// sequence begins with one, and can move the cursor, retitle the window or hide text), bidirectional overrides and other
/// invisible format characters are removed, and line breaks and tabs become spaces. Printable text is kept as it is.
/// </summary>
public static class TextSafety
{
    /// <summary>The text without control or invisible format characters; null becomes empty.</summary>
    public static string Clean(string? text)
    {
        if (string.IsNullOrEmpty(text)) return "";
        if (!NeedsCleaning(text)) return text;
        var sb = new StringBuilder(text.Length);
        foreach (char c in text)
        {
            if (c is '\t' or '\n' or '\r') sb.Append(' ');
            else if (!Unsafe(c)) sb.Append(c);
        }
        return sb.ToString();
    }

    /// <summary>
    /// The text without control characters (tabs and line breaks become spaces); invisible format characters are kept, so that
    /// ids that differ only by one can still be told apart and reported.
    /// </summary>
    public static string WithoutControls(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!text.Any(char.IsControl)) return text;
        var sb = new StringBuilder(text.Length);
        foreach (char c in text)
        {
            if (c is '\t' or '\n' or '\r') sb.Append(' ');
            else if (!char.IsControl(c)) sb.Append(c);
        }
        return sb.ToString();
    }

    /// <summary>True when <see cref="WithoutControls"/> would change the text.</summary>
    public static bool NeedsControlRemoval(string text) => text.Any(char.IsControl);

    /// <summary>True when <see cref="Clean"/> would change the text.</summary>
    public static bool NeedsCleaning(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        foreach (char c in text)
            if (c is '\t' or '\n' or '\r' || Unsafe(c)) return true;
        return false;
    }

    /// <summary>C0 and C1 controls, DEL, and invisible format characters (zero-width, bidirectional controls, soft hyphen).</summary>
    public static bool Unsafe(char c) =>
        char.IsControl(c) || CharUnicodeInfo.GetUnicodeCategory(c) == UnicodeCategory.Format;
}
