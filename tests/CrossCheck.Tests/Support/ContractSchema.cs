using System.Text.Json;
using Json.Schema;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Holds JSON written by CrossCheck to the project's JSON Schemas in <c>docs/</c> (<c>review.schema.json</c> for the review
/// and input-error JSON, <c>solve.schema.json</c> for <c>solve</c>). The schemas are closed, so a field or code the code
/// writes but the contract does not document fails here.
/// </summary>
public static class ContractSchema
{
    private static readonly Lazy<JsonSchema> ReviewSchema = new(() => Load("review.schema.json"));
    private static readonly Lazy<JsonSchema> SolveSchema = new(() => Load("solve.schema.json"));

    public static string Docs => Path.Combine(RepoPaths.Root, "docs");

    /// <summary>What is wrong with <paramref name="json"/> as a review (or input-error) document; empty when it conforms.</summary>
    public static IReadOnlyList<string> ReviewErrors(string json) => Errors(ReviewSchema.Value, json);

    /// <summary>What is wrong with <paramref name="json"/> as a <c>solve</c> document; empty when it conforms.</summary>
    public static IReadOnlyList<string> SolveErrors(string json) => Errors(SolveSchema.Value, json);

    /// <summary>Fails, listing every violation, unless <paramref name="json"/> conforms to docs/review.schema.json.</summary>
    public static string ShouldMatchReviewSchema(this string json, string? what = null) => Check(ReviewErrors(json), json, what ?? "review JSON");

    /// <summary>Fails, listing every violation, unless <paramref name="json"/> conforms to docs/solve.schema.json.</summary>
    public static string ShouldMatchSolveSchema(this string json, string? what = null) => Check(SolveErrors(json), json, what ?? "solve JSON");

    private static string Check(IReadOnlyList<string> errors, string json, string what)
    {
        if (errors.Count > 0)
            throw new ShouldAssertException($"{what} does not conform to the schema in docs/:\n  {string.Join("\n  ", errors.Take(30))}\n--- the JSON:\n{Head(json)}");
        return json;
    }

    private static string Head(string s) => s.Length <= 4000 ? s : s[..4000] + "\n...";

    private static JsonSchema Load(string file) =>
        // A registry of its own per schema, so that building never collides with another schema of the same id.
        JsonSchema.FromText(File.ReadAllText(Path.Combine(Docs, file)), new BuildOptions { SchemaRegistry = new SchemaRegistry() });

    private static List<string> Errors(JsonSchema schema, string json)
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json);
        }
        catch (JsonException ex)
        {
            return [$"not JSON: {ex.Message}"];
        }
        using (doc)
        {
            var result = schema.Evaluate(doc.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
            if (result.IsValid) return [];
            var list = new List<string>();
            foreach (var d in result.Details ?? [])
                if (d.Errors is { Count: > 0 } errors)
                    foreach (var (keyword, message) in errors)
                        list.Add($"{d.InstanceLocation} ({d.EvaluationPath}, {keyword}): {message}");
            if (list.Count == 0) list.Add("invalid (no detail given)");
            return list;
        }
    }
}
