using System.Diagnostics.CodeAnalysis;
using CrossCheck.Common;
using CrossCheck.Memo;

namespace CrossCheck.Jobs;

/// <summary>A firm's own memo template, read and checked before any submission is reviewed.</summary>
/// <param name="Text">The Scriban text.</param>
/// <param name="Name">The file it came from, for messages.</param>
public sealed record MemoTemplateFile(string Text, string Name)
{
    /// <summary>Reads and checks the template at <paramref name="path"/>.</summary>
    /// <returns>False, with a sentence for the user, when the file does not exist or the template has an error.</returns>
    public static bool TryLoad(string path, [NotNullWhen(true)] out MemoTemplateFile? template, [NotNullWhen(false)] out string? problem)
    {
        ArgumentNullException.ThrowIfNull(path);
        template = null;
        string text;
        try
        {
            // Opened once, a regular file (a named pipe would hang the reading), at most MaxBytes.
            text = InputText.Decode(InputFile.Read(path, MaxBytes))?.Text ?? throw new InputFileException(InputRefusal.Unreadable, "it holds binary data, not text");
        }
        catch (InputFileException ex)
        {
            problem = ex.Refusal == InputRefusal.Missing ? $"template '{path}' does not exist." : $"template '{path}' cannot be used: {ex.Message}.";
            return false;
        }
        try
        {
            MemoRenderer.Validate(text, path);
        }
        catch (MemoTemplateException ex)
        {
            problem = $"the memo template has an error: {ex.Message}";
            return false;
        }
        template = new MemoTemplateFile(text, path);
        problem = null;
        return true;
    }

    /// <summary>Largest template read (a shipped memo template is a few tens of kilobytes).</summary>
    public const long MaxBytes = 4L * 1024 * 1024;

    /// <summary>Renders <paramref name="model"/> with this template.</summary>
    /// <exception cref="MemoTemplateException">The template fails on this model.</exception>
    public string Render(MemoModel model) => MemoRenderer.Render(model, Text, Name);
}
