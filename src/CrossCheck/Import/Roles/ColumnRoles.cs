using System.Globalization;
using CrossCheck.Import.Loads;
using CrossCheck.Import.Tables;

namespace CrossCheck.Import.Roles;

/// <summary>How a column's role was decided.</summary>
internal enum RoleBasis
{
    /// <summary>Not decided: the column is not read.</summary>
    None,
    /// <summary>The header is the column's own name.</summary>
    Name,
    /// <summary>The header is one of the column's synonyms, and its cells agree.</summary>
    Synonym,
    /// <summary>The header names nothing (or something its cells contradict); the cells fit this role and no other needed one.</summary>
    Contents,
    /// <summary>Not printed as a column: given by the layout (a caption naming the load case, labels between rows).</summary>
    Layout,
}

/// <summary>What is known of one column of a table before its role is decided.</summary>
/// <param name="Header">The header as printed (with its unit).</param>
/// <param name="Unit">The unit given for the column (in the header, a units row or outside the table), if any.</param>
/// <param name="Cells">The cells as printed, top to bottom.</param>
/// <param name="Named">The column of the format the header's words name (by name or synonym), if any.</param>
/// <param name="ByName">True when <paramref name="Named"/> is by the column's own name, not a synonym.</param>
internal sealed record RoleColumn(string Header, string? Unit, IReadOnlyList<string> Cells, ColumnSpec? Named, bool ByName);

/// <summary>The role decided for a column: the column of the format it is read as (null: not read), how, and how sure.</summary>
internal sealed record RoleDecision(ColumnSpec? Role, RoleBasis Basis, double Confidence, string How)
{
    /// <summary>A sentence for the reviewer when the role was not taken from the header's words as they stand (else null).</summary>
    public string? Warning { get; init; }

    /// <summary>An error: two columns claim the role and their cells cannot tell them apart.</summary>
    public string? Error { get; init; }

    public static RoleDecision Unread(string how) => new(null, RoleBasis.None, 0, how);

    /// <summary><c>P (by its name, 100 %)</c>, for <c>crosscheck extract</c>.</summary>
    public string Describe() => string.Create(CultureInfo.InvariantCulture, $"{How}, {Math.Round(100 * Confidence):0} %");
}

/// <summary>
/// Ids the other tables of the submission give, against which a column's cells are checked: members, joints, and
/// the load cases of the loads table.
/// </summary>
internal sealed class RoleContext
{
    public HashSet<string> Members { get; } = new(StringComparer.Ordinal);
    public HashSet<string> Joints { get; } = new(StringComparer.Ordinal);
    public HashSet<string> Cases { get; } = new(StringComparer.Ordinal);

    /// <summary>The geometry tables are read first: they give the ids the other tables refer to.</summary>
    public static int Order(TableSpec spec) =>
        spec == TableSchema.Joints || spec == TableSchema.Supports ? 0 : spec == TableSchema.Members || spec == TableSchema.Spans ? 1 : spec == TableSchema.Loads ? 2 : 3;

    /// <summary>Remembers the ids a decided table gives.</summary>
    public void Learn(TableSpec spec, IReadOnlyList<RoleColumn> columns, IReadOnlyList<RoleDecision> decisions)
    {
        for (int k = 0; k < columns.Count; k++)
        {
            var target = (spec.Name, decisions[k].Role?.Name) switch
            {
                ("joints", "joint") or ("supports", "support") => Joints,
                ("members", "member") or ("spans", "span") => Members,
                ("loads", "case") => Cases,
                _ => null,
            };
            if (target is null) continue;
            foreach (var c in columns[k].Cells)
                if (Clean(c) is { Length: > 0 } id) target.Add(id);
        }
    }

    internal static string Clean(string cell)
    {
        string t = cell.Trim();
        return t.Contains("  ", StringComparison.Ordinal) || t.Contains('\t') || t.Contains('\n')
            ? string.Join(' ', t.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries)) : t;
    }
}

