using CrossCheck.Review;

namespace CrossCheck.Register;

/// <summary>One finding of a recorded review: a comment of the schedule with its stable id.</summary>
/// <param name="CommentId">The stable id, e.g. <c>EQ-DL-C</c>.</param>
/// <param name="Kind">The id's prefix: what kind of finding it is (<c>EM</c>, <c>EQ</c>, <c>SW</c>, ...).</param>
public sealed record RegisterFinding(string CommentId, string Kind, string Severity, string Case, string Where, string Text, string Source);

/// <summary>A reference in the register with its latest review.</summary>
public sealed record RegisterReference(string Reference, int Rounds, int Reviews, RegisterReview Latest);

/// <summary>A problem with the register itself (not a CrossCheck register, written by a newer version, locked too long, a server that cannot be reached or refuses the user, ...), as a sentence for the user that names no password.</summary>
public sealed class RegisterException : Exception
{
    public RegisterException() { }
    public RegisterException(string message) : base(message) { }
    public RegisterException(string message, Exception inner) : base(message, inner) { }
}
