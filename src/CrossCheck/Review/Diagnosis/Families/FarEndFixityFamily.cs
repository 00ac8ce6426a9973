using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A support's fixity mistaken: a pin treated as fixed against rotation, or a fixed support as a pin. Each is one
/// constraint added to or one unknown bordered onto the shared factor, tried at the supports near the members whose claims
/// differ (see <see cref="Evidence"/>).
/// </summary>
internal sealed class FarEndFixityFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var supports = x.Model.Joints.Where(j => j.IsSupport).ToList();
        var order = supports.Select((j, i) => (j.Id, i)).ToDictionary(t => t.Id, t => t.i, StringComparer.Ordinal);
        foreach (var j in x.Evidence.NearSupports(supports))
        {
            Restraint changed;
            string message, working;
            if (!j.Restraint.HasFlag(Restraint.Rotation))
            {
                changed = j.Restraint | Restraint.Rotation;
                message = $"The claims follow from treating support {j.Id} as fixed against rotation, but it is {Word(j.Restraint)}.";
                working = "For a member whose far end is pinned use the modified stiffness 3EI/L and carry nothing over to the pin.";
            }
            else
            {
                changed = j.Restraint & ~Restraint.Rotation;
                message = $"The claims follow from treating support {j.Id} as pinned, but it is fixed.";
                working = "Its members need the full stiffness 4EI/L and a carry-over of ½ to the support.";
            }
            double[] predicted;
            try { predicted = x.Solver.WithRestraint(x.Case, j, changed, x.Keys); }
            catch (StructureException) { continue; } // a mechanism with this support changed: the variant does not apply
            yield return new Hypothesis(CauseCode.FarEndFixity, 3, predicted, message)
            {
                CorrectWorking = working,
                Identity = $"far-end-fixity|{j.Id}",
                Place = new JointPlace(j.Id),
                Order = order[j.Id],
            };
        }
    }

    private static string Word(Restraint r) => r switch
    {
        Restraint.Pinned => "pinned",
        Restraint.Roller => "a roller",
        Restraint.Free => "free",
        _ => r.ToString().ToLowerInvariant(),
    };
}
