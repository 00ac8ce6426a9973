using System.Globalization;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Import;

namespace CrossCheck.TestTools;

/// <summary>What was planted in a generated submission.</summary>
public enum Planted
{
    /// <summary>Claims are the solver's own answer, rounded to 0.001 kN·m.</summary>
    Correct,
    /// <summary>One end moment left out of the claims (one the analysis says is not zero).</summary>
    Omitted,
    /// <summary>One claim off by 30 % of the case's peak moment.</summary>
    WrongClaim,
    /// <summary>Both claims of one member with their signs reversed.</summary>
    SignFlip,
    /// <summary>A frame with a lateral load, claimed from an analysis with sway prevented.</summary>
    SwayOmitted,
    NoClaimsTable,
    TextInNumber,
    UnknownMember,
    EmptyFile,
    Mechanism,
    FolderWithoutTables,
    UnknownUnit,
}

/// <summary>The verdict a generated submission must get (or an input error).</summary>
public enum Expected
{
    Concur,
    Comments,
    Revise,
    InputError,
}

/// <summary>One generated submission: where it was written, what was planted and what a review must say.</summary>
public sealed record Generated(string Name, string Path, Planted Planted, Expected Expected, string Scenario, string? Reference);

/// <summary>How many of each kind a batch holds.</summary>
public sealed record BatchPlan(int Correct, int Omitted, int WrongClaim, int SignFlip, int SwayOmitted, int Broken)
{
    public int Total => Correct + Omitted + WrongClaim + SignFlip + SwayOmitted + Broken;

    /// <summary>A mix for <paramref name="n"/> submissions: 40 % correct, 10 % with an end left out, 30 % wrong in three ways, 20 % broken.</summary>
    public static BatchPlan For(int n)
    {
        int broken = n / 5, omitted = n / 10, wrong = n / 10, flip = n / 10, sway = n / 10;
        return new BatchPlan(n - broken - omitted - wrong - flip - sway, omitted, wrong, flip, sway, broken);
    }
}

/// <summary>
/// Writes invented submissions (continuous beams and portal frames of fictional buildings) in the CSV format, with
/// claims taken from CrossCheck's own solver and then deliberately altered, or with deliberate input errors. For
/// tests of the batch mechanics and for timing, not for checking the solver.
/// </summary>
public static class SubmissionFactory
{
    private static readonly string[] BeamScenarios =
    [
        "Elm Lane footbridge deck girder", "Oakfield school hall roof beam", "Riverside car park ramp beam", "Northgate warehouse mezzanine beam",
        "Lindenfield library floor beam", "Harbour walk boardwalk stringer", "Quarry Road depot crane rail", "Willow Court balcony edge beam",
    ];

    private static readonly string[] FrameScenarios =
    [
        "Harbourside depot portal", "Millbrook workshop frame", "Greenway bus canopy frame", "Station yard storage shed frame",
        "Fenwick sports hall gable frame", "Copper Street garage frame",
    ];

    private static readonly Planted[] BrokenKinds =
    [
        Planted.NoClaimsTable, Planted.TextInNumber, Planted.UnknownMember, Planted.EmptyFile, Planted.Mechanism, Planted.FolderWithoutTables, Planted.UnknownUnit,
    ];

    public static Expected ExpectedFor(Planted p) => p switch
    {
        Planted.Correct => Expected.Concur,
        Planted.Omitted => Expected.Comments,
        Planted.WrongClaim or Planted.SignFlip or Planted.SwayOmitted => Expected.Revise,
        _ => Expected.InputError,
    };

