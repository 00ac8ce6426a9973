using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Memo;

/// <summary>One recomputed member-end moment, in the submission's unit and sign convention.</summary>
public sealed record SolvedEndMoment(string Case, string Member, string At, MemberEnd End, double Moment);

/// <summary>
/// One row of a combination's envelope in the submission's unit: at a member end (its convention) the largest and least
/// moment, or in the span the largest moment (sagging positive), each with the members loaded to reach it.
/// </summary>
public sealed record SolvedEnvelopeRow(string Combination, string Member, string At, double Max, IReadOnlyList<string> MaxLoaded, double? Min, IReadOnlyList<string> MinLoaded);

/// <summary>
/// The recomputed results of a submission in its own units and sign convention: what <c>crosscheck solve</c>
/// prints. Rendered as rows (for a console table), CSV or JSON.
/// </summary>
public sealed class SolveReport
{
    public SolveReport(Submission submission, AnalysisResult result)
    {
        ArgumentNullException.ThrowIfNull(submission);
        ArgumentNullException.ThrowIfNull(result);
        Submission = submission;
        Result = result;
        var u = submission.Info.Units.Moment;
        var rows = new List<SolvedEndMoment>();
        foreach (var c in result.Cases)
            foreach (var m in submission.Model.Members)
            {
                var mr = c.Members[m.Id];
                rows.Add(new SolvedEndMoment(c.Case, m.Id, m.Start, MemberEnd.Start, u.FromSi(ToConvention(mr.StartMoment, MemberEnd.Start))));
                rows.Add(new SolvedEndMoment(c.Case, m.Id, m.End, MemberEnd.End, u.FromSi(ToConvention(mr.EndMoment, MemberEnd.End))));
            }
        EndMoments = rows;
        var envelopes = new List<SolvedEnvelopeRow>();
        foreach (var env in result.Envelopes)
            foreach (var m in submission.Model.Members)
            {
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    var (max, min) = env.Extremes(r => ToConvention(r.Members[m.Id].MomentAtEnd(end), end));
                    envelopes.Add(new SolvedEnvelopeRow(env.Combination.Name, m.Id, m.JointAt(end), u.FromSi(max.Value), max.Loaded, u.FromSi(min.Value), min.Loaded));
                }
                var span = env.SpanMaximum(m.Id);
                envelopes.Add(new SolvedEnvelopeRow(env.Combination.Name, m.Id, "span", u.FromSi(span.Value), span.Loaded, null, []));
            }
        Envelopes = envelopes;
    }

    /// <summary>The envelopes of the combinations with a patterned case, member by member.</summary>
    public IReadOnlyList<SolvedEnvelopeRow> Envelopes { get; }

    /// <summary>The combination a case stands for, in words ("1.35 G + 1.5 Q"); null for a load case.</summary>
    public string? CombinationWords(string caseId) => Submission.Combination(caseId)?.Words;

    public Submission Submission { get; }
    public AnalysisResult Result { get; }
    public IReadOnlyList<SolvedEndMoment> EndMoments { get; }

    public string MomentUnit => Submission.Info.Units.Moment.Symbol;

    /// <summary>Converts a clockwise member-end moment to the submission's convention.</summary>
    public double ToConvention(double clockwise, MemberEnd end) =>
        Submission.Info.SignConvention == SignConvention.Sagging && end == MemberEnd.End ? -clockwise : clockwise;

    public string ConventionName => Submission.Info.SignConvention == SignConvention.Sagging
        ? "sagging positive (internal bending moment)"
        : "clockwise positive (moment on the member end)";

    /// <summary>One row per member end; names from the submission are defused for spreadsheets (<see cref="CsvOut"/>).</summary>
    public string ToCsv()
    {
        using var csv = new CsvOut();
        if (Envelopes.Count == 0)
        {
            csv.Header("case", "member", "at", $"moment [{MomentUnit}]");
            foreach (var r in EndMoments) csv.Text(r.Case).Text(r.Member).Text(r.At).Number(r.Moment).End();
            return csv.ToString();
        }
        // With envelopes: each bound a row of its own, with the members loaded to reach it.
        csv.Header("case", "member", "at", $"moment [{MomentUnit}]", "bound", "loaded");
        foreach (var r in EndMoments) csv.Text(r.Case).Text(r.Member).Text(r.At).Number(r.Moment).Text("").Text("").End();
        foreach (var r in Envelopes)
        {
            csv.Text(r.Combination).Text(r.Member).Text(r.At).Number(r.Max).Text("max").Text(string.Join(" ", r.MaxLoaded)).End();
            if (r.Min is double min) csv.Text(r.Combination).Text(r.Member).Text(r.At).Number(min).Text("min").Text(string.Join(" ", r.MinLoaded)).End();
        }
        return csv.ToString();
    }

    public string ToJson()
    {
        var units = Submission.Info.Units;
        using var j = new JsonOut();
        j.Obj()
            .Str("schema", "crosscheck-solve/1")
            .Obj("tool").Str("name", "crosscheck").Str("version", ToolInfo.Version).EndObj()
            .Obj("submission")
                .Str("title", Submission.Info.Title).Str("reference", Submission.Info.Reference).Str("source", Submission.Source)
                .Str("momentUnit", units.Moment.Symbol).Str("forceUnit", units.Force.Symbol).Str("displacementUnit", units.Displacement.Symbol)
                .Str("signConvention", Submission.Info.SignConvention == SignConvention.Sagging ? "sagging" : "clockwise")
            .EndObj()
            .Each("cases", Result.Cases, (o, c) =>
            {
                o.Str("case", c.Case)
                    .Str("combination", CombinationWords(c.Case))
                    .Each("endMoments", EndMoments.Where(e => e.Case == c.Case), (o, e) => o.Str("member", e.Member).Str("at", e.At).Num("moment", Round(e.Moment)))
                    .Each("spanMoments", Submission.Model.Members, (o, m) => o
                        .Str("member", m.Id)
                        .Num("maxSagging", Round(units.Moment.FromSi(c.Members[m.Id].MaxSagging.Moment)))
                        .Num("at", Round(units.Length.FromSi(c.Members[m.Id].MaxSagging.X))))
                    .Each("reactions", c.Reactions, (o, r) => o
                        .Str("joint", r.Key).Num("rx", Round(units.Force.FromSi(r.Value.Rx))).Num("ry", Round(units.Force.FromSi(r.Value.Ry)))
                        .Num("m", Round(units.Moment.FromSi(r.Value.M))));
                if (Submission.Model.RelativeStiffness) o.Null("displacements");
                else
                    o.Each("displacements", c.Displacements, (o, d) => o
                        .Str("joint", d.Key).Num("ux", Round(units.Displacement.FromSi(d.Value.Ux))).Num("uy", Round(units.Displacement.FromSi(d.Value.Uy)))
                        .Num("rotation", Round(d.Value.Rotation, 9)));
            })
            .Each("envelopes", Result.Envelopes, (o, env) => o
                .Str("combination", env.Combination.Name).Str("words", env.Combination.Words)
                .Each("rows", Envelopes.Where(r => r.Combination == env.Combination.Name), (o, r) => o
                    .Str("member", r.Member).Str("at", r.At).Num("max", Round(r.Max)).Strings("maxLoaded", r.MaxLoaded)
                    .Num("min", r.Min is double m ? Round(m) : null).Strings("minLoaded", r.MinLoaded)))
            .Strings("notes", Result.Notes)
            .EndObj();
        return j.ToString();
    }

    private static double Round(double v, int digits = 6) { double r = Math.Round(v, digits, MidpointRounding.AwayFromZero); return r == 0 ? 0 : r; }
}
