using System.Globalization;
using System.Text.RegularExpressions;
using CrossCheck.Model;
using UnitsNet;
using UnitsNet.Units;

namespace CrossCheck.Import;

/// <summary>
/// Reads unit symbols as engineers write them in calculation tables (<c>kNm</c>, <c>kip-ft</c>, <c>mm4</c>,
/// <c>10^6 mm^4</c>, <c>N/mm²</c>, ...) and gives the factor to SI. The usual spellings are in a table of exact SI
/// definitions here; anything else is parsed and converted by UnitsNet (loaded only then). Always invariant culture.
/// </summary>
public static partial class UnitReader
{
    private static readonly Dictionary<string, (QuantityKind Kind, double ToSi, string Trade)> Aliases = BuildAliases();
    // Building UnitsNet's full abbreviation table takes a large share of a second: only for spellings not in Aliases.
    private static readonly Dictionary<string, (QuantityKind Kind, double ToSi, string Trade)[]> AliasesAnyCase = Aliases
        .GroupBy(kv => kv.Key, StringComparer.OrdinalIgnoreCase)
        .ToDictionary(g => g.Key, g => g.Select(kv => kv.Value).ToArray(), StringComparer.OrdinalIgnoreCase);
    private static readonly Lazy<UnitParser> Parser = new(() => new UnitParser(UnitAbbreviationsCache.CreateDefault()));

    private static readonly Dictionary<QuantityKind, (Type UnitType, Enum Si)> Kinds = new()
    {
        [QuantityKind.Length] = (typeof(LengthUnit), LengthUnit.Meter),
        [QuantityKind.Force] = (typeof(ForceUnit), ForceUnit.Newton),
        [QuantityKind.Moment] = (typeof(TorqueUnit), TorqueUnit.NewtonMeter),
        [QuantityKind.ForcePerLength] = (typeof(ForcePerLengthUnit), ForcePerLengthUnit.NewtonPerMeter),
        [QuantityKind.Modulus] = (typeof(PressureUnit), PressureUnit.Pascal),
        [QuantityKind.SecondMoment] = (typeof(AreaMomentOfInertiaUnit), AreaMomentOfInertiaUnit.MeterToTheFourth),
        [QuantityKind.Area] = (typeof(AreaUnit), AreaUnit.SquareMeter),
        [QuantityKind.Angle] = (typeof(AngleUnit), AngleUnit.Radian),
    };

    /// <summary>Human name of a quantity kind for messages.</summary>
    public static string Describe(QuantityKind kind) => kind switch
    {
        QuantityKind.Length => "a length",
        QuantityKind.Force => "a force",
        QuantityKind.Moment => "a moment",
        QuantityKind.ForcePerLength => "a force per length",
        QuantityKind.Modulus => "an elastic modulus (pressure)",
        QuantityKind.SecondMoment => "a second moment of area",
        QuantityKind.Area => "an area",
        QuantityKind.Angle => "an angle",
        _ => "a number",
    };

    /// <summary>Parses <paramref name="text"/> as a unit of <paramref name="kind"/>.</summary>
    /// <returns>The unit with its display symbol and factor to SI, or null when it is not such a unit.</returns>
    public static UnitChoice? TryRead(string text, QuantityKind kind)
    {
        if (kind == QuantityKind.Number) return null;
        string raw = text.Trim();
        if (raw.Length == 0) return null;
        double multiplier = 1;
        var m = PowerPrefix().Match(raw);
        if (m.Success)
        {
            string exp = m.Groups["exp"].Success ? m.Groups["exp"].Value : FromSuperscript(m.Groups["sup"].Value);
            multiplier = Math.Pow(10, int.Parse(exp, CultureInfo.InvariantCulture));
            raw = raw[m.Length..].Trim();
        }
        string norm = Normalize(raw);
        double factor;
        // The spelling the trade prints (kN·m for kNm, KNM or kN-m), so that what a memo quotes does not echo a typing habit.
        string? trade = null;
        bool known = Aliases.TryGetValue(norm, out var alias);
        if (known && alias.Kind == kind) (factor, trade) = (alias.ToSi, alias.Trade);
        else if (known) return null; // a known spelling of another quantity
        else
        {
            // Spellings of our own, case-insensitively when only one unit of this kind matches.
            var matches = AliasesAnyCase.TryGetValue(norm, out var folded)
                ? folded.Where(a => a.Kind == kind).DistinctBy(a => a.ToSi).ToList()
                : [];
            if (matches.Count == 1) (factor, trade) = (matches[0].ToSi, matches[0].Trade);
            else if (folded is not null) return null;
            // A known unit followed by words ("m unless noted otherwise") is prose, not a unit.
            else if (norm.IndexOf(' ') is int sp and > 0 && Aliases.ContainsKey(norm[..sp])) return null;
            else
            {
                var (unitType, si) = Kinds[kind];
                if (!Parser.Value.TryParse(norm, unitType, CultureInfo.InvariantCulture, out var parsed)) return null;
                // The quantity's own conversion (not the global UnitConverter, which registers every quantity on first use).
                factor = Quantity.From(1.0, parsed).As(si);
            }
        }
        factor *= multiplier;
        string unit = trade ?? Pretty(raw);
        string symbol = m.Success ? $"{m.Value.Trim()} {unit}" : unit;
        return new UnitChoice(symbol, factor);
    }

