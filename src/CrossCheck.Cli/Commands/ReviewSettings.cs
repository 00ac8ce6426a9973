using System.CommandLine;
using System.Globalization;
using CrossCheck.Review;

namespace CrossCheck.Cli.Commands;

/// <summary>The options every reviewing command shares: reviewer, date and the three tolerances.</summary>
internal sealed class ReviewSettings
{
    private readonly Option<string?> _reviewer = new("--reviewer") { Description = "Name of the checking engineer, printed in the memo." };
    private readonly Option<string?> _date = new("--date") { Description = "Review date (yyyy-mm-dd); default today." };
    private readonly Option<double> _relative = new("--tolerance") { Description = "Agreement band as a fraction of the case's peak moment.", DefaultValueFactory = _ => 0.01 };
    private readonly Option<double> _absolute = new("--abs-tolerance") { Description = "Agreement floor in the submission's moment unit.", DefaultValueFactory = _ => 0.1 };
    private readonly Option<double> _minor = new("--minor-tolerance") { Description = "Differences up to this fraction of the peak are minor; beyond, discrepant.", DefaultValueFactory = _ => 0.05 };

    public void AddTo(Command command)
    {
        command.Add(_reviewer);
        command.Add(_date);
        command.Add(_relative);
        command.Add(_absolute);
        command.Add(_minor);
    }

    /// <summary>The review options, or null after printing what is wrong with them.</summary>
    public ReviewOptions? Read(ParseResult pr, CliIo io)
    {
        double rel = pr.GetValue(_relative), abs = pr.GetValue(_absolute), minor = pr.GetValue(_minor);
        if (!(rel >= 0) || !(abs >= 0) || !(minor >= rel))
        {
            io.Error.WriteLine("crosscheck: tolerances must be non-negative and --minor-tolerance must not be below --tolerance.");
            return null;
        }
        DateOnly? date = null;
        if (pr.GetValue(_date) is { } text)
        {
            if (!DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d))
            {
                io.Error.WriteLine($"crosscheck: --date '{text}' is not a date of the form yyyy-mm-dd.");
                return null;
            }
            date = d;
        }
        string? reviewer = pr.GetValue(_reviewer) is { } name ? Common.TextSafety.Clean(name) : null;
        return new ReviewOptions(abs, rel, minor, reviewer, date);
    }
}
