using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace CrossCheck.Register;

/// <summary>What a register holds, in a form two registers can be compared by (after a copy, say).</summary>
/// <param name="Reviews">Reviews recorded.</param>
/// <param name="References">References (calculations) they belong to.</param>
/// <param name="Findings">Findings over all reviews.</param>
/// <param name="Digest">SHA-256 over every review (every column, id included) and every finding, in id order:
/// equal digests mean the same rounds, comments and hashes, whichever database holds them.</param>
public sealed record RegisterTally(int Reviews, int References, int Findings, string Digest);

/// <summary>
/// <c>crosscheck register check</c>: the database's own checks (SQLite), every review's findings complete, no finding
/// without its review, and each reference's rounds numbered 1, 2, 3 ... with its reviews numbered 1, 2, ... within
/// each round, all of one input hash.
/// </summary>
internal static class RegisterCheck
{
    public static List<string> Problems(RegisterTx tx, RegisterBackend backend)
    {
        var problems = backend.StorageProblems(tx).ToList();
        // Values of the wrong kind (text where a count belongs, a verdict CrossCheck never writes): what would make 'history' print nonsense.
        foreach (var problem in tx.Rows($"SELECT {RegisterQueries.ReviewColumns} FROM reviews ORDER BY id", r =>
                 {
                     try { RegisterValues.Check(r, ""); return null; }
                     catch (RegisterException ex) { return ex.Message; }
                 }))
            if (problem is not null) problems.Add(problem);
        // With values CrossCheck never writes, the counts and rounds below cannot be read: those problems come first.
        if (problems.Count > 0) return problems;
        foreach (var (id, reference, round, expected, actual) in tx.Rows("""
            SELECT r.id, r.reference, r.round, r.finding_count, count(f.seq) FROM reviews r LEFT JOIN findings f ON f.review_id = r.id
            GROUP BY r.id, r.reference, r.round, r.finding_count HAVING count(f.seq) <> r.finding_count ORDER BY r.id
            """, r => (RegisterTx.Int64(r, 0), r.GetString(1), RegisterTx.Int64(r, 2), RegisterTx.Int64(r, 3), RegisterTx.Int64(r, 4))))
            problems.Add($"review {id} ({reference} round {round}) should have {expected} findings but has {actual}");
        long orphans = tx.Long("SELECT count(*) FROM findings f WHERE NOT EXISTS (SELECT 1 FROM reviews r WHERE r.id = f.review_id)");
        if (orphans > 0 && problems.Count == 0) problems.Add($"{orphans} finding(s) refer to a review that does not exist");

        var rows = tx.Rows("SELECT reference, round, round_review, input_hash FROM reviews",
            r => (Ref: r.GetString(0), Round: RegisterTx.Int(r, 1), Place: RegisterTx.Int(r, 2), Hash: r.GetString(3)));
        foreach (var reference in rows.GroupBy(x => x.Ref, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var rounds = reference.Select(x => x.Round).Distinct().Order().ToList();
            if (!rounds.SequenceEqual(Enumerable.Range(1, rounds.Count)))
                problems.Add($"reference {reference.Key} has rounds {string.Join(", ", rounds)} (expected 1 to {rounds.Count})");
            foreach (var round in reference.GroupBy(x => x.Round).OrderBy(g => g.Key))
            {
                var places = round.Select(x => x.Place).Order().ToList();
                if (!places.SequenceEqual(Enumerable.Range(1, places.Count)))
                    problems.Add($"reference {reference.Key} round {round.Key} has reviews numbered {string.Join(", ", places)} (expected 1 to {places.Count})");
                if (round.Select(x => x.Hash).Distinct(StringComparer.Ordinal).Count() > 1)
                    problems.Add($"reference {reference.Key} round {round.Key} holds reviews of different input files");
            }
        }
        return problems;
    }

    public static RegisterTally Tally(RegisterTx tx)
    {
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var line = new StringBuilder();
        void Add(object? value)
        {
            string text = value switch
            {
                null or DBNull => "-",
                double d => "R" + d.ToString("R", CultureInfo.InvariantCulture),
                IFormattable f => "N" + f.ToString(null, CultureInfo.InvariantCulture),
                _ => "S" + value.ToString()!.Length.ToString(CultureInfo.InvariantCulture) + ":" + value,
            };
            line.Append(text).Append('\u001f');
        }
        void Flush()
        {
            hash.AppendData(Encoding.UTF8.GetBytes(line.Append('\n').ToString()));
            line.Clear();
        }

        int reviews = 0, findings = 0;
        var references = new HashSet<string>(StringComparer.Ordinal);
        foreach (var r in RegisterQueries.Reviews(tx, "ORDER BY id"))
        {
            var x = r.Row;
            reviews++;
            references.Add(x.Reference);
            foreach (object? v in new object?[] { x.Id, x.Reference, x.Round, r.RoundReview, x.Revision, x.Title, x.Submission, x.Source, x.ReviewDate,
                         x.RecordedAt, x.Reviewer, x.ToolVersion, x.AbsoluteTolerance, x.RelativeTolerance, x.MinorRelativeTolerance, x.MomentUnit,
                         x.InputHash, x.Verdict, x.EndsAgree, x.EndsMinor, x.EndsDiscrepant, x.EndsMissing, x.EndsUnmatched, x.MajorFlags, x.MinorFlags,
                         x.TopCause, x.FindingCount })
                Add(v);
            Flush();
        }
        using (var cmd = tx.Command($"SELECT review_id, seq, {RegisterQueries.FindingColumns} FROM findings ORDER BY review_id, seq"))
        using (var r = cmd.ExecuteReader())
            while (r.Read())
            {
                findings++;
                Add(RegisterTx.Int64(r, 0));
                Add(RegisterTx.Int(r, 1));
                for (int i = 2; i < 9; i++) Add(r.GetString(i));
                Flush();
            }
        string digest = "sha256:" + Convert.ToHexStringLower(hash.GetHashAndReset());
        return new RegisterTally(reviews, references.Count, findings, digest);
    }
}
