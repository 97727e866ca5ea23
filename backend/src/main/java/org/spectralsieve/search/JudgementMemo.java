package org.spectralsieve.search;

import java.lang.ref.WeakReference;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.LongAdder;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.CrossingFinder;
import org.spectralsieve.requirement.JudgementPath;
import org.spectralsieve.requirement.MarginReuse;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.SampleJudge;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.weighting.FigurePath;

/**
 * Recent exact judgements of one sample, kept and handed out again for the same question
 * (docs/judgement-memo.md). A shared lab asks the same requirements over and over (presets, page refreshes,
 * several people), and judging one sample is a pure function of its arguments:
 * {@link SampleEvaluator#evaluate(Candidate, Requirement, Optional, ThicknessInterval)} reads the candidate (the
 * sample's curve and record, its material's name, index, made thicknesses and scaling), the requirement as
 * parsed, the resolved layer and the span, and nothing else. So the key is those arguments themselves, never a
 * version number that a write might forget to raise: a write that changes anything the judgement reads
 * changes its arguments, and the old entry can no longer be found.
 *
 * <ul>
 *   <li><b>Candidate</b>: every record field by value; its curve by identity (curves are immutable, so the same
 *       object is the same readings; a curve read again is another object: a miss, never a wrong hit). The
 *       curve is held weakly, so the memo never keeps a curve alive that the snapshot's cache dropped.</li>
 *   <li><b>Question</b>: the requirement by value, the resolved layer by value (its curve by content), and the
 *       emitter and response objects of weighted clauses by identity: {@link Weighting.Spectral} compares
 *       them by name only, and an imported spectrum deleted and imported again under the same name is another
 *       object. Also the process-wide benchmark switches of the evaluator's arithmetic and of its thickness solves (root finder, margins reused) (equal answers by their
 *       own tests, kept in the key all the same). Each distinct question gets a number never used again.</li>
 *   <li><b>Span</b>: the thicknesses the sample speaks for among its material's samples, by value.</li>
 * </ul>
 * Judgements are kept only for a question an earlier search asked too (admitted on the second ask): a new
 * threshold every time would only churn the memo. A judgement that throws is not kept. Bounded: at most {@code maxEntries} judgements (least recently used
 * first out) and {@value #QUESTIONS} questions; thread-safe (one lock per map, held only to look up or put).
 */
public final class JudgementMemo implements SampleJudge {

    /** Judgements kept by default (setting {@code sieve.search.judgement-memo-entries}); bytes: docs/judgement-memo.md. */
    public static final int DEFAULT_ENTRIES = 8192;
    /** Distinct questions numbered at once; an evicted question's entries can no longer be found and age out. */
    static final int QUESTIONS = 128;

    private final int maxEntries;
    private final boolean keyOnSampleIdOnly;
    private final Map<SampleKey, SampleEvaluation> entries;
    private final Map<Question, Asked> questions;
    private final AtomicLong nextQuestion = new AtomicLong();
    private final LongAdder hits = new LongAdder();
    private final LongAdder misses = new LongAdder();
    private final LongAdder unkept = new LongAdder();

    public JudgementMemo(int maxEntries) {
        this(maxEntries, false);
    }

    private JudgementMemo(int maxEntries, boolean keyOnSampleIdOnly) {
        if (maxEntries < 1) {
            throw new IllegalArgumentException("a judgement memo keeps at least one entry, was " + maxEntries);
        }
        this.maxEntries = maxEntries;
        this.keyOnSampleIdOnly = keyOnSampleIdOnly;
        this.entries = new LinkedHashMap<>(16, 0.75f, true) {
            @Override
            protected boolean removeEldestEntry(Map.Entry<SampleKey, SampleEvaluation> eldest) {
                return size() > JudgementMemo.this.maxEntries;
            }
        };
        this.questions = new LinkedHashMap<>(16, 0.75f, true) {
            @Override
            protected boolean removeEldestEntry(Map.Entry<Question, Asked> eldest) {
                return size() > QUESTIONS;
            }
        };
    }

    /**
     * A deliberately unsound memo for tests only: keyed on the question, the sample id and the span, blind to
     * the sample's curve and record and to its material; an edit between two searches then gets a stale hit,
     * which the equivalence test must catch.
     */
    static JudgementMemo staleKeyedForTests(int maxEntries) {
        return new JudgementMemo(maxEntries, true);
    }

    /** Whether the service keeps a memo: on unless {@code -Dsieve.search.judgement-memo=false} (benchmarks). */
    static boolean enabledByDefault() {
        return !"false".equals(System.getProperty("sieve.search.judgement-memo"));
    }

