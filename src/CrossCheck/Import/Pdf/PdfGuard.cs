using System.IO.Compression;
using System.Runtime.InteropServices;
using UglyToad.PdfPig.Filters;
using UglyToad.PdfPig.Tokens;

namespace CrossCheck.Import.Pdf;

/// <summary>A PDF went over one of the <see cref="PdfLimits"/> while it was being read; the message says which.</summary>
internal sealed class PdfLimitException(string message) : Exception(message);

/// <summary>
/// What one document may decompress: every stream at most <see cref="PdfLimits.MaxStreamBytes"/>, all of them together
/// at most <see cref="PdfLimits.MaxDecodedBytes"/>. Shared by the decoding filters of one document; the first refusal
/// is kept, since the parser may swallow the exception that carries it.
/// </summary>
internal sealed class DecodeBudget(PdfLimits limits, CancellationToken token)
{
    private long _total;
    private volatile string? _refusal;

    public PdfLimits Limits { get; } = limits;
    public CancellationToken Token { get; } = token;

    /// <summary>Why decoding was refused, when it was.</summary>
    public string? Refusal => _refusal;

    /// <summary>Accounts for <paramref name="bytes"/> about to be produced by one stream; throws when a limit is passed.</summary>
    public void Take(long bytes)
    {
        Token.ThrowIfCancellationRequested();
        if (bytes > Limits.MaxStreamBytes) Refuse(Messages.PdfStreamTooLarge(Limits.MaxStreamBytes));
        if (Interlocked.Add(ref _total, bytes) > Limits.MaxDecodedBytes) Refuse(Messages.PdfDecodedTooMuch(Limits.MaxDecodedBytes));
    }

    public void Refuse(string message)
    {
        _refusal ??= message;
        throw new PdfLimitException(message);
    }
}

/// <summary>
/// The parser's stream filters, each measured before it runs: a compressed stream is inflated once into nothing to
/// learn its size (a compression bomb is refused without ever being held in memory), then decoded by the parser's own
/// filter. LZW and run-length streams are sized the same way; other filters cannot expand much.
/// </summary>
internal sealed class GuardedFilterProvider(DecodeBudget budget) : IFilterProvider
{
    private readonly IFilterProvider _inner = DefaultFilterProvider.Instance;

    public IReadOnlyList<IFilter> GetFilters(DictionaryToken dictionary) => Wrap(_inner.GetFilters(dictionary));

    public IReadOnlyList<IFilter> GetNamedFilters(IReadOnlyList<NameToken> names) => Wrap(_inner.GetNamedFilters(names));

    public IReadOnlyList<IFilter> GetAllFilters() => Wrap(_inner.GetAllFilters());

    private readonly RecentlyDecoded _recent = new();

    private IReadOnlyList<IFilter> Wrap(IReadOnlyList<IFilter> filters) => filters.Select(f => (IFilter)new GuardedFilter(f, budget, _recent)).ToList();

    /// <summary>
    /// The last few compressed streams decoded, with their output: a page's content is decoded once to measure its
    /// cost (<see cref="PdfCost"/>) and again by the parser. A repeat is charged to the budget as before, but not inflated twice.
    /// </summary>
    private sealed class RecentlyDecoded
    {
        private const int Entries = 4;
        private const int MaxOutputBytes = 4 * 1024 * 1024;
        private readonly List<(DictionaryToken Dictionary, int Index, byte[] Input, byte[] Output, long Expected)> _entries = [];

        public bool TryGet(DictionaryToken dictionary, int index, ReadOnlySpan<byte> input, out byte[] output, out long expected)
        {
            lock (_entries)
            {
                foreach (var e in _entries)
                {
                    // The parser reads the page's stream anew: the same dictionary and bytes, not the same objects.
                    if (e.Index == index && input.SequenceEqual(e.Input) && (ReferenceEquals(e.Dictionary, dictionary) || e.Dictionary.Equals((IToken)dictionary)))
                    {
                        output = e.Output.ToArray();
                        expected = e.Expected;
                        return true;
                    }
                }
            }
            output = [];
            expected = 0;
            return false;
        }

        public void Add(DictionaryToken dictionary, int index, ReadOnlySpan<byte> input, ReadOnlySpan<byte> output, long expected)
        {
            if (output.Length > MaxOutputBytes) return;
            lock (_entries)
            {
                if (_entries.Count == Entries) _entries.RemoveAt(0);
                _entries.Add((dictionary, index, input.ToArray(), output.ToArray(), expected));
            }
        }
    }

