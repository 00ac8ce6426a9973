using System.Diagnostics;
using System.Globalization;
using System.Text;

namespace CrossCheck.TestTools;

/// <summary>
/// A fresh set of hostile inputs and situations, made from a variant number (it starts the random numbers: the same
/// number makes the same set) and none of them from the shipped catalogue: special files, links, encodings, huge and odd
/// values, terminal escapes, injection strings, mechanisms, submissions over their time budget, outputs that name inputs
/// or devices, damaged registers, odd models and interrupted screens. All content is invented.
/// </summary>
public static class HostileSet
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>A set-up that writes the small beam (<see cref="Beam"/>) as calc.csv and runs <paramref name="args"/>.</summary>
    public static Func<string, string[]> OnBeam(params string[] args) => f =>
    {
        Write(f, "calc.csv", Beam());
        return args;
    };

    /// <summary>A valid propped cantilever (A fixed, B roller, 6 m, 18 kN/m) with any section replaced.</summary>
    public static string Beam(string? title = null, string? joints = null, string? members = null, string? loads = null, string? claims = null, string? extraInfo = null) =>
        $"[info]\nkey,value\ntitle,{title ?? "Hostile round lintel"}\nforce unit,kN\nlength unit,m\n{extraInfo}\n" +
        $"[joints]\njoint,x,y,restraint\n{joints ?? "A,0,0,fixed\nB,6,0,roller"}\n\n" +
        $"[members]\nmember,start,end,E [GPa],I [mm^4]\n{members ?? "AB,A,B,200,250e6"}\n\n" +
        $"[loads]\ncase,on,kind,w,P,a,b,dir\n{loads ?? "1,AB,udl,18,,,,"}\n\n" +
        $"[end-moments]\ncase,member,at,moment\n{claims ?? "1,AB,A,-81\n1,AB,B,0"}\n";

    public static string Write(string folder, string name, string text)
    {
        string path = Path.Combine(folder, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    public static void Fifo(string path)
    {
        using var p = Process.Start(new ProcessStartInfo("mkfifo", [path]) { UseShellExecute = false })!;
        p.WaitForExit();
    }

    public static List<Scenario> Make(int variant, string demo)
    {
        var rnd = new Random(variant);
        var list = new List<Scenario>();
        SpecialFiles(list, rnd);
        Links(list);
        Encodings(list, rnd);
        OddValues(list, rnd);
        Escapes(list, rnd);
        Injection(list, rnd);
        Mechanisms(list, rnd);
        HostileSetMore.OverBudget(list, rnd);
        HostileSetMore.Outputs(list, rnd, demo);
        HostileSetMore.Registers(list, rnd, demo);
        HostileSetMore.Models(list, rnd);
        HostileSetMore.Interrupted(list, rnd);
        return list;
    }

    private static void SpecialFiles(List<Scenario> list, Random rnd)
    {
        foreach (var device in new[] { "/dev/zero", "/dev/urandom", "/dev/null", "/dev/full" })
            foreach (var ext in new[] { ".csv", ".pdf" })
                list.Add(new("special-files", $"{ext} linked to {device}", Expect.Refused, f =>
                {
                    File.CreateSymbolicLink(Path.Combine(f, "calc" + ext), device);
                    return ["review", "calc" + ext];
                }, Protected: [device]));
        foreach (var ext in new[] { ".csv", ".pdf" })
            list.Add(new("special-files", $"named pipe {ext} as submission", Expect.Refused, f =>
            {
                Fifo(Path.Combine(f, "calc" + ext));
                return ["review", "calc" + ext];
            }, Protected: ["calc" + ext]));
        list.Add(new("special-files", "named pipe as --template", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam());
            Fifo(Path.Combine(f, "t.sbn"));
            return ["review", "calc.csv", "--template", "t.sbn"];
        }, Protected: ["t.sbn", "calc.csv"]));
        list.Add(new("special-files", "named pipe as --register", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam());
            Fifo(Path.Combine(f, "r.db"));
            return ["review", "calc.csv", "--register", "r.db"];
        }, Protected: ["r.db"]));
        list.Add(new("special-files", "/dev/zero as --template of a screen", Expect.Refused, f =>
        {
            Write(f, "in/a.csv", Beam());
            return ["screen", "in", "--template", "/dev/zero", "--no-register"];
        }, Protected: ["/dev/zero"]));
        list.Add(new("special-files", "/dev/null as --register", Expect.Refused, OnBeam("review", "calc.csv", "--register", "/dev/null"), Check: (_, _) => File.Exists("/dev/null-wal") ? Verdict.Overwrite : null, Protected: ["/dev/null"]));
        list.Add(new("special-files", "folder table linked to /dev/zero", Expect.Refused, f =>
        {
            Directory.CreateDirectory(Path.Combine(f, "sub"));
            File.CreateSymbolicLink(Path.Combine(f, "sub", "joints.csv"), "/dev/zero");
            return ["review", "sub"];
        }));
        list.Add(new("special-files", "screen with a pipe, a device link and a good file", Expect.Refused, f =>
        {
            Write(f, "in/good.csv", Beam());
            Fifo(Path.Combine(f, "in", "pipe.csv"));
            File.CreateSymbolicLink(Path.Combine(f, "in", "zero.pdf"), "/dev/zero");
            return ["screen", "in", "--no-register", "-q"];
        }, Check: (f, _) => File.Exists(Path.Combine(f, "in-screen", "good-review.html")) ? null : Verdict.Other));
        _ = rnd;
    }

    private static void Links(List<Scenario> list)
    {
        foreach (var target in new[] { "/etc/passwd", "/etc/hostname", "/proc/self/environ", "/etc/shadow" })
            list.Add(new("links", $"table linked to {target}", Expect.Refused, f =>
            {
                Directory.CreateDirectory(Path.Combine(f, "sub"));
                File.WriteAllText(Path.Combine(f, "sub", "members.csv"), "member,start,end,I\nAB,A,B,1\n");
                File.CreateSymbolicLink(Path.Combine(f, "sub", "joints.csv"), target);
                return ["review", "sub"];
            }, Check: (_, r) => r.All.Contains("root:", StringComparison.Ordinal) || r.All.Contains("PATH=", StringComparison.Ordinal) ? Verdict.Other : null));
        list.Add(new("links", "link loop", Expect.Refused, f =>
        {
            File.CreateSymbolicLink(Path.Combine(f, "a.csv"), "b.csv");
            File.CreateSymbolicLink(Path.Combine(f, "b.csv"), "a.csv");
            return ["review", "a.csv"];
        }));
        list.Add(new("links", "dangling link", Expect.Refused, f =>
        {
            File.CreateSymbolicLink(Path.Combine(f, "calc.csv"), "/nonexistent/calc.csv");
            return ["review", "calc.csv"];
        }));
        list.Add(new("links", "screened entry linked to /etc", Expect.Refused, f =>
        {
            Write(f, "in/good.csv", Beam());
            Directory.CreateSymbolicLink(Path.Combine(f, "in", "etc"), "/etc");
            return ["screen", "in", "--no-register", "-q"];
        }, Check: (f, _) => File.ReadAllText(Path.Combine(f, "in-screen", "summary.csv")).Contains("outside the folder", StringComparison.Ordinal) ? null : Verdict.WrongAcceptance));
        list.Add(new("links", "screened file linked to /etc/passwd", Expect.Refused, f =>
        {
            Write(f, "in/good.csv", Beam());
            File.CreateSymbolicLink(Path.Combine(f, "in", "passwd.csv"), "/etc/passwd");
            return ["screen", "in", "--no-register", "-q"];
        }, Check: (f, r) => Directory.GetFiles(Path.Combine(f, "in-screen")).Any(p => File.ReadAllText(p).Contains("root:x", StringComparison.Ordinal)) ? Verdict.Other : null));
    }

    private static void Encodings(List<Scenario> list, Random rnd)
    {
        var encodings = new (string Name, Encoding E, bool Bom)[]
        {
            ("UTF-8 BOM", new UTF8Encoding(true), true), ("UTF-16LE BOM", new UnicodeEncoding(false, true), true), ("UTF-16BE BOM", new UnicodeEncoding(true, true), true),
            ("UTF-32LE BOM", new UTF32Encoding(false, true), true), ("UTF-32BE BOM", new UTF32Encoding(true, true), true), ("UTF-16LE", new UnicodeEncoding(false, false), false),
            ("UTF-16BE", new UnicodeEncoding(true, false), false), ("UTF-32LE", new UTF32Encoding(false, false), false), ("UTF-32BE", new UTF32Encoding(true, false), false),
        };
        foreach (var (name, e, bom) in encodings)
            list.Add(new("encodings", name, Expect.Accepted, f =>
            {
                File.WriteAllBytes(Path.Combine(f, "calc.csv"), [.. bom ? e.GetPreamble() : [], .. e.GetBytes(Beam(title: "Träger Nr. " + rnd.Next(100)))]);
                return ["review", "calc.csv", "--out", "memo.md"];
            }, Check: (f, r) => File.ReadAllText(Path.Combine(f, "memo.md")).Contains("Träger Nr.", StringComparison.Ordinal) && r.Code == 0 ? null : Verdict.Other));
        list.Add(new("encodings", "UTF-16 with an odd byte cut off", Expect.Refused, f =>
        {
            byte[] b = [.. new UnicodeEncoding(false, true).GetPreamble(), .. Encoding.Unicode.GetBytes(Beam())];
            File.WriteAllBytes(Path.Combine(f, "calc.csv"), b[..^3]);
            return ["review", "calc.csv"];
        }));
        for (int k = 0; k < 3; k++)
            list.Add(new("encodings", $"random bytes {k}", Expect.Refused, f =>
            {
                var b = new byte[rnd.Next(10, 50_000)];
                rnd.NextBytes(b);
                File.WriteAllBytes(Path.Combine(f, "calc.csv"), b);
                return ["review", "calc.csv"];
            }));
    }

    private static void OddValues(List<Scenario> list, Random rnd)
    {
        string[] values = ["1e308", "-1e308", "NaN", "Infinity", "-Infinity", "1e-320", "0x10", "1e400", "∞", "1.2.3", "--5", "0", "-250e6", new string('9', 400), "1_000"];
        string[] where = ["I", "x", "w", "moment", "E"];
        for (int k = 0; k < 15; k++)
        {
            string v = values[k % values.Length], col = where[rnd.Next(where.Length)];
            // A zero or a large negative load or claim is legal (a warning, or a finding); everything else here is refused.
            var expect = col is "w" or "moment" && v is "0" or "-250e6" ? Expect.Accepted : Expect.Refused;
            list.Add(new("odd-values", $"{col} = {v[..Math.Min(12, v.Length)]}", expect, f =>
            {
                string text = col switch
                {
                    "I" => Beam(members: $"AB,A,B,200,{v}"),
                    "x" => Beam(joints: $"A,0,0,fixed\nB,{v},0,roller"),
                    "w" => Beam(loads: $"1,AB,udl,{v},,,,"),
                    "moment" => Beam(claims: $"1,AB,A,{v}\n1,AB,B,0"),
                    _ => Beam(members: $"AB,A,B,{v},250e6"),
                };
                Write(f, "calc.csv", text);
                return ["review", "calc.csv"];
            }));
        }
        list.Add(new("odd-values", "25 MB of rows", Expect.Refused, f =>
        {
            using var w = new StreamWriter(Path.Combine(f, "calc.csv"));
            w.Write(Beam());
            w.Write("\n[reactions]\ncase,joint,Rx\n");
            while (w.BaseStream.Length < 25L * 1024 * 1024) w.Write("1,A,0\n");
            return ["review", "calc.csv"];
        }));
        list.Add(new("odd-values", "a header of 30 000 columns", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam().Replace("case,on,kind,w,P,a,b,dir", "case,on,kind,w,P,a,b,dir," + string.Join(",", Enumerable.Range(0, 30_000).Select(i => "c" + i)), StringComparison.Ordinal));
            return ["review", "calc.csv"];
        }));
        list.Add(new("odd-values", "a joint 10^7 km away", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam(joints: "A,0,0,fixed\nB,1e10,0,roller"));
            return ["review", "calc.csv"];
        }));
    }

    private static string Escape(Random rnd) => rnd.Next(6) switch
    {
        0 => "\u001b]0;owned\u0007",
        1 => "\u001b[2J\u001b[H",
        2 => "\u001b[31mred\u001b[0m",
        3 => "\u009b31m",
        4 => "\u001bP+q\u001b\\",
        _ => "\u0008\u0008\u0008\r",
    };

    private static void Escapes(List<Scenario> list, Random rnd)
    {
        foreach (var command in new[] { "review", "solve", "screen", "history", "extract-like" })
            for (int k = 0; k < 3; k++)
            {
                string esc = Escape(rnd);
                list.Add(new("terminal-escapes", $"{command} with {esc.Length}-character escape #{k}", Expect.Accepted, f =>
                {
                    string text = Beam(title: "Lintel " + esc, extraInfo: $"reference,REF{esc}{k}\n");
                    switch (command)
                    {
                        case "screen":
                            Write(f, $"in/calc{esc.Replace('/', '_').Replace('\\', '_')}.csv", text);
                            return ["screen", "in", "--register", "r.db"];
                        case "history":
                            Write(f, "calc.csv", text);
                            return ["review", "calc.csv", "--register", "r.db", "--reviewer", "A " + esc];
                        case "solve":
                            Write(f, "calc.csv", text.Replace("AB,A,B,200,250e6", $"AB{esc},A,B,200,250e6").Replace("1,AB,udl", $"1,AB{esc},udl").Replace("1,AB,A,-81\n1,AB,B,0", $"1,AB{esc},A,-81\n1,AB{esc},B,0"));
                            return ["solve", "calc.csv"];
                        default:
                            Write(f, "calc.csv", text);
                            return ["review", "calc.csv"];
                    }
                }, Check: (f, _) => command == "history" ? HostileRunHistory(f) : null));
            }
    }

    /// <summary>After a review recorded with escapes in its title and reviewer: `history` prints no control character.</summary>
    private static Verdict? HostileRunHistory(string folder) => HostileSetMore.Runner is { } run
        && run.Cli(folder, ["history", "--register", "r.db"], TimeSpan.FromSeconds(60)) is var h
        && (h.Code != 0 || h.All.Contains('\u001b', StringComparison.Ordinal) || h.All.Contains('\u0007', StringComparison.Ordinal)) ? Verdict.Other : null;

    private static readonly string[] Injections =
    [
        "=HYPERLINK(\"http://x\",\"y\")", "+1+1", "@SUM(A1)", "-2+3", "\tTAB", "<img src=x onerror=alert(1)>", "[x](javascript:alert(1))", "<script>alert(1)</script>",
        "[red]red[/]", ":warning:", "info.csv:1:key:", "{{ model }}", "${PATH}", "../../etc/passwd", "\u202Eevil.csv", "A\u200BB",
    ];

    private static void Injection(List<Scenario> list, Random rnd)
    {
        foreach (var s in Injections)
        {
            string safe = s.Replace(",", ";", StringComparison.Ordinal).Replace("\"", "'", StringComparison.Ordinal);
            list.Add(new("injection", $"title {safe[..Math.Min(16, safe.Length)]}", Expect.Accepted, f =>
            {
                Write(f, "calc.csv", Beam(title: "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"", extraInfo: $"reference,\"{s.Replace("\"", "\"\"", StringComparison.Ordinal)}\"\n"));
                return ["review", "calc.csv", "--out", "memo.md"];
            }, Check: (f, r) =>
            {
                string md = File.ReadAllText(Path.Combine(f, "memo.md"));
                bool raw = md.Contains("<img", StringComparison.Ordinal) || md.Contains("<script", StringComparison.Ordinal) || md.Contains("](javascript", StringComparison.Ordinal);
                bool markup = r.Out.Contains('⚠') || r.Out.Contains("🔑", StringComparison.Ordinal);
                return raw || markup ? Verdict.Other : null;
            }));
        }
        for (int k = 0; k < 4; k++)
        {
            string s = Injections[rnd.Next(4)];
            list.Add(new("injection", $"solve --format csv with member '{s}'", Expect.Accepted, f =>
            {
                string id = "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
                Write(f, "calc.csv", Beam(members: $"{id},A,B,200,250e6", loads: $"1,{id},udl,18,,,,", claims: $"1,{id},A,-81\n1,{id},B,0"));
                return ["solve", "calc.csv", "--format", "csv", "--out", "out.csv"];
            }, Check: (f, _) => File.ReadAllLines(Path.Combine(f, "out.csv")).Skip(1).Any(l => l.Split(',')[1].TrimStart('"') is var c && c.Length > 0 && "=+@\t".Contains(c[0], StringComparison.Ordinal)) ? Verdict.Other : null));
        }
    }

    private static void Mechanisms(List<Scenario> list, Random rnd)
    {
        for (int k = 0; k < 3; k++)
        {
            double h = 3 + rnd.Next(4), l = 5 + rnd.Next(6);
            string joints = string.Create(Inv, $"A,0,0,pinned\nB,0,{h},free\nC,{l},{h},free\nD,{l},0,pinned");
            list.Add(new("mechanisms", $"pinned portal, hinged column tops, gravity only #{k}", Expect.Refused, f =>
            {
                Write(f, "calc.csv", Beam(joints: joints, members: "AB,A,B,200,80e6,end\nBC,B,C,200,200e6,none\nCD,C,D,200,80e6,start",
                    loads: "1,BC,udl,12,,,,", claims: "1,BC,B,0\n1,BC,C,0").Replace("I [mm^4]\n", "I [mm^4],hinge\n", StringComparison.Ordinal));
                return ["review", "calc.csv"];
            }));
            list.Add(new("mechanisms", $"the same with a lateral load of 1e-12 #{k}", Expect.Refused, f =>
            {
                Write(f, "calc.csv", Beam(joints: joints, members: "AB,A,B,200,80e6,end\nBC,B,C,200,200e6,none\nCD,C,D,200,80e6,start",
                    loads: "1,BC,udl,12,,,,\n1,B,force,,1e-12,,,right", claims: "1,BC,B,0\n1,BC,C,0").Replace("I [mm^4]\n", "I [mm^4],hinge\n", StringComparison.Ordinal));
                return ["review", "calc.csv"];
            }));
        }
        list.Add(new("mechanisms", "beam on rollers only", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam(joints: "A,0,0,roller\nB,6,0,roller"));
            return ["review", "calc.csv"];
        }));
        list.Add(new("mechanisms", "a loose member beside a propped cantilever", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam(joints: "A,0,0,fixed\nB,6,0,roller\nC,10,0,free\nD,12,0,free", members: "AB,A,B,200,250e6\nCD,C,D,200,250e6"));
            return ["review", "calc.csv"];
        }));
        list.Add(new("mechanisms", "a free cantilever tip joined by a hinge to nothing", Expect.Refused, f =>
        {
            Write(f, "calc.csv", Beam(joints: "A,0,0,pinned\nB,6,0,free", loads: "1,AB,udl,18,,,,"));
            return ["review", "calc.csv"];
        }));
    }
}
