using CrossCheck.Common;

namespace CrossCheck.Register;

/// <summary>
/// <c>crosscheck register export</c>: the register as CSV, one row per review or one per finding, in id order (text
/// from submissions defused for spreadsheets by <see cref="CsvOut"/>). The same register gives the same bytes in
/// either database.
/// </summary>
internal static class RegisterExport
{
    public static string Reviews(RegisterTx tx)
    {
        using var csv = new CsvOut();
        csv.Header("id", "reference", "round", "revision", "title", "submission", "source", "review_date", "recorded_at", "reviewer",
            "tool_version", "abs_tolerance", "rel_tolerance", "minor_tolerance", "moment_unit", "input_hash", "verdict", "ends_agree", "ends_minor",
            "ends_discrepant", "ends_missing", "ends_unmatched", "major_flags", "minor_flags", "top_cause", "findings");
        foreach (var r in RegisterQueries.Reviews(tx, "ORDER BY id").Select(x => x.Row))
            csv.Number(r.Id).Text(r.Reference).Number(r.Round).Text(r.Revision).Text(r.Title).Text(r.Submission).Text(r.Source).Text(r.ReviewDate)
                .Text(r.RecordedAt).Text(r.Reviewer).Text(r.ToolVersion).Number(r.AbsoluteTolerance).Number(r.RelativeTolerance)
                .Number(r.MinorRelativeTolerance).Text(r.MomentUnit).Text(r.InputHash).Text(r.Verdict).Number(r.EndsAgree).Number(r.EndsMinor)
                .Number(r.EndsDiscrepant).Number(r.EndsMissing).Number(r.EndsUnmatched).Number(r.MajorFlags).Number(r.MinorFlags).Text(r.TopCause)
                .Number(r.FindingCount).End();
        return csv.ToString();
    }

    public static string Findings(RegisterTx tx)
    {
        using var csv = new CsvOut();
        csv.Header("review_id", "reference", "round", "review_date", "comment_id", "kind", "severity", "case", "where", "comment", "source");
        using var cmd = tx.Command("""
            SELECT r.id, r.reference, r.round, r.review_date, f.comment_id, f.kind, f.severity, f.load_case, f.place, f.message, f.source
            FROM findings f JOIN reviews r ON r.id = f.review_id ORDER BY r.id, f.seq
            """);
        using var r = cmd.ExecuteReader();
        while (r.Read())
        {
            csv.Number(RegisterTx.Int64(r, 0)).Text(r.GetString(1)).Number(RegisterTx.Int(r, 2));
            for (int i = 3; i <= 10; i++) csv.Text(r.GetString(i));
            csv.End();
        }
        return csv.ToString();
    }
}
