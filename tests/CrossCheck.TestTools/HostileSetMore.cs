using System.Globalization;
using System.Text;
using Microsoft.Data.Sqlite;

namespace CrossCheck.TestTools;

/// <summary>The rest of <see cref="HostileSet"/>: time budgets, outputs, registers, odd models and interrupted screens.</summary>
public static class HostileSetMore
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The runner, for checks that run a second command (history after a review, a re-run after an interrupted screen).</summary>
    public static HostileRun? Runner { get; set; }

    /// <summary>A frame of <paramref name="bays"/> × <paramref name="storeys"/> with <paramref name="cases"/> load cases and every claim wrong.</summary>
    public static string Frame(int bays, int storeys, int cases, Random rnd)
    {
        var sb = new StringBuilder("[info]\nkey,value\ntitle,Hostile round frame\nforce unit,kN\nlength unit,m\n\n[joints]\njoint,x,y,restraint\n");
        for (int i = 0; i <= bays; i++)
            for (int j = 0; j <= storeys; j++) sb.Append(Inv, $"J{i}_{j},{i * 6},{j * 3.5},{(j == 0 ? "fixed" : "free")}\n");
        sb.Append("\n[members]\nmember,start,end,E [GPa],I [mm^4]\n");
        var members = new List<string>();
        for (int i = 0; i <= bays; i++)
            for (int j = 1; j <= storeys; j++) { members.Add($"C{i}_{j}"); sb.Append(Inv, $"C{i}_{j},J{i}_{j - 1},J{i}_{j},200,{rnd.Next(80, 400)}e6\n"); }
        for (int i = 1; i <= bays; i++)
            for (int j = 1; j <= storeys; j++) { members.Add($"B{i}_{j}"); sb.Append(Inv, $"B{i}_{j},J{i - 1}_{j},J{i}_{j},200,{rnd.Next(150, 600)}e6\n"); }
        sb.Append("\n[loads]\ncase,on,kind,w,P,dir\n");
        for (int c = 1; c <= cases; c++)
            foreach (var m in members.Where(m => m[0] == 'B')) sb.Append(Inv, $"L{c},{m},udl,{rnd.Next(5, 30)},,\n");
        sb.Append("\n[end-moments]\ncase,member,at,moment\n");
        for (int c = 1; c <= cases; c++)
            foreach (var m in members) sb.Append(Inv, $"L{c},{m},start,{rnd.Next(-90, 90)}\nL{c},{m},end,{rnd.Next(-90, 90)}\n");
        return sb.ToString();
    }

    public static void OverBudget(List<Scenario> list, Random rnd)
    {
        for (int k = 0; k < 3; k++)
        {
            int bays = 10 + k, storeys = 12;
            list.Add(new("over-budget", $"{bays}x{storeys} frame, every claim wrong, --time-limit 2", Expect.Refused, f =>
            {
                HostileSet.Write(f, "calc.csv", Frame(bays, storeys, 8, rnd));
                return ["review", "calc.csv", "--time-limit", "2", "--max-members", "1000"];
            }, Check: (_, r) => r.Err.Contains("took longer than the time limit", StringComparison.Ordinal) && r.Elapsed < TimeSpan.FromSeconds(60) ? null : Verdict.Other));
        }
        list.Add(new("over-budget", "screen: a big frame over budget beside two small ones", Expect.Refused, f =>
        {
            HostileSet.Write(f, "in/big.csv", Frame(12, 12, 8, rnd));
            HostileSet.Write(f, "in/a.csv", HostileSet.Beam());
            HostileSet.Write(f, "in/b.csv", HostileSet.Beam());
            return ["screen", "in", "--time-limit", "2", "--max-members", "1000", "--no-register", "-q"];
        }, Check: (f, _) =>
        {
            string summary = File.ReadAllText(Path.Combine(f, "in-screen", "summary.csv"));
            return summary.Contains("took longer than the time limit", StringComparison.Ordinal) && summary.Contains("a.csv,concur", StringComparison.Ordinal) ? null : Verdict.Other;
        }));
    }

    public static void Outputs(List<Scenario> list, Random rnd, string demo)
    {
        list.Add(new("outputs", "--out is the submission", Expect.Refused, HostileSet.OnBeam("review", "calc.csv", "--out", "calc.csv"), Protected: ["calc.csv"]));
        list.Add(new("outputs", "--out is a link to the submission", Expect.Refused, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            File.CreateSymbolicLink(Path.Combine(f, "memo.md"), "calc.csv");
            return ["review", "calc.csv", "--out", "memo.md"];
        }, Protected: ["calc.csv"]));
        list.Add(new("outputs", "--out through a folder link back to the submission", Expect.Refused, f =>
        {
            HostileSet.Write(f, "d/calc.csv", HostileSet.Beam());
            Directory.CreateSymbolicLink(Path.Combine(f, "e"), "d");
            return ["review", "d/calc.csv", "--out", "e/calc.csv"];
        }, Protected: ["d/calc.csv"]));
        list.Add(new("outputs", "--out is a table of the folder reviewed", Expect.Refused, f =>
        {
            foreach (var file in Directory.GetFiles(demo)) File.Copy(file, Path.Combine(f, Path.GetFileName(file)));
            return ["review", ".", "--out", "members.csv"];
        }, Protected: ["members.csv"]));
        list.Add(new("outputs", "--out is the template", Expect.Refused, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            HostileSet.Write(f, "t.sbn", "{{ model.Title }}");
            return ["review", "calc.csv", "--template", "t.sbn", "--out", "t.sbn"];
        }, Protected: ["t.sbn"]));
        list.Add(new("outputs", "solve --out is the submission", Expect.Refused, HostileSet.OnBeam("solve", "calc.csv", "--out", "./calc.csv"), Protected: ["calc.csv"]));
        list.Add(new("outputs", "register export --out is the register", Expect.Refused, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            Runner!.Cli(f, ["review", "calc.csv", "--register", "r.db", "-q"], TimeSpan.FromSeconds(60));
            return ["register", "export", "--register", "r.db", "--out", "r.db"];
        }, Protected: ["r.db"]));
        foreach (var target in new[] { "/dev/null", "/dev/stdout", "-", "/dev/full" })
            list.Add(new("outputs", $"--out {target}", target == "/dev/full" ? Expect.Refused : Expect.Accepted, HostileSet.OnBeam("review", "calc.csv", "--out", target, "-q"),
                Protected: target.StartsWith('/') ? [target] : []));
        list.Add(new("outputs", "--out a named pipe with a reader", Expect.Accepted, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            HostileSet.Fifo(Path.Combine(f, "pipe"));
            _ = Task.Run(() => File.ReadAllText(Path.Combine(f, "pipe")));
            return ["review", "calc.csv", "--out", "pipe", "-q"];
        }, Protected: ["pipe"]));
        foreach (int bytes in new[] { 250, 255 })
            list.Add(new("outputs", $"a legal {bytes}-byte --out name", Expect.Accepted, f =>
            {
                string name = new string('é', (bytes - 3) / 2) + ((bytes - 3) % 2 == 1 ? "x" : "") + ".md";
                HostileSet.Write(f, "calc.csv", HostileSet.Beam());
                return ["review", "calc.csv", "--out", name, "-q"];
            }, Check: (f, _) => Directory.GetFiles(f).Length == 2 ? null : Verdict.Other));
        list.Add(new("outputs", "stale temporary files of a killed writer", Expect.Accepted, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            HostileSet.Write(f, $".memo.md.{999_000_000 + rnd.Next(1000)}.0123abcd.tmp", "half");
            return ["review", "calc.csv", "--out", "memo.md", "-q"];
        }));
    }

    public static void Registers(List<Scenario> list, Random rnd, string demo)
    {
        string Recorded(string f)
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam(extraInfo: "reference,R-1\n"));
            var r = Runner!.Cli(f, ["review", "calc.csv", "--register", "r.db", "-q", "--out", "m.md"], TimeSpan.FromSeconds(60));
            if (r.Code is not (0 or 1)) throw new InvalidOperationException("could not record: " + r.Err);
            return Path.Combine(f, "r.db");
        }
        string[] columns = ["round", "reference", "verdict", "ends_agree", "abs_tolerance", "review_date", "finding_count"];
        object[] values = ["x", -5, 1e300, "", "\u001b[2J", 3.5];
        for (int k = 0; k < 6; k++)
        {
            string column = columns[rnd.Next(columns.Length)];
            object value = values[rnd.Next(values.Length)];
            // Of these, only a text reference of any kind and a non-negative real tolerance are values CrossCheck could have written.
            bool valid = column == "reference" && value is string || column == "abs_tolerance" && value is double;
            foreach (var command in new[] { "history", "check" })
                list.Add(new("registers", $"{command} with {column} = {value}", valid ? Expect.Accepted : Expect.Refused, f =>
                {
                    string db = Recorded(f);
                    using (var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = db, Pooling = false }.ToString()))
                    {
                        c.Open();
                        using var cmd = c.CreateCommand();
                        cmd.CommandText = $"UPDATE reviews SET {column} = $v";
                        cmd.Parameters.AddWithValue("$v", value);
                        cmd.ExecuteNonQuery();
                    }
                    return command == "history" ? ["history", "--register", "r.db"] : ["register", "check", "--register", "r.db"];
                }));
        }
        foreach (var damage in new[] { "pages overwritten", "truncated", "not SQLite", "header only" })
            foreach (var command in new[] { "history", "check", "export" })
                list.Add(new("registers", $"{command} of a register {damage}", Expect.Refused, f =>
                {
                    string db = Recorded(f);
                    byte[] bytes = File.ReadAllBytes(db);
                    bytes = damage switch
                    {
                        "pages overwritten" => [.. bytes[..100], .. Enumerable.Range(0, bytes.Length - 100).Select(i => (byte)rnd.Next(256))],
                        "truncated" => bytes[..(bytes.Length / 3)],
                        "not SQLite" => Encoding.UTF8.GetBytes(HostileSet.Beam()),
                        _ => bytes[..100],
                    };
                    File.WriteAllBytes(db, bytes);
                    foreach (var side in new[] { "-wal", "-shm" }) File.Delete(db + side);
                    return command switch
                    {
                        "history" => ["history", "--register", "r.db"],
                        "check" => ["register", "check", "--register", "r.db"],
                        _ => ["register", "export", "--register", "r.db"],
                    };
                }));
        list.Add(new("registers", "a folder as --register", Expect.Refused, f =>
        {
            Directory.CreateDirectory(Path.Combine(f, "r.db"));
            HostileSet.Write(f, "calc.csv", HostileSet.Beam());
            return ["review", "calc.csv", "--register", "r.db"];
        }));
        _ = demo;
    }

    public static void Models(List<Scenario> list, Random rnd)
    {
        (char Latin, char Other)[] pairs = [('A', 'А'), ('B', 'В'), ('C', 'С'), ('E', 'Е'), ('H', 'Н'), ('K', 'К'), ('O', 'Ο'), ('P', 'Р'), ('T', 'Т'), ('X', 'Χ')];
        for (int k = 0; k < 4; k++)
        {
            var (latin, other) = pairs[rnd.Next(pairs.Length)];
            string a = $"{latin}1", b = k % 2 == 0 ? $"{other}1" : $"{latin}\u200B1";
            list.Add(new("odd-models", $"look-alike joint ids {k}", Expect.Accepted, f =>
            {
                HostileSet.Write(f, "calc.csv", HostileSet.Beam(joints: $"{a},0,0,fixed\n{b},6,0,roller", members: $"AB,{a},{b},200,250e6"));
                return ["review", "calc.csv", "--format", "json", "--out", "r.json"];
            }, Check: (f, _) => File.ReadAllText(Path.Combine(f, "r.json")).Contains("look alike", StringComparison.Ordinal) ? null : Verdict.WrongAcceptance));
        }
        list.Add(new("odd-models", "coincident joints", Expect.Accepted, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam(joints: "A,0,0,fixed\nB,6,0,roller\nB2,6,0,free\nC,9,0,fixed", members: "AB,A,B,200,250e6\nBC,B2,C,200,250e6"));
            return ["review", "calc.csv", "--format", "json", "--out", "r.json"];
        }, Check: (f, _) => File.ReadAllText(Path.Combine(f, "r.json")).Contains("at the same place", StringComparison.Ordinal) ? null : Verdict.WrongAcceptance));
        list.Add(new("odd-models", "member through a joint", Expect.Accepted, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam(joints: "A,0,0,fixed\nB,6,0,roller\nC,2.5,0,free\nD,2.5,-3,fixed", members: "AB,A,B,200,250e6\nCD,C,D,200,250e6"));
            return ["review", "calc.csv", "--format", "json", "--out", "r.json"];
        }, Check: (f, _) => File.ReadAllText(Path.Combine(f, "r.json")).Contains("lies on member", StringComparison.Ordinal) ? null : Verdict.WrongAcceptance));
        list.Add(new("odd-models", "a member entered twice", Expect.Accepted, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam(members: "AB,A,B,200,250e6\nAB2,A,B,200,250e6"));
            return ["review", "calc.csv", "--format", "json", "--out", "r.json"];
        }, Check: (f, _) => File.ReadAllText(Path.Combine(f, "r.json")).Contains("both join", StringComparison.Ordinal) ? null : Verdict.WrongAcceptance));
        for (int k = 0; k < 3; k++)
        {
            double a = Math.Round(rnd.NextDouble() * 6, 2);
            list.Add(new("odd-models", $"udl from {a} to {a}", Expect.Refused, f =>
            {
                HostileSet.Write(f, "calc.csv", HostileSet.Beam(loads: string.Create(Inv, $"1,AB,udl,18,,,,\n1,AB,udl,40,,{a},{a},")));
                return ["review", "calc.csv"];
            }));
        }
        list.Add(new("odd-models", "a bad member row: no 'separate structures' warning", Expect.Refused, f =>
        {
            HostileSet.Write(f, "calc.csv", HostileSet.Beam(joints: "A,0,0,fixed\nB,6,0,free\nC,12,0,roller", members: "AB,A,B,200,250e6\nBC,B,C,200,-1"));
            return ["review", "calc.csv"];
        }, Check: (_, r) => r.Err.Contains("separate structures", StringComparison.Ordinal) ? Verdict.Other : null));
    }

    public static void Interrupted(List<Scenario> list, Random rnd)
    {
        foreach (var signal in new[] { "INT", "TERM", "INT", "TERM", "KILL", "KILL" })
        {
            int delay = 500 + rnd.Next(2500);
            list.Add(new("interrupted-screens", $"SIG{signal} after {delay} ms", Expect.Interrupted, f =>
            {
                var rr = new Random(delay);
                for (int i = 0; i < 24; i++) HostileSet.Write(f, $"in/s{i:D2}.csv", i % 4 == 0 ? Frame(3, 3, 2, rr) : HostileSet.Beam(claims: $"1,AB,A,-{70 + i}\n1,AB,B,0"));
                return ["screen", "in", "--register", "r.db", "--jobs", "1", "-q"];
            }, Check: (f, r) =>
            {
                if (signal != "KILL" && r.Code is 130 or 143 && !File.Exists(Path.Combine(f, "in-screen", "summary.csv"))) return Verdict.Other;
                var again = Runner!.Cli(f, ["screen", "in", "--register", "r.db", "-q"], TimeSpan.FromSeconds(120));
                if (again.Code is not (0 or 1 or 2)) return Verdict.Other;
                if (File.Exists(Path.Combine(f, "in-screen", "screen-in-progress.txt"))) return Verdict.Other;
                if (Directory.GetFiles(Path.Combine(f, "in-screen"), ".*.tmp").Length > 0) return Verdict.Other;
                using var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = Path.Combine(f, "r.db"), Pooling = false }.ToString());
                c.Open();
                using var cmd = c.CreateCommand();
                cmd.CommandText = "SELECT count(*) FROM reviews";
                long reviews = (long)cmd.ExecuteScalar()!;
                // Interrupted and resumed: one review each; finished before the signal: a second screen records repeats (48).
                return reviews is 24 or 48 ? null : Verdict.Other;
            })
            { Interrupt = (signal, TimeSpan.FromMilliseconds(delay)) });
        }
    }
}
