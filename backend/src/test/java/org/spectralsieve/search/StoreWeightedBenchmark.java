package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.OdCode;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.SyntheticCurves;

/**
 * Weighted requirements over a synthetic store of a million curves, without the database (which cannot hold
 * a million samples in a benchmark's time): the steps {@link SearchService}'s weighted path takes, on the
 * store's own curves. Step one is the store's screen ({@link WeightedMisses}: every weighted clause's bound
 * per curve, kept where it proves a miss); step two judges exactly ({@link MaterialJudge}, curves decoded
 * from the store) every material not wholly proven missed, then the held materials best bound first while
 * they could still enter the shortlist, as {@code SearchService.searchExactly} does. Prints
 * {@code BENCH store-weighted curves=<n> mode=measured|solve part=screen|whole p50_ms p95_ms proven judged runs}
 * and the store's bytes per curve with the screen; asserts nothing about time. The store is built through
 * {@code SpectralStore.Builder.add} so every curve carries its screen bins (as a loaded library's do).
 * Switches: {@code -Dbench.storeWeightedSizes=10000,1000000}, {@code -Dbench.storeWeightedRuns=3},
 * {@code -Dbench.storeWeightedBase=10000} (stores larger than this repeat its rows: screening a synthetic curve
 * on insertion costs milliseconds), {@code -Dbench.storeWeightedWholeUpTo=30000} (the whole search, with the
 * exact judgement, only up to this size: above it only {@code part=screen}, and {@code judged} counts the
 * curves the screen leaves to judge), {@code -Dbench.limit=20}. Each line names its {@code rule}: {@code current}
 * ({@link WeightedMisses#add}), {@code reference} (the same rule with the arithmetic before the power tables, on
 * one thread) or {@code earlier} ({@link WeightedMisses#addEarlier}), alternated run by run;
 * {@code -Dbench.storeWeightedRules=current,reference} chooses them, {@code -Dbench.storeWeightedSkipEarlier=true}
 * leaves the earlier out, {@code -Dbench.storeWeightedJudging=bounded|earlier} the whole search's judging loop
 * for the current rule (bounded, the service's: {@code BoundedJudgement}; earlier: held misses judged while they
 * could enter), {@code -Dbench.storeWeightedWholeRules=current} runs the whole search for those rules
 * only (the others time their screen alone; above the base size the warm-up screens only). The held materials are judged as the service does: the shortlist's top rows kept up
 * to date from themselves and each newly judged material, ranked once from every judgement at the end.
 * The bounded loop forms the second, exact-curve stage as the service does ({@code -Dbench.storeWeightedSecondStage=false}
 * leaves it out) and takes each material's bound over the samples {@link MaterialJudge} picks; rule {@code samples}
 * is the current screen with each sample a contender of its own where the service makes it one (not in a solved
 * range), beside {@code current} (materials whole) and {@code before} (materials whole, one second bound at a time:
 * the loop before issue 14's sixth pass), {@code settled} is {@code samples} with the rows known to be "not judged"
 * from their thicknesses waiting last ({@link SettledRows}), {@code bar} is {@code settled} with a material's second
 * bounds formed only up to the bar it must reach ({@link BoundedJudgement.Refiner}), {@code codes} is {@code bar}
 * reading the store's figure codes with the contenders below the cut in a reserve, and {@code decoded} is {@code codes}
 * with each curve decoded once per search (the second bound and the judgement share it) and a sample judged alone
 * decoding only its own curve, as the service does (its snapshot's curve cache; {@code prepare(…, only)}); {@code codes}
 * and {@code decoded} (and every earlier rule) screen as the ninth pass did ({@code -Dsieve.store.bins-in-the-code-pass=false}
 * around their searches), {@code tenth} is {@code decoded} with the tenth pass's screen (the code pass in blocks of
 * curves, clause after clause, with the bins of an unknown lower end in the same block) and a solve's P(x) and Q(x) from
 * the bins alone ({@code -Dsieve.store.solve-from-codes=false} around its searches), {@code eleventh} is {@code tenth}
 * with a solve's bounds over thickness from the figure codes, split around their crossing, the bins of the first stage
 * read only where the codes prove no miss (the eleventh pass), {@code crossing} is {@code eleventh} with the bins read on
 * every curve ({@code -Dsieve.store.solve-codes-first=false}), {@code twelfth} is {@code eleventh} with a solve's contenders
 * formed from the snapshot's per-material arrays (made thicknesses and records formed once per store, as the service's
 * snapshot holds them) and only for the materials whose largest first bound reaches a cut, the rest in a reserve, over
 * a first stage that leaves the bins unread where the codes prove no miss and reads them only for the materials that
 * could reach the cut ({@link #solveContenders}, {@code WeightedMisses.screenWithBinsDeferred}; the twelfth pass), and
 * {@code arrays} is {@code twelfth} with the bins read on every curve (the eleventh pass's screen). Each line's {@code same_rows} says whether that rule's
 * rows equalled the first rule's in every run. {@code -Dbench.storeWeightedModes=measured,solve} chooses the
 * requirements; {@code -Dbench.debug=true} prints, per whole search, the contenders, second bounds formed and the
 * time in them and in the exact judgement, and the last row. The default base of 10,000 rows is not a multiple of three:
 * each copy above it groups the rows into materials shifted by one row, so its library is not
 * {@link ServiceWeightedBenchmark}'s (100 exact copies of 9,999 curves at 1M); {@code -Dbench.storeWeightedBase=9999}
 * makes it that library (save one index per curve here) and the two {@code judged} counts comparable.
 */
class StoreWeightedBenchmark {

    static final String WEIGHTED = "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%";
    private static final int BATCH = 8192;
    private static final java.util.concurrent.atomic.AtomicLong REFINE_NS = new java.util.concurrent.atomic.AtomicLong();
    private static final java.util.concurrent.atomic.AtomicLong JUDGE_NS = new java.util.concurrent.atomic.AtomicLong();
    private static final java.util.concurrent.atomic.AtomicLong REFINES = new java.util.concurrent.atomic.AtomicLong();
    /** Curves given a second bound (a material contender forms one per curve it refines). */
    private static final java.util.concurrent.atomic.AtomicLong CURVES_REFINED = new java.util.concurrent.atomic.AtomicLong();
    /** Reserves of contenders the judging loop reached and formed (rule {@code codes}). */
    private static final java.util.concurrent.atomic.AtomicLong RESERVES_FORMED = new java.util.concurrent.atomic.AtomicLong();
    /** Each synthetic curve's refractive index (the store keeps its own copy, not public): judged as stored. */
    private static final Map<SpectralStore, byte[]> INDEX_OF_CURVE = new java.util.IdentityHashMap<>();

