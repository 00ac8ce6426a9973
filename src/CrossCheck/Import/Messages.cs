using System.Globalization;

namespace CrossCheck.Import;

/// <summary>Every input-problem message in one place, so wording stays consistent and testable.</summary>
internal static class Messages
{
    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    public static string UnknownColumn(string header, TableSpec t) =>
        F($"column '{header}' is not part of table '{t.Name}' and was ignored (expected: {string.Join(", ", t.Columns.Select(c => c.Name))})");
    public static string DuplicateColumn(string name) => F($"column '{name}' appears twice; only the first is used");
    public static string MissingColumn(ColumnSpec c, TableSpec t) => F($"table '{t.Name}' needs a column '{c.Name}'");
    public static string MissingColumnForRow(string column, string? because) =>
        F($"this row needs a value in column '{column}'{Because(because)}, but the table has no such column");
    public static string EmptyId(string column) => F($"'{column}' is empty; every row needs one");
    public static string MissingValue(string column, string? because) => F($"'{column}' is empty{Because(because)}");
    public static string NotANumber(string column, string text, bool decimalComma) =>
        F($"'{column}' must be a number, got \"{text}\"{(decimalComma ? " (this file uses decimal commas)" : text.Contains(',') ? " (use '.' as the decimal point in comma-separated files)" : "")}");
    public static string OutOfRange(string column, string text) => F($"'{column}' = \"{text}\" is too large or too small to compute with");
    public static string BadUnit(string unit, ColumnSpec c) => F($"'{unit}' is not a unit of {UnitReader.Describe(c.Kind)} for column '{c.Name}'");
    public static string NoUnit(ColumnSpec c) =>
        F($"column '{c.Name}' has no unit: write it in the header, e.g. '{c.Name} [{Example(c.Kind)}]', or give 'force unit' and 'length unit' in the info table");
    private static string Because(string? b) => b is null ? "" : $" ({b})";

    private static string Example(QuantityKind k) => k switch
    {
        QuantityKind.Length => "m",
        QuantityKind.Force => "kN",
        QuantityKind.Moment => "kN·m",
        QuantityKind.ForcePerLength => "kN/m",
        QuantityKind.Modulus => "GPa",
        QuantityKind.SecondMoment => "mm^4",
        QuantityKind.Area => "mm^2",
        _ => "",
    };

    public static string MissingTable(string name, string? hint = null) => F($"the submission has no '{name}' table{(hint is null ? "" : "; " + hint)}");
    public static string UnknownTable(string name) =>
        F($"'{name}' is not a table of the submission format and was ignored (tables: {string.Join(", ", TableSchema.All.Select(t => t.Name))})");
    public static string DuplicateTable(string name) => F($"table '{name}' appears more than once; only the first is used");
    public static string BothGeometries => "give either joints + members or supports + spans, not both";
    public static string NoGeometry => "the submission needs a 'joints' and a 'members' table (or 'supports' and 'spans' for a continuous beam)";
    public static string DuplicateId(string kind, string id, string firstAt) => F($"{kind} '{id}' is defined twice (first at {firstAt})");
    public static string UnknownJoint(string id) => F($"joint '{id}' is not in the joints table");
    public static string UnknownTarget(string id) => F($"'{id}' is neither a member nor a joint");
    public static string ZeroLength(string member) => F($"member '{member}' has zero length (its start and end joints are at the same place)");
    public static string SameJoint(string member) => F($"member '{member}' starts and ends at the same joint");
    public static string NotPositive(string column, string text) => F($"'{column}' must be greater than zero, got \"{text}\"");
    public static string BadWord(string column, string text, IEnumerable<string> allowed) =>
        F($"'{column}' = \"{text}\" is not recognised (use one of: {string.Join(", ", allowed)})");
    public static string MovementNotRestrained(string column, string joint) =>
        F($"'{column}' is given for joint '{joint}', but the joint is not restrained in that direction");
    public static string SettlementNeedsE => "support movements need absolute stiffness: give E (and I in real units) for every member";
    public static string AxialNeedsArea(string member) => F($"'axial' is 'elastic', so member '{member}' needs an area A");
    public static string AxialNeedsE => "'axial' = 'elastic' needs absolute stiffness: give E for every member";
    public static string EMissingForMember => "E is given for some members but not this one";
    public static string LoadOutside(string column, double value, double length, string unit) =>
        F($"'{column}' = {value:0.###} {unit} lies outside the member (length {length:0.###} {unit})");
    public static string LoadEndsReversed => "'b' must not be less than 'a'";
    public static string KindOnJoint(string kind, string id) => F($"a '{kind}' load acts on a member, but '{id}' is a joint");
    public static string KindOnMember(string kind, string id) => F($"a '{kind}' load acts on a joint, but '{id}' is a member");
    public static string Ambiguous(string id) => F($"'{id}' is both a member and a joint id; rename one of them");
    public static string DirNotForKind(string kind) => F($"'dir' does not apply to a '{kind}' load");
    public static string NegativeMagnitude(string column) =>
        F($"'{column}' is negative: it acts opposite to 'dir'. Check that this is intended (write a positive value and the direction)");
    public static string NoLoads => "the loads table has no rows; at least one load is needed";
    public static string NoClaims => "the end-moments table has no rows: there is nothing to check";
    public static string CaseWithoutLoads(string id) => F($"load case '{id}' has no loads in the loads table (check the case id)");
    public static string DuplicateClaim(string member, string at, string c, string firstAt) =>
        F($"the moment of member '{member}' at '{at}' in case '{c}' is claimed twice (first at {firstAt})");
    public static string SpanSupportCount(int spans, int supports) =>
        F($"{spans} span(s) need {spans + 1} supports listed left to right, but the supports table has {supports}");
    public static string UnknownInfoKey(string key) => F($"info key '{key}' is not used by the checker (kept for the memo)");
    public static string NotACsv(string reason) => F($"the file could not be read as CSV: {reason}");
    public static string NoSections => "the file has no tables: a single-file submission introduces each table with a line such as [members]";
    public static string EmptyTable(string name) => F($"table '{name}' has no header row");
    public static string NotFound(string path) => F($"'{path}' does not exist");
    public static string Unsupported(string path) => F($"'{path}' is not a folder, a .csv file or a .pdf file");
    public static string NoJointsConnected(string id) => F($"joint '{id}' is not connected to any member");
}
