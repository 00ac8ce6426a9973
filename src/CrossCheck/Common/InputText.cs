using System.Text;

namespace CrossCheck.Common;

/// <summary>Text decoded from a file's bytes, and how.</summary>
/// <param name="Text">The text, without a byte-order mark at its start.</param>
/// <param name="Encoding">What it was read as: <c>UTF-8</c>, <c>UTF-16LE</c>, <c>UTF-16BE</c>, <c>UTF-32LE</c>, <c>UTF-32BE</c> or <c>Latin-1</c>.</param>
/// <param name="Fallback">True when the bytes were not valid in any Unicode encoding and were read as Latin-1.</param>
public sealed record DecodedText(string Text, string Encoding, bool Fallback);

/// <summary>
/// Decodes a text file whatever Unicode encoding it was saved in: a byte-order mark says which (UTF-8, UTF-16 or UTF-32, either
/// byte order); without one, the pattern of zero bytes tells UTF-16 and UTF-32 (text that is mostly ASCII has a zero in every
/// other, or three in every four, bytes); otherwise UTF-8, and bytes that are not UTF-8 are read as Latin-1 (what older
/// spreadsheets save). Binary data — control characters that no text holds — is recognised after decoding, so a UTF-16 file is
/// never taken for it.
/// </summary>
public static class InputText
{
    /// <summary>The text of <paramref name="bytes"/>; null when they are binary data rather than text.</summary>
    public static DecodedText? Decode(byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        var (encoding, name, bom) = Detect(bytes);
        string text;
        bool fallback = false;
        try
        {
            text = encoding.GetString(bytes, bom, bytes.Length - bom);
        }
        catch (DecoderFallbackException)
        {
            if (name != "UTF-8") return null;
            text = Encoding.Latin1.GetString(bytes);
            name = "Latin-1";
            fallback = true;
        }
        if (text.Length > 0 && text[0] == '\uFEFF') text = text[1..];
        return LooksBinary(text) ? null : new DecodedText(text, name, fallback);
    }

    private static (Encoding Encoding, string Name, int Bom) Detect(byte[] b)
    {
        if (b.Length >= 4 && b[0] == 0xFF && b[1] == 0xFE && b[2] == 0 && b[3] == 0) return (new UTF32Encoding(false, false, true), "UTF-32LE", 4);
        if (b.Length >= 4 && b[0] == 0 && b[1] == 0 && b[2] == 0xFE && b[3] == 0xFF) return (new UTF32Encoding(true, false, true), "UTF-32BE", 4);
        if (b.Length >= 3 && b[0] == 0xEF && b[1] == 0xBB && b[2] == 0xBF) return (new UTF8Encoding(false, true), "UTF-8", 3);
        if (b.Length >= 2 && b[0] == 0xFF && b[1] == 0xFE) return (new UnicodeEncoding(false, false, true), "UTF-16LE", 2);
        if (b.Length >= 2 && b[0] == 0xFE && b[1] == 0xFF) return (new UnicodeEncoding(true, false, true), "UTF-16BE", 2);
        // No mark: count zero bytes by their position in the first few kilobytes.
        int n = Math.Min(b.Length, 4096) & ~3;
        if (n >= 8)
        {
            var zeros = new int[4];
            int total = 0;
            for (int i = 0; i < n; i++)
                if (b[i] == 0) { zeros[i & 3]++; total++; }
            int quarter = n / 4;
            if (zeros[1] + zeros[2] + zeros[3] > 2.7 * quarter && zeros[0] < quarter / 4) return (new UTF32Encoding(false, false, true), "UTF-32LE", 0);
            if (zeros[0] + zeros[1] + zeros[2] > 2.7 * quarter && zeros[3] < quarter / 4) return (new UTF32Encoding(true, false, true), "UTF-32BE", 0);
            int odd = zeros[1] + zeros[3], even = zeros[0] + zeros[2];
            if (odd > 0.9 * (n / 2) && even < n / 20) return (new UnicodeEncoding(false, false, true), "UTF-16LE", 0);
            if (even > 0.9 * (n / 2) && odd < n / 20) return (new UnicodeEncoding(true, false, true), "UTF-16BE", 0);
        }
        return (new UTF8Encoding(false, true), "UTF-8", 0);
    }

    /// <summary>Binary data: a NUL, or more than one character in twenty a control character that text does not use.</summary>
    private static bool LooksBinary(string text)
    {
        int n = Math.Min(text.Length, 8192), control = 0;
        for (int i = 0; i < n; i++)
        {
            char c = text[i];
            if (c == '\0') return true;
            if (c < 9 || (c > 13 && c < 32)) control++;
        }
        return n > 0 && control > n / 20;
    }
}
