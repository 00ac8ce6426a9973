using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The thresholds of the numerical sanity layer: when a stiffness matrix counts as ill-conditioned, and how far from
/// equilibrium recovered forces may be before an analysis is not trusted. One place, so that the solver, the review
/// and the documentation agree.
/// </summary>
public static class NumericalLimits
{
    /// <summary>A member this many times stiffer (EI/L, or EA/L) than a member it meets is reported.</summary>
    public const double StiffnessContrast = 1e6;

    /// <summary>
    /// A condition number of the stiffness matrix above this is reported (<see cref="NumericalReport.ConditionEstimate"/>:
    /// a 1-norm estimate, translations measured in the mean member length). An elimination without scaling loses about
    /// log₁₀ κ of the 16 significant digits of double precision; above 10¹⁰ fewer than 6 would be left, too few to
    /// trust a comparison at the review's 10⁻² band with the equilibrium check's 10⁻⁶ margin. CrossCheck scales the
    /// matrix before factorising and verifies every result by equilibrium, so it loses fewer; a spread this wide is
    /// reported because in practice it is a typing or unit slip in E, I or A. Ordinary frames stay below about 10⁵.
    /// </summary>
    public const double ConditionEstimate = 1e10;

    /// <summary>
    /// A smallest pivot of the (Jacobi-scaled) factorisation below this fraction of its diagonal entry is reported: the
    /// scaled matrix itself is then nearly singular, whatever the condition number of the unscaled one.
    /// </summary>
    public const double SmallestPivotRatio = 1e-10;

    /// <summary>
    /// Largest out-of-balance force (or moment) at a free joint direction, or of the whole structure, as a fraction
    /// of the applied loads, for results to be trusted. Sound analyses stay below about 10⁻¹²; the review's own
    /// agreement band is 10⁻², so 10⁻⁶ leaves four orders of magnitude either side.
    /// </summary>
    public const double EquilibriumResidual = 1e-6;
}

/// <summary>The largest stiffness ratio between two members meeting at a joint.</summary>
/// <param name="Ratio">Stiffness of <paramref name="Stiffer"/> over that of <paramref name="Softer"/> (≥ 1).</param>
/// <param name="Stiffer">Id of the stiffer member.</param>
/// <param name="Softer">Id of the softer member.</param>
/// <param name="Joint">The joint where they meet.</param>
/// <param name="Measure"><c>EI/L</c> (bending) or <c>EA/L</c> (axial, elastic members only).</param>
public sealed record StiffnessContrast(double Ratio, string Stiffer, string Softer, string Joint, string Measure)
{
    /// <summary>The largest contrast between members that share a joint; null when no two members meet.</summary>
    public static StiffnessContrast? Of(StructureModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        StiffnessContrast? worst = null;
        void Consider(Joint joint, Func<Member, double> stiffness, string measure)
        {
            Member? hi = null, lo = null;
            double kHi = 0, kLo = double.PositiveInfinity;
            foreach (var m in model.MembersAt(joint.Id))
            {
                double k = stiffness(m);
                if (!(k > 0) || !double.IsFinite(k)) continue;
                if (k > kHi) { kHi = k; hi = m; }
                if (k < kLo) { kLo = k; lo = m; }
            }
            if (hi is null || lo is null || hi == lo) return;
            double ratio = kHi / kLo;
            if (worst is null || ratio > worst.Ratio) worst = new StiffnessContrast(ratio, hi.Id, lo.Id, joint.Id, measure);
        }
        foreach (var joint in model.Joints)
        {
            Consider(joint, m => m.E * m.I / model.Length(m), "EI/L");
            if (model.Axial == AxialBehaviour.Elastic) Consider(joint, m => m.E * (m.A ?? 0) / model.Length(m), "EA/L");
        }
        return worst;
    }
}

/// <summary>How far the recovered forces of one load case are from equilibrium, as fractions of the applied loads.</summary>
/// <param name="Case">The load case.</param>
/// <param name="Joint">Largest out-of-balance force or moment at a joint direction no support or hold restrains.</param>
/// <param name="AtJoint">Where <paramref name="Joint"/> occurs (null when it is zero).</param>
/// <param name="Direction"><c>x</c>, <c>y</c> or <c>rotation</c>.</param>
/// <param name="Global">Largest of ΣFx, ΣFy and ΣM over the whole structure (loads and reactions).</param>
public sealed record CaseEquilibrium(string Case, double Joint, string? AtJoint, string? Direction, double Global)
{
    public double Worst => Math.Max(Joint, Global);

    public bool Trusted => Worst <= NumericalLimits.EquilibriumResidual;
}

