using CrossCheck.Review;

namespace CrossCheck.Tests.Review;

/// <summary>How α_cr is written: never as a rounded zero, so that a flag always states a factor the designer can act on.</summary>
public class SwaySensitivityTests
{
    [Theory]
    [InlineData(12.345, "12.3")]
    [InlineData(7.4249, "7.42")]
    [InlineData(2.5, "2.50")]
    [InlineData(0.1, "0.10")]
    [InlineData(0.0427, "4.27E-02")]
    [InlineData(1.58e-9, "1.58E-09")]
    public void Words_KeepThreeSignificantFiguresBelowTwoDecimals(double alpha, string words) =>
        SwaySensitivity.Words(alpha).ShouldBe(words);

    [Fact]
    public void AFactorTooSmallForTwoDecimals_IsFlaggedMajor_WithItsValue()
    {
        // Below 3 a second-order analysis is needed (EN 1993-1-1 clause 5.2.2(5)B): major.
        var flag = SwaySensitivity.Flag("G", 1.58e-9).ShouldNotBeNull();
        flag.Severity.ShouldBe(Severity.Major);
        flag.Message.ShouldContain("1.58E-09");
        flag.Message.ShouldNotContain("0.00");
    }
}