    @Test
    void weightedSearchesOverAMillionCurves() {
        int limit = intProperty("bench.limit", 20);
        int runs = intProperty("bench.storeWeightedRuns", 3);
        // screening every curve of a synthetic library (Builder.add) takes milliseconds per curve: larger
        // stores repeat the rows of one this size (codes and screen bins carried over, new materials)
        int base = intProperty("bench.storeWeightedBase", 10_000);
        // the exact judgement of what the screen leaves takes minutes per search at a million curves
        int wholeUpTo = intProperty("bench.storeWeightedWholeUpTo", 30_000);
        Map<String, Requirement> modes = new java.util.LinkedHashMap<>();
        modes.put("measured", RequirementParser.parse(WEIGHTED));
        modes.put("solve", RequirementParser.parse(WEIGHTED + ", thickness 1 to 6 mm"));
        List<String> chosenModes = Arrays.asList(System.getProperty("bench.storeWeightedModes", "measured,solve").split(","));
        modes.keySet().retainAll(chosenModes);
        for (String size : System.getProperty("bench.storeWeightedSizes", "10000,1000000").split(",")) {
            if (size.isBlank()) {
                continue;
            }
            int n = Integer.parseInt(size.trim());
            long t0 = System.nanoTime();
            SpectralStore store = n <= base ? screenedStore(n, 20261202L) : repeated(screenedStore(base, 20261202L), n);
            System.out.printf(Locale.ROOT, "BENCH store-weighted-setup curves=%d build_s=%.1f bytes_per_curve=%.0f%n", n,
                    (System.nanoTime() - t0) / 1e9, store.bytesPerCurve());
            for (Map.Entry<String, Requirement> mode : modes.entrySet()) {
                boolean judge = n <= wholeUpTo;
                // the current rule, its arithmetic before the power tables (reference) and the earlier rule
                // (WeightedMisses.addEarlier), alternated run by run
                String[] rules = Arrays.stream(System.getProperty("bench.storeWeightedRules", "current,reference,earlier")
                                .split(",")).map(String::trim)
                        .filter(r -> !(r.equals("earlier") && Boolean.getBoolean("bench.storeWeightedSkipEarlier")))
                        .toArray(String[]::new);
                // the whole search only for these rules (the exact judgement is the same work whichever rule
                // screened: the same misses are proven); the others time their screen alone
                List<String> wholeRules = Arrays.asList(System.getProperty("bench.storeWeightedWholeRules",
                        String.join(",", rules)).split(","));
                for (String rule : rules) {
                    search(store, mode.getValue(), limit, judge && n <= base, rule); // warm-up (the screen only above the base size)
                }
                double[][] screen = new double[rules.length][runs];
                double[][] whole = new double[rules.length][runs];
                Outcome[] last = new Outcome[rules.length];
                boolean[] sameRows = new boolean[rules.length];
                Arrays.fill(sameRows, true);
                for (int r = 0; r < runs; r++) {
                    for (int v = 0; v < rules.length; v++) {
                        last[v] = search(store, mode.getValue(), limit, judge && wholeRules.contains(rules[v]), rules[v]);
                        // every rule's answer against the first rule's, run by run (only the work may differ)
                        sameRows[v] &= last[v].rows().isEmpty() || last[0].rows().isEmpty()
                                || last[v].rows().equals(last[0].rows());
                        screen[v][r] = last[v].screenMs;
                        whole[v][r] = last[v].wholeMs;
                    }
                }
                for (int v = 0; v < rules.length; v++) {
                    Arrays.sort(screen[v]);
                    Arrays.sort(whole[v]);
                    boolean judged = judge && wholeRules.contains(rules[v]);
                    for (String part : judged ? new String[] {"screen", "whole"} : new String[] {"screen"}) {
                        double[] ms = part.equals("screen") ? screen[v] : whole[v];
                        System.out.printf(Locale.ROOT, "BENCH store-weighted curves=%d mode=%s part=%s p50_ms=%.1f p95_ms=%.1f"
                                        + " proven=%d judged=%d runs=%d rule=%s judging=%s same_rows=%s%n", n, mode.getKey(), part, ms[runs / 2],
                                ms[Math.min(runs - 1, (int) Math.ceil(runs * 0.95) - 1)], last[v].proven, last[v].judged,
                                runs, rules[v], judged && List.of("current", "samples", "before", "settled", "bar", "codes", "decoded", "tenth", "eleventh", "crossing", "twelfth", "arrays").contains(rules[v])
                                        ? System.getProperty("bench.storeWeightedJudging", "bounded") : "earlier", sameRows[v]);
                    }
                }
            }
        }
    }

    /** @param rows the answer's rows (sample, standing, margin) when judged, for {@code same_rows}; empty otherwise */
    private record Outcome(double screenMs, double wholeMs, int proven, int judged, List<String> rows) {

        Outcome(double screenMs, double wholeMs, int proven, int judged) {
            this(screenMs, wholeMs, proven, judged, List.of());
        }
    }

    private static List<String> rowsOf(List<RankedRow> rows) {
        return rows.stream().map(r -> r.evaluation().sampleId() + " " + r.evaluation().standing() + " "
                + r.evaluation().worstMarginDecades()).toList();
    }

    /** Rule {@code arrays}: the twelfth pass's contenders over a screen that reads the bins on every curve. */
    private static final ThreadLocal<Boolean> NO_DEFERRED_BINS = ThreadLocal.withInitial(() -> false);

    /** One weighted search the service's way, on the store's curves. */
    private static Outcome search(SpectralStore store, Requirement requirement, int limit, boolean judge,
                                  String rule) {
        return searchOnce(store, requirement, limit, judge, rule);
    }

    private static Outcome searchOnce(SpectralStore store, Requirement requirement, int limit, boolean judge,
                                      String rule) {
        long t0 = System.nanoTime();
        if (judge && rule.equals("before") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // the loop before this pass: materials whole, one second bound at a time
            System.setProperty("sieve.search.second-bounds-in-parallel", "false");
            try {
                return searchBounded(store, requirement, limit, t0, false, false, false, false, false);
            } finally {
                System.clearProperty("sieve.search.second-bounds-in-parallel");
            }
        }
        if (judge && rule.equals("codes") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // the ninth pass: the store's figure codes and the contenders below the cut formed on demand
            ninthPassScreen(true);
            try {
                return searchBounded(store, requirement, limit, t0, true, true, true, true, false);
            } finally {
                ninthPassScreen(false);
            }
        }
        if (judge && rule.equals("decoded") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // the tenth pass: rule codes with each curve decoded once per search, and a sample judged alone
            // decoding only its own curve, as the service does (its snapshot's curve cache, prepare(…, only))
            ninthPassScreen(true);
            try {
                return searchBounded(store, requirement, limit, t0, true, true, true, true, true);
            } finally {
                ninthPassScreen(false);
            }
        }
        if (judge && rule.equals("tenth") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // rule decoded with the bins of a block's unknown lower end read in the screen's pass over the codes; a
            // solve's P(x) and Q(x) from the bins alone, as before the eleventh pass
            System.setProperty("sieve.store.solve-from-codes", "false");
            try {
                return searchBounded(store, requirement, limit, t0, true, true, true, true, true);
            } finally {
                System.clearProperty("sieve.store.solve-from-codes");
            }
        }
        if (judge && rule.equals("eleventh") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // rule tenth with a solve's bounds over thickness from the figure codes, split around their crossing
            return searchBounded(store, requirement, limit, t0, true, true, true, true, true);
        }
        if (judge && rule.equals("twelfth") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // rule eleventh with a solve's contenders formed from the snapshot's per-material arrays, those below a cut
            // in a reserve formed only if the judging loop reaches them (the twelfth pass)
            return searchBounded(store, requirement, limit, t0, true, true, true, true, true, true);
        }
        if (judge && rule.equals("arrays") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // rule twelfth with the bins read on every curve the codes prove no miss on (the screen of the eleventh
            // pass): isolates the deferred bins
            NO_DEFERRED_BINS.set(true);
            try {
                return searchBounded(store, requirement, limit, t0, true, true, true, true, true, true);
            } finally {
                NO_DEFERRED_BINS.set(false);
            }
        }
        if (judge && rule.equals("crossing") && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            // rule eleventh with the bins read on every curve of a solve's first stage, even where the codes prove a miss
            System.setProperty("sieve.store.solve-codes-first", "false");
            try {
                return searchBounded(store, requirement, limit, t0, true, true, true, true, true);
            } finally {
                System.clearProperty("sieve.store.solve-codes-first");
            }
        }
        if (!rule.equals("codes") && !rule.equals("decoded") && !rule.equals("tenth") && !rule.equals("eleventh")
                && !rule.equals("crossing") && !rule.equals("twelfth") && !rule.equals("arrays")) {
            // every rule before the ninth pass screens with the bins alone (WeightedScreen.figureCodesOn)
            System.setProperty("sieve.store.figure-codes", "false");
        }
        ninthPassScreen(true);
        try {
            return searchBefore(store, requirement, limit, judge, rule, t0);
        } finally {
            System.clearProperty("sieve.store.figure-codes");
            ninthPassScreen(false);
        }
    }

