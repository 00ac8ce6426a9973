using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The <c>members</c> table of a frame: id, end joints, section and hinges; each member checked against the joints.</summary>
internal sealed class MembersReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Layout != GeometryLayout.Frame || d.Table("members") is not { } table) return;
        var mv = d.View(table, TableSchema.Members, relativeStiffness: !d.HasE);
        d.WarnEIgnored(mv);
        var joints = d.Joints;
        var memberSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        var jointIds = joints.Select(j => j.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var row in mv.Rows)
        {
            string? id = mv.Id(row, "member");
            string? s = mv.Id(row, "start");
            string? e = mv.Id(row, "end");
            var (E, I, A) = GeometryCells.Section(d, mv, row);
            var hinge = GeometryCells.ReadHinge(d, mv, row);
            if (id is null || s is null || e is null) continue;
            if (!memberSeen.TryAdd(id, mv.RowRef(row))) { d.Error(mv.CellRef(row, "member"), Messages.DuplicateId("member", id, memberSeen[id].Compact)); continue; }
            // Without a joints table there is nothing to check the joint ids against (already reported).
            bool ok = !d.GeometryIncomplete;
            if (ok && !jointIds.Contains(s)) { if (!d.RejectedJoints.Contains(s)) d.Error(mv.CellRef(row, "start"), Messages.UnknownJoint(s)); ok = false; }
            if (!d.GeometryIncomplete && !jointIds.Contains(e)) { if (!d.RejectedJoints.Contains(e)) d.Error(mv.CellRef(row, "end"), Messages.UnknownJoint(e)); ok = false; }
            if (!ok) { d.RejectedMembers.Add(id); d.JointsOfRejectedMembers.Add(s); d.JointsOfRejectedMembers.Add(e); }
            if (s == e) { d.Error(mv.CellRef(row, "end"), Messages.SameJoint(id)); ok = false; }
            else if (ok)
            {
                var a = joints.First(j => j.Id == s);
                var b = joints.First(j => j.Id == e);
                double len = Math.Sqrt(((b.X - a.X) * (b.X - a.X)) + ((b.Y - a.Y) * (b.Y - a.Y)));
                double scale = Math.Max(1, Math.Max(Math.Abs(a.X) + Math.Abs(a.Y), Math.Abs(b.X) + Math.Abs(b.Y)));
                if (!(len > 1e-9 * scale)) { d.Error(mv.RowRef(row), Messages.ZeroLength(id)); ok = false; }
                else if (len > d.Limits.MaxLength) { d.Error(mv.RowRef(row), Messages.MemberTooLong(id, len, d.Limits.MaxLength)); ok = false; }
                else if (!LengthAgrees(d, mv, row, id, len)) ok = false;
            }
            if (!ok || E is null || I is null) continue;
            d.Members.Add(new Member(id, s, e, E.Value, I.Value, A, hinge, mv.RowRef(row)));
        }
        ReportRejected(d, mv);
    }

    /// <summary>
    /// A printed member length must agree with the joint coordinates: to half a unit in the last printed digit, or
    /// 0.2 % (a rounded length such as 5.83 for √34 passes). A length that disagrees is an error: one of them was
    /// written or read wrong, and the model cannot say which.
    /// </summary>
    private static bool LengthAgrees(SubmissionDraft d, TableView mv, RawRow row, string id, double len)
    {
        if (!mv.Has("length") || mv.Number(row, "length") is not double given) return true;
        string text = mv.Text(row, "length");
        double toSi = mv.Unit("length")?.ToSi ?? 1;
        int dot = text.IndexOfAny(['.', ',']);
        int decimals = dot < 0 || text.Contains('e', StringComparison.OrdinalIgnoreCase) ? 0 : text.Length - dot - 1;
        double half = 0.5 * Math.Pow(10, -decimals) * toSi;
        if (Math.Abs(given - len) <= Math.Max(half, 0.002 * len) + (1e-9 * len)) return true;
        d.Error(mv.CellRef(row, "length"), Messages.LengthDisagrees(id, text, len / toSi, mv.Unit("length")?.Symbol ?? "m"));
        return false;
    }

    private static void ReportRejected(SubmissionDraft d, TableView mv)
    {
        foreach (var (id, row) in d.RowsWithErrors(mv, "member"))
        {
            d.RejectedMembers.Add(id);
            d.JointsOfRejectedMembers.Add(mv.Text(row, "start"));
            d.JointsOfRejectedMembers.Add(mv.Text(row, "end"));
        }
    }
}
