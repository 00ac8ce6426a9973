using CrossCheck.Cli;
using CrossCheck.Import;
using CrossCheck.Tests.Support;
using static CrossCheck.Tests.Import.Documents.CalcSources;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// What is still not read is said with its page and line, never guessed: a header on two levels (one column per load
/// case under a group heading), a table drawn as a picture; and <c>crosscheck extract</c> says how it decided each
/// column's role and how sure it is.
/// </summary>
public class RefusalTests
{
    private static readonly string Loads = Table("Table 3: Loads (ULS-2)", ["On", "Kind", "w (kN/m)", "P (kN)", "a (m)"],
        ["AB", "udl", "18.0", "", ""], ["BC", "udl", "18.0", "", ""], ["AB", "point", "", "40.0", "3.00"]);

    [FactNeeding("chromium", "soffice")]
    public void HeaderOnTwoLevels_OneColumnPerLoadCase_IsRefusedAtItsPageAndLine()
    {
        string moments = "<p>Table 4: End moments</p><table><thead><tr><th>Member</th><th>At</th><th colspan=\"2\" style=\"text-align:center\">Moment (kN·m)</th></tr>"
            + "<tr><th></th><th></th><th>ULS-1</th><th>ULS-2</th></tr></thead><tbody>"
            + "<tr><td>AB</td><td>B</td><td class=\"n\">81.0</td><td class=\"n\">103.5</td></tr><tr><td>BC</td><td>B</td><td class=\"n\">-81.0</td><td class=\"n\">-103.5</td></tr></tbody></table>";
        string pdf = Producers.Chromium(Html(HtmlGeometry() + Loads + moments), "two-level");
        var r = SubmissionReader.Read(pdf);
        r.Succeeded.ShouldBeFalse();
        var refusal = r.Errors.First();
        refusal.Message.ShouldContain("a header on two levels: 'Moment (kN·m)' stands over the columns 'ULS-1', 'ULS-2'");
        r.Errors.ShouldNotContain(e => e.Where.Row != null && e.Where.Row != refusal.Where.Row, "the table is not read, so its cells add no errors of their own");
        refusal.Where.Page.ShouldBe(1);
        refusal.Where.Row.ShouldNotBeNull();
    }

    [FactNeeding("chromium", "soffice")]
    public void TableDrawnAsAPicture_IsNamedWithItsPageAndLines()
    {
        string png = Producers.Screenshot(Html(Table("", ["Member", "At", "Moment (kN·m)"], ["AB", "B", "103.5"], ["BC", "B", "-103.5"])), "moments-picture");
        string image = $"<p>Table 4: End moments (ULS-2), as computed:</p><img style=\"width: 110mm\" src=\"data:image/png;base64,{Convert.ToBase64String(File.ReadAllBytes(png))}\"><p>End of calculation.</p>";
        string pdf = Producers.Chromium(Html(HtmlGeometry() + Loads + image), "picture");
        var r = SubmissionReader.Read(pdf);
        var warning = r.Warnings.Single(w => w.Message.Contains("an image", StringComparison.Ordinal));
        warning.Message.ShouldMatch(@"an image between lines \d+ and \d+ was not read");
        warning.Where.Page.ShouldBe(1);
        r.Errors.ShouldContain(e => e.Message.Contains("no 'end-moments' table", StringComparison.Ordinal));
    }

    [FactNeeding("chromium", "soffice")]
    public void Extract_OfAWorkbook_SaysPerColumnHowItsRoleWasDecided_AndHowSure()
    {
        using var t = new TempSubmission();
        string xlsx = Producers.Spreadsheet(WorkbookTests.SheetPerTable(), "sheet-per-table", "xlsx");
        var (code, output, _) = CliRunner.Run("extract", xlsx, "--out", Path.Combine(t.Folder, "tables"));
        code.ShouldBe(ExitCodes.Concur);
        output.ShouldContain("loads: 3 rows, sheet 'Loads' rows 1-4");
        output.ShouldMatch(@"Conc\. load \(kN\) → P \[kN\] \(by its contents: 1 of 1 cells are numbers in a force unit \(kN\), \d+ %\)");
        output.ShouldMatch(@"Load type → kind \('Load type' is a synonym of 'kind', 95 %\)");
        output.ShouldMatch(@"Case → case \(by its name 'case', 100 %\)");
        File.ReadAllText(Path.Combine(t.Folder, "tables", "loads.csv")).ShouldContain("# read from sheet-per-table.xlsx sheet 'Loads' rows 2-4");
    }
}
