using System.Globalization;

namespace CrossCheck.Import;

/// <summary>Every input-problem message in one place, so wording stays consistent and testable.</summary>
internal static class Messages
{
    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    public static string UnknownColumn(string header, TableSpec t) =>
        F($"column '{header}' is not part of table '{t.Name}' and was ignored (expected: {string.Join(", ", t.Columns.Select(c => c.Name))})");
    public static string DuplicateColumn(string name) => F($"column '{name}' appears twice in the header; give each column once");
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
    public static string DuplicateTable(string name) => F($"table '{name}' appears more than once; give each table once (put all its rows in one table)");
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
    public static string ValueNotForKind(string column, string text, string kind, IEnumerable<string> uses) =>
        F($"'{column}' = \"{text}\" on a '{kind}' row is not used (a '{kind}' load reads {string.Join(", ", uses.Select(u => $"'{u}'"))}); check that the row's values were read into the right columns");
    public static string DirNotForKind(string kind) => F($"'dir' does not apply to a '{kind}' load");
    public static string NegativeMagnitude(string column) =>
        F($"'{column}' is negative: it acts opposite to 'dir'. Check that this is intended (write a positive value and the direction)");
    public static string NoLoads => "the loads table has no rows; at least one load is needed";
    public static string NoClaims => "the end-moments table has no rows: there is nothing to check";
    public static string CaseWithoutLoads(string id) => F($"load case '{id}' has no loads in the loads table (check the case id)");
    public static string DuplicateClaim(string member, string at, string c, string firstAt) =>
        F($"the moment of member '{member}' at '{at}' in case '{c}' is claimed twice (first at {firstAt})");
    // ---- combinations, envelopes, span moments, shears -----------------------------------------------

