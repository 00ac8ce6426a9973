using System.Net;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>
/// The reference moment-distribution working table printed on request (<c>--show-working</c>): CrossCheck's own
/// Hardy Cross distribution of every case, carried until the carry-overs fall below 0.1 moment units as is usual by
/// hand, with the sway corrections, so an author can compare it row by row with their own.
/// </summary>
public static class WorkingAppendix
{
    public static IEnumerable<MemoAppendix> For(ReviewResult review, MemoFormat format)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (!review.Options.ShowWorking) yield break;
        var s = review.Submission;
        if (s.Model.Axial != AxialBehaviour.Rigid)
        {
            yield return new MemoAppendix("Appendix: reference moment distribution",
                "Not available: moment distribution assumes axially rigid members and this submission asks for elastic axial behaviour.",
                "<p>Not available: moment distribution assumes axially rigid members and this submission asks for elastic axial behaviour.</p>");
            yield break;
        }
        var md = new StringBuilder();
        var html = new StringBuilder();
        var mu = s.Info.Units.Moment;
        md.Append("Reference working by CrossCheck (Hardy Cross, simultaneous balancing, modified stiffness 3EI/L at pinned far ends, ")
          .Append($"stopped when every carry-over is below 0.1 {mu.Symbol}, then a final balance). Moments in {mu.Symbol}, clockwise on the member end.\n");
        html.Append($"<p class=\"muted\">Reference working by CrossCheck (Hardy Cross, simultaneous balancing, modified stiffness 3EI/L at pinned far ends, stopped when every carry-over is below 0.1 {Esc(mu.Symbol)}, then a final balance). Moments in {Esc(mu.Symbol)}, clockwise on the member end.</p>\n");
        foreach (var c in s.Cases)
        {
            DistributionResult result;
            try
            {
                result = MomentDistribution.Run(s.Model, c, new DistributionOptions(StopWhenCarryOversBelow: 0.1 * mu.ToSi));
            }
            catch (NotSupportedException ex)
            {
                md.Append($"\n### Load case {c.Id}\n\n{ex.Message}\n");
                html.Append($"<h3>Load case {Esc(c.Id)}</h3><p>{Esc(ex.Message)}</p>\n");
                continue;
            }
            md.Append($"\n### Load case {c.Id}\n");
            html.Append($"<h3>Load case {Esc(c.Id)}</h3>\n");
            Table(result.NoSway, mu, md, html, s.Model);
            foreach (var sw in result.Sway)
            {
                if (Math.Abs(sw.Factor) < 1e-9)
                {
                    md.Append($"\nNo sway correction is needed for the {sw.Label}: the storey equilibrium equation gives zero.\n");
                    html.Append($"<p>No sway correction is needed for the {Esc(sw.Label)}: the storey equilibrium equation gives zero.</p>\n");
                    continue;
                }
                md.Append($"\nSway correction: {sw.Label}, used {Fmt.Number(sw.Factor, "0.####")} times (from the storey equilibrium equation).\n");
                html.Append($"<p>Sway correction: {Esc(sw.Label)}, used {Fmt.Number(sw.Factor, "0.####")} times (from the storey equilibrium equation).</p>\n");
                Table(sw.Table, mu, md, html, s.Model);
            }
            var final = result.NoSway.Columns.Select(col => result.Moment(col.Member, col.End)).ToList();
            md.Append("\nFinal moments: ").Append(string.Join(", ", result.NoSway.Columns.Select((col, i) => $"{Cell(col, s.Model)} {Fmt.Number(mu.FromSi(final[i]))}"))).Append('\n');
            html.Append("<p><strong>Final moments:</strong> ").Append(Esc(string.Join(", ", result.NoSway.Columns.Select((col, i) => $"{Cell(col, s.Model)} {Fmt.Number(mu.FromSi(final[i]))}")))).Append("</p>\n");
        }
        yield return new MemoAppendix("Appendix: reference moment distribution", md.ToString(), html.ToString());
    }

    private static string Cell((string Member, MemberEnd End) col, StructureModel model) => $"{col.Member}@{model.Member(col.Member).JointAt(col.End)}";

    private static string Esc(string s) => WebUtility.HtmlEncode(s);

    private static void Table(DistributionTable t, UnitChoice mu, StringBuilder md, StringBuilder html, StructureModel model)
    {
        var headers = t.Columns.Select(c => Cell(c, model)).ToList();
        md.Append('\n').Append("| Step | ").Append(string.Join(" | ", headers.Select(h => h.Replace("|", "\\|")))).Append(" |\n");
        md.Append("|---|").Append(string.Concat(headers.Select(_ => "--:|"))).Append('\n');
        html.Append("<table><thead><tr><th>Step</th>").Append(string.Concat(headers.Select(h => $"<th class=\"num\">{Esc(h)}</th>"))).Append("</tr></thead><tbody>\n");
        foreach (var row in t.Rows)
        {
            string label = row.Step switch
            {
                DistributionStep.DistributionFactor => "DF",
                DistributionStep.FixedEndMoment => "FEM",
                DistributionStep.Balance => $"balance {row.Cycle}",
                DistributionStep.CarryOver => $"carry-over {row.Cycle}",
                _ => "final",
            };
            var cells = row.Values.Select(v => v is not double x ? "" : row.Step == DistributionStep.DistributionFactor ? Fmt.Number(x, "0.000") : Fmt.Number(mu.FromSi(x))).ToList();
            md.Append("| ").Append(label).Append(" | ").Append(string.Join(" | ", cells)).Append(" |\n");
            html.Append("<tr><td>").Append(label).Append("</td>").Append(string.Concat(cells.Select(c => $"<td class=\"num\">{c}</td>"))).Append("</tr>\n");
        }
        html.Append("</tbody></table>\n");
    }
}
