namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// The look of the memo drawings. Every distinction is carried by shape, line weight or dash as well as by colour,
/// so the drawings read the same printed in grey: the recomputed diagram is a light tint with a solid outline, the
/// diagram implied by the claims is dashed, and the claim markers differ in shape (diamond, triangle, ringed cross,
/// square) rather than in colour alone.
/// </summary>
internal static class DiagramStyle
{
    public const string Font = "'DejaVu Sans', 'Segoe UI', Helvetica, Arial, sans-serif";

    public const string Ink = "#1d2a33";
    public const string Muted = "#6b7780";
    public const string Faint = "#aeb8be";
    public const string Ground = "#cfd6da";
    public const string Paper = "#ffffff";

    /// <summary>Recomputed bending moment: a teal outline over a pale tint (prints as a light grey area, dark edge).</summary>
    public const string Moment = "#2f6f73";
    public const string MomentFill = "#d6e8e6";

    /// <summary>Loads: a slate blue, drawn with thinner lines than the members.</summary>
    public const string Load = "#3d4f7c";

    /// <summary>Findings, matching the memo's status colours.</summary>
    public const string Minor = "#8a5a00";
    public const string Major = "#8f2424";

    public const double MemberWeight = 2.4;
    public const double FaintMemberWeight = 1.6;
    public const double OutlineWeight = 1.4;
    public const double LoadWeight = 1.1;

    public const double LabelSize = 11;
    public const double JointLabelSize = 12.5;
    public const double SmallSize = 9.5;

    /// <summary>Estimated advance of a text in px (DejaVu Sans is wide; bold a little wider), for placing labels.</summary>
    public static double TextWidth(string text, double size, bool bold = false)
    {
        double em = 0;
        foreach (char c in text)
            em += c switch
            {
                ' ' => 0.32,
                '.' or ',' or ':' or ';' or '\'' or 'i' or 'l' or 'j' or '|' => 0.3,
                '(' or ')' or 'f' or 't' or 'r' => 0.42,
                >= '0' and <= '9' => 0.64,
                >= 'A' and <= 'Z' => 0.72,
                'm' or 'w' or 'M' or 'W' => 0.92,
                _ => 0.61,
            };
        return Math.Max(0.6, em) * size * (bold ? 1.1 : 1.0);
    }
}
