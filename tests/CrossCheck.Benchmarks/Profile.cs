using System.Diagnostics;
using CrossCheck.Analysis;

namespace CrossCheck.Benchmarks;

/// <summary>Solves one big frame repeatedly, for a profiler to attach to (<c>-- profile DOF</c>).</summary>
public static class Profile
{
    public static void Run(int dof)
    {
        var (storeys, bays) = FrameGenerator.ForDof(dof, 20);
        var (model, cases) = FrameGenerator.Regular(storeys, bays);
        for (int i = 0; i < 6; i++)
        {
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var sw = Stopwatch.StartNew();
            new FrameSolver().Solve(model, cases);
            var cpu = Process.GetCurrentProcess().TotalProcessorTime - cpu0;
            Console.WriteLine($"solve {sw.ElapsedMilliseconds} ms wall, {cpu.TotalMilliseconds:0} ms CPU (incl. GC threads)");
        }
    }
}

/// <summary>
/// Reads one PDF repeatedly, stage by stage (<c>-- profile-pdf FILE</c>): the PDF library alone (letters of every
/// page), our text lines, table finding and conversion, the whole import. Prints the least time of each stage over
/// the runs (the least is the one the machine's other work disturbed least) and the allocations of a whole import.
/// </summary>
public static class ProfilePdf
{
    public static void Run(string path, int runs = 10)
    {
        var bytes = File.ReadAllBytes(path);
        var best = new Dictionary<string, double>();
        void Time(string stage, Action a)
        {
            var sw = Stopwatch.StartNew();
            a();
            double ms = sw.Elapsed.TotalMilliseconds;
            best[stage] = best.TryGetValue(stage, out var b) ? Math.Min(b, ms) : ms;
        }
        long alloc = 0;
        double pauses = 0;
        for (int i = 0; i < runs; i++)
        {
            Time("PDF library: letters of every page", () =>
            {
                using var pdf = UglyToad.PdfPig.PdfDocument.Open(bytes);
                int n = 0;
                for (int p = 1; p <= pdf.NumberOfPages; p++) n += pdf.GetPage(p).Letters.Count;
                if (n == 0) throw new InvalidOperationException("no letters");
            });
            Time("text lines (library + ours)", () => CrossCheck.Import.Pdf.PdfTextReader.Read(path, "calc.pdf", CrossCheck.Import.Pdf.PdfLimits.Default, []));
            Time("tables found and converted", () => CrossCheck.Import.Pdf.PdfSubmissionReader.Extract(path));
            long a0 = GC.GetTotalAllocatedBytes(precise: false);
            var p0 = GC.GetTotalPauseDuration();
            Time("whole import (submission built)", () =>
            {
                if (!CrossCheck.Import.SubmissionReader.Read(path).Succeeded) throw new InvalidOperationException("import failed");
            });
            alloc = GC.GetTotalAllocatedBytes(precise: false) - a0;
            pauses = (GC.GetTotalPauseDuration() - p0).TotalMilliseconds;
        }
        foreach (var (stage, ms) in best) Console.WriteLine($"{stage,-40} least of {runs}: {ms,7:0} ms");
        Console.WriteLine($"last whole import: allocated {alloc / 1048576} MiB, GC pauses {pauses:0} ms");
    }
}
