using BenchmarkDotNet.Attributes;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.TestTools;

namespace CrossCheck.Benchmarks;

/// <summary>
/// Review against solve of the same submission, in one warm process: an office frame of 300, 1,000 or 5,000 members
/// with one planted mistake (a beam's fixed-end moments taken as wL²/8). Solve reads and analyses; review reads,
/// analyses, compares, checks, diagnoses and writes the Markdown memo. Target: review within 10× of solve.
/// </summary>
[MemoryDiagnoser]
public class ReviewScaleBenchmarks
{
    private string _path = "";
    private InputLimits _limits = InputLimits.Default;

    [Params(300, 1000, 5000)]
    public int Members { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _path = Path.Combine(Path.GetTempPath(), $"crosscheck-bench-frame-{Environment.ProcessId}-{Members}.csv");
        var (storeys, bays) = BuildingFrame.ForMembers(Members);
        BuildingFrame.Write(_path, storeys, bays, BuildingMistake.FixedEndMoment, variant: 1);
        _limits = InputLimits.Default with { MaxMembers = Math.Max(Members, InputLimits.Default.MaxMembers) };
    }

    [GlobalCleanup]
    public void Cleanup() => File.Delete(_path);

    [Benchmark(Baseline = true, Description = "read + solve")]
    public int Solve()
    {
        var s = SubmissionReader.Read(_path, _limits).Submission!;
        return new FrameSolver().Solve(s.Model, s.Cases).Cases.Count;
    }

    [Benchmark(Description = "read + solve + review + memo")]
    public int Review()
    {
        var s = SubmissionReader.Read(_path, _limits).Submission!;
        var r = ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases));
        return MemoRenderer.Render(new MemoModel(r), MemoFormat.Markdown).Length;
    }
}
