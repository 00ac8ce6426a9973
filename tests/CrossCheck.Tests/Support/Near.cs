namespace CrossCheck.Tests.Support;

/// <summary>One tolerance rule for numeric checks: relative to the expected value, with an absolute floor.</summary>
public static class Near
{
    public static void Equal(double actual, double expected, double relative = 1e-9, double absolute = 1e-6, string? what = null)
    {
        double tol = Math.Max(absolute, relative * Math.Abs(expected));
        if (!(Math.Abs(actual - expected) <= tol))
            throw new Shouldly.ShouldAssertException(
                $"{what ?? "value"}: expected {expected:R} ± {tol:G3}, got {actual:R} (difference {actual - expected:G6})");
    }
}