    /**
     * The screen as before the tenth pass (on) or the default (off): the code pass curve by curve with the bins of an
     * unknown lower end in a pass of their own.
     */
    private static void ninthPassScreen(boolean on) {
        for (String p : List.of("sieve.store.bins-in-the-code-pass")) {
            if (on) {
                System.setProperty(p, "false");
            } else {
                System.clearProperty(p);
            }
        }
    }

    private static Outcome searchBefore(SpectralStore store, Requirement requirement, int limit, boolean judge,
                                        String rule, long t0) {
        if (judge && (rule.equals("current") || rule.equals("samples") || rule.equals("settled") || rule.equals("bar"))
                && !"earlier".equals(System.getProperty("bench.storeWeightedJudging", "bounded"))) {
            return searchBounded(store, requirement, limit, t0, !rule.equals("current"),
                    rule.equals("settled") || rule.equals("bar"), rule.equals("bar"), false, false);
        }
        Map<Long, Double> proven = new HashMap<>();
        switch (rule) {
            case "earlier" -> WeightedMisses.addEarlier(proven, store, requirement, Optional.empty());
            case "reference" -> WeightedMisses.add(proven, store, requirement, Optional.empty(), false, true);
            case "current", "samples", "before", "settled", "bar", "codes", "decoded", "tenth", "eleventh", "crossing", "twelfth", "arrays" -> WeightedMisses.add(proven, store, requirement, Optional.empty());
            default -> throw new IllegalArgumentException("rule " + rule);
        }
        long t1 = System.nanoTime();
        if (!judge) {
            int left = 0;
            for (int c = 0; c < store.size(); c++) {
                left += proven.containsKey(store.sampleId(c)) ? 0 : 1;
            }
            return new Outcome((t1 - t0) / 1e6, Double.NaN, proven.size(), left);
        }
        List<MaterialEvaluation> exact = new ArrayList<>();
        List<double[]> held = new ArrayList<>(); // {first curve, bound}
        int judged = 0;
        for (int first = 0; first < store.size(); first += 3) {
            int end = Math.min(store.size(), first + 3);
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            for (int c = first; c < end; c++) {
                Double b = proven.get(store.sampleId(c));
                allMiss &= b != null;
                bound = b == null ? bound : Math.max(bound, b);
            }
            if (allMiss) {
                held.add(new double[] {first, bound});
            } else {
                exact.addAll(judge(store, first, end, requirement));
                judged += end - first;
            }
        }
        List<RankedRow> rows = Ranking.rank(exact, limit);
        held.sort((a, b) -> Double.compare(b[1], a[1]));
        boolean judgedHeld = false;
        for (double[] h : held) {
            if (!couldEnter(rows, limit, h[1])) {
                break;
            }
            int first = (int) h[0];
            List<MaterialEvaluation> more = judge(store, first, Math.min(store.size(), first + 3), requirement);
            judged += more.size();
            exact.addAll(more);
            judgedHeld = true;
            // as the service: the top rows from themselves and the newly judged material, not every judgement
            List<MaterialEvaluation> union = new ArrayList<>();
            rows.forEach(row -> union.add(new MaterialEvaluation(row.materialId(), row.materialName(), row.evaluation())));
            union.addAll(more);
            rows = Ranking.rank(union, limit);
        }
        if (judgedHeld) {
            rows = Ranking.rank(exact, limit);
        }
        long t2 = System.nanoTime();
        if (rows.isEmpty()) {
            throw new IllegalStateException("no rows");
        }
        return new Outcome((t1 - t0) / 1e6, (t2 - t0) / 1e6, proven.size(), judged, rowsOf(rows));
    }

    /**
     * The exact judgement the service's way since materials are ranked by their bounds
     * ({@link BoundedJudgement}, {@code SearchService.searchExactly}): each material of three curves a contender
     * whose bound is the largest of its curves' margin bounds ({@link WeightedMisses#marginBounds}, of either
     * sign), judged from the largest bound down on both cores from {@link BoundedJudgement#PARALLEL_FROM}
     * materials, left out once the rows are full of rows it cannot beat. The current rule's screen only
     * ({@code -Dbench.storeWeightedJudging=earlier}: the loop before, held proven misses judged while they could enter).
     */
    private static Outcome searchBounded(SpectralStore store, Requirement requirement, int limit, long t0,
                                         boolean samplesAsContenders, boolean settledRows, boolean toTheBar,
                                         boolean reserve, boolean decodeOnce) {
        return searchBounded(store, requirement, limit, t0, samplesAsContenders, settledRows, toTheBar, reserve,
                decodeOnce, false);
    }

