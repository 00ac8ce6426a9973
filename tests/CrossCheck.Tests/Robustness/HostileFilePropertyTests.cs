using System.Text;
using CrossCheck.Cli;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using CsCheck;
using Microsoft.Data.Sqlite;

namespace CrossCheck.Tests.Robustness;

/// <summary>
/// Property tests, one per class of hostile input: output names, input budgets and encodings, time budgets, and registers with
/// values changed behind CrossCheck's back.
/// </summary>
public class HostileFilePropertyTests
{
    private static readonly Gen<string> FileName = Gen.String[Gen.Char.Where(c => c != '/' && c != '\0' && !char.IsSurrogate(c)), 1, 250]
        .Where(n => n is not ("." or "..") && Encoding.UTF8.GetByteCount(n) <= 255);

    [Fact]
    public void Property_TemporaryNames_FitEveryLegalName_AndAnyLegalNameIsWritten()
    {
        using var t = new TempSubmission();
        FileName.Sample(name =>
        {
            string temp = AtomicFile.TemporaryName(name, 4_194_304);
            Encoding.UTF8.GetByteCount(temp).ShouldBeLessThanOrEqualTo(AtomicFile.MaxNameBytes);
            temp.ShouldStartWith(".");
            temp.ShouldEndWith(".tmp");
            string path = Path.Combine(t.Folder, name);
            AtomicFile.WriteText(path, name);
            File.ReadAllText(path).ShouldBe(name);
            File.Delete(path);
            Directory.GetFiles(t.Folder).ShouldBeEmpty();
        }, iter: 150, threads: 1);
    }

    [Fact]
    public void Property_InputsAreReadWithinTheirBudget_CountingWhatIsRead()
    {
        using var t = new TempSubmission();
        int n = 0;
        Gen.Select(Gen.Int[0, 20_000], Gen.Int[0, 20_000]).Sample((size, budget) =>
        {
            string path = t.WriteBytes($"f{Interlocked.Increment(ref n)}.csv", new byte[size]);
            if (size <= budget) InputFile.Read(path, budget).Length.ShouldBe(size);
            else Should.Throw<InputFileException>(() => InputFile.Read(path, budget)).Refusal.ShouldBe(InputRefusal.TooLarge);
        }, iter: 200);
    }

    private static readonly Encoding[] Unicode =
    [
        new UTF8Encoding(true), new UnicodeEncoding(false, true), new UnicodeEncoding(true, true), new UTF32Encoding(false, true), new UTF32Encoding(true, true),
        new UnicodeEncoding(false, false), new UnicodeEncoding(true, false), new UTF32Encoding(false, false), new UTF32Encoding(true, false),
    ];

    [Fact]
    public void Property_TextInAnyUnicodeEncoding_DecodesToWhatWasWritten()
    {
        // Table text: ASCII with some accented letters and symbols engineers type (a mark-less file must be mostly ASCII to be recognised).
        var ascii = Gen.String[Gen.OneOf(Gen.Char['a', 'z'], Gen.Char['0', '9'], Gen.Const(','), Gen.Const('\n')), 40, 400];
        var text = Gen.Select(ascii, Gen.String[Gen.OneOf(Gen.Const('é'), Gen.Const('·'), Gen.Const('²')), 0, 3], (a, extra) => a + extra);
        Gen.Select(text, Gen.Int[0, Unicode.Length - 1]).Sample((s, k) =>
        {
            var e = Unicode[k];
            byte[] bytes = [.. e.GetPreamble(), .. e.GetBytes(s)];
            var decoded = InputText.Decode(bytes).ShouldNotBeNull();
            decoded.Text.ShouldBe(s);
            decoded.Fallback.ShouldBeFalse();
        }, iter: 400);
    }

    [Fact]
    public void Property_AnyTimeBudget_GivesAReviewOrAnOverBudgetError_NeverAnException()
    {
        Gen.Int[0, 40].Sample(ms =>
        {
            var limits = InputLimits.Default with { TimeBudget = TimeSpan.FromMilliseconds(ms) + TimeSpan.FromTicks(1) };
            var outcome = new ReviewJob().Review(CliRunner.Demo("school-hall.csv"), ReviewOptions.Default, limits);
            (outcome.Succeeded || outcome.Failure == ReviewFailure.OverBudget).ShouldBeTrue(string.Join("; ", outcome.Errors));
        }, iter: 25, threads: 1);
    }

    private static readonly string[] Columns = ["reference", "round", "review_date", "verdict", "ends_agree", "finding_count", "abs_tolerance", "title", "tool_version"];
    private static readonly object?[] Values = [null, "one", -7, 2.5, "", "\u001b[2J", 99999999999L, new byte[] { 1, 2 }];

    [Fact]
    public void Property_ARegisterChangedBehindOurBack_IsReadOrRefusedWithExitCode2_NeverACrash()
    {
        using var t = new TempSubmission();
        string template = Path.Combine(t.Folder, "template.db");
        CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--register", template, "--out", "/dev/null", "-q").ExitCode.ShouldBe(ExitCodes.Comments);
        int n = 0;
        Gen.Select(Gen.Int[0, Columns.Length - 1], Gen.Int[0, Values.Length - 1]).Sample((c, v) =>
        {
            string register = Path.Combine(t.Folder, $"r{Interlocked.Increment(ref n)}.db");
            File.Copy(template, register);
            using (var connection = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = register, Pooling = false }.ToString()))
            {
                connection.Open();
                using var cmd = connection.CreateCommand();
                cmd.CommandText = $"UPDATE reviews SET {Columns[c]} = $v";
                cmd.Parameters.AddWithValue("$v", Values[v] ?? DBNull.Value);
                try
                {
                    cmd.ExecuteNonQuery();
                }
                catch (SqliteException)
                {
                    return; // a NOT NULL column: SQLite itself keeps the value out
                }
            }
            foreach (var args in new[] { new[] { "history", "--register", register }, ["history", "DEMO-FB-01", "--register", register], ["register", "check", "--register", register] })
            {
                var r = CliRunner.Run(args);
                r.ExitCode.ShouldBeOneOf([ExitCodes.Concur, ExitCodes.Comments, ExitCodes.InputError], string.Join(" ", args) + "\n" + r.Err);
                r.Err.ShouldNotContain("internal error");
                (r.Out + r.Err).ShouldNotContain("\u001b");
            }
        }, iter: 40, threads: 1);
    }
}