/// <summary>
/// Decides what each column of a table is from its header and its contents. The rules, in order:
/// <list type="number">
/// <item>a header that is a column's own name is that column (the format's names are a contract);</item>
/// <item>a header that is a synonym is that column when its cells agree (numbers in a number column, words of a
/// closed vocabulary in such a column); a synonym whose cells contradict it (<c>Load</c> holding <c>udl</c>,
/// <c>point</c>) is decided by its cells;</item>
/// <item>an unknown header, or a contradicted synonym, whose cells fit exactly one needed column of the table that no
/// other column gives (load kinds, restraints, directions, ids that the other tables know, numbers in the column's
/// unit at a plausible magnitude) is read as that column, with a warning;</item>
/// <item>two columns claiming one role is an error only when their cells cannot separate them.</item>
/// </list>
/// Needed columns are the required ones, those the load kinds in the rows read (<c>P</c> for a point load, ...) and
/// <c>case</c> when the cells are the load cases of the loads table.
/// </summary>
internal static class ColumnRoles
{
    private const double Strong = 0.75;

    public static RoleDecision[] Decide(TableSpec spec, IReadOnlyList<RoleColumn> columns, RoleContext context)
    {
        var decisions = new RoleDecision[columns.Count];
        var profiles = columns.Select(c => new Profile(c)).ToArray();
        // 1 and 2: names, and synonyms whose cells agree.
        for (int k = 0; k < columns.Count; k++)
        {
            var c = columns[k];
            if (c.Named is not { } named) { decisions[k] = RoleDecision.Unread("names no column of the table"); continue; }
            if (c.ByName) { decisions[k] = new RoleDecision(named, RoleBasis.Name, 1.0, $"by its name '{named.Name}'"); continue; }
            if (Fits(spec, named, c, profiles[k], context))
                decisions[k] = new RoleDecision(named, RoleBasis.Synonym, profiles[k].Filled > 0 ? 0.95 : 0.85, $"'{c.Header}' is a synonym of '{named.Name}'");
            else
                decisions[k] = RoleDecision.Unread($"'{c.Header}' is a synonym of '{named.Name}', but {profiles[k].Says()}");
        }
        // Two columns on one role: a name beats a synonym; else the cells decide, or it is an error. (Two columns under
        // the same name are left as they are: the table's reader reports them.)
        foreach (var group in Enumerable.Range(0, columns.Count).Where(k => decisions[k].Role is not null).GroupBy(k => decisions[k].Role!.Name).Where(g => g.Count() > 1))
        {
            var ks = group.ToList();
            if (ks.Count(k => decisions[k].Basis == RoleBasis.Name) > 1) continue;
            int keep = ks.FirstOrDefault(k => decisions[k].Basis == RoleBasis.Name, -1);
            if (keep < 0)
            {
                var fitting = ks.Where(k => profiles[k].Filled > 0).ToList();
                keep = fitting.Count == 1 ? fitting[0] : ks[0];
                if (fitting.Count > 1)
                    foreach (int k in ks.Where(k => k != keep))
                        decisions[k] = decisions[k] with { Error = Messages.TwoColumnsOneRole(columns[keep].Header, columns[k].Header, group.Key) };
            }
            foreach (int k in ks.Where(k => k != keep && decisions[k].Error is null))
                decisions[k] = RoleDecision.Unread($"'{columns[keep].Header}' is already '{group.Key}'");
        }
        // 3: unknown or contradicted headers, by their cells.
        var taken = decisions.Where(d => d.Role is not null).Select(d => d.Role!.Name).ToHashSet(StringComparer.Ordinal);
        var needed = Needed(spec, columns, decisions, context);
        var offers = new List<(int K, ColumnSpec Role, double Score, string Evidence)>();
        for (int k = 0; k < columns.Count; k++)
        {
            if (decisions[k].Role is not null || decisions[k].Error is not null || profiles[k].Filled == 0) continue;
            var fits = spec.Columns.Where(r => !taken.Contains(r.Name) && needed.Contains(r.Name))
                .Select(r => (Role: r, Score: Score(spec, r, columns[k], profiles[k], context)))
                .Where(x => x.Score.Value >= Strong).ToList();
            if (fits.Count == 1) offers.Add((k, fits[0].Role, fits[0].Score.Value, fits[0].Score.Evidence));
        }
        foreach (var byRole in offers.GroupBy(o => o.Role.Name))
        {
            var best = byRole.OrderByDescending(o => o.Score).ToList();
            if (best.Count > 1 && best[1].Score > best[0].Score - 0.15) continue; // the cells cannot tell the columns apart
            var (k, role, score, evidence) = best[0];
            var before = decisions[k];
            string how = columns[k].Named is { } n && n != role
                ? $"'{columns[k].Header}' names '{n.Name}', but {evidence}: read as '{role.Name}'"
                : $"by its contents: {evidence}";
            decisions[k] = new RoleDecision(role, RoleBasis.Contents, 0.9 * score, how)
            {
                Warning = Messages.RoleFromContents(columns[k].Header, role.Name, evidence, before.Role is null && columns[k].Named is { } named ? named.Name : null),
            };
        }
        // A header that names a column whose role went elsewhere, and was not read: the reviewer is told.
        for (int k = 0; k < columns.Count; k++)
        {
            if (decisions[k].Role is null && decisions[k].Error is null && columns[k].Named is { } named && profiles[k].Filled > 0)
                decisions[k] = decisions[k] with { Warning = Messages.ColumnNotRead(columns[k].Header, named.Name, decisions[k].How.Split(", but ").Last()) };
        }
        return decisions;
    }

