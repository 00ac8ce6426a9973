using System.IO.Compression;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Tests.Support;
using CsCheck;
using UglyToad.PdfPig.Filters;
using UglyToad.PdfPig.Tokens;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// The guards that keep a hostile PDF from exhausting memory or time: decoded streams sized before they are decoded
/// (checked against the parser's own decoders), nesting measured before parsing, and pages costed — forms counted as
/// often as they are painted — before they are built.
/// </summary>
public class PdfBombTests
{
    private static readonly DictionaryToken NoParameters = new(new Dictionary<NameToken, IToken>());

    private delegate long SizeOf(ReadOnlySpan<byte> input, long cap);

    /// <summary>
    /// <paramref name="data"/> encoded: the parser's own <paramref name="decoder"/> gives it back whole, and the guard's
    /// <paramref name="size"/>, reckoned without decoding, is its length.
    /// </summary>
    private static void SizedAsDecoded(byte[] data, Func<byte[], byte[]> encode, IFilter decoder, SizeOf size)
    {
        byte[] packed = encode(data);
        decoder.Decode(packed, NoParameters, DefaultFilterProvider.Instance, 0).ToArray().ShouldBe(data);
        size(packed, long.MaxValue).ShouldBe(data.Length);
    }

    [Fact]
    public void InflatedSize_IsTheSizeTheParserDecodes_AndStopsAtTheCap()
    {
        Gen.Byte.Array[0, 5000].Sample(data =>
        {
            byte[] packed = Deflate(data);
            StreamSizes.Inflated(packed, long.MaxValue).ShouldBe(data.Length);
            new FlateFilter().Decode(packed, NoParameters, DefaultFilterProvider.Instance, 0).Length.ShouldBe(data.Length);
        }, iter: 100);
        StreamSizes.Inflated(Deflate(new byte[10_000_000]), cap: 1000).ShouldBeLessThan(1000 + (64 * 1024));
    }

    [Fact]
    public void LzwSize_IsTheSizeTheParserDecodes()
    {
        // The encoder below follows the PDF specification (ISO 32000-1, 7.4.4: 9- to 12-bit codes, code 256 clears the
        // table, 257 ends the data, early change); the parser's own LZW decoder is the outside check on it.
        Gen.Byte[0, 7].Array[0, 3000].Sample(data => SizedAsDecoded(data, LzwEncode, new LzwFilter(), StreamSizes.Lzw), iter: 100);
        // A sweep of lengths, so that some end code falls just where the decoder widens its codes (an edge the encoder once missed).
        var edge = Enumerable.Range(0, 2000).Select(i => (byte)((i * 7 + (i / 3)) % 8)).ToArray();
        for (int n = 1; n < edge.Length; n += 7) SizedAsDecoded(edge[..n], LzwEncode, new LzwFilter(), StreamSizes.Lzw);
    }

    [Fact]
    public void RunLengthSize_IsTheSizeTheParserDecodes()
    {
        Gen.Byte[0, 3].Array[0, 2000].Sample(data => SizedAsDecoded(data, RunLengthEncode, new RunLengthFilter(), StreamSizes.RunLength), iter: 100);
    }

    [Theory]
    [InlineData("[1 [2 [3]]]", 3)]
    [InlineData("<< /A << /B [1 2] >> >>", 3)]
    [InlineData("( [[[[ \\) [[ ) [1]", 1)]                               // brackets inside a string do not count
    [InlineData("% [[[[[[\n[1]", 1)]                                      // nor in a comment
    [InlineData("<5B5B5B> [1]", 1)]                                       // nor a hex string
    [InlineData("1 0 obj << /Length 5 >> stream\n[[[[[\nendstream endobj", 1)] // nor a stream's data
    public void Nesting_CountsArraysAndDictionaries_OutsideStringsCommentsAndStreams(string pdf, int depth)
    {
        PdfCost.Nesting(System.Text.Encoding.Latin1.GetBytes(pdf), 100).ShouldBe(depth);
    }

    [Fact]
    public void FormsPaintedManyTimes_AreRefusedBeforeTheyAreBuilt_AFewLevelsAreRead()
    {
        using var t = new TempSubmission();
        // Ten forms each painting the next ten times, nine deep: 10⁸ words from about 2 KB.
        var bomb = SubmissionReader.Read(t.WriteBytes("bomb.pdf", PdfBombs.Forms(levels: 9, fan: 10)));
        var e = bomb.Errors.ShouldHaveSingleItem();
        e.Where.Compact.ShouldBe("bomb.pdf:p1");
        e.Message.ShouldContain("counting the forms it repeats");
        // Three levels (a hundred words) is an ordinary page: read, and refused only because it holds no table.
        var small = SubmissionReader.Read(t.WriteBytes("small.pdf", PdfBombs.Forms(levels: 3, fan: 10)));
        small.Errors.ShouldHaveSingleItem().Message.ShouldStartWith("no table of the submission format");
    }

