using System.Collections.Frozen;

namespace CrossCheck.Review;

/// <summary>What a cause code means to the people who read it, in one row of <see cref="ReviewTerms"/>.</summary>
/// <param name="Code">The contract code (JSON, register, screen grouping), e.g. <c>sway-omitted</c>.</param>
/// <param name="Prefix">The start of the comment id of a comment about this mistake, e.g. <c>SO</c>.</param>
/// <param name="Title">The mistake in the trade's words, for headings: "sidesway ignored".</param>
/// <param name="Systematic">
/// True for a mistake of method or model that reproduces a whole pattern of claims (sidesway ignored, I for I/L); false
/// for a slip that can reproduce any single wrong number by construction (an arithmetic slip in the working, a copying
/// slip). When both explain the same claims the systematic mistake is the one the designer must hear.
/// </param>
public sealed record CauseTerm(string Code, string Prefix, string Title, bool Systematic);

/// <summary>The words of a flag kind: its contract code, comment-id prefix and heading.</summary>
public sealed record FlagTerm(string Code, string Prefix, string Title);

/// <summary>
/// The one table of the review's closed vocabularies: statuses, severities, flag kinds, cause codes and verdicts, with
/// the words the JSON, the memo, the terminal, the screen summary and the register use for each. Every member of every
/// enumeration has a row (a test checks it), so a new kind cannot be labelled as another by a catch-all.
/// </summary>
public static class ReviewTerms
{
    private static readonly FrozenDictionary<FlagKind, FlagTerm> Flags = new Dictionary<FlagKind, FlagTerm>
    {
        [FlagKind.EndMoment] = new("end-moment", "EX", "end moment"),
        [FlagKind.JointEquilibrium] = new("joint-equilibrium", "EQ", "joint equilibrium"),
        [FlagKind.ReleasedEnd] = new("released-end", "RL", "released end"),
        [FlagKind.StoreyShear] = new("storey-shear", "SW", "storey shear"),
        [FlagKind.Reaction] = new("reaction", "RX", "reactions"),
        [FlagKind.Displacement] = new("displacement", "DX", "displacements"),
        [FlagKind.Symmetry] = new("symmetry", "SY", "symmetry"),
        [FlagKind.Compatibility] = new("compatibility", "CP", "compatibility"),
        [FlagKind.DistributionTable] = new("distribution-table", "MD", "distribution table"),
        [FlagKind.Conditioning] = new("conditioning", "ST", "conditioning"),
        [FlagKind.Superposition] = new("superposition", "CB", "superposition of combinations"),
        [FlagKind.SpanStatics] = new("span-statics", "MS", "span moment by statics"),
        [FlagKind.ShearStatics] = new("shear-statics", "VS", "end shear by statics"),
        [FlagKind.Envelope] = new("envelope", "EV", "envelope"),
        [FlagKind.SecondOrder] = new("second-order", "AC", "second-order effects"),
        [FlagKind.SpanMoment] = new("span-moment", "SP", "span moment"),
    }.ToFrozenDictionary();

    private static readonly FrozenDictionary<CauseCode, CauseTerm> Causes = new Dictionary<CauseCode, CauseTerm>
    {
        [CauseCode.SwayOmitted] = new("sway-omitted", "SO", "sidesway ignored", true),
        [CauseCode.StiffnessWithoutLength] = new("stiffness-without-length", "KL", "stiffness taken as I instead of I/L", true),
        [CauseCode.FarEndFixity] = new("far-end-fixity", "FX", "support fixity mistaken", true),
        [CauseCode.FixedEndMoment] = new("fixed-end-moment", "FEM", "wrong fixed-end moment", true),
        [CauseCode.CarryOver] = new("carry-over", "CO", "wrong carry-over factor", true),
        [CauseCode.StoppedEarly] = new("stopped-early", "SE", "distribution stopped too early", true),
        [CauseCode.SignConvention] = new("sign-convention", "SC", "sign convention mixed up", true),
        [CauseCode.EndsSwapped] = new("ends-swapped", "ES", "member ends swapped", true),
        [CauseCode.UnitScale] = new("unit-scale", "UN", "unit mixed up", true),
        [CauseCode.LoadMisplaced] = new("load-misplaced", "LD", "load misplaced or left out", true),
        [CauseCode.HingeIgnored] = new("hinge-ignored", "HG", "hinge ignored", true),
        [CauseCode.SettlementIgnored] = new("settlement-ignored", "SM", "support movement ignored", true),
        [CauseCode.DistributionArithmetic] = new("distribution-arithmetic", "MD", "arithmetic slip in the distribution table", false),
        [CauseCode.CopyingSlip] = new("copying-slip", "CS", "figure miscopied", false),
        [CauseCode.CombinationFactor] = new("combination-factor", "CF", "wrong factor in a combination", true),
        [CauseCode.CombinationCaseMissing] = new("combination-case-missing", "CM", "load case left out of a combination", true),
        [CauseCode.PatternIgnored] = new("pattern-ignored", "PI", "pattern loading ignored", true),
        [CauseCode.MidspanNotMaximum] = new("midspan-not-maximum", "MX", "span moment taken at mid-span", true),
        [CauseCode.FreeMoment] = new("free-moment", "FM", "continuity ignored in the span moment", true),
        [CauseCode.ShearWithoutMoment] = new("shear-without-moment", "VM", "end moments ignored in the shears", true),
    }.ToFrozenDictionary();

