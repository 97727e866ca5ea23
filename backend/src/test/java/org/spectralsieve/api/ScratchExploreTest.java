package org.spectralsieve.api;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.TestPropertySource;

@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:scratch;DB_CLOSE_DELAY=-1")
class ScratchExploreTest {
    @Autowired SearchService search;

    @Test
    void explore() {
        for (String text : List.of(
                "blocks under 1% at 405 nm behind 4 mm clear float glass",
                "blocks under 1% at 405 nm, behind 4 mm clear float glass",
                "blocks under 1% at 405 nm and passes over 70% of illuminant a, behind 4 mm clear float glass",
                "blocks under 1% at 405 nm and mean over 70% from 450 to 650 nm, behind 4 mm clear float glass",
                "passes over 85% of led 365",
                "passes over 85% of led 365, thickness 1 to 6 mm",
                "erythemal under 1%",
                "uv hazard under 0.1%",
                "critical wavelength over 370 nm",
                "erythemal under 1% and passes over 80% of led 405, thickness 1 to 6 mm",
                "blocks under 1% of led 405 and passes over 60% of illuminant a, thickness 1 to 6 mm, behind 4 mm clear float glass",
                "passes over 80% at 365 nm and erythemal under 5%, thickness 1 to 6 mm")) {
            long t0 = System.nanoTime();
            Shortlist s;
            try {
                s = search.search(RequirementParser.parse(text), 8);
            } catch (RuntimeException e) {
                System.out.println("XX " + text + " -> " + e);
                continue;
            }
            System.out.printf("== %s (%.0f ms, %d samples) layer=%s%n", text, (System.nanoTime() - t0) / 1e6, s.evaluatedSamples(),
                    s.layer().map(l -> l.describe()).orElse("-"));
            for (RankedRow r : s.rows()) {
                System.out.printf("  %d %s %s d=%.3f feas=%s m=%.3f | %s%n", r.position(), r.materialName(), r.evaluation().verdict(),
                        r.evaluation().thicknessMm(), r.evaluation().feasibleMm(), r.evaluation().worstMarginDecades(),
                        r.evaluation().clauses().stream().map(c -> c.explanation()).toList());
            }
        }
    }
}
