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
