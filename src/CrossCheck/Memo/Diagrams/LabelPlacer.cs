namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Greedy placement of text labels: each label takes the first of its candidate positions that does not overlap a
/// label already placed or an area marked as taken (joints, support symbols). With no free candidate the first is used.
/// Taken areas are kept in a grid of square cells, so a candidate is tested only against the areas near it (a large
/// frame has thousands).
/// </summary>
internal sealed class LabelPlacer
{
    private const double Cell = 32;

    private readonly Dictionary<(int, int), List<Box>> _cells = [];
    private readonly List<Box> _unbounded = [];

    public void Block(Box b)
    {
        if (b.IsEmpty) return;
        if (!(b.Width < 64 * Cell && b.Height < 64 * Cell && Math.Abs(b.MinX) < 1e7 && Math.Abs(b.MinY) < 1e7))
        {
            _unbounded.Add(b);
            return;
        }
        var (x0, y0, x1, y1) = Cells(b);
        for (int i = x0; i <= x1; i++)
            for (int j = y0; j <= y1; j++)
            {
                if (!_cells.TryGetValue((i, j), out var list)) _cells[(i, j)] = list = [];
                list.Add(b);
            }
    }

    /// <summary>Chooses a centre for a label of the given size among <paramref name="candidates"/> (in order of preference).</summary>
    public Pt Place(IEnumerable<Pt> candidates, double width, double height)
    {
        Pt? first = null;
        foreach (var c in candidates)
        {
            first ??= c;
            var box = Box.Around(c, width + 2, height);
            if (!IsTaken(box))
            {
                Block(box);
                return c;
            }
        }
        var chosen = first ?? new Pt(0, 0);
        Block(Box.Around(chosen, width + 2, height));
        return chosen;
    }

    private bool IsTaken(Box box)
    {
        if (box.IsEmpty) return false;
        foreach (var t in _unbounded) if (t.Overlaps(box)) return true;
        if (!(box.Width < 64 * Cell && box.Height < 64 * Cell && Math.Abs(box.MinX) < 1e7 && Math.Abs(box.MinY) < 1e7))
            return _cells.Values.Any(list => list.Any(t => t.Overlaps(box)));
        var (x0, y0, x1, y1) = Cells(box);
        for (int i = x0; i <= x1; i++)
            for (int j = y0; j <= y1; j++)
                if (_cells.TryGetValue((i, j), out var list))
                    foreach (var t in list)
                        if (t.Overlaps(box)) return true;
        return false;
    }

    private static (int X0, int Y0, int X1, int Y1) Cells(Box b) =>
        ((int)Math.Floor(b.MinX / Cell), (int)Math.Floor(b.MinY / Cell), (int)Math.Floor(b.MaxX / Cell), (int)Math.Floor(b.MaxY / Cell));

    /// <summary>
    /// Candidates for a label that should sit just beyond <paramref name="tip"/> in direction <paramref name="outward"/>:
    /// first right there, then slid along <paramref name="along"/> or pushed further out, nearest first.
    /// </summary>
    public static IEnumerable<Pt> Beyond(Pt tip, Pt outward, Pt along, double width, double height, double gap = 4)
    {
        outward = outward.Unit;
        along = along.Unit;
        double reach = (Math.Abs(outward.X) * width / 2) + (Math.Abs(outward.Y) * height / 2) + gap;
        var c = tip + (outward * reach);
        double step = Math.Max(6, ((Math.Abs(along.X) * (width + 3)) + (Math.Abs(along.Y) * (height + 2))) / 2);
        double push = Math.Max(6, ((Math.Abs(outward.X) * (width + 2)) + (Math.Abs(outward.Y) * (height + 2))) * 0.6);
        var offsets = new List<(double Cost, Pt P)>();
        for (int k = 0; k <= 3; k++)
            for (int j = -6; j <= 6; j++)
            {
                double a = j * step, o = k * push;
                // Sliding along the member is preferred slightly over moving away from it, and the inward side over the outer.
                offsets.Add(((a * a) + (1.3 * o * o) + (j < 0 ? 0.5 : 0), c + (along * a) + (outward * o)));
            }
        return offsets.OrderBy(x => x.Cost).Select(x => x.P);
    }

    /// <summary>Candidates on a ring around <paramref name="centre"/>, starting from the direction <paramref name="preferred"/>.</summary>
    public static IEnumerable<Pt> Around(Pt centre, Pt preferred, double radius, double width, double height)
    {
        double a0 = Math.Atan2(preferred.Y, preferred.X);
        var order = new[] { 0, 1, -1, 2, -2, 3, -3, 4 };
        foreach (var ring in new[] { 1.0, 1.8, 2.8, 4.0 })
            foreach (int k in order)
            {
                double a = a0 + (k * Math.PI / 4);
                var d = new Pt(Math.Cos(a), Math.Sin(a));
                double reach = (radius * ring) + (Math.Abs(d.X) * width / 2) + (Math.Abs(d.Y) * height / 2);
                yield return centre + (d * reach);
            }
    }
}