    private static readonly FrozenDictionary<Verdict, (string Code, string Words)> Verdicts = new Dictionary<Verdict, (string, string)>
    {
        [Verdict.Concur] = ("concur", "Concur"),
        [Verdict.ConcurWithComments] = ("concur-with-comments", "Concur with comments"),
        [Verdict.Revise] = ("revise", "Revise and resubmit"),
    }.ToFrozenDictionary();

    private static readonly FrozenDictionary<EndStatus, string> Statuses = new Dictionary<EndStatus, string>
    {
        [EndStatus.Agree] = "agree",
        [EndStatus.Minor] = "minor",
        [EndStatus.Discrepant] = "discrepant",
        [EndStatus.Missing] = "missing",
        [EndStatus.Unmatched] = "unmatched",
    }.ToFrozenDictionary();

    private static readonly FrozenDictionary<Severity, string> Severities = new Dictionary<Severity, string>
    {
        [Severity.Info] = "info",
        [Severity.Minor] = "minor",
        [Severity.Major] = "major",
    }.ToFrozenDictionary();

    private static readonly FrozenDictionary<string, CauseCode> CauseByCode = Causes.ToFrozenDictionary(kv => kv.Value.Code, kv => kv.Key, StringComparer.Ordinal);

    public static FlagTerm Term(this FlagKind kind) => Lookup(Flags, kind);

    public static CauseTerm Term(this CauseCode code) => Lookup(Causes, code);

    /// <summary>The contract code of a flag kind: <c>joint-equilibrium</c>.</summary>
    public static string Json(this FlagKind kind) => kind.Term().Code;

    /// <summary>The contract code of a cause: <c>sway-omitted</c>.</summary>
    public static string Json(this CauseCode code) => code.Term().Code;

    public static string Json(this EndStatus status) => Lookup(Statuses, status);

    public static string Json(this Severity severity) => Lookup(Severities, severity);

    /// <summary>The contract code of a verdict: <c>concur-with-comments</c>. Also the word the terminal, the screen and the register print.</summary>
    public static string Json(this Verdict verdict) => Lookup(Verdicts, verdict).Code;

    /// <summary>The verdict in words for a memo heading: "Concur with comments".</summary>
    public static string Words(this Verdict verdict) => Lookup(Verdicts, verdict).Words;

    /// <summary>The cause with this contract code, if there is one (reading a register or a JSON back).</summary>
    public static bool TryParseCause(string code, out CauseCode cause) => CauseByCode.TryGetValue(code, out cause);

    /// <summary>Every cause code of the contract, in declaration order.</summary>
    public static IEnumerable<CauseTerm> AllCauses => Enum.GetValues<CauseCode>().Select(c => c.Term());

    /// <summary>Every flag kind of the contract, in declaration order.</summary>
    public static IEnumerable<FlagTerm> AllFlags => Enum.GetValues<FlagKind>().Select(k => k.Term());

    private static TValue Lookup<TKey, TValue>(FrozenDictionary<TKey, TValue> table, TKey key) where TKey : notnull =>
        table.TryGetValue(key, out var value) ? value : throw new ArgumentOutOfRangeException(nameof(key), key, $"No words for {typeof(TKey).Name}.{key}.");
}
