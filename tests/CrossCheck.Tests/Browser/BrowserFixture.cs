using OpenQA.Selenium;
using OpenQA.Selenium.Chrome;

namespace CrossCheck.Tests.Browser;

/// <summary>
/// One headless Chromium for the browser tests, driven through Debian's chromedriver (<c>apt-get install chromium
/// chromium-driver</c>; <c>.ci/run</c> installs both). Nothing is downloaded: Selenium is pointed at the installed binaries.
/// </summary>
public sealed class BrowserFixture : IDisposable
{
    public const string ChromiumPath = "/usr/bin/chromium";
    public const string DriverFolder = "/usr/bin";

    private readonly ChromeDriverService _service;

    public BrowserFixture()
    {
        if (!File.Exists(ChromiumPath) || !File.Exists(Path.Combine(DriverFolder, "chromedriver")))
            throw new InvalidOperationException("The browser tests need Debian's chromium and chromium-driver: apt-get install -y chromium chromium-driver (.ci/run does this).");
        Profile = Directory.CreateTempSubdirectory("crosscheck-browser-").FullName;
        _service = ChromeDriverService.CreateDefaultService(DriverFolder, "chromedriver");
        _service.HideCommandPromptWindow = true;
        _service.SuppressInitialDiagnosticInformation = true;
        var options = new ChromeOptions { BinaryLocation = ChromiumPath };
        options.AddArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
            "--disable-sync", "--no-first-run", "--window-size=1200,900", "--hide-scrollbars", $"--user-data-dir={Profile}");
        options.SetLoggingPreference(LogType.Browser, LogLevel.All);
        Driver = new ChromeDriver(_service, options, TimeSpan.FromSeconds(90));
        Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");
        Directory.CreateDirectory(Screenshots);
    }

    public ChromeDriver Driver { get; }

    /// <summary>Where the tests leave their screenshots for a person to look at.</summary>
    public string Screenshots { get; }

    private string Profile { get; }

    /// <summary>Console messages of level SEVERE (errors) logged since the last call.</summary>
    public IReadOnlyList<string> ConsoleErrors() =>
        Driver.Manage().Logs.GetLog(LogType.Browser).Where(e => e.Level == LogLevel.Severe).Select(e => e.Message).ToList();

    public void Dispose()
    {
        Driver.Quit();
        Driver.Dispose();
        _service.Dispose();
        try { Directory.Delete(Profile, recursive: true); } catch (IOException) { }
    }
}

[CollectionDefinition("Browser")]
public sealed class BrowserCollection : ICollectionFixture<BrowserFixture>
{
}
