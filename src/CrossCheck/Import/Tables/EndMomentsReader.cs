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
        var v = d.View(t, TableSchema.EndMoments);
        d.Remember(v, "moment", QuantityKind.Moment);
        bool sagging = d.Info.SignConvention == SignConvention.Sagging;
        var moments = EndClaimRows.Read(d, v, "moment", Messages.DuplicateClaim)
            .Select(r => new ClaimedEndMoment(r.Case, r.Member, r.At, r.End, sagging && r.End == MemberEnd.End ? -r.Value : r.Value, r.AsWritten, r.Source))
            .ToList();
        if (moments.Count == 0 && !v.Rows.Any()) d.Error(t.HeaderAt("end-moments"), Messages.NoClaims);
        d.Claims = new Claims(moments, [], []);
    }
}