    /** The entries by default, or {@code -Dsieve.search.judgement-memo-entries}. */
    static int entriesByDefault() {
        return Integer.getInteger("sieve.search.judgement-memo-entries", DEFAULT_ENTRIES);
    }

    @Override
    public SampleEvaluation evaluate(Candidate candidate, Requirement requirement, Optional<StackLayer> layer,
                                     ThicknessInterval span) {
        if (!candidate.states().isEmpty()) {
            // curves in other states (aged, printed) are read from the database per search and are not part of the
            // key: such a judgement is made afresh each time (few samples have them)
            unkept.increment();
            return SampleEvaluator.evaluate(candidate, requirement, layer, span);
        }
        Asked asked = asked(requirement, layer);
        if (!asked.again()) {
            // a question seen once so far: judged and not kept (a shared lab repeats questions; a new threshold each
            // time would only churn the memo, and its entries through the collector)
            unkept.increment();
            return SampleEvaluator.evaluate(candidate, requirement, layer, span);
        }
        SampleKey key = new SampleKey(asked.number(), candidate, span, keyOnSampleIdOnly);
        SampleEvaluation kept;
        synchronized (entries) {
            kept = entries.get(key);
        }
        if (kept != null) {
            hits.increment();
            return kept;
        }
        misses.increment();
        SampleEvaluation judged = SampleEvaluator.evaluate(candidate, requirement, layer, span);
        synchronized (entries) {
            entries.put(key, judged);
        }
        return judged;
    }

    /**
     * The question's number, and whether it was asked before (by an earlier search). A search passes the same
     * requirement and layer objects for every sample it judges, so the last few are recognised by identity first
     * (immutable records: the same objects are the same question, with the same switches): comparing a layer's curve
     * by content for every sample cost as much as judging it. A question not recognised so is counted as asked once
     * more: once per search ({@link #searchStarts} forgets the recent ones), more often when threads race or another
     * search starts meanwhile (then kept a search early; only the speed depends on it).
     */
    private Asked asked(Requirement requirement, Optional<StackLayer> layer) {
        boolean reference = JudgementPath.reference();
        boolean byLookup = FigurePath.byLookup();
        boolean earlier = PerPointArithmetic.earlier();
        // the thickness solves' switches as one number: root finder (bisection or ITP), margins reused or not
        int solve = (CrossingFinder.bisection() ? 1 : 0) | (MarginReuse.enabled() ? 2 : 0);
        Recent[] seen = recent;
        for (Recent r : seen) {
            if (r != null && r.requirement == requirement && r.layer == layer && r.reference == reference
                    && r.byLookup == byLookup && r.earlier == earlier && r.solve == solve) {
                return r.asked;
            }
        }
        Question q = Question.of(requirement, layer, reference, byLookup, earlier, solve);
        Asked asked;
        synchronized (questions) {
            Asked before = questions.get(q);
            asked = before == null ? new Asked(nextQuestion.getAndIncrement(), false) : new Asked(before.number(), true);
            questions.put(q, asked);
        }
        Recent[] next = new Recent[RECENT];
        next[0] = new Recent(requirement, layer, reference, byLookup, earlier, solve, asked);
        System.arraycopy(seen, 0, next, 1, RECENT - 1);
        recent = next; // a lost race forgets one recent question: the next call finds it through the map
        return asked;
    }

    /**
     * A search begins: the recent questions are forgotten, so a caller that searches the same requirement object
     * again is counted as asking again. A search in flight on another thread then finds its question through the
     * map once more (counted as one more ask: kept a search early at most; only the speed depends on it).
     */
    void searchStarts() {
        recent = new Recent[RECENT];
    }

    /** A question's number, never reused, and whether an earlier search asked it too. */
    private record Asked(long number, boolean again) {
    }

    /** Questions recognised by identity before the map is asked. */
    private static final int RECENT = 8;
    private volatile Recent[] recent = new Recent[RECENT];

    /** A recent question's objects, its switches and what the map said of it. */
    private record Recent(Requirement requirement, Optional<StackLayer> layer, boolean reference, boolean byLookup,
                          boolean earlier, int solve, Asked asked) {
    }

    /** Hits and misses since the memo was made, and the entries kept now. */
    public Counts counts() {
        int size;
        synchronized (entries) {
            size = entries.size();
        }
        int asked;
        synchronized (questions) {
            asked = questions.size();
        }
        return new Counts(hits.sum(), misses.sum(), unkept.sum(), size, maxEntries, asked);
    }

    public int maxEntries() {
        return maxEntries;
    }

