using CrossCheck.Common;
using CrossCheck.Import.Tables;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// Turns the raw tables of a submission (from CSV or PDF) into a <see cref="Submission"/>: resolves units,
/// converts to SI and to the clockwise member-end convention, and validates everything a checking engineer
/// would check before trusting the model. All problems are collected in one pass.
/// </summary>
/// <remarks>
/// Each table of the format has its reader (<see cref="ITableReader"/>, in <c>Import/Tables</c>); they share a
/// <see cref="SubmissionDraft"/> and run in the order of <see cref="Readers"/>, which is also the order problems are
/// reported in. To add a table: its <see cref="TableSpec"/> in <see cref="TableSchema"/>, a reader, and its line here.
/// </remarks>
public sealed class SubmissionBuilder
{
    /// <summary>The steps of a build, in order: each reads one table (or checks what the tables before it built).</summary>
    private static readonly ITableReader[] Readers =
    [
        new InfoReader(),          // title block, default units, sign convention, axial behaviour
        new GeometryLayoutStep(),  // frame or beam, and which geometry table is missing
        new JointsReader(),
        new MembersReader(),
        new BeamReader(),          // supports + spans
        new StructureAssembly(),   // the model from the geometry, checked as a whole
        new ModelSanity(),         // coincident joints, members through joints or twice, look-alike ids: warnings
        new LoadsReader(),
        new CombinationsReader(),  // factored cases, before the claims that may name them
        new EndMomentsReader(),
        new ReactionsReader(),
        new DisplacementsReader(),
        new SpanMomentsReader(),
        new ShearsReader(),
        new EnvelopesReader(),
        new DistributionReader(),
    ];

    private SubmissionBuilder()
    {
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
        foreach (var t in tables.Select(t => WithoutControls(t, problems)))
        {
            var spec = TableSchema.Find(t.Name);
            var where = t.HeaderAt(t.Name);
            if (spec is null) { problems.Add(new InputProblem(where, Messages.UnknownTable(t.Name), ProblemSeverity.Warning)); continue; }
            if (!byName.TryAdd(spec.Name, t)) problems.Add(new InputProblem(where, Messages.DuplicateTable(spec.Name)));
        }
        // Over a limit, nothing else is read: the other messages would only follow from the table left out.
        if (OverLimits(byName, limits) is { } over) return new ImportResult(null, Collapse([.. problems, over]));
        // Nothing could be read at all: the reader said why; "no joints table, no loads table, ..." would add nothing.
        if (byName.Count == 0 && problems.Any(p => p.IsError)) return new ImportResult(null, Collapse(problems));
        var draft = new SubmissionDraft(source, byName, limits, problems);
        foreach (var reader in Readers) reader.Read(draft);
        if (draft.HasErrors) return new ImportResult(null, Collapse(problems));
        var info = draft.Info with { Units = draft.DisplayUnits() };
        var submission = new Submission(TextSafety.Clean(source), info, draft.Model, draft.Cases, draft.Claims)
        {
            WorkingTables = draft.WorkingTables,
            Combinations = draft.Combinations,
        };
        return new ImportResult(submission, Collapse(problems));
    }

    /// <summary>
    /// The same message at the same place once, with how many times it was found ("... (13496 times)"): a header of one unknown
    /// column repeated thousands of times is one warning, not thousands.
    /// </summary>
    internal static List<InputProblem> Collapse(List<InputProblem> problems)
    {
        var counts = new Dictionary<(string, string, ProblemSeverity), int>();
        foreach (var p in problems) counts[(p.Where.Compact, p.Message, p.Severity)] = counts.GetValueOrDefault((p.Where.Compact, p.Message, p.Severity)) + 1;
        if (counts.Count == problems.Count) return problems;
        var seen = new HashSet<(string, string, ProblemSeverity)>();
        return problems.Where(p => seen.Add((p.Where.Compact, p.Message, p.Severity)))
            .Select(p => counts[(p.Where.Compact, p.Message, p.Severity)] is var n and > 1 ? p with { Message = $"{p.Message} ({Words.Count(n, "time")})" } : p)
            .ToList();
    }

    /// <summary>
    /// The table with control characters removed from every cell (an escape sequence in a title would reach the terminal, the
    /// memo and the register), with one warning naming the first cell that held any and how many did.
    /// </summary>
    private static RawTable WithoutControls(RawTable t, List<InputProblem> problems)
    {
        int count = 0;
        RawRow? first = null;
        RawRow Clean(RawRow r)
        {
            if (!r.Cells.Any(TextSafety.NeedsControlRemoval) && !(r.Printed?.Any(TextSafety.NeedsControlRemoval) ?? false)) return r;
            count += r.Cells.Count(TextSafety.NeedsControlRemoval);
            first ??= r;
            return r with { Cells = r.Cells.Select(TextSafety.WithoutControls).ToList(), Printed = r.Printed?.Select(TextSafety.WithoutControls).ToList() };
        }
        var header = Clean(t.Header);
        var rows = t.Rows.Select(Clean).ToList();
        if (first is null) return t;
        problems.Add(new InputProblem(new SourceRef(t.File, t.Name, first.Line, null, first.Page), Messages.ControlCharacters(Math.Max(count, 1)), ProblemSeverity.Warning));
        return t with { Name = TextSafety.WithoutControls(t.Name), Header = header, Rows = rows };
    }

    /// <summary>The first limit of <see cref="InputLimits"/> the tables go over (rows, members, joints, load cases), at the table's header.</summary>
    private static InputProblem? OverLimits(Dictionary<string, RawTable> tables, InputLimits limits)
    {
        static SourceRef At(RawTable t) => t.HeaderAt(t.Name);
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
}
