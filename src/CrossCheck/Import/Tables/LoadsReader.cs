using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The <c>loads</c> table: one load per row, grouped into load cases in the order they first appear.</summary>
internal sealed class LoadsReader : ITableReader
{
    private static readonly Dictionary<string, LoadDirection> DirWords = new(StringComparer.Ordinal)
    {
        ["down"] = LoadDirection.Down, ["up"] = LoadDirection.Up, ["left"] = LoadDirection.Left, ["right"] = LoadDirection.Right,
        ["-y"] = LoadDirection.Down, ["+y"] = LoadDirection.Up, ["-x"] = LoadDirection.Left, ["+x"] = LoadDirection.Right,
        ["gravity"] = LoadDirection.Down,
    };

    private enum Kind { Point, Udl, Linear, Moment, Force }

    private static readonly Dictionary<string, Kind> KindWords = new(StringComparer.Ordinal)
    {
        ["point"] = Kind.Point, ["concentrated"] = Kind.Point, ["conc"] = Kind.Point,
        ["udl"] = Kind.Udl, ["uniform"] = Kind.Udl, ["distributed"] = Kind.Udl,
        ["linear"] = Kind.Linear, ["trapezoidal"] = Kind.Linear, ["triangular"] = Kind.Linear, ["varying"] = Kind.Linear,
        ["moment"] = Kind.Moment, ["couple"] = Kind.Moment, ["force"] = Kind.Force,
    };

