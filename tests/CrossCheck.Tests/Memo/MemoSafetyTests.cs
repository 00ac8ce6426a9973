using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Memo;

public class MemoSafetyTests
{
    private const string Hostile = "<script>alert(\"x\")</script> & 'q'";

    [Fact]
    public void HtmlMemo_EscapesEveryStringFromTheSubmission()
    {
        // Hostile text in every free-text field: info values, joint, member and case ids, an extra info key.
        string csv = $"""
            [info]
            key,value
            title,"{Hostile.Replace("\"", "\"\"")}"
            reference,"R&D <b>1</b>"
            revision,"<i>A</i>"
            prepared by,"Bobby <img src=x onerror=alert(1)>"
            checked by,"x""</td>"
            date,"<2026>"
            force unit,kN
            length unit,m
            "<style>body.x</style>","& <hr>"

            [joints]
            joint,x,y,restraint
            "<J&1>",0,0,fixed
            "J'2",6,0,roller

            [members]
            member,start,end,E [GPa],I [mm^4]
            "<script>m</script>","<J&1>",J'2,200,250e6

            [loads]
            case,on,kind,w
            "<c>",<script>m</script>,udl,18

            [end-moments]
            case,member,at,moment
            "<c>",<script>m</script>,"<J&1>",-70
            "<c>",<nope>,"<J&1>",1
            """;
        var r = TempSubmission.ReadText(csv);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var s = r.Submission!;
        var review = ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases), new ReviewOptions(Reviewer: "<b>me</b>"),
            r.Warnings.Select(w => w.ToString()));
        string html = MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Html), MemoFormat.Html);
        html.ShouldNotContain("<script>");
        html.ShouldNotContain("<img");
        html.ShouldNotContain("<b>");
        html.ShouldNotContain("<i>A");
        html.ShouldNotContain("<J&1>");
        html.ShouldNotContain("<hr>");
        html.ShouldNotContain("<style>body.x");
        html.ShouldNotContain("x\"</td>");
        html.ShouldContain("&lt;script&gt;");
        html.ShouldContain("R&amp;D &lt;b&gt;1&lt;/b&gt;");
        html.ShouldContain("&lt;J&amp;1&gt;");
        html.Split("<script", StringSplitOptions.None).Length.ShouldBe(1);
    }

    [Fact]
    public void Template_WithATypo_IsAnErrorNotABlank()
    {
        var model = MemoExtensions.Build(Reviewed(), MemoFormat.Markdown);
        Should.Throw<MemoTemplateException>(() => MemoRenderer.Render(model, "{{ model.Titel }}", "typo.sbn")).Message.ShouldContain("typo.sbn");
        Should.Throw<MemoTemplateException>(() => MemoRenderer.Render(model, "{{ nothing_here }}", "typo.sbn"));
        MemoRenderer.Render(model, "{{ model.Title }}", "fine.sbn").ShouldBe("Alder Mill footbridge - main deck girder");
    }

    [Fact]
    public void Template_CannotIncludeFiles()
    {
        var model = MemoExtensions.Build(Reviewed(), MemoFormat.Markdown);
        Should.Throw<MemoTemplateException>(() => MemoRenderer.Render(model, "{{ include '/etc/passwd' }}", "sneaky.sbn"));
    }

    [Theory]
    [InlineData("{{ object.eval_template \"{{ include '/etc/hostname' }}\" }}")] // no template loader, even from inside the language
    [InlineData("{{ model.Title.Length }}")]                                    // a .NET member of a string
    [InlineData("{{ model.Cases.Capacity }}")]                                  // a .NET member of a list
    [InlineData("{{ model.Cases[0].Rows.GetType }}")]                           // a .NET method
    [InlineData("{{ while true }}x{{ end }}")]                                  // loops are bounded
    [InlineData("{{ func f; ret f; end; f }}")]                                 // recursion is bounded
    public void Template_CannotReachFilesOrDotNet_OrRunWithoutBound(string template)
    {
        var model = MemoExtensions.Build(Reviewed(), MemoFormat.Markdown);
        Should.Throw<MemoTemplateException>(() => MemoRenderer.Render(model, template, "hostile.sbn")).Message.ShouldStartWith("hostile.sbn");
    }

    [Fact]
    public void Template_OutputIsBounded()
    {
        var model = MemoExtensions.Build(Reviewed(), MemoFormat.Markdown);
        string line = new('x', 1000);
        string template = "{{ for i in 1..100000 }}" + line + "{{ end }}"; // 100 MB of text
        Should.Throw<MemoTemplateException>(() => MemoRenderer.Render(model, template, "flood.sbn"));
    }

    [Fact]
    public void Template_SeesTheModelsOwnProperties()
    {
        var model = MemoExtensions.Build(Reviewed(), MemoFormat.Markdown);
        MemoRenderer.Render(model, "{{ model.Cases.size }} {{ model.Cases[0].Id }} {{ model.Title | string.size }}", "fine.sbn").ShouldBe("2 DL 40");
    }

    private static ReviewResult Reviewed()
    {
        var s = SubmissionReader.Read(CliRunner.Demo("footbridge.csv")).Submission!;
        return ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases));
    }
}
