package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The example requirements the page offers as chips (web/search.js, on the classpath as static/search.js)
 * are read by the parser as they stand, so a change to the language cannot leave the page offering a
 * requirement it then refuses.
 */
class SearchExamplesReadTest {

    private static final Pattern EXAMPLE_TEXT = Pattern.compile("\\{\\s*text:\\s*'((?:[^'\\\\]|\\\\.)*)'");

    @Test
    void everyExampleChipReadsAsARequirement() throws IOException {
        List<String> examples = examples();
        assertThat(examples).as("examples found in search.js").hasSizeGreaterThanOrEqualTo(5);
        for (String example : examples) {
            assertThat(RequirementParser.parse(example, SpectrumLookup.builtIn(), MaterialClass.KNOWN).clauses())
                    .as(example).isNotEmpty();
        }
    }

    private static List<String> examples() throws IOException {
        try (InputStream in = SearchExamplesReadTest.class.getResourceAsStream("/static/search.js")) {
            assertThat(in).as("static/search.js on the classpath").isNotNull();
            String js = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            String block = js.substring(js.indexOf("const EXAMPLES = ["), js.indexOf("];", js.indexOf("const EXAMPLES = [")));
            List<String> texts = new ArrayList<>();
            Matcher m = EXAMPLE_TEXT.matcher(block);
            while (m.find()) {
                texts.add(m.group(1).replace("\\'", "'"));
            }
            return texts;
        }
    }
}
