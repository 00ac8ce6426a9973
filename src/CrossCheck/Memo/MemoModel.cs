using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Memo.Diagrams;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>
/// What a memo template sees: every number already formatted in the submission's units and sign convention,
/// every string exactly as read (templates escape them for HTML). Property names are the template's names.
/// </summary>
public sealed class MemoModel
{
    public MemoModel(ReviewResult review) : this(review, null)
    {
    }

    /// <param name="review">The review to present.</param>
    /// <param name="diagrams">Drawings for the HTML memo (see <see cref="MemoDiagrams.For"/>); null for none.</param>
    public MemoModel(ReviewResult review, MemoDiagrams? diagrams)
    {
        ArgumentNullException.ThrowIfNull(review);
        var s = review.Submission;
        var u = s.Info.Units;
        var o = review.Options;
        double Conv(double cw, MemberEnd? end) => end is MemberEnd e ? s.Info.SignConvention.FromClockwise(cw, e) : cw;

        Title = s.Info.Title ?? Path.GetFileName(Path.TrimEndingDirectorySeparator(s.Source));
        Reference = s.Info.Reference ?? "—";
        Revision = s.Info.Revision ?? "—";
        PreparedBy = s.Info.PreparedBy ?? "—";
        CheckedBy = s.Info.CheckedBy ?? "—";
        SubmissionDate = s.Info.Date ?? "—";
        Reviewer = o.Reviewer ?? "";
        ReviewDate = Clock.Iso(o.Date ?? Clock.Today(TimeProvider.System));
        ToolVersion = ToolInfo.Version;
        Source = s.Source;
        Verdict = review.Verdict.Words();
        VerdictCode = review.Verdict.Json();
        MomentUnit = u.Moment.Symbol;
        ForceUnit = u.Force.Symbol;
        LengthUnit = u.Length.Symbol;
        DisplacementUnit = u.Displacement.Symbol;
        string stated = s.Info.SignConventionStated ? "as the submission states its moments" : "assumed: the submission does not state its sign convention, and clockwise is the default";
        Convention = s.Info.SignConvention == SignConvention.Sagging
            ? $"sagging positive: the internal bending moment, positive when the fibre on the right-hand side of the member (looking from its start to its end) is in tension — {stated}"
            : $"clockwise positive: the moment the joint exerts on the member end (the slope-deflection and moment-distribution convention) — {stated}";
        AbsoluteTolerance = Fmt.Number(o.AbsoluteTolerance, "0.0##");
        RelativeTolerancePercent = Fmt.Number(o.RelativeTolerance * 100, "0.##");
        MinorTolerancePercent = Fmt.Number(o.MinorRelativeTolerance * 100, "0.##");
        Axial = s.Model.Axial == AxialBehaviour.Rigid
            ? "Axial deformation is neglected: every member keeps its length exactly (as in moment distribution and slope-deflection)."
            : "Axial deformation is included with E·A/L from the areas given.";
        Stiffness = s.Model.RelativeStiffness
            ? "No elastic modulus is given: the I values are used as relative stiffnesses, which fixes the moments of load cases but not displacements."
            : "Absolute stiffness from the E and I given.";
        Verification = review.Analysis?.Numerics is { } n
            ? $"Every recomputed result was verified by equilibrium before it was used: the largest out-of-balance force or moment at any joint, " +
              $"and of the structure as a whole, is {NumericalReport.Words(n.WorstResidual)} of the applied loads." +
              (n.IllConditioned ? $" The stiffness matrix is ill-conditioned (condition estimate {NumericalReport.Scientific(n.ConditionEstimate)}; see the notes in section 6)." : "")
            : "";
        HasMovements = s.Model.HasSupportMovements;
        HasHinges = s.Model.Members.Any(m => m.Hinge != Hinge.None);

        RunningHeader = CssString($"{(s.Info.Reference ?? Title)}{(s.Info.Revision is { Length: > 0 } rev ? $" · revision {rev}" : "")} · analysis check");
        RunningTitle = CssString(Title.Length > 60 ? Title[..57] + "..." : Title);
        VerdictLine = VerdictSentence(review);
        bool sections = s.Claims.SpanMoments.Count + s.Claims.Shears.Count + s.Claims.Envelopes.Count > 0;
        VerdictRule = sections
            ? "Verdict rule: revise when any claimed moment, shear, reaction or displacement is discrepant (beyond the minor band; an envelope figure " +
              "only on the unsafe side) or any check finding is major; concur when every claim agrees (an envelope figure may lie on the safe side) and no " +
              "check finding is above a note; otherwise concur with comments."
            : "Verdict rule: revise when any claimed moment, reaction or displacement is discrepant (beyond the minor band) or any check " +
              "finding is major; concur when every claim agrees and no check finding is above a note; otherwise concur with comments.";

        var memberOrder = s.Model.Members.Select((m, i) => (m.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        Cases = review.Cases.Select(c => new MemoCase(c, u, Conv, id => memberOrder.GetValueOrDefault(id, int.MaxValue), diagrams)).ToList();
        HasDiagrams = diagrams is not null;
        StructureFigure = diagrams?.Structure;
        Comments = review.Comments.Select(cm => new MemoComment(cm.Id, cm.Severity.Json(), cm.Case, cm.Where, cm.Text, cm.Source)
        {
            Cause = cm.Cause is { } k ? k.Term().Title : "",
            Symptoms = Symptoms(cm),
        }).ToList();
        Notes = review.Notes.ToList();
        Warnings = review.InputWarnings.ToList();

        InfoRows = s.Info.Other.Select(kv => new MemoPair(kv.Key, kv.Value)).ToList();
        var xs = Words.FixedColumn(s.Model.Joints.Select(j => u.Length.FromSi(j.X)).ToList(), 3);
        var ys = Words.FixedColumn(s.Model.Joints.Select(j => u.Length.FromSi(j.Y)).ToList(), 3);
        Joints = s.Model.Joints.Select((j, i) => new MemoJoint(j.Id, xs[i], ys[i],
            RestraintWord(j.Restraint), j.Movement.IsZero ? "" : Movement(j.Movement, u), j.Source.Citation)).ToList();
        // As engineers print section properties: E in GPa, I in 10⁶ mm⁴ (2400 for 2.4 × 10⁹ mm⁴), A in mm², one number of
        // decimals down each column.
        var members = s.Model.Members;
        var lengths = Words.FixedColumn(members.Select(m => u.Length.FromSi(s.Model.Length(m))).ToList(), 3);
        var moduli = Words.FixedColumn(members.Select(m => m.E / 1e9).ToList(), 1);
        var seconds = Words.FixedColumn(members.Select(m => s.Model.RelativeStiffness ? m.I : m.I * 1e6).ToList(), s.Model.RelativeStiffness ? 4 : 2);
        var areas = Words.FixedColumn(members.Select(m => (m.A ?? 0) * 1e6).ToList(), 1);
        Members = members.Select((m, i) => new MemoMember(m.Id, m.Start, m.End, lengths[i], s.Model.RelativeStiffness ? "—" : moduli[i], seconds[i],
            m.A is null ? "—" : areas[i], m.Hinge == Hinge.None ? "" : m.Hinge.ToString().ToLowerInvariant(), m.Source.Citation)).ToList();
        IUnit = s.Model.RelativeStiffness ? "relative" : "10⁶ mm⁴";
        Loads = s.Cases.SelectMany(c => c.Loads).Select(l => Load(l, u)).ToList();
        Combinations = s.Combinations.Select(c => MemoSections.Combination(c, u)).ToList();
        HasSwayCheck = review.Cases.Any(c => c.AlphaCr is not null);
        HasSectionChecks = s.Combinations.Count + s.Claims.SpanMoments.Count + s.Claims.Shears.Count + s.Claims.Envelopes.Count > 0;
        ClaimCount = s.Claims.EndMoments.Count;
        ReactionClaimCount = s.Claims.Reactions.Count;
        DisplacementClaimCount = s.Claims.Displacements.Count;
        ClaimsRead = $"Claims read: {Words.Count(ClaimCount, "end moment")}, {Words.Count(ReactionClaimCount, "reaction row")}, {Words.Count(DisplacementClaimCount, "displacement row")}" +
                     (s.Claims.SpanMoments.Count + s.Claims.Shears.Count + s.Claims.Envelopes.Count == 0 ? "." :
                         $", {Words.Count(s.Claims.SpanMoments.Count, "span moment")}, {Words.Count(s.Claims.Shears.Count, "end shear")}, {Words.Count(s.Claims.Envelopes.Count, "envelope row")}.");
    }

    public string Title { get; }
    public string Reference { get; }
    public string Revision { get; }
    public string PreparedBy { get; }
    public string CheckedBy { get; }
    public string SubmissionDate { get; }
    /// <summary>The checking engineer; empty when not given (the memo leaves a blank to fill in).</summary>
    public string Reviewer { get; }
    public string ReviewDate { get; }
    public string ToolVersion { get; }
    public string Source { get; }
    public string Verdict { get; }
    public string VerdictCode { get; }
    public string VerdictLine { get; }

    /// <summary>The running header of a printed page (reference, revision), as the text of a CSS string.</summary>
    public string RunningHeader { get; }

    /// <summary>The calculation's title for the running header, as the text of a CSS string.</summary>
    public string RunningTitle { get; }

    /// <summary>The verdict rule in one sentence (section 1).</summary>
    public string VerdictRule { get; }
    public string MomentUnit { get; }
    public string ForceUnit { get; }
    public string LengthUnit { get; }
    public string DisplacementUnit { get; }
    public string Convention { get; }
    public string AbsoluteTolerance { get; }
    public string RelativeTolerancePercent { get; }
    public string MinorTolerancePercent { get; }
    public string Axial { get; }
    public string Stiffness { get; }

    /// <summary>The equilibrium check every result passed (empty when the review carries no analysis).</summary>
    public string Verification { get; }
    public bool HasMovements { get; }
    public bool HasHinges { get; }
    public IReadOnlyList<MemoCase> Cases { get; }

    /// <summary>True when the memo carries drawings (HTML memos of an analysed review).</summary>
    public bool HasDiagrams { get; }

    /// <summary>Elevation of the structure as read; null without drawings.</summary>
    public MemoFigure? StructureFigure { get; }

    public IReadOnlyList<MemoComment> Comments { get; }
    public IReadOnlyList<string> Notes { get; }
    public IReadOnlyList<string> Warnings { get; }
    public IReadOnlyList<MemoPair> InfoRows { get; }
    public IReadOnlyList<MemoJoint> Joints { get; }
    public IReadOnlyList<MemoMember> Members { get; }
    public string IUnit { get; }
    public IReadOnlyList<MemoLoad> Loads { get; }
    public int ClaimCount { get; }
    public int ReactionClaimCount { get; }
    public int DisplacementClaimCount { get; }

    /// <summary>"Claims read: 12 end moments, 4 reaction rows, 0 displacement rows."</summary>
    public string ClaimsRead { get; }

    /// <summary>The load combinations as read.</summary>
    public IReadOnlyList<MemoCombination> Combinations { get; }

    public bool HasCombinations => Combinations.Count > 0;

    /// <summary>An elastic critical load factor was computed for at least one case.</summary>
    public bool HasSwayCheck { get; }

    /// <summary>The submission has combinations, span moments, shears or envelopes, so their checks of the claims ran too.</summary>
    public bool HasSectionChecks { get; }

    /// <summary>The comparison with the previous round when the review was recorded in a register (else <see cref="MemoRounds.None"/>).</summary>
    public MemoRounds Rounds { get; init; } = MemoRounds.None;

    /// <summary>The memo's format: a Markdown memo's values are made inert for Markdown viewers as they are written (<see cref="MarkdownText"/>).</summary>
    public MemoFormat Format { get; init; } = MemoFormat.Markdown;

    /// <summary>Appendices (the reference working table), as pre-rendered blocks by format.</summary>
    public IReadOnlyList<MemoAppendix> Appendices { get; init; } = [];

    /// <summary>
    /// The findings listed under a comment. A diagnosed mistake's comment already gives the corrected figures, so its
    /// differing end moments are summed up in one line (section 2 and the JSON list them one by one); its other
    /// findings are listed.
    /// </summary>
    private static List<MemoSymptom> Symptoms(ReviewComment cm)
    {
        var all = cm.Symptoms.Select(y => new MemoSymptom(y.Kind, y.Case, y.Severity.Json(), y.Place.Words, y.Text, y.Source)).ToList();
        var ends = cm.Symptoms.Where(y => y.Kind == "end-moment").ToList();
        if (cm.Cause is null || ends.Count <= 2) return all;
        var worst = ends.Max(y => y.Severity).Json();
        string cases = string.Join(", ", ends.Select(y => y.Case).Distinct());
        var summary = new MemoSymptom("end-moment", cases, worst, "", $"{Words.Count(ends.Count, "claimed end moment")} of case {cases} differ from the analysis (section 2)",
            SourceRef.Span(ends.Select(y => new SourceRef(y.Source))));
        return [summary, .. all.Where(y => y.Kind != "end-moment")];
    }

    /// <summary>
    /// The counts behind the verdict, adding up: every claimed or expected end is agree, minor, discrepant or missing
    /// (unmatched claims are counted apart), then the comments by severity.
    /// </summary>
    private static string VerdictSentence(ReviewResult review)
    {
        var ends = review.AllEndMoments.ToList();
        int Count(EndStatus st) => ends.Count(e => e.Status == st);
        int agree = Count(EndStatus.Agree), minor = Count(EndStatus.Minor), discrepant = Count(EndStatus.Discrepant), missing = Count(EndStatus.Missing);
        int unmatched = Count(EndStatus.Unmatched), compared = agree + minor + discrepant + missing;
        int majors = review.Comments.Count(c => c.Severity == Severity.Major), minors = review.Comments.Count(c => c.Severity == Severity.Minor);
        string sentence = string.Create(CultureInfo.InvariantCulture,
            $"Of {Words.Count(compared, "member-end moment")} compared with the independent analysis, {agree} agree{(agree == 1 ? "s" : "")}, {minor} differ{(minor == 1 ? "s" : "")} slightly (minor), {discrepant} {Words.Is(discrepant)} discrepant and {missing} {Words.Is(missing)} missing from the claims.");
        if (unmatched > 0) sentence += $" {Words.Count(unmatched, "claim")} name{(unmatched == 1 ? "s" : "")} an end the model does not have.";
        var others = review.Cases.SelectMany(c => c.SpanMoments.Select(x => x.Status).Concat(c.Shears.Select(x => x.Status))
            .Concat(c.Envelope.Select(x => x.Side == EnvelopeSide.Safe ? EndStatus.Agree : x.Status))).ToList();
        if (others.Count > 0)
        {
            int oa = others.Count(x => x == EndStatus.Agree), om = others.Count(x => x == EndStatus.Minor), od = others.Count(x => x == EndStatus.Discrepant);
            int safe = review.Cases.Sum(c => c.Envelope.Count(x => x.Side == EnvelopeSide.Safe));
            sentence += string.Create(CultureInfo.InvariantCulture,
                $" Of {Words.Count(others.Count - others.Count(x => x == EndStatus.Unmatched), "span moment, shear and envelope figure")} compared, {oa} agree{(oa == 1 ? "s" : "")}{(safe > 0 ? $" ({safe} on the safe side of the envelope)" : "")}, {om} {Words.Is(om)} minor and {od} {Words.Is(od)} discrepant.");
        }
        sentence += majors + minors == 0 ? " The schedule has no comments." : $" The schedule has {Words.Count(majors, "major comment")} and {Words.Count(minors, "minor comment")}.";
        return sentence;
    }

    /// <summary>
    /// Text for the inside of a double-quoted CSS string in a style sheet: quotes and backslashes escaped, <c>&lt;</c>
    /// written as an escape (so that no <c>&lt;/style&gt;</c> can close the sheet), control characters dropped.
    /// </summary>
    internal static string CssString(string text)
    {
        var sb = new System.Text.StringBuilder(text.Length);
        foreach (char ch in text)
        {
            if (char.IsControl(ch)) { sb.Append(' '); continue; }
            sb.Append(ch switch { '\\' => "\\\\", '"' => "\\\"", '<' => "\\3C ", '>' => "\\3E ", _ => ch.ToString() });
        }
        return sb.ToString();
    }

    private static string RestraintWord(Restraint r) => r switch
    {
        Restraint.Free => "free",
        Restraint.Fixed => "fixed",
        Restraint.Pinned => "pinned",
        Restraint.Roller => "roller",
        Restraint.Guided => "guided",
        _ => r.ToString().ToLowerInvariant(),
    };

    private static string Movement(SupportMovement mv, DisplayUnits u)
    {
        var parts = new List<string>();
        if (mv.X != 0) parts.Add($"x {Fmt.Number(u.Displacement.FromSi(mv.X), "0.###")} {u.Displacement.Symbol}");
        if (mv.Y != 0) parts.Add($"y {Fmt.Number(u.Displacement.FromSi(mv.Y), "0.###")} {u.Displacement.Symbol}");
        if (mv.Rotation != 0) parts.Add($"rotation {Fmt.Number(mv.Rotation, "0.######")} rad");
        return string.Join(", ", parts);
    }

    private static MemoLoad Load(Load l, DisplayUnits u)
    {
        string F(double v) => $"{Fmt.Number(u.Force.FromSi(v), "0.###")} {u.Force.Symbol}";
        string W(double v) => $"{Fmt.Number(u.Force.FromSi(v) * u.Length.ToSi, "0.###")} {u.Force.Symbol}/{u.Length.Symbol}";
        string Lg(double v) => $"{Fmt.Number(u.Length.FromSi(v), "0.###")} {u.Length.Symbol}";
        string M(double v) => $"{Fmt.Number(u.Moment.FromSi(v), "0.###")} {u.Moment.Symbol}";
        string Dir(LoadDirection d) => d.ToString().ToLowerInvariant();
        return l switch
        {
            PointLoad p => new MemoLoad(l.Case, p.Member, "point", $"P = {F(p.P)} {Dir(p.Direction)} at a = {Lg(p.A)}", l.Source.Citation),
            DistributedLoad d when d.IsUniform => new MemoLoad(l.Case, d.Member, "udl", $"w = {W(d.WStart)} {Dir(d.Direction)} from {Lg(d.A)} to {Lg(d.B)}", l.Source.Citation),
            DistributedLoad d => new MemoLoad(l.Case, d.Member, "linear", $"w = {W(d.WStart)} to {W(d.WEnd)} {Dir(d.Direction)} from {Lg(d.A)} to {Lg(d.B)}", l.Source.Citation),
            MemberCouple c => new MemoLoad(l.Case, c.Member, "moment", $"M = {M(c.M)} clockwise at a = {Lg(c.A)}", l.Source.Citation),
            JointForce f => new MemoLoad(l.Case, f.Joint, "force", $"P = {F(f.P)} {Dir(f.Direction)}", l.Source.Citation),
            JointCouple c => new MemoLoad(l.Case, c.Joint, "moment", $"M = {M(c.M)} clockwise", l.Source.Citation),
            _ => new MemoLoad(l.Case, "?", "?", "", l.Source.Citation),
        };
    }
}

public sealed record MemoPair(string Key, string Value);

public sealed record MemoJoint(string Id, string X, string Y, string Restraint, string Movement, string Source);

public sealed record MemoMember(string Id, string Start, string End, string Length, string EGPa, string I, string Amm2, string Hinge, string Source);

public sealed record MemoLoad(string Case, string On, string Kind, string Values, string Source);

public sealed record MemoComment(string Id, string Severity, string Case, string Where, string Text, string Source)
{
    /// <summary>The diagnosed mistake in the trade's words, or empty.</summary>
    public string Cause { get; init; } = "";

    /// <summary>The findings the comment stands for.</summary>
    public IReadOnlyList<MemoSymptom> Symptoms { get; init; } = [];
}

/// <summary>A finding listed under a comment.</summary>
public sealed record MemoSymptom(string Kind, string Case, string Severity, string Where, string Text, string Source);

public sealed record MemoRow(string Member, string At, string Claimed, string Recomputed, string Difference, string Status, string Source);

public sealed record MemoQuantity(string Joint, string Component, string Unit, string Claimed, string Recomputed, string Status, string Source);

public sealed record MemoFlag(string Kind, string Severity, string Where, string Message, string Source);

public sealed record MemoCause(string Code, string Confidence, string Explains, string Message, string Evidence)
{
    /// <summary>The mistake in the trade's words.</summary>
    public string Title { get; init; } = "";

    /// <summary>
    /// The claims the cause was found from when they are not the end moments alone: "span moments", "envelope", "end moments, span
    /// moments and shears" (the same mistake found from several tables is one cause); empty for end moments alone.
    /// </summary>
    public string FoundFrom { get; init; } = "";
}

/// <summary>An appendix of the memo (the reference working table), already rendered for Markdown and HTML.</summary>
public sealed record MemoAppendix(string Title, string Markdown, string Html);
