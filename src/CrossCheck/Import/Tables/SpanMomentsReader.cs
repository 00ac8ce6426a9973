using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The optional <c>span-moments</c> table: the largest internal moment of a member, sagging positive whatever the
/// end-moment convention, with where the author puts it. A member with a free end has no span moment between supports:
/// such a claim is left out with a warning.
/// </summary>
internal sealed class SpanMomentsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Table("span-moments") is not { } t) return;
        var model = d.Model;
        var v = d.View(t, TableSchema.SpanMoments);
        d.Remember(v, "moment", QuantityKind.Moment);
        var claims = new List<ClaimedSpanMoment>();
        var seen = new Dictionary<(string, string), SourceRef>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? member = v.Id(row, "member");
            double? moment = v.Number(row, "moment", required: true);
            double? x = v.Length(row, "x");
            if (member is null || moment is null || !d.ClaimCase(v, row, c)) continue;
            if (model.TryGetMember(member, out var m) && HasFreeEnd(model, m))
            {
                d.Warn(v.CellRef(row, "member"), Messages.SpanMomentFreeEnd(member));
                continue;
            }
            if (!seen.TryAdd((c, member), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), Messages.SpanMomentTwice(member, c, seen[(c, member)].Compact));
                continue;
            }
            claims.Add(new ClaimedSpanMoment(c, member, moment.Value, moment.Value / (v.Unit("moment")?.ToSi ?? 1), x, v.CellRef(row, "moment")));
        }
        d.Claims = d.Claims with { SpanMoments = claims };
    }

    /// <summary>A member end at an unsupported joint no other member reaches: the member is a cantilever.</summary>
    private static bool HasFreeEnd(StructureModel model, Member m) =>
        new[] { m.Start, m.End }.Any(j => model.TryGetJoint(j, out var joint) && !joint.IsSupport && model.MembersAt(j).Count() == 1);
}
