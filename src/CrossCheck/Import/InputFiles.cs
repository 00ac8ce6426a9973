using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>
/// The one place the readers obtain a submission file's bytes (<see cref="InputFile"/>: opened once, a regular file, inside the
/// folder the limits confine reading to, counted against a byte budget as read) and its text (<see cref="InputText"/>: UTF-8,
/// UTF-16 or UTF-32, Latin-1 when nothing else fits). A refusal is an input problem naming the file, never an exception.
/// </summary>
internal static class InputFiles
{
    /// <summary>The file's bytes, or null with the problem reported at <paramref name="where"/>.</summary>
    /// <param name="tooLarge">The message for a file over <paramref name="maxBytes"/> (its size, the limit).</param>
    /// <param name="unreadable">The message for a file that could not be read (the reason).</param>
    /// <param name="within">The folder the file must lie in once its links are resolved (<see cref="InputLimits.Within"/>), or null.</param>
    public static byte[]? ReadBytes(string path, SourceRef where, string? within, long maxBytes, List<InputProblem> problems,
        Func<long, long, string> tooLarge, Func<string, string> unreadable)
    {
        try
        {
            return InputFile.Read(path, maxBytes, within);
        }
        catch (InputFileException ex)
        {
            problems.Add(new InputProblem(where, ex.Refusal switch
            {
                InputRefusal.TooLarge => tooLarge(ex.Bytes, maxBytes),
                InputRefusal.Missing => Messages.NotFound(where.File),
                InputRefusal.NotAFile => Messages.NotARegularFile(FileFacts.Describe(ex.Kind)),
                InputRefusal.OutsideFolder => ex.Message,
                _ => unreadable(ex.Message),
            }));
            return null;
        }
    }

    /// <summary>The file's text (any Unicode encoding, with a warning when read as Latin-1), or null with the problem reported.</summary>
    public static string? ReadText(string path, SourceRef where, InputLimits limits, long maxBytes, List<InputProblem> problems,
        Func<long, long, string> tooLarge, Func<string, string> unreadable)
    {
        if (ReadBytes(path, where, limits.Within, maxBytes, problems, tooLarge, unreadable) is not { } bytes) return null;
        if (bytes.Length == 0)
        {
            problems.Add(new InputProblem(where, Messages.EmptyFile));
            return null;
        }
        if (InputText.Decode(bytes) is not { } decoded)
        {
            problems.Add(new InputProblem(where, unreadable("it contains binary data, not text")));
            return null;
        }
        // Not UTF-8: spreadsheets on older systems save Windows-1252; Latin-1 keeps every byte readable.
        if (decoded.Fallback) problems.Add(new InputProblem(where, Messages.NotUtf8, ProblemSeverity.Warning));
        return decoded.Text;
    }
}
