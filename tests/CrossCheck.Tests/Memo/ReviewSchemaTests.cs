using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CrossCheck.Cli;
using CrossCheck.Review;
using CrossCheck.Tests.Robustness;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Memo;

/// <summary>
/// The JSON contract of docs/REVIEW-JSON.md, held by docs/review.schema.json (and docs/solve.schema.json): every
/// submission the repository holds — demos, PDF fixtures, the fuzzing starting point (two-bay shelter) and every entry of the bad-input catalogue —
/// reviewed with <c>--format json</c> gives a document that conforms; the schema refuses documents that break the
/// contract; and its enumerations are exactly the words and codes the code writes.
/// </summary>
public class ReviewSchemaTests
{
    private static string Root => RepoPaths.Root;

    /// <summary>Every committed submission (and every catalogue entry, generated ones included), by a readable key.</summary>
    public static TheoryData<string> Inputs()
    {
        var data = new TheoryData<string>();
        foreach (var key in GoodInputs()) data.Add(key);
        foreach (var e in BadInputCatalogue.Entries) data.Add("bad:" + e.Id);
        return data;
    }

    public static TheoryData<string> Submissions()
    {
        var data = new TheoryData<string>();
        foreach (var key in GoodInputs().Where(k => !k.StartsWith("pdf-error:", StringComparison.Ordinal))) data.Add(key);
        return data;
    }

    private static IEnumerable<string> GoodInputs()
    {
        string demo = Path.Combine(Root, "fixtures", "demo");
        foreach (var p in Directory.EnumerateFileSystemEntries(demo).Order(StringComparer.Ordinal))
        {
            string name = Path.GetFileName(p);
            bool submission = Directory.Exists(p) || (name.EndsWith(".pdf", StringComparison.Ordinal))
                              || (name.EndsWith(".csv", StringComparison.Ordinal) && !name.EndsWith(".expected.csv", StringComparison.Ordinal));
            if (submission) yield return "demo:" + name;
        }
        foreach (var p in Directory.EnumerateFiles(Path.Combine(Root, "fixtures", "pdf"), "*.pdf").Order(StringComparer.Ordinal))
            yield return "pdf:" + Path.GetFileName(p);
        foreach (var p in Directory.EnumerateFiles(Path.Combine(Root, "fixtures", "pdf", "errors"), "*.pdf").Order(StringComparer.Ordinal))
            yield return "pdf-error:" + Path.GetFileName(p);
        yield return "fuzz:two-bay-shelter.csv";
    }

    private static string PathOf(string key, string scratch)
    {
        int colon = key.IndexOf(':', StringComparison.Ordinal);
        string kind = key[..colon], name = key[(colon + 1)..];
        return kind switch
        {
            "demo" => Path.Combine(Root, "fixtures", "demo", name),
            "pdf" => Path.Combine(Root, "fixtures", "pdf", name),
            "pdf-error" => Path.Combine(Root, "fixtures", "pdf", "errors", name),
            "fuzz" => Path.Combine(Root, "tests", "CrossCheck.Tests", "Robustness", "Samples", name),
            "bad" => BadInputCatalogue.Get(name).Path(scratch),
            _ => throw new ArgumentException(key),
        };
    }

    [Fact]
    public void TheInputsCoverTheDemosTheFixturesAndTheCatalogue()
    {
        var keys = GoodInputs().ToList();
        keys.Count(k => k.StartsWith("demo:", StringComparison.Ordinal)).ShouldBe(8); // four demos, each as CSV and as PDF
        keys.Count(k => k.StartsWith("pdf:", StringComparison.Ordinal)).ShouldBeGreaterThanOrEqualTo(5);
        keys.Count(k => k.StartsWith("pdf-error:", StringComparison.Ordinal)).ShouldBeGreaterThanOrEqualTo(3);
    }

    [Theory]
    [MemberData(nameof(Inputs))]
    public void ReviewJson_OfEverySubmissionInTheRepository_ConformsToTheSchema(string key)
    {
        using var t = new TempSubmission();
        var r = CliRunner.Run("review", PathOf(key, t.Folder), "--format", "json", "--date", "2026-12-01", "--reviewer", "A. Checker");
        r.ExitCode.ShouldBeOneOf(ExitCodes.Concur, ExitCodes.Comments, ExitCodes.InputError);
        r.Out.ShouldMatchReviewSchema(key);
        // The exit code and the document agree: 2 has the input-error shape (verdict null), 0 and 1 a review whose verdict matches.
        using var doc = JsonDocument.Parse(r.Out);
        var verdict = doc.RootElement.GetProperty("verdict");
        if (r.ExitCode == ExitCodes.InputError)
        {
            verdict.ValueKind.ShouldBe(JsonValueKind.Null, r.Err);
            doc.RootElement.GetProperty("inputErrors").GetArrayLength().ShouldBeGreaterThan(0);
        }
        else if (r.ExitCode == ExitCodes.Concur)
        {
            verdict.GetString().ShouldBe("concur");
        }
        else
        {
            verdict.GetString().ShouldBeOneOf("concur-with-comments", "revise");
        }
    }

