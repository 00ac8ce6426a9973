using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// Turns the raw tables of a submission (from CSV or PDF) into a <see cref="Submission"/>: resolves units,
/// converts to SI and to the clockwise member-end convention, and validates everything a checking engineer
/// would check before trusting the model. All problems are collected in one pass.
/// </summary>
public sealed class SubmissionBuilder
{
    private static readonly Dictionary<string, Restraint> RestraintWords = new(StringComparer.Ordinal)
    {
        ["free"] = Restraint.Free, ["none"] = Restraint.Free, ["fixed"] = Restraint.Fixed, ["fix"] = Restraint.Fixed,
        ["encastre"] = Restraint.Fixed, ["clamped"] = Restraint.Fixed, ["built in"] = Restraint.Fixed,
        ["pinned"] = Restraint.Pinned, ["pin"] = Restraint.Pinned, ["hinged"] = Restraint.Pinned,
        ["roller"] = Restraint.Roller, ["simple"] = Restraint.Roller, ["guided"] = Restraint.Guided, ["sliding"] = Restraint.Guided,
    };

    private static readonly Dictionary<string, Hinge> HingeWords = new(StringComparer.Ordinal)
    {
        ["none"] = Hinge.None, ["start"] = Hinge.Start, ["end"] = Hinge.End, ["both"] = Hinge.Both,
        ["i"] = Hinge.Start, ["j"] = Hinge.End,
    };

    private static readonly Dictionary<string, LoadDirection> DirWords = new(StringComparer.Ordinal)
    {
        ["down"] = LoadDirection.Down, ["up"] = LoadDirection.Up, ["left"] = LoadDirection.Left, ["right"] = LoadDirection.Right,
        ["-y"] = LoadDirection.Down, ["+y"] = LoadDirection.Up, ["-x"] = LoadDirection.Left, ["+x"] = LoadDirection.Right,
        ["gravity"] = LoadDirection.Down,
    };

    private enum Kind { Point, Udl, Linear, Moment, Force }

    private static readonly Dictionary<string, Kind> KindWords = new(StringComparer.Ordinal)
    {
        ["point"] = Kind.Point, ["concentrated"] = Kind.Point, ["conc"] = Kind.Point,
        ["udl"] = Kind.Udl, ["uniform"] = Kind.Udl, ["distributed"] = Kind.Udl,
        ["linear"] = Kind.Linear, ["trapezoidal"] = Kind.Linear, ["triangular"] = Kind.Linear, ["varying"] = Kind.Linear,
        ["moment"] = Kind.Moment, ["couple"] = Kind.Moment, ["force"] = Kind.Force,
    };

    private readonly List<InputProblem> _problems = [];
    private readonly string _source;
    private readonly Dictionary<string, RawTable> _tables;
    private readonly InputLimits _limits;

    private SubmissionBuilder(string source, Dictionary<string, RawTable> tables, InputLimits limits)
    {
        _source = source;
        _tables = tables;
        _limits = limits;
    }

    /// <summary>Builds a submission from raw tables keyed by their format name (see <see cref="TableSchema"/>).</summary>
    /// <param name="source">Path of the submission as given, for the memo.</param>
    /// <param name="tables">Tables found in the input.</param>
    /// <param name="earlier">Problems already found while reading the files.</param>
    /// <param name="limits">Bounds on rows, members, joints, load cases and magnitudes (defaults when null).</param>
    public static ImportResult Build(string source, IEnumerable<RawTable> tables, IEnumerable<InputProblem>? earlier = null, InputLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(tables);
        limits ??= InputLimits.Default;
        var problems = new List<InputProblem>(earlier ?? []);
        var byName = new Dictionary<string, RawTable>(StringComparer.Ordinal);
        foreach (var t in tables)
        {
            var spec = TableSchema.Find(t.Name);
            var where = new SourceRef(t.File, t.Name, t.Header.Line, null, t.Header.Page);
            if (spec is null) { problems.Add(new InputProblem(where, Messages.UnknownTable(t.Name), ProblemSeverity.Warning)); continue; }
            if (!byName.TryAdd(spec.Name, t)) problems.Add(new InputProblem(where, Messages.DuplicateTable(spec.Name)));
        }
        // Over a limit, nothing else is read: the other messages would only follow from the table left out.
        if (OverLimits(byName, limits) is { } over) return new ImportResult(null, [.. problems, over]);
        // Nothing could be read at all: the reader said why; "no joints table, no loads table, ..." would add nothing.
        if (byName.Count == 0 && problems.Any(p => p.IsError)) return new ImportResult(null, problems);
        var b = new SubmissionBuilder(source, byName, limits);
        b._problems.AddRange(problems);
        var submission = b.Run();
        return new ImportResult(b._problems.Any(p => p.IsError) ? null : submission, b._problems);
    }