    /**
     * @param solveReserve over a range, the materials' contenders formed from the snapshot's per-material arrays
     *                     ({@link Snapshot}), and only for the materials whose largest first bound over every row
     *                     reaches a cut; the others wait in a {@link BoundedJudgement.Reserve} ({@link #solveContenders})
     */
    private static Outcome searchBounded(SpectralStore store, Requirement requirement, int limit, long t0,
                                         boolean samplesAsContenders, boolean settledRows, boolean toTheBar,
                                         boolean reserve, boolean decodeOnce, boolean solveReserve) {
        // the curves this search decodes: once each, shared by the second bound and the judgement (the service's
        // snapshot keeps a cache of the curves it judged), or decoded at each use as before the tenth pass. Only as
        // measured: a solve refines tens of thousands of curves, more than the service's bounded cache would keep
        // (here unbounded, ~23 KB a decoded curve), and judges whole materials
        java.util.concurrent.ConcurrentHashMap<Integer, Curve> decoded = new java.util.concurrent.ConcurrentHashMap<>();
        java.util.function.IntFunction<Curve> curves = decodeOnce && requirement.thickness().kind() == ThicknessSpec.Kind.AS_MEASURED
                ? c -> decoded.computeIfAbsent(c, store::curve) : store::curve;
        // the screen: each curve's bound of either sign; a negative one is a proven miss (WeightedMisses.add),
        // and the second stage of the same search (its queries), as SearchService.searchExactly forms them
        ThicknessSpec spec = requirement.thickness();
        boolean fromArrays = solveReserve && settledRows && spec.kind() == ThicknessSpec.Kind.RANGE;
        // the twelfth pass: a solve's first stage stops at the codes' bound where they prove no miss; the bins are read
        // only for the curves of materials that could reach the rows (solveContenders)
        // deferred only where the first set read in full (the largest 4·k materials' codes' bounds) leaves materials
        // unread: on a smaller store every bin would be read all the same, after a pass over the codes more
        boolean deferring = !NO_DEFERRED_BINS.get() && (store.size() + 2) / 3 > 4 * (SOLVE_RESERVE_AFTER + 4 * limit);
        WeightedMisses.DeferredBins deferredBins = fromArrays
                ? WeightedMisses.screenWithBinsDeferred(store, requirement, deferring) : null;
        WeightedMisses.Screen screen = deferredBins != null ? new WeightedMisses.Screen(deferredBins.bounds(), deferredBins.secondStage())
                : WeightedMisses.screen(store, requirement, Optional.empty(), false, true);
        double[] bounds = screen.bounds();
        WeightedMisses.SecondStage second = Boolean.parseBoolean(System.getProperty("bench.storeWeightedSecondStage", "true"))
                ? screen.secondStage() : null;
        long t1b = System.nanoTime();
        int provenCount = 0;
        // a solved range judges a material's samples together (their rows share its feasible interval and advice)
        boolean bySample = samplesAsContenders && spec.kind() != ThicknessSpec.Kind.RANGE;
        List<BoundedJudgement.Contender> contenders = new ArrayList<>();
        BoundedJudgement.Reserve later = null;
        boolean lazy = reserve && bySample && spec.kind() == ThicknessSpec.Kind.AS_MEASURED;
        if (lazy) {
            // as SearchService: each material's largest sample bound; those below the cut wait in a reserve
            int materials = (store.size() + 2) / 3;
            double[] materialBound = new double[materials];
            for (int m = 0; m < materials; m++) {
                double bound = Double.NEGATIVE_INFINITY;
                for (int c = 3 * m; c < Math.min(store.size(), 3 * m + 3); c++) {
                    double margin = c < bounds.length && !Double.isNaN(bounds[c]) ? bounds[c] : Double.POSITIVE_INFINITY;
                    provenCount += margin < 0 ? 1 : 0;
                    bound = Math.max(bound, margin);
                }
                materialBound[m] = bound;
            }
            double cut = BoundedJudgement.kthLargest(materialBound, materials, SearchService.RESERVE_AFTER + 4 * limit);
            // as SearchService: the materials below the cut by index in a plain array (not one boxed number each)
            int[] rest = new int[materials];
            int restCount = 0;
            double restBound = Double.NEGATIVE_INFINITY;
            for (int m = 0; m < materials; m++) {
                if (materialBound[m] >= cut) {
                    addSampleContenders(contenders, store, 3 * m, Math.min(store.size(), 3 * m + 3), bounds, spec);
                } else {
                    rest[restCount++] = m;
                    restBound = Math.max(restBound, materialBound[m]);
                }
            }
            int inRest = restCount;
            if (inRest > 0) {
                later = new BoundedJudgement.Reserve(restBound, () -> {
                    RESERVES_FORMED.incrementAndGet();
                    List<BoundedJudgement.Contender> formed = new ArrayList<>();
                    for (int i = 0; i < inRest; i++) {
                        int m = rest[i];
                        addSampleContenders(formed, store, 3 * m, Math.min(store.size(), 3 * m + 3), bounds, spec);
                    }
                    return formed;
                });
            }
        }
        if (fromArrays) {
            SolveContenders formed = solveContenders(store, deferredBins, spec, limit);
            contenders = formed.now();
            later = formed.later();
            provenCount = formed.proven();
        }
        for (int first = 0; first < (lazy || fromArrays ? 0 : store.size()); first += 3) {
            int end = Math.min(store.size(), first + 3);
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            boolean[] judgedHere = judgedSamples(store, first, end, spec);
            for (int c = first; c < end; c++) {
                double margin = c < bounds.length && !Double.isNaN(bounds[c]) ? bounds[c] : Double.POSITIVE_INFINITY;
                allMiss &= margin < 0;
                provenCount += margin < 0 ? 1 : 0;
                // as the service: the largest bound over the samples MaterialJudge judges (a sample not judged
                // gives no row)
                bound = judgedHere[c - first] ? Math.max(bound, margin) : bound;
            }
            StoredMaterial m = store.material(first);
            // the synthetic materials state no made thicknesses (MadeThicknesses.of(List.of(), …) in judge), so a
            // bulk one is made at an asked thickness only as measured: as the service's madeFor, a proven miss
            // of a bulk material at a thickness is not "at best a valued miss"
            boolean made = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(first);
            if (settledRows && settledOverRange(store, first, end, spec)) {
                // as SearchService: a material whose every row is "not judged" from its thicknesses waits last
                contenders.add(new BoundedJudgement.Contender(material(m, first), Double.NEGATIVE_INFINITY, false, false,
                        true, Double.NEGATIVE_INFINITY, BoundedJudgement.WHOLE_MATERIAL, true));
            } else if (bySample) {
                // as SearchService: each sample the judgement picks a contender of its own, with its own bound
                for (int c = first; c < end; c++) {
                    double margin = c < bounds.length && !Double.isNaN(bounds[c]) ? bounds[c] : Double.POSITIVE_INFINITY;
                    if (judgedHere[c - first]) {
                        contenders.add(new BoundedJudgement.Contender(material(m, first), margin, margin < 0 && made,
                                false, false, Double.POSITIVE_INFINITY, store.sampleId(c)));
                    }
                }
            } else {
                contenders.add(new BoundedJudgement.Contender(material(m, first), bound, allMiss && made, false));
            }
        }
        java.util.Queue<WeightedMisses.SecondStage> idle = new java.util.concurrent.ConcurrentLinkedQueue<>();
        if (second != null) {
            idle.add(second);
        }
        long tc = System.nanoTime();
        java.util.concurrent.atomic.AtomicInteger judged = new java.util.concurrent.atomic.AtomicInteger();
        List<MaterialEvaluation> exact = BoundedJudgement.judgeContenders(contenders, later, limit,
                new BoundedJudgement.Ranker(list -> Ranking.rank(list, limit), null),
                contender -> {
                    int first = (int) ((contender.material().id() - 1) * 3);
                    long j0 = System.nanoTime();
                    List<MaterialEvaluation> rows = contender.oneSample()
                            ? judgeOne(store, first, Math.min(store.size(), first + 3), requirement, contender.sampleId(),
                                    curves, decodeOnce)
                            : judge(store, first, Math.min(store.size(), first + 3), requirement);
                    JUDGE_NS.addAndGet(System.nanoTime() - j0);
                    judged.addAndGet(rows.size());
                    return rows;
                }, contenders.size() + (later == null ? 0 : store.size()) >= BoundedJudgement.PARALLEL_FROM,
                second == null ? null : (c, bar) -> {
                    long r0 = System.nanoTime();
                    // as the service: a second stage of its own for each second bound formed at the same time
                    WeightedMisses.SecondStage stage = idle.poll();
                    stage = stage != null ? stage
                            : WeightedMisses.secondStage(store, requirement, Optional.empty(), false, true);
                    BoundedJudgement.Contender out = c.oneSample()
                            ? refinedSample(store, c, bounds, stage, spec, toTheBar ? bar : Double.NEGATIVE_INFINITY, curves)
                            : refined(store, c, bounds, stage, spec, toTheBar ? bar : Double.NEGATIVE_INFINITY, curves);
                    idle.add(stage);
                    REFINE_NS.addAndGet(System.nanoTime() - r0);
                    REFINES.incrementAndGet();
                    return out;
                });
        List<RankedRow> rows = Ranking.rank(exact, limit);
        long t2 = System.nanoTime();
        if (rows.isEmpty()) {
            throw new IllegalStateException("no rows");
        }
        if (Boolean.getBoolean("bench.debug")) {
            RankedRow lastRow = rows.get(rows.size() - 1);
            java.util.Map<String, Integer> kinds = new java.util.TreeMap<>();
            for (MaterialEvaluation e : exact) {
                int c = (int) (e.evaluation().sampleId() - 1);
                kinds.merge((store.isBulk(c) ? "bulk " : "fixed ") + e.evaluation().standing()
                        + (bounds[c] < 0 ? " proven" : ""), 1, Integer::sum);
            }
            System.out.printf("DEBUG reserves_formed=%d%n", RESERVES_FORMED.getAndSet(0));
            System.out.printf("DEBUG contenders=%d refines=%d curves_refined=%d refine_ms=%.1f judge_ms=%.1f t_contenders_ms=%.1f%n",
                    contenders.size(), REFINES.getAndSet(0), CURVES_REFINED.getAndSet(0), REFINE_NS.getAndSet(0) / 1e6, JUDGE_NS.getAndSet(0) / 1e6, (tc - t1b) / 1e6);
            System.out.println("DEBUG last=" + lastRow.evaluation().standing() + " " + lastRow.evaluation().worstMarginDecades()
                    + " first=" + rows.get(0).evaluation().worstMarginDecades() + " kinds=" + kinds);
        }
        return new Outcome((t1b - t0) / 1e6, (t2 - t0) / 1e6, provenCount, judged.get(), rowsOf(rows));
    }

