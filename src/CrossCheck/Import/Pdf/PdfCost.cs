using UglyToad.PdfPig;
using UglyToad.PdfPig.Core;
using UglyToad.PdfPig.Tokens;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Measures what a PDF would make the parser do before it does it, so that a small hostile file cannot make it build
/// millions of objects: how deep the file's arrays and dictionaries nest, and how many letters and operations a page
/// produces once every form it paints (and every form those paint) is counted as often as it is painted.
/// </summary>
internal static class PdfCost
{
    /// <summary>
    /// The deepest nesting of arrays and dictionaries in the file's objects (streams' contents, strings and comments
    /// skipped), stopping as soon as it passes <paramref name="limit"/>.
    /// </summary>
    public static int Nesting(ReadOnlySpan<byte> pdf, int limit)
    {
        int depth = 0, deepest = 0;
        for (int i = 0; i < pdf.Length; i++)
        {
            byte c = pdf[i];
            switch (c)
            {
                case (byte)'%':
                    while (i < pdf.Length && pdf[i] is not ((byte)'\n' or (byte)'\r')) i++;
                    break;
                case (byte)'(':
                    i = SkipString(pdf, i, out _);
                    break;
                case (byte)'<' when i + 1 < pdf.Length && pdf[i + 1] == '<':
                case (byte)'[':
                    if (c == '<') i++;
                    if (++depth > deepest) deepest = depth;
                    if (deepest > limit) return deepest;
                    break;
                case (byte)'<':
                    while (i < pdf.Length && pdf[i] != '>') i++;
                    break;
                case (byte)'>' when i + 1 < pdf.Length && pdf[i + 1] == '>':
                case (byte)']':
                    if (c == '>') i++;
                    depth = Math.Max(0, depth - 1);
                    break;
                case (byte)'s' when IsKeyword(pdf, i, "stream"u8):
                {
                    int end = pdf[i..].IndexOf("endstream"u8);
                    if (end < 0) return deepest;
                    i += end + 8;
                    break;
                }
            }
        }
        return deepest;
    }

    /// <summary>What painting one page costs: letters shown and content operations run, counting forms as often as they are painted.</summary>
    public readonly record struct Cost(long Letters, long Operations)
    {
        public static Cost operator +(Cost a, Cost b) => new(Saturate(a.Letters + b.Letters), Saturate(a.Operations + b.Operations));

        private static long Saturate(long v) => v < 0 ? long.MaxValue / 4 : Math.Min(v, long.MaxValue / 4);
    }

    /// <summary>Walks the page tree (cycles and absurd depth ignored) and returns each page's dictionary and inherited resources, in page order.</summary>
    public static List<(DictionaryToken Page, DictionaryToken? Resources)> Pages(PdfDocument pdf, int max)
    {
        var pages = new List<(DictionaryToken, DictionaryToken?)>();
        var seen = new HashSet<IndirectReference>();
        var root = pdf.Structure.Catalog.CatalogDictionary;
        if (!root.TryGet(NameToken.Pages, out var pagesToken)) return pages;
        void Walk(IToken token, DictionaryToken? resources, int depth)
        {
            if (pages.Count > max || depth > 64) return;
            if (token is IndirectReferenceToken r && !seen.Add(r.Data)) return;
            if (Resolve(pdf, token) is not DictionaryToken node) return;
            if (Resolve(pdf, node.Data.GetValueOrDefault("Resources")) is DictionaryToken own) resources = own;
            if (Resolve(pdf, node.Data.GetValueOrDefault("Kids")) is ArrayToken kids)
            {
                foreach (var kid in kids.Data) Walk(kid, resources, depth + 1);
                return;
            }
            pages.Add((node, resources));
        }
        Walk(pagesToken, null, 0);
        return pages;
    }

    /// <summary>The cost of painting a page, stopping once it is known to pass <paramref name="letterCap"/> or <paramref name="operationCap"/>.</summary>
    public static Cost OfPage(PdfDocument pdf, DictionaryToken page, DictionaryToken? resources, long letterCap, long operationCap)
    {
        var walker = new Walker(pdf, letterCap, operationCap);
        var contents = Resolve(pdf, page.Data.GetValueOrDefault("Contents"));
        var streams = contents is ArrayToken a ? a.Data.Select(t => Resolve(pdf, t)).OfType<StreamToken>().ToList()
            : contents is StreamToken s ? [s] : [];
        var total = default(Cost);
        foreach (var stream in streams)
        {
            total += walker.Content(walker.Decode(stream), resources, 0);
            if (walker.Over(total)) break;
        }
        return total;
    }

    private sealed class Walker(PdfDocument pdf, long letterCap, long operationCap)
    {
        private readonly Dictionary<IndirectReference, Cost> _forms = [];
        private readonly HashSet<IndirectReference> _painting = [];

        public bool Over(Cost c) => c.Letters > letterCap || c.Operations > operationCap;

        public ReadOnlySpan<byte> Decode(StreamToken s) => s.Decode(pdf.Structure.FilterProvider, pdf.Structure.TokenScanner).Span;

