using System.Text.RegularExpressions;
using CrossCheck.Import.Pdf;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Robustness;

/// <summary>What a catalogue entry must produce (see <c>fixtures/bad/README.md</c>).</summary>
public enum BadOutcome
{
    /// <summary>The input cannot be read: input errors, exit code 2.</summary>
    InputError,
    /// <summary>Read, but the structure cannot be analysed (a mechanism, an analysis that fails its equilibrium check): exit code 2.</summary>
    NotAnalysable,
    /// <summary>Reviewed; the review carries a finding (a flag or an end-moment status) at the given place.</summary>
    Finding,
    /// <summary>Reviewed; a warning says what was wrong with the input.</summary>
    Warning,
}

/// <summary>One entry of <c>fixtures/bad/manifest.csv</c>.</summary>
/// <param name="Id">Unique name.</param>
/// <param name="Input">A path relative to <c>fixtures/bad</c>, or <c>generated:NAME</c> for a file <see cref="HostileInputs"/> makes.</param>
/// <param name="Outcome">What must happen.</param>
/// <param name="Where">The place, as <c>SourceRef.Compact</c> (<c>file:line:column</c>, <c>file.pdf:p1:7:x</c>); <c>{line:TEXT}</c> in a PDF's place is the line printing TEXT.</param>
/// <param name="Message">A fragment of the message; alternatives separated by <c>|</c>.</param>
/// <param name="Note">What the entry is about.</param>
public sealed record BadInput(string Id, string Input, BadOutcome Outcome, string Where, string Message, string Note)
{
    public override string ToString() => Id;

    public bool IsPdf => Input.EndsWith(".pdf", StringComparison.OrdinalIgnoreCase);

    public bool Generated => Input.StartsWith("generated:", StringComparison.Ordinal);

    public IEnumerable<string> Messages => Message.Split('|');

    /// <summary>The input as a path, generating it into <paramref name="scratch"/> when it is not committed.</summary>
    public string Path(string scratch) => Generated
        ? HostileInputs.Make(Input["generated:".Length..], scratch)
        : System.IO.Path.GetFullPath(System.IO.Path.Combine(BadInputCatalogue.Folder, Input));

    /// <summary>The expected place with any <c>{line:TEXT}</c> resolved against the PDF at <paramref name="path"/>.</summary>
    public string ResolvedWhere(string path) => Regex.Replace(Where, @"\{line:(?<text>[^}]*)\}", m =>
    {
        var doc = PdfTextReader.Read(path, System.IO.Path.GetFileName(path), PdfLimits.Default, [])
                  ?? throw new InvalidOperationException($"{Id}: the PDF could not be read to find '{m.Groups["text"].Value}'");
        return doc.Lines.First(l => l.Text.Contains(m.Groups["text"].Value, StringComparison.Ordinal)).Number.ToString(System.Globalization.CultureInfo.InvariantCulture);
    });
}

/// <summary>Reads the catalogue of bad submissions.</summary>
public static class BadInputCatalogue
{
    public static string Folder { get; } = Path.Combine(RepoPaths.Root, "fixtures", "bad");

    public static IReadOnlyList<BadInput> Entries { get; } = Load();

    public static BadInput Get(string id) => Entries.Single(e => e.Id == id);

    private static List<BadInput> Load() =>
        CsvRecords.Parse(File.ReadAllText(Path.Combine(Folder, "manifest.csv"))).Select(r => new BadInput(
            r["id"], r["input"],
            r["outcome"] switch
            {
                "input-error" => BadOutcome.InputError,
                "not-analysable" => BadOutcome.NotAnalysable,
                "finding" => BadOutcome.Finding,
                "warning" => BadOutcome.Warning,
                var o => throw new InvalidDataException($"manifest.csv: '{r["id"]}' has an unknown outcome '{o}'"),
            },
            r["where"], r["message"], r["note"])).ToList();
}
