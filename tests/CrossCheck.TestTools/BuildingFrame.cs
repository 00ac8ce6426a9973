using System.Globalization;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Model;

namespace CrossCheck.TestTools;

/// <summary>The one mistake planted in a generated building frame.</summary>
public enum BuildingMistake
{
    /// <summary>No mistake: the claims are the solver's own answer.</summary>
    None,
    /// <summary>One beam of case G analysed with wL²/8 instead of wL²/12 as its fixed-end moments.</summary>
    FixedEndMoment,
    /// <summary>One claim of case G written with two neighbouring digits exchanged.</summary>
    CopyingSlip,
    /// <summary>The uniform load of one beam of case G put on the next beam of the same length in the same storey.</summary>
    LoadMoved,
    /// <summary>One claim of case G off by 30 % of the case's peak moment: a wrong figure that is no recognisable mistake.</summary>
    WrongClaim,
    /// <summary>Every claim of case G off by 5 to 30 % of the case's peak moment, either way: the worst case for the diagnosis.</summary>
    EveryClaimWrong,
}

/// <summary>
/// Writes an invented multi-storey rigid frame (an office block of <c>storeys</c> × <c>bays</c>) as one CSV submission with
/// two cases (G: a uniform load on every beam; G+W: the same with wind at every floor) and claims from CrossCheck's own
/// solver with one planted mistake. For measuring how the review grows with the size of a frame, not for checking the
/// solver. Members: storeys × (2 × bays + 1).
/// </summary>
public static class BuildingFrame
{
    /// <summary>Storeys and bays of the measured sizes: 300, 1,000 and 5,000 members.</summary>
    public static (int Storeys, int Bays) ForMembers(int members) => members switch
    {
        300 => (20, 7),
        1000 => (40, 12),
        5000 => (40, 62),
        _ => throw new ArgumentOutOfRangeException(nameof(members), members, "sizes: 300, 1000, 5000"),
    };

