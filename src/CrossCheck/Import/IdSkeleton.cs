using System.Globalization;
using System.Text;

namespace CrossCheck.Import;

/// <summary>
/// What an id looks like to a reader: the compatibility form of its text (NFKC: a composed and a decomposed "Ä", a full-width
/// "Ａ" and an "A" are one), without invisible format characters (zero-width spaces and joiners, direction marks), with letters
/// of the Cyrillic and Greek alphabets that are drawn like Latin ones read as those. Two ids with the same skeleton are
/// different ids that a person cannot tell apart.
/// </summary>
public static class IdSkeleton
{
    // Cyrillic and Greek capitals and small letters drawn as Latin ones (common practice: the look-alikes every font shares).
    private const string Foreign = "АВЕКМНОРСТХаеорсухіјЅѕІΑΒΕΖΗΙΚΜΝΟΡΤΥΧοκν";
    private const string Latin = "ABEKMHOPCTXaeopcyxijSsIABEZHIKMNOPTYXokv";

    public static string Of(string id)
    {
        ArgumentNullException.ThrowIfNull(id);
        string s = id.Normalize(NormalizationForm.FormKC);
        var sb = new StringBuilder(s.Length);
        foreach (char c in s)
        {
            if (CharUnicodeInfo.GetUnicodeCategory(c) == UnicodeCategory.Format) continue;
            int k = Foreign.IndexOf(c, StringComparison.Ordinal);
            sb.Append(k >= 0 ? Latin[k] : c);
        }
        return sb.ToString();
    }

    /// <summary>The characters of either id that are not plain ASCII, as code points: <c>U+0410</c>, <c>U+200B (invisible)</c>.</summary>
    public static string Differences(string a, string b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        var odd = (a + b).EnumerateRunes().Where(r => r.Value > 0x7E || r.Value < 0x20).Distinct()
            .Select(r => string.Create(CultureInfo.InvariantCulture, $"U+{r.Value:X4}{(Rune.GetUnicodeCategory(r) == UnicodeCategory.Format ? " (invisible)" : "")}"))
            .ToList();
        return odd.Count == 0 ? "their Unicode forms" : string.Join(", ", odd);
    }
}
