using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// How the review quotes numbers to the author: every figure attributed to the submission exactly as it was written
/// (the printed text, in the author's convention), CrossCheck's own figures in the author's units and convention, and
/// units in the spelling the trade prints (kN·m). Internal values (SI, clockwise) never reach a sentence.
/// </summary>
public sealed class Quoting
{
    private readonly SubmissionInfo _info;

    public Quoting(Submission submission)
    {
        ArgumentNullException.ThrowIfNull(submission);
        _info = submission.Info;
    }

    /// <summary>The convention the submission's moments are written in.</summary>
    public SignConvention Convention => _info.SignConvention;

    /// <summary>True when the submission does not state its convention and the default (clockwise) was assumed.</summary>
    public bool ConventionAssumed => !_info.SignConventionStated;

    public UnitChoice MomentUnit => _info.Units.Moment;

    /// <summary>A claimed end moment as written: <c>141.7 kN·m</c>.</summary>
    public string Claim(ClaimedEndMoment claim) => $"{ClaimNumber(claim)} {MomentUnit.Symbol}";

    /// <summary>The number of a claimed end moment as written: <c>141.7</c>, <c>−90.7</c>.</summary>
    public static string ClaimNumber(ClaimedEndMoment claim)
    {
        ArgumentNullException.ThrowIfNull(claim);
        return claim.Source.Text is { Length: > 0 } t && t.Any(char.IsAsciiDigit) ? t.Trim() : Fmt.Number(claim.AsWritten, "0.0##");
    }

    /// <summary>A figure of any table as written: the cell's text when it holds digits, else the value read (in the author's unit).</summary>
    public static string Written(SourceRef? source, double asWritten) =>
        source?.Text is { Length: > 0 } t && t.Any(char.IsAsciiDigit) ? t.Trim() : Fmt.Number(asWritten, "0.0##");

    /// <summary>A claimed span moment as written: <c>82.9 kN·m</c> (span moments are sagging positive in every submission).</summary>
    public string Claim(ClaimedSpanMoment claim)
    {
        ArgumentNullException.ThrowIfNull(claim);
        return $"{Written(claim.Source, claim.AsWritten)} {MomentUnit.Symbol}";
    }

    /// <summary>A claimed end shear as written: <c>73.7 kN</c>.</summary>
    public string Claim(ClaimedShear claim)
    {
        ArgumentNullException.ThrowIfNull(claim);
        return $"{Written(claim.Source, claim.AsWritten)} {_info.Units.Force.Symbol}";
    }

    /// <summary>A bending moment that is no member-end moment (a span moment, sagging positive), in the author's unit: <c>82.94 kN·m</c>.</summary>
    public string SpanMoment(double si) => $"{Fmt.Number(MomentUnit.FromSi(si), "0.0#")} {MomentUnit.Symbol}";

    /// <summary>A clockwise member-end moment (N·m) in the author's unit and convention: <c>114.73 kN·m</c>.</summary>
    public string EndMoment(double clockwise, MemberEnd end) => $"{EndNumber(clockwise, end)} {MomentUnit.Symbol}";

    /// <summary>The number of <see cref="EndMoment"/> alone.</summary>
    public string EndNumber(double clockwise, MemberEnd end) => Fmt.Number(MomentUnit.FromSi(Convention.FromClockwise(clockwise, end)), "0.0#");

    /// <summary>A moment that belongs to no member end (an unbalance, a couple, a statical moment): <c>27.0 kN·m</c>.</summary>
    public string Moment(double si) => $"{Fmt.Number(MomentUnit.FromSi(si), "0.0#")} {MomentUnit.Symbol}";

    /// <summary>A force: <c>12.5 kN</c>.</summary>
    public string Force(double si) => $"{Fmt.Number(_info.Units.Force.FromSi(si), "0.0#")} {_info.Units.Force.Symbol}";

    /// <summary>A load's force as a designer writes it: <c>40 kN</c>, <c>12.5 kN</c>.</summary>
    public string LoadForce(double si) => $"{Fmt.Number(_info.Units.Force.FromSi(si), "0.###")} {_info.Units.Force.Symbol}";

    /// <summary>A length: <c>4 m</c>.</summary>
    public string Length(double si) => $"{Fmt.Number(_info.Units.Length.FromSi(si), "0.###")} {_info.Units.Length.Symbol}";

    /// <summary>A line load: <c>14 kN/m</c>.</summary>
    public string LineLoad(double si) =>
        $"{Fmt.Number(_info.Units.Force.FromSi(si) * _info.Units.Length.ToSi, "0.###")} {_info.Units.Force.Symbol}/{_info.Units.Length.Symbol}";

    /// <summary>A reaction or displacement component in its unit: <c>41.7 kN</c>, <c>-3.2 mm</c>, <c>0.0012 rad</c>.</summary>
    public string Component(string component, double si, bool reaction)
    {
        var unit = UnitOf(component, reaction);
        return $"{Fmt.Number(unit.FromSi(si), component == "rotation" ? "0.0#####" : "0.0###")} {unit.Symbol}";
    }

    /// <summary>The unit of a reaction or displacement component.</summary>
    public UnitChoice UnitOf(string component, bool reaction) =>
        reaction ? (component == "M" ? _info.Units.Moment : _info.Units.Force)
            : component == "rotation" ? new UnitChoice("rad", 1) : _info.Units.Displacement;

    /// <summary>The convention in a few words for a bracket after figures: "kN·m, clockwise on the member end (assumed: not stated)".</summary>
    /// <summary>The convention alone: "clockwise on the member end", with the assumption when there is one.</summary>
    public string ConventionWords => $"{Convention.Short()}{(ConventionAssumed ? ", assumed as the submission states no convention" : "")}";

    public string ConventionNote => $"{MomentUnit.Symbol}, {Convention.Short()}{(ConventionAssumed ? ", assumed as the submission states no convention" : "")}";
}
