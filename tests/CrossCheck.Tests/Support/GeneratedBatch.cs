using CrossCheck.TestTools;

namespace CrossCheck.Tests.Support;

/// <summary>A folder of generated submissions (see <see cref="SubmissionFactory"/>) with an output folder beside it; deleted on dispose.</summary>
public sealed class GeneratedBatch : IDisposable
{
    private readonly TempSubmission _temp = new();

    public GeneratedBatch(BatchPlan plan, int variant)
    {
        Submissions = SubmissionFactory.WriteBatch(Folder, plan, variant);
    }

    /// <summary>The folder screened.</summary>
    public string Folder => Path.Combine(_temp.Folder, "subs");

    /// <summary>Where the outputs go.</summary>
    public string Out => Path.Combine(_temp.Folder, "out");

    /// <summary>The register file, beside the folder (where <c>screen</c> puts it by default).</summary>
    public string Register => Path.Combine(_temp.Folder, "crosscheck-register.db");

    public string Root => _temp.Folder;

    public IReadOnlyList<Generated> Submissions { get; }

    public void Dispose() => _temp.Dispose();
}
