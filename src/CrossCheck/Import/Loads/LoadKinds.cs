namespace CrossCheck.Import.Loads;

/// <summary>The load kinds of the format. To add one: its <see cref="LoadKind"/> class and a line in <see cref="All"/>.</summary>
internal static class LoadKinds
{
    /// <summary>Every kind, in the order messages list them.</summary>
    public static readonly LoadKind[] All =
    [
        new PointLoadKind(),
        new UniformLoadKind(),
        new LinearLoadKind(),
        new CoupleLoadKind(),
        new JointForceKind(),
    ];

    // A word claimed by two kinds fails here, when the type is first used.
    private static readonly Dictionary<string, LoadKind> ByWord =
        All.SelectMany(k => k.Words.Select(w => (Word: w, Kind: k))).ToDictionary(x => x.Word, x => x.Kind, StringComparer.Ordinal);

    /// <summary>The first word of each kind, for messages.</summary>
    public static IReadOnlyList<string> Names { get; } = [.. All.Select(k => k.Words[0])];

    /// <summary>The kind a <c>kind</c> cell names (compared normalised), or null.</summary>
    public static LoadKind? Find(string text) => ByWord.GetValueOrDefault(TableSchema.Normalize(text));
}
