using System.Text.Json;
using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Register;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>The review as JSON, per REVIEW-JSON.md (schema <c>crosscheck-review/1</c>).</summary>
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
            _ => Mom(v),
        };
        string UnitOf(Flag f) => f.Unit switch
        {
            ValueKind.Force => u.Force.Symbol,
            ValueKind.Displacement => u.Displacement.Symbol,
            ValueKind.Rotation => "rad",
            _ => u.Moment.Symbol,
        };
        double Qty(QuantityFinding q, double si, bool reaction) => reaction
            ? Round(q.Component == "M" ? u.Moment.FromSi(si) : u.Force.FromSi(si))
            : q.Component == "rotation" ? Round(si, 9) : Round(u.Displacement.FromSi(si));

        var doc = new
        {
            schema = Schema,
            tool = new { name = "crosscheck", version = ToolInfo.Version },
            submission = new
            {
                title = s.Info.Title,
                reference = s.Info.Reference,
                revision = s.Info.Revision,
                preparedBy = s.Info.PreparedBy,
                source = s.Source,
                momentUnit = u.Moment.Symbol,
                forceUnit = u.Force.Symbol,
                displacementUnit = u.Displacement.Symbol,
                signConvention = s.Info.SignConvention == SignConvention.Sagging ? "sagging" : "clockwise",
            },
            reviewer = review.Options.Reviewer,
            date = (review.Options.Date ?? DateOnly.FromDateTime(DateTime.Today)).ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture),
            tolerance = new
            {
                absolute = review.Options.AbsoluteTolerance,
                relative = review.Options.RelativeTolerance,
                minorRelative = review.Options.MinorRelativeTolerance,
            },
            verdict = review.Verdict.Json(),
            cases = review.Cases.Select(c => new
            {
                @case = c.Case,
                peakMoment = Mom(c.PeakMoment),
                endMoments = c.EndMoments.Select(e => new
                {
                    member = e.Member,
                    at = e.At,
                    claimed = MomN(e.Claimed),
                    recomputed = MomN(e.Recomputed),
                    difference = MomN(e.Difference),
                    status = e.Status.Json(),
                    source = e.Source?.RowCompact,
                }),
                reactions = c.Reactions.Select(q => new
                {
                    joint = q.Joint, component = q.Component, claimed = Qty(q, q.Claimed, true), recomputed = Qty(q, q.Recomputed, true),
                    difference = Qty(q, q.Difference, true), status = q.Status.Json(), source = q.Source.RowCompact,
                }),
                displacements = c.Displacements.Select(q => new
                {
                    joint = q.Joint, component = q.Component, claimed = Qty(q, q.Claimed, false), recomputed = Qty(q, q.Recomputed, false),
                    difference = Qty(q, q.Difference, false), status = q.Status.Json(), source = q.Source.RowCompact,
                }),
                flags = c.Flags.Select(f => new
                {
                    kind = f.Kind.Json(),
                    severity = f.Severity.Json(),
                    where = f.Where,
                    value = Value(f),
                    unit = UnitOf(f),
                    message = f.Message,
                    source = f.SourceText,
                }),
                distributionAudit = c.Audit is not { } a ? null : new
                {
                    variant = a.Variant,
                    cellsChecked = a.CellsChecked,
                    cellsWrong = a.CellsWrong,
                    firstWrongCell = a.First is not { } w ? null : new
                    {
                        row = w.Row,
                        column = w.Column,
                        found = w.Step == Model.WorkingStep.DistributionFactor ? Round(w.Found) : Mom(w.Found),
                        expected = w.Step == Model.WorkingStep.DistributionFactor ? Round(w.Expected) : Mom(w.Expected),
                        source = w.Source.RowCompact,
                    },
                    knockOn = Mom(a.KnockOn),
                    knockOnColumn = a.KnockOnColumn,
                },
                causes = c.Causes.Select(x => new
                {
                    code = x.Code,
                    confidence = Round(x.Confidence, 3),
                    explains = Round(x.Explains, 3),
                    message = x.Message,
                    evidence = x.Evidence,
                }),
            }),
            comments = review.Comments.Select(cm => new { id = cm.Id, severity = cm.Severity.Json(), @case = cm.Case, where = cm.Where, text = cm.Text, source = cm.Source }),
            notes = review.Notes,
            inputWarnings = review.InputWarnings,
            inputErrors = Array.Empty<object>(),
        };
        if (rounds is null) return JsonSerializer.Serialize(doc, SolveReport.JsonOptions) + "\n";
        var node = JsonSerializer.SerializeToNode(doc, SolveReport.JsonOptions)!.AsObject();
        node["register"] = JsonSerializer.SerializeToNode(new
        {
            reference = rounds.Review.Reference,
            round = rounds.Review.Round,
            repeat = rounds.Repeat,
            inputHash = rounds.Review.InputHash,
            previousRound = rounds.Previous?.Round,
            previousDate = rounds.Previous?.ReviewDate,
            previousVerdict = rounds.Previous?.Verdict,
            closed = rounds.Closed.Select(c => c.Id),
            persisting = rounds.Persisting.Select(c => c.Id),
            @new = rounds.New.Select(c => c.Id),
        }, SolveReport.JsonOptions);
        return node.ToJsonString(SolveReport.JsonOptions) + "\n";
    }

    /// <summary>The JSON for a submission that could not be read: verdict null and the input errors.</summary>
    public static string WriteInputErrors(string source, IEnumerable<InputProblem> errors)
    {
        var doc = new
        {
            schema = Schema,
            tool = new { name = "crosscheck", version = ToolInfo.Version },
            submission = new { source },
            verdict = (string?)null,
            cases = Array.Empty<object>(),
            inputErrors = errors.Select(e => new { source = e.Where.Compact, message = e.Message }),
        };
        return JsonSerializer.Serialize(doc, SolveReport.JsonOptions) + "\n";
    }

    private static double Round(double v, int digits = 6)
    {
        double r = Math.Round(v, digits, MidpointRounding.AwayFromZero);
        return r == 0 ? 0 : r;
    }
}
