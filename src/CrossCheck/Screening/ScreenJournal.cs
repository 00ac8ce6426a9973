using System.Globalization;
using CrossCheck.Common;

namespace CrossCheck.Screening;

/// <summary>
/// The note a screen keeps in its output folder while it runs (<see cref="FileName"/>), removed when it finishes: if the
/// screen is interrupted (Ctrl-C, SIGTERM, a kill, a power cut) it stays, and the next screen of the same folder into the
/// same output folder resumes: it takes the interrupted screen's date, and a submission whose review that screen recorded
/// (same reference, same input files, recorded since it started) is not recorded again — only its memo is written if it
/// is missing. The register itself says what was done; the note only says since when.
/// </summary>
/// <param name="Path">The note's file.</param>
/// <param name="Since">When the interrupted screen started (UTC, as the register stamps reviews), or null for a fresh screen.</param>
/// <param name="Date">The review date of the batch (the interrupted screen's, when resuming).</param>
public sealed record ScreenJournal(string Path, string? Since, DateOnly Date)
{
    public const string FileName = "screen-in-progress.txt";

    /// <summary>True when this screen finishes one that was interrupted.</summary>
    public bool Resuming => Since is not null;

    /// <summary>Starts a screen: resumes the note left by an interrupted screen of the same folder and register, or writes a new one.</summary>
    public static ScreenJournal Begin(string outDir, string folder, string? register, DateOnly date, TimeProvider time)
    {
        ArgumentNullException.ThrowIfNull(time);
        string path = SubmissionNames.ChildPath(outDir, FileName);
        string folderLine = "folder: " + folder, registerLine = "register: " + (register ?? "(none)");
        if (FileFacts.Of(path).Kind == FileKind.Regular)
        {
            try
            {
                var lines = File.ReadAllLines(path);
                string? Value(string key) => lines.FirstOrDefault(l => l.StartsWith(key + ": ", StringComparison.Ordinal))?[(key.Length + 2)..];
                if (lines.Contains(folderLine) && lines.Contains(registerLine) && Value("started") is { } since
                    && DateOnly.TryParseExact(Value("date"), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var earlier))
                    return new ScreenJournal(path, since, earlier);
            }
            catch (IOException)
            {
                // Unreadable: start afresh.
            }
        }
        AtomicFile.WriteText(path, string.Join('\n',
            "A CrossCheck screen is writing into this folder, or was interrupted. Run the same 'crosscheck screen' command again to finish it;",
            "the reviews already recorded in the register are not recorded again. This file is removed when the screen finishes.",
            folderLine, registerLine, "date: " + Clock.Iso(date), "started: " + Clock.UtcStamp(time), ""));
        return new ScreenJournal(path, null, date);
    }

    /// <summary>The screen finished: the note goes.</summary>
    public void Finish()
    {
        try
        {
            File.Delete(Path);
        }
        catch (IOException)
        {
            // Left behind, the note only makes the next screen check the register first.
        }
    }
}