    /// <summary>
    /// True when <paramref name="text"/> is one of the spellings of the table here, of any kind (a power of ten before it
    /// allowed). Cheap: never loads UnitsNet's parser, so it can be asked of any word (is this line a units row? is this
    /// caption id a unit?).
    /// </summary>
    public static bool IsKnownSpelling(string text)
    {
        string raw = text.Trim();
        if (PowerPrefix().Match(raw) is { Success: true } m) raw = raw[m.Length..].Trim();
        if (raw.Length == 0) return false;
        string norm = Normalize(raw);
        return Aliases.ContainsKey(norm) || AliasesAnyCase.ContainsKey(norm);
    }

    /// <summary>The SI unit of a kind, used when a value needs no unit (angles in radians).</summary>
    public static UnitChoice Radian { get; } = new("rad", 1);

    /// <summary>Combines a force and a length unit into the derived unit of <paramref name="kind"/>.</summary>
    public static UnitChoice Derive(QuantityKind kind, UnitChoice force, UnitChoice length) => kind switch
    {
        QuantityKind.Force => force,
        QuantityKind.Length => length,
        QuantityKind.Moment => new($"{force.Symbol}·{length.Symbol}", force.ToSi * length.ToSi),
        QuantityKind.ForcePerLength => new($"{force.Symbol}/{length.Symbol}", force.ToSi / length.ToSi),
        QuantityKind.Modulus => new($"{force.Symbol}/{length.Symbol}²", force.ToSi / (length.ToSi * length.ToSi)),
        QuantityKind.SecondMoment => new($"{length.Symbol}⁴", Math.Pow(length.ToSi, 4)),
        QuantityKind.Area => new($"{length.Symbol}²", length.ToSi * length.ToSi),
        QuantityKind.Angle => Radian,
        _ => new("", 1),
    };

    private static string Normalize(string s)
    {
        s = s.Replace('\u00B7', '·').Replace('\u22C5', '·').Replace('\u2219', '·').Replace('\u2022', '·');
        s = Regex.Replace(s, @"\s+", " ").Trim();
        s = s.Replace("^2", "²").Replace("^3", "³").Replace("^4", "⁴");
        // Exponents typed without a caret: N/mm2, KN/M2, mm4 (a digit right after a letter is a power in a unit symbol).
        if (s.Length > 1) s = CaretlessPower().Replace(s, m => m.Value switch { "2" => "²", "3" => "³", _ => "⁴" });
        return s;
    }

    private static string Pretty(string raw)
    {
        var s = Normalize(raw);
        s = s.Replace("*", "·");
        return s;
    }

    [GeneratedRegex(@"(?<=[A-Za-zµ])[234](?![0-9])")]
    private static partial Regex CaretlessPower();

    [GeneratedRegex(@"^(?:[x×]\s*)?(?:(?:10\s*\^\s*|1e)(?<exp>[+-]?\d+)|10(?<sup>[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))\s*", RegexOptions.CultureInvariant)]
    private static partial Regex PowerPrefix();

    /// <summary><c>⁻⁶</c> → <c>-6</c>.</summary>
    private static string FromSuperscript(string s)
    {
        var sb = new System.Text.StringBuilder();
        foreach (char c in s) sb.Append(c switch { '⁻' => '-', '⁺' => '+', _ => (char)('0' + "⁰¹²³⁴⁵⁶⁷⁸⁹".IndexOf(c, StringComparison.Ordinal)) });
        return sb.ToString();
    }

