using System.Globalization;
using System.Text;

namespace CrossCheck.Tests.Support;

/// <summary>
/// The generated entries of the catalogue about files rather than their content: links to devices and system files, named
/// pipes, text in UTF-16 and UTF-32, a header of one unknown column repeated thousands of times, and PDFs whose text a person
/// does not see (white on a white page, far off the page) or that the PDF library cannot parse.
/// </summary>
public static class HostileFiles
{
    /// <summary>Writes the input <paramref name="name"/> into <paramref name="folder"/>; null when the name is not one of these.</summary>
    public static string? Make(string name, string folder)
    {
        string path = Path.Combine(folder, name);
        switch (name)
        {
            case "link-to-dev-zero.csv":
                return SpecialFiles.Link(path, "/dev/zero");
            case "link-to-dev-zero.pdf":
                return SpecialFiles.Link(path, "/dev/zero");
            case "named-pipe.csv":
                return SpecialFiles.Fifo(path);
            case "table-linked-to-system-file":
            {
                Directory.CreateDirectory(path);
                foreach (var f in Directory.GetFiles(Path.Combine(RepoPaths.Root, "fixtures", "demo", "shed-frame")))
                    if (Path.GetFileName(f) != "joints.csv") File.Copy(f, Path.Combine(path, Path.GetFileName(f)));
                SpecialFiles.Link(Path.Combine(path, "joints.csv"), "/etc/passwd");
                return path;
            }
            case "utf16-text-in-number.csv":
                File.WriteAllBytes(path, [.. Encoding.Unicode.GetPreamble(), .. Encoding.Unicode.GetBytes(Committed("text-in-number.csv"))]);
                return path;
            case "utf32be-text-in-number.csv":
            {
                var utf32 = new UTF32Encoding(bigEndian: true, byteOrderMark: false);
                File.WriteAllBytes(path, utf32.GetBytes(Committed("text-in-number.csv")));
                return path;
            }
            case "unknown-column-repeated.csv":
                File.WriteAllText(path, SampleText.With(loads: "[loads]\ncase,on,kind,w," + string.Join(",", Enumerable.Repeat("colour", 5000)) + "\n1,AB,udl,18\n"));
                return path;
            case "pdf-white-text.pdf":
                File.WriteAllBytes(path, PdfBombs.OnePage("1 1 1 rg " + TableText(72)));
                return path;
            case "pdf-off-page-text.pdf":
                File.WriteAllBytes(path, PdfBombs.OnePage(TableText(9000)));
                return path;
            case "pdf-unparsable.pdf":
                File.WriteAllBytes(path, Encoding.Latin1.GetBytes("%PDF-1.7\n1 0 obj\n<< /Type /Catalog /Pages 7 0 R >>\nendobj\ntrailer\n<< /Root 1 0 R /Size 2 >>\n%%EOF\n"));
                return path;
            default:
                return null;
        }
    }

    private static string Committed(string name) => File.ReadAllText(Path.Combine(RepoPaths.Root, "fixtures", "bad", name));

    /// <summary>The catalogue base's tables as lines of text starting at x = <paramref name="x"/> points.</summary>
    private static string TableText(int x)
    {
        string[] lines =
        [
            "Joint x y Restraint", "A 0 0 fixed", "B 6 0 roller", "Member Start End E [GPa] I [mm4]", "AB A B 200 250e6",
            "Case On Kind w", "1 AB udl 18", "Case Member At Moment", "1 AB A -81", "1 AB B 0",
        ];
        var sb = new StringBuilder(string.Create(CultureInfo.InvariantCulture, $"BT /F1 11 Tf {x} 770 Td 14 TL "));
        foreach (var l in lines) sb.Append('(').Append(l).Append(") Tj T* ");
        return sb.Append("ET").ToString();
    }
}
