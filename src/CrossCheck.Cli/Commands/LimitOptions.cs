using System.CommandLine;
using CrossCheck.Import;

namespace CrossCheck.Cli.Commands;

/// <summary>
/// The options that set <see cref="InputLimits"/>: the commands that read submissions all take them, with the library's
/// defaults (the library's, unless the command has its own) as their defaults.
/// </summary>
internal sealed class LimitOptions
{
    private readonly InputLimits _defaults;
    private readonly Option<int> _maxPages;
    private readonly Option<double> _timeLimit;
    private readonly Option<int> _maxRows;
    private readonly Option<int> _maxMembers;
    private readonly Option<double> _maxFileMb;

    public LimitOptions(InputLimits? defaults = null)
    {
        _defaults = defaults ?? InputLimits.Default;
        var d = _defaults;
        _maxPages = new("--max-pages") { Description = "Read PDFs of at most this many pages.", DefaultValueFactory = _ => d.Pdf.MaxPages };
        _timeLimit = new("--time-limit")
        {
            Description = "Stop a review (reading included; in a screen, each submission's) after this many seconds.", DefaultValueFactory = _ => d.TimeBudget.TotalSeconds,
        };
        _maxRows = new("--max-rows") { Description = "Read tables of at most this many rows.", DefaultValueFactory = _ => d.MaxRows };
        _maxMembers = new("--max-members")
        {
            Description = "Analyse structures of at most this many members (and twice as many joints).", DefaultValueFactory = _ => d.MaxMembers,
        };
        _maxFileMb = new("--max-file-mb")
        {
            Description = "Read CSV files of at most this many megabytes (PDFs: five times as many).", DefaultValueFactory = _ => d.MaxFileBytes / (1024.0 * 1024),
        };
    }

    public void AddTo(Command command)
    {
        command.Add(_maxPages);
        command.Add(_timeLimit);
        command.Add(_maxRows);
        command.Add(_maxMembers);
        command.Add(_maxFileMb);
    }

    /// <summary>The limits asked for; null (after a message) when they make no sense.</summary>
    public InputLimits? Read(ParseResult pr, CliIo io)
    {
        int pages = pr.GetValue(_maxPages), rows = pr.GetValue(_maxRows), members = pr.GetValue(_maxMembers);
        double seconds = pr.GetValue(_timeLimit), megabytes = pr.GetValue(_maxFileMb);
        if (pages < 1 || !(seconds > 0) || seconds > 3600)
        {
            io.Error.WriteLine("crosscheck: --max-pages must be at least 1 and --time-limit between 0 and 3600 seconds.");
            return null;
        }
        if (rows < 1 || members < 1 || !(megabytes > 0) || megabytes > 2000)
        {
            io.Error.WriteLine("crosscheck: --max-rows and --max-members must be at least 1, and --max-file-mb between 0 and 2000.");
            return null;
        }
        long bytes = (long)(megabytes * 1024 * 1024);
        return _defaults with
        {
            MaxRows = rows,
            MaxMembers = members,
            MaxJoints = 2 * members,
            MaxFileBytes = bytes,
            TimeBudget = TimeSpan.FromSeconds(seconds),
            Pdf = _defaults.Pdf with
            {
                MaxPages = pages,
                TimeBudget = TimeSpan.FromSeconds(seconds),
                MaxFileBytes = Math.Max(_defaults.Pdf.MaxFileBytes * bytes / _defaults.MaxFileBytes, 1),
            },
        };
    }
}
