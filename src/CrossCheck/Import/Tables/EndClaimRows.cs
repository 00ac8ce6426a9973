using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>One row of a table of claims at member ends: the case, the member, the end as written and resolved, the value (SI) and as written.</summary>
internal readonly record struct EndClaimRow(string Case, string Member, string At, MemberEnd? End, double Value, double AsWritten, SourceRef Source);

/// <summary>The rows of a table of claims at member ends (<c>end-moments</c>, <c>shears</c>): case, member, <c>at</c> and one value column.</summary>
internal static class EndClaimRows
{
    /// <summary>
    /// The rows of <paramref name="v"/> that name a member, an end and a <paramref name="column"/> value in a case that stands,
    /// in order. A second claim at the same end in the same case is an error (<paramref name="twice"/> is given the member,
    /// the <c>at</c> cell, the case and where the first stands) and is left out. Errors are reported as the rows are enumerated.
    /// </summary>
    public static IEnumerable<EndClaimRow> Read(SubmissionDraft d, TableView v, string column, Func<string, string, string, string, string> twice)
    {
        var seen = new Dictionary<(string, string, MemberEnd), SourceRef>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? member = v.Id(row, "member");
            string? at = v.Id(row, "at");
            double? value = v.Number(row, column, required: true);
            // A case whose loads were all left out for errors of their own is not reported again.
            if (member is null || at is null || value is null || !d.ClaimCase(v, row, c)) continue;
            var end = MemberEndCell.Resolve(d.Model, member, at);
            if (end is MemberEnd e && !seen.TryAdd((c, member, e), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), twice(member, at, c, seen[(c, member, e)].Compact));
                continue;
            }
            yield return new EndClaimRow(c, member, at, end, value.Value, value.Value / (v.Unit(column)?.ToSi ?? 1), v.CellRef(row, column));
        }
    }
}
