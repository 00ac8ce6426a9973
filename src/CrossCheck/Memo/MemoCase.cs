using CrossCheck.Common;
using CrossCheck.Memo.Diagrams;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

public sealed class MemoCase
{
    /// <param name="conv">Converts a clockwise member-end moment to the submission's own convention.</param>
    internal MemoCase(CaseReview c, DisplayUnits u, Func<double, MemberEnd?, double> conv, Func<string, int> order, MemoDiagrams? diagrams = null)
    {
        Figures = diagrams?.ForCase(c.Case) ?? [];
        Details = diagrams?.DetailsFor(c.Case) ?? [];
        DetailsOmitted = diagrams?.DetailsOmitted(c.Case) ?? 0;
        string mom(double? si, MemberEnd? end, string fmt) => si is double v ? Fmt.Number(u.Moment.FromSi(conv(v, end)), fmt) : "—";
        Id = c.Case;
        Peak = mom(c.PeakMoment, null, "0.00");
        AgreeTolerance = Fmt.Number(u.Moment.FromSi(c.AgreeTolerance), "0.00");
        MinorTolerance = Fmt.Number(u.Moment.FromSi(c.MinorTolerance), "0.00");
        Rows = c.EndMoments.OrderBy(e => order(e.Member)).ThenBy(e => e.End ?? MemberEnd.End).Select(e => new MemoRow(e.Member, e.At,
            e.Claim is { } cl ? Quoting.ClaimNumber(cl) : "—", mom(e.Recomputed, e.End, "0.00"),
            e.Difference is double d ? Fmt.Number(u.Moment.FromSi(conv(d, e.End)), "+0.00;-0.00;0.00") : "—",
            e.Status.Json(), e.Source?.Citation ?? "(not claimed)")).ToList();
        Agree = c.Count(EndStatus.Agree);
        Minor = c.Count(EndStatus.Minor);
        Discrepant = c.Count(EndStatus.Discrepant);
        Missing = c.Count(EndStatus.Missing);
        Unmatched = c.Count(EndStatus.Unmatched);
        Reactions = c.Reactions.Select(q => Quantity(q, true, u)).ToList();
        Displacements = c.Displacements.Select(q => Quantity(q, false, u)).ToList();
        Flags = c.Flags.Where(f => f.Severity != Severity.Info).Select(f => new MemoFlag(f.Kind.Json(), f.Severity.Json(), f.Where, f.Message, f.SourceText)).ToList();
        InfoFlags = c.Flags.Where(f => f.Severity == Severity.Info).Select(f => new MemoFlag(f.Kind.Json(), f.Severity.Json(), f.Where, f.Message, f.SourceText)).ToList();
        Unexplained = c.Causes.Count == 0 && c.EndMoments.Any(e => e.Status is EndStatus.Discrepant or EndStatus.Minor);
        UnexplainedSections = c.SectionCauses.Count == 0 && SectionDifferences(c);
        Causes = MemoSections.Causes(c);
        Heading = MemoSections.Heading(c);
        IsCombination = c.Combination is not null;
        IsEnvelope = c.Combination?.IsPatterned == true;
        SpanMoments = MemoSections.Spans(c, u, order);
        Shears = MemoSections.Shears(c, u, order);
        EnvelopeRows = MemoSections.Envelope(c, u, order);
        ShearAgreeTolerance = Fmt.Number(u.Force.FromSi(c.ShearBand.Agree), "0.00");
        ShearMinorTolerance = Fmt.Number(u.Force.FromSi(c.ShearBand.Minor), "0.00");
        Alpha = MemoSections.Alpha(c);
    }

    private static bool SectionDifferences(CaseReview c) =>
        c.SpanMoments.Any(x => x.Status is EndStatus.Minor or EndStatus.Discrepant) || c.Shears.Any(x => x.Status is EndStatus.Minor or EndStatus.Discrepant)
        || c.Envelope.Any(x => x.Side == EnvelopeSide.Unsafe);

    /// <summary>"Load case G", or the combination with its definition ("Combination ULS-1 (envelope) = 1.35 G + 1.5 Q (...)").</summary>
    public string Heading { get; }

    /// <summary>The span-moment, shear or envelope claims differ and no tested mistake reproduces them.</summary>
    public bool UnexplainedSections { get; }

    /// <summary>"Load case G" or "Combination ULS-1", for the headings of sections 3 and 4.</summary>
    public string ShortHeading => IsCombination ? $"Combination {Id}" : $"Load case {Id}";

    /// <summary>The entry is a load combination.</summary>
    public bool IsCombination { get; }

    /// <summary>The entry is a combination with a patterned case: it has an envelope, no end-moment table.</summary>
    public bool IsEnvelope { get; }

    public IReadOnlyList<MemoSpanRow> SpanMoments { get; }
    public IReadOnlyList<MemoShearRow> Shears { get; }
    public IReadOnlyList<MemoEnvelopeRow> EnvelopeRows { get; }
    public string ShearAgreeTolerance { get; }
    public string ShearMinorTolerance { get; }

    /// <summary>The elastic critical load factor in a sentence; empty when not computed.</summary>
    public string Alpha { get; }

    private static MemoQuantity Quantity(QuantityFinding q, bool reaction, DisplayUnits u)
    {
        var unit = reaction ? (q.Component == "M" ? u.Moment : u.Force) : (q.Component == "rotation" ? new UnitChoice("rad", 1) : u.Displacement);
        string fmt = q.Component == "rotation" ? "0.000000" : "0.0##";
        return new MemoQuantity(q.Joint, q.Component, unit.Symbol, Fmt.Number(unit.FromSi(q.Claimed), fmt), Fmt.Number(unit.FromSi(q.Recomputed), fmt),
            q.Status.Json(), q.Source.Citation);
    }

    public string Id { get; }
    public string Peak { get; }
    public string AgreeTolerance { get; }
    public string MinorTolerance { get; }
    public IReadOnlyList<MemoRow> Rows { get; }
    public int Agree { get; }
    public int Minor { get; }
    public int Discrepant { get; }
    public int Missing { get; }
    public int Unmatched { get; }
    public IReadOnlyList<MemoQuantity> Reactions { get; }
    public IReadOnlyList<MemoQuantity> Displacements { get; }
    public IReadOnlyList<MemoFlag> Flags { get; }
    public IReadOnlyList<MemoFlag> InfoFlags { get; }
    public IReadOnlyList<MemoCause> Causes { get; }

    /// <summary>The case has differences but no tested mistake reproduces them.</summary>
    public bool Unexplained { get; }

    /// <summary>Loads and bending-moment drawings of the case (HTML memos only).</summary>
    public IReadOnlyList<MemoFigure> Figures { get; }

    /// <summary>Member details for the members whose claims differ (HTML memos only).</summary>
    public IReadOnlyList<MemoFigure> Details { get; }

    /// <summary>Members with differing claims left without a detail drawing (beyond <see cref="MemoDiagrams.MaxDetailsPerCase"/>).</summary>
    public int DetailsOmitted { get; }

    /// <summary>"3 more members of this case have differing claims and no detail drawing; ..."</summary>
    public string DetailsOmittedText => $"{Words.Count(DetailsOmitted, "more member")} of this case {(DetailsOmitted == 1 ? "has" : "have")} differing claims and no detail drawing; the table above lists them.";
}