    public static string CombinationNamedLikeCase(string name) =>
        F($"combination '{name}' has the name of a load case; give it a name of its own (claims name cases and combinations in the same 'case' column)");
    public static string CombinationCaseUnknown(string c) => F($"load case '{c}' is not in the loads table (check the case id)");
    public static string CombinationCaseTwice(string combination, string c, string firstAt) =>
        F($"combination '{combination}' takes case '{c}' twice (first at {firstAt}); give each case once with its factor");
    public static string UnloadedFactorWithoutPattern =>
        "'factor unloaded' applies only to a patterned case (pattern = spans); this row is not patterned";
    public static string ClaimNamesPatterned(string c, string table) =>
        F($"'{c}' is a combination with a patterned case: it has an envelope, not one answer, so its results go in the 'envelopes' table, not in '{table}'");
    public static string EnvelopeNotPatterned(string c) =>
        F($"combination '{c}' has no patterned case (pattern = spans): it has one answer, so claim it in the end-moments, span-moments or shears table");
    public static string EnvelopeUnknownCombination(string c) => F($"'{c}' is not a combination of the combinations table");
    public static string EnvelopeNeedsValue => "the row gives neither 'max' nor 'min'; give at least one";
    public static string EnvelopeSpanMinIgnored => "'min' is not read on a span row: the span row is the largest span moment ('max') only";
    public static string EnvelopeTwice(string combination, string member, string at, string firstAt) =>
        F($"the envelope of member '{member}' at '{at}' in combination '{combination}' is given twice (first at {firstAt})");
    public static string SpanMomentTwice(string member, string c, string firstAt) =>
        F($"the span moment of member '{member}' in case '{c}' is claimed twice (first at {firstAt})");
    public static string SpanMomentFreeEnd(string member) =>
        F($"member '{member}' has a free end (a cantilever): it has no span moment between supports, so this claim was not read (give the moment at its root as an end moment)");
    public static string ShearTwice(string member, string at, string c, string firstAt) =>
        F($"the shear of member '{member}' at '{at}' in case '{c}' is claimed twice (first at {firstAt})");
    public static string SpanSupportCount(int spans, int supports) =>
        F($"{spans} span(s) need {spans + 1} supports listed left to right, but the supports table has {supports}");
    public static string UnknownInfoKey(string key) => F($"info key '{key}' is not used by the checker (kept for the memo)");
    public static string NotACsv(string reason) => F($"the file could not be read as CSV: {reason}");
    public static string EmptyFile => "the file is empty (0 bytes)";
    public static string NotUtf8 => "the file is not UTF-8; it was read as Latin-1 (save as 'CSV UTF-8' to be sure of special characters)";
    public static string BadQuoting(string reason) => F($"badly quoted CSV ({reason}); the row was read as best it could be, check it");
    public static string StrayByteOrderMark =>
        "this line holds an invisible byte-order mark (were two files joined?); it was removed before the line was read";
    public static string CsvTooLarge(long bytes, long max) =>
        F($"the file is {Size(bytes)}; CSV files larger than {Size(max)} are not read (raise the limit with --max-file-mb)");
    public static string LineTooLong(int chars, int max) =>
        F($"this line is {chars} characters long; lines longer than {max} characters are not read (a table row is a few hundred; is the file a table?)");
    public static string CellTooLong(int column, int chars, int max) =>
        F($"cell {column} of this row holds {chars} characters; cells longer than {max} are not read, so the row was left out");
    public static string TooManyRows(string table, int rows, int max) =>
        F($"table '{table}' has {rows} rows; CrossCheck reads at most {max} rows per table (raise the limit with --max-rows)");
    public static string TooManyMembers(int count, int max) =>
        F($"the submission has {count} members; CrossCheck analyses at most {max} (raise the limit with --max-members)");
    public static string TooManyJoints(int count, int max) =>
        F($"the submission has {count} joints; CrossCheck analyses at most {max} (raise the limit with --max-members, which allows twice as many joints as members)");
    public static string TooManyCases(int count, int max) =>
        F($"the loads table has {count} load cases; CrossCheck reviews at most {max} in one submission (split the submission)");
    public static string TooLong(string column, string text, double metres, double max) =>
        F($"'{column}' = \"{text}\" is {metres:0.###e+0} m; CrossCheck reads lengths and coordinates up to {max:0.###e+0} m (a unit slip, such as millimetres read as metres?)");
    public static string MemberTooLong(string member, double metres, double max) =>
        F($"member '{member}' is {metres:0.###e+0} m long; CrossCheck analyses members up to {max:0.###e+0} m long (a unit slip, such as millimetres read as metres?)");
    public static string InfoKeyTwice(string key, string first, string firstAt, string value) =>
        F($"info key '{key}' is given twice with different values: \"{first}\" (at {firstAt}) and \"{value}\"; give it once");
    public static string NotAForceUnit(string value) => F($"'{value}' is not a force unit");
    public static string NotALengthUnit(string value) => F($"'{value}' is not a length unit");
    public static string NoCsvInFolder =>
        "the folder holds no CSV tables (expected joints.csv, members.csv, loads.csv, end-moments.csv, ...)";
    public static string SeparateParts(int parts, IEnumerable<string> examples) =>
        F($"the members form {parts} separate structures that share no joint ({string.Join("; ", examples)}); each is analysed with its own supports. Check the member joints if the structure should be one");
    private static string Size(long bytes) => bytes < 1024 * 1024
        ? F($"{Math.Ceiling(bytes / 1024.0):0} KB")
        : F($"{bytes / (1024.0 * 1024):0.#} MB");
    public static string UndecidableDelimiter(int tabLine, int otherLine) =>
        F($"the delimiter of this file cannot be decided: line {tabLine} is split by tabs and line {otherLine} by commas or semicolons. Save it with one delimiter (comma-separated CSV, or tab-separated text)");
    public static string NoSections => "the file has no tables: a single-file submission introduces each table with a line such as [members]";
    public static string EmptyTable(string name) => F($"table '{name}' has no header row");
    public static string NotFound(string path) => F($"'{path}' does not exist");
    public static string ControlCharacters(int cells) =>
        F($"{cells} cell(s) of this table held control characters (an escape sequence?); they were removed before the cells were read");
    public static string NotARegularFile(string what) => F($"the file is {what}; CrossCheck reads regular files only, so it was not read");
    public static string OverTimeBudget(double seconds) =>
        F($"the review took longer than the time limit of {seconds:0.#} s and was stopped; raise it with --time-limit, or split the submission");
    public static string Unsupported(string path) => F($"'{path}' is not a folder, a .csv file, a .pdf file or an .xlsx workbook (tab-separated text is read as .tsv or .txt)");
    public static string FileTooLarge(long bytes, long max) =>
        F($"the file is {Size(bytes)}; files larger than {Size(max)} are not read (raise the limit with --max-file-mb)");