/// <summary>
/// The numerical sanity of an analysis: how well conditioned its stiffness matrix was and how closely every case's
/// recovered forces satisfy equilibrium at every joint and for the structure as a whole.
/// </summary>
/// <param name="ConditionEstimate">
/// The condition number κ₁ = ‖K̃‖₁·‖K̃⁻¹‖₁ of the reduced stiffness matrix, estimated by Hager's method as refined by
/// Higham from a few solves with the factorisation already made (a lower bound, usually exact or within a factor of 3).
/// K̃ is the stiffness matrix with translations measured in units of the mean member length, so that every entry is a
/// moment: the number measures how far apart the structure's stiffnesses are, not a mix of units, and grows in
/// proportion to the contrast between a very stiff member and the rest. (It replaces the reciprocal of the smallest
/// scaled pivot, which stays near 1 when one member is far stiffer than its neighbours; that indicator is
/// <see cref="SmallestPivotRatio"/>.)
/// </param>
/// <param name="Contrast">The largest stiffness ratio between members meeting at a joint.</param>
/// <param name="Cases">The equilibrium residual of every case.</param>
public sealed record NumericalReport(double ConditionEstimate, StiffnessContrast? Contrast, IReadOnlyList<CaseEquilibrium> Cases)
{
    /// <summary>
    /// Smallest pivot of the factorisation divided by its diagonal entry (the factorisations work on a Jacobi-scaled
    /// copy): near zero means the scaled matrix itself is nearly singular. 1 when not known.
    /// </summary>
    public double SmallestPivotRatio { get; init; } = 1;

    /// <summary>
    /// The condition number exceeds <see cref="NumericalLimits.ConditionEstimate"/>, the scaled factorisation met a
    /// pivot below <see cref="NumericalLimits.SmallestPivotRatio"/>, or the stiffnesses of neighbouring members differ by
    /// more than <see cref="NumericalLimits.StiffnessContrast"/>.
    /// </summary>
    public bool IllConditioned => ConditionEstimate > NumericalLimits.ConditionEstimate || SmallestPivotRatio < NumericalLimits.SmallestPivotRatio
                                  || Contrast?.Ratio >= NumericalLimits.StiffnessContrast;

    /// <summary>The worst case residual (0 when there are no cases).</summary>
    public CaseEquilibrium? WorstCase => Cases.OrderByDescending(c => c.Worst).FirstOrDefault();

    public double WorstResidual => WorstCase?.Worst ?? 0;

    /// <summary>Every case is in equilibrium within <see cref="NumericalLimits.EquilibriumResidual"/>.</summary>
    public bool Trusted => Cases.All(c => c.Trusted);

    /// <summary>
    /// One sentence on an ill-conditioned analysis for the reviewer: the contrast and the condition number, and that
    /// the results passed the equilibrium check.
    /// </summary>
    public string Describe()
    {
        string head = Contrast is { } k && k.Ratio >= NumericalLimits.StiffnessContrast
            ? $"Member {k.Stiffer} is {Scientific(k.Ratio)} times stiffer ({k.Measure}) than member {k.Softer}, which meets it at joint {k.Joint}"
            : "The stiffness matrix is ill-conditioned";
        return $"{head} (condition number of the stiffness matrix about {Scientific(ConditionEstimate)}). Every result was verified by equilibrium " +
               $"(largest out-of-balance {Words(WorstResidual)} of the applied loads), but stiffnesses this different are usually a typing or unit error in E, I or A.";
    }

    /// <summary>A residual in words: <c>below 10⁻¹⁰</c> for sound analyses (so that memos do not show round-off), else <c>3.2×10⁻⁷</c>.</summary>
    public static string Words(double residual) =>
        residual < 1e-10 ? "below 10⁻¹⁰" : Scientific(residual);

    /// <summary><c>2.3×10⁶</c>.</summary>
    public static string Scientific(double v)
    {
        if (v == 0 || !double.IsFinite(v)) return v.ToString("0", CultureInfo.InvariantCulture);
        int exp = (int)Math.Floor(Math.Log10(Math.Abs(v)));
        double mant = v / Math.Pow(10, exp);
        if (Math.Round(mant, 1) >= 10) { mant /= 10; exp++; }
        string m = mant.ToString("0.#", CultureInfo.InvariantCulture);
        return exp == 0 ? m : $"{(m == "1" ? "" : m + "×")}10{Superscript(exp)}";
    }

    private static string Superscript(int n)
    {
        const string digits = "⁰¹²³⁴⁵⁶⁷⁸⁹";
        string s = Math.Abs(n).ToString(CultureInfo.InvariantCulture);
        var chars = s.Select(c => digits[c - '0']);
        return (n < 0 ? "⁻" : "") + string.Concat(chars);
    }
}