    /// <summary>The first limit of <see cref="InputLimits"/> the tables go over (rows, members, joints, load cases), at the table's header.</summary>
    private static InputProblem? OverLimits(Dictionary<string, RawTable> tables, InputLimits limits)
    {
        static SourceRef At(RawTable t) => new(t.File, t.Name, t.Header.Line, null, t.Header.Page);
        static int Rows(RawTable t) => t.Rows.Count(r => !r.IsBlank);
        foreach (var t in tables.Values)
            if (Rows(t) > limits.MaxRows) return new InputProblem(At(t), Messages.TooManyRows(t.Name, Rows(t), limits.MaxRows));
        foreach (var name in new[] { "members", "spans" })
            if (tables.TryGetValue(name, out var m) && Rows(m) > limits.MaxMembers) return new InputProblem(At(m), Messages.TooManyMembers(Rows(m), limits.MaxMembers));
        foreach (var name in new[] { "joints", "supports" })
            if (tables.TryGetValue(name, out var j) && Rows(j) > limits.MaxJoints) return new InputProblem(At(j), Messages.TooManyJoints(Rows(j), limits.MaxJoints));
        if (tables.TryGetValue("loads", out var loads))
        {
            int caseColumn = -1;
            for (int i = 0; i < loads.Header.Cells.Count; i++)
                if (TableSchema.ResolveColumn(TableSchema.Loads, TableSchema.SplitHeader(loads.Header.Cells[i]).Name)?.Name == "case") { caseColumn = i; break; }
            int cases = caseColumn < 0 ? 1 : loads.Rows.Where(r => !r.IsBlank).Select(r => r.Cell(caseColumn).Trim()).Distinct(StringComparer.Ordinal).Count();
            if (cases > limits.MaxLoadCases) return new InputProblem(At(loads), Messages.TooManyCases(cases, limits.MaxLoadCases));
        }
        return null;
    }

    private void Error(SourceRef where, string message) => _problems.Add(new InputProblem(where, message));

    /// <summary>Reports a missing table, unless its file is there but could not be read (already reported).</summary>
    private void MissingTable(string name, string? hint = null)
    {
        if (!_problems.Any(p => p.IsError && p.Where.Row is null && string.Equals(p.Where.File, name + ".csv", StringComparison.OrdinalIgnoreCase)))
            Error(Whole, Messages.MissingTable(name, hint));
    }

    // Ids of rows left out because of an error already reported: a later reference to one of them is not reported again
    // (a joint whose x is "six" must not also be "not in the joints table", nor its case "without loads").
    private readonly HashSet<string> _rejectedJoints = new(StringComparer.Ordinal);
    private readonly HashSet<string> _rejectedMembers = new(StringComparer.Ordinal);
    private readonly HashSet<string> _rejectedCases = new(StringComparer.Ordinal);
    private readonly HashSet<string> _jointsOfRejectedMembers = new(StringComparer.Ordinal);

    /// <summary>
    /// The ids (from <paramref name="idColumn"/>) of the rows of a table that carry an error, or of every row when the
    /// error is in the table's header (a missing column, a unit that cannot be read).
    /// </summary>
    private List<(string Id, RawRow Row)> RowsWithErrors(TableView v, string idColumn, string fallback = "")
    {
        var lines = _problems.Where(p => p.IsError && p.Where.Table == v.Spec.Name && p.Where.File == v.Raw.File && p.Where.Row is not null)
            .Select(p => (p.Where.Row!.Value, p.Where.Page)).ToHashSet();
        bool header = lines.Contains((v.Raw.Header.Line, v.Raw.Header.Page));
        return v.Rows.Where(r => header || lines.Contains((r.Line, r.Page))).Select(r => (Id: v.Text(r, idColumn) is { Length: > 0 } id ? id : fallback, Row: r))
            .Where(x => x.Id.Length > 0).ToList();
    }
    private void Warn(SourceRef where, string message) => _problems.Add(new InputProblem(where, message, ProblemSeverity.Warning));

    private SourceRef Whole => new(Path.GetFileName(_source.TrimEnd('/', '\\')));

    private Submission? Run()
    {
        var (info, defaults, rawInfo) = ReadInfo();
        bool hasE = HasE();
        var axial = ParseAxial(rawInfo);
        var (joints, members) = ReadGeometry(defaults, hasE);
        var model = new StructureModel(joints, members, axial, relativeStiffness: !hasE);
        ValidateModel(model, hasE, axial);
        var cases = ReadLoads(defaults, model);
        var claims = ReadClaims(defaults, model, info.SignConvention, cases);
        var units = DisplayUnitsFor(defaults);
        info = info with { Units = units };
        var working = _tables.TryGetValue("distribution", out var dt) && !_geometryIncomplete
            ? WorkingTableReader.Read(dt, model, defaults.For(QuantityKind.Moment) ?? _seenUnits.GetValueOrDefault(nameof(QuantityKind.Moment)), _problems, _limits)
            : [];
        if (_problems.Any(p => p.IsError)) return null;
        return new Submission(_source, info, model, cases, claims) { WorkingTables = working };
    }

