using System.Diagnostics;

namespace CrossCheck.Memo;

/// <summary>The memo could not be printed to PDF: no browser, or the browser failed.</summary>
public sealed class PdfPrintException : Exception
{
    public PdfPrintException() { }
    public PdfPrintException(string message) : base(message) { }
    public PdfPrintException(string message, Exception inner) : base(message, inner) { }
}

/// <summary>
/// Prints an HTML memo to PDF with a headless Chromium browser (Debian's <c>chromium</c> package). The HTML is written
/// to a private temporary folder with a fresh browser profile, printed there, and the bytes returned; the caller
/// writes them to their place (atomically). Nothing is fetched from the network: the memo is self-contained.
/// </summary>
public static class PdfPrinter
{
    /// <summary>Environment variable naming the browser executable, when it is not <c>chromium</c> on the PATH.</summary>
    public const string BrowserVariable = "CROSSCHECK_CHROMIUM";

    private static readonly string[] Names = ["chromium", "chromium-browser"];

    /// <summary>The browser to print with: <see cref="BrowserVariable"/> when set (null if that file does not exist), else the first Chromium on the PATH.</summary>
    public static string? FindBrowser()
    {
        string? configured = Environment.GetEnvironmentVariable(BrowserVariable);
        if (!string.IsNullOrWhiteSpace(configured)) return File.Exists(configured) ? configured : null;
        string path = Environment.GetEnvironmentVariable("PATH") ?? "";
        foreach (var dir in path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
            foreach (var name in Names)
            {
                string candidate = Path.Combine(dir, name);
                if (File.Exists(candidate)) return candidate;
            }
        return null;
    }

    /// <summary>What to tell a user who asked for a PDF on a machine without the browser.</summary>
    public static string MissingBrowserMessage =>
        "--format pdf prints the HTML memo with a headless Chromium browser, and none was found " +
        $"(looked for {string.Join(" and ", Names)} on the PATH, or the file named by {BrowserVariable}). " +
        "Install it (Debian/Ubuntu: apt-get install chromium), or write the memo with --format html and print it from any browser.";

    /// <summary>Prints <paramref name="html"/> to PDF and returns the file's bytes.</summary>
    /// <exception cref="PdfPrintException">The browser failed, timed out or wrote no PDF.</exception>
    public static byte[] Print(string html, string browser, TimeSpan? timeout = null)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(browser);
        string work = Path.Combine(Path.GetTempPath(), $"crosscheck-pdf-{Environment.ProcessId}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(work);
        try
        {
            string page = Path.Combine(work, "memo.html");
            string pdf = Path.Combine(work, "memo.pdf");
            File.WriteAllText(page, html);
            var psi = new ProcessStartInfo(browser)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                RedirectStandardInput = true,
                UseShellExecute = false,
                WorkingDirectory = work,
            };
            foreach (var arg in new[]
                     {
                         "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
                         "--disable-sync", "--no-first-run", "--no-default-browser-check", "--disable-extensions", "--mute-audio",
                         $"--user-data-dir={Path.Combine(work, "profile")}", "--no-pdf-header-footer", "--print-to-pdf-no-header",
                         $"--print-to-pdf={pdf}", new Uri(page).AbsoluteUri,
                     })
                psi.ArgumentList.Add(arg);

            using var process = new Process { StartInfo = psi };
            var errors = new System.Text.StringBuilder();
            process.ErrorDataReceived += (_, e) => { if (e.Data is not null) lock (errors) errors.AppendLine(e.Data); };
            process.OutputDataReceived += (_, _) => { };
            try
            {
                process.Start();
            }
            catch (Exception ex) when (ex is System.ComponentModel.Win32Exception or InvalidOperationException)
            {
                throw new PdfPrintException($"could not start the browser '{browser}': {ex.Message}", ex);
            }
            process.StandardInput.Close();
            process.BeginErrorReadLine();
            process.BeginOutputReadLine();
            if (!process.WaitForExit(timeout ?? TimeSpan.FromSeconds(120)))
            {
                process.Kill(entireProcessTree: true);
                throw new PdfPrintException($"the browser '{browser}' did not finish printing the memo within {(timeout ?? TimeSpan.FromSeconds(120)).TotalSeconds:0} s.");
            }
            process.WaitForExit();
            if (!File.Exists(pdf) || new FileInfo(pdf).Length < 5)
            {
                string tail;
                lock (errors) tail = string.Join(" | ", errors.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).TakeLast(3));
                throw new PdfPrintException($"the browser '{browser}' exited with code {process.ExitCode} and wrote no PDF{(tail.Length > 0 ? $" ({tail})" : "")}.");
            }
            byte[] bytes = File.ReadAllBytes(pdf);
            if (bytes.Length < 5 || bytes[0] != '%' || bytes[1] != 'P' || bytes[2] != 'D' || bytes[3] != 'F')
                throw new PdfPrintException($"the browser '{browser}' wrote a file that is not a PDF.");
            return bytes;
        }
        finally
        {
            try
            {
                Directory.Delete(work, recursive: true);
            }
            catch (IOException)
            {
                // A browser helper still holding a file: the folder is in the temporary area and is left for the system to clear.
            }
            catch (UnauthorizedAccessException)
            {
            }
        }
    }
}
