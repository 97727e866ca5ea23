package org.spectralsieve.web;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.json.JsonMapper;

/**
 * How fast the page answers and draws, measured in a real headless Chromium against the whole application with
 * its demo library. Run by the {@code bench} profile ({@code mvn -B -q -o -Pbench test -pl backend -am
 * -Dtest=PageSpeedBenchmark -Dsurefire.failIfNoSpecifiedTests=false}); the normal test run never includes a
 * {@code *Benchmark}. Prints {@code BENCH page-find …} and {@code BENCH page-overlay …} lines and asserts nothing
 * about time (docs/page-speed.md).
 *
 * <p>Every time is taken inside the page with {@code performance.now()} and the marks the page sets
 * ({@code sieve:results-rendered} in search.js, {@code sieve:chart-drawn} in chart.js's uPlot draw hook,
 * {@code sieve:material-shown} in app.js, {@code sieve:compare-drawn} in compare.js's draw hook), so the
 * WebDriver's own round trips are not in the figures.
 *
 * <p>Switches: {@code -Dbench.pageRuns=15} (timed runs per requirement), {@code -Dbench.pageWarmup=3},
 * {@code -Dbench.overlayRuns=7} (draws per overlay size), {@code -Dbench.overlayFrames=240},
 * {@code -Dbench.pageProfile=fixed|thickness|weighted} and {@code -Dbench.overlayProfile=true} (one more run under
 * Chromium's JavaScript profiler, its top self times printed as {@code BENCH page-profile} lines).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:page-speed-bench;DB_CLOSE_DELAY=-1")
class PageSpeedBenchmark {

    /** Trade requirements on the demo library: two point clauses; the same with a thickness to solve; weighted. */
    static final Map<String, String> REQUIREMENTS = new LinkedHashMap<>();

    static {
        REQUIREMENTS.put("fixed", "passes over 80% at 365 nm and blocks under 1% at 405 nm");
        REQUIREMENTS.put("thickness", "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm");
        REQUIREMENTS.put("weighted", "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%");
    }

    /** The word the synthetic overlay materials carry in their names, so a worded search admits only them. */
    static final String OVERLAY_WORD = "overlaybench";
    static final int OVERLAY_CURVES = 20;
    static final int OVERLAY_POINTS = 1000;

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private static PageBrowser browser;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        browser = PageBrowser.startOrSkip();
        browser.driver().manage().timeouts().scriptTimeout(Duration.ofSeconds(120));
    }

    @AfterAll
    static void stopBrowser() {
        if (browser != null) {
            browser.close();
        }
    }

    @Test
    @SuppressWarnings("unchecked")
    void searchToRowsToFirstResultsChart() {
        int warmup = intProperty("bench.pageWarmup", 3);
        int runs = intProperty("bench.pageRuns", 15);
        for (Map.Entry<String, String> requirement : REQUIREMENTS.entrySet()) {
            for (int i = 0; i < warmup; i++) {
                findOnce(requirement.getValue());
            }
        }
        // one run of each requirement in turn, so a noisy neighbour hurts all alike
        Map<String, List<Map<String, Object>>> timings = new LinkedHashMap<>();
        for (int i = 0; i < runs; i++) {
            for (Map.Entry<String, String> requirement : REQUIREMENTS.entrySet()) {
                timings.computeIfAbsent(requirement.getKey(), k -> new ArrayList<>()).add(findOnce(requirement.getValue()));
            }
        }
        String profiled = System.getProperty("bench.pageProfile", "");
        if (REQUIREMENTS.containsKey(profiled)) {
            browser.open(port, "/");
            profile("page-find requirement=" + profiled, () -> searchAndOpenFirst(REQUIREMENTS.get(profiled)));
        }
        timings.forEach((name, list) -> {
            Map<String, Object> first = list.get(0);
            System.out.printf(Locale.ROOT, "BENCH page-find requirement=%s rows=%s runs=%d"
                            + " end_to_end_p50_ms=%s end_to_end_p90_ms=%s"
                            + " rows_p50_ms=%s rows_p90_ms=%s rows_frame_p50_ms=%s http_p50_ms=%s server_took_p50_ms=%s"
                            + " chart_p50_ms=%s chart_p90_ms=%s first_draw_p50_ms=%s draws=%s load=%s text=\"%s\"%n",
                    name, first.get("rows"), list.size(),
                    p(list, "endToEndMs", 50), p(list, "endToEndMs", 90),
                    p(list, "rowsMs", 50), p(list, "rowsMs", 90), p(list, "rowsFrameMs", 50), p(list, "httpMs", 50),
                    p(list, "tookMs", 50),
                    p(list, "chartMs", 50), p(list, "chartMs", 90), p(list, "firstDrawMs", 50), first.get("draws"),
                    loadAverage(), REQUIREMENTS.get(name));
            // what opening the first result asked the server, in the last run: where the chart's time goes
            for (Map<String, Object> request : (List<Map<String, Object>>) list.get(list.size() - 1).get("requests")) {
                System.out.printf(Locale.ROOT, "BENCH page-find-request requirement=%s start_ms=%s end_ms=%s path=%s%n",
                        name, ms(number(request, "startMs")), ms(number(request, "endMs")), request.get("path"));
            }
        });
    }

    /**
     * One search as a user makes it on a freshly opened page: Search pressed (t0) → the shortlist rows rendered
     * (mark {@code sieve:results-rendered}); then the first row's material opened (t1) → its chart drawn for the
     * last time (the last {@code sieve:chart-drawn} before {@code sieve:material-shown}: the measured curves, then
     * the curve rescaled to the row's thickness). End to end = both spans, without the user's own pause between.
     */
    @SuppressWarnings("unchecked")
    private Map<String, Object> findOnce(String requirement) {
        browser.open(port, "/");
        return searchAndOpenFirst(requirement);
    }

    @SuppressWarnings("unchecked")
    private Map<String, Object> searchAndOpenFirst(String requirement) {
        return (Map<String, Object>) ((JavascriptExecutor) browser.driver()).executeAsyncScript(PAGE_HELPERS + """
                const [requirement, done] = arguments;
                (async () => {
                  document.getElementById('search-limit').value = '20';
                  document.getElementById('requirement-text').value = requirement;
                  let answer = null;
                  document.getElementById('search-results')
                    .addEventListener('shortlist', (e) => { answer = e.detail; }, { once: true });
                  performance.clearMarks();
                  performance.clearResourceTimings();
                  const t0 = performance.now();
                  document.getElementById('search-button').click();
                  const rendered = await waitFor(() => marks('sieve:results-rendered', t0)[0]);
                  // the frame after the rows: the task that rendered them (and told Compare and the address) is over
                  const rowsFrameMs = (await nextFrame()) - t0;
                  const http = performance.getEntriesByType('resource').find((e) => /\\/api\\/search$/.test(e.name));
                  const open = document.querySelector('#results-table tbody tr[data-result-material-id] button.material-link');
                  const t1 = performance.now();
                  open.click();
                  const shown = await waitFor(() => marks('sieve:material-shown', t1)[0]);
                  const draws = marks('sieve:chart-drawn', t1).filter((m) => m.startTime <= shown.startTime);
                  const rowsMs = rendered.startTime - t0;
                  const chartMs = draws[draws.length - 1].startTime - t1;
                  done({ rowsMs, rowsFrameMs, chartMs, endToEndMs: rowsMs + chartMs, firstDrawMs: draws[0].startTime - t1,
                    draws: draws.length, httpMs: http ? http.responseEnd - http.startTime : -1,
                    tookMs: answer ? answer.tookMs : -1,
                    requests: performance.getEntriesByType('resource').filter((e) => e.startTime >= t1)
                      .map((e) => ({ path: new URL(e.name).pathname + new URL(e.name).search,
                        startMs: e.startTime - t1, endMs: e.responseEnd - t1 })),
                    rows: document.querySelectorAll('#results-table tbody tr[data-result-material-id]').length });
                })().catch((e) => done({ error: String(e) }));
                """, requirement);
    }

    @Test
    void twentyCurvesOfAThousandPointsAgainstOne() throws Exception {
        importOverlayCurves();
        browser.open(port, "/");
        browser.script("document.getElementById('search-limit').value = '20'");
        String requirement = OVERLAY_WORD + " passes over 1% at 600 nm";
        List<String> rows = browser.search(requirement);
        if (rows.size() != OVERLAY_CURVES) {
            throw new IllegalStateException("the worded search should offer the " + OVERLAY_CURVES
                    + " synthetic materials, offered " + rows.size());
        }
        browser.waiting().until(d -> d.findElement(By.id("compare")).isDisplayed());
        for (org.openqa.selenium.WebElement row : browser.resultRows()) {
            String sample = row.getDomAttribute("data-sample-id");
            int points = JSON.readTree(PageBrowser.get(port, "/api/samples/" + sample + "/curve").body())
                    .path("wavelengthsNm").size();
            if (points != OVERLAY_POINTS) {
                throw new IllegalStateException("sample " + sample + " holds " + points + " points, not " + OVERLAY_POINTS);
            }
        }
        int runs = intProperty("bench.overlayRuns", 7);
        int frames = intProperty("bench.overlayFrames", 240);
        // the first 20-curve draw fetches the 20 curves; later draws use the page's cache
        Map<String, Object> cold = overlayOnce(OVERLAY_CURVES, 0);
        overlayOnce(1, 0);
        Map<Integer, List<Map<String, Object>>> timings = new LinkedHashMap<>();
        for (int i = 0; i < runs; i++) {
            for (int n : new int[] {1, OVERLAY_CURVES}) {
                timings.computeIfAbsent(n, k -> new ArrayList<>()).add(overlayOnce(n, frames));
            }
        }
        if (Boolean.getBoolean("bench.overlayProfile")) {
            profile("page-overlay curves=" + OVERLAY_CURVES, () -> overlayOnce(OVERLAY_CURVES, frames));
        }
        browser.screenshot("page-speed-overlay-20", "compare");
        timings.forEach((n, list) -> {
            double[] intervals = list.stream().flatMap(m -> ((List<Number>) m.get("intervals")).stream())
                    .mapToDouble(Number::doubleValue).toArray();
            double[] redraws = list.stream().flatMap(m -> ((List<Number>) m.get("redraws")).stream())
                    .mapToDouble(Number::doubleValue).toArray();
            System.out.printf(Locale.ROOT, "BENCH page-overlay curves=%d points_per_curve=%d runs=%d"
                            + " first_draw_p50_ms=%s first_draw_p90_ms=%s first_draw_cold_ms=%s"
                            + " frame_p50_ms=%s frame_p90_ms=%s frame_max_ms=%s frames=%d frames_over_50ms=%d"
                            + " redraw_p50_ms=%s redraw_p90_ms=%s redraw_max_ms=%s redraws=%d load=%s%n",
                    n, OVERLAY_POINTS, list.size(), p(list, "firstDrawMs", 50), p(list, "firstDrawMs", 90),
                    n == OVERLAY_CURVES ? ms(number(cold, "firstDrawMs")) : "-",
                    ms(percentile(intervals, 50)), ms(percentile(intervals, 90)), ms(max(intervals)), intervals.length,
                    Arrays.stream(intervals).filter(v -> v > 50).count(),
                    ms(percentile(redraws, 50)), ms(percentile(redraws, 90)), ms(max(redraws)), redraws.length,
                    loadAverage());
        });
    }

    /**
     * Ticks the first {@code n} rows of the Compare list at once (one change event, as a last tick) and times the
     * chart's first draw from that tick ({@code sieve:compare-drawn}); then, for {@code frames} animation frames,
     * drives the chart as a user would: the cursor swept across the plot every frame, a drag-to-zoom (mouse down,
     * three moves, up: uPlot's setScale) and a double click back to the whole range every twelve frames. Frame
     * times are the intervals between requestAnimationFrame callbacks; a redraw is a zoom or reset's event to
     * its {@code sieve:compare-drawn} mark.
     */
    @SuppressWarnings("unchecked")
    private Map<String, Object> overlayOnce(int n, int frames) {
        Map<String, Object> result = (Map<String, Object>) ((JavascriptExecutor) browser.driver()).executeAsyncScript(
                PAGE_HELPERS + """
                const [n, frames, done] = arguments;
                (async () => {
                  const boxes = [...document.querySelectorAll('#compare-rows input[type=checkbox]')];
                  document.getElementById('compare-none').click();
                  await nextFrame();
                  performance.clearMarks();
                  boxes.forEach((b, i) => { b.checked = i < n; });
                  const t0 = performance.now();
                  boxes[n - 1].dispatchEvent(new Event('change'));
                  const drawn = await waitFor(() => marks('sieve:compare-drawn', t0)[0]);
                  const firstDrawMs = drawn.startTime - t0;
                  await waitFor(() => document.getElementById('compare-status').textContent.endsWith('compared'));
                  const series = Number(document.getElementById('compare-chart').dataset.series);
                  await nextFrame();
                  const over = document.querySelector('#compare-chart .u-over');
                  over.scrollIntoView({ block: 'center' });
                  await nextFrame();
                  const r = over.getBoundingClientRect();
                  const at = (f) => ({ clientX: r.left + r.width * f, clientY: r.top + r.height * 0.5 });
                  const mouse = (target, type, f, dx = 0) => target.dispatchEvent(new MouseEvent(type,
                    { bubbles: true, cancelable: true, button: 0, buttons: type === 'mouseup' ? 0 : 1,
                      movementX: dx, movementY: 0, ...at(f) }));
                  const intervals = [];
                  const sent = [];
                  let last = null;
                  for (let i = 0; i < frames; i++) {
                    const ts = await nextFrame();
                    if (last !== null) intervals.push(ts - last);
                    last = ts;
                    const phase = i % 12;
                    const from = 0.15 + 0.5 * ((i * 7) % 12) / 12;
                    if (phase === 0) mouse(over, 'mousedown', from);
                    else if (phase <= 3) mouse(over, 'mousemove', from + 0.08 * phase, 5);
                    else if (phase === 4) { sent.push(performance.now()); mouse(document, 'mouseup', from + 0.24); }
                    else if (phase === 8) { sent.push(performance.now()); mouse(over, 'dblclick', 0.5); }
                    else mouse(over, 'mousemove', ((i * 13) % 100) / 100, 3);
                  }
                  const drawMarks = marks('sieve:compare-drawn', t0);
                  const redraws = sent.map((t) => drawMarks.find((m) => m.startTime >= t))
                    .map((m, k) => (m ? m.startTime - sent[k] : null)).filter((v) => v !== null);
                  done({ firstDrawMs, series, intervals, redraws, asked: sent.length });
                })().catch((e) => done({ error: String(e) }));
                """, n, frames);
        if (result.containsKey("error")) {
            throw new IllegalStateException("overlay of " + n + ": " + result.get("error"));
        }
        if (number(result, "series") != n) {
            throw new IllegalStateException("asked for " + n + " curves, the chart drew " + result.get("series"));
        }
        return result;
    }

    /**
     * Runs {@code step} under Chromium's JavaScript sampling profiler (DevTools protocol) and prints the twenty
     * functions with the most self time: {@code BENCH page-profile of=<what> self_ms=<x> function=<name> at=<file:line>}.
     * Layout, style and paint show as "(program)"; the profile finds where the page's own scripts spend the time.
     */
    @SuppressWarnings("unchecked")
    private void profile(String what, Runnable step) {
        org.openqa.selenium.chromium.HasCdp cdp = (org.openqa.selenium.chromium.HasCdp) browser.driver();
        cdp.executeCdpCommand("Profiler.enable", Map.of());
        cdp.executeCdpCommand("Profiler.setSamplingInterval", Map.of("interval", 100));
        cdp.executeCdpCommand("Profiler.start", Map.of());
        step.run();
        Map<String, Object> profile = (Map<String, Object>) cdp.executeCdpCommand("Profiler.stop", Map.of()).get("profile");
        cdp.executeCdpCommand("Profiler.disable", Map.of());
        Map<Long, String> names = new java.util.HashMap<>();
        for (Map<String, Object> node : (List<Map<String, Object>>) profile.get("nodes")) {
            Map<String, Object> frame = (Map<String, Object>) node.get("callFrame");
            String url = String.valueOf(frame.get("url"));
            names.put(((Number) node.get("id")).longValue(), (String.valueOf(frame.get("functionName")).isEmpty()
                    ? "(anonymous)" : frame.get("functionName")) + " at=" + url.substring(url.lastIndexOf('/') + 1)
                    + ":" + (((Number) frame.get("lineNumber")).intValue() + 1));
        }
        List<Number> samples = (List<Number>) profile.get("samples");
        List<Number> deltas = (List<Number>) profile.get("timeDeltas");
        Map<String, Double> self = new java.util.HashMap<>();
        for (int i = 0; i + 1 < samples.size(); i++) {
            // a sample's time runs until the next sample
            self.merge(names.get(samples.get(i).longValue()), deltas.get(i + 1).doubleValue() / 1000.0, Double::sum);
        }
        self.entrySet().stream().sorted(Map.Entry.<String, Double>comparingByValue().reversed()).limit(20)
                .forEach(e -> System.out.printf(Locale.ROOT, "BENCH page-profile of=\"%s\" self_ms=%s function=%s%n",
                        what, ms(e.getValue()), e.getKey()));
    }

    /** Helpers shared by the page scripts: marks after a time, a poll until something is there, the next frame. */
    private static final String PAGE_HELPERS = """
            const marks = (name, after) => performance.getEntriesByName(name, 'mark').filter((m) => m.startTime >= after);
            const nextFrame = () => new Promise((resolve) => requestAnimationFrame(resolve));
            const waitFor = (test, timeoutMs = 60000) => new Promise((resolve, reject) => {
              const start = performance.now();
              const poll = () => {
                const value = test();
                if (value) resolve(value);
                else if (performance.now() - start > timeoutMs) reject(new Error('timed out: ' + test));
                else setTimeout(poll, 2);
              };
              poll();
            });
            """;

    /**
     * Twenty invented, illustrative films (no real product), each a curve of 1,000 points from 200 to 1199 nm:
     * a logistic absorption edge placed 10 nm further along for each, with a small ripple so that no two
     * neighbouring points lie on one line. Stored through the import endpoint, as a user's files would be.
     */
    private void importOverlayCurves() throws IOException, InterruptedException {
        HttpClient http = HttpClient.newHttpClient();
        for (int k = 0; k < OVERLAY_CURVES; k++) {
            StringBuilder csv = new StringBuilder("# sample: illustrative overlay benchmark film " + k
                    + "\nwavelength_nm,transmittance\n");
            double edge = 300 + 10 * k;
            for (int i = 0; i < OVERLAY_POINTS; i++) {
                int nm = 200 + i;
                double t = 0.02 + 0.88 / (1 + Math.exp(-(nm - edge) / 8.0)) + 0.01 * Math.sin(nm / 7.0 + k);
                csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.6f", t)).append('\n');
            }
            Map<String, String> fields = new LinkedHashMap<>();
            fields.put("materialName", String.format(Locale.ROOT, "Illustrative %s film %02d", OVERLAY_WORD, k + 1));
            fields.put("materialClass", "film");
            fields.put("scaling", "bulk");
            fields.put("indexN", "1.5");
            fields.put("thicknessMm", "0.1");
            HttpResponse<String> answer = http.send(multipart(fields, csv.toString()), HttpResponse.BodyHandlers.ofString());
            if (answer.statusCode() != 201) {
                throw new IllegalStateException("import refused: " + answer.statusCode() + " " + answer.body());
            }
        }
    }

    private HttpRequest multipart(Map<String, String> fields, String file) {
        String boundary = "----sieve-page-speed-bench";
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        fields.forEach((k, v) -> out.writeBytes(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"" + k
                + "\"\r\n\r\n" + v + "\r\n").getBytes(StandardCharsets.UTF_8)));
        out.writeBytes(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"overlay.csv\""
                + "\r\nContent-Type: text/csv\r\n\r\n").getBytes(StandardCharsets.UTF_8));
        out.writeBytes(file.getBytes(StandardCharsets.UTF_8));
        out.writeBytes(("\r\n--" + boundary + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/imports"))
                .header("Content-Type", "multipart/form-data; boundary=" + boundary)
                .POST(HttpRequest.BodyPublishers.ofByteArray(out.toByteArray())).build();
    }

    // ---------- statistics (the bench package's BenchStats is package-private there) ----------

    private static String p(List<Map<String, Object>> list, String key, double percentile) {
        for (Map<String, Object> m : list) {
            if (m.containsKey("error")) {
                throw new IllegalStateException("a timed run failed: " + m.get("error"));
            }
        }
        return ms(percentile(list.stream().mapToDouble(m -> number(m, key)).toArray(), percentile));
    }

    private static double number(Map<String, Object> m, String key) {
        Object v = m.get(key);
        if (!(v instanceof Number number)) {
            throw new IllegalStateException("no " + key + " in " + m);
        }
        return number.doubleValue();
    }

    /** The nearest-rank percentile, as BenchStats takes it. */
    static double percentile(double[] values, double p) {
        if (values.length == 0) {
            return Double.NaN;
        }
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        int index = (int) Math.ceil(p / 100.0 * sorted.length) - 1;
        return sorted[Math.max(0, Math.min(sorted.length - 1, index))];
    }

    private static double max(double[] values) {
        return Arrays.stream(values).max().orElse(Double.NaN);
    }

    private static String ms(double value) {
        return String.format(Locale.ROOT, "%.1f", value);
    }

    /** The machine's one-minute load average when the line is printed: these figures mean little without it. */
    private static String loadAverage() {
        try {
            return java.nio.file.Files.readString(java.nio.file.Path.of("/proc/loadavg")).split(" ")[0];
        } catch (IOException | RuntimeException e) {
            return "unknown";
        }
    }

    private static int intProperty(String name, int fallback) {
        return Integer.parseInt(System.getProperty(name, String.valueOf(fallback)));
    }
}
