using CrossCheck.Import.Loads;
using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The <c>loads</c> table: one load per row, grouped into load cases in the order they first appear. This reader
/// reads what every row has (case, target, kind, direction); the row's own columns are read by its
/// <see cref="LoadKind"/>.
/// </summary>
internal sealed class LoadsReader : ITableReader
{
    private static readonly Dictionary<string, LoadDirection> DirWords = new(StringComparer.Ordinal)
    {
        ["down"] = LoadDirection.Down, ["up"] = LoadDirection.Up, ["left"] = LoadDirection.Left, ["right"] = LoadDirection.Right,
        ["-y"] = LoadDirection.Down, ["+y"] = LoadDirection.Up, ["-x"] = LoadDirection.Left, ["+x"] = LoadDirection.Right,
        ["gravity"] = LoadDirection.Down,
    };

    /// <summary>True for a word of the direction vocabulary (<c>down</c>, <c>up</c>, <c>-y</c>, <c>gravity</c>, ...).</summary>
    public static bool IsDirection(string text) => DirWords.ContainsKey(TableSchema.Normalize(text));

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
            if (LoadKinds.Find(kindText) is not { } kind)
            {
                d.Error(v.CellRef(row, "kind"), Messages.BadWord("kind", kindText, LoadKinds.Names));
                continue;
            }
            bool isMember = model.TryGetMember(on, out var member);
            bool isJoint = model.TryGetJoint(on, out _);
            // A load on a member or joint left out for an error of its own is not reported again; its case is incomplete.
            if ((d.GeometryIncomplete || d.RejectedMembers.Contains(on) || d.RejectedJoints.Contains(on)) && !isMember && !isJoint) { d.RejectedCases.Add(c); continue; }
            if (TargetProblem(kind.Target, isMember, isJoint, kindText, on) is { } problem) { d.Error(v.CellRef(row, "on"), problem); continue; }
            bool onMember = kind.Target == LoadTarget.Member || (kind.Target == LoadTarget.MemberOrJoint && isMember);
            WarnForeignValues(d, v, row, kind, kindText);
            var dir = ParseDir(d, v, row, kind);
            double length = onMember ? model.Length(member) : 0;
            var load = kind.Read(new LoadRow(v, row, d.Problems, d.Defaults.Length, c, on, onMember, length, dir));
            if (load is null) continue;
            loads.Add(load);
            if (!order.Contains(c)) order.Add(c);
        }
        if (!v.Rows.Any()) d.Error(t.HeaderAt("loads"), Messages.NoLoads);
        foreach (var (id, _) in d.RowsWithErrors(v, "case", "1")) d.RejectedCases.Add(id);
        d.Cases.AddRange(order.Select(id => new LoadCase(id, loads.Where(l => l.Case == id).ToList())));
    }

    private static readonly string[] ValueColumns = ["P", "w", "w end", "M", "a", "b"];

    /// <summary>
    /// A value the row's kind does not read (a <c>P</c> on a UDL row, a <c>w</c> on a point load) is not used, and is
    /// often the sign of a cell read or typed into the wrong column: the reviewer is told, with the cell.
    /// </summary>
    private static void WarnForeignValues(SubmissionDraft d, TableView v, RawRow row, LoadKind kind, string kindText)
    {
        foreach (var column in ValueColumns)
        {
            if (kind.Uses.Contains(column) || !v.Has(column)) continue;
            string text = v.Text(row, column);
            if (text.Length == 0 || text is "-" or "–" or "—" or "0") continue;
            d.Warn(v.CellRef(row, column), Messages.ValueNotForKind(column, text, kindText, kind.Uses));
        }
    }

    /// <summary>What is wrong with the id a load acts on, for a kind that acts on <paramref name="target"/>; null when nothing.</summary>
    private static string? TargetProblem(LoadTarget target, bool isMember, bool isJoint, string kindText, string on) => target switch
    {
        LoadTarget.Member when !isMember => isJoint ? Messages.KindOnJoint(kindText, on) : Messages.UnknownTarget(on),
        LoadTarget.Joint when !isJoint => isMember ? Messages.KindOnMember(kindText, on) : Messages.UnknownTarget(on),
        LoadTarget.MemberOrJoint when isMember && isJoint => Messages.Ambiguous(on),
        LoadTarget.MemberOrJoint when !isMember && !isJoint => Messages.UnknownTarget(on),
        _ => null,
    };

    private static LoadDirection ParseDir(SubmissionDraft d, TableView v, RawRow row, LoadKind kind)
    {
        string text = v.Text(row, "dir");
        if (text.Length == 0) return LoadDirection.Down;
        if (!kind.HasDirection) { d.Warn(v.CellRef(row, "dir"), Messages.DirNotForKind(kind.Words[0])); return LoadDirection.Down; }
        if (DirWords.TryGetValue(TableSchema.Normalize(text), out var dir)) return dir;
        d.Error(v.CellRef(row, "dir"), Messages.BadWord("dir", text, ["down", "up", "left", "right"]));
        return LoadDirection.Down;
    }
}
