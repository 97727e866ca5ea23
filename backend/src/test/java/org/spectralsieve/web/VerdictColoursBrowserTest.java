package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * Verdicts are never carried by colour alone, and their colours stay apart for the common colour-vision
 * deficiencies (docs/accessibility.md). Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-a11y;DB_CLOSE_DELAY=-1")
class VerdictColoursBrowserTest {

    private static final String REQUIREMENT =
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
    private static final List<String> VERDICTS = List.of("meets", "unverified", "misses");
    private static final Pattern BADGE = Pattern.compile("([✓?✗])\\s*(meets|unverified|misses)");
    private static final Pattern RGB = Pattern.compile("rgba?\\((\\d+), (\\d+), (\\d+)");

    /*
     * Machado, Oliveira & Fernandes (2009), "A physiologically-based model for simulation of color vision
     * deficiency", IEEE TVCG 15(6): the severity-1.0 matrices, applied to linear sRGB. Written from memory; each
     * row sums to 1 (white stays white), which the test checks.
     */
    private static final double[][] PROTANOPIA = {
            {0.152286, 1.052583, -0.204868}, {0.114503, 0.786281, 0.099216}, {-0.003882, -0.048116, 1.051998}};
    private static final double[][] DEUTERANOPIA = {
            {0.367322, 0.860646, -0.227968}, {0.280085, 0.672501, 0.047413}, {-0.011820, 0.042940, 0.968881}};
    private static final double[][] TRITANOPIA = {
            {1.255528, -0.076749, -0.178779}, {-0.078411, 0.930809, 0.147602}, {0.004733, 0.691367, 0.303900}};
    private static final double[][] TYPICAL = {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}};
    /**
     * CIELAB ΔE*ab between two badge outlines that must tell them apart at a glance. About 2.3 is a just-noticeable
     * difference (Sharma, "Digital Color Imaging Handbook", 2003); 20 is "clearly different colours": our choice.
     */
    private static final double APART = 20;

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
    void everyVerdictBadgeSaysItsVerdictWithASymbolAndAWord() {
        page.open(port, "/");
        WebElementText[] badges = badges();
        assertThat(badges).isNotEmpty();
        for (WebElementText badge : badges) {
            Matcher m = BADGE.matcher(badge.text());
            assertThat(m.matches()).as("badge text '%s'", badge.text()).isTrue();
            assertThat(m.group(2)).isEqualTo(badge.verdict());
        }
        Set<String> seen = java.util.Arrays.stream(badges).map(WebElementText::verdict).collect(Collectors.toSet());
        assertThat(seen).as("verdicts shown on the demo library's shortlist").hasSizeGreaterThanOrEqualTo(2);
    }

    @Test
    void verdictOutlinesStayApartForRedGreenAndBlueYellowColourBlindness() {
        page.open(port, "/");
        @SuppressWarnings("unchecked")
        Map<String, String> borders = (Map<String, String>) page.script("""
                const out = {};
                for (const v of arguments[0]) {
                  const badge = document.createElement('span');
                  badge.className = 'verdict verdict-' + v;
                  document.body.append(badge);
                  out[v] = getComputedStyle(badge).borderTopColor;
                  badge.remove();
                }
                return out;""", VERDICTS);
        for (double[][] matrix : List.of(PROTANOPIA, DEUTERANOPIA, TRITANOPIA)) {
            for (double[] row : matrix) {
                assertThat(row[0] + row[1] + row[2]).isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-5));
            }
        }
        Map<String, double[][]> visions = Map.of("typical", TYPICAL, "protanopia", PROTANOPIA,
                "deuteranopia", DEUTERANOPIA, "tritanopia", TRITANOPIA);
        for (var vision : visions.entrySet()) {
            for (int i = 0; i < VERDICTS.size(); i++) {
                for (int j = i + 1; j < VERDICTS.size(); j++) {
                    String a = VERDICTS.get(i);
                    String b = VERDICTS.get(j);
                    double difference = deltaE(lab(simulate(vision.getValue(), rgb(borders.get(a)))),
                            lab(simulate(vision.getValue(), rgb(borders.get(b)))));
                    assertThat(difference).as("ΔE*ab of the %s and %s outlines (%s, %s) for %s vision", a, b,
                            borders.get(a), borders.get(b), vision.getKey()).isGreaterThanOrEqualTo(APART);
                }
            }
        }
    }

    private record WebElementText(String verdict, String text) {
    }

    /** Every verdict badge of the shortlist, the hidden clause rows' included, as its verdict and its text. */
    private WebElementText[] badges() {
        page.search(REQUIREMENT);
        @SuppressWarnings("unchecked")
        List<Map<String, String>> found = (List<Map<String, String>>) page.script("""
                return [...document.querySelectorAll('#results-table .verdict')].map((b) =>
                  ({ verdict: b.dataset.verdict, text: b.textContent.trim() }));""");
        return found.stream().map(m -> new WebElementText(m.get("verdict"), m.get("text")))
                .toArray(WebElementText[]::new);
    }

    private static double[] rgb(String css) {
        Matcher m = RGB.matcher(css);
        assertThat(m.find()).as("a computed colour: %s", css).isTrue();
        return new double[] {Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)), Integer.parseInt(m.group(3))};
    }

    /** The colour as seen with the deficiency: sRGB → linear → matrix → clipped, still linear. */
    private static double[] simulate(double[][] matrix, double[] srgb) {
        double[] linear = new double[3];
        for (int c = 0; c < 3; c++) {
            linear[c] = toLinear(srgb[c] / 255);
        }
        double[] seen = new double[3];
        for (int r = 0; r < 3; r++) {
            double v = matrix[r][0] * linear[0] + matrix[r][1] * linear[1] + matrix[r][2] * linear[2];
            seen[r] = Math.max(0, Math.min(1, v));
        }
        return seen;
    }

    /** IEC 61966-2-1 (sRGB) transfer function. */
    private static double toLinear(double v) {
        return v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4);
    }

    /** CIELAB (CIE 15:2004) from linear sRGB, D65 white; matrix of IEC 61966-2-1. */
    private static double[] lab(double[] linear) {
        double x = 0.4124 * linear[0] + 0.3576 * linear[1] + 0.1805 * linear[2];
        double y = 0.2126 * linear[0] + 0.7152 * linear[1] + 0.0722 * linear[2];
        double z = 0.0193 * linear[0] + 0.1192 * linear[1] + 0.9505 * linear[2];
        double fx = f(x / 0.95047);
        double fy = f(y);
        double fz = f(z / 1.08883);
        return new double[] {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
    }

    private static double f(double t) {
        return t > 216.0 / 24389 ? Math.cbrt(t) : (24389.0 / 27 * t + 16) / 116;
    }

    private static double deltaE(double[] a, double[] b) {
        return Math.sqrt(Math.pow(a[0] - b[0], 2) + Math.pow(a[1] - b[1], 2) + Math.pow(a[2] - b[2], 2));
    }
}