    /**
     * What the service's snapshot holds per material, formed once per store (the first search forms it, as a snapshot
     * is formed once per library generation): each material's made thicknesses ({@code SnapshotIndex.Slots#made}) and
     * record. Before the twelfth pass the benchmark formed both per material per search (a boxed list and a stream
     * pipeline each, twice per material), which the service never did.
     */
    private record Snapshot(MadeThicknesses[] made, org.spectralsieve.library.Material[] records) {

        static Snapshot of(SpectralStore store) {
            int materials = (store.size() + 2) / 3;
            MadeThicknesses[] made = new MadeThicknesses[materials];
            org.spectralsieve.library.Material[] records = new org.spectralsieve.library.Material[materials];
            for (int m = 0; m < materials; m++) {
                int first = 3 * m;
                List<Double> measured = new ArrayList<>(3);
                for (int c = first; c < Math.min(store.size(), first + 3); c++) {
                    measured.add(store.thicknessMm(c));
                }
                made[m] = MadeThicknesses.of(List.of(), Double.NaN, Double.NaN, measured);
                records[m] = material(store.material(first), first);
            }
            return new Snapshot(made, records);
        }
    }

    private static final Map<SpectralStore, Snapshot> SNAPSHOTS = new java.util.IdentityHashMap<>();

    private static synchronized Snapshot snapshotOf(SpectralStore store) {
        return SNAPSHOTS.computeIfAbsent(store, Snapshot::of);
    }

    /**
     * Materials formed at the start of a solve, before the others wait in the reserve: the service's as-measured cut
     * (256 + 4·limit) is too tight here, as a solve's loop forms ~1,500 second bounds before its rows end in a bar the
     * rest cannot reach, and a reserve the loop reaches is formed whole (then nothing is saved). Any cut gives the
     * same contenders in the same order (BoundedJudgement.Reserve); this one only changes how much is formed.
     */
    static final int SOLVE_RESERVE_AFTER = 4096;

    /** The contenders formed at once, the reserve (null: none) and the count of proven misses among the rows. */
    private record SolveContenders(List<BoundedJudgement.Contender> now, BoundedJudgement.Reserve later, int proven) {
    }

