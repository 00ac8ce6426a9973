namespace CrossCheck.Register;

/// <summary>One step of the register's schema: applied once, in order, inside a transaction.</summary>
/// <param name="Version">The schema version the register has after this step (1, 2, ...).</param>
/// <param name="Description">What the step does, for error messages.</param>
/// <param name="Sql">The statements.</param>
internal sealed record Migration(int Version, string Description, string Sql);

/// <summary>
/// The register's schema as a list of migrations. The version is kept in SQLite's <c>user_version</c>; the file is
/// marked as a CrossCheck register by <c>application_id</c>. To change the schema, append a migration (never edit a
/// released one) and a test that opens a register of the previous version.
/// </summary>
internal static class RegisterSchema
{
    /// <summary>"CCKR" — marks the file as a CrossCheck register.</summary>
    public const int ApplicationId = 0x43434B52;

    public static IReadOnlyList<Migration> Migrations { get; } =
    [
        new(1, "reviews and their findings", """
            CREATE TABLE reviews (
                id              INTEGER PRIMARY KEY,
                reference       TEXT    NOT NULL,
                round           INTEGER NOT NULL CHECK (round >= 1),
                revision        TEXT,
                title           TEXT,
                submission      TEXT    NOT NULL,
                source          TEXT    NOT NULL,
                review_date     TEXT    NOT NULL,
                recorded_at     TEXT    NOT NULL,
                reviewer        TEXT,
                tool_version    TEXT    NOT NULL,
                abs_tolerance   REAL    NOT NULL,
                rel_tolerance   REAL    NOT NULL,
                minor_tolerance REAL    NOT NULL,
                moment_unit     TEXT    NOT NULL,
                input_hash      TEXT    NOT NULL,
                verdict         TEXT    NOT NULL CHECK (verdict IN ('concur', 'concur-with-comments', 'revise')),
                ends_agree      INTEGER NOT NULL,
                ends_minor      INTEGER NOT NULL,
                ends_discrepant INTEGER NOT NULL,
                ends_missing    INTEGER NOT NULL,
                ends_unmatched  INTEGER NOT NULL,
                major_flags     INTEGER NOT NULL,
                minor_flags     INTEGER NOT NULL,
                top_cause       TEXT,
                finding_count   INTEGER NOT NULL
            );
            CREATE INDEX reviews_by_reference ON reviews (reference, round, id);
            CREATE TABLE findings (
                review_id  INTEGER NOT NULL REFERENCES reviews (id) ON DELETE CASCADE,
                seq        INTEGER NOT NULL,
                comment_id TEXT    NOT NULL,
                kind       TEXT    NOT NULL,
                severity   TEXT    NOT NULL,
                load_case  TEXT    NOT NULL,
                place      TEXT    NOT NULL,
                message    TEXT    NOT NULL,
                source     TEXT    NOT NULL,
                PRIMARY KEY (review_id, seq),
                UNIQUE (review_id, comment_id)
            );
            """),
    ];

    public static int Latest(IReadOnlyList<Migration> migrations) => migrations.Count == 0 ? 0 : migrations[^1].Version;
}