    /// <summary>Writes a batch into <paramref name="folder"/> (created if needed), names <c>sub-001</c>, <c>sub-002</c>, ... in shuffled order of kinds.</summary>
    public static IReadOnlyList<Generated> WriteBatch(string folder, BatchPlan plan, int variant)
    {
        ArgumentNullException.ThrowIfNull(plan);
        Directory.CreateDirectory(folder);
        var kinds = new List<Planted>();
        kinds.AddRange(Enumerable.Repeat(Planted.Correct, plan.Correct));
        kinds.AddRange(Enumerable.Repeat(Planted.Omitted, plan.Omitted));
        kinds.AddRange(Enumerable.Repeat(Planted.WrongClaim, plan.WrongClaim));
        kinds.AddRange(Enumerable.Repeat(Planted.SignFlip, plan.SignFlip));
        kinds.AddRange(Enumerable.Repeat(Planted.SwayOmitted, plan.SwayOmitted));
        for (int i = 0; i < plan.Broken; i++) kinds.Add(BrokenKinds[i % BrokenKinds.Length]);
        var rnd = new Random(variant);
        var order = kinds.OrderBy(_ => rnd.Next()).ToList();
        var list = new List<Generated>();
        for (int i = 0; i < order.Count; i++)
            list.Add(Write(folder, string.Create(CultureInfo.InvariantCulture, $"sub-{i + 1:000}"), order[i], variant * 7919 + i, asFolder: i % 3 == 2));
        return list;
    }

    /// <summary>Writes one submission named <paramref name="name"/> into <paramref name="folder"/>.</summary>
    /// <param name="asFolder">A folder of one CSV file per table instead of one sectioned CSV file.</param>
    public static Generated Write(string folder, string name, Planted planted, int variant, bool asFolder = false, string? reference = null)
    {
        var rnd = new Random(variant);
        bool frame = planted == Planted.SwayOmitted || rnd.Next(3) == 0;
        reference ??= rnd.Next(4) == 0 ? null : string.Create(CultureInfo.InvariantCulture, $"GEN-{variant:X6}");
        var scenario = frame ? FrameScenarios[rnd.Next(FrameScenarios.Length)] : BeamScenarios[rnd.Next(BeamScenarios.Length)];
        bool sagging = rnd.Next(5) == 0;
        var doc = frame ? Frame(rnd) : Beam(rnd);
        doc.Info(scenario + " (generated)", reference, sagging);
        var expected = ExpectedFor(planted);

        if (planted == Planted.EmptyFile)
        {
            string path = System.IO.Path.Combine(folder, name + ".csv");
            File.WriteAllBytes(path, []);
            return new Generated(name, path, planted, expected, scenario, reference);
        }
        if (planted == Planted.FolderWithoutTables)
        {
            string dir = System.IO.Path.Combine(folder, name);
            Directory.CreateDirectory(dir);
            File.WriteAllText(System.IO.Path.Combine(dir, "notes.txt"), "Tables to follow.\n");
            return new Generated(name, dir, planted, expected, scenario, reference);
        }
        if (planted == Planted.Mechanism) doc.MakeMechanism();

        // Claims from solving the model as written (or its braced variant), then the planted alteration.
        var solveDoc = planted == Planted.SwayOmitted ? doc.Braced() : doc;
        var claims = planted == Planted.Mechanism ? doc.ZeroClaims() : Solve(solveDoc);
        switch (planted)
        {
            case Planted.Omitted: claims.Omit(rnd); break;
            case Planted.WrongClaim: claims.Alter(rnd, 0.30); break;
            case Planted.SignFlip: claims.FlipMember(rnd); break;
        }
        if (planted != Planted.NoClaimsTable) doc.Add("end-moments", claims.Lines(sagging));
        if (planted == Planted.TextInNumber) doc.SpoilNumber();
        if (planted == Planted.UnknownMember) doc.Add("loads", null, "1,Z9,udl,10,,");
        if (planted == Planted.UnknownUnit) doc.SpoilUnit();

        string target = asFolder ? doc.WriteFolder(System.IO.Path.Combine(folder, name)) : doc.WriteFile(System.IO.Path.Combine(folder, name + ".csv"));
        return new Generated(name, target, planted, expected, scenario, reference);
    }

