namespace CrossCheck.Memo.Diagrams;

/// <summary>A point or vector in drawing coordinates (px, x to the right, y down as in SVG).</summary>
internal readonly record struct Pt(double X, double Y)
{
    public static Pt operator +(Pt a, Pt b) => new(a.X + b.X, a.Y + b.Y);
    public static Pt operator -(Pt a, Pt b) => new(a.X - b.X, a.Y - b.Y);
    public static Pt operator *(Pt a, double k) => new(a.X * k, a.Y * k);
    public static Pt operator *(double k, Pt a) => new(a.X * k, a.Y * k);

    public double Length => Math.Sqrt((X * X) + (Y * Y));

    public Pt Unit => Length > 0 ? new Pt(X / Length, Y / Length) : new Pt(0, 0);

    /// <summary>This vector turned 90° clockwise on screen (y down): (x, y) → (−y, x).</summary>
    public Pt TurnClockwise => new(-Y, X);

    public double Dot(Pt o) => (X * o.X) + (Y * o.Y);

    public double DistanceTo(Pt o) => (this - o).Length;

    public static Pt Lerp(Pt a, Pt b, double t) => new(a.X + ((b.X - a.X) * t), a.Y + ((b.Y - a.Y) * t));

    // The derived properties return points themselves: the record's generated printing would recurse without end.
    public override string ToString() => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"({X:0.###}, {Y:0.###})");
}

/// <summary>An axis-aligned rectangle in drawing coordinates.</summary>
internal readonly record struct Box(double MinX, double MinY, double MaxX, double MaxY)
{
    public static Box Empty { get; } = new(double.PositiveInfinity, double.PositiveInfinity, double.NegativeInfinity, double.NegativeInfinity);

    public bool IsEmpty => MinX > MaxX || MinY > MaxY;
    public double Width => IsEmpty ? 0 : MaxX - MinX;
    public double Height => IsEmpty ? 0 : MaxY - MinY;
    public Pt Centre => new((MinX + MaxX) / 2, (MinY + MaxY) / 2);

    public static Box Around(Pt centre, double width, double height) =>
        new(centre.X - (width / 2), centre.Y - (height / 2), centre.X + (width / 2), centre.Y + (height / 2));

    public Box Include(Pt p) => new(Math.Min(MinX, p.X), Math.Min(MinY, p.Y), Math.Max(MaxX, p.X), Math.Max(MaxY, p.Y));

    public Box Include(Box b) => b.IsEmpty ? this : IsEmpty ? b : new(Math.Min(MinX, b.MinX), Math.Min(MinY, b.MinY), Math.Max(MaxX, b.MaxX), Math.Max(MaxY, b.MaxY));

    public Box Grow(double d) => IsEmpty ? this : new(MinX - d, MinY - d, MaxX + d, MaxY + d);

    public bool Overlaps(Box o) => !IsEmpty && !o.IsEmpty && MinX < o.MaxX && o.MinX < MaxX && MinY < o.MaxY && o.MinY < MaxY;

    public bool Contains(Pt p) => p.X >= MinX && p.X <= MaxX && p.Y >= MinY && p.Y <= MaxY;
}

/// <summary>
/// Maps the structure's coordinates (m, y up) to drawing coordinates (px, y down) at one scale, fitting the joints
/// into a box of at most <c>maxWidth</c> × <c>maxHeight</c> px with the lowest-left joint at the origin.
/// </summary>
internal sealed class View
{
    private readonly double _minX;
    private readonly double _maxY;
    private readonly Pt _origin;

    /// <param name="origin">Where the lowest-left corner of the joints' extent lands in the drawing.</param>
    public View(IEnumerable<(double X, double Y)> points, double maxWidth, double maxHeight, Pt origin = default)
    {
        _origin = origin;
        var list = points.ToList();
        if (list.Count == 0) list.Add((0, 0));
        _minX = list.Min(p => p.X);
        _maxY = list.Max(p => p.Y);
        double w = list.Max(p => p.X) - _minX;
        double h = _maxY - list.Min(p => p.Y);
        double sx = w > 0 ? maxWidth / w : double.PositiveInfinity;
        double sy = h > 0 ? maxHeight / h : double.PositiveInfinity;
        double s = Math.Min(sx, sy);
        Scale = double.IsFinite(s) && s > 0 ? s : 1;
    }

    /// <summary>Pixels per metre.</summary>
    public double Scale { get; }

    public Pt Map(double x, double y) => new(_origin.X + ((x - _minX) * Scale), _origin.Y + ((_maxY - y) * Scale));

    /// <summary>A direction given in structure axes (y up), as a drawing vector (y down).</summary>
    public static Pt Direction(double x, double y) => new Pt(x, -y).Unit;
}
