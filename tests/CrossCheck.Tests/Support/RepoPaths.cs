namespace CrossCheck.Tests.Support;

public static class RepoPaths
{
    /// <summary>The repository root (the folder holding CrossCheck.sln), found from the test binaries.</summary>
    public static string Root { get; } = Find();

    private static string Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "CrossCheck.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("CrossCheck.sln not found above the test binaries.");
    }
}
