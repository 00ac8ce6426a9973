namespace CrossCheck.Import;

/// <summary>The physical kind of a number column, which decides the units it accepts.</summary>
public enum QuantityKind
{
    /// <summary>A plain number (relative stiffness, ratios).</summary>
    Number,
    Length,
    Force,
    Moment,
    ForcePerLength,
    /// <summary>Elastic modulus (pressure units).</summary>
    Modulus,
    /// <summary>Second moment of area.</summary>
    SecondMoment,
    Area,
    /// <summary>Rotation; radians when no unit is given.</summary>
    Angle,
}
