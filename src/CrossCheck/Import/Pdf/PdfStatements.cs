using System.Text.RegularExpressions;

namespace CrossCheck.Import.Pdf;

/// <summary>Units stated in words: <c>Units: kN, m</c>, <c>forces in kN, moments in kN·m</c>, <c>End moments [kN·m]</c>.</summary>
internal sealed class UnitsStatement
{
    public Dictionary<QuantityKind, string> ByKind { get; } = [];

    /// <summary>A unit for displacements only (<c>deflections in mm</c>).</summary>
    public string? Displacement { get; set; }

    public bool IsEmpty => ByKind.Count == 0 && Displacement is null;

    /// <summary>The unit this statement gives a column of <paramref name="kind"/>: stated for the kind, or derived from a force and a length unit.</summary>
    public string? For(QuantityKind kind, bool displacementColumn)
    {
        if (displacementColumn && Displacement is not null) return Displacement;
        if (ByKind.TryGetValue(kind, out var u)) return u;
        if (kind is QuantityKind.Moment or QuantityKind.ForcePerLength or QuantityKind.Modulus or QuantityKind.SecondMoment or QuantityKind.Area
            && ByKind.TryGetValue(QuantityKind.Force, out var f) && ByKind.TryGetValue(QuantityKind.Length, out var l))
        {
            var fu = UnitReader.TryRead(f, QuantityKind.Force);
            var lu = UnitReader.TryRead(l, QuantityKind.Length);
            if (fu is null || lu is null) return null;
            if (kind is QuantityKind.SecondMoment or QuantityKind.Area) return null; // a length unit for coordinates rarely sets the section unit
            string symbol = UnitReader.Derive(kind, fu, lu).Symbol;
            return UnitReader.TryRead(symbol, kind) is null ? null : symbol;
        }
        return null;
    }
}

/// <summary>
/// The sentences of a calculation that the PDF reader acts on: title-block <c>key: value</c> lines, units
/// statements, notes saying that parentheses mean negative, load-case labels, and page numbers.
/// </summary>
internal static partial class PdfStatements
{
    /// <summary>A title-block pair read from a line.</summary>
    internal sealed record KeyValue(string Key, string PrintedKey, string Value);

    /// <summary>
    /// The <c>key: value</c> pairs of a line whose keys are info keys (see <see cref="TableSchema.InfoKeys"/>) or
    /// <c>units</c>. A line may hold several (<c>Job No: 1234    Rev: B</c>), and a key may stand in one cell with its
    /// value in the next.
    /// </summary>
    public static List<KeyValue> KeyValues(TextLine line)
    {
        var pairs = new List<KeyValue>();
        var chunks = line.Chunks();
        for (int i = 0; i < chunks.Count; i++)
        {
            string text = chunks[i].Text;
            var m = KeyColon().Match(text);
            if (m.Success)
            {
                string printed = m.Groups["k"].Value.Trim();
                string? key = KeyOf(printed);
                if (key is null) continue;
                string value = m.Groups["v"].Value.Trim();
                if (value.Length == 0 && i + 1 < chunks.Count && !KeyColon().IsMatch(chunks[i + 1].Text)) value = chunks[++i].Text;
                pairs.Add(new KeyValue(key, printed, value));
                continue;
            }
            if (chunks.Count == 2 && i == 0 && KeyOf(text) is { } k && k != "units" && text.Length > 2)
            {
                pairs.Add(new KeyValue(k, text, chunks[1].Text));
                break;
            }
        }
        return pairs;
    }

    private static string? KeyOf(string printed)
    {
        string n = TableSchema.Normalize(printed.TrimEnd('.', ':'));
        if (n is "units" or "unit" or "all units") return "units";
        return TableSchema.InfoKey(printed);
    }

