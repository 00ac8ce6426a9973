using System.Text.RegularExpressions;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// Reads the optional <c>distribution</c> table: the author's moment-distribution working, one row per step
/// (distribution factors, fixed-end moments, balance, carry-over, final) and one column per member end. A column is
/// named <c>member@joint</c> (<c>AB@A</c>) or with a double subscript (<c>M_AB</c>, <c>MAB</c>, <c>M(AB)</c>: the
/// moment at A of the member from A to B). Moments take the column's bracketed unit or the info table's defaults.
/// </summary>
internal static partial class WorkingTableReader
{
    private static readonly (string Word, WorkingStep Step)[] StepWords =
    [
        ("df", WorkingStep.DistributionFactor), ("distribution factor", WorkingStep.DistributionFactor), ("distribution factors", WorkingStep.DistributionFactor),
        ("d.f.", WorkingStep.DistributionFactor), ("fem", WorkingStep.FixedEndMoment), ("fixed end moment", WorkingStep.FixedEndMoment),
        ("fixed end moments", WorkingStep.FixedEndMoment), ("f.e.m.", WorkingStep.FixedEndMoment), ("balance", WorkingStep.Balance), ("bal", WorkingStep.Balance),
        ("distribute", WorkingStep.Balance), ("dist", WorkingStep.Balance), ("carry over", WorkingStep.CarryOver), ("co", WorkingStep.CarryOver),
        ("c.o.", WorkingStep.CarryOver), ("carryover", WorkingStep.CarryOver), ("final", WorkingStep.Final), ("sum", WorkingStep.Final),
        ("total", WorkingStep.Final), ("σ", WorkingStep.Final), ("final moment", WorkingStep.Final), ("final moments", WorkingStep.Final),
    ];

    public static List<WorkingTable> Read(RawTable t, StructureModel model, UnitChoice? momentUnit, List<InputProblem> problems, InputLimits? limits = null)
    {
        limits ??= InputLimits.Default;
        var header = t.Header;
        int caseCol = -1, stepCol = -1;
        var columns = new List<(int Index, WorkingColumn Column, UnitChoice? Unit)>();
        for (int i = 0; i < header.Cells.Count; i++)
        {
            string cell = header.Cells[i];
            if (cell.Length == 0) continue;
            var (name, unitText) = TableSchema.SplitHeader(cell);
            // "M(AB)" is a double subscript, not a unit in parentheses.
            if (unitText is not null && !cell.Contains('[') && ResolveEnd(cell.Trim(), model) is not null) (name, unitText) = (cell.Trim(), null);
            if (unitText is null && t.ColumnUnits?.TryGetValue(i, out var u) == true) unitText = u;
            string norm = TableSchema.Normalize(name);
            var where = t.HeaderAt("distribution", cell, i);
            if (TableSchema.Distribution.Column("case").Matches(norm)) { caseCol = i; continue; }
            if (TableSchema.Distribution.Column("step").Matches(norm)) { stepCol = i; continue; }
            var end = ResolveEnd(name, model);
            if (end is null)
            {
                problems.Add(new InputProblem(where, Messages.WorkingColumnNotAnEnd(cell)));
                continue;
            }
            UnitChoice? unit = momentUnit;
            if (unitText is { Length: > 0 })
            {
                unit = UnitReader.TryRead(unitText, QuantityKind.Moment);
                if (unit is null) { problems.Add(new InputProblem(where, Messages.NotAMomentUnit(unitText))); continue; }
            }
            if (unit is null)
            {
                problems.Add(new InputProblem(where, Messages.WorkingColumnNoUnit(cell, name)));
                continue;
            }
            columns.Add((i, new WorkingColumn(end.Value.Member, end.Value.End, name.Trim(), where, unit), unit));
        }
        if (stepCol < 0)
        {
            problems.Add(new InputProblem(t.HeaderAt("distribution", "step"), Messages.WorkingNeedsStep));
            return [];
        }
        var byCase = new Dictionary<string, List<WorkingRow>>(StringComparer.Ordinal);
        var order = new List<string>();
        foreach (var row in t.Rows.Where(r => !r.IsBlank))
        {
            string caseId = caseCol >= 0 && row.Cell(caseCol).Trim().Length > 0 ? row.Cell(caseCol).Trim() : "1";
            string label = row.Cell(stepCol).Trim();
            var rowRef = t.RowAt("distribution", row);
            var step = ParseStep(label);
            if (step is null)
            {
                problems.Add(new InputProblem(rowRef with { Column = header.Cell(stepCol), Text = label },
                    Messages.WorkingStepUnknown(label)));
                continue;
            }
            var values = new double?[columns.Count];
            var texts = new string[columns.Count];
            bool ok = true;
            for (int k = 0; k < columns.Count; k++)
            {
                string text = row.Cell(columns[k].Index).Trim();
                texts[k] = text;
                if (text.Length == 0 || text is "-" or "—" or "–") continue;
                if (!NumberText.TryParse(text, t.DecimalComma, out double v))
                {
                    problems.Add(new InputProblem(rowRef with { Column = columns[k].Column.Header, Text = text }, Messages.NotANumber(columns[k].Column.Header, text, t.DecimalComma)));
                    ok = false;
                    continue;
                }
                double si = step == WorkingStep.DistributionFactor ? v : v * columns[k].Unit!.ToSi;
                if (!double.IsFinite(si) || Math.Abs(si) > limits.MaxMagnitude || (v != 0 && Math.Abs(si) < limits.MinMagnitude))
                {
                    problems.Add(new InputProblem(rowRef with { Column = columns[k].Column.Header, Text = text }, Messages.OutOfRange(columns[k].Column.Header, text)));
                    ok = false;
                    continue;
                }
                values[k] = si;
            }
            if (!ok) continue;
            if (!byCase.TryGetValue(caseId, out var list)) { byCase[caseId] = list = []; order.Add(caseId); }
            list.Add(new WorkingRow(step.Value, label, values, texts, rowRef));
        }
        return order.Select(c => new WorkingTable(c, columns.Select(x => x.Column).ToList(), byCase[c])).ToList();
    }