    /// <summary>A continuous beam of 2–4 spans; case 1 a UDL on every span, case 2 point loads on some spans.</summary>
    private static Doc Beam(Random rnd)
    {
        var d = new Doc { IsBeam = true };
        int spans = 2 + rnd.Next(3);
        var supports = new List<string> { "support,restraint" };
        var spanRows = new List<string> { "span,length [m],E [GPa],I [mm^4]" };
        for (int i = 0; i <= spans; i++)
        {
            string restraint = i == 0 ? (rnd.Next(3) == 0 ? "fixed" : "pinned") : i == spans && rnd.Next(3) == 0 ? "fixed" : "roller";
            supports.Add($"{(char)('A' + i)},{restraint}");
        }
        double[] sections = [180e6, 250e6, 320e6, 410e6];
        var lengths = new double[spans];
        for (int i = 0; i < spans; i++)
        {
            lengths[i] = 4 + (0.5 * rnd.Next(13));
            string id = $"{(char)('A' + i)}{(char)('A' + i + 1)}";
            d.Members.Add(id);
            d.Lengths[id] = lengths[i];
            spanRows.Add(Inv($"{id},{lengths[i]:0.0},200,{sections[rnd.Next(sections.Length)]:0}"));
        }
        var loads = new List<string> { "case,on,kind,w [kN/m],P [kN],a [m]" };
        double w = 8 + rnd.Next(13);
        foreach (var m in d.Members) loads.Add(Inv($"1,{m},udl,{w:0},,"));
        foreach (var m in d.Members.Where(_ => rnd.Next(2) == 0).DefaultIfEmpty(d.Members[0]))
            loads.Add(Inv($"2,{m},point,,{20 + rnd.Next(41)},{Math.Round(d.Lengths[m] * (0.2 + (0.6 * rnd.NextDouble())), 1):0.0}"));
        d.Add("supports", supports);
        d.Add("spans", spanRows);
        d.Add("loads", loads);
        return d;
    }

    /// <summary>A portal frame of 1–2 bays and 1–2 storeys; case G a UDL on every beam, case G+W the same with wind from the left.</summary>
    private static Doc Frame(Random rnd)
    {
        var d = new Doc { IsBeam = false };
        int bays = 1 + rnd.Next(2), storeys = 1 + rnd.Next(2);
        string bases = rnd.Next(2) == 0 ? "fixed" : "pinned";
        var xs = new double[bays + 1];
        for (int i = 1; i <= bays; i++) xs[i] = xs[i - 1] + 6 + rnd.Next(5);
        var ys = new double[storeys + 1];
        for (int j = 1; j <= storeys; j++) ys[j] = ys[j - 1] + 3.5 + (0.5 * rnd.Next(4));
        var joints = new List<string> { "joint,x [m],y [m],restraint" };
        for (int j = 0; j <= storeys; j++)
            for (int i = 0; i <= bays; i++)
                joints.Add(Inv($"{J(i, j)},{xs[i]:0.0},{ys[j]:0.0},{(j == 0 ? bases : "free")}"));
        var members = new List<string> { "member,start,end,E [GPa],I [mm^4]" };
        for (int j = 1; j <= storeys; j++)
            for (int i = 0; i <= bays; i++)
            {
                string id = $"C{i + 1}{j}";
                d.Members.Add(id);
                d.Lengths[id] = ys[j] - ys[j - 1];
                members.Add(Inv($"{id},{J(i, j - 1)},{J(i, j)},200,{(150 + (10 * rnd.Next(10))) * 1e6:0}"));
            }
        for (int j = 1; j <= storeys; j++)
            for (int i = 1; i <= bays; i++)
            {
                string id = $"B{i}{j}";
                d.Members.Add(id);
                d.Lengths[id] = xs[i] - xs[i - 1];
                d.Beams.Add(id);
                members.Add(Inv($"{id},{J(i - 1, j)},{J(i, j)},200,{(300 + (20 * rnd.Next(10))) * 1e6:0}"));
            }
        var loads = new List<string> { "case,on,kind,w [kN/m],P [kN],dir" };
        double w = 10 + rnd.Next(15);
        foreach (var b in d.Beams) loads.Add(Inv($"G,{b},udl,{w:0},,down"));
        foreach (var b in d.Beams) loads.Add(Inv($"G+W,{b},udl,{w:0},,down"));
        // Wind large enough that ignoring sway matters: a quarter to a half of the gravity load on a floor.
        for (int j = 1; j <= storeys; j++) loads.Add(Inv($"G+W,{J(0, j)},force,,{Math.Round(w * xs[bays] * (0.25 + (0.25 * rnd.NextDouble()))):0},right"));
        d.TopLeftJoints.AddRange(Enumerable.Range(1, storeys).Select(j => J(0, j)));
        d.Add("joints", joints);
        d.Add("members", members);
        d.Add("loads", loads);
        return d;
    }