    /// <summary>A units statement in <paramref name="text"/>, or null.</summary>
    public static UnitsStatement? Units(string text)
    {
        var st = new UnitsStatement();
        var m = UnitsLead().Match(text);
        if (m.Success) ParseList(m.Groups["rest"].Value, st);
        foreach (Match q in QuantityIn().Matches(text)) AddToken(q.Groups["q"].Value, q.Groups["u"].Value, st);
        return st.IsEmpty ? null : st;
    }

    /// <summary>Units written in brackets or parentheses in a caption or group header: <c>End moments [kN·m]</c>.</summary>
    public static UnitsStatement? Bracketed(string text)
    {
        var st = new UnitsStatement();
        foreach (Match b in BracketUnit().Matches(text)) AddToken("", b.Groups["u"].Value, st);
        return st.IsEmpty ? null : st;
    }

    private static void ParseList(string rest, UnitsStatement st)
    {
        rest = rest.Trim().TrimEnd('.', ')', ';');
        foreach (var token in ListSplit().Split(rest))
        {
            string t = token.Trim().Trim('.', '(', ')');
            if (t.Length == 0) continue;
            var q = QuantityWord().Match(t);
            if (q.Success) AddToken(q.Groups["q"].Value, q.Groups["u"].Value, st);
            else AddToken("", t, st);
        }
    }

    private static readonly QuantityKind[] TryOrder =
    [
        QuantityKind.Moment, QuantityKind.ForcePerLength, QuantityKind.Modulus, QuantityKind.SecondMoment, QuantityKind.Area,
        QuantityKind.Force, QuantityKind.Length, QuantityKind.Angle,
    ];

    private static void AddToken(string quantity, string unit, UnitsStatement st)
    {
        unit = unit.Trim().TrimEnd('.', ',', ';', ')');
        if (unit.Length == 0) return;
        string q = quantity.Trim().ToLowerInvariant();
        if (q.StartsWith("displacement", StringComparison.Ordinal) || q.StartsWith("deflection", StringComparison.Ordinal))
        {
            if (UnitReader.TryRead(unit, QuantityKind.Length) is not null) st.Displacement ??= unit;
            return;
        }
        QuantityKind? kind = q switch
        {
            "" => null,
            _ when q.StartsWith("force", StringComparison.Ordinal) || q.StartsWith("load", StringComparison.Ordinal)
                || q.StartsWith("reaction", StringComparison.Ordinal) => QuantityKind.Force,
            _ when q.StartsWith("moment", StringComparison.Ordinal) => QuantityKind.Moment,
            _ when q.StartsWith("length", StringComparison.Ordinal) || q.StartsWith("dimension", StringComparison.Ordinal)
                || q.StartsWith("distance", StringComparison.Ordinal) || q.StartsWith("coordinate", StringComparison.Ordinal) => QuantityKind.Length,
            _ when q.StartsWith("modul", StringComparison.Ordinal) || q == "e" => QuantityKind.Modulus,
            _ when q.StartsWith("second moment", StringComparison.Ordinal) || q.StartsWith("inertia", StringComparison.Ordinal) || q == "i" => QuantityKind.SecondMoment,
            _ when q.StartsWith("area", StringComparison.Ordinal) => QuantityKind.Area,
            _ when q.StartsWith("rotation", StringComparison.Ordinal) => QuantityKind.Angle,
            _ => null,
        };
        if (kind is QuantityKind k)
        {
            if (UnitReader.TryRead(unit, k) is not null) st.ByKind.TryAdd(k, unit);
            else if (k == QuantityKind.Force && UnitReader.TryRead(unit, QuantityKind.ForcePerLength) is not null) st.ByKind.TryAdd(QuantityKind.ForcePerLength, unit);
            return;
        }
        // "m unless noted otherwise": the unit is the first word or two.
        var words = unit.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        for (int n = words.Length; n >= 1; n--)
        {
            if (n < words.Length && n > 2) continue;
            string u = string.Join(" ", words[..n]).TrimEnd('.', ',', ';', ':');
            foreach (var candidate in TryOrder)
            {
                if (UnitReader.TryRead(u, candidate) is null) continue;
                st.ByKind.TryAdd(candidate, u);
                return;
            }
        }
    }

