namespace CrossCheck.Import.Tables;

/// <summary>
/// Decides, before any geometry table is read, whether the submission is a frame (<c>joints</c> and <c>members</c>)
/// or a continuous beam (<c>supports</c> and <c>spans</c>), and reports a mix of the two or a missing table.
/// </summary>
internal sealed class GeometryLayoutStep : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        bool frame = d.Has("joints") || d.Has("members");
        bool beam = d.Has("supports") || d.Has("spans");
        if (frame && beam) d.Error(d.Whole, Messages.BothGeometries);
        if (beam && !frame)
        {
            d.Layout = GeometryLayout.Beam;
            if (!d.Has("supports")) d.MissingTable("supports", "a continuous beam given by spans needs its supports listed left to right");
            if (!d.Has("spans")) d.MissingTable("spans");
            if (!d.Has("supports") || !d.Has("spans")) d.GeometryIncomplete = true;
            return;
        }
        if (!frame) { d.Error(d.Whole, Messages.NoGeometry); d.GeometryIncomplete = true; return; }
        d.Layout = GeometryLayout.Frame;
        if (!d.Has("joints")) { d.MissingTable("joints"); d.GeometryIncomplete = true; }
        if (!d.Has("members")) { d.MissingTable("members"); d.GeometryIncomplete = true; }
    }
}