    /**
     * A solve's contenders (the twelfth pass) from plain arrays: first each material's largest first bound over
     * <em>every</em> row (one pass over the bounds, no object per material), at least the contender's own bound (the
     * largest over the rows {@link MaterialJudge} judges), so a material whose largest lies below the cut can wait in
     * a reserve whose bound is the largest of theirs ({@link BoundedJudgement.Reserve}: every contender in it has a
     * bound no larger). Only the materials at or above the cut (or without a finite bound) are formed now, with the
     * snapshot's made thicknesses, as the loop before formed every one. A material settled "not judged" can wait in
     * the reserve too, although the reserve's contract names none: such a contender waits behind every other in
     * {@link BoundedJudgement#ORDER} whenever it is formed, and a reserve the loop keeps out is kept out by full rows
     * ending in a met row, which keep out every settled contender as well ({@link BoundedJudgement#noneCanEnter}; the
     * rows only improve). So the loop judges the same contenders in the same order as with every one formed first.
     */
    private static SolveContenders solveContenders(SpectralStore store, WeightedMisses.DeferredBins deferredBins,
                                                   ThicknessSpec spec, int limit) {
        Snapshot snapshot = snapshotOf(store);
        double[] bounds = deferredBins.bounds();
        int size = store.size();
        int materials = (size + 2) / 3;
        double[] largest = new double[materials];
        for (int m = 0; m < materials; m++) {
            double bound = Double.NEGATIVE_INFINITY;
            for (int c = 3 * m; c < Math.min(size, 3 * m + 3); c++) {
                bound = Math.max(bound, firstBound(bounds, c));
            }
            largest[m] = bound;
        }
        // the largest over the codes' bounds where the bins were left unread: at least the full bounds' largest, so a
        // material below the cut may wait in the reserve, its bins read only if the loop reaches it. The cut is found
        // again once the bins of the materials above it are read (their bounds only fall), until every material at or
        // above it has its full bounds: so the reserve's bound lies below the contenders formed now
        int k = SOLVE_RESERVE_AFTER + 4 * limit;
        boolean[] full = new boolean[materials];
        int[] above = new int[3 * materials];
        long r0 = System.nanoTime();
        int readNow = readLargestFirst(deferredBins, largest, full, k);
        int rounds = 0;
        double cut;
        // what is left above the cut, until none is (a safety net: the pass above leaves none but the materials
        // without a finite bound, whose rows' bins are not deferred)
        while (true) {
            rounds++;
            cut = BoundedJudgement.kthLargest(largest, materials, k);
            int aboveCount = 0;
            for (int m = 0; m < materials; m++) {
                if (!full[m] && (largest[m] >= cut || Double.isNaN(largest[m]))) {
                    for (int c = 3 * m; c < Math.min(size, 3 * m + 3); c++) {
                        above[aboveCount++] = c;
                    }
                }
            }
            if (aboveCount == 0) {
                break;
            }
            readNow += deferredBins.readInFull(above, aboveCount);
            markReadInFull(above, aboveCount, full, largest, bounds, size);
        }
        double roundsMs = (System.nanoTime() - r0) / 1e6;
        int proven = 0;
        for (double b : bounds) {
            proven += b < 0 ? 1 : 0;
        }
        List<BoundedJudgement.Contender> now = new ArrayList<>();
        int[] rest = new int[materials];
        int restCount = 0;
        double restBound = Double.NEGATIVE_INFINITY;
        // a material formed because a row reaches the cut waits in the reserve all the same when its contender's own
        // bound does not (the rows it judges lie below it; a fixed part's rows measured outside the range have no
        // bound, +∞, and give no row), or when it is settled (bound -∞ whatever its rows' first bounds)
        List<BoundedJudgement.Contender> formedBelow = new ArrayList<>();
        for (int m = 0; m < materials; m++) {
            if (largest[m] >= cut || Double.isNaN(largest[m])) {
                BoundedJudgement.Contender c = materialContender(store, snapshot, m, bounds, spec);
                if (c.settledNotJudged() || c.bound() < cut) {
                    formedBelow.add(c);
                    restBound = c.settledNotJudged() ? restBound : Math.max(restBound, c.bound());
                } else {
                    now.add(c);
                }
            } else {
                rest[restCount++] = m;
                restBound = Math.max(restBound, largest[m]);
            }
        }
        if (Boolean.getBoolean("bench.debug")) {
            System.out.printf(Locale.ROOT, "DEBUG solve_cut=%.6f formed_now=%d formed_into_reserve=%d reserve_unformed=%d"
                    + " bins_read_now=%d rounds=%d rounds_ms=%.1f%n", cut, now.size(), formedBelow.size(), restCount, readNow, rounds, roundsMs);
        }
        if (restCount == 0 && formedBelow.isEmpty()) {
            return new SolveContenders(now, null, proven);
        }
        int waiting = restCount;
        BoundedJudgement.Reserve later = new BoundedJudgement.Reserve(restBound, () -> {
            RESERVES_FORMED.incrementAndGet();
            // their bins first: the contenders then carry the bounds the screen would have formed
            int[] curves = new int[3 * waiting];
            int count = 0;
            for (int i = 0; i < waiting; i++) {
                for (int c = 3 * rest[i]; c < Math.min(size, 3 * rest[i] + 3); c++) {
                    curves[count++] = c;
                }
            }
            deferredBins.readInFull(curves, count);
            List<BoundedJudgement.Contender> formed = new ArrayList<>(waiting + formedBelow.size());
            for (int i = 0; i < waiting; i++) {
                formed.add(materialContender(store, snapshot, rest[i], bounds, spec));
            }
            formed.addAll(formedBelow);
            return formed;
        });
        return new SolveContenders(now, later, proven);
    }

    /**
     * Reads the bins of the materials whose codes' bound could reach the cut, in two sets, each in the order of the
     * store's rows (read in that order a curve's bins share cache lines with its neighbours'; in the order of the bounds
     * each curve's bins were a cache miss apiece): first the materials whose codes' bound is among the largest 4·k;
     * then every other whose codes' bound is at least F, the k-th largest full bound among those read. The cut (the
     * k-th largest full bound of all) is at least F, as more materials only raise a k-th largest, so a material whose
     * codes' bound lies below F — at least its full bounds' largest — is below the cut and need not be read. Marks each
     * material read in {@code full} and sets its {@code largest} to its full bounds' largest; the caller's loop reads
     * whatever else is at or above the cut (the materials without a finite bound, whose rows' bins are not deferred).
     */
    private static int readLargestFirst(WeightedMisses.DeferredBins deferredBins, double[] largest, boolean[] full, int k) {
        int materials = largest.length;
        double[] codes = largest.clone(); // the codes' bounds, as the screen left them
        int[] curves = new int[deferredBins.bounds().length];
        double firstSet = BoundedJudgement.kthLargest(codes, materials, Math.min(4 * k, materials));
        int read = readAtLeast(deferredBins, codes, firstSet, largest, full, curves);
        double[] readBounds = new double[materials];
        int n = 0;
        for (int m = 0; m < materials; m++) {
            if (full[m]) {
                readBounds[n++] = largest[m];
            }
        }
        double lowest = BoundedJudgement.kthLargest(readBounds, n, k);
        return read + readAtLeast(deferredBins, codes, lowest, largest, full, curves);
    }

    /** Reads in full the materials not yet read whose finite codes' bound is at least {@code from}, in row order. */
    private static int readAtLeast(WeightedMisses.DeferredBins deferredBins, double[] codes, double from,
                                   double[] largest, boolean[] full, int[] curves) {
        double[] bounds = deferredBins.bounds();
        int size = bounds.length;
        int n = 0;
        for (int m = 0; m < codes.length; m++) {
            if (!full[m] && Double.isFinite(codes[m]) && codes[m] >= from) {
                for (int c = 3 * m; c < Math.min(size, 3 * m + 3); c++) {
                    curves[n++] = c;
                }
            }
        }
        int read = deferredBins.readInFull(curves, n);
        markReadInFull(curves, n, full, largest, bounds, size);
        return read;
    }

    /** One material's contender over a range, as the loop before formed it, from the snapshot's made thicknesses. */
    private static BoundedJudgement.Contender materialContender(SpectralStore store, Snapshot snapshot, int m,
                                                               double[] bounds, ThicknessSpec spec) {
        int first = 3 * m;
        int end = Math.min(store.size(), first + 3);
        MadeThicknesses made = snapshot.made()[m];
        org.spectralsieve.library.Material record = snapshot.records()[m];
        if (settledOverRange(store, first, end, spec, made)) {
            return new BoundedJudgement.Contender(record, Double.NEGATIVE_INFINITY, false, false,
                    true, Double.NEGATIVE_INFINITY, BoundedJudgement.WHOLE_MATERIAL, true);
        }
        boolean[] judgedHere = judgedSamples(store, first, end, spec, made);
        double bound = Double.NEGATIVE_INFINITY;
        boolean allMiss = true;
        for (int c = first; c < end; c++) {
            double margin = firstBound(bounds, c);
            allMiss &= margin < 0;
            bound = judgedHere[c - first] ? Math.max(bound, margin) : bound;
        }
        boolean madeThere = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(first);
        return new BoundedJudgement.Contender(record, bound, allMiss && madeThere, false);
    }

