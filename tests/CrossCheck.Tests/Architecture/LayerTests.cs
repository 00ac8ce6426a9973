using Mono.Cecil;
using Mono.Cecil.Cil;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Architecture;

/// <summary>
/// The dependency rule: Common ← Model ← (Import, Analysis) ← Review ← (Memo, Register) ← Jobs ← Screening ← CLI. A
/// lower layer never names a higher one, and layers side by side never name each other (see <see cref="Layers"/>).
/// Checked on the compiled code, method bodies included.
/// </summary>
public class LayerTests(ITestOutputHelper output)
{
    private static readonly System.Reflection.Assembly Core = typeof(global::CrossCheck.Common.Fmt).Assembly;
    private static readonly System.Reflection.Assembly Cli = typeof(global::CrossCheck.Cli.App).Assembly;

    private static ModuleDefinition Read(System.Reflection.Assembly a) => ModuleDefinition.ReadModule(a.Location);

    public static string Describe(IReadOnlyList<Violation> violations) =>
        $"{violations.Count} reference(s) against the layers (type (layer) → type it names (layer)):\n" +
        string.Join("\n", violations.Select(v => "  " + v));

    private void Expect(IReadOnlyList<Violation> violations)
    {
        if (violations.Count == 0) return;
        output.WriteLine(Describe(violations));
        Assert.Fail(Describe(violations));
    }

    [Fact]
    public void Core_NoLayerNamesOneAboveIt_OrOneBesideIt()
    {
        using var module = Read(Core);
        Expect(Layers.Check(module, Layers.CrossCheck));
    }

    [Fact]
    public void Cli_IsTheRoof_AndTheLibraryDoesNotReferenceIt()
    {
        using var module = Read(Cli);
        Expect(Layers.Check(module, Layers.CrossCheck));
        using var core = Read(Core);
        core.AssemblyReferences.Select(r => r.Name).ShouldNotContain(Cli.GetName().Name);
    }

    [Fact]
    public void EveryNamespace_BelongsToALayer()
    {
        using var core = Read(Core);
        using var cli = Read(Cli);
        Layers.Unplaced(core, Layers.CrossCheck).ShouldBeEmpty("a new namespace needs its place in Layers.CrossCheck");
        Layers.Unplaced(cli, Layers.CrossCheck).ShouldBeEmpty("a new namespace needs its place in Layers.CrossCheck");
        // The library holds no CLI code, and the CLI no library code.
        core.Types.Select(t => t.Namespace).ShouldNotContain(ns => ns.StartsWith("CrossCheck.Cli", StringComparison.Ordinal));
        cli.Types.Select(t => t.Namespace).ShouldAllBe(ns => ns.Length == 0 || ns.StartsWith("CrossCheck.Cli", StringComparison.Ordinal));
    }

    [Fact]
    public void Memo_FormatsWhatItIsGiven_AndRunsNoAnalysis()
    {
        // Evaluating given results (MemberResult.MomentAt, ...) is formatting; solving, distributing or reviewing is not.
        string[] analyses =
        [
            "CrossCheck.Analysis.FrameSolver", "CrossCheck.Analysis.MomentDistribution", "CrossCheck.Analysis.ILinearSolver",
            "CrossCheck.Analysis.Kinematics", "CrossCheck.Review.ReviewEngine", "CrossCheck.Review.ClaimChecks",
            "CrossCheck.Review.Diagnosis.Diagnoser", "CrossCheck.Review.Diagnosis.WorkingTableAudit", "CrossCheck.Import.SubmissionReader",
        ];
        using var module = Read(Core);
        var runs = Layers.References(module)
            .Where(r => Layers.Of(r.From.Namespace, Layers.CrossCheck)?.Name == "Memo" && analyses.Contains(r.To.FullName))
            .Select(r => $"{r.From.FullName} → {r.To.FullName}").Distinct().Order(StringComparer.Ordinal).ToList();
        runs.ShouldBeEmpty();
    }

