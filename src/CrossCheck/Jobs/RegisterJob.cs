using System.Diagnostics.CodeAnalysis;
using CrossCheck.Register;

namespace CrossCheck.Jobs;

/// <summary>The register's own commands: open an existing register, export it, copy it to another (file or server).</summary>
public static class RegisterJob
{
    /// <summary>Opens a register that must already exist (reading never creates one): a file path, or a PostgreSQL URI or connection string.</summary>
    public static bool TryOpenExisting(string location, [NotNullWhen(true)] out ReviewRegister? register, [NotNullWhen(false)] out string? problem)
    {
        ArgumentNullException.ThrowIfNull(location);
        register = null;
        try
        {
            register = ReviewRegister.OpenExisting(RegisterLocation.Parse(location));
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
    public static (string? Text, string? WrittenTo, string? Problem) Export(string location, bool findings, string? outPath)
    {
        if (JobOutput.RefuseInput(outPath, location) is { } clash) return (null, null, clash);
        if (!TryOpenExisting(location, out var register, out var problem)) return (null, null, problem);
        using (register)
        {
            string csv;
            try
            {
                csv = findings ? register.ExportFindingsCsv() : register.ExportReviewsCsv();
            }
            catch (RegisterException ex)
            {
                return (null, null, ex.Message);
            }
            if (outPath is null || Common.OutputTarget.IsStandardOutput(outPath)) return (csv, null, null);
            return JobOutput.TryWrite(outPath, csv, out problem) ? (null, outPath, null) : (null, null, problem);
        }
    }

    /// <summary>
    /// Copies the register at <paramref name="from"/> into the one at <paramref name="to"/> (created if needed, and
    /// empty), then checks both and compares their contents.
    /// </summary>
    public static RegisterCopyOutcome Copy(string from, string to)
    {
        ArgumentNullException.ThrowIfNull(from);
        ArgumentNullException.ThrowIfNull(to);
        if (!TryOpenExisting(from, out var source, out var problem)) return new RegisterCopyOutcome(problem);
        using (source)
        {
            try
            {
                using var target = ReviewRegister.Open(RegisterLocation.Parse(to));
                var (reviews, findings) = source.CopyTo(target);
                var problems = source.Check().Select(p => $"{source.Path}: {p}").Concat(target.Check().Select(p => $"{target.Path}: {p}")).ToList();
                return new RegisterCopyOutcome(null)
                {
                    From = source.Path, To = target.Path, Reviews = reviews, Findings = findings,
                    FromTally = source.Tally(), ToTally = target.Tally(), Problems = problems,
                };
            }
            catch (RegisterException ex)
            {
                return new RegisterCopyOutcome(ex.Message);
            }
        }
    }
}

/// <summary>What <see cref="RegisterJob.Copy"/> did: why it could not, or what it copied and how both registers check.</summary>
public sealed record RegisterCopyOutcome(string? Problem)
{
    public string From { get; init; } = "";
    public string To { get; init; } = "";
    public int Reviews { get; init; }
    public int Findings { get; init; }
    public RegisterTally? FromTally { get; init; }
    public RegisterTally? ToTally { get; init; }

    /// <summary>What <c>register check</c> finds on either side after the copy.</summary>
    public IReadOnlyList<string> Problems { get; init; } = [];

    /// <summary>True when both registers check sound and hold the same reviews and findings (equal digests).</summary>
    public bool Verified => Problem is null && Problems.Count == 0 && FromTally is not null && FromTally == ToTally;
}
