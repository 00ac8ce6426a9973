using System.Globalization;
using System.IO.Compression;
using System.Text;
using CrossCheck.Import;
using CrossCheck.Tests.Import.Pdf;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Makes the bad inputs of the catalogue (<c>fixtures/bad/manifest.csv</c>) that are binary, huge or hostile, so that
/// none of them is committed: garbage bytes named .csv, over-long lines, files over each limit, truncated PDFs and PDF
/// bombs (compression bombs, deep nesting, forms painted billions of times). Every file is built from invented content
/// and random numbers of a fixed variant, so each run makes the same bytes.
/// </summary>
public static class HostileInputs
{
    /// <summary>The generated inputs made whole in memory, by name.</summary>
    private static readonly Dictionary<string, Func<byte[]>> Made = new(StringComparer.Ordinal)
    {
        ["binary-garbage.csv"] = () => Garbage(64 * 1024, 11),
        ["very-long-line.csv"] = () => Text(SampleText.All.Replace("1,AB,udl,18", "1,AB,udl,18," + new string('9', 200_000), StringComparison.Ordinal)),
        ["too-many-rows.csv"] = () => Text(SampleText.With(loads: "[loads]\ncase,on,kind,w\n" + string.Concat(Enumerable.Repeat("1,AB,udl,0.01\n", InputLimits.Default.MaxRows + 1)))),
        ["too-many-members.csv"] = () => Text(Beam(InputLimits.Default.MaxMembers + 1)),
        ["too-many-cases.csv"] = () => Text(SampleText.With(loads: "[loads]\ncase,on,kind,w\n" + string.Concat(Enumerable.Range(1, 51).Select(i => $"C{i},AB,udl,{i}\n")))),
        ["empty.pdf"] = () => [],
        ["truncated.pdf"] = () =>
        {
            byte[] whole = File.ReadAllBytes(Path.Combine(RepoPaths.Root, "fixtures", "demo", "footbridge.pdf"));
            return whole[..(whole.Length * 2 / 5)];
        },
        ["bomb-deflate.pdf"] = () => PdfBombs.Deflated(megabytes: 100),
        ["bomb-double-deflate.pdf"] = () => PdfBombs.DoubleDeflated(megabytes: 100),
        ["bomb-nesting.pdf"] = () => PdfBombs.NestedObjects(depth: 50_000),
        ["bomb-content-nesting.pdf"] = () => PdfBombs.NestedContent(depth: 5_000),
        ["bomb-forms.pdf"] = () => PdfBombs.Forms(levels: 9, fan: 10),
        ["bomb-letters.pdf"] = () => PdfBombs.Letters(letters: 3_000_000),
        ["too-many-pages.pdf"] = () => PdfBombs.BlankPages(201),
        ["pdf-bad-number.pdf"] = () => PdfTestData.SampleBeam("Catalogue base, bad number", xOfB: "6.0.1").Build(),
        ["pdf-no-end-moments.pdf"] = () => PdfTestData.SampleBeam("Catalogue base, claims left out", claims: false).Build(),
    };

    /// <summary>Writes the generated input <paramref name="name"/> into <paramref name="folder"/> and returns its path.</summary>
    public static string Make(string name, string folder)
    {
        string path = Path.Combine(folder, name);
        if (Made.TryGetValue(name, out var make))
        {
            File.WriteAllBytes(path, make());
        }
        else if (name == "too-large.csv")
        {
            // Sparse: the size is checked before anything is read, so no 21 MB need be written.
            using var f = new FileStream(path, FileMode.Create);
            f.Write(Encoding.UTF8.GetBytes(SampleText.All));
            f.SetLength(21L * 1024 * 1024);
        }
        else
        {
            return HostileFiles.Make(name, folder) ?? throw new ArgumentException($"no generated input is called '{name}'", nameof(name));
        }
        return path;
    }

    private static byte[] Text(string text) => Encoding.UTF8.GetBytes(text);

