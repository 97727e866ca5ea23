package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.spectralsieve.accounts.Account;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.Role;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The page in server mode, in a real headless Chromium: an anonymous visit lands on the sign-in page, a wrong
 * password is explained there, a viewer sees who is signed in and no import, retire or correct controls, an
 * editor sees them, and a refusal that happens anyway (the role lowered meanwhile) shows the server's words.
 * Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "sieve.server-mode=true",
        "sieve.index.dir=",
        "spring.datasource.url=jdbc:h2:mem:server-mode-page-browser;DB_CLOSE_DELAY=-1"})
class ServerModePageBrowserTest {

    private static final String PASSWORD = "larkspur-lane-bench-7";

    @LocalServerPort
    private int port;
    @Autowired
    private AccountAdministration administration;

    private PageBrowser page;
    private WebDriver driver;
    private WebDriverWait wait;

    @BeforeAll
    static void needsABrowser() {
        HeadlessChromium.assumeInstalled();
    }

    @BeforeEach
    void startBrowser() throws IOException {
        page = PageBrowser.startOrSkip();
        driver = page.driver();
        wait = page.waiting();
    }

    @AfterEach
    void stopBrowser() {
        if (page != null) {
            page.close();
        }
    }

    private void signIn(String name, String password) {
        wait.withMessage("waiting for the sign-in form").until(d -> !d.findElements(By.id("sign-in-form")).isEmpty());
        WebElement nameField = driver.findElement(By.id("sign-in-name"));
        nameField.clear();
        nameField.sendKeys(name);
        WebElement passwordField = driver.findElement(By.id("sign-in-password"));
        passwordField.clear();
        passwordField.sendKeys(password);
        driver.findElement(By.id("sign-in-button")).click();
    }

    private String signedInText() {
        return wait.withMessage("waiting for the signed-in line").until(d -> d.findElements(By.id("signed-in")).stream()
                .map(WebElement::getText).filter(t -> !t.isEmpty()).findFirst().orElse(null));
    }

    private List<WebElement> visibleButtons(String text) {
        return driver.findElements(By.xpath("//button[text()='" + text + "']")).stream()
                .filter(WebElement::isDisplayed).toList();
    }

    @Test
    void aViewerSignsInSeesItsRoleAndNoControlsItMayNotUse() {
        Account wren = administration.createAccount("wren-page", Role.VIEWER, PASSWORD);
        page.load(port, "/");
        wait.until(d -> d.getCurrentUrl().endsWith("/sign-in.html"));

        signIn(wren.name(), "not-the-right-one");
        wait.withMessage("waiting for the refusal to be explained")
                .until(d -> d.findElement(By.id("sign-in-message")).isDisplayed());
        assertThat(driver.findElement(By.id("sign-in-message")).getText()).contains("do not match");

        signIn(wren.name(), PASSWORD);
        page.waitForLibrary();
        assertThat(signedInText()).contains("wren-page").contains("viewer");
        assertThat(driver.findElement(By.id("curve-import")).isDisplayed()).isFalse();
        page.openMaterialFromLibrary("UV-transmitting cast acrylic");
        assertThat(visibleButtons("Retire")).isEmpty();
        assertThat(visibleButtons("Correct…")).isEmpty();
        assertThat(visibleButtons("Retire material")).isEmpty();

        driver.findElement(By.xpath("//div[@id='signed-in']//button[text()='Sign out']")).click();
        wait.until(d -> d.getCurrentUrl().endsWith("/sign-in.html"));
    }

    @Test
    void anEditorSeesTheControlsAndARefusalAfterItsRoleWasLoweredIsExplained() {
        Account juniper = administration.createAccount("juniper-page", Role.EDITOR, PASSWORD);
        page.load(port, "/sign-in.html");
        signIn(juniper.name(), PASSWORD);
        page.waitForLibrary();
        assertThat(signedInText()).contains("juniper-page").contains("editor");
        assertThat(driver.findElement(By.id("curve-import")).isDisplayed()).isTrue();
        page.openMaterialFromLibrary("UV-transmitting cast acrylic");
        assertThat(visibleButtons("Retire")).isNotEmpty();

        administration.changeRole(juniper.id(), Role.VIEWER); // an admin lowers it while the page is open
        visibleButtons("Retire").get(0).click();
        WebElement message = wait.withMessage("waiting for the refusal")
                .until(d -> d.findElement(By.id("message")).isDisplayed() ? d.findElement(By.id("message")) : null);
        assertThat(message.getText()).contains("editor");
    }
}
