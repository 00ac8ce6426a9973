using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A claim that is the analysis value miscopied: at the precision it was written to, two neighbouring digits
/// exchanged, the sign lost, or the decimal point moved. Only those ends change; the rest of the prediction is the
/// analysis itself, so the hypothesis fits only when every other claim agrees.
/// </summary>
internal sealed class CopyingSlipFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var unit = x.Quote.MomentUnit;
        var slips = new List<(int Index, string What)>();
        for (int i = 0; i < x.Keys.Count; i++)
        {
            if (Math.Abs(x.Claimed[i] - x.Recomputed[i]) <= x.Agree) continue;
            // Compared as written: in the author's unit and convention.
            var end = x.Keys[i].End;
            double claimed = x.Ends[i].Claim?.AsWritten ?? unit.FromSi(x.Quote.Convention.FromClockwise(x.Claimed[i], end));
            double recomputed = unit.FromSi(x.Quote.Convention.FromClockwise(x.Recomputed[i], end));
            int decimals = DecimalsWritten(claimed, x.Ends[i].Source?.Text);
            string c = Digits(claimed, decimals), r = Digits(recomputed, decimals);
            string? what = null;
            if (c == r && Math.Sign(claimed) != Math.Sign(recomputed)) what = "its sign lost";
            else if (Math.Sign(claimed) == Math.Sign(recomputed) && c.Length == r.Length && NeighboursExchanged(c, r))
                what = "two neighbouring digits exchanged";
            else if (Math.Sign(claimed) == Math.Sign(recomputed) && recomputed != 0)
                foreach (double shift in new[] { 10.0, 100.0, 0.1, 0.01 })
                    if (Math.Abs((claimed / (recomputed * shift)) - 1) < (0.5 * Math.Pow(10, -decimals) / Math.Abs(claimed)) + 1e-9)
                    {
                        what = "its decimal point moved";
                        break;
                    }
            if (what is not null) slips.Add((i, what));
        }
        // Signs lost at several ends are a sign-convention pattern, not copying; one lost sign can be either.
        if (slips.Count > 1) slips.RemoveAll(s => s.What == "its sign lost");
        if (slips.Count == 0) yield break;
        string Describe((int Index, string What) s)
        {
            var f = x.Ends[s.Index];
            string cite = f.Source is { } src ? $" ({src.Citation})" : "";
            return $"{f.Member} at {f.At}{cite}, written {Quoting.ClaimNumber(f.Claim!)} where the analysis gives {x.EndMoment(x.Recomputed[s.Index], f.End!.Value)}: {s.What}";
        }
        var all = (double[])x.Recomputed.Clone();
        foreach (var s in slips) all[s.Index] = x.Claimed[s.Index];
        var first = x.Ends[slips[0].Index];
        yield return new Hypothesis(CauseCode.CopyingSlip, 4, all,
            slips.Count == 1
                ? $"The claim for {Describe(slips[0])}. The analysis behind it is right; correct the figure where it was copied."
                : $"The claims for {string.Join("; ", slips.Select(Describe))}. The analysis behind them is right; correct the figures where they were copied.")
        {
            Identity = $"copying-slip|{x.Case.Id}|{string.Join(",", slips.Select(s => $"{x.Keys[s.Index].Member}@{x.Keys[s.Index].End}"))}",
            Place = slips.Count == 1 ? first.Place : null,
        };
    }

    /// <summary>Decimals the claim was written with: from the text as read when known, else the fewest that give the value.</summary>
    private static int DecimalsWritten(double value, string? text)
    {
        if (text is { Length: > 0 })
        {
            string t = text.Trim();
            int dot = Math.Max(t.LastIndexOf('.'), t.LastIndexOf(','));
            if (dot >= 0)
            {
                int n = 0;
                for (int k = dot + 1; k < t.Length && char.IsAsciiDigit(t[k]); k++) n++;
                if (n > 0 && n <= 6) return n;
            }
            else if (t.Any(char.IsAsciiDigit)) return 0;
        }
        for (int d = 0; d <= 4; d++)
            if (Math.Abs(Math.Round(value, d) - value) <= 1e-9 * Math.Max(1, Math.Abs(value))) return d;
        return 4;
    }

    /// <summary>The digits of |value| at <paramref name="decimals"/> places, without the point.</summary>
    private static string Digits(double value, int decimals) =>
        Math.Abs(value).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture).Replace(".", "", StringComparison.Ordinal);

    private static bool NeighboursExchanged(string a, string b)
    {
        int first = -1;
        for (int k = 0; k < a.Length; k++)
        {
            if (a[k] == b[k]) continue;
            if (first >= 0) return k == first + 1 && a[first] == b[k] && a[k] == b[first] && a[(k + 1)..] == b[(k + 1)..];
            first = k;
        }
        return false;
    }
}
