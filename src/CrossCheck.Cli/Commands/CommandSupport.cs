using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary>What the commands share: printing warnings and problems, writing to standard output or a file, the console.</summary>
internal static class CommandSupport
{
    public static void Warnings(IEnumerable<InputProblem> warnings, CliIo io)
    {
        foreach (var w in warnings) io.Error.WriteLine($"warning: {Clean(w.ToString())}");
    }

    /// <summary>A sentence for the user, after <c>crosscheck:</c>.</summary>
    public static void Fail(string message, CliIo io) => io.Error.WriteLine($"crosscheck: {Clean(message)}");

    /// <summary>Text from a submission, a file name or the register, safe for a terminal: no control characters (<see cref="TextSafety"/>).</summary>
    public static string Clean(string? text) => TextSafety.Clean(text);

    /// <summary>
    /// Data as a table cell or part of a line: printed exactly as written — never read as console markup (<c>[red]</c>) or
    /// as an emoji shortcode (<c>:warning:</c>, <c>info.csv:1:key:</c>) — with control characters removed.
    /// </summary>
    public static Text Cell(string? text, Style? style = null) => new(Clean(text), style ?? Style.Plain);

    /// <summary>A line made of parts, each printed as written (see <see cref="Cell"/>).</summary>
    public static void Line(IAnsiConsole console, params (string? Text, Style? Style)[] parts)
    {
        var line = new Paragraph();
        foreach (var (text, style) in parts) line.Append(Clean(text), style ?? Style.Plain);
        console.Write(line);
        console.WriteLine();
    }

    /// <summary>Prints why a submission has no result: the input problems, or why its structure cannot be analysed.</summary>
    public static void ReportErrors(string path, IReadOnlyList<InputProblem> errors, string? structureProblem, CliIo io)
    {
        if (structureProblem is not null)
        {
            Fail($"'{path}' cannot be analysed: {structureProblem}", io);
            return;
        }
        Fail($"'{path}' could not be read ({errors.Count} problem{(errors.Count == 1 ? "" : "s")}):", io);
        foreach (var e in errors) io.Error.WriteLine($"  {Clean(e.Where.Located)}: {Clean(e.Message)}");
    }

    /// <summary>
    /// Writes to <paramref name="outPath"/> (atomically, by the library; a device or pipe is streamed into), or to standard output
    /// when it is null or <c>-</c>; false (after a message) when the file cannot be written.
    /// </summary>
    public static bool Emit(string? outPath, string content, CliIo io, bool announce = true)
    {
        if (outPath is null || OutputTarget.IsStandardOutput(outPath)) { io.Output.Write(content); return true; }
        if (!JobOutput.TryWrite(outPath, content, out var problem))
        {
            Fail(problem, io);
            return false;
        }
        if (announce) io.Error.WriteLine($"wrote {outPath}");
        return true;
    }

    /// <summary>Bytes (a PDF memo) to standard output: the process's own stream when the command writes to the console.</summary>
    public static void WriteBytes(byte[] bytes, CliIo io)
    {
        if (ReferenceEquals(io.Output, System.Console.Out))
        {
            io.Output.Flush();
            using var stdout = System.Console.OpenStandardOutput();
            stdout.Write(bytes);
            return;
        }
        io.Output.Write(System.Text.Encoding.Latin1.GetString(bytes));
    }

    public static IAnsiConsole Console(CliIo io)
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(io.Output),
            Ansi = io.Interactive ? AnsiSupport.Detect : AnsiSupport.No,
            ColorSystem = io.Interactive ? ColorSystemSupport.Detect : ColorSystemSupport.NoColors,
            Interactive = io.Interactive ? InteractionSupport.Detect : InteractionSupport.No,
        });
        if (!io.Interactive) console.Profile.Width = 132; // files and pipes: wide enough for the tables
        return console;
    }
}