        public Cost Content(ReadOnlySpan<byte> content, DictionaryToken? resources, int depth)
        {
            long letters = 0, operations = 0;
            var total = default(Cost);
            int nameStart = -1, nameEnd = -1; // the last name operand, made a string only when a form is painted
            for (int i = 0; i < content.Length; i++)
            {
                byte c = content[i];
                if (IsWhite(c)) continue;
                switch (c)
                {
                    case (byte)'%':
                        while (i < content.Length && content[i] is not ((byte)'\n' or (byte)'\r')) i++;
                        continue;
                    case (byte)'(':
                        i = SkipString(content, i, out int n);
                        letters += n;
                        continue;
                    case (byte)'<' when i + 1 < content.Length && content[i + 1] == '<':
                    case (byte)'>' when i + 1 < content.Length && content[i + 1] == '>':
                        i++;
                        continue;
                    case (byte)'<':
                    {
                        int close = content[(i + 1)..].IndexOf((byte)'>');
                        var hex = close < 0 ? content[(i + 1)..] : content.Slice(i + 1, close);
                        int digits = 0;
                        if (!hex.ContainsAnyExcept(HexDigits)) digits = hex.Length;
                        else foreach (byte b in hex) if (Uri.IsHexDigit((char)b)) digits++;
                        i += 1 + hex.Length;
                        letters += digits / 2;
                        continue;
                    }
                    case (byte)'[' or (byte)']' or (byte)'{' or (byte)'}' or (byte)'>' or (byte)')':
                        continue;
                    case (byte)'/':
                    {
                        int start = ++i;
                        i = EndOfWord(content, i);
                        (nameStart, nameEnd) = (start, i);
                        i--;
                        continue;
                    }
                }
                int from = i;
                i = EndOfWord(content, i);
                var word = content[from..i];
                i--;
                if (word.Length == 0 || !(char.IsAsciiLetter((char)word[0]) || word[0] is (byte)'\'' or (byte)'"')) continue; // a number
                operations++;
                if (word.SequenceEqual("ID"u8))
                {
                    // Inline image data: binary up to "EI".
                    int end = content[(i + 1)..].IndexOf("EI"u8);
                    i = end < 0 ? content.Length : i + 1 + end + 1;
                }
                else if (word.SequenceEqual("Do"u8) && nameStart >= 0)
                {
                    total += Form(resources, System.Text.Encoding.Latin1.GetString(content[nameStart..nameEnd]), depth);
                    if (Over(total + new Cost(letters, operations))) break;
                }
            }
            return total + new Cost(letters, operations);
        }

        private Cost Form(DictionaryToken? resources, string name, int depth)
        {
            if (depth > 32 || Resolve(pdf, resources?.Data.GetValueOrDefault("XObject")) is not DictionaryToken xobjects) return default;
            if (xobjects.Data.GetValueOrDefault(name) is not IndirectReferenceToken r) return default;
            if (_forms.TryGetValue(r.Data, out var known)) return known;
            if (!_painting.Add(r.Data)) return default; // a form that paints itself: the parser stops it; so does this
            try
            {
                if (Resolve(pdf, r) is not StreamToken form || !(form.StreamDictionary.Data.GetValueOrDefault("Subtype") is NameToken { Data: "Form" }))
                    return _forms[r.Data] = default;
                var own = Resolve(pdf, form.StreamDictionary.Data.GetValueOrDefault("Resources")) as DictionaryToken ?? resources;
                return _forms[r.Data] = Content(Decode(form), own, depth + 1);
            }
            finally
            {
                _painting.Remove(r.Data);
            }
        }
    }

    private static IToken? Resolve(PdfDocument pdf, IToken? token)
    {
        for (int hops = 0; token is IndirectReferenceToken r && hops < 8; hops++)
            token = pdf.Structure.GetObject(r.Data)?.Data;
        return token is IndirectReferenceToken ? null : token;
    }

    /// <summary>Skips a literal string starting at <paramref name="i"/> (an opening parenthesis); returns the index of its closing one and its length.</summary>
    private static int SkipString(ReadOnlySpan<byte> s, int i, out int length)
    {
        int level = 0;
        length = 0;
        for (; i < s.Length; i++)
        {
            byte c = s[i];
            if (c == '\\') { i++; length++; continue; }
            if (c == '(') { if (level++ > 0) length++; continue; }
            if (c == ')') { if (--level == 0) return i; length++; continue; }
            length++;
        }
        return s.Length;
    }

    private static bool IsKeyword(ReadOnlySpan<byte> s, int i, ReadOnlySpan<byte> word) =>
        s[i..].StartsWith(word) && (i == 0 || IsWhite(s[i - 1]) || s[i - 1] == '>') && i + word.Length < s.Length && IsWhite(s[i + word.Length]);

    private static bool IsWhite(byte c) => c is 0 or 9 or 10 or 12 or 13 or 32;

    private static readonly System.Buffers.SearchValues<byte> HexDigits = System.Buffers.SearchValues.Create("0123456789ABCDEFabcdef"u8);

    /// <summary>White space and delimiters: where a word (a number, an operator, a name) ends.</summary>
    private static readonly System.Buffers.SearchValues<byte> WordEnds = System.Buffers.SearchValues.Create([0, 9, 10, 12, 13, 32, .. "()<>[]{}/%"u8]);

    /// <summary>The index of the first white space or delimiter at or after <paramref name="i"/> (the length when none).</summary>
    private static int EndOfWord(ReadOnlySpan<byte> s, int i)
    {
        int n = s[i..].IndexOfAny(WordEnds);
        return n < 0 ? s.Length : i + n;
    }

    private static bool IsDelimiter(byte c) => c is (byte)'(' or (byte)')' or (byte)'<' or (byte)'>' or (byte)'[' or (byte)']' or (byte)'{' or (byte)'}' or (byte)'/' or (byte)'%';
}