    public void Read(SubmissionDraft d)
    {
        if (d.Table("loads") is not { } t) { d.MissingTable("loads"); return; }
        var model = d.Model;
        var v = d.View(t, TableSchema.Loads);
        d.Remember(v, "P", QuantityKind.Force);
        var loads = new List<Load>();
        var order = new List<string>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? on = v.Id(row, "on");
            string kindText = v.Text(row, "kind");
            if (on is null) continue;
            if (kindText.Length == 0) { d.Error(v.CellRef(row, "kind"), Messages.MissingValue("kind", null)); continue; }
            if (!KindWords.TryGetValue(TableSchema.Normalize(kindText), out var kind))
            {
                d.Error(v.CellRef(row, "kind"), Messages.BadWord("kind", kindText, ["point", "udl", "linear", "moment", "force"]));
                continue;
            }
            bool isMember = model.TryGetMember(on, out var member);
            bool isJoint = model.TryGetJoint(on, out _);
            if ((d.GeometryIncomplete || d.RejectedMembers.Contains(on) || d.RejectedJoints.Contains(on)) && !isMember && !isJoint) { d.RejectedCases.Add(c); continue; }
            bool onMember;
            switch (kind)
            {
                case Kind.Force:
                    if (!isJoint) { d.Error(v.CellRef(row, "on"), isMember ? Messages.KindOnMember(kindText, on) : Messages.UnknownTarget(on)); continue; }
                    onMember = false;
                    break;
                case Kind.Moment:
                    if (isMember && isJoint) { d.Error(v.CellRef(row, "on"), Messages.Ambiguous(on)); continue; }
                    if (!isMember && !isJoint) { d.Error(v.CellRef(row, "on"), Messages.UnknownTarget(on)); continue; }
                    onMember = isMember;
                    break;
                case Kind.Point:
                    // A point load on a joint is a joint force.
                    if (isMember && isJoint) { d.Error(v.CellRef(row, "on"), Messages.Ambiguous(on)); continue; }
                    if (!isMember && !isJoint) { d.Error(v.CellRef(row, "on"), Messages.UnknownTarget(on)); continue; }
                    onMember = isMember;
                    if (!onMember) kind = Kind.Force;
                    break;
                default:
                    if (!isMember) { d.Error(v.CellRef(row, "on"), isJoint ? Messages.KindOnJoint(kindText, on) : Messages.UnknownTarget(on)); continue; }
                    onMember = true;
                    break;
            }
            var dir = ParseDir(d, v, row, kind);
            var where = v.RowRef(row);
            double L = onMember ? model.Length(member) : 0;
            string lu = v.Unit("a")?.Symbol ?? d.Defaults.Length?.Symbol ?? "m";
            double lf = v.Unit("a")?.ToSi ?? 1;
            Load? load = null;
            switch (kind)
            {
                case Kind.Point:
                {
                    double? p = v.Number(row, "P", required: true, requiredBecause: "a point load");
                    double? a = v.Number(row, "a", required: true, requiredBecause: "the position of a point load");
                    if (p is null || a is null || !InMember(d, v, row, "a", a.Value, L, lu, lf)) continue;
                    WarnNegative(d, v, row, "P", p.Value);
                    load = new PointLoad(c, on, p.Value, a.Value, dir, where);
                    break;
                }
                case Kind.Udl:
                case Kind.Linear:
                {
                    double? w = v.Number(row, "w", required: true, requiredBecause: "a distributed load");
                    double? w2 = kind == Kind.Linear ? v.Number(row, "w end", required: true, requiredBecause: "a linear load") : w;
                    double a = v.Number(row, "a") ?? 0;
                    double b = v.Number(row, "b") ?? L;
                    if (w is null || w2 is null) continue;
                    if (!InMember(d, v, row, "a", a, L, lu, lf) || !InMember(d, v, row, "b", b, L, lu, lf)) continue;
                    if (b < a) { d.Error(v.CellRef(row, "b"), Messages.LoadEndsReversed); continue; }
                    if (b == a) continue; // a load over no length does nothing
                    WarnNegative(d, v, row, "w", w.Value);
                    load = new DistributedLoad(c, on, w.Value, w2.Value, a, Math.Min(b, L), dir, where);
                    break;
                }
                case Kind.Moment:
                {
                    double? m = v.Number(row, "M", required: true, requiredBecause: "a moment load");
                    if (m is null) continue;
                    if (onMember)
                    {
                        double? a = v.Number(row, "a", required: true, requiredBecause: "the position of a couple on a member");
                        if (a is null || !InMember(d, v, row, "a", a.Value, L, lu, lf)) continue;
                        load = new MemberCouple(c, on, m.Value, a.Value, where);
                    }
                    else
                    {
                        load = new JointCouple(c, on, m.Value, where);
                    }
                    break;
                }
                case Kind.Force:
                {
                    double? p = v.Number(row, "P", required: true, requiredBecause: "a joint force");
                    if (p is null) continue;
                    WarnNegative(d, v, row, "P", p.Value);
                    load = new JointForce(c, on, p.Value, dir, where);
                    break;
                }
            }
            if (load is null) continue;
            loads.Add(load);
            if (!order.Contains(c)) order.Add(c);
        }
        if (!v.Rows.Any()) d.Error(new SourceRef(t.File, "loads", t.Header.Line, null, t.Header.Page), Messages.NoLoads);
        foreach (var (id, _) in d.RowsWithErrors(v, "case", "1")) d.RejectedCases.Add(id);
        d.Cases.AddRange(order.Select(id => new LoadCase(id, loads.Where(l => l.Case == id).ToList())));
    }

    private static LoadDirection ParseDir(SubmissionDraft d, TableView v, RawRow row, Kind kind)
    {
        string text = v.Text(row, "dir");
        if (text.Length == 0) return LoadDirection.Down;
        if (kind == Kind.Moment) { d.Warn(v.CellRef(row, "dir"), Messages.DirNotForKind("moment")); return LoadDirection.Down; }
        if (DirWords.TryGetValue(TableSchema.Normalize(text), out var dir)) return dir;
        d.Error(v.CellRef(row, "dir"), Messages.BadWord("dir", text, ["down", "up", "left", "right"]));
        return LoadDirection.Down;
    }

    private static bool InMember(SubmissionDraft d, TableView v, RawRow row, string column, double value, double length, string unit, double toSi)
    {
        double tol = 1e-9 * Math.Max(1, length);
        if (value >= -tol && value <= length + tol) return true;
        d.Error(v.CellRef(row, column), Messages.LoadOutside(column, value / toSi, length / toSi, unit));
        return false;
    }

    private static void WarnNegative(SubmissionDraft d, TableView v, RawRow row, string column, double value)
    {
        if (value < 0) d.Warn(v.CellRef(row, column), Messages.NegativeMagnitude(column));
    }
}