    // ---- workbooks ----------------------------------------------------------------------------------

    public static string WorkbookEmpty => "the file is empty (0 bytes), not a workbook";
    public static string WorkbookNotXlsx => "the file is not an .xlsx workbook (an Office Open XML spreadsheet); save it as .xlsx, or give the tables as CSV";
    public static string WorkbookTooLarge(long max) =>
        F($"the workbook's parts expand to more than {Size(max)}, far more than a calculation needs (a compression bomb?); it was not read");
    public static string WorkbookTooManyCells(int max) => F($"the workbook holds more than {max} cells; CrossCheck reads calculation workbooks, not data sets");
    public static string WorkbookDamaged(string reason) => F($"the workbook is damaged or uses features CrossCheck cannot read ({reason}); save it again as .xlsx, or give the tables as CSV");
    public static string WorkbookHiddenSheet(string sheet) => F($"sheet '{sheet}' is hidden and was not read");
    public static string WorkbookHiddenCells(string sheet, IReadOnlyList<int> rows, IReadOnlyList<string> columns) =>
        F($"sheet '{sheet}' has hidden {string.Join(" and ", new[] { rows.Count == 0 ? null : $"row{(rows.Count > 1 ? "s" : "")} {string.Join(", ", rows.Take(10))}{(rows.Count > 10 ? ", ..." : "")}", columns.Count == 0 ? null : $"column{(columns.Count > 1 ? "s" : "")} {string.Join(", ", columns.Take(10))}{(columns.Count > 10 ? ", ..." : "")}" }.Where(x => x is not null))}; hidden cells were not read (unhide them if they are part of the calculation)");
    public static string WorkbookFormulaWithoutValue(string formula) =>
        F($"the formula ={formula} has no saved result; open the workbook in a spreadsheet program and save it (so that its results are stored), then try again");
    public static string WorkbookDrawing(string sheet, string cell) =>
        F($"an image or chart on sheet '{sheet}' at {cell} was not read (a table drawn as a picture is not read; give it as cells)");
    public static string WorkbookNoTables(IReadOnlyList<string> sheets) =>
        F($"no table of the submission format was found on {(sheets.Count == 1 ? $"sheet '{sheets[0]}'" : $"the sheets {string.Join(", ", sheets.Select(s => $"'{s}'"))}")}. Tables are recognised by their header row (or a sheet named after the table)");

    // ---- PDF input ----------------------------------------------------------------------------------

