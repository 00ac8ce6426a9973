using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The <c>info</c> table: title block, default force and length units, sign convention and axial behaviour.
/// Read first: the units it gives are the defaults of every other table.
/// </summary>
internal sealed class InfoReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        var raw = d.InfoValues;
        UnitChoice? force = null, length = null;
        var sign = SignConvention.Clockwise;
        if (d.Table("info") is { } t)
        {
            var view = d.View(t, TableSchema.Info);
            foreach (var row in view.Rows)
            {
                string printedKey = view.Text(row, "key");
                string key = TableSchema.InfoKey(printedKey) ?? TableSchema.Normalize(printedKey);
                string value = view.Text(row, "value");
                if (key.Length == 0) continue;
                var where = view.CellRef(row, "value");
                if (raw.TryGetValue(key, out var first))
                {
                    // A setting given twice with different values contradicts itself; a free-text key keeps its first value.
                    if (TableSchema.InfoKeys.ContainsKey(key) && !string.Equals(TableSchema.Normalize(first.Value), TableSchema.Normalize(value), StringComparison.Ordinal))
                        d.Error(where, Messages.InfoKeyTwice(printedKey, first.Value, first.Where.RowCompact, value));
                    continue;
                }
                raw.Add(key, (value, where));
                switch (key)
                {
                    case "force unit":
                        force = UnitReader.TryRead(value, QuantityKind.Force);
                        if (force is null) d.Error(where, Messages.NotAForceUnit(value));
                        break;
                    case "length unit":
                        length = UnitReader.TryRead(value, QuantityKind.Length);
                        if (length is null) d.Error(where, Messages.NotALengthUnit(value));
                        break;
                    case "sign convention":
                        if (ParseSign(value) is SignConvention sc) sign = sc;
                        else d.Error(where, Messages.BadWord("sign convention", value, ["clockwise", "sagging"]));
                        break;
                }
            }
        }
        string? Get(string key) => raw.TryGetValue(key, out var v) && v.Value.Length > 0 ? v.Value : null;
        var other = raw.Where(kv => !TableSchema.InfoKeys.ContainsKey(kv.Key)).ToDictionary(kv => kv.Key, kv => kv.Value.Value, StringComparer.Ordinal);
        d.Info = new SubmissionInfo(Get("title"), Get("reference"), Get("revision"),
            Get("prepared by"), Get("checked by"), Get("date"), sign, DisplayUnits.Si, other) { SignConventionStated = raw.ContainsKey("sign convention") };
        d.Defaults = new UnitDefaults(force, length);
        d.Axial = ParseAxial(d);
    }

    /// <summary>
    /// Reads a sign-convention statement: <c>clockwise</c>, <c>sagging</c>, or a phrase holding exactly one of them
    /// (<c>clockwise moments positive</c>). Anticlockwise and hogging-positive conventions are not supported.
    /// </summary>
    private static SignConvention? ParseSign(string value)
    {
        string v = TableSchema.Normalize(value);
        if (v is "cw") return SignConvention.Clockwise;
        if (v is "bending") return SignConvention.Sagging;
        var words = v.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        if (words.Any(w => w is "anticlockwise" or "counterclockwise" or "counter" or "anti") || v.Contains("hogging positive", StringComparison.Ordinal)) return null;
        bool cw = words.Contains("clockwise"), sag = words.Contains("sagging");
        return cw == sag ? null : cw ? SignConvention.Clockwise : SignConvention.Sagging;
    }

    private static AxialBehaviour ParseAxial(SubmissionDraft d)
    {
        if (!d.InfoValues.TryGetValue("axial", out var a) || a.Value.Length == 0) return AxialBehaviour.Rigid;
        string v = TableSchema.Normalize(a.Value);
        if (v is "rigid" or "inextensible") return AxialBehaviour.Rigid;
        if (v is "elastic" or "flexible") return AxialBehaviour.Elastic;
        d.Error(a.Where, Messages.BadWord("axial", a.Value, ["rigid", "elastic"]));
        return AxialBehaviour.Rigid;
    }
}