    internal static WorkingStep? ParseStep(string label)
    {
        // "balance 2", "CO-3", "Bal." and the like: drop the numbering and trailing dots.
        string s = TableSchema.Normalize(StepNumber().Replace(label, "")).TrimEnd('.', ' ');
        foreach (var (word, step) in StepWords)
            if (s == word || s == word.TrimEnd('.')) return step;
        return null;
    }

    /// <summary>Resolves <c>AB@A</c>, <c>M_AB</c>, <c>MAB</c>, <c>M(AB)</c> or <c>AB</c> to a member end.</summary>
    internal static (string Member, MemberEnd End)? ResolveEnd(string header, StructureModel model)
    {
        string h = header.Trim();
        var at = AtForm().Match(h);
        if (at.Success && model.TryGetMember(at.Groups["m"].Value.Trim(), out var member))
            return member.EndAt(at.Groups["j"].Value.Trim()) is MemberEnd e ? (member.Id, e) : null;
        var sub = SubscriptForm().Match(h);
        string pair = sub.Success ? sub.Groups["p"].Value : h;
        pair = pair.Replace(" ", "").Replace(",", "");
        (string, MemberEnd)? found = null;
        for (int split = 1; split < pair.Length; split++)
        {
            string near = pair[..split], far = pair[split..];
            foreach (var m in model.Members)
            {
                if (m.Start == near && m.End == far) { if (found is not null) return null; found = (m.Id, MemberEnd.Start); }
                else if (m.End == near && m.Start == far) { if (found is not null) return null; found = (m.Id, MemberEnd.End); }
            }
        }
        return found;
    }

    [GeneratedRegex(@"^(?<m>[^@]+)@(?<j>.+)$")]
    private static partial Regex AtForm();

    [GeneratedRegex(@"^M\s*(?:_|\(|\s)?\s*(?<p>[^)]+?)\s*\)?$")]
    private static partial Regex SubscriptForm();

    [GeneratedRegex(@"[\s\-_#]*\d+\s*$")]
    private static partial Regex StepNumber();
}
