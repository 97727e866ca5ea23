package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The ranking order (our own definition, no external source): verdict, then margin, then name, then sample id. */
class RankingTest {

    private static final Clause ANY = ClauseEvaluatorTest.point(Direction.PASS, 405, 0.5);

    private static MaterialEvaluation row(long materialId, String name, long sampleId, Verdict verdict, double margin) {
        ClauseResult clause = new ClauseResult(ANY, 0.5, 0.5, margin, verdict, "illustrative");
        SampleEvaluation e = new SampleEvaluation(sampleId, 2, null, verdict, margin, Double.isNaN(margin) ? -1 : 0,
                List.of(clause));
        return new MaterialEvaluation(materialId, name, e);
    }

    /** Expected order, best first. */
    private static final List<MaterialEvaluation> EXPECTED = List.of(
            row(1, "alder acrylic", 11, Verdict.MEETS, 1.2),
            row(2, "birch glass", 21, Verdict.MEETS, 0.3),
            row(3, "Cedar film", 31, Verdict.MEETS, 0.0),       // tie on margin: names case-insensitive c < d
            row(4, "dune film", 41, Verdict.MEETS, 0.0),
            row(5, "elm sheet", 51, Verdict.UNVERIFIED, 0.5),   // unverified after every meets, whatever the margin
            row(6, "fir sheet", 61, Verdict.UNVERIFIED, -2.0),
            row(7, "ash sheet", 71, Verdict.UNVERIFIED, Double.NaN), // NaN last among unverified
            row(8, "gum plate", 81, Verdict.MISSES, -0.1),      // the least-missing miss first
            row(9, "hazel plate", 91, Verdict.MISSES, -3.0),
            row(10, "hazel plate", 92, Verdict.MISSES, -3.0));  // same name and margin (a twin material): lower sample id

    @Test
    void rankingOrdersMeetsThenUnverifiedThenMissesByMarginNameAndId() {
        List<MaterialEvaluation> shuffled = new ArrayList<>(EXPECTED);
        Collections.shuffle(shuffled, new Random(42));
        List<RankedRow> rows = Ranking.rank(shuffled, 100);
        assertThat(rows).extracting(RankedRow::materialId).containsExactly(1L, 2L, 3L, 4L, 5L, 6L, 7L, 8L, 9L, 10L);
        assertThat(rows).extracting(RankedRow::position).containsExactly(1, 2, 3, 4, 5, 6, 7, 8, 9, 10);
    }

    @Test
    void eachMaterialAppearsOnceWithItsBestSample() {
        List<MaterialEvaluation> input = List.of(
                row(1, "alder acrylic", 12, Verdict.MISSES, -0.2),
                row(1, "alder acrylic", 13, Verdict.MEETS, 0.1),
                row(1, "alder acrylic", 11, Verdict.MEETS, 0.1),   // same margin: lower sample id wins
                row(2, "birch glass", 21, Verdict.MEETS, 0.05));
        List<RankedRow> rows = Ranking.rank(input, 10);
        assertThat(rows).hasSize(2);
        assertThat(rows.get(0).materialId()).isEqualTo(1);
        assertThat(rows.get(0).evaluation().sampleId()).isEqualTo(11);
        assertThat(rows.get(1).materialId()).isEqualTo(2);
    }

    @Test
    void limitCutsTheListAfterOrdering() {
        List<MaterialEvaluation> reversed = new ArrayList<>(EXPECTED);
        Collections.reverse(reversed);
        List<RankedRow> rows = Ranking.rank(reversed, 3);
        assertThat(rows).extracting(RankedRow::materialId).containsExactly(1L, 2L, 3L);
    }

    @Test
    void orderIsUsableOnAnyRowTypeWithTheSameResult() {
        record Lite(Standing v, double m, String name, long id) {
        }
        List<Lite> lite = new ArrayList<>(EXPECTED.stream().map(e -> new Lite(e.evaluation().standing(),
                e.evaluation().worstMarginDecades(), e.materialName(), e.evaluation().sampleId())).toList());
        Collections.shuffle(lite, new Random(7));
        lite.sort(RankingOrder.of(Lite::v, Lite::m, Lite::name, Lite::id));
        assertThat(lite).extracting(Lite::id).containsExactly(11L, 21L, 31L, 41L, 51L, 61L, 71L, 81L, 91L, 92L);
    }
}
