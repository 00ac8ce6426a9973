using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary>What a kind of load may act on.</summary>
internal enum LoadTarget
{
    Member,
    Joint,
    /// <summary>A member or a joint, whichever the id names (an id naming both is ambiguous).</summary>
    MemberOrJoint,
}

/// <summary>
/// A kind of load of the <c>loads</c> table: the words of the <c>kind</c> column that name it, what it may act on,
/// whether it has a direction, and how a row of it is read into a model <see cref="Load"/> (its columns, their
/// checks, the load built). Every kind is registered in <see cref="LoadKinds.All"/>; the table's reader does the
/// rest (case, target, direction).
/// </summary>
internal abstract class LoadKind
{
    /// <summary>The words that name the kind, normalised (<see cref="TableSchema.Normalize"/>); messages list the first.</summary>
    public abstract IReadOnlyList<string> Words { get; }

    public abstract LoadTarget Target { get; }

    /// <summary>False for a kind the <c>dir</c> column means nothing to (a direction given is warned about and ignored).</summary>
    public virtual bool HasDirection => true;

    /// <summary>
    /// The number columns a row of this kind reads (of <c>P</c>, <c>w</c>, <c>w end</c>, <c>M</c>, <c>a</c>, <c>b</c>): a value
    /// in another of them is a sign the row was misread or mistyped (a <c>P</c> on a UDL row).
    /// </summary>
    public abstract IReadOnlyList<string> Uses { get; }

    /// <summary>The load of a row, or null when the row is left out (with its problems reported through <paramref name="row"/>).</summary>
    public abstract Load? Read(LoadRow row);
}
