using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The cells the geometry tables share: section properties, restraints, hinges and support movements.</summary>
internal static class GeometryCells
{
    private static readonly Dictionary<string, Restraint> RestraintWords = new(StringComparer.Ordinal)
    {
        ["free"] = Restraint.Free, ["none"] = Restraint.Free, ["fixed"] = Restraint.Fixed, ["fix"] = Restraint.Fixed,
        ["encastre"] = Restraint.Fixed, ["clamped"] = Restraint.Fixed, ["built in"] = Restraint.Fixed,
        ["pinned"] = Restraint.Pinned, ["pin"] = Restraint.Pinned, ["hinged"] = Restraint.Pinned,
        ["roller"] = Restraint.Roller, ["simple"] = Restraint.Roller, ["guided"] = Restraint.Guided, ["sliding"] = Restraint.Guided,
    };

    private static readonly Dictionary<string, Hinge> HingeWords = new(StringComparer.Ordinal)
    {
        ["none"] = Hinge.None, ["start"] = Hinge.Start, ["end"] = Hinge.End, ["both"] = Hinge.Both,
        ["i"] = Hinge.Start, ["j"] = Hinge.End,
    };

    /// <summary>True for a word of the restraint vocabulary (<c>fixed</c>, <c>pinned</c>, <c>roller</c>, ...).</summary>
    public static bool IsRestraintWord(string text) => RestraintWords.ContainsKey(TableSchema.Normalize(text));

    /// <summary>True for a word of the hinge vocabulary (<c>none</c>, <c>start</c>, <c>end</c>, <c>both</c>, <c>i</c>, <c>j</c>).</summary>
    public static bool IsHingeWord(string text) => HingeWords.ContainsKey(TableSchema.Normalize(text));

    /// <summary>E (when the submission gives it; else 1, for relative stiffness), I and A of a member or span row.</summary>
    public static (double? E, double? I, double? A) Section(SubmissionDraft d, TableView v, RawRow row)
    {
        double? E = 1;
        if (d.HasE)
        {
            E = v.Number(row, "E", required: true, requiredBecause: "E is given for other members");
            if (E is <= 0) { d.Error(v.CellRef(row, "E"), Messages.NotPositive("E", v.Text(row, "E"))); E = null; }
        }
        double? I = v.Number(row, "I", required: true);
        if (I is <= 0) { d.Error(v.CellRef(row, "I"), Messages.NotPositive("I", v.Text(row, "I"))); I = null; }
        double? A = v.Has("A") ? v.Number(row, "A") : null;
        if (A is <= 0) { d.Error(v.CellRef(row, "A"), Messages.NotPositive("A", v.Text(row, "A"))); A = null; }
        return (E, I, A);
    }

    public static Restraint ReadRestraint(SubmissionDraft d, TableView v, RawRow row, string column, Restraint? fallback)
    {
        string text = v.Text(row, column);
        if (text.Length == 0)
        {
            if (fallback is Restraint f) return f;
            d.Error(v.CellRef(row, column), Messages.MissingValue(column, null));
            return Restraint.Free;
        }
        if (RestraintWords.TryGetValue(TableSchema.Normalize(text), out var r)) return r;
        d.Error(v.CellRef(row, column), Messages.BadWord(column, text, ["free", "fixed", "pinned", "roller", "guided"]));
        return Restraint.Free;
    }

    public static Hinge ReadHinge(SubmissionDraft d, TableView v, RawRow row)
    {
        string text = v.Text(row, "hinge");
        if (text.Length == 0) return Hinge.None;
        if (HingeWords.TryGetValue(TableSchema.Normalize(text), out var h)) return h;
        d.Error(v.CellRef(row, "hinge"), Messages.BadWord("hinge", text, ["none", "start", "end", "both"]));
        return Hinge.None;
    }

    /// <summary>A support movement must be in a restrained direction (<paramref name="xColumn"/> null: the table has no x movement).</summary>
    public static void CheckMovement(SubmissionDraft d, TableView v, RawRow row, Restraint r, string id, double sx, double sy, double sr, string? xColumn)
    {
        if (sx != 0 && !r.HasFlag(Restraint.X) && xColumn is not null) d.Error(v.CellRef(row, xColumn), Messages.MovementNotRestrained(xColumn, id));
        if (sy != 0 && !r.HasFlag(Restraint.Y)) d.Error(v.CellRef(row, "settle y"), Messages.MovementNotRestrained("settle y", id));
        if (sr != 0 && !r.HasFlag(Restraint.Rotation)) d.Error(v.CellRef(row, "settle rotation"), Messages.MovementNotRestrained("settle rotation", id));
    }
}