    /// <summary>True when the text says that numbers in parentheses (brackets) are negative.</summary>
    public static bool SaysParenthesesNegative(string text)
    {
        string t = text.ToLowerInvariant();
        bool parens = t.Contains("bracket", StringComparison.Ordinal) || t.Contains("parenthes", StringComparison.Ordinal)
                      || t.Contains("( )", StringComparison.Ordinal) || t.Contains("()", StringComparison.Ordinal);
        return parens && (t.Contains("negative", StringComparison.Ordinal) || t.Contains("minus", StringComparison.Ordinal));
    }

    /// <summary>The load case a line names when it stands alone in a table (<c>Load case DL (dead load)</c>), or null.</summary>
    public static string? CaseLabel(string text)
    {
        var m = CaseLabelRx().Match(Geometry.Collapse(text));
        return m.Success ? m.Groups["id"].Value : null;
    }

    /// <summary>The table of the format a caption names by one of its names (<c>Table 3 - Applied loads (ULS-2)</c>), or null.</summary>
    public static TableSpec? NamedTable(string text)
    {
        string t = " " + TableSchema.Normalize(CaptionWords().Replace(text, " ")) + " ";
        foreach (var spec in TableSchema.All.Where(s => s != TableSchema.Info))
            foreach (var name in spec.Synonyms.Prepend(spec.Name))
                if (t.Contains(" " + TableSchema.Normalize(name) + " ", StringComparison.Ordinal)) return spec;
        return null;
    }

    /// <summary>
    /// The load case a caption names, or null: <c>Table 4: End moments, load case G+W</c>, <c>case ULS-2</c>,
    /// <c>Loads (ULS-2)</c>, or <c>ULS-2: end moments</c> (an id before a colon). An id in parentheses or before a colon must
    /// look like a case id (a digit, a <c>+</c>, or capitals), and not be a unit, a note word or a title-block key.
    /// </summary>
    public static string? CaptionCase(string text)
    {
        string t = Geometry.Collapse(text);
        var m = CaptionCaseRx().Match(t);
        if (m.Success) return m.Groups["id"].Value.TrimEnd('.', ',', ':', ';');
        foreach (Match p in ParenthesisedId().Matches(t))
            if (LooksLikeCase(p.Groups["id"].Value)) return p.Groups["id"].Value;
        var lead = LeadingId().Match(t);
        return lead.Success && LooksLikeCase(lead.Groups["id"].Value) && KeyOf(lead.Groups["id"].Value) is null ? lead.Groups["id"].Value : null;
    }

    private static bool LooksLikeCase(string id)
    {
        if (id.Length == 0 || NotCases.Contains(id.ToLowerInvariant().TrimEnd('.'))) return false;
        if (TableSchema.IsRelativeUnit(id) || UnitReader.IsKnownSpelling(id)) return false;
        return id.Any(char.IsDigit) || id.Contains('+', StringComparison.Ordinal) || (id.Length >= 2 && id.All(c => !char.IsLetter(c) || char.IsUpper(c)));
    }

    private static readonly HashSet<string> NotCases = new(StringComparer.Ordinal)
    {
        "continued", "cont", "contd", "cont'd", "note", "notes", "units", "unit", "table", "figure", "fig", "see", "typ", "typical", "all",
        "ref", "rev", "date", "by", "job", "project", "page", "sheet", "si", "uk", "us", "eu", "nts", "tbc", "na", "n/a",
    };

    /// <summary>
    /// True for a rule typed in characters (<c>------  ------</c>, <c>=====</c>, <c>+----+----+</c>), as a plain-text printout
    /// draws under its headers: not a row.
    /// </summary>
    public static bool IsRule(string text)
    {
        int rule = 0;
        foreach (char c in text)
        {
            if (c is '-' or '=' or '_' or '–' or '—' or '―' or '─' or '━' or '═' or '~') rule++;
            else if (!(char.IsWhiteSpace(c) || c is '+' or '|' or ':' or '*' or '.')) return false;
        }
        return rule >= 3;
    }