    /**
     * As {@code SearchService.refined}: each curve's bound lowered by the second stage on its decoded curve, the
     * material's the largest over its three curves (every curve is judged as measured; in a solve the largest over
     * all three holds the service's largest over the curves judged), proven to miss when every bound is negative and
     * it is made at the asked thickness, unable to meet when each curve has a clause unverified on it or a negative
     * bound.
     */
    private static BoundedJudgement.Contender refined(SpectralStore store, BoundedJudgement.Contender c, double[] bounds,
                                                      WeightedMisses.SecondStage second, ThicknessSpec spec, double bar,
                                                      java.util.function.IntFunction<Curve> curves) {
        int first = (int) ((c.material().id() - 1) * 3);
        double bound = Double.NEGATIVE_INFINITY;
        double unverifiedBound = Double.NEGATIVE_INFINITY;
        boolean allMiss = true;
        boolean noneMeets = true;
        int end = Math.min(store.size(), first + 3);
        boolean[] judgedHere = judgedSamples(store, first, end, spec);
        // as the service: against a met last row only the judged curves, largest first bound first, up to the bar
        boolean everySample = !(bar > Double.NEGATIVE_INFINITY);
        List<Integer> order = new ArrayList<>();
        for (int k = first; k < end; k++) {
            if (everySample || judgedHere[k - first]) {
                order.add(k);
            }
        }
        if (!everySample) {
            order.sort((a, b) -> Double.compare(firstBound(bounds, b), firstBound(bounds, a)));
        }
        boolean reached = false;
        for (int k : order) {
            double b = firstBound(bounds, k);
            // as the service: the second stage only for a curve with a first bound (it only tightens one)
            boolean formed = b < Double.POSITIVE_INFINITY && (everySample || !reached && !(b < bar));
            b = formed ? Math.min(b, second.bound(k, curves.apply(k), bar)) : b;
            CURVES_REFINED.addAndGet(formed ? 1 : 0);
            allMiss &= b < 0;
            if (judgedHere[k - first]) {
                bound = Math.max(bound, b);
                reached |= !(b < bar);
                noneMeets &= formed && second.cannotMeet() || b < 0;
                unverifiedBound = Math.max(unverifiedBound, formed ? second.unverifiedBound() : Double.POSITIVE_INFINITY);
            }
        }
        boolean made = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(first);
        return new BoundedJudgement.Contender(c.material(), bound, everySample && allMiss && made, false, noneMeets,
                spec.kind() == ThicknessSpec.Kind.AS_MEASURED ? unverifiedBound : Double.POSITIVE_INFINITY);
    }

    /** As the by-sample branch of the contender loop: each curve of the material a contender of its own (as measured). */
    private static void addSampleContenders(List<BoundedJudgement.Contender> out, SpectralStore store, int first, int end,
                                            double[] bounds, ThicknessSpec spec) {
        StoredMaterial m = store.material(first);
        boolean made = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(first);
        for (int c = first; c < end; c++) {
            double margin = c < bounds.length && !Double.isNaN(bounds[c]) ? bounds[c] : Double.POSITIVE_INFINITY;
            out.add(new BoundedJudgement.Contender(material(m, first), margin, margin < 0 && made,
                    false, false, Double.POSITIVE_INFINITY, store.sampleId(c)));
        }
    }

    /**
     * After {@code curves[0, n)} were read in full: each of their materials (rows of three) not yet marked gets the
     * largest of its rows' full bounds and is marked.
     */
    private static void markReadInFull(int[] curves, int n, boolean[] full, double[] largest, double[] bounds, int size) {
        for (int i = 0; i < n; i++) {
            int m = curves[i] / 3;
            if (!full[m]) {
                full[m] = true;
                double bound = Double.NEGATIVE_INFINITY;
                for (int c = 3 * m; c < Math.min(size, 3 * m + 3); c++) {
                    bound = Math.max(bound, firstBound(bounds, c));
                }
                largest[m] = bound;
            }
        }
    }

    private static double firstBound(double[] bounds, int k) {
        return k < bounds.length && !Double.isNaN(bounds[k]) ? bounds[k] : Double.POSITIVE_INFINITY;
    }

    /** As {@code SearchService.refinedSample}: one curve's bound lowered by the second stage on its decoded curve. */
    private static BoundedJudgement.Contender refinedSample(SpectralStore store, BoundedJudgement.Contender c,
                                                            double[] bounds, WeightedMisses.SecondStage second,
                                                            ThicknessSpec spec, double bar,
                                                            java.util.function.IntFunction<Curve> curves) {
        int k = (int) (c.sampleId() - 1);
        double b = k < bounds.length && !Double.isNaN(bounds[k]) ? bounds[k] : Double.POSITIVE_INFINITY;
        if (!(b < Double.POSITIVE_INFINITY)) {
            return c; // as the service: nothing to tighten
        }
        b = Math.min(b, second.bound(k, curves.apply(k), bar));
        CURVES_REFINED.incrementAndGet();
        boolean made = spec.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(k);
        return new BoundedJudgement.Contender(c.material(), b, b < 0 && made, false, second.cannotMeet() || b < 0,
                spec.kind() == ThicknessSpec.Kind.AS_MEASURED ? second.unverifiedBound() : Double.POSITIVE_INFINITY,
                c.sampleId());
    }

    /**
     * One curve of a material judged alone ({@link MaterialJudge#evaluateOne}). {@code onlyItsCurve}: as the service's
     * {@code prepare(…, only)}, the one sample a candidate (the made thicknesses still from all), its curve from
     * {@code curves}; else (before the tenth pass) every curve of the material decoded, the others there for the choice.
     */
    private static List<MaterialEvaluation> judgeOne(SpectralStore store, int from, int to, Requirement requirement,
                                                     long sampleId, java.util.function.IntFunction<Curve> curves,
                                                     boolean onlyItsCurve) {
        return MaterialJudge.evaluateOne(onlyItsCurve ? candidates(store, from, to, sampleId, curves)
                : candidates(store, from, to), requirement, Optional.empty(), sampleId);
    }

    /** As {@code SearchService.settledOverRange}: every row of the material's curves [from, to) is not judged. */
    private static boolean settledOverRange(SpectralStore store, int from, int to, ThicknessSpec spec) {
        return settledOverRange(store, from, to, spec, null);
    }

    /** {@link #settledOverRange(SpectralStore, int, int, ThicknessSpec)} with the made thicknesses known (null: formed here). */
    private static boolean settledOverRange(SpectralStore store, int from, int to, ThicknessSpec spec, MadeThicknesses known) {
        double[] measured = new double[to - from];
        boolean[] rescalable = new boolean[to - from];
        for (int c = from; c < to; c++) {
            measured[c - from] = store.thicknessMm(c);
            rescalable[c - from] = store.isBulk(c);
        }
        MadeThicknesses made = known != null ? known : MadeThicknesses.of(List.of(), Double.NaN, Double.NaN,
                Arrays.stream(measured).boxed().toList());
        return SettledRows.overRange(measured, rescalable, made, spec);
    }

