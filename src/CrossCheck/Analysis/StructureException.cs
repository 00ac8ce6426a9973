namespace CrossCheck.Analysis;

/// <summary>
/// The structure cannot be analysed as given: a mechanism (whatever the loads), a loose part, a disconnected joint,
/// a couple on a joint that cannot carry moment, or support movements that contradict axially rigid members. The message names
/// the joint and direction involved; it is meant for the reviewer, not a stack trace.
/// </summary>
public sealed class StructureException : Exception
{
    public StructureException() { }
    public StructureException(string message) : base(message) { }
    public StructureException(string message, Exception inner) : base(message, inner) { }

    public StructureException(string message, string? joint, string? direction) : base(message)
    {
        Joint = joint;
        Direction = direction;
    }

    public StructureException(string message, string? joint, string? direction, Exception inner) : base(message, inner)
    {
        Joint = joint;
        Direction = direction;
    }

    /// <summary>The joint that is free to move, when one can be named.</summary>
    public string? Joint { get; }

    /// <summary><c>x</c>, <c>y</c> or <c>rotation</c>, when known.</summary>
    public string? Direction { get; }
}
