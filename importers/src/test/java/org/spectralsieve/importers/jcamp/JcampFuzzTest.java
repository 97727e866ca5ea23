package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import java.util.List;
import java.util.Random;
import org.spectralsieve.importers.TextMutations;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/**
 * 5,000 fixed-seed mutations of two valid files (truncation, flipped characters, swapped or lost
 * lines, huge numbers, NaN, empty text) end in a ParsedSpectrum or an ImportException, never in any
 * other exception. Common practice for parsers of untrusted input, no source.
 */
class JcampFuzzTest {

    private static final int MUTATIONS = 5_000;
    private static final String[] INSERTS = {"1E+999", "-1E+999", "99999999999999999999999999", "NaN", "Infinity",
            "s99999999999", "Z999999", "?", "##", "##END=", "##TITLE= x", "$$", "\u001A", "\u0000", "%", "J", "@",
            "e-", "+", "1e", ".", "##NPOINTS= 2147483647", "##XFACTOR= 0", "##YUNITS= %T", "##XUNITS= 1/CM"};

    @Test
    void mutatedFilesGiveASpectrumOrAnImportExceptionOnly() {
        List<String> seeds = List.of(asdfSeed(), writerSeed());
        Random random = new Random(42L);
        int spectra = 0;
        int refusals = 0;
        for (int i = 0; i < MUTATIONS; i++) {
            String seed = seeds.get(i % seeds.size());
            String mutated = mutate(seed, random);
            try {
                Jdx.read(mutated);
                spectra++;
            } catch (ImportException expected) {
                assertThat(expected.getMessage()).startsWith(Jdx.SOURCE);
                // the reader wraps a slipped RuntimeException as a last guard; that must never be needed
                if (expected.getCause() instanceof RuntimeException slipped) {
                    fail("mutation " + i + " reached the guard with " + slipped + " for:\n" + mutated, slipped);
                }
                refusals++;
            } catch (RuntimeException | StackOverflowError | OutOfMemoryError e) {
                fail("mutation " + i + " threw " + e + " for:\n" + mutated, e);
            }
        }
        // both outcomes must occur, or the mutations are too weak (or too strong) to test anything
        assertThat(spectra).isPositive();
        assertThat(refusals).isPositive();
    }

    /** The same mutations read as relative values (readValues): values or an ImportException, nothing else. */
    @Test
    void mutatedFilesGiveValuesOrAnImportExceptionOnly() {
        List<String> seeds = List.of(asdfSeed(), writerSeed());
        Random random = new Random(43L);
        int values = 0;
        int refusals = 0;
        for (int i = 0; i < MUTATIONS; i++) {
            String mutated = mutate(seeds.get(i % seeds.size()), random);
            try {
                new JcampReader().readValues(Jdx.SOURCE, new java.io.StringReader(mutated),
                        org.spectralsieve.importers.SpectrumValuesOptions.defaults());
                values++;
            } catch (ImportException expected) {
                assertThat(expected.getMessage()).startsWith(Jdx.SOURCE);
                if (expected.getCause() instanceof RuntimeException slipped) {
                    fail("mutation " + i + " reached the guard with " + slipped + " for:\n" + mutated, slipped);
                }
                refusals++;
            } catch (RuntimeException | StackOverflowError | OutOfMemoryError e) {
                fail("mutation " + i + " threw " + e + " for:\n" + mutated, e);
            }
        }
        assertThat(values).isPositive();
        assertThat(refusals).isPositive();
    }

    @Test
    void bothSeedsAreValid() throws ImportException {
        // asdfSeed worked by hand: line 1 gives 10, 21, 43 … 505 (10 points); line 2 checks 505 and falls to
        // 10 (9 more); line 3 checks 10, T repeats it, then 21, 32, 43, 43, 43, 43, 65, 98, 142, 197 (11 more);
        // line 4 checks 197 and falls to −199 (8 more); line 5 checks −199, then −189, −179: 40 in all
        double[] y = Jdx.read(asdfSeed()).values();
        assertThat(y).hasSize(40);
        assertThat(y[9]).isEqualTo(505);
        assertThat(y[29]).isEqualTo(197);
        assertThat(y[39]).isEqualTo(-179);
        assertThat(Jdx.read(writerSeed()).size()).isEqualTo(60);
    }

    /** An illustrative DIFDUP block: ASDF with Y-checks, DUP and SQZ, 40 points at 300…339 nm. */
    private static String asdfSeed() {
        return Jdx.xydata(300, 339, 40,
                "300A0J1K2L3M4N5O6P7Q8R9",
                "309E05j1k2l3m4n5o6p7q8r9",
                "318A0TJ1U%%%K2L3M4N5",
                "329A97j1k2l3m4n5o6p7q8",
                "337a99J0T");
    }

    private static String writerSeed() {
        double[] x = new double[60];
        double[] t = new double[60];
        boolean[] bounds = new boolean[60];
        for (int i = 0; i < x.length; i++) {
            x[i] = 300 + i * 1.5 + (i % 3) * 0.1;
            t[i] = 0.5 + 0.4 * Math.sin(i / 7.0);
            bounds[i] = i % 11 == 0;
        }
        return JcampWriter.write(null, x, t, bounds);
    }

    private static String mutate(String text, Random random) {
        int kind = random.nextInt(9);
        return switch (kind) {
            case 0 -> text.substring(0, random.nextInt(text.length() + 1));
            case 1 -> flip(text, random, 1 + random.nextInt(5));
            case 2 -> TextMutations.swapLines(text, random);
            case 3 -> TextMutations.dropLine(text, random);
            case 4, 5 -> insert(text, random, INSERTS[random.nextInt(INSERTS.length)]);
            case 6 -> random.nextInt(20) == 0 ? "" : TextMutations.duplicateLine(text, random);
            case 7 -> insert(text, random, Long.toString(random.nextLong()) + "." + random.nextInt(1000));
            default -> flip(TextMutations.swapLines(text, random), random, 1);
        };
    }

    private static String flip(String text, Random random, int count) {
        if (text.isEmpty()) {
            return text;
        }
        char[] c = text.toCharArray();
        for (int k = 0; k < count; k++) {
            c[random.nextInt(c.length)] = (char) random.nextInt(256);
        }
        return new String(c);
    }

    private static String insert(String text, Random random, String what) {
        int at = random.nextInt(text.length() + 1);
        return text.substring(0, at) + what + text.substring(at);
    }



}
