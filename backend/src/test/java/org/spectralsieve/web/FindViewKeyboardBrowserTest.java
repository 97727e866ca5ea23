package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.Map;
import java.util.function.Predicate;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.interactions.Actions;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The Find view worked with the keyboard alone (docs/accessibility.md): every key goes to whatever has the focus,
 * as a user's keyboard would, and every element the focus lands on must show a focus ring. Skipped without
 * Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-a11y;DB_CLOSE_DELAY=-1")
class FindViewKeyboardBrowserTest {

    private static final String REQUIREMENT =
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
    /** More Tab presses than the page has stops between two of the steps below. */
    private static final int MOST_TABS = 80;

    private static PageBrowser page;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void start() throws IOException {
        page = PageBrowser.startOrSkip();
    }

    @AfterAll
    static void stop() {
        if (page != null) {
            page.close();
        }
    }

    @Test
    void aRequirementIsSearchedExplainedOpenedAndReturnedFromWithKeysOnly() throws IOException {
        page.open(port, "/");

        tabUntil("the requirement box", e -> "requirement-text".equals(e.getDomAttribute("id")));
        keys(REQUIREMENT, Keys.ENTER);
        page.waitForResults(REQUIREMENT);

        WebElement details = tabUntil("the first result's Details",
                e -> e.equals(firstRow().findElement(By.cssSelector("button.toggle"))));
        keys(Keys.SPACE);
        assertThat(details.getDomAttribute("aria-expanded")).isEqualTo("true");
        WebElement explanation = page.driver().findElement(
                By.cssSelector("#results-table tr.result-clauses:not([hidden]) td.explanation"));
        assertThat(explanation.isDisplayed()).as("the first row's clause explanations are shown").isTrue();
        assertThat(explanation.getText()).isNotBlank();
        page.screenshot("keyboard-1-explanation", "search-results");

        keys(Keys.chord(Keys.SHIFT, Keys.TAB));
        WebElement link = focused();
        assertThat(link.getDomAttribute("class")).contains("material-link");
        String name = link.getText();
        keys(Keys.ENTER);
        page.waitForMaterial(name);
        page.waiting().withMessage("waiting for the focus to move to the opened material's heading")
                .until(d -> "detail-name".equals(focused().getDomAttribute("id")));
        assertFocusVisible("the material's heading");
        page.screenshot("keyboard-2-material", "material-detail");

        WebElement back = tabUntil("Back to the results", e -> "back-to-results".equals(e.getDomAttribute("id")));
        keys(Keys.ENTER);
        assertThat(focused().getText()).as("focus back on the name the material was opened from").isEqualTo(name);
        assertThat(back.isDisplayed()).isFalse();
        assertFocusVisible("the result's name");

        // Escape does the same from anywhere inside the material view
        keys(Keys.ENTER);
        page.waiting().until(d -> "detail-name".equals(focused().getDomAttribute("id")));
        keys(Keys.TAB, Keys.TAB, Keys.ESCAPE);
        assertThat(focused().getText()).isEqualTo(name);
        page.screenshot("keyboard-3-back", "search-results");
    }

    @Test
    void theLibraryListOpensAMaterialWithEnter() {
        page.open(port, "/");
        WebElement row = tabUntil("a library row", e -> e.getDomAttribute("data-material-id") != null);
        String name = row.findElement(By.cssSelector("td")).getText();
        keys(Keys.ENTER);
        page.waitForMaterial(name);
    }

    /** Presses Tab until {@code wanted} holds for the focused element; every stop on the way must show its focus. */
    private WebElement tabUntil(String what, Predicate<WebElement> wanted) {
        for (int i = 0; i < MOST_TABS; i++) {
            keys(Keys.TAB);
            WebElement now = focused();
            assertFocusVisible(describe(now) + " (Tab " + (i + 1) + " on the way to " + what + ")");
            if (wanted.test(now)) {
                return now;
            }
        }
        throw new AssertionError(what + " not reached in " + MOST_TABS + " presses of Tab");
    }

    private void assertFocusVisible(String where) {
        Map<?, ?> ring = (Map<?, ?>) page.script("""
                const s = getComputedStyle(document.activeElement);
                return { outline: s.outlineStyle + ' ' + s.outlineWidth, shadow: s.boxShadow,
                  visible: (s.outlineStyle !== 'none' && parseFloat(s.outlineWidth) > 0) || s.boxShadow !== 'none' };""");
        assertThat(ring.get("visible")).as("a focus ring on %s (outline %s, box-shadow %s)", where, ring.get("outline"),
                ring.get("shadow")).isEqualTo(Boolean.TRUE);
    }

    private WebElement focused() {
        return page.driver().switchTo().activeElement();
    }

    private WebElement firstRow() {
        return page.resultRows().get(0);
    }

    private String describe(WebElement e) {
        return e.getTagName() + "#" + e.getDomAttribute("id") + "." + e.getDomAttribute("class") + " '"
                + e.getText().lines().findFirst().orElse("") + "'";
    }

    /** Keys typed into whatever has the focus, as a keyboard would: no element is clicked or addressed. */
    private void keys(CharSequence... keys) {
        new Actions(page.driver()).sendKeys(keys).perform();
    }
}
