using CrossCheck.Common;

namespace CrossCheck.Register;

/// <summary>
/// <c>crosscheck register copy FROM TO</c>: every review and finding of one register into another that is empty, ids,
/// rounds, dates and hashes unchanged, in one transaction on the target (a copy stopped half-way leaves it empty). The
/// source is read in one snapshot, so screens may go on writing to it meanwhile; what they add later is not copied.
/// </summary>
internal static class RegisterCopy
{
    private const string Columns =
        "id, reference, round, round_review, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version, abs_tolerance, " +
        "rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant, ends_missing, " +
        "ends_unmatched, major_flags, minor_flags, top_cause, finding_count";

    /// <summary>Copies, and returns how many reviews and findings went across.</summary>
    /// <exception cref="RegisterException">The target is the source, or holds reviews already; or either database fails.</exception>
    public static (int Reviews, int Findings) Copy(ReviewRegister from, ReviewRegister to)
    {
        if (from.Location.Kind == to.Location.Kind && string.Equals(from.Path, to.Path, StringComparison.Ordinal))
            throw new RegisterException($"cannot copy register {from.Path} onto itself.");
        return from.Read(src => to.Write(dst =>
        {
            long existing = dst.Long("SELECT count(*) FROM reviews");
            if (existing > 0)
                throw new RegisterException($"register {to.Path} already holds {Words.Count((int)existing, "review")}; copy into a new or empty register.");
            int reviews = 0, findings = 0;
            string names = string.Join(", ", Columns.Split(", ").Select(c => "@" + c));
            using (var insert = dst.Command($"INSERT INTO reviews ({Columns}) VALUES ({names})"))
            {
                var p = Columns.Split(", ").Select(c => RegisterTx.Add(insert, "@" + c, null)).ToArray();
                foreach (var stored in RegisterQueries.Reviews(src, "ORDER BY id"))
                {
                    var x = stored.Row;
                    object?[] values = [x.Id, x.Reference, x.Round, stored.RoundReview, x.Revision, x.Title, x.Submission, x.Source, x.ReviewDate,
                        x.RecordedAt, x.Reviewer, x.ToolVersion, x.AbsoluteTolerance, x.RelativeTolerance, x.MinorRelativeTolerance, x.MomentUnit,
                        x.InputHash, x.Verdict, x.EndsAgree, x.EndsMinor, x.EndsDiscrepant, x.EndsMissing, x.EndsUnmatched, x.MajorFlags, x.MinorFlags,
                        x.TopCause, x.FindingCount];
                    for (int i = 0; i < p.Length; i++) RegisterTx.Set(p[i], values[i]);
                    insert.ExecuteNonQuery();
                    reviews++;
                }
            }
            const string findingColumns = "review_id, seq, comment_id, kind, severity, load_case, place, message, source";
            using (var insert = dst.Command($"INSERT INTO findings ({findingColumns}) VALUES ({string.Join(", ", findingColumns.Split(", ").Select(c => "@" + c))})"))
            using (var read = src.Command($"SELECT {findingColumns} FROM findings ORDER BY review_id, seq"))
            using (var r = read.ExecuteReader())
            {
                var p = findingColumns.Split(", ").Select(c => RegisterTx.Add(insert, "@" + c, null)).ToArray();
                while (r.Read())
                {
                    p[0].Value = RegisterTx.Int64(r, 0);
                    p[1].Value = RegisterTx.Int(r, 1);
                    for (int i = 2; i < p.Length; i++) RegisterTx.Set(p[i], r.GetString(i));
                    insert.ExecuteNonQuery();
                    findings++;
                }
            }
            to.Backend.AfterCopy(dst);
            return (reviews, findings);
        }, retry: false));
    }
}
