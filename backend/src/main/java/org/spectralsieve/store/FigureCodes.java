package org.spectralsieve.store;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Per curve, the exact weighted figures of a few built-in weightings as measured (docs/weighted-screening.md,
 * "Figures in the store"): computed once when the curve enters the store, from the very curve the exact judgement
 * reads, with the judgement's own arithmetic ({@link Weighting#figureForMargin}), and kept as a 16-bit log code
 * whose step bounds the figure both ways, plus one bit per figure saying whether its two ends are equal (L = U:
 * no point below detection weighs in it, or none changes it).
 *
 * <p>The code of a figure U &gt; 0 is c = round((−log10 U − {@link #TOP_OD}) / {@link #STEP}) + 1, so −log10 U lies
 * within half a step of TOP_OD + (c − 1)·STEP; a whole step either side, [{@link #lowerOf}, {@link #upperOf}],
 * holds U with room for any rounding of the logarithm. Code 0: no bound (the figure is unavailable on the curve —
 * the judgement then calls the clause unverified — or the curve was not computed here); {@link #BELOW}: U is at most
 * {@link #upperOf}(BELOW), possibly 0. The figures are chosen by identity with the built-in catalogues' objects, so
 * a clause reads a code only where its figure is the very one computed here (an imported spectrum never matches).
 */
public final class FigureCodes {

    /** Decades per code step: 2·10⁻⁴ (0.046 % of the figure). */
    static final double STEP = 2e-4;
    /** The optical density code 1 stands for: T = 10^0.2 = 1.58, above any stored reading (at most 1.5). */
    static final double TOP_OD = -0.2;
    /** No bound: the figure is not available on the curve, or was not computed. */
    static final int NONE = 0;
    /** U is below the codes' range (about 10⁻¹³), possibly 0. */
    static final int BELOW = 0xFFFF;

    /** The figures kept, in the order of their columns: the four built-in LEDs unweighted, erythemal, UV hazard, τv. */
    static final List<Weighting> FIGURES = List.of(
            led("led-365"), led("led-385"), led("led-395"), led("led-405"),
            Weighting.erythemal(SpectrumLookup.builtIn()),
            Weighting.uvHazard(SpectrumLookup.builtIn()),
            Weighting.luminous());

    /** Bytes per curve: one code per figure and one byte of "both ends equal" bits. */
    public static final int BYTES_PER_CURVE = FIGURES.size() * Short.BYTES + 1;

    private final short[][] codes;
    private final byte[] equalEnds;

    private FigureCodes(short[][] codes, byte[] equalEnds) {
        this.codes = codes;
        this.equalEnds = equalEnds;
    }

    private static Weighting led(String name) {
        return Weighting.of(EmitterCatalogue.named(name).orElseThrow(), Optional.empty());
    }

    /**
     * The column of the clause's figure, or −1 when it is not one kept here. By identity of the emitter and
     * response objects (the built-in catalogues'), not by name: an imported spectrum of the same name, or another
     * lookup's copy, computes its own figure, which these codes do not bound.
     */
    static int figureOf(Weighting weighting) {
        if (weighting instanceof Weighting.Luminous) {
            return FIGURES.indexOf(weighting);
        }
        if (weighting instanceof Weighting.Spectral s) {
            for (int f = 0; f < FIGURES.size(); f++) {
                if (FIGURES.get(f) instanceof Weighting.Spectral kept && kept.preset() == s.preset()
                        && kept.emitter() == s.emitter()
                        && kept.response().isPresent() == s.response().isPresent()
                        && (s.response().isEmpty() || kept.response().get() == s.response().get())) {
                    return f;
                }
            }
        }
        return -1;
    }

    /** The code of a figure's upper end U (see the class comment). */
    static int encode(double u) {
        if (!(u > 0)) {
            return BELOW;
        }
        double x = (-Math.log10(u) - TOP_OD) / STEP;
        if (x < 0) {
            return NONE; // above T = 1.58: never a stored reading's mean; no bound
        }
        long c = Math.round(x) + 1;
        return (int) Math.min(BELOW, c);
    }

    /** {@link #upperOf} of every code, formed once (a million curves read three codes each per search). */
    private static final double[] UPPER = new double[BELOW + 1];
    /** {@link #lowerOf} of every code. */
    private static final double[] LOWER = new double[BELOW + 1];

    static {
        for (int c = 1; c <= BELOW; c++) {
            UPPER[c] = Math.pow(10, -(TOP_OD + (c - 2) * STEP));
            LOWER[c] = c == BELOW ? 0 : Math.pow(10, -(TOP_OD + c * STEP));
        }
    }

    /** log10 of {@link #upperOf}: −(TOP_OD + (code − 2)·STEP), no logarithm to take per curve. */
    static double log10UpperOf(int code) {
        return -(TOP_OD + (code - 2) * STEP);
    }

    /** log10 of {@link #lowerOf} (−∞ for {@link #BELOW}). */
    static double log10LowerOf(int code) {
        return code == BELOW ? Double.NEGATIVE_INFINITY : -(TOP_OD + code * STEP);
    }

    /** An upper bound on the figure a code holds (one whole step above its centre). */
    static double upperOf(int code) {
        return UPPER[code];
    }

    /** A lower bound on the figure a code holds (one whole step below its centre); 0 for {@link #BELOW}. */
    static double lowerOf(int code) {
        return LOWER[code];
    }

    /** The figure's code of the curve ({@link #NONE}: no bound). */
    int code(int figure, int curve) {
        return codes[figure][curve] & 0xFFFF;
    }

    /** Whether the figure's lower end L equals its upper end U on the curve (then the code bounds L as well). */
    boolean endsEqual(int figure, int curve) {
        return (equalEnds[curve] >> figure & 1) != 0;
    }

    /** Collects the codes of each curve slot; arrays grow with the store's. */
    static final class Builder {
        private short[][] codes;
        private byte[] equalEnds;

        Builder(int capacity) {
            codes = new short[FIGURES.size()][capacity];
            equalEnds = new byte[capacity];
        }

        void grow(int capacity) {
            for (int f = 0; f < codes.length; f++) {
                codes[f] = Arrays.copyOf(codes[f], capacity);
            }
            equalEnds = Arrays.copyOf(equalEnds, capacity);
        }

        void unknown(int slot) {
            for (short[] column : codes) {
                column[slot] = NONE;
            }
            equalEnds[slot] = 0;
        }

        /** The slot's codes from another store's (a carried row): the same bytes {@link #add} wrote for it. */
        void copy(int slot, FigureCodes from, int fromSlot) {
            for (int f = 0; f < codes.length; f++) {
                codes[f][slot] = from.codes[f][fromSlot];
            }
            equalEnds[slot] = from.equalEnds[fromSlot];
        }

        /**
         * The slot's codes from the curve the exact judgement reads: U with points below detection at their limit,
         * L at 0, as the judgement reads a clause's two ends (a figure that is not "at most" has L = U).
         */
        void add(int slot, Curve curve) {
            int equal = 0;
            for (int f = 0; f < FIGURES.size(); f++) {
                Weighting w = FIGURES.get(f);
                Figure upper = w.figureForMargin(curve, BelowDetectionAs.LIMIT);
                if (!upper.available()) {
                    codes[f][slot] = NONE;
                    continue;
                }
                double u = upper.value().getAsDouble();
                double l = upper.bound() != Figure.Bound.AT_MOST ? u
                        : Math.min(u, w.figureForMargin(curve, BelowDetectionAs.ZERO).value().orElse(0));
                codes[f][slot] = (short) encode(u);
                if (l == u) {
                    equal |= 1 << f;
                }
            }
            equalEnds[slot] = (byte) equal;
        }

        FigureCodes build(int size) {
            short[][] c = new short[codes.length][];
            for (int f = 0; f < c.length; f++) {
                c[f] = codes[f].length == size ? codes[f] : Arrays.copyOf(codes[f], size);
            }
            return new FigureCodes(c, equalEnds.length == size ? equalEnds : Arrays.copyOf(equalEnds, size));
        }
    }
}
