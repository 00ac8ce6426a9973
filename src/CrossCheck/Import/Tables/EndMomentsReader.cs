using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The <c>end-moments</c> table: the claims under review, each matched to a member end and turned into the clockwise
/// member-end convention when the submission gives sagging moments.
/// </summary>
internal sealed class EndMomentsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Table("end-moments") is not { } t)
        {
            // A package that states only span moments, shears or envelopes has claims to check all the same.
            if (d.Limits.ClaimsRequired && !d.Has("span-moments") && !d.Has("shears") && !d.Has("envelopes"))
                d.MissingTable("end-moments", "it holds the moments under review");
            return;
        }
        var model = d.Model;
        var v = d.View(t, TableSchema.EndMoments);
        d.Remember(v, "moment", QuantityKind.Moment);
        var moments = new List<ClaimedEndMoment>();
        var seen = new Dictionary<(string, string, MemberEnd), SourceRef>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? memberId = v.Id(row, "member");
            string? at = v.Id(row, "at");
            double? value = v.Number(row, "moment", required: true);
            if (memberId is null || at is null || value is null) continue;
            // A case whose loads were all left out for errors of their own is not reported again.
            if (!d.ClaimCase(v, row, c)) continue;
            MemberEnd? end = MemberEndCell.Resolve(model, memberId, at);
            double cw = value.Value;
            if (d.Info.SignConvention == SignConvention.Sagging && end == MemberEnd.End) cw = -cw;
            double asWritten = value.Value / (v.Unit("moment")?.ToSi ?? 1);
            if (end is MemberEnd e && !seen.TryAdd((c, memberId, e), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), Messages.DuplicateClaim(memberId, at, c, seen[(c, memberId, e)].Compact));
                continue;
            }
            moments.Add(new ClaimedEndMoment(c, memberId, at, end, cw, asWritten, v.CellRef(row, "moment")));
        }
        if (moments.Count == 0 && !v.Rows.Any()) d.Error(t.HeaderAt("end-moments"), Messages.NoClaims);
        d.Claims = new Claims(moments, [], []);
    }
}