    private static string J(int i, int j) => $"{(char)('A' + i)}{j}";

    private static Claims Solve(Doc doc)
    {
        string temp = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"crosscheck-gen-{Environment.ProcessId}-{Guid.NewGuid():N}.csv");
        try
        {
            // The reader wants claims; any will do for solving.
            doc.WithClaims(doc.ZeroClaims().Lines(sagging: false)).WriteFile(temp);
            var read = SubmissionReader.Read(temp);
            if (!read.Succeeded) throw new InvalidOperationException("generated model does not read: " + string.Join("; ", read.Problems));
            var s = read.Submission!;
            var result = new FrameSolver().Solve(s.Model, s.Cases);
            var claims = new Claims();
            foreach (var c in result.Cases)
            {
                claims.Peaks[c.Case] = c.PeakMoment / 1e3;
                foreach (var m in s.Model.Members)
                {
                    var r = c.Members[m.Id];
                    claims.Rows.Add(new ClaimRow(c.Case, m.Id, m.Start, r.StartMoment / 1e3, true));
                    claims.Rows.Add(new ClaimRow(c.Case, m.Id, m.End, r.EndMoment / 1e3, false));
                }
            }
            return claims;
        }
        finally
        {
            File.Delete(temp);
        }
    }

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    private sealed class ClaimRow(string @case, string member, string at, double clockwise, bool isStart)
    {
        public string Case { get; } = @case;
        public string Member { get; } = member;
        public string At { get; } = at;
        public bool IsStart { get; } = isStart;

        /// <summary>kN·m, clockwise on the member end.</summary>
        public double Clockwise { get; set; } = clockwise;
    }

    private sealed class Claims
    {
        public List<ClaimRow> Rows { get; } = [];
        public Dictionary<string, double> Peaks { get; } = [];

        /// <summary>Alters one claim by <paramref name="fraction"/> of its case's peak moment.</summary>
        public void Alter(Random rnd, double fraction)
        {
            var candidates = Rows.Where(r => Math.Abs(r.Clockwise) > 1e-6).ToList();
            var pick = candidates[rnd.Next(candidates.Count)];
            pick.Clockwise += fraction * Peaks[pick.Case];
        }

        /// <summary>Leaves out one claim whose moment is at least a tenth of its case's peak.</summary>
        public void Omit(Random rnd)
        {
            var candidates = Rows.Where(r => Math.Abs(r.Clockwise) >= 0.1 * Peaks[r.Case]).ToList();
            Rows.Remove(candidates[rnd.Next(candidates.Count)]);
        }

        /// <summary>Reverses both claims of one member in one case (a member whose moments are not both negligible).</summary>
        public void FlipMember(Random rnd)
        {
            var members = Rows.GroupBy(r => (r.Case, r.Member)).Where(g => g.Max(r => Math.Abs(r.Clockwise)) > 0.2 * Peaks[g.Key.Case]).ToList();
            foreach (var r in members[rnd.Next(members.Count)]) r.Clockwise = -r.Clockwise;
        }

        public List<string> Lines(bool sagging)
        {
            var lines = new List<string> { "case,member,at,moment [kN·m]" };
            foreach (var r in Rows)
            {
                double v = sagging && !r.IsStart ? -r.Clockwise : r.Clockwise;
                lines.Add(Inv($"{r.Case},{r.Member},{r.At},{Math.Round(v, 3):0.###}"));
            }
            return lines;
        }
    }

    /// <summary>A submission as ordered sections of CSV lines.</summary>
    private sealed class Doc
    {
        private readonly List<(string Table, List<string> Lines)> _sections = [];

        public bool IsBeam { get; init; }
        public List<string> Members { get; } = [];
        public List<string> Beams { get; } = [];
        public Dictionary<string, double> Lengths { get; } = [];
        public List<string> TopLeftJoints { get; } = [];

        public void Add(string table, List<string>? lines, string? extra = null)
        {
            var existing = _sections.FirstOrDefault(s => s.Table == table);
            if (existing.Lines is null)
            {
                _sections.Add((table, lines ?? []));
                existing = _sections[^1];
            }
            if (extra is not null) existing.Lines.Add(extra);
        }

        public void Info(string title, string? reference, bool sagging)
        {
            var lines = new List<string> { "key,value", $"title,{title}", "force unit,kN", "length unit,m", "prepared by,Generated (test data)" };
            if (reference is not null) lines.Add($"reference,{reference}");
            if (sagging) lines.Add("sign convention,sagging");
            _sections.Insert(0, ("info", lines));
        }

        public Doc WithClaims(List<string> lines)
        {
            var copy = Clone();
            copy.Add("end-moments", lines);
            return copy;
        }

        private Doc Clone(Func<string, List<string>, List<string>>? edit = null)
        {
            var copy = new Doc { IsBeam = IsBeam };
            foreach (var (table, l) in _sections) copy._sections.Add((table, edit is null ? [.. l] : edit(table, l)));
            copy.Members.AddRange(Members);
            copy.Beams.AddRange(Beams);
            foreach (var kv in Lengths) copy.Lengths[kv.Key] = kv.Value;
            copy.TopLeftJoints.AddRange(TopLeftJoints);
            return copy;
        }

        /// <summary>The same model with sway prevented: the left joint of every floor held horizontally.</summary>
        public Doc Braced() => Clone((table, lines) => table == "joints"
            ? lines.Select(l => TopLeftJoints.Any(j => l.StartsWith(j + ",", StringComparison.Ordinal)) ? l[..l.LastIndexOf(',')] + ",pinned" : l).ToList()
            : [.. lines]);

        /// <summary>A mechanism the load drives: the beam's first support becomes a pin and every other support is removed.</summary>
        public void MakeMechanism()
        {
            string table = IsBeam ? "supports" : "joints";
            var lines = _sections.First(s => s.Table == table).Lines;
            for (int i = 1; i < lines.Count; i++)
            {
                int comma = lines[i].LastIndexOf(',');
                bool first = i == 1;
                if (IsBeam) lines[i] = lines[i][..comma] + (first ? ",pinned" : ",free");
                else if (!lines[i].EndsWith(",free", StringComparison.Ordinal)) lines[i] = lines[i][..comma] + (first ? ",pinned" : ",free");
            }
        }

        public Claims ZeroClaims()
        {
            var c = new Claims();
            foreach (var m in Members) { c.Rows.Add(new ClaimRow(IsBeam ? "1" : "G", m, "start", 0, true)); c.Rows.Add(new ClaimRow(IsBeam ? "1" : "G", m, "end", 0, false)); }
            return c;
        }

        public void SpoilNumber()
        {
            var lines = _sections.First(s => s.Table == (IsBeam ? "spans" : "members")).Lines;
            int comma = lines[1].LastIndexOf(',');
            lines[1] = lines[1][..comma] + ",2.5e8x";
        }

        public void SpoilUnit()
        {
            var lines = _sections.First(s => s.Table == (IsBeam ? "spans" : "members")).Lines;
            lines[0] = lines[0].Replace("I [mm^4]", "I [furlong^4]", StringComparison.Ordinal);
        }

        public string WriteFile(string path)
        {
            var sb = new StringBuilder();
            foreach (var (table, lines) in _sections)
            {
                sb.Append('[').Append(table).Append("]\n");
                foreach (var l in lines) sb.Append(l).Append('\n');
                sb.Append('\n');
            }
            File.WriteAllText(path, sb.ToString());
            return path;
        }

        public string WriteFolder(string dir)
        {
            Directory.CreateDirectory(dir);
            foreach (var (table, lines) in _sections) File.WriteAllText(System.IO.Path.Combine(dir, table + ".csv"), string.Join("\n", lines) + "\n");
            return dir;
        }
    }
}