    public static string PdfEmptyFile => "the file is empty (0 bytes), not a PDF";
    public static string PdfTooLarge(long bytes, long max) =>
        F($"the file is {bytes / (1024 * 1024)} MB; CrossCheck reads PDFs up to {max / (1024 * 1024)} MB");
    public static string PdfNotPdf => "the file is not a PDF (it does not begin with '%PDF-'); give a text PDF, a CSV file or a folder of CSV tables";
    public static string PdfDamaged(string reason) =>
        F($"the PDF is damaged or uses features CrossCheck cannot read ({reason}); export the calculation again, or give its tables as CSV");
    /// <summary>A PDF the PDF library failed on: its own words are not shown (they describe its internals, and may quote the file).</summary>
    public static string PdfUnreadable => PdfDamaged("its structure could not be parsed");
    public static string PdfEncrypted =>
        "the PDF is encrypted with a password; CrossCheck cannot read it. Export an unprotected copy, or give the tables as CSV";
    public static string PdfNoPages => "the PDF has no pages";
    public static string PdfTooManyPages(int pages, int max) =>
        F($"the PDF has {pages} pages; CrossCheck reads at most {max} (raise the limit with --max-pages, or extract the calculation's pages)");
    public static string PdfTooManyLetters(int letters, int max) =>
        F($"the page holds {letters} letters, more than the {max} a page of tables can have; it looks like a drawing or a damaged page");
    public static string PdfStreamTooLarge(long max) =>
        F($"a compressed stream in the PDF expands to more than {Size(max)}, far more than a calculation needs: the file looks like a compression bomb and was not read");
    public static string PdfDecodedTooMuch(long max) =>
        F($"the PDF's compressed streams expand to more than {Size(max)} in all; the file was not read (a compression bomb, or a document of drawings rather than tables?)");
    public static string PdfNestedTooDeep(int max) =>
        F($"the PDF nests arrays or dictionaries more than {max} deep; no calculation needs that (a hostile or damaged file?), so it was not read");
    public static string PdfPageTooCostly(long letters, long operations, int maxLetters, long maxOperations) =>
        F($"the page would produce {(letters > 2L * maxLetters ? $"about {letters} letters (more than the {maxLetters} a page of tables can have)" : $"more than {operations} drawing operations (the limit is {maxOperations})")}, counting the forms it repeats; it looks like a hostile or damaged page and the file was not read");
    public static string PdfTimeBudget(double seconds, int page, int pages) =>
        F($"reading the PDF took longer than the time budget of {seconds:0.#} s (stopped at page {page} of {pages}); raise it with --time-limit, or extract the calculation's pages");
    public static string PdfScanned(int pages) =>
        F($"the PDF has no extractable text: {(pages == 1 ? "its page is an image" : $"all {pages} pages are images")} (a scan?). CrossCheck does not read numbers from images; export the calculation's tables as a text PDF or as CSV");
    public static string PdfInvisibleOnly =>
        "the PDF's only text is invisible: an OCR layer over scanned images. CrossCheck does not read numbers recognised from images; export the calculation's tables as a text PDF or as CSV";
    public static string PdfNoText => "the PDF has no text on any page; export the calculation's tables as a text PDF or as CSV";
    public static string PdfPageImageOnly => "this page has no text, only images (a scanned page?); nothing on it was read";
    public static string PdfPageInvisibleText =>
        "this page's text is invisible (an OCR layer over a scanned image?); CrossCheck does not read it. Give a text PDF or CSV";
    public static string PdfRotatedText(int letters) =>
        F($"{letters} letters of rotated text on this page were not read (only horizontal text is read)");
    public static string PdfNoTables(IReadOnlyList<string> seen) => seen.Count == 0
        ? "no table of the submission format was found, and no line looked like a table header. Tables are recognised by their header row (see the README's 'PDF input')"
        : F($"no table of the submission format was recognised. Header rows seen: {string.Join("; ", seen)}. Name the columns as in the submission format (or a listed synonym), or give the tables as CSV");
    public static string PdfParenthesesWithoutNote(string column, string text) =>
        F($"'{column}' = \"{text}\" is in parentheses, and the document does not say that parentheses mean negative (a note such as 'negative values in brackets'); correct the value after 'crosscheck extract'");
    public static string PdfAmbiguousThousands(string text) =>
        F($"\"{text}\" was read with ',' as a thousands separator (the document shows no decimal commas); check it");
    public static string PdfWideUnresolved(string header, string sub) =>
        F($"end-moment column '{header}': '{sub}' does not name the two joints of a member in the members table (M_AB is the moment at end A of the member from A to B)");
    public static string PdfWideAmbiguous(string header, IEnumerable<string> readings) =>
        F($"end-moment column '{header}' can be read more than one way ({string.Join(" or ", readings)}); write the subscript with a separator, e.g. M_A-B");
    public static string PdfWideNoGeometry(string header) =>
        F($"end-moment column '{header}' cannot be resolved: the document has no members (or spans) table naming the members' joints");
    public static string PdfWideUnits(string a, string b) =>
        F($"the end-moment columns give different units ('{a}' and '{b}'); give one unit for the table");
    public static string PdfIncompatibleTables(string name, string first) =>
        F($"a second '{name}' table with different columns (the first is at {first}); this one was not read. Give one '{name}' table");
    public static string PdfUnitsDiffer(string name, string column, string first) =>
        F($"this part of table '{name}' gives column '{column}' in a different unit from the part at {first}; this part was not read");
    public static string PdfSideBySide(string read, string beside) =>
        F($"two tables stand side by side in this line ('{beside}' and '{read}'); CrossCheck reads tables set one under another, so the '{beside}' table was not read. Give the tables as CSV (or print them one under the other)");
    public static string PdfTwoLevelHeader(string group, IReadOnlyList<string> columns) =>
        F($"a header on two levels: '{group}' stands over the columns {string.Join(", ", columns.Select(c => $"'{c}'"))} (one column per load case?). Headers on two levels are not read: give one row per value (or the table as CSV)");
    public static string PdfImageNotRead(int? above, int? below) =>
        F($"an image {(above is int a && below is int b ? $"between lines {a} and {b}" : above is int a2 ? $"below line {a2}" : below is int b2 ? $"above line {b2}" : "on this page")} was not read (a table drawn as a picture is not read; give it as text or CSV)");
    public static string PdfUnlabelledColumn(string sample) => F($"a column without a header (values such as \"{sample}\") was ignored");

