using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// Warnings about a model that can be analysed but is probably not what its author meant (they reach the memo's input section
/// and the JSON's input warnings): two joints at one place, a member running through a joint it is not connected to, two
/// members between the same joints, and ids that look alike but differ (Unicode forms, letters of another alphabet,
/// invisible characters) — each of these makes members that should meet stay apart, or a load land on another member.
/// </summary>
internal sealed class ModelSanity : ITableReader
{
    /// <summary>Above this many member–joint pairs the "member through a joint" check is not run (a review reads far fewer).</summary>
    private const long MaxPairs = 20_000_000;

    public void Read(SubmissionDraft d)
    {
        if (d.Model is not { } model) return;
        var joints = model.Joints;
        double size = Math.Max(1e-9, joints.Count == 0 ? 1 : Math.Max(joints.Max(j => j.X) - joints.Min(j => j.X), joints.Max(j => j.Y) - joints.Min(j => j.Y)));
        double tol = 1e-6 * size;
        var length = d.DisplayUnits().Length;
        string At(double x, double y) => string.Create(CultureInfo.InvariantCulture, $"x = {length.FromSi(x):0.###}, y = {length.FromSi(y):0.###} {length.Symbol}");

        // Two joints at one place: members that name one of them are not connected to members that name the other.
        var order = new Dictionary<Joint, int>(ReferenceEqualityComparer.Instance);
        for (int n = 0; n < joints.Count; n++) order[joints[n]] = n;
        var byX = joints.OrderBy(j => j.X).ThenBy(j => j.Y).ToList();
        for (int i = 0; i < byX.Count; i++)
            for (int k = i + 1; k < byX.Count && byX[k].X - byX[i].X <= tol; k++)
                if (Math.Abs(byX[k].Y - byX[i].Y) <= tol)
                {
                    var (first, second) = order[byX[i]] <= order[byX[k]] ? (byX[i], byX[k]) : (byX[k], byX[i]);
                    d.Warn(second.Source, Messages.CoincidentJoints(first.Id, second.Id, At(second.X, second.Y)));
                }

        // Two members between the same two joints: their stiffnesses add.
        var pairs = new Dictionary<(string, string), Member>();
        foreach (var m in model.Members)
        {
            var key = string.CompareOrdinal(m.Start, m.End) <= 0 ? (m.Start, m.End) : (m.End, m.Start);
            if (!pairs.TryAdd(key, m)) d.Warn(m.Source, Messages.ParallelMembers(pairs[key].Id, m.Id, key.Item1, key.Item2));
        }

        // A joint inside a member's length that the member does not name: the member runs through it unconnected (two members
        // overlapping along one line show up this way too).
        if ((long)model.Members.Count * joints.Count <= MaxPairs)
        {
            var at = joints.ToDictionary(j => j.Id, StringComparer.Ordinal);
            foreach (var m in model.Members)
            {
                if (!at.TryGetValue(m.Start, out var a) || !at.TryGetValue(m.End, out var b)) continue;
                double dx = b.X - a.X, dy = b.Y - a.Y, len2 = (dx * dx) + (dy * dy);
                if (!(len2 > 0)) continue;
                double minX = Math.Min(a.X, b.X) - tol, maxX = Math.Max(a.X, b.X) + tol, minY = Math.Min(a.Y, b.Y) - tol, maxY = Math.Max(a.Y, b.Y) + tol;
                foreach (var j in joints)
                {
                    if (j.X < minX || j.X > maxX || j.Y < minY || j.Y > maxY || j.Id == m.Start || j.Id == m.End) continue;
                    double t = (((j.X - a.X) * dx) + ((j.Y - a.Y) * dy)) / len2;
                    double off = Math.Abs(((j.X - a.X) * dy) - ((j.Y - a.Y) * dx)) / Math.Sqrt(len2);
                    if (t * Math.Sqrt(len2) > tol && (1 - t) * Math.Sqrt(len2) > tol && off <= tol)
                        d.Warn(m.Source, Messages.MemberThroughJoint(m.Id, j.Id));
                }
            }
        }

        LookAlike(d, "joint", joints.Select(j => (j.Id, j.Source)));
        LookAlike(d, "member", model.Members.Select(m => (m.Id, m.Source)));
    }

    /// <summary>Ids that read the same (<see cref="IdSkeleton.Of"/>) but are different strings.</summary>
    private static void LookAlike(SubmissionDraft d, string kind, IEnumerable<(string Id, SourceRef Source)> ids)
    {
        var seen = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (id, source) in ids)
        {
            string skeleton = IdSkeleton.Of(id);
            if (!seen.TryAdd(skeleton, id) && seen[skeleton] != id)
                d.Warn(source, Messages.LookAlikeIds(kind, seen[skeleton], id, IdSkeleton.Differences(seen[skeleton], id)));
        }
    }
}
