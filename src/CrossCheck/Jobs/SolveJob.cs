using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;

namespace CrossCheck.Jobs;

/// <summary>What <c>crosscheck solve</c> got: the recomputed results, or why there are none.</summary>
/// <param name="Path">The submission as given.</param>
/// <param name="Report">The results in the submission's units and convention; null when <see cref="Errors"/> or <see cref="StructureProblem"/> say why not.</param>
/// <param name="Errors">The input problems that stopped it.</param>
/// <param name="Warnings">Import warnings.</param>
/// <param name="StructureProblem">Why the structure cannot be analysed (a mechanism, ...).</param>
public sealed record SolveOutcome(string Path, SolveReport? Report, IReadOnlyList<InputProblem> Errors, IReadOnlyList<InputProblem> Warnings,
    string? StructureProblem = null);

/// <summary>Read → solve, for <c>crosscheck solve</c>; the report renders itself as CSV or JSON.</summary>
public static class SolveJob
{
    /// <summary>
    /// Recomputing a model needs no claims, and without a diagnosis to run a large frame costs little (the skyline
    /// solver handles 100,000 unknowns in about a second), so solve reads far bigger structures than review.
    /// </summary>
    public static InputLimits Limits { get; } = InputLimits.Default with
    {
        ClaimsRequired = false, MaxMembers = 50_000, MaxJoints = 100_000, MaxRows = 200_000,
    };

    /// <summary>Reads and solves the submission at <paramref name="path"/>. Bad input is returned, never thrown.</summary>
    public static SolveOutcome Run(string path, InputLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        var imported = SubmissionReader.Read(path, limits ?? Limits);
        var warnings = imported.Warnings.ToList();
        if (!imported.Succeeded) return new SolveOutcome(path, null, imported.Errors.ToList(), warnings);
        var s = imported.Submission;
        if (!new FrameSolver().TrySolve(s.Model, s.Cases, out var result, out var problem)) return new SolveOutcome(path, null, [], warnings, problem.Message);
        try
        {
            // Combinations: derived cases under their names, and the envelopes of those with a patterned case.
            return new SolveOutcome(path, new SolveReport(s, CombinationAnalysis.Extend(result, s.Cases, s.Combinations)), [], warnings);
        }
        catch (StructureException ex)
        {
            return new SolveOutcome(path, null, [], warnings, ex.Message);
        }
    }
}
