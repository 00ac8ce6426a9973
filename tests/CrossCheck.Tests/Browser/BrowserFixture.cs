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

    private readonly Lazy<(ChromeDriverService Service, ChromeDriver Driver)> _browser;

    public BrowserFixture()
    {
        // Started on first use: on a machine without chromium the tests that need it are skipped (Support/Needs), and
        // nothing here may fail the collection.
        Profile = Path.Combine(Path.GetTempPath(), $"crosscheck-browser-{Guid.NewGuid():N}");
        Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");
        Directory.CreateDirectory(Screenshots);
        _browser = new Lazy<(ChromeDriverService, ChromeDriver)>(Start);
    }

    private (ChromeDriverService, ChromeDriver) Start()
    {
        if (!File.Exists(ChromiumPath) || !File.Exists(Path.Combine(DriverFolder, "chromedriver")))
            throw new InvalidOperationException("The browser tests need Debian's chromium and chromium-driver: apt-get install -y chromium chromium-driver (.ci/run does this).");
        Directory.CreateDirectory(Profile);
        var service = ChromeDriverService.CreateDefaultService(DriverFolder, "chromedriver");
        service.HideCommandPromptWindow = true;
        service.SuppressInitialDiagnosticInformation = true;
        var options = new ChromeOptions { BinaryLocation = ChromiumPath };
        options.AddArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
            "--disable-sync", "--no-first-run", "--window-size=1200,900", "--hide-scrollbars", $"--user-data-dir={Profile}");
        options.SetLoggingPreference(LogType.Browser, LogLevel.All);
        return (service, new ChromeDriver(service, options, TimeSpan.FromSeconds(90)));
    }

    public ChromeDriver Driver => _browser.Value.Driver;

    /// <summary>Where the tests leave their screenshots for a person to look at.</summary>
    public string Screenshots { get; }

    private string Profile { get; }

    /// <summary>Console messages of level SEVERE (errors) logged since the last call.</summary>
    public IReadOnlyList<string> ConsoleErrors() =>
        Driver.Manage().Logs.GetLog(LogType.Browser).Where(e => e.Level == LogLevel.Severe).Select(e => e.Message).ToList();

    public void Dispose()
    {
        if (!_browser.IsValueCreated) return;
        var (service, driver) = _browser.Value;
        driver.Quit();
        driver.Dispose();
        service.Dispose();
        try { Directory.Delete(Profile, recursive: true); } catch (IOException) { }
    }
}

[CollectionDefinition("Browser")]
public sealed class BrowserCollection : ICollectionFixture<BrowserFixture>
{
}