    [Theory]
    [MemberData(nameof(Submissions))]
    public void SolveJson_OfEverySubmissionInTheRepository_ConformsToTheSchema(string key)
    {
        using var t = new TempSubmission();
        var r = CliRunner.Run("solve", PathOf(key, t.Folder), "--format", "json");
        r.ExitCode.ShouldBe(ExitCodes.Concur, r.Err);
        r.Out.ShouldMatchSolveSchema(key);
    }

    [Fact]
    public void RegisterObject_OfASecondRound_ConformsToTheSchema()
    {
        using var t = new TempSubmission();
        string db = Path.Combine(t.Folder, "reg.db");
        string calc = t.Write("calc.csv", File.ReadAllText(CliRunner.Demo("footbridge.csv")));
        var first = CliRunner.Run("review", calc, "--format", "json", "--register", db, "--date", "2026-12-01");
        first.Out.ShouldMatchReviewSchema("first round");
        // The author corrects the copying slip of case DL (141.7 → 114.7): a second round with closed and persisting comments.
        File.WriteAllText(calc, File.ReadAllText(calc).Replace("141.7", "114.7", StringComparison.Ordinal));
        var second = CliRunner.Run("review", calc, "--format", "json", "--register", db, "--date", "2026-12-08");
        second.Out.ShouldMatchReviewSchema("second round");
        var register = JsonNode.Parse(second.Out)!["register"]!;
        register["round"]!.GetValue<int>().ShouldBe(2);
        register["previousRound"]!.GetValue<int>().ShouldBe(1);
        register["closed"]!.AsArray().Count.ShouldBeGreaterThan(0);
    }

    // ---- the schema can fail: documents that break the contract are refused ----------------------------------------

