using Mono.Cecil;

namespace CrossCheck.Tests.Architecture;

/// <summary>One layer: the namespaces in it and the layers it may name.</summary>
public sealed record Layer(string Name, string[] Namespaces, string[] MayUse);

/// <summary>A type that names a type of a layer it may not use.</summary>
public sealed record Violation(string From, string FromLayer, string To, string ToLayer)
{
    public override string ToString() => $"{From} ({FromLayer}) → {To} ({ToLayer})";
}

/// <summary>
/// The layers of CrossCheck, from the floor up, and a check over compiled code: every type reference in signatures,
/// attributes, fields, locals and method bodies (IL: calls, object creation, field access, casts, <c>typeof</c>,
/// catch clauses), including those in lambdas, iterators and async state machines (nested types count as their
/// outermost type), must point to the type's own layer or to one it may use.
/// </summary>
public static class Layers
{
    /// <summary>Floor first. A layer may use the layers it lists; nothing may use a layer above it.</summary>
    public static IReadOnlyList<Layer> CrossCheck { get; } =
    [
        new("Common", ["CrossCheck.Common"], []),
        new("Model", ["CrossCheck.Model"], ["Common"]),
        new("Import", ["CrossCheck.Import"], ["Common", "Model"]),
        new("Analysis", ["CrossCheck.Analysis"], ["Common", "Model"]),
        new("Review", ["CrossCheck.Review"], ["Common", "Model", "Import", "Analysis"]),
        new("Memo", ["CrossCheck.Memo"], ["Common", "Model", "Import", "Analysis", "Review"]),
        new("Register", ["CrossCheck.Register"], ["Common", "Model", "Import", "Analysis", "Review"]),
        new("Jobs", ["CrossCheck.Jobs"], ["Common", "Model", "Import", "Analysis", "Review", "Memo", "Register"]),
        new("Screening", ["CrossCheck.Screening"], ["Common", "Model", "Import", "Analysis", "Review", "Memo", "Register", "Jobs"]),
        new("Cli", ["CrossCheck.Cli"], ["Common", "Model", "Import", "Analysis", "Review", "Memo", "Register", "Jobs", "Screening"]),
    ];

    /// <summary>The layer of a namespace (a namespace inside one of the layer's, too), or null when it is not one of ours.</summary>
    public static Layer? Of(string ns, IReadOnlyList<Layer> layers) =>
        layers.FirstOrDefault(l => l.Namespaces.Any(p => ns == p || ns.StartsWith(p + ".", StringComparison.Ordinal)));

    /// <summary>Every reference from a type of <paramref name="module"/> to a type of a layer its own layer may not use.</summary>
    public static IReadOnlyList<Violation> Check(ModuleDefinition module, IReadOnlyList<Layer> layers) =>
        References(module)
            .Select(r => (r.From, r.To, FromLayer: Of(r.From.Namespace, layers), ToLayer: Of(r.To.Namespace, layers)))
            .Where(r => r.FromLayer is not null && r.ToLayer is not null && r.FromLayer != r.ToLayer && !r.FromLayer.MayUse.Contains(r.ToLayer.Name))
            .Select(r => new Violation(r.From.FullName, r.FromLayer!.Name, r.To.FullName, r.ToLayer!.Name))
            .Distinct()
            .OrderBy(v => v.From, StringComparer.Ordinal).ThenBy(v => v.To, StringComparer.Ordinal)
            .ToList();

    /// <summary>The namespaces of <paramref name="module"/> that start with <paramref name="root"/> and belong to no layer.</summary>
    public static IReadOnlyList<string> Unplaced(ModuleDefinition module, IReadOnlyList<Layer> layers, string root = "CrossCheck") =>
        module.Types.Select(t => t.Namespace)
            .Where(ns => (ns == root || ns.StartsWith(root + ".", StringComparison.Ordinal)) && Of(ns, layers) is null)
            .Distinct().Order(StringComparer.Ordinal).ToList();

