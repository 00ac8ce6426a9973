namespace CrossCheck.Model;

/// <summary>How the claimed member-end moments are signed in the submission.</summary>
public enum SignConvention
{
    /// <summary>Moment of the joint on the member end, clockwise positive (slope-deflection / moment distribution).</summary>
    Clockwise,
    /// <summary>Internal bending moment, positive when the right-hand fibre (facing start to end) is in tension.</summary>
    Sagging,
}

/// <summary>A unit the submission uses for one kind of quantity, with its factor to SI.</summary>
/// <param name="Symbol">Symbol for display, e.g. <c>kN·m</c>.</param>
/// <param name="ToSi">Multiply a value in this unit by this to get SI.</param>
public sealed record UnitChoice(string Symbol, double ToSi)
{
    public double FromSi(double si) => si / ToSi;
    public double ToSiValue(double value) => value * ToSi;
}

/// <summary>The units the submission's numbers are reported in.</summary>
public sealed record DisplayUnits(UnitChoice Force, UnitChoice Length, UnitChoice Moment, UnitChoice Displacement)
{
    public static DisplayUnits Si { get; } = new(new("kN", 1e3), new("m", 1), new("kN·m", 1e3), new("mm", 1e-3));
}

/// <summary>Title block and settings from the <c>info</c> table.</summary>
public sealed record SubmissionInfo(
    string? Title,
    string? Reference,
    string? Revision,
    string? PreparedBy,
    string? CheckedBy,
    string? Date,
    SignConvention SignConvention,
    DisplayUnits Units,
    IReadOnlyDictionary<string, string> Other)
{
    /// <summary>True when the submission states its sign convention; false when the default (clockwise) is assumed.</summary>
    public bool SignConventionStated { get; init; }

    public static SubmissionInfo Empty { get; } =
        new(null, null, null, null, null, null, SignConvention.Clockwise, DisplayUnits.Si, new Dictionary<string, string>());
}

/// <summary>A calculation under review: title block, structure, load cases and the author's claims.</summary>
/// <param name="Source">Path of the submission as given (folder, CSV or PDF).</param>
public sealed record Submission(string Source, SubmissionInfo Info, StructureModel Model, IReadOnlyList<LoadCase> Cases, Claims Claims)
{
    /// <summary>Moment-distribution working tables the author included, if any.</summary>
    public IReadOnlyList<WorkingTable> WorkingTables { get; init; } = [];

    /// <summary>The load combinations of the <c>combinations</c> table, in the order first read.</summary>
    public IReadOnlyList<Combination> Combinations { get; init; } = [];

    public LoadCase? Case(string id) => Cases.FirstOrDefault(c => c.Id == id);

    /// <summary>The combination named <paramref name="name"/>, if there is one.</summary>
    public Combination? Combination(string name) => Combinations.FirstOrDefault(c => c.Name == name);

    /// <summary>
    /// The load cases with every combination that has no patterned case as a derived case (its factored loads under its
    /// name): what claims may name and what the analysis answers for.
    /// </summary>
    public IReadOnlyList<LoadCase> CasesWithCombinations() =>
        Combinations.Count == 0 ? Cases : [.. Cases, .. Combinations.Where(c => !c.IsPatterned).Select(c => c.AllLoaded(Cases))];
}
