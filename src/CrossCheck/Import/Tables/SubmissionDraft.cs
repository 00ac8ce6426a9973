using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// What the table readers of one build share: the tables, the problems found so far, the units, the rows left out
/// for errors already reported, and the submission built so far (each reader adds its part, in the order of
/// <see cref="SubmissionBuilder"/>'s list).
/// </summary>
internal sealed class SubmissionDraft(string source, IReadOnlyDictionary<string, RawTable> tables, InputLimits limits, List<InputProblem> problems)
{
    public string Source { get; } = source;
    public IReadOnlyDictionary<string, RawTable> Tables { get; } = tables;
    public InputLimits Limits { get; } = limits;
    public List<InputProblem> Problems { get; } = problems;

    public bool Has(string table) => Tables.ContainsKey(table);

    public RawTable? Table(string name) => Tables.GetValueOrDefault(name);

    /// <summary>A table bound to its schema with the units of the <c>info</c> table; header problems are reported here.</summary>
    public TableView View(RawTable table, TableSpec spec, bool relativeStiffness = false) =>
        new(table, spec, Defaults, Problems, relativeStiffness, Limits);

    // ---- problems --------------------------------------------------------------------------------

    /// <summary>The whole submission, for problems that belong to no table.</summary>
    public SourceRef Whole => new(Path.GetFileName(Source.TrimEnd('/', '\\')));

    public bool HasErrors => Problems.Any(p => p.IsError);

    public void Error(SourceRef where, string message) => Problems.Add(new InputProblem(where, message));

    public void Warn(SourceRef where, string message) => Problems.Add(new InputProblem(where, message, ProblemSeverity.Warning));

    /// <summary>Reports a missing table, unless its file is there but could not be read (already reported).</summary>
    public void MissingTable(string name, string? hint = null)
    {
        if (!Problems.Any(p => p.IsError && p.Where.Row is null && string.Equals(p.Where.File, name + ".csv", StringComparison.OrdinalIgnoreCase)))
            Error(Whole, Messages.MissingTable(name, hint));
    }

    /// <summary>
    /// The ids (from <paramref name="idColumn"/>) of the rows of a table that carry an error, or of every row when the
    /// error is in the table's header (a missing column, a unit that cannot be read).
    /// </summary>
    public List<(string Id, RawRow Row)> RowsWithErrors(TableView v, string idColumn, string fallback = "")
    {
        var lines = Problems.Where(p => p.IsError && p.Where.Table == v.Spec.Name && p.Where.File == v.Raw.File && p.Where.Row is not null)
            .Select(p => (p.Where.Row!.Value, p.Where.Page)).ToHashSet();
        bool header = lines.Contains((v.Raw.Header.Line, v.Raw.Header.Page));
        return v.Rows.Where(r => header || lines.Contains((r.Line, r.Page))).Select(r => (Id: v.Text(r, idColumn) is { Length: > 0 } id ? id : fallback, Row: r))
            .Where(x => x.Id.Length > 0).ToList();
    }

    // Ids of rows left out because of an error already reported: a later reference to one of them is not reported again
    // (a joint whose x is "six" must not also be "not in the joints table", nor its case "without loads").
    public HashSet<string> RejectedJoints { get; } = new(StringComparer.Ordinal);
    public HashSet<string> RejectedMembers { get; } = new(StringComparer.Ordinal);
    public HashSet<string> RejectedCases { get; } = new(StringComparer.Ordinal);
    public HashSet<string> JointsOfRejectedMembers { get; } = new(StringComparer.Ordinal);

    /// <summary>True when a geometry table is missing: references to members and joints are then not checked.</summary>
    public bool GeometryIncomplete { get; set; }

    // ---- units -----------------------------------------------------------------------------------

    /// <summary>The force and length units of the <c>info</c> table (none until it is read).</summary>
    public UnitDefaults Defaults { get; set; } = new(null, null);

    private readonly Dictionary<string, UnitChoice> _seenUnits = [];

    /// <summary>Remembers the unit a column gave itself, for the units the memo reports in (the first of each kind wins).</summary>
    public void Remember(TableView v, string column, QuantityKind kind, string? slot = null)
    {
        if (v.Unit(column) is UnitChoice u && v.HasOwnUnit(column)) _seenUnits.TryAdd(slot ?? kind.ToString(), u);
    }

    public UnitChoice? SeenUnit(string slot) => _seenUnits.GetValueOrDefault(slot);