    /// <summary>Bytes that are no text at all (NULs included), from random numbers of the given variant.</summary>
    public static byte[] Garbage(int length, int variant)
    {
        var bytes = new byte[length];
        new Random(variant).NextBytes(bytes);
        return bytes;
    }

    /// <summary>A continuous beam of <paramref name="spans"/> equal spans with a load on each and claims at every end.</summary>
    public static string Beam(int spans)
    {
        var sb = new StringBuilder(SampleText.Info).Append("\n\n[supports]\nsupport,restraint\n");
        for (int i = 0; i <= spans; i++) sb.Append(CultureInfo.InvariantCulture, $"S{i},{(i == 0 ? "pinned" : "roller")}\n");
        sb.Append("\n[spans]\nspan,length,I\n");
        for (int i = 1; i <= spans; i++) sb.Append(CultureInfo.InvariantCulture, $"P{i},5,1\n");
        sb.Append("\n[loads]\ncase,on,kind,w\n");
        for (int i = 1; i <= spans; i++) sb.Append(CultureInfo.InvariantCulture, $"1,P{i},udl,10\n");
        sb.Append("\n[end-moments]\ncase,member,at,moment\n");
        for (int i = 1; i <= spans; i++) sb.Append(CultureInfo.InvariantCulture, $"1,P{i},start,-20\n1,P{i},end,20\n");
        return sb.ToString();
    }
}

/// <summary>
/// Hand-made PDFs that attack the reader rather than the parser's happy path. Each is a minimal valid file (catalog,
/// page tree, one page, Helvetica) with its cross-reference table computed, so that the attack, not damage, is what
/// the reader meets.
/// </summary>
public static class PdfBombs
{
    private const string Page = "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >>{0} >>{1} >>";
    private const string Font = "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>";

    /// <summary>A page whose content stream inflates to <paramref name="megabytes"/> MB of spaces (about a thousandth of that in the file).</summary>
    public static byte[] Deflated(int megabytes) =>
        Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", ""), Stream("/Filter /FlateDecode", Deflate(Spaces(megabytes))), Font);

