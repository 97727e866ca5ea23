package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;

import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * A page of another site, open in the user's real (headless Chromium) browser, sends a multipart import to
 * the tool as any site could (a "simple" request: no preflight). The tool refuses it and stores nothing;
 * the same import sent by the tool's own page is stored. Skipped (not failed) without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-cross-site;DB_CLOSE_DELAY=-1")
@ExtendWith(OutputCaptureExtension.class)
class CrossSiteWriteBrowserTest {

    private static PageBrowser page;
    private static WebDriver driver;
    private static HttpServer otherSite;

    @LocalServerPort
    private int port;

    @Autowired
    private DSLContext db;

    @BeforeAll
    static void start() throws IOException {
        page = PageBrowser.startOrSkip();
        driver = page.driver();
        driver.manage().timeouts().scriptTimeout(Duration.ofSeconds(30));
        // another origin on this machine: 127.0.0.1 on its own port, while the tool is opened as localhost
        otherSite = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
        otherSite.createContext("/", exchange -> {
            byte[] page = "<!doctype html><title>another site</title><p>illustrative page".getBytes(StandardCharsets.UTF_8);
            exchange.getResponseHeaders().set("Content-Type", "text/html; charset=utf-8");
            exchange.sendResponseHeaders(200, page.length);
            exchange.getResponseBody().write(page);
            exchange.close();
        });
        otherSite.start();
    }

    @AfterAll
    static void stop() {
        if (page != null) {
            page.close();
        }
        if (otherSite != null) {
            otherSite.stop(0);
        }
    }

    /** The page's script: a multipart import of a small invented curve; answers the status it could see. */
    private static String importScript(String url, String materialName) {
        return """
                const done = arguments[arguments.length - 1];
                const form = new FormData();
                form.set('materialName', '%s');
                form.set('materialClass', 'plastic sheet');
                form.set('scaling', 'bulk');
                form.set('thicknessMm', '3');
                form.set('file', new Blob(['wavelength_nm,transmittance\\n350,0.1\\n400,0.8\\n450,0.9\\n'],
                    { type: 'text/csv' }), 'planted.csv');
                fetch('%s', { method: 'POST', body: form, mode: 'no-cors' })
                  .then(r => done('status ' + r.status + ' ' + r.type), e => done('failed ' + e));
                """.formatted(materialName, url);
    }

    @Test
    void anImportSentByAnotherSitesPageIsRefusedAndOnlyTheToolsOwnPageCanStore(CapturedOutput log) {
        driver.get("http://127.0.0.1:" + otherSite.getAddress().getPort() + "/");
        Object planted = ((JavascriptExecutor) driver).executeAsyncScript(
                importScript("http://localhost:" + port + "/api/imports", "Illustrative planted sheet"));

        // the other page sees only an opaque answer; the request did reach the tool and was refused
        assertThat(planted).isEqualTo("status 0 opaque");
        new WebDriverWait(driver, Duration.ofSeconds(10)).until(d -> log.getOut().contains("Refused POST /api/imports"));
        // 127.0.0.1 and localhost are different sites to the browser
        assertThat(log.getOut()).contains("Sec-Fetch-Site: cross-site");
        assertThat(db.fetchCount(MATERIAL, MATERIAL.NAME.eq("Illustrative planted sheet"))).isZero();

        driver.get("http://localhost:" + port + "/");
        Object own = ((JavascriptExecutor) driver).executeAsyncScript(
                importScript("api/imports", "Illustrative sheet from the page"));

        // same origin: the page sees the real answer
        assertThat(own).isEqualTo("status 201 basic");
        assertThat(db.fetchCount(MATERIAL, MATERIAL.NAME.eq("Illustrative sheet from the page"))).isEqualTo(1);
    }
}
