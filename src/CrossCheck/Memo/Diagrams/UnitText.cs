using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Memo.Diagrams;

/// <summary>Numbers for drawings, in the submission's own units.</summary>
internal sealed class UnitText(DisplayUnits units)
{
    public DisplayUnits Units { get; } = units;

    public string Length(double metres) => $"{Fmt.Number(Units.Length.FromSi(metres), "0.###")} {Units.Length.Symbol}";

    public string Force(double newtons) => $"{Fmt.Number(Units.Force.FromSi(newtons), "0.##")} {Units.Force.Symbol}";

    public string LineLoad(double newtonsPerMetre) => Fmt.Number(Units.Force.FromSi(newtonsPerMetre) * Units.Length.ToSi, "0.##");

    public string LineLoadUnit => $"{Units.Force.Symbol}/{Units.Length.Symbol}";

    public string Couple(double newtonMetres) => $"{Fmt.Number(Units.Moment.FromSi(Math.Abs(newtonMetres)), "0.##")} {Units.Moment.Symbol}";

    /// <summary>A moment magnitude with the precision the case's peak calls for.</summary>
    public string MomentMagnitude(double newtonMetres, double peak) => Fmt.Number(Units.Moment.FromSi(Math.Abs(newtonMetres)), MomentFormat(peak));

    /// <summary>Three significant figures or one decimal, whichever is finer, judged on the peak in display units.</summary>
    public string MomentFormat(double peakSi)
    {
        double p = Units.Moment.FromSi(Math.Abs(peakSi));
        return p < 10 ? "0.00" : p < 10000 ? "0.0" : "0";
    }

    public string Movement(SupportMovement mv)
    {
        var parts = new List<string>();
        if (mv.X != 0) parts.Add($"Δx {Fmt.Number(Units.Displacement.FromSi(mv.X), "+0.###;−0.###")} {Units.Displacement.Symbol}");
        if (mv.Y != 0) parts.Add($"Δy {Fmt.Number(Units.Displacement.FromSi(mv.Y), "+0.###;−0.###")} {Units.Displacement.Symbol}");
        if (mv.Rotation != 0) parts.Add($"θ {Fmt.Number(mv.Rotation, "+0.######;−0.######")} rad");
        return string.Join(", ", parts);
    }
}
