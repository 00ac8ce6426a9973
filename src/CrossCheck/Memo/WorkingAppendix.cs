using System.Net;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>
/// The appendix with the reference moment-distribution working table (<c>--show-working</c>): formats
/// <see cref="ReviewResult.Working"/>, CrossCheck's own Hardy Cross distribution of every case with the sway corrections.
/// </summary>
public static class WorkingAppendix
{
    public static IEnumerable<MemoAppendix> For(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (review.Working is not { } working) yield break;
        var s = review.Submission;
        if (!working.Available)
        {
            yield return new MemoAppendix("Appendix: reference moment distribution",
                "Not available: moment distribution assumes axially rigid members and this submission asks for elastic axial behaviour.",
                "<p>Not available: moment distribution assumes axially rigid members and this submission asks for elastic axial behaviour.</p>");
            yield break;
        }
        var md = new StringBuilder();
        var html = new StringBuilder();
        var mu = s.Info.Units.Moment;
        string stop = Fmt.Number(ReferenceWorking.StopBelow, "0.###");
        md.Append("Reference working by CrossCheck (Hardy Cross, simultaneous balancing; an overhang takes no distributed moment and carries its statical root moment; ")
          .Append($"stopped when every carry-over is below {stop} {mu.Symbol}, then a final balance). Moments in {mu.Symbol}, clockwise on the member end.\n");
        html.Append($"<p class=\"muted\">Reference working by CrossCheck (Hardy Cross, simultaneous balancing; an overhang takes no distributed moment and carries its statical root moment; stopped when every carry-over is below {stop} {Esc(mu.Symbol)}, then a final balance). Moments in {Esc(mu.Symbol)}, clockwise on the member end.</p>\n");
        foreach (var c in working.Cases)
        {
            if (c.Result is not { } result)
            {
                md.Append($"\n### Load case {c.Case}\n\n{c.Problem}\n");
                html.Append($"<h3>Load case {Esc(c.Case)}</h3><p>{Esc(c.Problem ?? "")}</p>\n");
                continue;
            }
            md.Append($"\n### Load case {c.Case}\n\nStiffness: {c.Method}.\n");
            html.Append($"<h3>Load case {Esc(c.Case)}</h3>\n<p class=\"muted\">Stiffness: {Esc(c.Method)}.</p>\n");
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
            string final = string.Join(", ", result.NoSway.Columns.Select((col, i) => $"{Cell(col, s.Model)} {Fmt.Number(mu.FromSi(c.Final[i]))}"));
            md.Append("\nFinal moments: ").Append(final).Append('\n');
            html.Append("<p><strong>Final moments:</strong> ").Append(Esc(final)).Append("</p>\n");
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