    /** Which of the material's curves [from, to) {@link MaterialJudge#choose} judges, from their thicknesses alone. */
    private static boolean[] judgedSamples(SpectralStore store, int from, int to, ThicknessSpec spec) {
        return judgedSamples(store, from, to, spec, null);
    }

    /** {@link #judgedSamples(SpectralStore, int, int, ThicknessSpec)} with the made thicknesses known (null: formed here). */
    private static boolean[] judgedSamples(SpectralStore store, int from, int to, ThicknessSpec spec, MadeThicknesses known) {
        double[] measured = new double[to - from];
        for (int c = from; c < to; c++) {
            measured[c - from] = store.thicknessMm(c);
        }
        MadeThicknesses made = known != null ? known : MadeThicknesses.of(List.of(), Double.NaN, Double.NaN,
                Arrays.stream(measured).boxed().toList());
        var spans = MaterialJudge.spans(measured, store.isBulk(from), made, spec);
        boolean[] out = new boolean[spans.length];
        for (int i = 0; i < spans.length; i++) {
            out[i] = spans[i] != null;
        }
        return out;
    }

    /**
     * The class of every synthetic material, parsed once: the service reads its materials' records as loaded, so a
     * class parsed per material per search (a regular expression each) timed the benchmark, not the service.
     */
    private static final org.spectralsieve.library.MaterialClass PLASTIC_SHEET =
            org.spectralsieve.library.MaterialClass.of("plastic sheet");

    /** A material record for a synthetic material (its curves are read from the store by id, not from here). */
    private static org.spectralsieve.library.Material material(StoredMaterial m, int firstCurve) {
        return new org.spectralsieve.library.Material(m.id(), "synthetic-" + m.id(), m.name(),
                PLASTIC_SHEET, "", List.of(),
                org.spectralsieve.library.Scaling.BULK, SyntheticCurves.INDICES[0], List.of());
    }

    /** As {@code SearchService.couldEnter}: whether a held material whose bound is {@code bound} could still enter. */
    private static boolean couldEnter(List<RankedRow> rows, int limit, double bound) {
        if (rows.size() < limit) {
            return true;
        }
        RankedRow last = rows.get(rows.size() - 1);
        Standing standing = last.evaluation().standing();
        if (standing.compareTo(Standing.MISSES) < 0) {
            return false;
        }
        if (standing != Standing.MISSES) {
            return true;
        }
        double margin = last.evaluation().worstMarginDecades();
        return Double.isNaN(margin) || bound >= margin;
    }

    private static List<MaterialEvaluation> judge(SpectralStore store, int from, int to, Requirement requirement) {
        return MaterialJudge.evaluate(candidates(store, from, to), requirement, Optional.empty());
    }

    private static List<Candidate> candidates(SpectralStore store, int from, int to) {
        return candidates(store, from, to, BoundedJudgement.WHOLE_MATERIAL, store::curve);
    }

    /** The material's curves [from, to) as candidates, or only sample {@code only}'s (made thicknesses from all). */
    private static List<Candidate> candidates(SpectralStore store, int from, int to, long only,
                                              java.util.function.IntFunction<Curve> curves) {
        byte[] index = INDEX_OF_CURVE.get(store);
        List<Candidate> candidates = new ArrayList<>();
        List<Double> measured = new ArrayList<>();
        for (int c = from; c < to; c++) {
            measured.add(store.thicknessMm(c));
        }
        MadeThicknesses made = MadeThicknesses.of(List.of(), Double.NaN, Double.NaN, measured);
        for (int c = from; c < to; c++) {
            if (only != BoundedJudgement.WHOLE_MATERIAL && store.sampleId(c) != only) {
                continue;
            }
            StoredMaterial m = store.material(c);
            candidates.add(new Candidate(store.sampleId(c), m.id(), m.name(), curves.apply(c), store.thicknessMm(c),
                    store.isBulk(c), SyntheticCurves.INDICES[index[c]], made));
        }
        return candidates;
    }

    /**
     * The curves of {@code SearchBenchmark.syntheticStore} (same seed, same materials of three), added as
     * curves so the store computes each one's weighted screen bins.
     */
    static SpectralStore screenedStore(int n, long seed) {
        SyntheticCurves synthetic = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        double[] grid = SpectralStore.DEFAULT_GRID.points();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        byte[] index = new byte[n];
        for (int start = 0; start < n; start += BATCH) {
            int count = Math.min(BATCH, n - start);
            SyntheticCurves.Spec[] specs = new SyntheticCurves.Spec[count];
            for (int k = 0; k < count; k++) {
                specs[k] = synthetic.next();
            }
            Curve[] curves = new Curve[count];
            IntStream.range(0, count).parallel().forEach(k -> curves[k] = curveOf(synthetic.codes(specs[k]), grid));
            for (int k = 0; k < count; k++) {
                int i = start + k;
                int material = i / 3;
                index[i] = (byte) specs[k].index();
                builder.add(i + 1L, new StoredMaterial(material + 1L, "material " + material, "plastic sheet"),
                        specs[k].thicknessMm(), material % 3 != 2, false, SyntheticCurves.INDICES[specs[k].index()], curves[k]);
            }
        }
        SpectralStore store = builder.build();
        INDEX_OF_CURVE.put(store, index);
        return store;
    }

    /** n rows cycling over the base store's rows (codes and screen bins carried over), three per new material. */
    private static SpectralStore repeated(SpectralStore base, int n) {
        byte[] baseIndex = INDEX_OF_CURVE.get(base);
        byte[] index = new byte[n];
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        for (int i = 0; i < n; i++) {
            int row = i % base.size();
            int material = i / 3;
            index[i] = baseIndex[row];
            builder.addCarried(i + 1L, new StoredMaterial(material + 1L, "material " + material, "plastic sheet"),
                    base.thicknessMm(row), material % 3 != 2, false, SyntheticCurves.INDICES[index[i]], base, row);
        }
        SpectralStore store = builder.build();
        INDEX_OF_CURVE.put(store, index);
        return store;
    }

    /** The curve the codes stand for, as {@link SpectralStore#curve} decodes a stored row. */
    static Curve curveOf(short[] codes, double[] grid) {
        int first = -1;
        int last = -1;
        for (int w = 0; w < codes.length; w++) {
            if (OdCode.isMeasured(codes[w])) {
                first = first < 0 ? w : first;
                last = w;
            }
        }
        int size = last - first + 1;
        double[] nm = new double[size];
        double[] t = new double[size];
        boolean[] below = new boolean[size];
        double[] limits = new double[size];
        for (int k = 0; k < size; k++) {
            short code = codes[first + k];
            nm[k] = grid[first + k];
            t[k] = OdCode.transmittance(code);
            below[k] = OdCode.isBound(code);
            limits[k] = below[k] ? t[k] : 0;
        }
        return Curve.of(nm, t, below, limits);
    }

    static int intProperty(String name, int fallback) {
        String value = System.getProperty(name);
        return value == null || value.isBlank() ? fallback : Integer.parseInt(value.trim());
    }
}
