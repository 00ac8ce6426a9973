namespace CrossCheck.Import.Loads;

/// <summary><c>udl</c>: a uniform load w from a to b.</summary>
internal sealed class UniformLoadKind : DistributedLoadKind
{
    public override IReadOnlyList<string> Words { get; } = ["udl", "uniform", "distributed"];

    public override IReadOnlyList<string> Uses { get; } = ["w", "a", "b"];

    protected override double? EndIntensity(LoadRow row, double? w) => w;
}