    private static readonly Lazy<string> Footbridge = new(() =>
        CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--format", "json", "--date", "2026-12-01").Out.ShouldMatchReviewSchema());

    private static string Altered(Action<JsonNode> change)
    {
        var node = JsonNode.Parse(Footbridge.Value)!;
        change(node);
        return node.ToJsonString();
    }

    private static JsonNode FirstCause(JsonNode doc) =>
        doc["cases"]!.AsArray().Select(c => c!["causes"]!.AsArray()).First(a => a.Count > 0)[0]!;

    [Fact]
    public void UnknownCauseCode_IsRefused()
    {
        string json = Altered(d => FirstCause(d)["code"] = "moon-phase");
        var errors = ContractSchema.ReviewErrors(json);
        errors.ShouldNotBeEmpty();
        errors.ShouldContain(e => e.Contains("/causes/0/code", StringComparison.Ordinal), string.Join("\n", errors));
        Should.Throw<ShouldAssertException>(() => json.ShouldMatchReviewSchema());
    }

    [Theory]
    [InlineData("an undocumented field at the top", "/extra")]
    [InlineData("an undocumented field in a flag", "/flags/0/extra")]
    [InlineData("an unknown flag kind", "/flags/0/kind")]
    [InlineData("an unknown status", "/endMoments/0/status")]
    [InlineData("an unknown verdict", "/verdict")]
    [InlineData("a comment id of no known form", "/comments/0/id")]
    [InlineData("a missing field", "/cases/0")]
    [InlineData("a number written as text", "/peakMoment")]
    public void DocumentsThatBreakTheContract_AreRefused(string what, string where)
    {
        string json = Altered(d =>
        {
            var c0 = d["cases"]![0]!;
            switch (what)
            {
                case "an undocumented field at the top": d["extra"] = 1; break;
                case "an undocumented field in a flag": c0["flags"]![0]!["extra"] = "x"; break;
                case "an unknown flag kind": c0["flags"]![0]!["kind"] = "beauty"; break;
                case "an unknown status": c0["endMoments"]![0]!["status"] = "close-enough"; break;
                case "an unknown verdict": d["verdict"] = "maybe"; break;
                case "a comment id of no known form": d["comments"]![0]!["id"] = "comment 1"; break;
                case "a missing field": c0.AsObject().Remove("causes"); break;
                case "a number written as text": c0["peakMoment"] = "114.7"; break;
            }
        });
        var errors = ContractSchema.ReviewErrors(json);
        errors.ShouldNotBeEmpty(what);
        errors.ShouldContain(e => e.Contains(where, StringComparison.Ordinal), $"{what}:\n{string.Join("\n", errors)}");
    }

    [Fact]
    public void InputErrorDocument_HasItsOwnClosedShape()
    {
        using var t = new TempSubmission();
        string path = t.Write("bad.csv", SampleText.With(frame: SampleText.Frame.Replace("AB,A,B,200,250e6", "AB,A,B,200,-1", StringComparison.Ordinal)));
        var r = CliRunner.Run("review", path, "--format", "json");
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Out.ShouldMatchReviewSchema();
        var node = JsonNode.Parse(r.Out)!;
        node["cases"]!.AsArray().Add(new JsonObject());
        ContractSchema.ReviewErrors(node.ToJsonString()).ShouldNotBeEmpty("an input-error document has no cases");
        var empty = JsonNode.Parse(r.Out)!;
        empty["inputErrors"] = new JsonArray();
        ContractSchema.ReviewErrors(empty.ToJsonString()).ShouldNotBeEmpty("an input-error document names at least one error");
        var verdict = JsonNode.Parse(r.Out)!;
        verdict["verdict"] = "concur";
        ContractSchema.ReviewErrors(verdict.ToJsonString()).ShouldNotBeEmpty("a verdict needs the whole review");
    }

    [Fact]
    public void ExamplesInTheContract_ConformToTheSchema()
    {
        // The JSON examples of docs/REVIEW-JSON.md (a review, an input error) are held to the schema too.
        string doc = File.ReadAllText(Path.Combine(ContractSchema.Docs, "REVIEW-JSON.md"));
        var examples = Regex.Matches(doc, "```json\n(?<json>.*?)\n```", RegexOptions.Singleline).Select(m => m.Groups["json"].Value).ToList();
        examples.Count.ShouldBe(2);
        foreach (var example in examples) example.ShouldMatchReviewSchema("an example of docs/REVIEW-JSON.md");
    }

    // ---- the schema's enumerations are the code's words --------------------------------------------------------------

    private static readonly Lazy<JsonDocument> Schema = new(() => JsonDocument.Parse(File.ReadAllText(Path.Combine(ContractSchema.Docs, "review.schema.json"))));

    private static string[] Enum(string def) =>
        [.. Schema.Value.RootElement.GetProperty("$defs").GetProperty(def).GetProperty("enum").EnumerateArray().Select(e => e.GetString()!).Order(StringComparer.Ordinal)];

    private static string[] Sorted(IEnumerable<string> words) => [.. words.Distinct().Order(StringComparer.Ordinal)];

    [Fact]
    public void SchemaEnumerations_AreExactlyTheWordsTheCodeWrites()
    {
        Enum("flagKind").ShouldBe(Sorted(System.Enum.GetValues<FlagKind>().Select(k => k.Json())));
        Enum("endStatus").ShouldBe(Sorted(System.Enum.GetValues<EndStatus>().Select(s => s.Json())));
        Enum("severity").ShouldBe(Sorted(System.Enum.GetValues<Severity>().Select(s => s.Json())));
        Enum("verdict").ShouldBe(Sorted(System.Enum.GetValues<Verdict>().Select(v => v.Json())));
    }

    [Fact]
    public void CauseCodes_InTheSchemaAndTheDocs_AreExactlyTheCodesTheDiagnosisCanGive()
    {
        // The diagnosis's codes are a closed enumeration with one table of words (ReviewTerms): every member must be in the
        // schema and documented, so that a new code that is not documented fails here rather than in a reader's script.
        var codes = ReviewTerms.AllCauses.Select(t => t.Code);
        var fromCode = Sorted(codes);
        fromCode.Length.ShouldBeGreaterThanOrEqualTo(14);
        Enum("causeCode").ShouldBe(fromCode);
        string doc = File.ReadAllText(Path.Combine(ContractSchema.Docs, "REVIEW-JSON.md"));
        foreach (var code in fromCode) doc.ShouldContain($"| `{code}` |", Case.Sensitive, $"docs/REVIEW-JSON.md documents the cause code {code}");
        foreach (var kind in Enum("flagKind")) doc.ShouldContain($"| `{kind}` |", Case.Sensitive, $"docs/REVIEW-JSON.md documents the flag kind {kind}");
        foreach (var status in Enum("endStatus")) doc.ShouldContain($"| `{status}` |", Case.Sensitive, $"docs/REVIEW-JSON.md documents the status {status}");
    }
}
