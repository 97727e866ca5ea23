package org.spectralsieve.web;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebDriver;

/**
 * axe-core (the npm registry's accessibility checker) run inside the page under test. Its file is not part of the
 * repository: {@code .ci/run} fetches the pinned version into {@code .cache/npm/} at the repository root (see
 * docs/accessibility.md); {@code -Dsieve.axe=/path/to/axe.min.js} points elsewhere. Without the file the calling
 * test is skipped with a message saying how to get it.
 */
final class AxeCore {

    /** Relative to the backend module, where surefire runs. */
    static final Path DEFAULT = Path.of("..", ".cache", "npm", "node_modules", "axe-core", "axe.min.js");
    /** WCAG 2.0 and 2.1, levels A and AA: the rules the issue asks for (text contrast to AA among them). */
    static final List<String> TAGS = List.of("wcag2a", "wcag2aa", "wcag21a", "wcag21aa");

    private final String source;

    private AxeCore(String source) {
        this.source = source;
    }

    static AxeCore loadOrSkip() throws IOException {
        Path file = Path.of(System.getProperty("sieve.axe", DEFAULT.toString()));
        assumeTrue(Files.isReadable(file), "Accessibility check skipped: no axe-core at " + file.toAbsolutePath()
                + " (run .ci/run, or: npm install --no-save --prefix .cache/npm axe-core@4.14.1; or set -Dsieve.axe)");
        return new AxeCore(Files.readString(file, StandardCharsets.UTF_8));
    }

    /** The version axe reports about itself, for the failure message and the log. */
    String version(WebDriver driver) {
        inject(driver);
        return String.valueOf(((JavascriptExecutor) driver).executeScript("return axe.version"));
    }

    /**
     * Runs the WCAG 2 A/AA rules over the whole document as it stands and answers one line per violation:
     * rule id, impact, help text and the CSS targets of (up to five of) its nodes. Empty when none.
     */
    List<String> violations(WebDriver driver) {
        inject(driver);
        driver.manage().timeouts().scriptTimeout(Duration.ofSeconds(60));
        Object answer = ((JavascriptExecutor) driver).executeAsyncScript("""
                const done = arguments[arguments.length - 1];
                axe.run(document, { runOnly: { type: 'tag', values: arguments[0] }, resultTypes: ['violations'] })
                  .then((r) => done(r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help,
                    nodes: v.nodes.slice(0, 5).map((n) => n.target.join(' ') + ' :: ' + (n.failureSummary || '')
                      .replace(/\\s+/g, ' ').slice(0, 200)), count: v.nodes.length }))))
                  .catch((e) => done([{ id: 'axe-error', impact: 'n/a', help: String(e), nodes: [], count: 0 }]));
                """, TAGS);
        List<String> lines = new ArrayList<>();
        for (Object item : (List<?>) answer) {
            Map<?, ?> v = (Map<?, ?>) item;
            lines.add(v.get("id") + " (" + v.get("impact") + ", " + v.get("count") + " nodes): " + v.get("help")
                    + "\n      " + String.join("\n      ", ((List<?>) v.get("nodes")).stream().map(String::valueOf).toList()));
        }
        return lines;
    }

    private void inject(WebDriver driver) {
        JavascriptExecutor js = (JavascriptExecutor) driver;
        if (!Boolean.TRUE.equals(js.executeScript("return typeof window.axe === 'object'"))) {
            // executeScript wraps the source in a function: axe's UMD wrapper then sets window.axe itself
            js.executeScript(source);
        }
    }
}
