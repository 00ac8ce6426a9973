using System.Diagnostics.CodeAnalysis;
using CrossCheck.Register;

namespace CrossCheck.Jobs;

/// <summary>The register's commands that read it: open an existing register, export it.</summary>
public static class RegisterJob
{
    /// <summary>Opens a register that must already exist (reading never creates one).</summary>
    public static bool TryOpenExisting(string path, [NotNullWhen(true)] out ReviewRegister? register, [NotNullWhen(false)] out string? problem)
    {
        ArgumentNullException.ThrowIfNull(path);
        register = null;
        if (!File.Exists(path))
        {
            problem = $"there is no register at '{path}' ('crosscheck screen' and 'crosscheck review --register' create one).";
            return false;
        }
        try
        {
            register = ReviewRegister.Open(path);
            problem = null;
            return true;
        }
        catch (RegisterException ex)
        {
            problem = ex.Message;
            return false;
        }
    }

    /// <summary>The register as CSV (one row per review, or per finding), written to <paramref name="outPath"/> or returned.</summary>
    /// <returns>The outcome: the text (no path), the file written, or why not.</returns>
    public static (string? Text, string? WrittenTo, string? Problem) Export(string path, bool findings, string? outPath)
    {
        if (JobOutput.RefuseInput(outPath, path) is { } clash) return (null, null, clash);
        if (!TryOpenExisting(path, out var register, out var problem)) return (null, null, problem);
        using (register)
        {
            string csv = findings ? register.ExportFindingsCsv() : register.ExportReviewsCsv();
            if (outPath is null || Common.OutputTarget.IsStandardOutput(outPath)) return (csv, null, null);
            return JobOutput.TryWrite(outPath, csv, out problem) ? (null, outPath, null) : (null, null, problem);
        }
    }
}
