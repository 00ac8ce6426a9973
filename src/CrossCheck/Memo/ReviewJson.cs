using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>The review as JSON, per docs/REVIEW-JSON.md (schema <c>crosscheck-review/1</c>).</summary>
public static class ReviewJson
{
    public const string Schema = "crosscheck-review/1";

    public static string Write(ReviewResult review) => Write(review, null);

    /// <param name="review">The review.</param>
    /// <param name="rounds">When the review was recorded in a register: adds a <c>register</c> object (round, previous round, and the
    /// ids of the comments closed, persisting and new against it).</param>
    public static string Write(ReviewResult review, RoundComparison? rounds)
    {
        ArgumentNullException.ThrowIfNull(review);
        var s = review.Submission;
        var u = s.Info.Units;
        double Mom(double si) => Round(u.Moment.FromSi(si));
        double? MomN(double? si) => si is double v ? Mom(v) : null;
        double? Value(Flag f) => f.Value is not double v ? null : f.Unit switch
        {
            ValueKind.Force => Round(u.Force.FromSi(v)),
            ValueKind.Displacement => Round(u.Displacement.FromSi(v)),
            ValueKind.Rotation => Round(v, 9),
            ValueKind.Factor => Round(v),
            _ => Mom(v),
        };
        string UnitOf(Flag f) => f.Unit switch
        {
            ValueKind.Force => u.Force.Symbol,
            ValueKind.Displacement => u.Displacement.Symbol,
            ValueKind.Rotation => "rad",
            ValueKind.Factor => "1",
            _ => u.Moment.Symbol,
        };
        double Force(double si) => Round(u.Force.FromSi(si));
        double? ForceN(double? si) => si is double v ? Force(v) : null;
        double? LengthN(double? si) => si is double v ? Round(u.Length.FromSi(v)) : null;
        double Qty(QuantityFinding q, double si, bool reaction) => reaction
            ? Round(q.Component == "M" ? u.Moment.FromSi(si) : u.Force.FromSi(si))
            : q.Component == "rotation" ? Round(si, 9) : Round(u.Displacement.FromSi(si));

        using var j = new JsonOut();
        j.Obj()
            .Str("schema", Schema)
            .Obj("tool").Str("name", "crosscheck").Str("version", ToolInfo.Version).EndObj()
            .Obj("submission")
                .Str("title", s.Info.Title).Str("reference", s.Info.Reference).Str("revision", s.Info.Revision).Str("preparedBy", s.Info.PreparedBy)
                .Str("source", s.Source).Str("momentUnit", u.Moment.Symbol).Str("forceUnit", u.Force.Symbol).Str("displacementUnit", u.Displacement.Symbol)
                .Str("signConvention", s.Info.SignConvention.Code()).Bool("signConventionStated", s.Info.SignConventionStated)
            .EndObj()
            .Str("reviewer", review.Options.Reviewer)
            .Str("date", Clock.Iso(review.Options.Date ?? Clock.Today(TimeProvider.System)))
            .Obj("tolerance")
                .Num("absolute", review.Options.AbsoluteTolerance).Num("relative", review.Options.RelativeTolerance).Num("minorRelative", review.Options.MinorRelativeTolerance)
            .EndObj()
            .Str("verdict", review.Verdict.Json())
            .Maybe("analysis", review.Analysis?.Numerics, (o, n) => o
                .Bool("verified", n.Trusted).Num("equilibriumResidual", n.WorstResidual).Num("conditionEstimate", n.ConditionEstimate)
                .Bool("illConditioned", n.IllConditioned)
                .Maybe("stiffnessContrast", n.Contrast, (o, k) => o
                    .Num("ratio", k.Ratio).Str("stiffer", k.Stiffer).Str("softer", k.Softer).Str("joint", k.Joint).Str("measure", k.Measure)))
            .Each("cases", review.Cases, (o, c) => o
                .Str("case", c.Case)
                .Maybe("combination", c.Combination, (o, k) => o
                    .Bool("patterned", k.IsPatterned).Str("words", k.Words)
                    .Each("terms", k.Terms, (o, t) => o
                        .Str("case", t.Case).Num("factor", t.Factor).Str("pattern", t.Patterned ? "spans" : "no").Num("factorUnloaded", t.Patterned ? t.FactorUnloaded : null)
                        .Str("source", t.Source.RowCompact)))
                .Num("alphaCr", c.AlphaCr is double a ? Significant(a) : null)
                .Num("peakMoment", Mom(c.PeakMoment))
                .Each("endMoments", c.EndMoments, (o, e) => o
                    .Str("member", e.Member).Str("at", e.At).Num("claimed", MomN(e.Claimed)).Num("recomputed", MomN(e.Recomputed))
                    .Num("difference", MomN(e.Difference)).Str("status", e.Status.Json()).Str("source", e.Source?.RowCompact)
                    .Str("claimedAsWritten", e.Claim is { } cl ? Quoting.ClaimNumber(cl) : null)
                    .Num("recomputedAsWritten", e.Recomputed is double rc && e.End is MemberEnd en ? Mom(s.Info.SignConvention.FromClockwise(rc, en)) : null))
                .Each("reactions", c.Reactions, (o, q) => o
                    .Str("joint", q.Joint).Str("component", q.Component).Num("claimed", Qty(q, q.Claimed, true)).Num("recomputed", Qty(q, q.Recomputed, true))
                    .Num("difference", Qty(q, q.Difference, true)).Str("status", q.Status.Json()).Str("source", q.Source.RowCompact))
                .Each("displacements", c.Displacements, (o, q) => o
                    .Str("joint", q.Joint).Str("component", q.Component).Num("claimed", Qty(q, q.Claimed, false)).Num("recomputed", Qty(q, q.Recomputed, false))
                    .Num("difference", Qty(q, q.Difference, false)).Str("status", q.Status.Json()).Str("source", q.Source.RowCompact))
                .Each("spanMoments", c.SpanMoments, (o, x) => o
                    .Str("member", x.Member).Num("claimed", Mom(x.Claimed)).Num("recomputed", MomN(x.Recomputed)).Num("difference", MomN(x.Difference))
                    .Str("status", x.Status.Json()).Num("claimedX", LengthN(x.ClaimedX)).Num("recomputedX", LengthN(x.RecomputedX))
                    .Num("maximumAt", LengthN(x.LocationNote)).Str("source", x.Claim.Source.RowCompact)
                    .Str("claimedAsWritten", Quoting.Written(x.Claim.Source, x.Claim.AsWritten)))
                .Each("shears", c.Shears, (o, x) => o
                    .Str("member", x.Member).Str("at", x.At).Num("claimed", Force(x.Claimed)).Num("recomputed", ForceN(x.Recomputed))
                    .Num("difference", ForceN(x.Difference)).Str("status", x.Status.Json()).Str("source", x.Claim.Source.RowCompact)
                    .Str("claimedAsWritten", Quoting.Written(x.Claim.Source, x.Claim.AsWritten)))
                .Each("envelope", c.Envelope, (o, x) => o
                    .Str("member", x.Member).Str("at", x.IsSpan ? "span" : x.At).Str("bound", x.Bound).Num("claimed", Mom(x.Claimed)).Num("recomputed", MomN(x.Recomputed))
                    .Num("difference", MomN(x.Difference)).Str("status", x.Status.Json()).Str("side", x.Side switch { EnvelopeSide.Unsafe => "unsafe", EnvelopeSide.Safe => "safe", _ => null })
                    .Strings("governing", x.Governing).Str("arrangement", x.Recomputed is null ? null : x.Arrangement).Num("allLoaded", MomN(x.AllLoaded))
                    .Num("x", LengthN(x.X)).Str("source", x.Source.RowCompact).Str("claimedAsWritten", x.AsWritten))
                .Each("flags", c.Flags, (o, f) => o
                    .Str("kind", f.Kind.Json()).Str("severity", f.Severity.Json()).Str("where", f.Where).Num("value", Value(f)).Str("unit", UnitOf(f))
                    .Str("message", f.Message).Str("brief", f.Brief.Length > 0 ? f.Brief : f.Message).Str("source", f.SourceText))
                .Maybe("distributionAudit", c.Audit, (o, a) => o
                    .Str("variant", a.Variant).Int("cellsChecked", a.CellsChecked).Int("cellsWrong", a.CellsWrong)
                    .Maybe("firstWrongCell", a.First, (o, w) => o
                        .Str("row", w.Row).Str("column", w.Column)
                        .Num("found", w.Step == WorkingStep.DistributionFactor ? Round(w.Found) : Mom(w.Found))
                        .Num("expected", w.Step == WorkingStep.DistributionFactor ? Round(w.Expected) : Mom(w.Expected))
                        .Str("source", w.Source.RowCompact))
                    .Num("knockOn", Mom(a.KnockOn)).Str("knockOnColumn", a.KnockOnColumn))
                .Each("causes", c.AllCauses, (o, x) => o
                    .Str("code", x.Code).Str("claims", x.Claims).Str("title", x.Kind.Term().Title).Num("confidence", Round(x.Confidence, 3)).Num("explains", Round(x.Explains, 3))
                    .Bool("reproduces", x.Reproduces).Str("message", x.Message).Str("evidence", x.Evidence).Str("correctWorking", x.CorrectWorking)))
            .Each("comments", review.Comments, (o, cm) => o
                .Str("id", cm.Id).Str("severity", cm.Severity.Json()).Str("case", cm.Case).Strings("cases", cm.Cases).Str("where", cm.Where)
                .Str("cause", cm.Cause?.Json()).Str("text", cm.Text).Str("source", cm.Source)
                .Each("symptoms", cm.Symptoms, (o, y) => o
                    .Str("kind", y.Kind).Str("case", y.Case).Str("severity", y.Severity.Json()).Str("where", y.Place.Words).Str("text", y.Text).Str("source", y.Source)))
            .Strings("notes", review.Notes)
            .Strings("inputWarnings", review.InputWarnings)
            .Arr("inputErrors").EndArr();
        if (rounds is not null)
        {
            j.Obj("register")
                .Str("reference", rounds.Review.Reference).Int("round", rounds.Review.Round).Bool("repeat", rounds.Repeat).Str("inputHash", rounds.Review.InputHash)
                .Int("previousRound", rounds.Previous?.Round).Str("previousDate", rounds.Previous?.ReviewDate).Str("previousVerdict", rounds.Previous?.Verdict)
                .Strings("closed", rounds.Closed.Select(c => c.Id))
                .Strings("persisting", rounds.Persisting.Select(c => c.Id))
                .Strings("new", rounds.New.Select(c => c.Id))
                .EndObj();
        }
        j.EndObj();
        return j.ToString();
    }

    /// <summary>The JSON for a submission that could not be read: verdict null and the input errors.</summary>
    public static string WriteInputErrors(string source, IEnumerable<InputProblem> errors)
    {
        using var j = new JsonOut();
        j.Obj()
            .Str("schema", Schema)
            .Obj("tool").Str("name", "crosscheck").Str("version", ToolInfo.Version).EndObj()
            .Obj("submission").Str("source", source).EndObj()
            .Null("verdict")
            .Arr("cases").EndArr()
            .Each("inputErrors", errors, (o, e) => o.Str("source", e.Where.Compact).Str("message", e.Message))
            .EndObj();
        return j.ToString();
    }

    /// <summary>Six significant figures (α_cr: a tiny factor must not round to 0).</summary>
    private static double Significant(double v) => double.Parse(v.ToString("G6", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    private static double Round(double v, int digits = 6)
    {
        double r = Math.Round(v, digits, MidpointRounding.AwayFromZero);
        return r == 0 ? 0 : r;
    }
}
