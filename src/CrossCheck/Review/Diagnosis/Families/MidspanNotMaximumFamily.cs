namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// The span moment taken at mid-span: where the end moments differ, the largest moment is where the shear changes sign,
/// not at L/2. For an envelope's span rows, the envelope's largest moment at mid-span.
/// </summary>
internal sealed class MidspanNotMaximumFamily : ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Kind == SectionKind.Shear) yield break;
        var predicted = new double[x.Claims.Count];
        for (int i = 0; i < x.Claims.Count; i++)
        {
            var k = x.Claims[i].Key;
            if (k.End is not null) { predicted[i] = x.Claims[i].Recomputed; continue; }
            var m = x.Model.Member(k.Member);
            double half = x.Model.Length(m) / 2;
            if (x.Kind == SectionKind.SpanMoment && x.Result is { } r) predicted[i] = r.Members[k.Member].MomentAt(half);
            else if (x.Envelope is { } e) predicted[i] = e.Extremes(c => c.Members[k.Member].MomentAt(half)).Max.Value;
            else yield break;
        }
        yield return new Hypothesis(CauseCode.MidspanNotMaximum, 1, predicted,
            "The span moments claimed are the moments at mid-span; where the two end moments differ, the largest moment lies where the shear changes sign, " +
            "off the middle of the span.")
        {
            Identity = "midspan-not-maximum",
            CorrectWorking = "Find where the shear is zero (x = V_start / w under a uniform load) and take the moment there.",
        };
    }
}
