using CrossCheck.Cli;

namespace CrossCheck.Tests.Support;

/// <summary>Runs the command line in-process and captures what it writes.</summary>
public static class CliRunner
{
    public sealed record Outcome(int ExitCode, string Out, string Err);

    public static Outcome Run(params string[] args) => RunWith(null, args);

    /// <summary>Runs with an environment of its own (<paramref name="environment"/> maps variable names to values; others are unset).</summary>
    public static Outcome RunWith(IReadOnlyDictionary<string, string>? environment, params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = App.Run(args, output, error, environment is null ? null : name => environment.GetValueOrDefault(name));
        return new Outcome(code, output.ToString(), error.ToString());
    }

    public static string Demo(string name) => Path.Combine(RepoPaths.Root, "fixtures", "demo", name);
}