    /// <remarks>The first name given for a unit is the spelling the trade prints.</remarks>
    private static Dictionary<string, (QuantityKind Kind, double ToSi, string Trade)> BuildAliases()
    {
        // Exact SI definitions (NIST SP 811, Appendix B): in = 0.0254 m, ft = 0.3048 m, lbf = 4.4482216152605 N,
        // kgf = 9.80665 N. Kept here so that start-up need not load UnitsNet's full unit tables; UnitsNet reads
        // any other spelling.
        const double Lbf = 4.4482216152605, Kip = 1000 * Lbf, In = 0.0254, Ft = 0.3048, Tf = 9806.65;
        var d = new Dictionary<string, (QuantityKind, double, string)>(StringComparer.Ordinal);
        void Add(QuantityKind kind, double factor, params string[] names) { foreach (var n in names) d[Normalize(n)] = (kind, factor, names[0]); }
        static string[] Products(string a, string b) =>
            [$"{a}·{b}", $"{a}{b}", $"{a}-{b}", $"{a}.{b}", $"{a}*{b}", $"{a} {b}"];

        Add(QuantityKind.Moment, 1, Products("N", "m"));
        Add(QuantityKind.Moment, 1e-3, Products("N", "mm"));
        Add(QuantityKind.Moment, 1e3, Products("kN", "m"));
        Add(QuantityKind.Moment, 1, Products("kN", "mm"));
        Add(QuantityKind.Moment, 1e6, Products("MN", "m"));
        Add(QuantityKind.Moment, Kip * Ft, [.. Products("kip", "ft"), .. Products("k", "ft"), .. Products("ft", "kip"), .. Products("kips", "ft"), "kft"]);
        Add(QuantityKind.Moment, Kip * In, [.. Products("kip", "in"), .. Products("k", "in"), .. Products("in", "kip"), .. Products("kips", "in")]);
        Add(QuantityKind.Moment, Lbf * Ft, [.. Products("lb", "ft"), .. Products("lbf", "ft"), .. Products("ft", "lb")]);
        Add(QuantityKind.Moment, Lbf * In, [.. Products("lb", "in"), .. Products("lbf", "in"), .. Products("in", "lb")]);
        Add(QuantityKind.Moment, Tf, [.. Products("tf", "m"), .. Products("t", "m")]);

        Add(QuantityKind.Force, 1, "N");
        Add(QuantityKind.Force, 1e3, "kN");
        Add(QuantityKind.Force, 1e6, "MN");
        Add(QuantityKind.Force, Kip, "kip", "kips", "k");
        Add(QuantityKind.Force, Lbf, "lb", "lbf", "lbs");
        Add(QuantityKind.Force, Tf, "tf");

        Add(QuantityKind.Length, 1, "m");
        Add(QuantityKind.Length, 1e-3, "mm");
        Add(QuantityKind.Length, 1e-2, "cm");
        Add(QuantityKind.Length, Ft, "ft", "'");
        Add(QuantityKind.Length, In, "in", "\"");

        Add(QuantityKind.ForcePerLength, 1, "N/m");
        Add(QuantityKind.ForcePerLength, 1e3, "kN/m");
        Add(QuantityKind.ForcePerLength, 1e3, "N/mm");
        Add(QuantityKind.ForcePerLength, 1e6, "kN/mm");
        Add(QuantityKind.ForcePerLength, Kip / Ft, "kip/ft", "k/ft", "klf", "kips/ft");
        Add(QuantityKind.ForcePerLength, Kip / In, "kip/in", "k/in", "kips/in");
        Add(QuantityKind.ForcePerLength, Lbf / Ft, "lb/ft", "lbf/ft", "plf");
        Add(QuantityKind.ForcePerLength, Lbf / In, "lb/in", "lbf/in", "pli");

        Add(QuantityKind.Modulus, 1, "Pa");
        Add(QuantityKind.Modulus, 1, "N/m²");
        Add(QuantityKind.Modulus, 1e3, "kPa");
        Add(QuantityKind.Modulus, 1e3, "kN/m²");
        Add(QuantityKind.Modulus, 1e6, "MPa");
        Add(QuantityKind.Modulus, 1e6, "N/mm²");
        Add(QuantityKind.Modulus, 1e6, "MN/m²");
        Add(QuantityKind.Modulus, 1e9, "GPa");
        Add(QuantityKind.Modulus, 1e9, "kN/mm²");
        Add(QuantityKind.Modulus, Kip / (In * In), "ksi", "kip/in²");
        Add(QuantityKind.Modulus, Lbf / (In * In), "psi", "lb/in²");
        Add(QuantityKind.Modulus, Kip / (Ft * Ft), "ksf", "kip/ft²");

        Add(QuantityKind.SecondMoment, 1, "m⁴", "m4");
        Add(QuantityKind.SecondMoment, 1e-8, "cm⁴", "cm4");
        Add(QuantityKind.SecondMoment, 1e-12, "mm⁴", "mm4");
        Add(QuantityKind.SecondMoment, In * In * In * In, "in⁴", "in4");
        Add(QuantityKind.SecondMoment, Ft * Ft * Ft * Ft, "ft⁴", "ft4");

        Add(QuantityKind.Area, 1, "m²", "m2");
        Add(QuantityKind.Area, 1e-4, "cm²", "cm2");
        Add(QuantityKind.Area, 1e-6, "mm²", "mm2");
        Add(QuantityKind.Area, In * In, "in²", "in2");
        Add(QuantityKind.Area, Ft * Ft, "ft²", "ft2");

        Add(QuantityKind.Angle, 1, "rad", "radian", "radians");
        Add(QuantityKind.Angle, 1e-3, "mrad");
        Add(QuantityKind.Angle, Math.PI / 180, "deg", "°", "degree", "degrees");
        return d;
    }
}
