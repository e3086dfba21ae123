package org.specimenledger.web;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.List;
import java.util.logging.Level;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * One headless Chromium (Debian's {@code chromium} and {@code chromium-driver}) driven by Selenium, with
 * the browser's console read after every page so that a script error or a refused resource (the content
 * security policy reports there) fails the test, and a screenshot of each page kept under
 * {@code target/screenshots/}.
 */
final class Browser implements AutoCloseable {

    static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    static final Path DRIVER = Path.of("/usr/bin/chromedriver");
    private static final Path SCREENSHOTS = Path.of("target", "screenshots");

    final ChromeDriver driver;
    private final int port;
    private final Path profile;

    static boolean available() {
        return Files.isExecutable(CHROMIUM) && Files.isExecutable(DRIVER);
    }

    Browser(int port) {
        this.port = port;
        try {
            this.profile = Files.createTempDirectory("ledger-browser-");
            Files.createDirectories(SCREENSHOTS);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toFile());
        options.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--disable-dev-shm-usage", "--window-size=1280,900", "--user-data-dir=" + profile);
        LoggingPreferences logs = new LoggingPreferences();
        logs.enable(LogType.BROWSER, Level.ALL);
        options.setCapability("goog:loggingPrefs", logs);
        // the driver is named outright, so nothing is looked up or downloaded
        ChromeDriverService service = new ChromeDriverService.Builder().usingDriverExecutable(DRIVER.toFile())
                .usingAnyFreePort().build();
        this.driver = new ChromeDriver(service, options);
        driver.manage().timeouts().implicitlyWait(Duration.ZERO);
    }

    void open(String path) {
        driver.get("http://localhost:" + port + path);
    }

    WebElement find(String css) {
        return driver.findElement(By.cssSelector(css));
    }

    List<WebElement> all(String css) {
        return driver.findElements(By.cssSelector(css));
    }

    WebDriverWait waiting() {
        return new WebDriverWait(driver, Duration.ofSeconds(20));
    }

    String path() {
        return java.net.URI.create(driver.getCurrentUrl()).getPath();
    }

    void signIn(String username, String password) {
        open("/sign-in");
        find("#username").sendKeys(username);
        find("#password").sendKeys(password);
        find("#sign-in-form button[type=submit]").click();
        waiting().until(d -> !path().equals("/sign-in") || d.getCurrentUrl().contains("?"));
    }

    void signOut() {
        find("form.sign-out button").click();
        waiting().until(d -> path().equals("/sign-in"));
    }

    /** The console's errors since the last call (reading the log empties it). */
    List<String> consoleErrors() {
        return driver.manage().logs().get(LogType.BROWSER).getAll().stream()
                .filter(e -> e.getLevel().intValue() >= Level.SEVERE.intValue())
                .map(LogEntry::getMessage).toList();
    }

    void screenshot(String name) {
        try {
            Path shot = ((TakesScreenshot) driver).getScreenshotAs(OutputType.FILE).toPath();
            Files.copy(shot, SCREENSHOTS.resolve(name + ".png"), StandardCopyOption.REPLACE_EXISTING);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    void width(int pixels) {
        driver.manage().window().setSize(new Dimension(pixels, 1000));
    }

    @Override
    public void close() {
        driver.quit();
        try (var files = Files.walk(profile)) {
            files.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            // a left-over temporary profile is harmless
        }
    }
}
