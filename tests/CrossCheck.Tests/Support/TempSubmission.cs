using CrossCheck.Import;

namespace CrossCheck.Tests.Support;

/// <summary>Writes submission files into a fresh temporary folder for a test; deleted on dispose.</summary>
public sealed class TempSubmission : IDisposable
{
    public TempSubmission() => Folder = Directory.CreateTempSubdirectory("crosscheck-test-").FullName;

    public string Folder { get; }

    public string Write(string name, string content)
    {
        string path = Path.Combine(Folder, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, content.ReplaceLineEndings("\n"));
        return path;
    }

    public string WriteBytes(string name, byte[] content)
    {
        string path = Path.Combine(Folder, name);
        File.WriteAllBytes(path, content);
        return path;
    }

    /// <summary>A new, empty folder <paramref name="name"/> inside the scratch folder.</summary>
    public string MakeFolder(string name)
    {
        string path = Path.Combine(Folder, name);
        Directory.CreateDirectory(path);
        return path;
    }

    /// <summary>A new folder <paramref name="name"/> inside the scratch folder holding a copy of the files of <paramref name="from"/>.</summary>
    public string CopyFolder(string from, string name)
    {
        string path = Path.Combine(Folder, name);
        CopyFiles(from, path);
        return path;
    }

    /// <summary>Copies the files of the folder <paramref name="from"/> (not its subfolders) into <paramref name="to"/>, made if need be.</summary>
    public static void CopyFiles(string from, string to)
    {
        Directory.CreateDirectory(to);
        foreach (var f in Directory.GetFiles(from)) File.Copy(f, Path.Combine(to, Path.GetFileName(f)));
    }

    public static ImportResult ReadText(string sectioned)
    {
        using var t = new TempSubmission();
        return SubmissionReader.Read(t.Write("calc.csv", sectioned));
    }

    public void Dispose()
    {
        try { Directory.Delete(Folder, recursive: true); } catch (IOException) { }
    }
}

/// <summary>Well-formed submission text to start from in tests (a propped cantilever, kN and m).</summary>
public static class SampleText
{
    public const string Info = """
        [info]
        key,value
        title,Test beam
        force unit,kN
        length unit,m
        """;

    public const string Frame = """
        [joints]
        joint,x,y,restraint
        A,0,0,fixed
        B,6,0,roller

        [members]
        member,start,end,E [GPa],I [mm^4]
        AB,A,B,200,250e6
        """;

    public const string Loads = """
        [loads]
        case,on,kind,w,P,a
        1,AB,udl,18,,
        """;

    public const string Claims = """
        [end-moments]
        case,member,at,moment
        1,AB,A,-81
        1,AB,B,0
        """;

    /// <summary>
    /// The joints of the portal frame of docs/REFERENCE-CHECKS.md group 5 on fixed feet: columns 4 m high at A–B and
    /// D–C, the beam B–C 6 m long (members are the test's own).
    /// </summary>
    public const string PortalJoints = """
        [joints]
        joint,x,y,restraint
        A,0,0,fixed
        B,0,4,free
        C,6,4,free
        D,6,0,fixed
        """;

    public static string All => string.Join("\n\n", Info, Frame, Loads, Claims);

    /// <summary>The sample with one section replaced.</summary>
    public static string With(string? info = null, string? frame = null, string? loads = null, string? claims = null) =>
        string.Join("\n\n", info ?? Info, frame ?? Frame, loads ?? Loads, claims ?? Claims);
}
