using CrossCheck.Model;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Analysis;

/// <summary>
/// The sway correction of moment distribution: one sway case per independent translation that turns a member's
/// chord, each distributed with the joints free to rotate, superposed so that every storey equation (virtual work of
/// the end moments and the loads in that sway) is satisfied.
/// </summary>
internal static class SwayEquations
{
    /// <summary>The independent translations that rotate some member's chord.</summary>
    public static List<int> Modes(DistributionFrame frame)
    {
        var kin = frame.Kinematics;
        // An overhang's tip moves freely and its moments are statical: its translation needs no sway case.
        return kin.TranslationUnknowns.Where(u => frame.Members.Where((m, i) => frame.OverhangTip[i] is null).Any(m => kin.ChordRotation(m).Terms.ContainsKey(u))).ToList();
    }

    /// <summary>A sway of a size that gives fixed-end moments of order 100 units keeps the table readable.</summary>
    public static double Scale(DistributionFrame frame, int mode)
    {
        var kin = frame.Kinematics;
        double peak = frame.Members.Max(m => Math.Abs(6 * m.E * m.I / frame.Length(m) * kin.ChordRotation(m).Terms.GetValueOrDefault(mode)));
        return peak > 0 ? 1e5 / peak : 1;
    }

    /// <summary>Fixed-end moments of a sway of unknown <paramref name="mode"/> by <paramref name="scale"/> with joints held.</summary>
    public static double[] FixedEndMoments(DistributionFrame frame, int mode, double scale)
    {
        var members = frame.Members;
        var fem = new double[frame.Columns.Count];
        for (int mi = 0; mi < members.Count; mi++)
        {
            var m = members[mi];
            double psi = frame.Kinematics.ChordRotation(m).Terms.GetValueOrDefault(mode) * scale;
            if (psi == 0) continue;
            double v = -6 * m.E * m.I * psi / frame.Length(m); // slope-deflection: −6EIψ/L at both ends
            fem[2 * mi] = v;
            fem[(2 * mi) + 1] = v;
        }
        return fem;
    }

    /// <summary>Virtual work of the member-end moments in a sway mode: Σ (M_ab + M_ba)·ψ.</summary>
    public static double Residual(DistributionFrame frame, int mode, double[] moments)
    {
        var members = frame.Members;
        double r = 0;
        for (int mi = 0; mi < members.Count; mi++)
        {
            double psi = frame.Kinematics.ChordRotation(members[mi]).Terms.GetValueOrDefault(mode);
            if (psi != 0) r += (moments[2 * mi] + moments[(2 * mi) + 1]) * psi;
        }
        return r;
    }

    /// <summary>Virtual work of the loads in a sway mode (joints translate, members move as rigid bodies).</summary>
    public static double LoadWork(DistributionFrame frame, int mode, LoadCase c)
    {
        var model = frame.Model;
        var kinematics = frame.Kinematics;
        double w = 0;
        foreach (var load in c.Loads)
        {
            switch (load)
            {
                case JointForce f:
                {
                    var (ux, uy) = kinematics.JointTranslation(f.Joint);
                    var (gx, gy) = f.Direction.Vector();
                    w += f.P * ((gx * ux.Terms.GetValueOrDefault(mode)) + (gy * uy.Terms.GetValueOrDefault(mode)));
                    break;
                }
                case MemberLoad ml:
                {
                    var m = model.Member(ml.Member);
                    var a = model.Joint(m.Start);
                    var b = model.Joint(m.End);
                    double L = frame.Length(m), cos = (b.X - a.X) / L, sin = (b.Y - a.Y) / L;
                    var (ux, uy) = kinematics.JointTranslation(m.Start);
                    double dux = ux.Terms.GetValueOrDefault(mode), duy = uy.Terms.GetValueOrDefault(mode);
                    double ua = (dux * cos) + (duy * sin), va = (-dux * sin) + (duy * cos);
                    double psi = kinematics.ChordRotation(m).Terms.GetValueOrDefault(mode);
                    switch (LocalLoads.Resolve(ml, cos, sin))
                    {
                        case LocalPoint p: w += (p.Qx * ua) + (p.Qy * (va - (psi * p.A))); break;
                        case LocalDistributed d:
                        {
                            double len = d.B - d.A;
                            double qx = (d.Qx1 + d.Qx2) / 2 * len, qy = (d.Qy1 + d.Qy2) / 2 * len;
                            // ∫ qy·s ds for a linear load between A and B.
                            double qys = (d.Qy1 * ((d.B * d.B) - (d.A * d.A)) / 2) + ((d.Qy2 - d.Qy1) / len * ((((d.B * d.B * d.B) - (d.A * d.A * d.A)) / 3) - (d.A * ((d.B * d.B) - (d.A * d.A)) / 2)));
                            w += (qx * ua) + (qy * va) - (psi * qys);
                            break;
                        }
                        case LocalCouple cp: w += cp.C * -psi; break;
                    }
                    break;
                }
            }
        }
        return w;
    }

    /// <summary>
    /// The multiples of the sway cases that satisfy every storey equation: Σ_s a_ts·x_s = −(residual of the no-sway
    /// moments + work of the loads) in each sway mode t.
    /// </summary>
    /// <exception cref="ArgumentException">The equations are singular (as MathNet reports it).</exception>
    /// <exception cref="InvalidOperationException">The equations are singular (as MathNet reports it).</exception>
    /// <param name="frame">The structure.</param>
    /// <param name="modes">The sway modes.</param>
    /// <param name="noSway">End moments of the no-sway stage.</param>
    /// <param name="sway">End moments of each sway case, by mode.</param>
    /// <param name="loadWork">Work of the loads in each mode.</param>
    public static Vector<double> Factors(DistributionFrame frame, List<int> modes, double[] noSway, IReadOnlyList<double[]> sway, double[] loadWork)
    {
        int n = modes.Count;
        var a = Matrix<double>.Build.Dense(n, n);
        var b = Vector<double>.Build.Dense(n);
        for (int t = 0; t < n; t++)
        {
            b[t] = -(Residual(frame, modes[t], noSway) + loadWork[t]);
            for (int s = 0; s < n; s++) a[t, s] = Residual(frame, modes[t], sway[s]);
        }
        return a.Solve(b);
    }
}