    private bool HasE()
    {
        var t = _tables.GetValueOrDefault("members") ?? _tables.GetValueOrDefault("spans");
        if (t is null) return false;
        return t.Header.Cells.Any(c => TableSchema.Normalize(TableSchema.SplitHeader(c).Name) is "e" or "modulus" or "elastic modulus" or "young's modulus");
    }

    // ---- info ------------------------------------------------------------------------------------

    private (SubmissionInfo Info, UnitDefaults Defaults, Dictionary<string, (string Value, SourceRef Where)> Raw) ReadInfo()
    {
        var raw = new Dictionary<string, (string, SourceRef)>(StringComparer.Ordinal);
        UnitChoice? force = null, length = null;
        var sign = SignConvention.Clockwise;
        if (_tables.TryGetValue("info", out var t))
        {
            var view = new TableView(t, TableSchema.Info, new UnitDefaults(null, null), _problems, limits: _limits);
            foreach (var row in view.Rows)
            {
                string printedKey = view.Text(row, "key");
                string key = TableSchema.InfoKey(printedKey) ?? TableSchema.Normalize(printedKey);
                string value = view.Text(row, "value");
                if (key.Length == 0) continue;
                var where = view.CellRef(row, "value");
                if (raw.TryGetValue(key, out var first))
                {
                    // A setting given twice with different values contradicts itself; a free-text key keeps its first value.
                    if (TableSchema.InfoKeys.ContainsKey(key) && !string.Equals(TableSchema.Normalize(first.Item1), TableSchema.Normalize(value), StringComparison.Ordinal))
                        Error(where, Messages.InfoKeyTwice(printedKey, first.Item1, first.Item2.RowCompact, value));
                    continue;
                }
                raw.Add(key, (value, where));
                switch (key)
                {
                    case "force unit":
                        force = UnitReader.TryRead(value, QuantityKind.Force);
                        if (force is null) Error(where, Messages.NotAForceUnit(value));
                        break;
                    case "length unit":
                        length = UnitReader.TryRead(value, QuantityKind.Length);
                        if (length is null) Error(where, Messages.NotALengthUnit(value));
                        break;
                    case "sign convention":
                        if (ParseSign(value) is SignConvention sc) sign = sc;
                        else Error(where, Messages.BadWord("sign convention", value, ["clockwise", "sagging"]));
                        break;
                }
            }
        }
        string? Get(string key) => raw.TryGetValue(key, out var v) && v.Item1.Length > 0 ? v.Item1 : null;
        var other = raw.Where(kv => !TableSchema.InfoKeys.ContainsKey(kv.Key)).ToDictionary(kv => kv.Key, kv => kv.Value.Item1, StringComparer.Ordinal);
        var info = new SubmissionInfo(Get("title"), Get("reference"), Get("revision"),
            Get("prepared by"), Get("checked by"), Get("date"), sign, DisplayUnits.Si, other) { SignConventionStated = raw.ContainsKey("sign convention") };
        _defaults = new UnitDefaults(force, length);
        return (info, _defaults, raw);
    }

    /// <summary>
    /// Reads a sign-convention statement: <c>clockwise</c>, <c>sagging</c>, or a phrase holding exactly one of them
    /// (<c>clockwise moments positive</c>). Anticlockwise and hogging-positive conventions are not supported.
    /// </summary>
    private static SignConvention? ParseSign(string value)
    {
        string v = TableSchema.Normalize(value);
        if (v is "cw") return SignConvention.Clockwise;
        if (v is "bending") return SignConvention.Sagging;
        var words = v.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        if (words.Any(w => w is "anticlockwise" or "counterclockwise" or "counter" or "anti") || v.Contains("hogging positive", StringComparison.Ordinal)) return null;
        bool cw = words.Contains("clockwise"), sag = words.Contains("sagging");
        return cw == sag ? null : cw ? SignConvention.Clockwise : SignConvention.Sagging;
    }

    private UnitDefaults _defaults = new(null, null);
    private readonly Dictionary<string, UnitChoice> _seenUnits = [];

    private AxialBehaviour ParseAxial(Dictionary<string, (string Value, SourceRef Where)> raw)
    {
        if (!raw.TryGetValue("axial", out var a) || a.Value.Length == 0) return AxialBehaviour.Rigid;
        string v = TableSchema.Normalize(a.Value);
        if (v is "rigid" or "inextensible") return AxialBehaviour.Rigid;
        if (v is "elastic" or "flexible") return AxialBehaviour.Elastic;
        Error(a.Where, Messages.BadWord("axial", a.Value, ["rigid", "elastic"]));
        return AxialBehaviour.Rigid;
    }

    // ---- geometry --------------------------------------------------------------------------------

    /// <summary>True when a geometry table is missing: references to members and joints are then not checked.</summary>
    private bool _geometryIncomplete;