    /// <summary>Writes the submission to <paramref name="path"/>; returns what was planted, in words.</summary>
    public static string Write(string path, int storeys, int bays, BuildingMistake mistake, int variant)
    {
        var rnd = new Random(variant);
        var inv = CultureInfo.InvariantCulture;
        // Bays alternate 6.0 and 7.5 m; the ground storey is 4.2 m, the others 3.5 m.
        var xs = new double[bays + 1];
        for (int i = 1; i <= bays; i++) xs[i] = xs[i - 1] + (i % 2 == 1 ? 6.0 : 7.5);
        var ys = new double[storeys + 1];
        for (int j = 1; j <= storeys; j++) ys[j] = ys[j - 1] + (j == 1 ? 4.2 : 3.5);
        var sb = new StringBuilder();
        sb.Append("[info]\nkey,value\n");
        sb.Append(inv, $"title,Larchmont Quay office block - {storeys} storeys x {bays} bays (generated)\n");
        sb.Append(inv, $"reference,GEN-BLD-{storeys}x{bays}\nforce unit,kN\nlength unit,m\nprepared by,Generated (test data)\n\n");
        sb.Append("[joints]\njoint,x [m],y [m],restraint\n");
        for (int j = 0; j <= storeys; j++)
            for (int i = 0; i <= bays; i++)
                sb.Append(inv, $"{J(i, j)},{xs[i]:0.0},{ys[j]:0.0},{(j == 0 ? "fixed" : "free")}\n");
        sb.Append("\n[members]\nmember,start,end,E [GPa],I [mm^4]\n");
        var beams = new List<(string Id, int Bay, int Storey)>();
        for (int j = 1; j <= storeys; j++)
        {
            // Columns lighter up the building, in steps of five storeys.
            double column = Math.Max(120, 400 - (20 * ((j - 1) / 5))) * 1e6;
            for (int i = 0; i <= bays; i++) sb.Append(inv, $"C{i}_{j},{J(i, j - 1)},{J(i, j)},200,{column:0}\n");
            for (int i = 1; i <= bays; i++)
            {
                beams.Add(($"B{i}_{j}", i, j));
                sb.Append(inv, $"B{i}_{j},{J(i - 1, j)},{J(i, j)},200,{(i % 2 == 1 ? 350e6 : 500e6):0}\n");
            }
        }
        double W(int storey) => storey == storeys ? 15 : 25;
        var target = beams[rnd.Next(beams.Count)];
        string? movedTo = mistake == BuildingMistake.LoadMoved ? MovedTo(target, bays) : null;
        sb.Append("\n[loads]\ncase,on,kind,w [kN/m],P [kN],dir\n");
        foreach (var c in new[] { "G", "G+W" })
            foreach (var b in beams) sb.Append(inv, $"{c},{b.Id},udl,{W(b.Storey):0},,down\n");
        for (int j = 1; j <= storeys; j++) sb.Append(inv, $"G+W,{J(0, j)},force,,{(j == storeys ? 6 : 12):0},right\n");
        string model = sb.ToString();

        // Claims: the analysis of the model as written, or of the author's mistaken model for case G.
        var s = Read(path, model + "\n[end-moments]\ncase,member,at,moment\nG,B1_1,start,0\n");
        var g = s.Cases.First(c => c.Id == "G");
        var src = new SourceRef("generated");
        string planted = "nothing (the claims are the analysis)";
        var authorG = g;
        if (mistake == BuildingMistake.FixedEndMoment)
        {
            double L = xs[target.Bay] - xs[target.Bay - 1], fem = W(target.Storey) * 1e3 * L * L / 12;
            // wL²/8 = 1.5 × wL²/12: the extra half locked into the beam's ends (clockwise: −, + under gravity).
            authorG = g with { Loads = [.. g.Loads, new LockedEndMoments("G", target.Id, -0.5 * fem, 0.5 * fem, src)] };
            planted = $"fixed-end moments wL²/8 instead of wL²/12 on beam {target.Id} in case G";
        }
        else if (movedTo is not null)
        {
            authorG = g with { Loads = [.. g.Loads.Select(l => l is DistributedLoad d && d.Member == target.Id ? d with { Member = movedTo } : l)] };
            planted = $"the uniform load of beam {target.Id} put on beam {movedTo} in case G";
        }
        var solver = new FrameSolver();
        var right = solver.Solve(s.Model, s.Cases);
        var author = mistake is BuildingMistake.FixedEndMoment or BuildingMistake.LoadMoved ? solver.Solve(s.Model, [authorG]).Cases[0] : right.Cases[0];
        var rows = new List<(string Case, string Member, string At, double Moment)>();
        foreach (var result in new[] { author, right.Cases.First(c => c.Case == "G+W") })
            foreach (var m in s.Model.Members)
            {
                rows.Add((result.Case, m.Id, m.Start, Math.Round(result.EndMoment(m.Id, MemberEnd.Start) / 1e3, 2)));
                rows.Add((result.Case, m.Id, m.End, Math.Round(result.EndMoment(m.Id, MemberEnd.End) / 1e3, 2)));
            }
        if (mistake is BuildingMistake.CopyingSlip or BuildingMistake.WrongClaim)
        {
            double peak = rows.Where(r => r.Case == "G").Max(r => Math.Abs(r.Moment));
            var candidates = Enumerable.Range(0, rows.Count).Where(k => rows[k].Case == "G" && Math.Abs(rows[k].Moment) > 0.3 * peak).ToList();
            int k = candidates[rnd.Next(candidates.Count)];
            var r = rows[k];
            if (mistake == BuildingMistake.CopyingSlip)
            {
                string digits = Math.Abs(r.Moment).ToString("0.00", inv);
                int p = digits.IndexOf('.', StringComparison.Ordinal) - 2; // the two digits before the point
                if (p < 0 || digits[p] == digits[p + 1]) p = digits.Length - 2; // or the two decimals
                var chars = digits.ToCharArray();
                (chars[p], chars[p + 1]) = (chars[p + 1], chars[p]);
                rows[k] = r with { Moment = Math.Sign(r.Moment) * double.Parse(new string(chars), inv) };
            }
            else
            {
                rows[k] = r with { Moment = Math.Round(r.Moment + (0.3 * peak), 2) };
            }
            planted = $"the claim for {r.Member} at {r.At} in case G written {rows[k].Moment.ToString("0.00", inv)} for {r.Moment.ToString("0.00", inv)}";
        }
        if (mistake == BuildingMistake.EveryClaimWrong)
        {
            double peak = rows.Where(r => r.Case == "G").Max(r => Math.Abs(r.Moment));
            for (int k = 0; k < rows.Count; k++)
                if (rows[k].Case == "G")
                    rows[k] = rows[k] with { Moment = Math.Round(rows[k].Moment + (peak * (0.05 + (0.25 * rnd.NextDouble())) * (rnd.Next(2) == 0 ? -1 : 1)), 2) };
            planted = "every claim of case G off by 5 to 30 % of its peak moment";
        }
        var claims = new StringBuilder("\n[end-moments]\ncase,member,at,moment [kN·m]\n");
        foreach (var r in rows) claims.Append(inv, $"{r.Case},{r.Member},{r.At},{r.Moment:0.00}\n");
        File.WriteAllText(path, model + claims);
        return planted;
    }

    private static string J(int i, int j) => string.Create(CultureInfo.InvariantCulture, $"J{i}_{j}");

    /// <summary>The next beam of the same length in the same storey (two bays along, or back).</summary>
    private static string MovedTo((string Id, int Bay, int Storey) beam, int bays)
    {
        int to = beam.Bay + 2 <= bays ? beam.Bay + 2 : beam.Bay - 2;
        if (to < 1) throw new ArgumentException("a moved load needs at least three bays");
        return string.Create(CultureInfo.InvariantCulture, $"B{to}_{beam.Storey}");
    }

    private static Submission Read(string path, string text)
    {
        File.WriteAllText(path, text);
        var limits = InputLimits.Default with { MaxMembers = 100_000, MaxJoints = 100_000, MaxRows = 1_000_000, MaxFileBytes = 1L << 30 };
        var read = SubmissionReader.Read(path, limits);
        return read.Submission ?? throw new InvalidOperationException("generated model does not read: " + string.Join("; ", read.Problems));
    }
}
