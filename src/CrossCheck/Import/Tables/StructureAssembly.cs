using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// Puts the joints and members read into a <see cref="StructureModel"/> and checks it as a whole: joints no member
/// reaches, separate structures, support movements or elastic members without E, members without an area.
/// </summary>
internal sealed class StructureAssembly : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        var model = new StructureModel(d.Joints, d.Members, d.Axial, relativeStiffness: !d.HasE);
        d.Model = model;
        var touched = model.Members.SelectMany(m => new[] { m.Start, m.End }).ToHashSet(StringComparer.Ordinal);
        foreach (var j in model.Joints.Where(j => !d.GeometryIncomplete && !touched.Contains(j.Id) && !d.JointsOfRejectedMembers.Contains(j.Id)))
            d.Error(j.Source, Messages.NoJointsConnected(j.Id));
        var parts = Parts(model);
        // A member row left out for an error would split the structure: that error is the news, not "separate structures".
        if (parts.Count > 1 && d.RejectedMembers.Count == 0)
            d.Warn(d.Whole, Messages.SeparateParts(parts.Count, parts.Take(4).Select(p => p.Count <= 4 ? $"joints {string.Join(", ", p)}" : $"joints {string.Join(", ", p.Take(3))} and {p.Count - 3} more")));
        if (!d.HasE)
        {
            foreach (var j in model.Joints.Where(j => !j.Movement.IsZero))
                d.Error(j.Source, Messages.SettlementNeedsE);
        }
        if (d.Axial == AxialBehaviour.Elastic)
        {
            if (!d.HasE) d.Error(d.Whole, Messages.AxialNeedsE);
            foreach (var m in model.Members.Where(m => m.A is null)) d.Error(m.Source.Cell("A"), Messages.AxialNeedsArea(m.Id));
        }
    }

    /// <summary>The joints of each separate structure the members form (joints without members left out), in submission order.</summary>
    private static List<List<string>> Parts(StructureModel model)
    {
        var parent = new Dictionary<string, string>(StringComparer.Ordinal);
        string Root(string j)
        {
            while (parent[j] != j) j = parent[j] = parent[parent[j]];
            return j;
        }
        foreach (var m in model.Members) { parent.TryAdd(m.Start, m.Start); parent.TryAdd(m.End, m.End); }
        foreach (var m in model.Members)
        {
            string a = Root(m.Start), b = Root(m.End);
            if (a != b) parent[b] = a;
        }
        return model.Joints.Where(j => parent.ContainsKey(j.Id)).GroupBy(j => Root(j.Id)).Select(g => g.Select(j => j.Id).ToList()).ToList();
    }
}
