using System.Globalization;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>Submissions and helpers shared by the PDF tests.</summary>
public static class PdfTestData
{
    /// <summary>A submission that uses every table and column of the format (invented numbers: it tests reading, not analysis).</summary>
    public const string EveryColumn = """
        [info]
        key,value
        title,Every column - reading fixture
        reference,TEST-RT-1
        revision,C
        prepared by,A. Writer (test)
        checked by,B. Checker (test)
        date,2026-12-01
        force unit,kN
        length unit,m
        sign convention,sagging
        axial,elastic

        [joints]
        joint,x [m],y [m],restraint,settle x [mm],settle y [mm],settle rotation [rad]
        J1,0,0,fixed,0,-5,0
        J2,0,4.5,free,,,
        J3,7.25,4.5,free,,,
        J4,7.25,0,pinned,2,0,
        J5,12,4.5,roller,,-3,

        [members]
        member,start,end,E [GPa],I [mm^4],A [mm^2],hinge
        C1,J1,J2,205,1.2e8,7600,none
        B1,J2,J3,205,2.5e8,9500,
        C2,J4,J3,205,1.2e8,7600,
        B2,J3,J5,205,1.8e8,8200,end

        [loads]
        case,on,kind,P [kN],w [kN/m],w end [kN/m],M [kN·m],a [m],b [m],dir
        D,B1,udl,,12.5,,,,,down
        D,B2,linear,,4,9,,1,4.75,down
        D,B1,point,35,,,,2.5,,down
        W,C1,udl,,2.2,,,,,right
        W,J2,force,6.5,,,,,,left
        W,B1,moment,,,,15,3,,
        W,J3,moment,,,,-8,,,

        [end-moments]
        case,member,at,moment [kN·m]
        D,C1,J1,12.35
        D,C1,J2,-24.7
        D,B1,start,-24.7
        D,B1,end,-61.05
        D,C2,J4,0
        D,C2,J3,18.4
        D,B2,J3,-42.65
        D,B2,J5,0
        W,C1,J1,-1234.5
        W,C1,J2,6.8
        W,B1,J2,-6.8
        W,B1,J3,2.25

        [reactions]
        case,joint,Rx [kN],Ry [kN],M [kN·m]
        D,J1,-3.2,75.1,12.35
        D,J4,3.2,102.4,
        W,J1,-9.9,,-1234.5

        [displacements]
        case,joint,ux [mm],uy [mm],rotation [rad]
        D,J2,1.25,-0.5,0.0012
        W,J3,14.5,,-0.0031
        """;

    /// <summary>A regular frame with random sections and loads, written as CSV with its recomputed end moments as the claims.</summary>
    public static string RandomFrame(int variant, int bays, int storeys)
    {
        var shape = new FrameShape(bays, storeys, FixedBases: variant % 2 == 0, Elastic: false, Hinges: variant % 3 == 0, variant);
        var b = RandomFrames.Build(shape, loadCases: 2);
        var model = b.Model;
        var cases = b.Cases;
        var result = new FrameSolver().Solve(model, cases);
        string F(double v) => v.ToString("G7", CultureInfo.InvariantCulture);
        var sb = new StringBuilder();
        sb.Append("[info]\nkey,value\ntitle,Random frame ").Append(variant).Append("\nforce unit,kN\nlength unit,m\n\n");
        sb.Append("[joints]\njoint,x [m],y [m],restraint\n");
        foreach (var j in model.Joints) sb.Append(CultureInfo.InvariantCulture, $"{j.Id},{F(j.X)},{F(j.Y)},{Restraint(j.Restraint)}\n");
        sb.Append("\n[members]\nmember,start,end,E [kPa],I [m^4],hinge\n");
        foreach (var m in model.Members) sb.Append(CultureInfo.InvariantCulture, $"{m.Id},{m.Start},{m.End},{F(m.E / 1e3)},{F(m.I)},{m.Hinge.ToString().ToLowerInvariant()}\n");
        sb.Append("\n[loads]\ncase,on,kind,P [kN],w [kN/m],w end [kN/m],M [kN·m],a [m],b [m],dir\n");
        foreach (var c in cases)
            foreach (var l in c.Loads)
                sb.Append(l switch
                {
                    PointLoad p => $"{c.Id},{p.Member},point,{F(p.P / 1e3)},,,,{F(p.A)},,{Dir(p.Direction)}\n",
                    DistributedLoad d => $"{c.Id},{d.Member},linear,,{F(d.WStart / 1e3)},{F(d.WEnd / 1e3)},,{F(d.A)},{F(d.B)},{Dir(d.Direction)}\n",
                    MemberCouple mc => $"{c.Id},{mc.Member},moment,,,,{F(mc.M / 1e3)},{F(mc.A)},,\n",
                    JointForce jf => $"{c.Id},{jf.Joint},force,{F(jf.P / 1e3)},,,,,,{Dir(jf.Direction)}\n",
                    JointCouple jc => $"{c.Id},{jc.Joint},moment,,,,{F(jc.M / 1e3)},,,\n",
                    _ => "",
                });
        sb.Append("\n[end-moments]\ncase,member,at,moment [kN·m]\n");
        foreach (var c in result.Cases)
            foreach (var m in model.Members)
            {
                var r = c.Members[m.Id];
                sb.Append(CultureInfo.InvariantCulture, $"{c.Case},{m.Id},{m.Start},{F(r.StartMoment / 1e3)}\n");
                sb.Append(CultureInfo.InvariantCulture, $"{c.Case},{m.Id},{m.End},{F(r.EndMoment / 1e3)}\n");
            }
        return sb.ToString();
    }

