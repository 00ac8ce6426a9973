namespace CrossCheck.Common;

/// <summary>The tool's name and version for memos and JSON.</summary>
public static class ToolInfo
{
    public static string Version { get; } =
        typeof(ToolInfo).Assembly.GetName().Version is { } v ? $"{v.Major}.{v.Minor}.{v.Build}" : "0.0.0";
}