    /// <summary>The columns the table needs: required ones, those its load kinds read, a case column when cells name the loads' cases.</summary>
    private static HashSet<string> Needed(TableSpec spec, IReadOnlyList<RoleColumn> columns, RoleDecision[] decisions, RoleContext context)
    {
        var needed = spec.Columns.Where(c => c.Required).Select(c => c.Name).ToHashSet(StringComparer.Ordinal);
        if (spec.Columns.Any(c => c.Name == "case") && (context.Cases.Count > 0 || spec == TableSchema.Loads)) needed.Add("case");
        if (spec != TableSchema.Loads) return needed;
        int kindK = Array.FindIndex(decisions, d => d.Role?.Name == "kind");
        var kinds = kindK >= 0 ? columns[kindK].Cells.Select(LoadKinds.Find).OfType<LoadKind>().Distinct().ToList() : LoadKinds.All.ToList();
        foreach (var kind in kinds) needed.UnionWith(kind.Uses.Where(u => u is not "a" and not "b" || kind.Uses.Count == 2));
        needed.Add("dir");
        return needed;
    }

    /// <summary>Whether a column's cells agree with the role its header names.</summary>
    private static bool Fits(TableSpec spec, ColumnSpec role, RoleColumn c, Profile p, RoleContext context)
    {
        if (p.Filled == 0) return true;
        if (role.Type == ColumnType.Number)
            return p.NumberShare >= 0.8 && UnitFits(role, c.Unit);
        if (Vocabulary(spec, role) is { } vocab) return p.Share(vocab) >= 0.6;
        // An id column whose cells are another closed vocabulary (load kinds, restraints) is not an id column.
        return !(p.Share(LoadKinds.Find) >= 0.8 || p.Share(GeometryCells.IsRestraintWord) >= 0.8 || p.Share(LoadsReader.IsDirection) >= 0.8)
               || (role.Name == "at" && p.Share(IsEndWord) >= 0.8);
    }

    private static bool UnitFits(ColumnSpec role, string? unit) =>
        unit is null || role.Kind == QuantityKind.Number || UnitReader.TryRead(unit, role.Kind) is not null
        || (role.Kind == QuantityKind.SecondMoment && TableSchema.IsRelativeUnit(unit));

