using System.Diagnostics;
using System.Security.Cryptography;
using System.Text;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Documents made by programs other than CrossCheck, as calc packages arrive: HTML printed by Debian's headless chromium,
/// a typesetter's output (groff with tbl, PostScript, ghostscript's ps2pdf), a plain-text printout (enscript, ps2pdf),
/// and a spreadsheet program's PDF export and <c>.xlsx</c> (LibreOffice headless, which stores formula results). Each
/// output is made once per source text and kept in the temporary folder (keyed by a hash of the source), so a test run
/// pays for each program once. <c>.ci/run</c> installs the programs.
/// </summary>
public static class Producers
{
    private static readonly string Cache = Path.Combine(Path.GetTempPath(), "crosscheck-producers");
    private static readonly SemaphoreSlim Office = new(1, 1);

    /// <summary>HTML printed to PDF by headless chromium.</summary>
    public static string Chromium(string html, string name) => Make(html, name, ".html", ".pdf", (src, dir, output) =>
        Run("chromium", dir, "--headless", "--no-sandbox", "--disable-gpu", "--no-pdf-header-footer", "--no-first-run",
            "--disable-background-networking", "--disable-component-update", "--disable-sync", $"--user-data-dir={Path.Combine(dir, "profile")}",
            $"--print-to-pdf={output}", src));

    /// <summary>HTML rendered to a PNG picture by headless chromium (a table drawn as an image, for the refusal tests).</summary>
    public static string Screenshot(string html, string name) => Make(html, name, ".html", ".png", (src, dir, output) =>
        Run("chromium", dir, "--headless", "--no-sandbox", "--disable-gpu", "--hide-scrollbars", "--no-first-run", "--window-size=600,200",
            "--disable-background-networking", "--disable-component-update", "--disable-sync", $"--user-data-dir={Path.Combine(dir, "profile")}",
            $"--screenshot={output}", src));

    /// <summary>A groff document (ms macros, tbl tables) typeset to PostScript, then PDF by ghostscript.</summary>
    public static string Groff(string source, string name) => Make(source, name, ".ms", ".pdf", (src, dir, output) =>
    {
        string ps = Path.Combine(dir, "out.ps");
        var (code, stdout, err) = Capture("groff", dir, "-t", "-ms", "-Tps", src);
        if (code != 0) throw new InvalidOperationException($"groff failed: {err}");
        File.WriteAllText(ps, stdout, Encoding.Latin1);
        Run("ps2pdf", dir, ps, output);
    });

    /// <summary>A plain-text printout: enscript (Courier, no page headers) to PostScript, then PDF by ghostscript.</summary>
    public static string Enscript(string text, string name) => Make(text, name, ".txt", ".pdf", (src, dir, output) =>
    {
        string ps = Path.Combine(dir, "out.ps");
        Run("enscript", dir, "-B", "-q", "-f", "Courier10", "-o", ps, src);
        Run("ps2pdf", dir, ps, output);
    });

    /// <summary>A spreadsheet (flat OpenDocument XML) exported by LibreOffice headless as <paramref name="format"/> (<c>pdf</c> or <c>xlsx</c>).</summary>
    public static string Spreadsheet(string fods, string name, string format) => Make(fods, name, ".fods", "." + format, (src, dir, output) =>
    {
        Office.Wait();
        try
        {
            Run("soffice", dir, $"-env:UserInstallation=file://{Path.Combine(dir, "profile")}", "--headless", "--convert-to", format, "--outdir", dir, src);
            File.Move(Path.Combine(dir, Path.GetFileNameWithoutExtension(src) + "." + format), output, overwrite: true);
        }
        finally
        {
            Office.Release();
        }
    });

    private static string Make(string source, string name, string inExt, string outExt, Action<string, string, string> produce)
    {
        string hash = Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(inExt + outExt + source)))[..16];
        string folder = Path.Combine(Cache, hash);
        string output = Path.Combine(folder, name + outExt);
        if (File.Exists(output)) return output;
        string work = Path.Combine(Cache, hash + "-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(work);
        string src = Path.Combine(work, name + inExt);
        File.WriteAllText(src, source);
        string made = Path.Combine(work, name + ".out" + outExt);
        produce(src, work, made);
        if (!File.Exists(made)) throw new InvalidOperationException($"{name}{outExt} was not made");
        Directory.CreateDirectory(folder);
        File.Move(made, output, overwrite: true);
        try { Directory.Delete(work, recursive: true); } catch (IOException) { }
        return output;
    }

    private static void Run(string program, string dir, params string[] args)
    {
        var (code, _, err) = Capture(program, dir, args);
        if (code != 0) throw new InvalidOperationException($"{program} failed ({code}): {err}");
    }

    private static (int Code, string Out, string Err) Capture(string program, string dir, params string[] args)
    {
        var psi = new ProcessStartInfo(program) { WorkingDirectory = dir, RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var a in args) psi.ArgumentList.Add(a);
        psi.Environment["HOME"] = dir;
        using var p = Process.Start(psi) ?? throw new InvalidOperationException($"could not start {program}");
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(180_000))
        {
            p.Kill(entireProcessTree: true);
            throw new InvalidOperationException($"{program} did not finish within 180 s");
        }
        return (p.ExitCode, stdout.Result, stderr.Result);
    }
}