    private static string Restraint(Restraint r) => r switch
    {
        Model.Restraint.Fixed => "fixed",
        Model.Restraint.Pinned => "pinned",
        Model.Restraint.Roller => "roller",
        Model.Restraint.Guided => "guided",
        _ => "free",
    };

    private static string Dir(LoadDirection d) => d.ToString().ToLowerInvariant();

    /// <summary>
    /// Everything the importer read, without where it was read: the title block, units, model, loads and claims
    /// (claims by case, member and resolved end). Two readings of one submission give equal lists.
    /// </summary>
    public static List<string> Canon(Submission s)
    {
        var nowhere = new SourceRef("-");
        string G(double v) => v.ToString("G12", CultureInfo.InvariantCulture);
        string U(UnitChoice u) => G(u.ToSi);
        var i = s.Info;
        var list = new List<string>
        {
            $"info {i.Title}|{i.Reference}|{i.Revision}|{i.PreparedBy}|{i.CheckedBy}|{i.Date}|{i.SignConvention}",
            $"units {U(i.Units.Force)} {U(i.Units.Length)} {U(i.Units.Moment)} {U(i.Units.Displacement)}",
            $"model axial={s.Model.Axial} relative={s.Model.RelativeStiffness}",
        };
        list.AddRange(s.Model.Joints.Select(j => $"joint {j.Id} {G(j.X)} {G(j.Y)} {j.Restraint} {G(j.Movement.X)} {G(j.Movement.Y)} {G(j.Movement.Rotation)}"));
        list.AddRange(s.Model.Members.Select(m => $"member {m.Id} {m.Start} {m.End} {G(m.E)} {G(m.I)} {(m.A is double a ? G(a) : "-")} {m.Hinge}"));
        foreach (var c in s.Cases)
        {
            list.Add($"case {c.Id}");
            list.AddRange(c.Loads.Select(l => "load " + (l with { Source = nowhere })));
        }
        list.AddRange(s.Claims.EndMoments.Select(e => $"claim {e.Case} {e.Member} {e.End} {G(e.Moment)} {G(e.AsWritten)}").Order(StringComparer.Ordinal));
        list.AddRange(s.Claims.Reactions.Select(r => $"reaction {r.Case} {r.Joint} {Opt(r.Rx)} {Opt(r.Ry)} {Opt(r.M)}"));
        list.AddRange(s.Claims.Displacements.Select(d => $"displacement {d.Case} {d.Joint} {Opt(d.Ux)} {Opt(d.Uy)} {Opt(d.Rotation)}"));
        return list;

        string Opt(double? v) => v is double x ? G(x) : "-";
    }

    /// <summary>
    /// The sample beam of <see cref="SampleText"/> (a propped cantilever, kN and m) as PDF tables under a project line:
    /// joints (B at x = <paramref name="xOfB"/>, as printed), members, loads and, unless left out, the claimed end moments.
    /// </summary>
    public static PdfFixtureWriter SampleBeam(string project, string xOfB = "6", bool claims = true)
    {
        var w = new PdfFixtureWriter();
        w.Text("Project: " + project).Text("Units: kN, m");
        w.Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["A", "0", "0", "fixed"], ["B", xOfB, "0", "roller"]]));
        w.Table(new FixtureTable(["Member", "Start", "End", "E [GPa]", "I [mm4]"], [["AB", "A", "B", "200", "250e6"]]));
        w.Table(new FixtureTable(["Case", "On", "Kind", "w"], [["1", "AB", "udl", "18"]]));
        if (claims) w.Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]));
        return w;
    }

    /// <summary>Writes a PDF's bytes to a temporary file (kept in CROSSCHECK_KEEP_PDF when that is set, for a look).</summary>
    public static string Save(TempSubmission t, string name, byte[] pdf)
    {
        if (Environment.GetEnvironmentVariable("CROSSCHECK_KEEP_PDF") is { Length: > 0 } keep)
        {
            Directory.CreateDirectory(keep);
            File.WriteAllBytes(Path.Combine(keep, name), pdf);
        }
        return t.WriteBytes(name, pdf);
    }

    public static string Problems(ImportResult r) => string.Join("\n", r.Problems);
}