    /// <summary>True for page-number lines (<c>Page 2 of 5</c>, <c>- 3 -</c>, <c>Sheet 4</c>).</summary>
    public static bool IsPageNumber(string text) => PageNumber().IsMatch(Geometry.Collapse(text));

    /// <summary>The line with digits folded (<c>Page 2 of 5</c> → <c>page # of #</c>), to spot running headers and footers.</summary>
    public static string Shape(string text) => Digits().Replace(Geometry.Collapse(text).ToLowerInvariant(), "#");

    [GeneratedRegex(@"^(?<k>[A-Za-z][A-Za-z .'/]{0,38}?)\s*[:：]\s*(?<v>.*)$")]
    private static partial Regex KeyColon();

    [GeneratedRegex(@"\b(?:all\s+)?units?\b\s*(?:[:=]|\s[-–]\s|\s+(?:are|in)\b)\s*(?<rest>.+)$", RegexOptions.IgnoreCase)]
    private static partial Regex UnitsLead();

    [GeneratedRegex(@"\b(?<q>forces?|loads?|reactions?|moments?|lengths?|dimensions?|distances?|coordinates?|displacements?|deflections?|rotations?|moduli|modulus)\s+(?:are\s+)?in\s+(?<u>[^\s,;()]+(?:\s*[·*.\-]\s*[A-Za-z]+)?)", RegexOptions.IgnoreCase)]
    private static partial Regex QuantityIn();

    [GeneratedRegex(@"^(?<q>forces?|loads?|reactions?|moments?|lengths?|dimensions?|distances?|coordinates?|displacements?|deflections?|rotations?|moduli|modulus|second moments?(?: of area)?|inertias?|areas?|E|I)\s*(?:in|:|=|-)?\s+(?<u>\S.*)$", RegexOptions.IgnoreCase)]
    private static partial Regex QuantityWord();

    [GeneratedRegex(@"\s*(?:[,;]|\band\b)\s*")]
    private static partial Regex ListSplit();

    [GeneratedRegex(@"[\[(](?<u>[^\[\]()]{1,20})[\])]")]
    private static partial Regex BracketUnit();

    [GeneratedRegex(@"^(?:load\s+case|case|lc|load\s+combination|combination)(?:\s+no\.?)?(?:\s*[:\-–]\s*|\s+)(?<id>[^\s:,;()]+)(?:\s*[:\-–(,].*)?$", RegexOptions.IgnoreCase)]
    private static partial Regex CaseLabelRx();

    [GeneratedRegex(@"\b(?:load\s+case|case|lc|load\s+combination|combination)\s*(?:no\.?\s*)?[:\-–]?\s+(?<id>[^\s:,;()]+)", RegexOptions.IgnoreCase)]
    private static partial Regex CaptionCaseRx();

    [GeneratedRegex(@"^(?:(?:page|sheet|p\.|pg\.?)\s*\d+(?:\s*(?:of|/)\s*\d+)?|\d+\s*(?:of|/)\s*\d+|[-–]?\s*\d{1,4}\s*[-–]?)$", RegexOptions.IgnoreCase)]
    private static partial Regex PageNumber();

    [GeneratedRegex(@"\d+")]
    private static partial Regex Digits();

    [GeneratedRegex(@"\((?<id>[A-Za-z0-9][A-Za-z0-9+\-_./]{0,11})\)")]
    private static partial Regex ParenthesisedId();

    [GeneratedRegex(@"^(?<id>[A-Za-z0-9][A-Za-z0-9+\-_./]{0,11})\s*:")]
    private static partial Regex LeadingId();

    [GeneratedRegex(@"[^\p{L}\p{N}\s\-]+")]
    private static partial Regex CaptionWords();
}
