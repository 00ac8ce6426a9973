using BenchmarkDotNet.Running;

namespace CrossCheck.Benchmarks;

/// <summary>
/// Benchmarks (BenchmarkDotNet): <c>dotnet run -c Release --project tests/CrossCheck.Benchmarks -- --filter '*'</c>.
/// <c>-- scaling</c> prints a quick time-and-memory table of frame size against solve time without BenchmarkDotNet.
/// </summary>
public static class Program
{
    public static void Main(string[] args)
    {
        if (args.Length > 0 && args[0] == "scaling") { Scaling.Run(); return; }
        if (args.Length > 1 && args[0] == "warm-review")
        {
            WarmReview.Run(args[1], args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 20);
            return;
        }
        if (args.Length > 1 && args[0] == "screen-stages")
        {
            ScreenStagesRun.Run(args[1], args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 3);
            return;
        }
        if (args.Length > 1 && args[0] == "review-profile")
        {
            ReviewProfile.Run(args[1], args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 2);
            return;
        }
        if (args.Length > 1 && args[0] == "hypotheses")
        {
            HypothesisCount.Run(args[1], args.Length > 2 && args[2] == "exhaustive");
            return;
        }
        if (args.Length > 1 && args[0] == "profile-pdf") { ProfilePdf.Run(args[1]); return; }
        if (args.Length > 1 && args[0] == "profile") { Profile.Run(int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture)); return; }
        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}