    private sealed class GuardedFilter(IFilter inner, DecodeBudget budget, RecentlyDecoded recent) : IFilter
    {
        public bool IsSupported => inner.IsSupported;

        public Memory<byte> Decode(Memory<byte> input, DictionaryToken streamDictionary, IFilterProvider filterProvider, int filterIndex)
        {
            if (inner is FlateFilter && recent.TryGet(streamDictionary, filterIndex, input.Span, out var known, out long charged))
            {
                budget.Take(charged);
                if (charged == 0) budget.Take(known.Length);
                return known;
            }
            var output = DecodeMeasured(input, streamDictionary, filterProvider, filterIndex, out long expected);
            if (inner is FlateFilter) recent.Add(streamDictionary, filterIndex, input.Span, output.Span, expected);
            return output;
        }

        private Memory<byte> DecodeMeasured(Memory<byte> input, DictionaryToken streamDictionary, IFilterProvider filterProvider, int filterIndex, out long expected)
        {
            long cap = budget.Limits.MaxStreamBytes + 1;
            expected = inner switch
            {
                FlateFilter => StreamSizes.Inflated(input, cap),
                LzwFilter => StreamSizes.Lzw(input.Span, cap),
                RunLengthFilter => StreamSizes.RunLength(input.Span, cap),
                _ => 0,
            };
            budget.Take(expected);
            var output = inner.Decode(input, streamDictionary, filterProvider, filterIndex);
            if (expected == 0) budget.Take(output.Length);
            return output;
        }
    }
}

/// <summary>Sizes of decoded streams, found without keeping the decoded bytes; each stops counting at a cap.</summary>
internal static class StreamSizes
{
    /// <summary>Bytes a Flate stream inflates to (as the parser reads it: the two-byte zlib header skipped), at most <paramref name="cap"/>.</summary>
    public static long Inflated(Memory<byte> input, long cap)
    {
        if (input.Length < 3) return 0;
        var source = MemoryMarshal.TryGetArray<byte>(input, out var segment)
            ? new MemoryStream(segment.Array!, segment.Offset + 2, segment.Count - 2, writable: false)
            : new MemoryStream(input[2..].ToArray(), writable: false);
        long total = 0;
        var buffer = System.Buffers.ArrayPool<byte>.Shared.Rent(64 * 1024);
        try
        {
            using var inflate = new DeflateStream(source, CompressionMode.Decompress);
            int n;
            while ((n = inflate.Read(buffer, 0, buffer.Length)) > 0)
            {
                total += n;
                if (total >= cap) return total;
            }
        }
        catch (InvalidDataException)
        {
            // Damaged data: what inflated before the damage is what the parser will get at most.
        }
        finally
        {
            System.Buffers.ArrayPool<byte>.Shared.Return(buffer);
        }
        return total;
    }

    /// <summary>Bytes an LZW stream (PDF variant, early change) decodes to, at most <paramref name="cap"/>: only the lengths of the table's strings are kept.</summary>
    public static long Lzw(ReadOnlySpan<byte> input, long cap)
    {
        const int clear = 256, end = 257;
        var lengths = new int[4096];
        int next = 258, width = 9, previous = -1;
        long total = 0, bitBuffer = 0;
        int bits = 0;
        for (int i = 0; i < input.Length;)
        {
            while (bits < width && i < input.Length) { bitBuffer = (bitBuffer << 8) | input[i++]; bits += 8; }
            if (bits < width) break;
            int code = (int)((bitBuffer >> (bits - width)) & ((1 << width) - 1));
            bits -= width;
            if (code == clear) { next = 258; width = 9; previous = -1; continue; }
            if (code == end) break;
            int length = code < 256 ? 1 : code < next ? lengths[code] : previous >= 0 ? Length(previous) + 1 : 1;
            if (previous >= 0 && next < 4096) lengths[next++] = Length(previous) + 1;
            total += length;
            if (total >= cap) return total;
            previous = code;
            if (next + 1 >= (1 << width) && width < 12) width++;
        }
        return total;

        int Length(int c) => c < 256 ? 1 : lengths[c];
    }

    /// <summary>Bytes a run-length stream decodes to, at most <paramref name="cap"/>.</summary>
    public static long RunLength(ReadOnlySpan<byte> input, long cap)
    {
        long total = 0;
        for (int i = 0; i < input.Length;)
        {
            int n = input[i];
            if (n == 128) break;
            if (n < 128) { total += n + 1; i += n + 2; }
            else { total += 257 - n; i += 2; }
            if (total >= cap) return total;
        }
        return total;
    }
}
