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
/// Strict variables (a typo is an error, not a blank), no includes, no file access, and only the public properties of
/// CrossCheck's own report types are visible: a template cannot call a method or walk from a value into .NET's types
/// (reflection, files, processes). Loops, recursion, output size and time are bounded, so a template cannot hang a
/// batch or fill the disk.
/// </summary>
public static class MemoRenderer
{
    public static string TemplateName(MemoFormat format) => format == MemoFormat.Html ? "memo.html.sbn" : "memo.md.sbn";

    /// <summary>Text of a shipped template.</summary>
    public static string BuiltInTemplate(MemoFormat format) => BuiltInTemplate(TemplateName(format));

    public static string Render(MemoModel model, MemoFormat format) => Render(model, BuiltInTemplate(format), TemplateName(format));

    /// <exception cref="MemoTemplateException">The template has errors or refers to unknown names.</exception>
    public static string Render(MemoModel model, string templateText, string templateName)
    {
        ArgumentNullException.ThrowIfNull(model);
        return RenderObject(model, templateText, templateName, model.Format == MemoFormat.Markdown);
    }

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
    /// <param name="markdown">
    /// True for a Markdown memo: every value the template writes is made inert for Markdown viewers (<see cref="MarkdownText"/>), so
    /// a title such as <c>&lt;img onerror=...&gt;</c> or <c>[click](javascript:...)</c> is shown as text, whatever the template.
    /// </param>
    internal static string RenderObject(object model, string templateText, string templateName, bool markdown = false)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(templateText);
        var template = Parsed(templateText, templateName);
        using var deadline = new CancellationTokenSource(RenderTimeLimit);
        var context = new SharedAccessorContext(markdown)
        {
            StrictVariables = true,
            EnableRelaxedMemberAccess = false,
            MemberRenamer = m => m.Name,
            MemberFilter = Visible,
            TemplateLoader = null,
            LoopLimit = 500_000,
            RecursiveLimit = 50,
            RegexTimeOut = TimeSpan.FromSeconds(2),
            OutputLimit = MaxOutputChars,
            OnOutputLimit = ScriptLimitBehavior.Throw,
            CancellationToken = deadline.Token,
        };
        var globals = new ScriptObject { ["model"] = model };
        // `e` escapes a value for HTML (as `value | html.escape` does). Built in, because a memo calls it hundreds of times
        // and a function written in the template costs a scope per call; a template may still define its own.
        globals["e"] = EscapeFunction;
        // `cell value` makes a value safe inside a Markdown table cell (`|` escaped, line breaks as spaces): a memo of a
        // large frame calls it for every row, so it is built in too. A template may still define its own.
        globals["cell"] = CellFunction;
        context.PushGlobal(globals);
        try
        {
            return template.Render(context);
        }
        catch (ScriptRuntimeException ex)
        {
            throw new MemoTemplateException($"{templateName}: {ex.Message}", ex);
        }
        catch (OperationCanceledException ex)
        {
            throw new MemoTemplateException($"{templateName}: rendering took longer than {RenderTimeLimit.TotalSeconds:0} s and was stopped", ex);
        }
    }

    /// <summary><c>e value</c>: the value as text, escaped for HTML (what <c>value | html.escape</c> gives).</summary>
    private static readonly OneValueFunction EscapeFunction = new("e", text => Scriban.Functions.HtmlFunctions.Escape(text) ?? "");

    /// <summary><c>cell value</c>: the value as text with <c>|</c> escaped and line breaks as spaces, for a Markdown table cell.</summary>
    private static readonly OneValueFunction CellFunction =
        new("cell", text => (text ?? "").Replace("|", "\\|", StringComparison.Ordinal).Replace("\n", " ", StringComparison.Ordinal));

    /// <summary>A built-in template function of one value, which it formats as text.</summary>
    private sealed class OneValueFunction(string name, Func<string?, string> format) : IScriptCustomFunction
    {
        public int RequiredParameterCount => 1;
        public int ParameterCount => 1;
        public ScriptVarParamKind VarParamKind => ScriptVarParamKind.None;
        public Type ReturnType => typeof(string);
        public ScriptParameterInfo GetParameterInfo(int index) => new(typeof(object), "value");

        public object? Invoke(TemplateContext context, ScriptNode? callerContext, ScriptArray arguments, ScriptBlockStatement? blockStatement) =>
            arguments.Count == 1
                ? format(context.ObjectToString(arguments[0]))
                : throw new ScriptRuntimeException(callerContext?.Span ?? context.CurrentSpan, $"{name} takes one value, got {arguments.Count}");

        public ValueTask<object?> InvokeAsync(TemplateContext context, ScriptNode? callerContext, ScriptArray arguments, ScriptBlockStatement? blockStatement) =>
            new(Invoke(context, callerContext, arguments, blockStatement));
    }

    /// <summary>
    /// A context that keeps what it learns about a .NET type's visible properties for every later render: building
    /// that by reflection cost more than the rest of rendering a memo, and a batch renders hundreds. Safe to share
    /// because every context here uses the same <see cref="Visible"/> filter and member names.
    /// </summary>
    private sealed class SharedAccessorContext(bool markdown) : TemplateContext
    {
        private static readonly System.Collections.Concurrent.ConcurrentDictionary<Type, IObjectAccessor> Accessors = new();

        /// <summary>What a template writes from a value (not its own text): for Markdown, with raw HTML and links made inert.</summary>
        public override TemplateContext Write(Scriban.Parsing.SourceSpan span, object? textAsObject) =>
            markdown && textAsObject is string text ? base.Write(span, MarkdownText.Inert(text)) : base.Write(span, textAsObject);

        protected override IObjectAccessor GetMemberAccessorImpl(object target)
        {
            // Scriban itself keeps accessors per type (for one context); this keeps them for all.
            var type = target.GetType();
            if (Accessors.TryGetValue(type, out var known)) return known;
            var accessor = base.GetMemberAccessorImpl(target);
            if (accessor is not null) Accessors.TryAdd(type, accessor);
            return accessor!;
        }
    }

    /// <summary>Longest a memo may take to render (a shipped memo takes milliseconds).</summary>
    public static TimeSpan RenderTimeLimit { get; } = TimeSpan.FromSeconds(60);

    /// <summary>Largest memo a template may write, in characters (a shipped memo is a few hundred kilobytes).</summary>
    public const int MaxOutputChars = 64 * 1024 * 1024;

    /// <summary>Only properties (no indexers) declared by CrossCheck's own types: the report models and what they hold.</summary>
    private static bool Visible(MemberInfo member) =>
        member is PropertyInfo p && p.GetIndexParameters().Length == 0 && p.DeclaringType?.Assembly == typeof(MemoRenderer).Assembly;
}