    // ---- the distribution (working) table -----------------------------------------------------------

    public static string WorkingColumnNotAnEnd(string cell) =>
        F($"column '{cell}' does not name a member end: write it as member@joint (e.g. AB@A) or with a double subscript (M_AB) of joints joined by a member");
    public static string NotAMomentUnit(string unit) => F($"'{unit}' is not a moment unit");
    public static string WorkingColumnNoUnit(string cell, string name) =>
        F($"column '{cell}' has no unit: write it in the header (e.g. '{name} [kN·m]') or give 'force unit' and 'length unit' in the info table");
    public static string WorkingNeedsStep => "table 'distribution' needs a column 'step' (DF, FEM, balance, carry-over, final)";
    public static string WorkingStepUnknown(string label) => F($"step \"{label}\" is not recognised (use DF, FEM, balance, carry-over or final)");

    public static string CoincidentJoints(string first, string second, string at) =>
        F($"joints '{first}' and '{second}' are at the same place ({at}); members that name one are not connected to members that name the other. Use one joint if they should be joined");
    public static string ParallelMembers(string first, string second, string a, string b) =>
        F($"members '{first}' and '{second}' both join '{a}' and '{b}'; their stiffnesses add (is one member entered twice?)");
    public static string MemberThroughJoint(string member, string joint) =>
        F($"joint '{joint}' lies on member '{member}' between its ends, but the member is not connected to it; split the member at '{joint}' if they should be joined (or two members overlap)");
    public static string LookAlikeIds(string kind, string first, string second, string differences) =>
        F($"{kind} ids '{first}' and '{second}' look alike but are different ids ({differences}); a reference to one does not reach the other");
    public static string LoadOverNoLength => "'b' equals 'a': a distributed load over no length does nothing; give its extent, or use a point load";
    public static string EIgnoredForRelativeI =>
        "I is given as a relative stiffness, so the stiffnesses are relative (E = 1 for every member): the E column is not used, and displacements are not checked";
    public static string LengthDisagrees(string member, string printed, double fromJoints, string unit) =>
        F($"member '{member}' is given as {printed} {unit} long, but its joints are {fromJoints:0.###} {unit} apart; check the joint coordinates and the length (was a column misread?)");
    public static string TwoColumnsOneRole(string first, string second, string role) =>
        F($"columns '{first}' and '{second}' both read as '{role}', and their cells cannot tell them apart; name one of them as in the submission format");
    public static string RoleFromContents(string header, string role, string evidence, string? named) =>
        F($"column '{header}' was read as '{role}' from its contents ({evidence}){(named is null ? "" : $"; its header names '{named}', which its cells do not fit")}: check the choice");
    public static string ColumnNotRead(string header, string named, string why) =>
        F($"column '{header}' names '{named}', but {why}; it was not read");
    public static string NoJointsConnected(string id) => F($"joint '{id}' is not connected to any member");
}