    /// <summary>The units the submission reports in: those its columns gave, else the <c>info</c> defaults, else kN and m.</summary>
    public DisplayUnits DisplayUnits()
    {
        var force = SeenUnit(nameof(QuantityKind.Force)) ?? Defaults.Force ?? new UnitChoice("kN", 1e3);
        var length = SeenUnit(nameof(QuantityKind.Length)) ?? Defaults.Length ?? new UnitChoice("m", 1);
        var moment = SeenUnit(nameof(QuantityKind.Moment)) ?? Defaults.For(QuantityKind.Moment)
                     ?? UnitReader.Derive(QuantityKind.Moment, force, length);
        var disp = SeenUnit("displacement")
                   ?? (length.Symbol == "m" ? new UnitChoice("mm", 1e-3) : length);
        return new DisplayUnits(force, length, moment, disp);
    }

    // ---- the submission built so far -------------------------------------------------------------

    public SubmissionInfo Info { get; set; } = SubmissionInfo.Empty;

    /// <summary>The <c>info</c> values as written, by key, with where each was read.</summary>
    public Dictionary<string, (string Value, SourceRef Where)> InfoValues { get; } = new(StringComparer.Ordinal);

    /// <summary>Whether the members (or spans) table gives E; without it, stiffnesses are relative.</summary>
    public bool HasE { get; } = StiffnessGiven(tables);

    public AxialBehaviour Axial { get; set; } = AxialBehaviour.Rigid;

    /// <summary>Which geometry tables the submission gives (decided before any of them is read).</summary>
    public GeometryLayout Layout { get; set; } = GeometryLayout.None;

    public List<Joint> Joints { get; } = [];
    public List<Member> Members { get; } = [];

    private StructureModel? _model;

    /// <summary>The structure, once the geometry tables are read.</summary>
    public StructureModel Model
    {
        get => _model ?? throw new InvalidOperationException("The structure is assembled after the geometry tables are read.");
        set => _model = value;
    }

    public List<LoadCase> Cases { get; } = [];

    /// <summary>The claims; <see cref="Claims.None"/> until the end-moments table is read.</summary>
    public Claims Claims { get; set; } = Claims.None;

    public IReadOnlyList<WorkingTable> WorkingTables { get; set; } = [];

    /// <summary>The load combinations (<see cref="CombinationsReader"/>); empty until that table is read.</summary>
    public List<Combination> Combinations { get; } = [];

    /// <summary>
    /// Whether a claim of <paramref name="v"/>'s table may name case <paramref name="c"/>: a load case or a combination
    /// without a patterned case. A patterned combination is an input error (its claims go in the envelopes table); an
    /// unknown case is one unless the model has support movements (a case of movements alone), or the case was left
    /// out for an error already reported.
    /// </summary>
    public bool ClaimCase(TableView v, RawRow row, string c, bool unknownAllowed = false)
    {
        if (Combinations.FirstOrDefault(x => x.Name == c) is { } combination)
        {
            if (!combination.IsPatterned) return true;
            Error(v.CellRef(row, "case"), Messages.ClaimNamesPatterned(c, v.Spec.Name));
            return false;
        }
        if (unknownAllowed || Cases.Any(x => x.Id == c) || Model.HasSupportMovements) return true;
        if (!RejectedCases.Contains(c) && Has("loads")) Error(v.CellRef(row, "case"), Messages.CaseWithoutLoads(c));
        return false;
    }

    private static bool StiffnessGiven(IReadOnlyDictionary<string, RawTable> tables)
    {
        var t = tables.GetValueOrDefault("members") ?? tables.GetValueOrDefault("spans");
        if (t is null) return false;
        bool e = t.Header.Cells.Any(c => TableSchema.Normalize(TableSchema.SplitHeader(c).Name) is "e" or "modulus" or "elastic modulus" or "young's modulus");
        return e && !RelativeI(t);
    }

    /// <summary>True when the table's I column is headed as relative (<c>I (rel.)</c>, <c>I/I₀</c>, <c>k</c>): stiffness is then relative, E = 1.</summary>
    public static bool RelativeI(RawTable t)
    {
        for (int i = 0; i < t.Header.Cells.Count; i++)
        {
            string cell = t.Header.Cells[i];
            var spec = TableSchema.Find(t.Name) ?? TableSchema.Members;
            if (TableSchema.ResolveColumn(spec, TableSchema.SplitHeader(cell).Name)?.Name != "I") continue;
            if (TableSchema.IsRelativeStiffness(cell)) return true;
            if (TableSchema.SplitHeader(cell).Unit is null && t.ColumnUnits?.TryGetValue(i, out var u) == true && TableSchema.IsRelativeUnit(u)) return true;
        }
        return false;
    }

    /// <summary>Warns once that the E column is not used because I is given as relative.</summary>
    public void WarnEIgnored(TableView v)
    {
        if (!HasE && v.Has("E") && RelativeI(v.Raw)) Warn(v.HeaderRef("E"), Messages.EIgnoredForRelativeI);
    }
}

/// <summary>The geometry tables a submission gives: a frame (joints and members) or a beam (supports and spans).</summary>
internal enum GeometryLayout
{
    None,
    Frame,
    Beam,
}