    [Fact]
    public void Check_FindsABackReference_InAMethodBodyAndInAClosure_OfAPlantedAssembly()
    {
        // The rule run on a small assembly made here: a Model type whose method body creates a Review type, and a
        // closure class nested in it that takes typeof(a Review type); a Review type naming a Model type is allowed.
        using var planted = PlantedAssembly();
        var violations = Layers.Check(planted.MainModule, Layers.CrossCheck);
        output.WriteLine(Describe(violations));
        Describe(violations).ShouldBe("""
            2 reference(s) against the layers (type (layer) → type it names (layer)):
              CrossCheck.Model.Beam (Model) → CrossCheck.Review.Verdicts (Review)
              CrossCheck.Model.Span (Model) → CrossCheck.Review.Finding (Review)
            """.ReplaceLineEndings("\n"));
    }

    [Fact]
    public void Check_AcceptsTheSameAssemblyWithoutTheBackReferences()
    {
        using var planted = PlantedAssembly(plant: false);
        Layers.Check(planted.MainModule, Layers.CrossCheck).ShouldBeEmpty();
        Layers.References(planted.MainModule).Select(r => (r.From.FullName, r.To.FullName))
            .ShouldContain(("CrossCheck.Review.Verdicts", "CrossCheck.Model.Beam"));
    }

    private static AssemblyDefinition PlantedAssembly(bool plant = true)
    {
        var assembly = AssemblyDefinition.CreateAssembly(new AssemblyNameDefinition("Planted", new Version(1, 0)), "Planted", ModuleKind.Dll);
        var m = assembly.MainModule;
        var objectCtor = m.ImportReference(typeof(object).GetConstructor(System.Type.EmptyTypes)!);
        TypeDefinition NewType(string ns, string name)
        {
            var t = new TypeDefinition(ns, name, TypeAttributes.Public | TypeAttributes.Class, m.TypeSystem.Object);
            var ctor = new MethodDefinition(".ctor", MethodAttributes.Public | MethodAttributes.HideBySig | MethodAttributes.SpecialName | MethodAttributes.RTSpecialName,
                m.TypeSystem.Void);
            var il = ctor.Body.GetILProcessor();
            il.Emit(OpCodes.Ldarg_0);
            il.Emit(OpCodes.Call, objectCtor);
            il.Emit(OpCodes.Ret);
            t.Methods.Add(ctor);
            m.Types.Add(t);
            return t;
        }
        MethodDefinition Method(TypeDefinition owner, Action<ILProcessor> body)
        {
            var method = new MethodDefinition("Run", MethodAttributes.Public | MethodAttributes.Static | MethodAttributes.HideBySig, m.TypeSystem.Void);
            var il = method.Body.GetILProcessor();
            body(il);
            il.Emit(OpCodes.Ret);
            owner.Methods.Add(method);
            return method;
        }

        var beam = NewType("CrossCheck.Model", "Beam");
        var span = NewType("CrossCheck.Model", "Span");
        var verdicts = NewType("CrossCheck.Review", "Verdicts");
        var finding = NewType("CrossCheck.Review", "Finding");
        NewType("CrossCheck.Common", "Text");
        // Allowed: Review names Model in a method body.
        Method(verdicts, il => { il.Emit(OpCodes.Newobj, beam.Methods[0]); il.Emit(OpCodes.Pop); });
        if (!plant) return assembly;

        // Planted 1: a Model type's method body creates a Review object (nothing in its signature says so).
        Method(beam, il => { il.Emit(OpCodes.Newobj, verdicts.Methods[0]); il.Emit(OpCodes.Pop); });
        // Planted 2: a closure class nested in a Model type takes typeof(a Review type).
        var closure = new TypeDefinition("", "<>c", TypeAttributes.NestedPrivate | TypeAttributes.Class, m.TypeSystem.Object);
        span.NestedTypes.Add(closure);
        Method(closure, il => { il.Emit(OpCodes.Ldtoken, finding); il.Emit(OpCodes.Pop); });
        return assembly;
    }
}