    /// <summary>How well a column's cells fit a role, from 0 to 1, and the evidence in words.</summary>
    private static (double Value, string Evidence) Score(TableSpec spec, ColumnSpec role, RoleColumn c, Profile p, RoleContext context)
    {
        string Of(int n, string what) => string.Create(CultureInfo.InvariantCulture, $"{n} of {p.Filled} cells are {what}");
        if (role.Type == ColumnType.Number)
        {
            if (p.NumberShare < 0.9) return (0, "");
            if (c.Unit is { } u)
            {
                if (role.Kind == QuantityKind.Number || UnitReader.TryRead(u, role.Kind) is not { } unit) return (0, "");
                double plausible = p.Plausible(unit.ToSi, role.Kind);
                return (plausible >= 0.8 ? 0.9 : 0.4, string.Create(CultureInfo.InvariantCulture,
                    $"{Of(p.Numbers, "numbers")} in {UnitReader.Describe(role.Kind)} unit ({u})"));
            }
            return (0.5, Of(p.Numbers, "numbers"));
        }
        if (Vocabulary(spec, role) is { } vocab)
        {
            int n = p.Count(vocab);
            return ((double)n / p.Filled, Of(n, VocabularyName(role)));
        }
        if (role.Name == "case")
        {
            int n = p.Count(context.Cases.Contains);
            return context.Cases.Count > 0 ? ((double)n / p.Filled, Of(n, "load cases of the loads table")) : (0, "");
        }
        var known = KnownIds(spec, role, context);
        if (known is null || known.Count == 0)
        {
            // An id that defines a row (a joint's or member's own id): distinct words, not numbers with decimals.
            bool defining = role.Name is "joint" or "member" or "support" or "span" && (spec == TableSchema.Joints || spec == TableSchema.Members || spec == TableSchema.Supports || spec == TableSchema.Spans);
            bool distinct = p.Values.Distinct(StringComparer.Ordinal).Count() == p.Filled;
            return defining && distinct && p.NumberShare < 0.5 ? (0.8, Of(p.Filled, "distinct ids")) : (0, "");
        }
        int hits = p.Count(v => known.Contains(v) || (role.Name == "at" && IsEndWord(v)));
        string what = known == context.Members ? "members of the members table" : known == context.Joints ? "joints of the joints table" : "members or joints of the other tables";
        return ((double)hits / p.Filled, Of(hits, what));
    }

    private static HashSet<string>? KnownIds(TableSpec spec, ColumnSpec role, RoleContext context) => (spec.Name, role.Name) switch
    {
        ("members", "start") or ("members", "end") or ("end-moments", "at") or ("reactions", "joint") or ("displacements", "joint") => context.Joints,
        ("end-moments", "member") => context.Members,
        ("loads", "on") => [.. context.Members, .. context.Joints],
        _ => null,
    };

    private static Func<string, bool>? Vocabulary(TableSpec spec, ColumnSpec role) => (spec.Name, role.Name) switch
    {
        ("loads", "kind") => t => LoadKinds.Find(t) is not null,
        ("loads", "dir") => LoadsReader.IsDirection,
        (_, "restraint") => GeometryCells.IsRestraintWord,
        (_, "hinge") => GeometryCells.IsHingeWord,
        ("distribution", "step") => t => WorkingTableReader.ParseStep(t) is not null,
        _ => null,
    };

    private static string VocabularyName(ColumnSpec role) => role.Name switch
    {
        "kind" => "load kinds",
        "dir" => "directions",
        "restraint" => "restraints",
        "hinge" => "hinge words",
        _ => "steps of a moment distribution",
    };

    private static bool IsEndWord(string t) => TableSchema.Normalize(t) is "start" or "end" or "i" or "j" or "near" or "far";

