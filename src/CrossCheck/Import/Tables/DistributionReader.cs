namespace CrossCheck.Import.Tables;

/// <summary>
/// The optional <c>distribution</c> table, the author's moment-distribution working (read by
/// <see cref="WorkingTableReader"/>); not read when the geometry is incomplete, since its columns name member ends.
/// </summary>
internal sealed class DistributionReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Table("distribution") is not { } dt || d.GeometryIncomplete) return;
        var momentUnit = d.Defaults.For(QuantityKind.Moment) ?? d.SeenUnit(nameof(QuantityKind.Moment));
        d.WorkingTables = WorkingTableReader.Read(dt, d.Model, momentUnit, d.Problems, d.Limits);
    }
}
