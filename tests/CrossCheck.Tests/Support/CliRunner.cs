using CrossCheck.Cli;

namespace CrossCheck.Tests.Support;

/// <summary>Runs the command line in-process and captures what it writes.</summary>
public static class CliRunner
{
    public sealed record Outcome(int ExitCode, string Out, string Err);

    public static Outcome Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = App.Run(args, output, error);
        return new Outcome(code, output.ToString(), error.ToString());
    }

    public static string Demo(string name) => Path.Combine(RepoPaths.Root, "fixtures", "demo", name);
}
