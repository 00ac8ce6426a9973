using System.Text.RegularExpressions;

namespace CrossCheck.Import;

internal enum ColumnType
{
    Id,
    Text,
    Number,
}

/// <summary>A column of the submission format: its name, accepted synonyms and kind.</summary>
internal sealed record ColumnSpec(string Name, ColumnType Type, QuantityKind Kind, bool Required, params string[] Synonyms)
{
    /// <summary>The name, normalised (see <see cref="TableSchema.Normalize"/>).</summary>
    public string NormalizedName { get; } = TableSchema.Normalize(Name);

    private readonly HashSet<string> _names = [TableSchema.Normalize(Name), .. Synonyms.Select(TableSchema.Normalize)];

    public bool Matches(string normalizedHeader) => _names.Contains(normalizedHeader);
}

/// <summary>A table of the submission format.</summary>
internal sealed record TableSpec(string Name, ColumnSpec[] Columns, params string[] Synonyms)
{
    public bool Matches(string normalizedName) =>
        TableSchema.Normalize(Name) == normalizedName || Synonyms.Any(s => TableSchema.Normalize(s) == normalizedName);

    public ColumnSpec Column(string name) => Columns.First(c => c.Name == name);
}

/// <summary>The tables and columns of docs/SUBMISSION-FORMAT.md (format contract v1), in one place.</summary>
internal static partial class TableSchema
{
    /// <summary>
    /// Header names of a relative second moment of area, the hand-method habit (<c>I/I₀</c>, <c>rel. I</c>, <c>k</c>):
    /// read as relative stiffness, E = 1 (see <see cref="IsRelativeStiffness"/>).
    /// </summary>
    private static readonly string[] RelativeI = ["I/I0", "I/I₀", "I/Io", "I rel", "I rel.", "rel I", "rel. I", "relative I", "Irel", "Ir", "k", "relative stiffness", "rel. stiffness"];

    /// <summary>Unit words that say a stiffness is relative (<c>I (rel.)</c>, <c>I [-]</c>).</summary>
    private static readonly string[] RelativeUnits = ["rel", "relative", "ratio", "-", "1", "", "k", "i/i0", "i/i₀", "i/io"];

    /// <summary>
    /// True when a second-moment header says the values are relative: by its name (<c>I/I₀</c>, <c>k</c>, <c>rel. I</c>)
    /// or by its unit (<c>I (rel.)</c>, <c>I [relative]</c>, <c>I [-]</c>).
    /// </summary>
    public static bool IsRelativeStiffness(string header)
    {
        var (name, unit) = SplitHeader(header);
        if (unit is not null && IsRelativeUnit(unit)) return true;
        string n = Normalize(name);
        return n.Length > 0 && RelativeI.Any(r => Normalize(r) == n);
    }

    /// <summary>True for a unit word that means "relative" (<c>rel.</c>, <c>relative</c>, <c>ratio</c>, <c>-</c>).</summary>
    public static bool IsRelativeUnit(string unit) => RelativeUnits.Contains(Normalize(unit).TrimEnd('.'));

    private static ColumnSpec Id(string name, bool required = true, params string[] syn) => new(name, ColumnType.Id, QuantityKind.Number, required, syn);
    private static ColumnSpec Text(string name, bool required = false, params string[] syn) => new(name, ColumnType.Text, QuantityKind.Number, required, syn);
    private static ColumnSpec Num(string name, QuantityKind kind, bool required = false, params string[] syn) => new(name, ColumnType.Number, kind, required, syn);

    public static readonly TableSpec Info = new("info", [Text("key", true, "item", "field"), Text("value", true)], "title block", "project");

    public static readonly TableSpec Joints = new("joints",
    [
        Id("joint", true, "node", "id", "point", "joint no", "node no", "jt"),
        Num("x", QuantityKind.Length, true, "x coord", "x coordinate"),
        Num("y", QuantityKind.Length, true, "y coord", "y coordinate"),
        Text("restraint", false, "support", "fixity", "boundary", "support type", "restraint type"),
        Num("settle x", QuantityKind.Length, false, "settlement x", "dx"),
        Num("settle y", QuantityKind.Length, false, "settlement y", "settlement", "dy"),
        Num("settle rotation", QuantityKind.Angle, false, "settlement rotation", "rotation"),
    ], "nodes");

    public static readonly TableSpec Members = new("members",
    [
        Id("member", true, "element", "id", "span", "bar", "member no", "element no", "mem"),
        Id("start", true, "from", "start joint", "node i", "i", "joint i", "start node", "i node", "i end"),
        Id("end", true, "to", "end joint", "node j", "j", "joint j", "end node", "j node", "j end"),
        Num("E", QuantityKind.Modulus, false, "modulus", "elastic modulus", "young's modulus", "youngs modulus"),
        Num("I", QuantityKind.SecondMoment, true, ["Ixx", "Iz", "Ix", "second moment of area", "moment of inertia", "inertia", .. RelativeI]),
        Num("A", QuantityKind.Area, false, "area", "section area", "cross section area"),
        Text("hinge", false, "release", "releases", "hinges"),
        Num("length", QuantityKind.Length, false, "L", "member length", "length L"),
    ], "elements", "member properties");

