using System.Buffers.Binary;
using System.IO.Compression;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Reads the pixels of an 8-bit, non-interlaced PNG (what a browser screenshot is), enough to tell a blank picture
/// from a drawing. Follows the PNG specification (W3C, 2nd edition): chunks, zlib-compressed IDAT, per-row filters 0–4.
/// </summary>
public sealed class Png
{
    private Png(int width, int height, byte[] rgb)
    {
        Width = width;
        Height = height;
        Rgb = rgb;
    }

    public int Width { get; }
    public int Height { get; }

    /// <summary>Three bytes per pixel, row by row.</summary>
    public byte[] Rgb { get; }

    public static Png Read(byte[] file)
    {
        ArgumentNullException.ThrowIfNull(file);
        byte[] signature = [137, 80, 78, 71, 13, 10, 26, 10];
        if (file.Length < 8 || !file.AsSpan(0, 8).SequenceEqual(signature)) throw new InvalidDataException("not a PNG");
        int pos = 8, width = 0, height = 0, colourType = 0;
        using var idat = new MemoryStream();
        while (pos + 8 <= file.Length)
        {
            int length = BinaryPrimitives.ReadInt32BigEndian(file.AsSpan(pos));
            string type = System.Text.Encoding.ASCII.GetString(file, pos + 4, 4);
            var data = file.AsSpan(pos + 8, length);
            if (type == "IHDR")
            {
                width = BinaryPrimitives.ReadInt32BigEndian(data);
                height = BinaryPrimitives.ReadInt32BigEndian(data[4..]);
                if (data[8] != 8 || data[12] != 0) throw new InvalidDataException("only 8-bit non-interlaced PNGs are read here");
                colourType = data[9];
            }
            else if (type == "IDAT") idat.Write(data);
            else if (type == "IEND") break;
            pos += 12 + length;
        }
        int bpp = colourType switch { 2 => 3, 6 => 4, 0 => 1, 4 => 2, _ => throw new InvalidDataException($"colour type {colourType} not read here") };
        idat.Position = 0;
        using var z = new ZLibStream(idat, CompressionMode.Decompress);
        using var raw = new MemoryStream();
        z.CopyTo(raw);
        var bytes = raw.ToArray();
        int stride = width * bpp;
        var prev = new byte[stride];
        var cur = new byte[stride];
        var rgb = new byte[width * height * 3];
        for (int y = 0; y < height; y++)
        {
            int filter = bytes[y * (stride + 1)];
            Array.Copy(bytes, (y * (stride + 1)) + 1, cur, 0, stride);
            for (int i = 0; i < stride; i++)
            {
                int a = i >= bpp ? cur[i - bpp] : 0, b = prev[i], c = i >= bpp ? prev[i - bpp] : 0;
                cur[i] = (byte)(cur[i] + filter switch
                {
                    1 => a,
                    2 => b,
                    3 => (a + b) / 2,
                    4 => Paeth(a, b, c),
                    _ => 0,
                });
            }
            for (int x = 0; x < width; x++)
            {
                int o = ((y * width) + x) * 3;
                if (bpp >= 3) { rgb[o] = cur[x * bpp]; rgb[o + 1] = cur[(x * bpp) + 1]; rgb[o + 2] = cur[(x * bpp) + 2]; }
                else rgb[o] = rgb[o + 1] = rgb[o + 2] = cur[x * bpp];
            }
            (prev, cur) = (cur, prev);
        }
        return new Png(width, height, rgb);
    }

    private static int Paeth(int a, int b, int c)
    {
        int p = a + b - c, pa = Math.Abs(p - a), pb = Math.Abs(p - b), pc = Math.Abs(p - c);
        return pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
    }

    /// <summary>Share of pixels darker than near-white.</summary>
    public double InkShare()
    {
        long ink = 0;
        for (int i = 0; i < Rgb.Length; i += 3)
            if (Rgb[i] + Rgb[i + 1] + Rgb[i + 2] < 3 * 235) ink++;
        return (double)ink / (Width * Height);
    }

    /// <summary>Number of distinct colours (capped for speed).</summary>
    public int DistinctColours(int cap = 4096)
    {
        var seen = new HashSet<int>();
        for (int i = 0; i < Rgb.Length && seen.Count < cap; i += 3) seen.Add((Rgb[i] << 16) | (Rgb[i + 1] << 8) | Rgb[i + 2]);
        return seen.Count;
    }
}
