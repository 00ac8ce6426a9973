using System.Reflection;
using Scriban;
using Scriban.Runtime;
using Scriban.Syntax;

namespace CrossCheck.Memo;

public enum MemoFormat
{
    Markdown,
    Html,
}

/// <summary>A memo template that does not parse or refers to something the model does not have.</summary>
public sealed class MemoTemplateException : Exception
{
    public MemoTemplateException() { }
    public MemoTemplateException(string message) : base(message) { }
    public MemoTemplateException(string message, Exception inner) : base(message, inner) { }
}

/// <summary>
/// Renders memos from Scriban templates: the shipped ones (embedded from <c>templates/</c>) or a firm's own.
/// Strict variables (a typo is an error, not a blank), no includes, no file access, only public properties
/// of the model are visible.
/// </summary>
public static class MemoRenderer
{
    public static string TemplateName(MemoFormat format) => format == MemoFormat.Html ? "memo.html.sbn" : "memo.md.sbn";

    /// <summary>Text of a shipped template.</summary>
    public static string BuiltInTemplate(MemoFormat format) => BuiltInTemplate(TemplateName(format));

    public static string Render(MemoModel model, MemoFormat format) => Render(model, BuiltInTemplate(format), TemplateName(format));

    /// <exception cref="MemoTemplateException">The template has errors or refers to unknown names.</exception>
    public static string Render(MemoModel model, string templateText, string templateName) => RenderObject(model, templateText, templateName);

    /// <summary>Text of a shipped template by file name (<c>screen-index.html.sbn</c>).</summary>
    internal static string BuiltInTemplate(string fileName)
    {
        string name = "CrossCheck.Templates." + fileName;
        using var stream = typeof(MemoRenderer).Assembly.GetManifestResourceStream(name)
            ?? throw new InvalidOperationException($"Template resource {name} is missing from the build.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }

    /// <summary>Checks that a template parses, without rendering it.</summary>
    /// <exception cref="MemoTemplateException">It does not.</exception>
    public static void Validate(string templateText, string templateName)
    {
        ArgumentNullException.ThrowIfNull(templateText);
        var template = Template.Parse(templateText, templateName);
        if (template.HasErrors)
            throw new MemoTemplateException($"{templateName}: {string.Join("; ", template.Messages.Select(m => m.ToString()))}");
    }

    // Parsing a memo template costs more than rendering it; a batch renders the same one hundreds of times. Each
    // thread keeps its own parsed copies, so no parsed template is ever shared between threads.
    private static readonly ThreadLocal<Dictionary<(string Name, string Text), Template>> ParsedByThread = new(() => []);

    private static Template Parsed(string templateText, string templateName)
    {
        var cache = ParsedByThread.Value!;
        if (cache.TryGetValue((templateName, templateText), out var cached)) return cached;
        var template = Template.Parse(templateText, templateName);
        if (template.HasErrors)
            throw new MemoTemplateException($"{templateName}: {string.Join("; ", template.Messages.Select(m => m.ToString()))}");
        if (cache.Count >= 16) cache.Clear();
        cache[(templateName, templateText)] = template;
        return template;
    }

    /// <summary>Renders any report model (memo, screening index) with the same safe settings.</summary>
    internal static string RenderObject(object model, string templateText, string templateName)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(templateText);
        var template = Parsed(templateText, templateName);
        var context = new TemplateContext
        {
            StrictVariables = true,
            EnableRelaxedMemberAccess = false,
            MemberRenamer = m => m.Name,
            MemberFilter = m => m is PropertyInfo,
            TemplateLoader = null,
            LoopLimit = 500_000,
            RecursiveLimit = 50,
            RegexTimeOut = TimeSpan.FromSeconds(2),
        };
        var globals = new ScriptObject { ["model"] = model };
        context.PushGlobal(globals);
        try
        {
            return template.Render(context);
        }
        catch (ScriptRuntimeException ex)
        {
            throw new MemoTemplateException($"{templateName}: {ex.Message}", ex);
        }
    }
}