    /**
     * @param hits      judgements handed out again; {@code misses} judged now and kept
     * @param unkept    judged now and not kept: their question was asked for the first time
     * @param questions distinct questions numbered now (at most {@value #QUESTIONS})
     */
    public record Counts(long hits, long misses, long unkept, int entries, int maxEntries, int questions) {

        public double hitRate() {
            long all = hits + misses + unkept;
            return all == 0 ? 0 : (double) hits / all;
        }
    }

    /**
     * What the judgement reads besides the sample and span. The requirement by value; the spectra its weighted
     * clauses integrate by identity (their equality is by name); the layer by value; the evaluator's switches.
     */
    private record Question(Requirement requirement, Optional<StackLayer> layer, Identities spectra,
                            boolean referencePath, boolean figureByLookup, boolean earlierArithmetic,
                            int solveSwitches) {

        static Question of(Requirement requirement, Optional<StackLayer> layer, boolean referencePath,
                           boolean figureByLookup, boolean earlierArithmetic, int solveSwitches) {
            List<Object> spectra = new ArrayList<>();
            for (Clause c : requirement.clauses()) {
                if (c instanceof WeightedClause w && w.weighting() instanceof Weighting.Spectral s) {
                    spectra.add(s.emitter());
                    spectra.add(s.response().orElse(null));
                }
            }
            return new Question(requirement, layer, new Identities(spectra.toArray()), referencePath, figureByLookup,
                    earlierArithmetic, solveSwitches);
        }
    }

    /** Objects compared by identity, element by element. */
    private static final class Identities {
        private final Object[] objects;
        private final int hash;

        Identities(Object[] objects) {
            this.objects = objects;
            int h = 1;
            for (Object o : objects) {
                h = 31 * h + System.identityHashCode(o);
            }
            this.hash = h;
        }

        @Override
        public boolean equals(Object o) {
            if (!(o instanceof Identities other) || other.objects.length != objects.length) {
                return false;
            }
            for (int i = 0; i < objects.length; i++) {
                if (objects[i] != other.objects[i]) {
                    return false;
                }
            }
            return true;
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }

    /** One judgement's arguments: the question's number, the candidate (curve by identity, held weakly), the span. */
    private static final class SampleKey {
        private final long question;
        private final long sampleId;
        private final long materialId;
        private final String materialName;
        private final long thicknessBits;
        private final boolean bulk;
        private final RefractiveIndex index;
        private final MadeThicknesses made;
        private final boolean totalTransmittance;
        private final String notRescaledReason;
        private final WeakReference<Curve> curve;
        private final long spanLoBits;
        private final long spanHiBits;
        private final boolean sampleIdOnly;
        private final int hash;

        SampleKey(long question, Candidate c, ThicknessInterval span, boolean sampleIdOnly) {
            this.question = question;
            this.sampleId = c.sampleId();
            this.materialId = c.materialId();
            this.materialName = c.materialName();
            this.thicknessBits = Double.doubleToLongBits(c.thicknessMm());
            this.bulk = c.bulk();
            this.index = c.index();
            this.made = c.made();
            this.totalTransmittance = c.totalTransmittance();
            this.notRescaledReason = c.notRescaledReason();
            this.curve = new WeakReference<>(c.measured());
            this.spanLoBits = Double.doubleToLongBits(span.loMm());
            this.spanHiBits = Double.doubleToLongBits(span.hiMm());
            this.sampleIdOnly = sampleIdOnly;
            this.hash = sampleIdOnly
                    ? Arrays.hashCode(new long[] {question, sampleId, spanLoBits, spanHiBits})
                    : Objects.hash(question, sampleId, materialId, materialName, thicknessBits, bulk, index, made,
                            totalTransmittance, notRescaledReason, System.identityHashCode(c.measured()), spanLoBits,
                            spanHiBits);
        }

        @Override
        public boolean equals(Object o) {
            if (!(o instanceof SampleKey k) || k.hash != hash || k.question != question || k.sampleId != sampleId
                    || k.spanLoBits != spanLoBits || k.spanHiBits != spanHiBits) {
                return false;
            }
            if (sampleIdOnly) {
                return true;
            }
            Curve mine = curve.get();
            // a collected curve matches nothing: that sample's next judgement is judged again
            return mine != null && mine == k.curve.get() && k.materialId == materialId
                    && k.thicknessBits == thicknessBits && k.bulk == bulk
                    && k.totalTransmittance == totalTransmittance && materialName.equals(k.materialName)
                    && Objects.equals(index, k.index) && made.equals(k.made)
                    && Objects.equals(notRescaledReason, k.notRescaledReason);
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }
}
