using System.Globalization;
using System.Text;

namespace CrossCheck.Import;

/// <summary>
/// What an id looks like to a reader: a composed and a decomposed letter are one ("Ä" and "A" + U+0308; the build runs without
/// ICU, so the Latin-1 letters are decomposed here), a full-width "Ａ" and an "A" are one, invisible format characters (zero-width
/// spaces and joiners, direction marks) are dropped, and letters of the Cyrillic and Greek alphabets that are drawn like Latin
/// ones are read as those. Two ids with the same skeleton are different ids that a person cannot tell apart.
/// </summary>
public static class IdSkeleton
{
    // Cyrillic and Greek capitals and small letters drawn as Latin ones (common practice: the look-alikes every font shares).
    private const string Foreign = "АВЕКМНОРСТХаеорсухіјЅѕІΑΒΕΖΗΙΚΜΝΟΡΤΥΧοκν";
    private const string Latin = "ABEKMHOPCTXaeopcyxijSsIABEZHIKMNOPTYXokv";

    // The Latin-1 letters U+00C0 to U+00FF as base letter and combining mark ('-': no decomposition).
    private const string Bases = "AAAAAA-CEEEEIIII-NOOOOO--UUUUY--aaaaaa-ceeeeiiii-nooooo--uuuuy-y";
    private const string Marks = "\u0300\u0301\u0302\u0303\u0308\u030A-\u0327\u0300\u0301\u0302\u0308\u0300\u0301\u0302\u0308-\u0303\u0300\u0301\u0302\u0303\u0308--\u0300\u0301\u0302\u0308\u0301--"
                               + "\u0300\u0301\u0302\u0303\u0308\u030A-\u0327\u0300\u0301\u0302\u0308\u0300\u0301\u0302\u0308-\u0303\u0300\u0301\u0302\u0303\u0308--\u0300\u0301\u0302\u0308\u0301-\u0308";

    public static string Of(string id)
    {
        ArgumentNullException.ThrowIfNull(id);
        var sb = new StringBuilder(id.Length);
        foreach (char c in id)
        {
            if (CharUnicodeInfo.GetUnicodeCategory(c) == UnicodeCategory.Format) continue;
            if (c is >= '\uFF01' and <= '\uFF5E') { sb.Append((char)(c - 0xFEE0)); continue; } // full-width forms
            if (c is >= '\u00C0' and <= '\u00FF' && Bases[c - 0xC0] != '-') { sb.Append(Bases[c - 0xC0]).Append(Marks[c - 0xC0]); continue; }
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