    public static readonly TableSpec Supports = new("supports",
    [
        Id("support", true, "joint", "node", "id"),
        Text("restraint", true, "type", "fixity", "support type"),
        Num("settle y", QuantityKind.Length, false, "settlement y", "settlement", "dy"),
        Num("settle rotation", QuantityKind.Angle, false, "settlement rotation", "rotation"),
    ]);

    public static readonly TableSpec Spans = new("spans",
    [
        Id("span", true, "member", "id", "span no"),
        Num("length", QuantityKind.Length, true, "L", "span length", "length L"),
        Num("E", QuantityKind.Modulus, false, "modulus", "elastic modulus", "young's modulus", "youngs modulus"),
        Num("I", QuantityKind.SecondMoment, true, ["Ixx", "Iz", "Ix", "second moment of area", "moment of inertia", "inertia", .. RelativeI]),
        Text("hinge", false, "release", "releases"),
    ]);

    public static readonly TableSpec Loads = new("loads",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination", "load combination"),
        Id("on", true, "member", "joint", "span", "applied to", "element", "location", "acting on", "member/joint"),
        Text("kind", true, "type", "load type", "load kind"),
        Num("P", QuantityKind.Force, false, "force", "load", "F", "point load"),
        Num("w", QuantityKind.ForcePerLength, false, "w start", "intensity", "udl", "w1", "q"),
        Num("w end", QuantityKind.ForcePerLength, false, "w2", "intensity end", "q end", "q2"),
        Num("M", QuantityKind.Moment, false, "moment", "couple", "applied moment"),
        Num("a", QuantityKind.Length, false, "x", "position", "distance", "from", "start at", "dist"),
        Num("b", QuantityKind.Length, false, "to", "end at"),
        Text("dir", false, "direction"),
    ], "load table", "applied loads");

    public static readonly TableSpec EndMoments = new("end-moments",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination", "load combination"),
        Id("member", true, "span", "element"),
        Id("at", true, "end", "joint", "node", "at joint"),
        Num("moment", QuantityKind.Moment, true, "M", "end moment", "member end moment", "final moment", "final end moment"),
    ], "end moments", "member end moments", "final moments", "moments", "final end moments");

    public static readonly TableSpec Reactions = new("reactions",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination"),
        Id("joint", true, "support", "node"),
        Num("Rx", QuantityKind.Force, false, "H", "horizontal", "Fx", "horizontal reaction"),
        Num("Ry", QuantityKind.Force, false, "V", "R", "vertical", "Fy", "vertical reaction"),
        Num("M", QuantityKind.Moment, false, "moment", "Mz", "moment reaction", "fixing moment"),
    ], "support reactions");

    public static readonly TableSpec Displacements = new("displacements",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination"),
        Id("joint", true, "node"),
        Num("ux", QuantityKind.Length, false, "dx", "sway", "drift", "horizontal", "δx", "Δx"),
        Num("uy", QuantityKind.Length, false, "dy", "deflection", "vertical", "δy", "Δy"),
        Num("rotation", QuantityKind.Angle, false, "theta", "θ", "rz"),
    ], "deflections", "joint displacements");

    /// <summary>
    /// The author's moment-distribution working table: <c>case</c>, <c>step</c>, then one column per member end
    /// (<c>AB@A</c>, or a double subscript such as <c>M_AB</c>); read by <see cref="WorkingTableReader"/>.
    /// </summary>
    public static readonly TableSpec Distribution = new("distribution",
    [
        Id("case", false, "load case", "lc"),
        Text("step", true, "row", "operation", "stage"),
    ], "moment distribution", "distribution table", "working table", "hardy cross");

    /// <summary>Load combinations: factored load cases, a variable case optionally patterned span by span.</summary>
    public static readonly TableSpec Combinations = new("combinations",
    [
        Id("combination", true, "combo", "load combination", "comb", "combination name"),
        Id("case", true, "load case", "lc", "loadcase"),
        Num("factor", QuantityKind.Number, true, "load factor", "partial factor", "gamma", "γ", "γf"),
        Text("pattern", false, "patterned", "pattern loading", "arrangement"),
        Num("factor unloaded", QuantityKind.Number, false, "unloaded factor", "factor where unloaded", "gamma unloaded", "γ unloaded", "factor min"),
    ], "load combinations", "combination factors", "combos");

    /// <summary>Envelopes of combinations with a patterned case: largest and least end moments, largest span moments.</summary>
    public static readonly TableSpec Envelopes = new("envelopes",
    [
        Id("combination", true, "combo", "load combination", "comb"),
        Id("member", true, "span", "element"),
        Id("at", true, "end", "joint", "node", "at joint", "location"),
        Num("max", QuantityKind.Moment, false, "maximum", "M max", "Mmax", "max moment"),
        Num("min", QuantityKind.Moment, false, "minimum", "M min", "Mmin", "min moment"),
    ], "envelope", "moment envelope", "moment envelopes", "envelope moments", "pattern envelope");

    /// <summary>Claimed largest span moments, sagging positive.</summary>
    public static readonly TableSpec SpanMoments = new("span-moments",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination", "load combination"),
        Id("member", true, "span", "element"),
        Num("moment", QuantityKind.Moment, true, "M", "span moment", "max span moment", "M span", "Mspan", "max moment", "sagging moment"),
        Num("x", QuantityKind.Length, false, "at x", "position", "x from start", "distance"),
    ], "span moments", "maximum span moments", "max span moments", "span maxima");

    /// <summary>Claimed member-end shears, beam convention (V = dM/dx along start→end).</summary>
    public static readonly TableSpec Shears = new("shears",
    [
        Id("case", false, "load case", "lc", "loadcase", "combination", "load combination"),
        Id("member", true, "span", "element"),
        Id("at", true, "end", "joint", "node", "at joint"),
        Num("V", QuantityKind.Force, true, "shear", "shear force", "end shear", "V end"),
    ], "shear forces", "end shears", "member end shears", "member shears");

    public static readonly TableSpec[] All =
        [Info, Joints, Members, Supports, Spans, Loads, Combinations, EndMoments, Reactions, Displacements, SpanMoments, Shears, Envelopes, Distribution];

    public static TableSpec? Find(string name)
    {
        string n = Normalize(name);
        return All.FirstOrDefault(t => t.Matches(n));
    }

    /// <summary>
    /// The column a header name (without its unit) stands for: the column whose own name matches first, then a
    /// column with a matching synonym. Every reader resolves headers through here.
    /// </summary>
    public static ColumnSpec? ResolveColumn(TableSpec spec, string name)
    {
        string norm = Normalize(name);
        return spec.Columns.FirstOrDefault(c => c.NormalizedName == norm) ?? spec.Columns.FirstOrDefault(c => c.Matches(norm));
    }

    /// <summary>
    /// Keys of the <c>info</c> table and the words calculation title blocks use for them
    /// (<c>Job No.</c> = reference, <c>Designed by</c> = prepared by, ...).
    /// </summary>
    public static readonly IReadOnlyDictionary<string, string[]> InfoKeys = new Dictionary<string, string[]>(StringComparer.Ordinal)
    {
        ["title"] = ["project", "project title", "job title", "subject"],
        ["reference"] = ["ref", "job", "job number", "job no", "calc ref", "calculation reference", "calc no", "document number", "doc no", "project number", "project no"],
        ["revision"] = ["rev", "issue"],
        ["prepared by"] = ["author", "designer", "designed by", "calculated by", "calc by", "made by", "calcs by", "by"],
        ["checked by"] = ["checker", "checked"],
        ["date"] = ["dated"],
        ["force unit"] = [],
        ["length unit"] = [],
        ["sign convention"] = ["moment sign convention", "convention"],
        ["axial"] = ["axial behaviour", "axial behavior", "axial deformation"],
    };

    /// <summary>The info key a title-block word stands for (<c>Job No.</c> → <c>reference</c>), or null when it is none of them.</summary>
    public static string? InfoKey(string key)
    {
        string n = Normalize(key.Trim().TrimEnd('.', ':'));
        foreach (var (canonical, synonyms) in InfoKeys)
            if (canonical == n || synonyms.Any(s => Normalize(s) == n)) return canonical;
        return null;
    }

    /// <summary>Case-insensitive, trimmed, with space, <c>_</c> and <c>-</c> treated alike.</summary>
    public static string Normalize(string s) => Separators().Replace(s.Trim().ToLowerInvariant(), " ").Trim();

    /// <summary>Splits <c>x [m]</c> into name and unit; also accepts <c>x (m)</c>.</summary>
    public static (string Name, string? Unit) SplitHeader(string header)
    {
        string h = header.Replace("\uFEFF", "").Trim();
        var m = BracketUnit().Match(h);
        if (m.Success) return (m.Groups["name"].Value.Trim(), m.Groups["unit"].Value.Trim());
        var p = ParenUnit().Match(h);
        if (p.Success) return (p.Groups["name"].Value.Trim(), p.Groups["unit"].Value.Trim());
        return (h, null);
    }

    [GeneratedRegex(@"[\s_\-]+")]
    private static partial Regex Separators();

    [GeneratedRegex(@"^(?<name>.*?)\s*\[(?<unit>[^\]]*)\]\s*$")]
    private static partial Regex BracketUnit();

    [GeneratedRegex(@"^(?<name>.*?)\s*\((?<unit>[^)]*)\)\s*$")]
    private static partial Regex ParenUnit();
}
