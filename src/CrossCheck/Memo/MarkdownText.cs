namespace CrossCheck.Memo;

/// <summary>
/// Text from a submission made inert in a Markdown memo: Markdown viewers pass raw HTML through and follow links, so a title
/// <c>&lt;img src=x onerror=...&gt;</c> or a member called <c>[open](javascript:...)</c> would run or link. A <c>&lt;</c> becomes
/// <c>&amp;lt;</c> (no tag, no autolink can start) and <c>](</c> becomes <c>]\(</c> (no inline link or image); the text reads the
/// same. Idempotent, so a value escaped twice is unchanged.
/// </summary>
public static class MarkdownText
{
    public static string Inert(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!text.Contains('<', StringComparison.Ordinal) && !text.Contains("](", StringComparison.Ordinal)) return text;
        return text.Replace("<", "&lt;", StringComparison.Ordinal).Replace("](", "]\\(", StringComparison.Ordinal);
    }
}
