using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>A support's fixity mistaken: a pin treated as fixed against rotation, or a fixed support as a pin.</summary>
internal sealed class FarEndFixityFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        foreach (var j in x.Model.Joints.Where(j => j.IsSupport))
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
            var joints = x.Model.Joints.Select(k => k.Id == j.Id ? k with { Restraint = changed } : k).ToList();
            var altered = new StructureModel(joints, x.Model.Members, x.Model.Axial, x.Model.RelativeStiffness);
            yield return new Hypothesis(CauseCode.FarEndFixity, 3, x.From(x.SolveAltered(altered, x.Case)), message)
            {
                CorrectWorking = working,
                Identity = $"far-end-fixity|{j.Id}",
                Place = new JointPlace(j.Id),
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