    /// <summary>
    /// Every (outermost type, referenced outermost type) pair of the module, each once, references to the type itself left out.
    /// </summary>
    public static IEnumerable<(TypeReference From, TypeReference To)> References(ModuleDefinition module)
    {
        foreach (var type in module.GetTypes())
        {
            var from = Outermost(type);
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (var to in Named(type))
            {
                var outer = Outermost(to);
                if (outer.FullName != from.FullName && seen.Add(outer.FullName)) yield return (from, outer);
            }
        }
    }

    /// <summary>A nested type stands for the type it is declared in (closures, iterators and state machines included).</summary>
    private static TypeReference Outermost(TypeReference t)
    {
        while (t.DeclaringType is not null) t = t.DeclaringType;
        return t;
    }

    /// <summary>Every type <paramref name="type"/> names, unwrapped from arrays, pointers, references and generic arguments.</summary>
    private static IEnumerable<TypeReference> Named(TypeDefinition type)
    {
        var found = new List<TypeReference>();
        void Add(TypeReference? t)
        {
            switch (t)
            {
                case null or GenericParameter:
                    return;
                case GenericInstanceType g:
                    Add(g.ElementType);
                    foreach (var a in g.GenericArguments) Add(a);
                    return;
                case IModifierType m:
                    Add(m.ModifierType);
                    Add(m.ElementType);
                    return;
                case FunctionPointerType f:
                    Add(f.ReturnType);
                    foreach (var p in f.Parameters) Add(p.ParameterType);
                    return;
                case TypeSpecification s:
                    Add(s.ElementType);
                    return;
                default:
                    found.Add(t);
                    return;
            }
        }
        void Attributes(ICustomAttributeProvider p)
        {
            if (!p.HasCustomAttributes) return;
            foreach (var a in p.CustomAttributes)
            {
                Add(a.AttributeType);
                foreach (var arg in a.ConstructorArguments.Concat(a.Fields.Select(f => f.Argument)).Concat(a.Properties.Select(x => x.Argument)))
                    if (arg.Value is TypeReference typeOf) Add(typeOf);
            }
        }
        void Method(MethodReference m)
        {
            Add(m.DeclaringType);
            Add(m.ReturnType);
            foreach (var p in m.Parameters) Add(p.ParameterType);
            if (m is GenericInstanceMethod gm) foreach (var a in gm.GenericArguments) Add(a);
        }
        void Constraints(IGenericParameterProvider p)
        {
            foreach (var g in p.GenericParameters)
                foreach (var c in g.Constraints) Add(c.ConstraintType);
        }

        Add(type.BaseType);
        foreach (var i in type.Interfaces) Add(i.InterfaceType);
        Attributes(type);
        Constraints(type);
        foreach (var f in type.Fields) { Add(f.FieldType); Attributes(f); }
        foreach (var p in type.Properties) { Add(p.PropertyType); Attributes(p); }
        foreach (var e in type.Events) { Add(e.EventType); Attributes(e); }
        foreach (var m in type.Methods)
        {
            Method(m);
            Attributes(m);
            Attributes(m.MethodReturnType);
            foreach (var p in m.Parameters) Attributes(p);
            Constraints(m);
            if (!m.HasBody) continue;
            foreach (var v in m.Body.Variables) Add(v.VariableType);
            foreach (var h in m.Body.ExceptionHandlers) Add(h.CatchType);
            foreach (var ins in m.Body.Instructions)
            {
                switch (ins.Operand)
                {
                    case TypeReference t: Add(t); break;
                    case MethodReference mr: Method(mr); break;
                    case FieldReference fr: Add(fr.DeclaringType); Add(fr.FieldType); break;
                    case CallSite cs:
                        Add(cs.ReturnType);
                        foreach (var p in cs.Parameters) Add(p.ParameterType);
                        break;
                }
            }
        }
        return found;
    }
}