    private (List<Joint> Joints, List<Member> Members) ReadGeometry(UnitDefaults defaults, bool hasE)
    {
        bool frame = _tables.ContainsKey("joints") || _tables.ContainsKey("members");
        bool beam = _tables.ContainsKey("supports") || _tables.ContainsKey("spans");
        if (frame && beam) Error(Whole, Messages.BothGeometries);
        if (beam && !frame) return ReadBeam(defaults, hasE);
        if (!frame) { Error(Whole, Messages.NoGeometry); _geometryIncomplete = true; return ([], []); }
        if (!_tables.ContainsKey("joints")) { MissingTable("joints"); _geometryIncomplete = true; }
        if (!_tables.ContainsKey("members")) { MissingTable("members"); _geometryIncomplete = true; }
        var joints = _tables.ContainsKey("joints") ? ReadJoints(defaults) : [];
        var members = _tables.ContainsKey("members") ? ReadMembers(defaults, hasE, joints) : [];
        return (joints, members);
    }

    private List<Joint> ReadJoints(UnitDefaults defaults)
    {
        var jv = new TableView(_tables["joints"], TableSchema.Joints, defaults, _problems, limits: _limits);
        Remember(jv, "x", QuantityKind.Length);
        var joints = new List<Joint>();
        var firstSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in jv.Rows)
        {
            string? id = jv.Id(row, "joint");
            double? x = jv.Length(row, "x", required: true);
            double? y = jv.Length(row, "y", required: true);
            var restraint = ParseRestraint(jv, row, "restraint", Restraint.Free);
            double sx = jv.Number(row, "settle x") ?? 0, sy = jv.Number(row, "settle y") ?? 0, sr = jv.Number(row, "settle rotation") ?? 0;
            if (id is null || x is null || y is null) continue;
            if (!firstSeen.TryAdd(id, jv.RowRef(row))) { Error(jv.CellRef(row, "joint"), Messages.DuplicateId("joint", id, firstSeen[id].Compact)); continue; }
            CheckMovement(jv, row, restraint, id, sx, sy, sr, "settle x");
            joints.Add(new Joint(id, x.Value, y.Value, restraint, new SupportMovement(sx, sy, sr), jv.RowRef(row)));
        }
        foreach (var (id, _) in RowsWithErrors(jv, "joint")) _rejectedJoints.Add(id);
        return joints;
    }

    private List<Member> ReadMembers(UnitDefaults defaults, bool hasE, List<Joint> joints)
    {
        var mv = new TableView(_tables["members"], TableSchema.Members, defaults, _problems, relativeStiffness: !hasE, limits: _limits);
        var members = new List<Member>();
        var memberSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        var jointIds = joints.Select(j => j.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var row in mv.Rows)
        {
            string? id = mv.Id(row, "member");
            string? s = mv.Id(row, "start");
            string? e = mv.Id(row, "end");
            var (E, I, A) = Section(mv, row, hasE);
            var hinge = ParseHinge(mv, row);
            if (id is null || s is null || e is null) continue;
            if (!memberSeen.TryAdd(id, mv.RowRef(row))) { Error(mv.CellRef(row, "member"), Messages.DuplicateId("member", id, memberSeen[id].Compact)); continue; }
            // Without a joints table there is nothing to check the joint ids against (already reported).
            bool ok = !_geometryIncomplete;
            if (ok && !jointIds.Contains(s)) { if (!_rejectedJoints.Contains(s)) Error(mv.CellRef(row, "start"), Messages.UnknownJoint(s)); ok = false; }
            if (!_geometryIncomplete && !jointIds.Contains(e)) { if (!_rejectedJoints.Contains(e)) Error(mv.CellRef(row, "end"), Messages.UnknownJoint(e)); ok = false; }
            if (!ok) { _rejectedMembers.Add(id); _jointsOfRejectedMembers.Add(s); _jointsOfRejectedMembers.Add(e); }
            if (s == e) { Error(mv.CellRef(row, "end"), Messages.SameJoint(id)); ok = false; }
            else if (ok)
            {
                var a = joints.First(j => j.Id == s);
                var b = joints.First(j => j.Id == e);
                double len = Math.Sqrt(((b.X - a.X) * (b.X - a.X)) + ((b.Y - a.Y) * (b.Y - a.Y)));
                double scale = Math.Max(1, Math.Max(Math.Abs(a.X) + Math.Abs(a.Y), Math.Abs(b.X) + Math.Abs(b.Y)));
                if (!(len > 1e-9 * scale)) { Error(mv.RowRef(row), Messages.ZeroLength(id)); ok = false; }
                else if (len > _limits.MaxLength) { Error(mv.RowRef(row), Messages.MemberTooLong(id, len, _limits.MaxLength)); ok = false; }
            }
            if (!ok || E is null || I is null) continue;
            members.Add(new Member(id, s, e, E.Value, I.Value, A, hinge, mv.RowRef(row)));
        }
        foreach (var (id, row) in RowsWithErrors(mv, "member"))
        {
            _rejectedMembers.Add(id);
            _jointsOfRejectedMembers.Add(mv.Text(row, "start"));
            _jointsOfRejectedMembers.Add(mv.Text(row, "end"));
        }
        return members;
    }

    private (List<Joint> Joints, List<Member> Members) ReadBeam(UnitDefaults defaults, bool hasE)
    {
        if (!_tables.ContainsKey("supports")) MissingTable("supports", "a continuous beam given by spans needs its supports listed left to right");
        if (!_tables.ContainsKey("spans")) MissingTable("spans");
        if (!_tables.ContainsKey("supports") || !_tables.ContainsKey("spans")) { _geometryIncomplete = true; return ([], []); }
        var sv = new TableView(_tables["supports"], TableSchema.Supports, defaults, _problems, limits: _limits);
        var pv = new TableView(_tables["spans"], TableSchema.Spans, defaults, _problems, relativeStiffness: !hasE, limits: _limits);
        Remember(pv, "length", QuantityKind.Length);
        var supports = new List<(string Id, Restraint R, double Sy, double Sr, RawRow Row)>();
        var seen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in sv.Rows)
        {
            string? id = sv.Id(row, "support");
            var r = ParseRestraint(sv, row, "restraint", null);
            double sy = sv.Number(row, "settle y") ?? 0, sr = sv.Number(row, "settle rotation") ?? 0;
            if (id is null) continue;
            if (!seen.TryAdd(id, sv.RowRef(row))) { Error(sv.CellRef(row, "support"), Messages.DuplicateId("support", id, seen[id].Compact)); continue; }
            CheckMovement(sv, row, r, id, 0, sy, sr, null);
            supports.Add((id, r, sy, sr, row));
        }
        var spans = new List<(string Id, double L, double? E, double? I, double? A, Hinge H, RawRow Row)>();
        var spanSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in pv.Rows)
        {
            string? id = pv.Id(row, "span");
            double? len = pv.Length(row, "length", required: true);
            if (len is <= 0) Error(pv.CellRef(row, "length"), Messages.NotPositive("length", pv.Text(row, "length")));
            var (E, I, A) = Section(pv, row, hasE);
            var h = ParseHinge(pv, row);
            if (id is null) continue;
            if (!spanSeen.TryAdd(id, pv.RowRef(row))) { Error(pv.CellRef(row, "span"), Messages.DuplicateId("span", id, spanSeen[id].Compact)); continue; }
            // A span whose length could not be read keeps its place, so that the supports still line up (its error is reported).
            spans.Add((id, len ?? double.NaN, E, I, A, h, row));
        }
        if (spans.Count > 0 && supports.Count != spans.Count + 1)
        {
            Error(new SourceRef(sv.Raw.File, "supports", sv.Raw.Header.Line), Messages.SpanSupportCount(spans.Count, supports.Count));
            _geometryIncomplete = true;
            return ([], []);
        }
        var joints = new List<Joint>();
        double x = 0;
        for (int i = 0; i < supports.Count; i++)
        {
            var s = supports[i];
            joints.Add(new Joint(s.Id, x, 0, s.R, new SupportMovement(0, s.Sy, s.Sr), sv.RowRef(s.Row)));
            if (i < spans.Count && spans[i].L > 0) x += spans[i].L;
        }
        var members = new List<Member>();
        for (int i = 0; i < spans.Count; i++)
        {
            var p = spans[i];
            if (p.E is null || p.I is null || !(p.L > 0))
            {
                _rejectedMembers.Add(p.Id);
                _jointsOfRejectedMembers.Add(supports[i].Id);
                _jointsOfRejectedMembers.Add(supports[i + 1].Id);
                continue;
            }
            members.Add(new Member(p.Id, supports[i].Id, supports[i + 1].Id, p.E.Value, p.I.Value, p.A, p.H, pv.RowRef(p.Row)));
        }
        return (joints, members);
    }

    private (double? E, double? I, double? A) Section(TableView v, RawRow row, bool hasE)
    {
        double? E = 1;
        if (hasE)
        {
            E = v.Number(row, "E", required: true, requiredBecause: "E is given for other members");
            if (E is <= 0) { Error(v.CellRef(row, "E"), Messages.NotPositive("E", v.Text(row, "E"))); E = null; }
        }
        double? I = v.Number(row, "I", required: true);
        if (I is <= 0) { Error(v.CellRef(row, "I"), Messages.NotPositive("I", v.Text(row, "I"))); I = null; }
        double? A = v.Has("A") ? v.Number(row, "A") : null;
        if (A is <= 0) { Error(v.CellRef(row, "A"), Messages.NotPositive("A", v.Text(row, "A"))); A = null; }
        return (E, I, A);
    }

    private Restraint ParseRestraint(TableView v, RawRow row, string column, Restraint? fallback)
    {
        string text = v.Text(row, column);
        if (text.Length == 0)
        {
            if (fallback is Restraint f) return f;
            Error(v.CellRef(row, column), Messages.MissingValue(column, null));
            return Restraint.Free;
        }
        if (RestraintWords.TryGetValue(TableSchema.Normalize(text), out var r)) return r;
        Error(v.CellRef(row, column), Messages.BadWord(column, text, ["free", "fixed", "pinned", "roller", "guided"]));
        return Restraint.Free;
    }

    private Hinge ParseHinge(TableView v, RawRow row)
    {
        string text = v.Text(row, "hinge");
        if (text.Length == 0) return Hinge.None;
        if (HingeWords.TryGetValue(TableSchema.Normalize(text), out var h)) return h;
        Error(v.CellRef(row, "hinge"), Messages.BadWord("hinge", text, ["none", "start", "end", "both"]));
        return Hinge.None;
    }

    private void CheckMovement(TableView v, RawRow row, Restraint r, string id, double sx, double sy, double sr, string? xColumn)
    {
        if (sx != 0 && !r.HasFlag(Restraint.X) && xColumn is not null) Error(v.CellRef(row, xColumn), Messages.MovementNotRestrained(xColumn, id));
        if (sy != 0 && !r.HasFlag(Restraint.Y)) Error(v.CellRef(row, "settle y"), Messages.MovementNotRestrained("settle y", id));
        if (sr != 0 && !r.HasFlag(Restraint.Rotation)) Error(v.CellRef(row, "settle rotation"), Messages.MovementNotRestrained("settle rotation", id));
    }

    private void ValidateModel(StructureModel model, bool hasE, AxialBehaviour axial)
    {
        var touched = model.Members.SelectMany(m => new[] { m.Start, m.End }).ToHashSet(StringComparer.Ordinal);
        foreach (var j in model.Joints.Where(j => !_geometryIncomplete && !touched.Contains(j.Id) && !_jointsOfRejectedMembers.Contains(j.Id)))
            Error(j.Source, Messages.NoJointsConnected(j.Id));
        var parts = Parts(model);
        if (parts.Count > 1)
            Warn(Whole, Messages.SeparateParts(parts.Count, parts.Take(4).Select(p => p.Count <= 4 ? $"joints {string.Join(", ", p)}" : $"joints {string.Join(", ", p.Take(3))} and {p.Count - 3} more")));
        if (!hasE)
        {
            foreach (var j in model.Joints.Where(j => !j.Movement.IsZero))
                Error(j.Source, Messages.SettlementNeedsE);
        }
        if (axial == AxialBehaviour.Elastic)
        {
            if (!hasE) Error(Whole, Messages.AxialNeedsE);
            foreach (var m in model.Members.Where(m => m.A is null)) Error(m.Source.Cell("A"), Messages.AxialNeedsArea(m.Id));
        }
    }

    /// <summary>The joints of each separate structure the members form (joints without members left out), in submission order.</summary>
    private static List<List<string>> Parts(StructureModel model)
    {
        var parent = new Dictionary<string, string>(StringComparer.Ordinal);
        string Root(string j)
        {
            while (parent[j] != j) j = parent[j] = parent[parent[j]];
            return j;
        }
        foreach (var m in model.Members) { parent.TryAdd(m.Start, m.Start); parent.TryAdd(m.End, m.End); }
        foreach (var m in model.Members)
        {
            string a = Root(m.Start), b = Root(m.End);
            if (a != b) parent[b] = a;
        }
        return model.Joints.Where(j => parent.ContainsKey(j.Id)).GroupBy(j => Root(j.Id)).Select(g => g.Select(j => j.Id).ToList()).ToList();
    }

    // ---- loads -----------------------------------------------------------------------------------

    private List<LoadCase> ReadLoads(UnitDefaults defaults, StructureModel model)
    {
        if (!_tables.TryGetValue("loads", out var t)) { MissingTable("loads"); return []; }
        var v = new TableView(t, TableSchema.Loads, defaults, _problems, limits: _limits);
        Remember(v, "P", QuantityKind.Force);
        var loads = new List<Load>();
        var order = new List<string>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? on = v.Id(row, "on");
            string kindText = v.Text(row, "kind");
            if (on is null) continue;
            if (kindText.Length == 0) { Error(v.CellRef(row, "kind"), Messages.MissingValue("kind", null)); continue; }
            if (!KindWords.TryGetValue(TableSchema.Normalize(kindText), out var kind))
            {
                Error(v.CellRef(row, "kind"), Messages.BadWord("kind", kindText, ["point", "udl", "linear", "moment", "force"]));
                continue;
            }
            bool isMember = model.TryGetMember(on, out var member);
            bool isJoint = model.TryGetJoint(on, out _);
            if ((_geometryIncomplete || _rejectedMembers.Contains(on) || _rejectedJoints.Contains(on)) && !isMember && !isJoint) { _rejectedCases.Add(c); continue; }
            bool onMember;
            switch (kind)
            {
                case Kind.Force:
                    if (!isJoint) { Error(v.CellRef(row, "on"), isMember ? Messages.KindOnMember(kindText, on) : Messages.UnknownTarget(on)); continue; }
                    onMember = false;
                    break;
                case Kind.Moment:
                    if (isMember && isJoint) { Error(v.CellRef(row, "on"), Messages.Ambiguous(on)); continue; }
                    if (!isMember && !isJoint) { Error(v.CellRef(row, "on"), Messages.UnknownTarget(on)); continue; }
                    onMember = isMember;
                    break;
                case Kind.Point:
                    // A point load on a joint is a joint force.
                    if (isMember && isJoint) { Error(v.CellRef(row, "on"), Messages.Ambiguous(on)); continue; }
                    if (!isMember && !isJoint) { Error(v.CellRef(row, "on"), Messages.UnknownTarget(on)); continue; }
                    onMember = isMember;
                    if (!onMember) kind = Kind.Force;
                    break;
                default:
                    if (!isMember) { Error(v.CellRef(row, "on"), isJoint ? Messages.KindOnJoint(kindText, on) : Messages.UnknownTarget(on)); continue; }
                    onMember = true;
                    break;
            }
            var dir = ParseDir(v, row, kind);
            var where = v.RowRef(row);
            double L = onMember ? model.Length(member) : 0;
            string lu = v.Unit("a")?.Symbol ?? _defaults.Length?.Symbol ?? "m";
            double lf = v.Unit("a")?.ToSi ?? 1;
            Load? load = null;
            switch (kind)
            {
                case Kind.Point:
                {
                    double? p = v.Number(row, "P", required: true, requiredBecause: "a point load");
                    double? a = v.Number(row, "a", required: true, requiredBecause: "the position of a point load");
                    if (p is null || a is null || !InMember(v, row, "a", a.Value, L, lu, lf)) continue;
                    WarnNegative(v, row, "P", p.Value);
                    load = new PointLoad(c, on, p.Value, a.Value, dir, where);
                    break;
                }
                case Kind.Udl:
                case Kind.Linear:
                {
                    double? w = v.Number(row, "w", required: true, requiredBecause: "a distributed load");
                    double? w2 = kind == Kind.Linear ? v.Number(row, "w end", required: true, requiredBecause: "a linear load") : w;
                    double a = v.Number(row, "a") ?? 0;
                    double b = v.Number(row, "b") ?? L;
                    if (w is null || w2 is null) continue;
                    if (!InMember(v, row, "a", a, L, lu, lf) || !InMember(v, row, "b", b, L, lu, lf)) continue;
                    if (b < a) { Error(v.CellRef(row, "b"), Messages.LoadEndsReversed); continue; }
                    if (b == a) continue; // a load over no length does nothing
                    WarnNegative(v, row, "w", w.Value);
                    load = new DistributedLoad(c, on, w.Value, w2.Value, a, Math.Min(b, L), dir, where);
                    break;
                }
                case Kind.Moment:
                {
                    double? m = v.Number(row, "M", required: true, requiredBecause: "a moment load");
                    if (m is null) continue;
                    if (onMember)
                    {
                        double? a = v.Number(row, "a", required: true, requiredBecause: "the position of a couple on a member");
                        if (a is null || !InMember(v, row, "a", a.Value, L, lu, lf)) continue;
                        load = new MemberCouple(c, on, m.Value, a.Value, where);
                    }
                    else
                    {
                        load = new JointCouple(c, on, m.Value, where);
                    }
                    break;
                }
                case Kind.Force:
                {
                    double? p = v.Number(row, "P", required: true, requiredBecause: "a joint force");
                    if (p is null) continue;
                    WarnNegative(v, row, "P", p.Value);
                    load = new JointForce(c, on, p.Value, dir, where);
                    break;
                }
            }
            if (load is null) continue;
            loads.Add(load);
            if (!order.Contains(c)) order.Add(c);
        }
        if (!v.Rows.Any()) Error(new SourceRef(t.File, "loads", t.Header.Line, null, t.Header.Page), Messages.NoLoads);
        foreach (var (id, _) in RowsWithErrors(v, "case", "1")) _rejectedCases.Add(id);
        return order.Select(id => new LoadCase(id, loads.Where(l => l.Case == id).ToList())).ToList();
    }

    private LoadDirection ParseDir(TableView v, RawRow row, Kind kind)
    {
        string text = v.Text(row, "dir");
        if (text.Length == 0) return LoadDirection.Down;
        if (kind == Kind.Moment) { Warn(v.CellRef(row, "dir"), Messages.DirNotForKind("moment")); return LoadDirection.Down; }
        if (DirWords.TryGetValue(TableSchema.Normalize(text), out var d)) return d;
        Error(v.CellRef(row, "dir"), Messages.BadWord("dir", text, ["down", "up", "left", "right"]));
        return LoadDirection.Down;
    }

    private bool InMember(TableView v, RawRow row, string column, double value, double length, string unit, double toSi)
    {
        double tol = 1e-9 * Math.Max(1, length);
        if (value >= -tol && value <= length + tol) return true;
        Error(v.CellRef(row, column), Messages.LoadOutside(column, value / toSi, length / toSi, unit));
        return false;
    }

    private void WarnNegative(TableView v, RawRow row, string column, double value)
    {
        if (value < 0) Warn(v.CellRef(row, column), Messages.NegativeMagnitude(column));
    }

    // ---- claims ----------------------------------------------------------------------------------

    private Claims ReadClaims(UnitDefaults defaults, StructureModel model, SignConvention sign, List<LoadCase> cases)
    {
        if (!_tables.TryGetValue("end-moments", out var t))
        {
            if (_limits.ClaimsRequired) MissingTable("end-moments", "it holds the moments under review");
            return Claims.None;
        }
        var v = new TableView(t, TableSchema.EndMoments, defaults, _problems, limits: _limits);
        Remember(v, "moment", QuantityKind.Moment);
        var caseIds = cases.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        bool movements = model.HasSupportMovements;
        var moments = new List<ClaimedEndMoment>();
        var seen = new Dictionary<(string, string, MemberEnd), SourceRef>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? memberId = v.Id(row, "member");
            string? at = v.Id(row, "at");
            double? value = v.Number(row, "moment", required: true);
            if (memberId is null || at is null || value is null) continue;
            if (!caseIds.Contains(c) && !movements)
            {
                // A case whose loads were all left out for errors of their own is not reported again.
                if (!_rejectedCases.Contains(c) && _tables.ContainsKey("loads")) Error(v.CellRef(row, "case"), Messages.CaseWithoutLoads(c));
                continue;
            }
            MemberEnd? end = null;
            if (model.TryGetMember(memberId, out var member))
            {
                string atNorm = TableSchema.Normalize(at);
                end = member.EndAt(at) ?? (atNorm is "start" or "i" or "near" ? MemberEnd.Start : atNorm is "end" or "j" or "far" ? MemberEnd.End : null);
            }
            double cw = value.Value;
            if (sign == SignConvention.Sagging && end == MemberEnd.End) cw = -cw;
            double asWritten = value.Value / (v.Unit("moment")?.ToSi ?? 1);
            if (end is MemberEnd e && !seen.TryAdd((c, memberId, e), v.RowRef(row)))
            {
                Error(v.RowRef(row), Messages.DuplicateClaim(memberId, at, c, seen[(c, memberId, e)].Compact));
                continue;
            }
            moments.Add(new ClaimedEndMoment(c, memberId, at, end, cw, asWritten, v.CellRef(row, "moment")));
        }
        if (moments.Count == 0 && !v.Rows.Any()) Error(new SourceRef(t.File, "end-moments", t.Header.Line), Messages.NoClaims);

        var reactions = new List<ClaimedReaction>();
        if (_tables.TryGetValue("reactions", out var rt))
        {
            var rv = new TableView(rt, TableSchema.Reactions, defaults, _problems, limits: _limits);
            foreach (var row in rv.Rows)
            {
                string c = rv.Id(row, "case", required: false) ?? "1";
                string? joint = rv.Id(row, "joint");
                double? rx = rv.Number(row, "Rx"), ry = rv.Number(row, "Ry"), m = rv.Number(row, "M");
                if (joint is null) continue;
                reactions.Add(new ClaimedReaction(c, joint, rx, ry, m, rv.RowRef(row)));
            }
        }
        var displacements = new List<ClaimedDisplacement>();
        if (_tables.TryGetValue("displacements", out var dt))
        {
            var dv = new TableView(dt, TableSchema.Displacements, defaults, _problems, limits: _limits);
            Remember(dv, "ux", QuantityKind.Length, "displacement");
            Remember(dv, "uy", QuantityKind.Length, "displacement");
            foreach (var row in dv.Rows)
            {
                string c = dv.Id(row, "case", required: false) ?? "1";
                string? joint = dv.Id(row, "joint");
                double? ux = dv.Number(row, "ux"), uy = dv.Number(row, "uy"), rot = dv.Number(row, "rotation");
                if (joint is null) continue;
                displacements.Add(new ClaimedDisplacement(c, joint, ux, uy, rot, dv.RowRef(row)));
            }
        }
        return new Claims(moments, reactions, displacements);
    }

    // ---- display units ---------------------------------------------------------------------------

    private void Remember(TableView v, string column, QuantityKind kind, string? slot = null)
    {
        if (v.Unit(column) is UnitChoice u && v.HasOwnUnit(column)) _seenUnits.TryAdd(slot ?? kind.ToString(), u);
    }

    private DisplayUnits DisplayUnitsFor(UnitDefaults defaults)
    {
        var force = _seenUnits.GetValueOrDefault(nameof(QuantityKind.Force)) ?? defaults.Force ?? new UnitChoice("kN", 1e3);
        var length = _seenUnits.GetValueOrDefault(nameof(QuantityKind.Length)) ?? defaults.Length ?? new UnitChoice("m", 1);
        var moment = _seenUnits.GetValueOrDefault(nameof(QuantityKind.Moment)) ?? defaults.For(QuantityKind.Moment)
                     ?? UnitReader.Derive(QuantityKind.Moment, force, length);
        var disp = _seenUnits.GetValueOrDefault("displacement")
                   ?? (length.Symbol == "m" ? new UnitChoice("mm", 1e-3) : length);
        return new DisplayUnits(force, length, moment, disp);
    }

    /// <summary>Formats a number for messages in invariant culture.</summary>
    internal static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
