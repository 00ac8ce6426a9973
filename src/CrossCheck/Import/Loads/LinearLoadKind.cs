namespace CrossCheck.Import.Loads;

/// <summary><c>linear</c>: a load varying linearly from w at a to <c>w end</c> at b.</summary>
internal sealed class LinearLoadKind : DistributedLoadKind
{
    public override IReadOnlyList<string> Words { get; } = ["linear", "trapezoidal", "triangular", "varying"];

    public override IReadOnlyList<string> Uses { get; } = ["w", "w end", "a", "b"];

    protected override double? EndIntensity(LoadRow row, double? w) => row.Number("w end", required: true, requiredBecause: "a linear load");
}
