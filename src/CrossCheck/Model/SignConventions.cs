namespace CrossCheck.Model;

/// <summary>
/// The one place where member-end moments change sign convention. Inside the library every member-end moment is
/// clockwise on the member end; a submission may state its moments as internal bending moments (sagging positive).
/// </summary>
/// <remarks>
/// At a member's start the internal moment (positive when the right-hand fibre, looking from start to end, is in
/// tension) equals the clockwise end moment; at its end it is the negative. A fixed-end beam under gravity load:
/// −wL²/12 at both ends as internal moments, −wL²/12 and +wL²/12 clockwise (common practice; see
/// docs/REFERENCE-CHECKS.md, "Sign conventions").
/// </remarks>
public static class SignConventions
{
    /// <summary>A moment written in <paramref name="convention"/> at <paramref name="end"/>, as a clockwise member-end moment.</summary>
    public static double ToClockwise(this SignConvention convention, double written, MemberEnd end) =>
        convention == SignConvention.Sagging && end == MemberEnd.End ? -written : written;

    /// <summary>A clockwise member-end moment at <paramref name="end"/>, as it is written in <paramref name="convention"/>.</summary>
    public static double FromClockwise(this SignConvention convention, double clockwise, MemberEnd end) =>
        convention == SignConvention.Sagging && end == MemberEnd.End ? -clockwise : clockwise;

    /// <summary>The contract's word: <c>clockwise</c> or <c>sagging</c>.</summary>
    public static string Code(this SignConvention convention) => convention switch
    {
        SignConvention.Clockwise => "clockwise",
        SignConvention.Sagging => "sagging",
        _ => throw new ArgumentOutOfRangeException(nameof(convention), convention, null),
    };

    /// <summary>Short words for a quoted figure: "clockwise on the member end", "sagging positive".</summary>
    public static string Short(this SignConvention convention) => convention switch
    {
        SignConvention.Clockwise => "clockwise on the member end",
        SignConvention.Sagging => "sagging positive",
        _ => throw new ArgumentOutOfRangeException(nameof(convention), convention, null),
    };

    /// <summary>The other convention.</summary>
    public static SignConvention Other(this SignConvention convention) =>
        convention == SignConvention.Sagging ? SignConvention.Clockwise : SignConvention.Sagging;
}