    /// <summary>The same bomb compressed twice (<c>[/FlateDecode /FlateDecode]</c>): its first stage is small, its second huge.</summary>
    public static byte[] DoubleDeflated(int megabytes) =>
        Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", ""),
            Stream("/Filter [/FlateDecode /FlateDecode]", Deflate(Deflate(Spaces(megabytes)))), Font);

    /// <summary>Arrays nested <paramref name="depth"/> deep in the page dictionary.</summary>
    public static byte[] NestedObjects(int depth) =>
        Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", " /Junk " + new string('[', depth) + new string(']', depth)),
            Stream("", Text("BT /F1 12 Tf 72 770 Td (Nested) Tj ET")), Font);

    /// <summary>Arrays nested <paramref name="depth"/> deep inside a compressed content stream (invisible to a scan of the file).</summary>
    public static byte[] NestedContent(int depth) =>
        Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", ""),
            Stream("/Filter /FlateDecode", Deflate(Text("BT /F1 12 Tf 72 770 Td (Nested) Tj ET " + new string('[', depth) + new string(']', depth) + " pop"))), Font);

    /// <summary>
    /// Forms that paint the next form <paramref name="fan"/> times, <paramref name="levels"/> deep, the last showing one
    /// word: a file of two kilobytes that shows fan^(levels−1) words.
    /// </summary>
    public static byte[] Forms(int levels, int fan)
    {
        const int first = 6;
        var objects = new List<string>
        {
            Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, $" /XObject << /X {first} 0 R >>", ""), Stream("", Text("/X Do")), Font,
        };
        for (int l = 0; l < levels; l++)
        {
            bool last = l == levels - 1;
            string body = last ? "BT /F1 12 Tf 72 770 Td (laugh) Tj ET" : string.Join(" ", Enumerable.Repeat("/X Do", fan));
            string resources = last ? "/Font << /F1 5 0 R >>" : $"/XObject << /X {first + l + 1} 0 R >>";
            objects.Add(Stream($"/Type /XObject /Subtype /Form /BBox [0 0 595 842] /Resources << {resources} >>", Text(body)));
        }
        return Document([.. objects]);
    }

    /// <summary>One compressed content stream showing <paramref name="letters"/> one-letter strings.</summary>
    public static byte[] Letters(int letters)
    {
        var sb = new StringBuilder("BT /F1 6 Tf 20 820 Td ");
        for (int i = 0; i < letters; i++) sb.Append("(x)Tj ");
        sb.Append("ET");
        return Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", ""), Stream("/Filter /FlateDecode", Deflate(Text(sb.ToString()))), Font);
    }

    /// <summary>A one-page document whose content stream is <paramref name="content"/> (Helvetica as /F1).</summary>
    public static byte[] OnePage(string content) =>
        Document(Catalog, Pages(1), string.Format(CultureInfo.InvariantCulture, Page, "", ""), Stream("", Text(content)), Font);

    /// <summary>A document of <paramref name="count"/> blank pages sharing one empty content stream.</summary>
    public static byte[] BlankPages(int count)
    {
        var kids = string.Join(" ", Enumerable.Range(0, count).Select(i => $"{6 + i} 0 R"));
        var objects = new List<string>
        {
            Catalog, $"<< /Type /Pages /Kids [{kids}] /Count {count} >>", "<< >>", Stream("", Text("")), Font,
        };
        for (int i = 0; i < count; i++) objects.Add("<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R >>");
        return Document([.. objects]);
    }

    private const string Catalog = "<< /Type /Catalog /Pages 2 0 R >>";

    private static string Pages(int count) => $"<< /Type /Pages /Kids [3 0 R] /Count {count} >>";

    private static byte[] Text(string s) => Encoding.Latin1.GetBytes(s);

    private static byte[] Spaces(int megabytes)
    {
        var b = new byte[megabytes * 1024 * 1024];
        Array.Fill(b, (byte)' ');
        return b;
    }

    private static byte[] Deflate(byte[] data)
    {
        using var ms = new MemoryStream();
        using (var z = new ZLibStream(ms, CompressionLevel.SmallestSize, leaveOpen: true)) z.Write(data);
        return ms.ToArray();
    }

    /// <summary>A stream object: its dictionary entries and its bytes (the length is filled in).</summary>
    private static string Stream(string entries, byte[] data) => "\u0001" + entries + "\u0002" + Convert.ToBase64String(data);

    /// <summary>Numbers the objects from 1, writes them with a correct cross-reference table and trailer.</summary>
    private static byte[] Document(params string[] objects)
    {
        using var ms = new MemoryStream();
        void W(string s) => ms.Write(Encoding.Latin1.GetBytes(s));
        var offsets = new List<long>();
        W("%PDF-1.7\n%\u00e2\u00e3\u00cf\u00d3\n");
        for (int i = 0; i < objects.Length; i++)
        {
            offsets.Add(ms.Position);
            string o = objects[i];
            if (o.StartsWith('\u0001'))
            {
                int split = o.IndexOf('\u0002', StringComparison.Ordinal);
                byte[] data = Convert.FromBase64String(o[(split + 1)..]);
                W($"{i + 1} 0 obj\n<< {o[1..split]} /Length {data.Length} >>\nstream\n");
                ms.Write(data);
                W("\nendstream\nendobj\n");
            }
            else
            {
                W($"{i + 1} 0 obj\n{o}\nendobj\n");
            }
        }
        long xref = ms.Position;
        W($"xref\n0 {objects.Length + 1}\n0000000000 65535 f \n");
        foreach (long o in offsets) W(string.Create(CultureInfo.InvariantCulture, $"{o:D10} 00000 n \n"));
        W(string.Create(CultureInfo.InvariantCulture, $"trailer\n<< /Size {objects.Length + 1} /Root 1 0 R >>\nstartxref\n{xref}\n%%EOF\n"));
        return ms.ToArray();
    }
}
