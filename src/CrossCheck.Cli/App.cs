using System.CommandLine;
using CrossCheck.Cli.Commands;
using CrossCheck.Common;

namespace CrossCheck.Cli;

/// <summary>Exit codes of every command (docs/EXIT-CODES.md).</summary>
public static class ExitCodes
{
    public const int Concur = 0;
    public const int Comments = 1;
    public const int InputError = 2;
    public const int InternalError = 3;

    /// <summary>A screen stopped by Ctrl-C (SIGINT) after writing the summary and index of what it had done: 128 + 2.</summary>
    public const int Interrupted = 130;

    /// <summary>A screen stopped by SIGTERM after writing the summary and index of what it had done: 128 + 15.</summary>
    public const int Terminated = 143;
}

/// <summary>The command line: parses arguments, calls the library, returns an exit code. No logic of its own.</summary>
public static class App
{
    /// <param name="args">The command line.</param>
    /// <param name="output">Standard output.</param>
    /// <param name="error">Standard error.</param>
    /// <param name="environment">Reads an environment variable (the process's when null; tests give their own).</param>
    public static int Run(string[] args, TextWriter output, TextWriter error, Func<string, string?>? environment = null)
    {
        ArgumentNullException.ThrowIfNull(args);
        var io = new CliIo(output, error, ReferenceEquals(output, Console.Out) && !Console.IsOutputRedirected)
        {
            Variable = environment ?? Environment.GetEnvironmentVariable,
        };
        var root = new RootCommand(
            "CrossCheck re-analyses the continuous beams and rigid frames of a calculation, checks the member end moments " +
            "its author claims, and writes a review memo. It checks analysis arithmetic only; the engineer of record stays responsible.");
        root.Add(ReviewCommand.Create(io));
        root.Add(SolveCommand.Create(io));
        root.Add(ScreenCommand.Create(io));
        root.Add(HistoryCommand.Create(io));
        root.Add(HistoryCommand.CreateRegister(io));
        root.Add(ExtractCommand.Create(io));
        foreach (var sub in root.Subcommands)
            if (!sub.Options.OfType<VersionOption>().Any()) sub.Add(new VersionOption());

        // --version answers with this tool's version wherever it appears (the parser's own option would report the host's).
        if (args.Contains("--version") && !args.Any(a => a is "--help" or "-h" or "-?"))
        {
            output.WriteLine(ToolInfo.Version);
            return ExitCodes.Concur;
        }

        ParseResult parsed;
        try
        {
            parsed = root.Parse(args);
        }
        catch (Exception ex)
        {
            error.WriteLine($"crosscheck: {ex.Message}");
            return ExitCodes.InputError;
        }
        bool wantsInfo = args.Any(a => a is "--help" or "-h" or "-?" or "--version");
        if (parsed.Errors.Count > 0 && !wantsInfo)
        {
            foreach (var e in parsed.Errors) error.WriteLine($"crosscheck: {e.Message}");
            error.WriteLine("Run 'crosscheck --help' for usage.");
            return ExitCodes.InputError;
        }
        try
        {
            return parsed.Invoke(new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false });
        }
        catch (Exception ex)
        {
            error.WriteLine($"crosscheck: internal error: {ex.Message}");
            error.WriteLine("This is a fault in CrossCheck, not in your input. Please report it with the submission that caused it.");
            if (Environment.GetEnvironmentVariable("CROSSCHECK_DEBUG") == "1") error.WriteLine(ex.ToString());
            return ExitCodes.InternalError;
        }
    }
}

/// <summary>Where a command writes: standard output for results, standard error for messages.</summary>
public sealed class CliIo(TextWriter output, TextWriter error, bool interactive)
{
    public TextWriter Output { get; } = output;
    public TextWriter Error { get; } = error;

    /// <summary>True when standard output is a terminal (colours and progress bars allowed).</summary>
    public bool Interactive { get; } = interactive;

    /// <summary>Reads an environment variable (<c>CROSSCHECK_REGISTER</c>).</summary>
    public Func<string, string?> Variable { get; init; } = Environment.GetEnvironmentVariable;
}
