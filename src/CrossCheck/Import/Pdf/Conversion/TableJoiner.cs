using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// Joins the printed parts of a table (a table continued after other tables, or split by its author) into one, when
/// they have the same columns in the same units; parts that differ are reported and left out.
/// </summary>
internal static class TableJoiner
{
    /// <summary>One segment per table of the format, the later parts appended to the first, in document order.</summary>
    public static List<Segment> Join(PdfReading r, List<Segment> segments)
    {
        var result = new List<Segment>();
        foreach (var s in segments)
        {
            var baseSeg = result.FirstOrDefault(x => x.Spec == s.Spec);
            if (baseSeg is null) { result.Add(s); continue; }
            var where = new SourceRef(r.File, s.Spec.Name, s.Source.First.Number, null, s.Source.First.Page);
            var a = baseSeg.Known.Select(c => c.Column!.Name).Order().ToList();
            var b = s.Known.Select(c => c.Column!.Name).Order().ToList();
            if (!a.SequenceEqual(b))
            {
                r.Problems.Add(new InputProblem(where, Messages.PdfIncompatibleTables(s.Spec.Name, baseSeg.Where)));
                continue;
            }
            bool unitsAgree = true;
            foreach (var c in s.Known.Where(c => c.Column!.Type == ColumnType.Number))
            {
                var other = baseSeg.Known.First(o => o.Column == c.Column);
                if (SameUnit(c.EffectiveUnit, other.EffectiveUnit, c.Column!.Kind)) continue;
                r.Problems.Add(new InputProblem(where with { Column = c.Printed }, Messages.PdfUnitsDiffer(s.Spec.Name, c.Column.Name, baseSeg.Where)));
                unitsAgree = false;
            }
            if (!unitsAgree) continue;
            baseSeg.Append(s);
        }
        return result;
    }

    private static bool SameUnit(string? a, string? b, QuantityKind kind)
    {
        if (a is null || b is null) return a is null && b is null;
        return UnitReader.TryRead(a, kind)?.ToSi is double fa && UnitReader.TryRead(b, kind)?.ToSi is double fb
            ? Math.Abs(fa - fb) <= 1e-12 * Math.Abs(fa)
            : string.Equals(a, b, StringComparison.Ordinal);
    }
}
