using System.Text;
using CsCheck;

namespace CrossCheck.Tests.Robustness;

/// <summary>One change to a file: what kind, where (a fraction of the length), how much, and which token to use.</summary>
public sealed record Edit(int Kind, double At, int Length, int Token)
{
    public const int Kinds = 12;

    public override string ToString() => $"{Mutations.KindNames[Kind]}@{At:0.###}/{Length}/#{Token}";
}

/// <summary>
/// Random mutations of valid input files for the fuzz tests: byte flips, deletions, insertions of awkward tokens
/// (huge and denormal numbers, NaN, quotes, section lines, byte-order marks, very long strings), cell replacements,
/// duplicated, dropped and swapped lines, truncation, random bytes. Each mutation is a list of <see cref="Edit"/>s
/// applied in order, so that CsCheck can shrink a failing one to the few edits that matter.
/// </summary>
public static class Mutations
{
    public static readonly string[] KindNames =
        ["flip", "delete", "insert", "cell", "duplicate-line", "delete-line", "swap-lines", "truncate", "random-bytes", "control", "repeat", "zero-fill"];

    /// <summary>Text that breaks readers: numbers at the edges of double, words of the format in the wrong place, quoting, encodings.</summary>
    public static readonly string[] Tokens =
    [
        "", "0", "-0", "1e308", "-1e308", "4.9e-324", "1e-310", "2.2250738585072014e-308", "NaN", "Infinity", "-inf", "1e30", "1e31", "1e-30",
        "123456789012345678901234567890", "0x10", "1,5", "1.5.5", "\u22123", "(4)", "\"", "\"\"", "\"a,b\"", ",", ",,,,,,,,", "#", "[members]",
        "[loads]", "[end-moments]", "[info]", "[joints]", "[supports]", "[spans]", "[distribution]", "\uFEFF", "\0", "\r", "\t", "\n", "\u03A9",
        "\u65E5\u672C", "A", "B", "C", "AB", "BC", "start", "end", "fixed", "free", "pinned", "roller", "guided", "udl", "point", "moment",
        "force", "linear", "up", "left", "both", "kN", "mm", "x [kN]", "I [furlong]", "moment [kN\u00B7m]", "force unit", "length unit",
        "sagging", "elastic", "rigid", "1e5", "100000", "-100000", "99999999999999999999999999999999999999999999999999", "0.000000001",
        "1e-9", "-1", "-6", "6", "12.5", "1E+02", "+7", "..", "-", "e", "DF", "FEM", "balance", "final", "M_AB", "AB@A",
        new string('x', 3000), new string('9', 400), "\u00E9", "\u00C3\u00A9", "\u202E", "\u200B",
    ];

    public static readonly Gen<Edit> Edits =
        Gen.Select(Gen.Int[0, Edit.Kinds - 1], Gen.Double[0, 1], Gen.Int[1, 64], Gen.Int[0, Tokens.Length - 1])
            .Select(t => new Edit(t.Item1, t.Item2, t.Item3, t.Item4));

    /// <summary>Applies <paramref name="edits"/> to a copy of <paramref name="original"/>.</summary>
    public static byte[] Apply(byte[] original, IReadOnlyList<Edit> edits)
    {
        var b = new List<byte>(original);
        foreach (var e in edits) Apply(b, e);
        return [.. b];
    }

    private static void Apply(List<byte> b, Edit e)
    {
        int n = b.Count;
        int at = Math.Clamp((int)(e.At * n), 0, n);
        byte[] token = Encoding.UTF8.GetBytes(Tokens[e.Token]);
        switch (e.Kind)
        {
            case 0 when n > 0:
                b[Math.Min(at, n - 1)] ^= (byte)(1 << (e.Token % 8));
                break;
            case 1:
                b.RemoveRange(at, Math.Min(e.Length, n - at));
                break;
            case 2:
                b.InsertRange(at, token);
                break;
            case 3:
            {
                // Replace the cell (between separators) that holds the position.
                int start = at, end = at;
                while (start > 0 && b[start - 1] is not ((byte)',' or (byte)';' or (byte)'\n')) start--;
                while (end < n && b[end] is not ((byte)',' or (byte)';' or (byte)'\n' or (byte)'\r')) end++;
                b.RemoveRange(start, end - start);
                b.InsertRange(start, token);
                break;
            }
            case 4 or 5 or 6:
            {
                var (ls, le) = Line(b, at);
                var line = b.GetRange(ls, le - ls);
                if (e.Kind == 4) b.InsertRange(ls, line);
                else if (e.Kind == 5) b.RemoveRange(ls, le - ls);
                else if (le < n)
                {
                    var (ns, ne) = Line(b, le);
                    var next = b.GetRange(ns, ne - ns);
                    b.RemoveRange(ls, ne - ls);
                    b.InsertRange(ls, [.. next, .. line]);
                }
                break;
            }
            case 7:
                b.RemoveRange(at, n - at);
                break;
            case 8:
            {
                var bytes = new byte[e.Length];
                new Random(e.Token * 7919 + e.Length).NextBytes(bytes);
                b.InsertRange(at, bytes);
                break;
            }
            case 9:
                b.InsertRange(at, [(byte)(e.Token % 32)]);
                break;
            case 10:
            {
                // A stretch of the file repeated: long lines, repeated rows, repeated PDF objects.
                int len = Math.Min(e.Length * 16, n - at);
                var piece = b.GetRange(at, len);
                for (int r = 0; r < 1 + (e.Token % 8); r++) b.InsertRange(at, piece);
                break;
            }
            case 11:
                for (int i = at; i < Math.Min(n, at + e.Length); i++) b[i] = 0;
                break;
        }
    }

    /// <summary>The line (with its end) holding position <paramref name="at"/>.</summary>
    private static (int Start, int End) Line(List<byte> b, int at)
    {
        int s = Math.Min(at, b.Count), t = s;
        while (s > 0 && b[s - 1] != '\n') s--;
        while (t < b.Count && b[t] != '\n') t++;
        if (t < b.Count) t++;
        return (s, t);
    }
}
