using System.Globalization;
using System.Text.RegularExpressions;
using CrossCheck.Model;
using UnitsNet;
using UnitsNet.Units;

namespace CrossCheck.Import;

/// <summary>
/// Reads unit symbols as engineers write them in calculation tables (<c>kNm</c>, <c>kip-ft</c>, <c>mm4</c>,
/// <c>10^6 mm^4</c>, <c>N/mm²</c>, ...) and gives the factor to SI. The spellings engineers use that UnitsNet
/// does not know are mapped here; conversion factors come from UnitsNet. Always invariant culture.
/// </summary>
public static partial class UnitReader
{
    private static readonly Dictionary<string, Enum> Aliases = BuildAliases();
    private static readonly UnitParser Parser = new(UnitAbbreviationsCache.CreateDefault());

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
        var (unitType, si) = Kinds[kind];
        Enum? unit = null;
        if (Aliases.TryGetValue(norm, out var alias) && alias.GetType() == unitType) unit = alias;
        else if (Parser.TryParse(norm, unitType, CultureInfo.InvariantCulture, out var parsed)) unit = parsed;
        else
        {
            // Fall back to a case-insensitive alias when only one unit of this kind matches.
            var matches = Aliases.Where(kv => kv.Value.GetType() == unitType && string.Equals(kv.Key, norm, StringComparison.OrdinalIgnoreCase))
                .Select(kv => kv.Value).Distinct().ToList();
            if (matches.Count == 1) unit = matches[0];
        }
        if (unit is null) return null;
        double factor = UnitConverter.Convert(1.0, unit, si) * multiplier;
        string symbol = m.Success ? $"{m.Value.Trim()} {Pretty(raw)}" : Pretty(raw);
        return new UnitChoice(symbol, factor);
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
        return s;
    }

    private static string Pretty(string raw)
    {
        var s = Normalize(raw);
        s = s.Replace("*", "·");
        return s;
    }

    [GeneratedRegex(@"^(?:[x×]\s*)?(?:(?:10\s*\^\s*|1e)(?<exp>[+-]?\d+)|10(?<sup>[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))\s*", RegexOptions.CultureInvariant)]
    private static partial Regex PowerPrefix();

    /// <summary><c>⁻⁶</c> → <c>-6</c>.</summary>
    private static string FromSuperscript(string s)
    {
        var sb = new System.Text.StringBuilder();
        foreach (char c in s) sb.Append(c switch { '⁻' => '-', '⁺' => '+', _ => (char)('0' + "⁰¹²³⁴⁵⁶⁷⁸⁹".IndexOf(c, StringComparison.Ordinal)) });
        return sb.ToString();
    }

    private static Dictionary<string, Enum> BuildAliases()
    {
        var d = new Dictionary<string, Enum>(StringComparer.Ordinal);
        void Add(Enum unit, params string[] names) { foreach (var n in names) d[Normalize(n)] = unit; }
        static string[] Products(string a, string b) =>
            [$"{a}·{b}", $"{a}{b}", $"{a}-{b}", $"{a}.{b}", $"{a}*{b}", $"{a} {b}"];

        Add(TorqueUnit.NewtonMeter, Products("N", "m"));
        Add(TorqueUnit.NewtonMillimeter, Products("N", "mm"));
        Add(TorqueUnit.KilonewtonMeter, Products("kN", "m"));
        Add(TorqueUnit.KilonewtonMillimeter, Products("kN", "mm"));
        Add(TorqueUnit.MeganewtonMeter, Products("MN", "m"));
        Add(TorqueUnit.KilopoundForceFoot, [.. Products("kip", "ft"), .. Products("k", "ft"), .. Products("ft", "kip"), .. Products("kips", "ft"), "kft"]);
        Add(TorqueUnit.KilopoundForceInch, [.. Products("kip", "in"), .. Products("k", "in"), .. Products("in", "kip"), .. Products("kips", "in")]);
        Add(TorqueUnit.PoundForceFoot, [.. Products("lb", "ft"), .. Products("lbf", "ft"), .. Products("ft", "lb")]);
        Add(TorqueUnit.PoundForceInch, [.. Products("lb", "in"), .. Products("lbf", "in"), .. Products("in", "lb")]);
        Add(TorqueUnit.TonneForceMeter, [.. Products("tf", "m"), .. Products("t", "m")]);

        Add(ForceUnit.Newton, "N");
        Add(ForceUnit.Kilonewton, "kN");
        Add(ForceUnit.Meganewton, "MN");
        Add(ForceUnit.KilopoundForce, "kip", "kips", "k");
        Add(ForceUnit.PoundForce, "lb", "lbf", "lbs");
        Add(ForceUnit.TonneForce, "tf");

        Add(LengthUnit.Meter, "m");
        Add(LengthUnit.Millimeter, "mm");
        Add(LengthUnit.Centimeter, "cm");
        Add(LengthUnit.Foot, "ft", "'");
        Add(LengthUnit.Inch, "in", "\"");

        Add(ForcePerLengthUnit.NewtonPerMeter, "N/m");
        Add(ForcePerLengthUnit.NewtonPerMillimeter, "N/mm");
        Add(ForcePerLengthUnit.KilonewtonPerMeter, "kN/m");
        Add(ForcePerLengthUnit.KilonewtonPerMillimeter, "kN/mm");
        Add(ForcePerLengthUnit.KilopoundForcePerFoot, "kip/ft", "k/ft", "klf", "kips/ft");
        Add(ForcePerLengthUnit.KilopoundForcePerInch, "kip/in", "k/in", "kips/in");
        Add(ForcePerLengthUnit.PoundForcePerFoot, "lb/ft", "lbf/ft", "plf");
        Add(ForcePerLengthUnit.PoundForcePerInch, "lb/in", "lbf/in", "pli");

        Add(PressureUnit.Pascal, "Pa", "N/m²");
        Add(PressureUnit.Kilopascal, "kPa", "kN/m²");
        Add(PressureUnit.Megapascal, "MPa", "N/mm²", "MN/m²");
        Add(PressureUnit.Gigapascal, "GPa", "kN/mm²");
        Add(PressureUnit.KilopoundForcePerSquareInch, "ksi", "kip/in²");
        Add(PressureUnit.PoundForcePerSquareInch, "psi", "lb/in²");
        Add(PressureUnit.KilopoundForcePerSquareFoot, "ksf", "kip/ft²");

        Add(AreaMomentOfInertiaUnit.MeterToTheFourth, "m⁴", "m4");
        Add(AreaMomentOfInertiaUnit.CentimeterToTheFourth, "cm⁴", "cm4");
        Add(AreaMomentOfInertiaUnit.MillimeterToTheFourth, "mm⁴", "mm4");
        Add(AreaMomentOfInertiaUnit.InchToTheFourth, "in⁴", "in4");
        Add(AreaMomentOfInertiaUnit.FootToTheFourth, "ft⁴", "ft4");

        Add(AreaUnit.SquareMeter, "m²", "m2");
        Add(AreaUnit.SquareCentimeter, "cm²", "cm2");
        Add(AreaUnit.SquareMillimeter, "mm²", "mm2");
        Add(AreaUnit.SquareInch, "in²", "in2");
        Add(AreaUnit.SquareFoot, "ft²", "ft2");

        Add(AngleUnit.Radian, "rad", "radian", "radians");
        Add(AngleUnit.Milliradian, "mrad");
        Add(AngleUnit.Degree, "deg", "°", "degree", "degrees");
        return d;
    }
}
