using System.Diagnostics.CodeAnalysis;
using CrossCheck.Model;

namespace CrossCheck.Import;

public enum ProblemSeverity
{
    /// <summary>The submission cannot be reviewed until this is fixed.</summary>
    Error,
    /// <summary>Worth a look (an ignored column, an unusual value); the review goes on.</summary>
    Warning,
}

/// <summary>Something wrong with the input, with the exact place it was found.</summary>
public sealed record InputProblem(SourceRef Where, string Message, ProblemSeverity Severity = ProblemSeverity.Error)
{
    public bool IsError => Severity == ProblemSeverity.Error;

    /// <summary><c>members.csv:7:I: I must be greater than zero (got "-3").</c></summary>
    public override string ToString() => $"{Where.Compact}: {Message}";
}

/// <summary>The submission read from its files, or the problems that stopped it being read.</summary>
public sealed record ImportResult(Submission? Submission, IReadOnlyList<InputProblem> Problems)
{
    [MemberNotNullWhen(true, nameof(Submission))]
    public bool Succeeded => Submission is not null && !Problems.Any(p => p.IsError);
    public IEnumerable<InputProblem> Errors => Problems.Where(p => p.IsError);
    public IEnumerable<InputProblem> Warnings => Problems.Where(p => !p.IsError);
}

/// <summary>Thrown by callers that want an exception instead of a problem list (see <see cref="ImportResult"/>).</summary>
public sealed class InputException : Exception
{
    public InputException() { }
    public InputException(string message) : base(message) { }
    public InputException(string message, Exception inner) : base(message, inner) { }

    public InputException(IReadOnlyList<InputProblem> problems)
        : base(string.Join(Environment.NewLine, problems.Select(p => p.ToString()))) => Problems = problems;

    public IReadOnlyList<InputProblem> Problems { get; } = [];
}
