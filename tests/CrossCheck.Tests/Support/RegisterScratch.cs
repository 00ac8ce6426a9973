using CrossCheck.Register;

namespace CrossCheck.Tests.Support;

/// <summary>
/// A test's scratch folder with a register of the given kind in it (<see cref="TestRegister"/>: an SQLite file in the
/// folder, or a PostgreSQL schema of its own); the register goes first at the end, then the folder.
/// </summary>
public sealed class RegisterScratch : IDisposable
{
    public RegisterScratch(RegisterKind kind, string name = "reg.db")
    {
        Files = new TempSubmission();
        Db = TestRegister.Create(kind, Files.Folder, name);
    }

    /// <summary>The scratch folder (write submissions and outputs here).</summary>
    public TempSubmission Files { get; }

    public string Folder => Files.Folder;

    public TestRegister Db { get; }

    /// <summary>What <c>--register</c> takes.</summary>
    public string Location => Db.Location;

    public ReviewRegister Open() => Db.Open();

    /// <summary>Runs SQL on the register's own database (<see cref="TestRegister.Scalar"/>).</summary>
    public long Scalar(string sql) => Db.Scalar(sql);

    public void Dispose()
    {
        Db.Dispose();
        Files.Dispose();
    }
}
