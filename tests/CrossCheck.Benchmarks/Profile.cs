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

/// <summary>Reads one PDF repeatedly, stage by stage (<c>-- profile-pdf FILE</c>).</summary>
public static class ProfilePdf
{
    public static void Run(string path)
    {
        for (int i = 0; i < 4; i++)
        {
            var sw = Stopwatch.StartNew();
            var problems = new List<CrossCheck.Import.InputProblem>();
            CrossCheck.Import.Pdf.PdfTextReader.Read(path, "calc.pdf", CrossCheck.Import.Pdf.PdfLimits.Default, problems);
            long read = sw.ElapsedMilliseconds; sw.Restart();
            var r = CrossCheck.Import.SubmissionReader.Read(path);
            Console.WriteLine($"text lines {read} ms; whole import {sw.ElapsedMilliseconds} ms; ok {r.Succeeded}; problems {problems.Count}");
        }
    }
}
