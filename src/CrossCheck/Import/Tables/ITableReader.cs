namespace CrossCheck.Import.Tables;

/// <summary>
/// One step of building a submission, most of them the reader of one table of the format. Each reads what it needs
/// from the <see cref="SubmissionDraft"/>, reports problems to it and adds its part of the submission. The steps run
/// in the order of <see cref="SubmissionBuilder"/>'s list, which is also the order problems are reported in.
/// </summary>
internal interface ITableReader
{
    void Read(SubmissionDraft draft);
}