    /// <summary>What a column's cells are: how many are filled, numbers, and so on.</summary>
    private sealed class Profile
    {
        /// <summary>Cells looked at: a long table's column shows what it is in its first few hundred cells.</summary>
        private const int Sample = 400;

        public Profile(RoleColumn c)
        {
            Values = c.Cells.Take(Sample).Select(RoleContext.Clean).Where(v => !IsBlank(v)).ToList();
            Numbers = Values.Count(LooksNumeric);
        }

        public List<string> Values { get; }
        public int Filled => Values.Count;
        public int Numbers { get; }
        public double NumberShare => Filled == 0 ? 0 : (double)Numbers / Filled;

        public int Count(Func<string, bool> test) => Values.Count(test);
        public double Share(Func<string, bool> test) => Filled == 0 ? 0 : (double)Count(test) / Filled;
        public double Share(Func<string, LoadKind?> find) => Share(v => find(v) is not null);

        /// <summary>The share of numbers whose magnitude (in SI, through <paramref name="toSi"/>) is plausible for the kind.</summary>
        public double Plausible(double toSi, QuantityKind kind)
        {
            var (lo, hi) = Magnitudes.Range(kind);
            int n = 0, ok = 0;
            foreach (var v in Values)
            {
                if (!NumberOf(v, out double x)) continue;
                n++;
                double si = Math.Abs(x * toSi);
                if (si == 0 || (si >= lo && si <= hi)) ok++;
            }
            return n == 0 ? 0 : (double)ok / n;
        }

        public string Says()
        {
            if (NumberShare >= 0.8) return string.Create(CultureInfo.InvariantCulture, $"{Numbers} of {Filled} cells are numbers");
            var words = Values.Where(v => !LooksNumeric(v)).Distinct(StringComparer.Ordinal).Take(3);
            return $"its cells hold words ({string.Join(", ", words.Select(w => $"\"{w}\""))})";
        }
    }

    private static bool IsBlank(string v) => v is "" or "-" or "–" or "—" or "−" or "n/a" or "N/A" or "/";

    /// <summary>A number as printed: signs and dashes, thousands separators, decimal commas, parentheses, a power of ten, a unit after it.</summary>
    internal static bool LooksNumeric(string text) => NumberOf(text, out _);

    private static bool NumberOf(string text, out double value)
    {
        string s = text.Trim();
        if (NumberText.TryParse(s, false, out value)) return true;
        if (Pdf.PdfNumbers.SplitUnit(s) is var (n, _)) s = n;
        s = s.Trim('(', ')').Replace('\u2212', '-').Replace('\u2013', '-');
        if (NumberText.TryParse(s, false, out value)) return true;
        string plain = Pdf.PdfNumbers.Normalize(s, new Pdf.NumberStyle(false, true), out _);
        if (NumberText.TryParse(plain, false, out value)) return true;
        plain = Pdf.PdfNumbers.Normalize(s, new Pdf.NumberStyle(true, true), out _);
        return NumberText.TryParse(plain, false, out value);
    }
}

/// <summary>
/// Magnitudes a structural calculation's numbers have, in SI, by kind (common practice: from a 10 mm bracket to a
/// 500 m span, from a few newtons to tens of meganewtons): a whole column outside them suggests a unit slip or a misread.
/// </summary>
internal static class Magnitudes
{
    public static (double Lo, double Hi) Range(QuantityKind kind) => kind switch
    {
        QuantityKind.Length => (1e-4, 1e4),
        QuantityKind.Force => (1e-1, 1e9),
        QuantityKind.Moment => (1e-1, 1e10),
        QuantityKind.ForcePerLength => (1e-1, 1e8),
        QuantityKind.Modulus => (1e5, 1e13),
        QuantityKind.SecondMoment => (1e-12, 1e2),
        QuantityKind.Area => (1e-7, 1e2),
        QuantityKind.Angle => (1e-9, 7),
        _ => (0, double.MaxValue),
    };
}
