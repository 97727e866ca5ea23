package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import java.io.StringReader;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** 5,000 mutations of valid illustrative files: the reader returns a spectrum or an ImportException, nothing else. */
class FuzzedInputTest {

    private static final String[] VALID = {
        "# Spectral Sieve curve v1\n# thickness_mm: 3\nwavelength_nm,transmittance\n300,<0.001\n310,0.2\n320,0.5\n",
        "Wavelength (nm);Transmittance(%);Std.Dev.\n190;0,01;0,002\n191;12,5;0,1\n192;50,25;0,2\n",
        "# film offcut\nw.length.1 transmittance.1  w.length.2 transmittance.2\n190\t4.8\t190\t5.3\n191\t5.2\t191\t5.2\n",
        "Operator: invented\nwavenumber (cm-1),A\n20000,0.5\n25000,1.5\n30000,2.5\n",
        "365.5   12.3\n405\t80\n450  90\n",
    };
    private static final String[] HUGE = {"1e308", "-1e308", "1e999", "NaN", "Infinity", "-0", "4.9e-324", "", "<", "\"", ",", ";"};
    private static final ReadOptions[] OPTIONS = {ReadOptions.defaults(),
        ReadOptions.defaults().replicates(Replicates.MEAN).mergeDuplicates(true),
        ReadOptions.defaults().decimalMark(DecimalMark.COMMA).replicates(Replicates.SEPARATE)};

    @Test
    void fiveThousandMutationsYieldASpectrumOrAnImportException() {
        Random random = new Random(424242L);
        DelimitedTextReader reader = new DelimitedTextReader();
        int parsed = 0;
        int refused = 0;
        for (int k = 0; k < 5_000; k++) {
            String text = mutate(VALID[random.nextInt(VALID.length)], random);
            try {
                List<ParsedSpectrum> all = reader.readAll("fuzz.csv", new StringReader(text), OPTIONS[k % OPTIONS.length]);
                assertThat(all).isNotEmpty();
                parsed++;
            } catch (ImportException e) {
                assertThat(e.getMessage()).startsWith("fuzz.csv");
                refused++;
            } catch (RuntimeException e) {
                fail("mutation " + k + " threw " + e + " for input:\n" + text, e);
            }
        }
        assertThat(parsed).isPositive();
        assertThat(refused).isPositive();
    }

    private static final String[] VALID_SPECTRA = {
        "# source: illustrative bench lamp\nwavelength_nm,relative power\n360,0.25\n365,1\n370,0.125\n",
        "title line,,,\nwavelength,extraterrestrial,global,direct\n280,0.08,4.7E-23,2.5E-26\n280.5,0.09,1.2E-21,1.1E-24\n",
        "Wavelength (um);Sensitivity\n0,35;0,5\n0,40;1,5\n",
        "400\t10\n410\t30\n420\t5\n",
    };
    private static final SpectrumValuesOptions[] VALUE_OPTIONS = {SpectrumValuesOptions.defaults(),
        SpectrumValuesOptions.defaults().valueColumn("global").mergeDuplicates(true),
        SpectrumValuesOptions.defaults().valueColumn("2").xUnit(XUnit.MICROMETRE)};

    /** The same mutations through the relative-spectrum reader: values with all invariants, or an ImportException. */
    @Test
    void fiveThousandMutationsOfSpectrumFilesYieldValuesOrAnImportException() {
        Random random = new Random(737373L);
        DelimitedValuesReader reader = new DelimitedValuesReader();
        int parsed = 0;
        int refused = 0;
        for (int k = 0; k < 5_000; k++) {
            String text = mutate(VALID_SPECTRA[random.nextInt(VALID_SPECTRA.length)], random);
            try {
                SpectrumValues v = reader.read("fuzz.csv", new StringReader(text), VALUE_OPTIONS[k % VALUE_OPTIONS.length]);
                double[] nm = v.wavelengthsNm();
                for (int i = 0; i < nm.length; i++) {
                    assertThat(v.values()[i]).isNotNegative();
                    assertThat(i == 0 || nm[i] > nm[i - 1]).isTrue();
                }
                parsed++;
            } catch (ImportException e) {
                assertThat(e.getMessage()).startsWith("fuzz.csv");
                refused++;
            } catch (RuntimeException e) {
                fail("mutation " + k + " threw " + e + " for input:\n" + text, e);
            }
        }
        assertThat(parsed).isPositive();
        assertThat(refused).isPositive();
    }

    private static String mutate(String valid, Random random) {
        String text = valid;
        int steps = 1 + random.nextInt(3);
        for (int s = 0; s < steps; s++) {
            text = switch (random.nextInt(6)) {
                case 0 -> text.substring(0, random.nextInt(text.length() + 1)); // truncation
                case 1 -> flipByte(text, random);
                case 2 -> TextMutations.swapLines(text, random);
                case 3 -> replaceToken(text, random);
                case 4 -> "";
                default -> TextMutations.duplicateLine(text, random);
            };
            if (text.isEmpty()) {
                break;
            }
        }
        return text;
    }

    private static String flipByte(String text, Random random) {
        if (text.isEmpty()) {
            return text;
        }
        char[] c = text.toCharArray();
        int i = random.nextInt(c.length);
        c[i] = (char) (c[i] ^ (1 << random.nextInt(7)));
        return new String(c);
    }



    /** Replaces a run of digits with a huge number, NaN, an empty field or a stray delimiter. */
    private static String replaceToken(String text, Random random) {
        int start = random.nextInt(text.length() + 1);
        while (start < text.length() && !Character.isDigit(text.charAt(start))) {
            start++;
        }
        int end = start;
        while (end < text.length() && (Character.isDigit(text.charAt(end)) || text.charAt(end) == '.')) {
            end++;
        }
        return text.substring(0, start) + HUGE[random.nextInt(HUGE.length)] + text.substring(end);
    }
}