    [Fact]
    public void StreamAndDocumentBudgets_AreLimitsThatCanBeSet()
    {
        string demo = CliRunner.Demo("footbridge.pdf");
        SubmissionReader.Read(demo).Succeeded.ShouldBeTrue();
        var perStream = SubmissionReader.Read(demo, PdfLimits.Default with { MaxStreamBytes = 1024 });
        perStream.Errors.ShouldHaveSingleItem().Message.ShouldStartWith("a compressed stream in the PDF expands to more than 1 KB");
        var total = SubmissionReader.Read(demo, PdfLimits.Default with { MaxDecodedBytes = 20 * 1024 });
        total.Errors.ShouldHaveSingleItem().Message.ShouldStartWith("the PDF's compressed streams expand to more than 20 KB in all");
    }

    [Fact]
    public void Bombs_AreRefusedQuickly_AndWithoutHoldingTheirContent()
    {
        using var t = new TempSubmission();
        foreach (var name in new[] { "bomb-deflate.pdf", "bomb-double-deflate.pdf", "bomb-nesting.pdf", "bomb-content-nesting.pdf", "bomb-forms.pdf", "bomb-letters.pdf" })
        {
            string path = HostileInputs.Make(name, t.Folder);
            GC.Collect();
            long before = GC.GetTotalAllocatedBytes(precise: true);
            var r = SubmissionReader.Read(path);
            long allocated = GC.GetTotalAllocatedBytes(precise: true) - before;
            r.Succeeded.ShouldBeFalse(name);
            // Far less than what the bombs expand to (100 MB of content, 10⁸ words, 3 million letters).
            allocated.ShouldBeLessThan(400L * 1024 * 1024, name);
        }
    }

    private static byte[] Deflate(byte[] data)
    {
        using var ms = new MemoryStream();
        using (var z = new ZLibStream(ms, CompressionLevel.Fastest, leaveOpen: true)) z.Write(data);
        return ms.ToArray();
    }

    /// <summary>LZW as PDF writes it, for inputs short enough never to fill the table (fewer than 3800 bytes).</summary>
    private static byte[] LzwEncode(byte[] data)
    {
        var table = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int i = 0; i < 256; i++) table[((char)i).ToString()] = i;
        int next = 258;
        var bits = new List<bool>();
        void Emit(int code)
        {
            // Early change: the decoder, one entry behind, widens its codes when its table reaches 511, 1023, 2047.
            int width = next < 512 ? 9 : next < 1024 ? 10 : next < 2048 ? 11 : 12;
            for (int b = width - 1; b >= 0; b--) bits.Add(((code >> b) & 1) == 1);
        }
        Emit(256);
        string w = "";
        foreach (byte c in data)
        {
            string wc = w + (char)c;
            if (table.ContainsKey(wc)) { w = wc; continue; }
            Emit(table[w]);
            table[wc] = next++;
            w = ((char)c).ToString();
        }
        if (w.Length > 0)
        {
            Emit(table[w]);
            next++; // the decoder adds an entry after this code too, and may widen before the end code
        }
        Emit(257);
        var bytes = new byte[(bits.Count + 7) / 8];
        for (int i = 0; i < bits.Count; i++) if (bits[i]) bytes[i / 8] |= (byte)(0x80 >> (i % 8));
        return bytes;
    }

    /// <summary>Run-length encoding (ISO 32000-1, 7.4.5): runs of 2–128 equal bytes, literal stretches of 1–128.</summary>
    private static byte[] RunLengthEncode(byte[] data)
    {
        var o = new List<byte>();
        int i = 0;
        while (i < data.Length)
        {
            int run = 1;
            while (i + run < data.Length && run < 128 && data[i + run] == data[i]) run++;
            if (run >= 2) { o.Add((byte)(257 - run)); o.Add(data[i]); i += run; continue; }
            int start = i;
            while (i < data.Length && i - start < 128 && !(i + 1 < data.Length && data[i + 1] == data[i])) i++;
            if (i == start) i++;
            o.Add((byte)(i - start - 1));
            o.AddRange(data[start..i]);
        }
        o.Add(128);
        return [.. o];
    }
}
