package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.importers.ImportException;

/** Each broken file is refused with an ImportException naming the file, the line and the JCAMP label. */
class JcampMalformedInputTest {

    private static final String PAIRS_HEADER_X = "##XUNITS= NANOMETERS";
    private static final String PAIRS_HEADER_Y = "##YUNITS= ABSORBANCE";

    static Stream<Arguments> brokenFiles() {
        String complete = Jdx.xydata(1, 5, 5, "1 10 20 30", "4 40 50");
        String truncated = complete.substring(0, complete.indexOf("##END=") - 4); // cuts "50" and the END
        return Stream.of(
                // line 1: A0 J5 j2 % = 10 25 13 13; line 2 must repeat 13 but writes A4 = 14
                Arguments.of("failed DIF Y-check", Jdx.xydata(1, 5, 5, "1 A0J5j2%", "4 A4J"), 10, "##XYDATA",
                        "Y-check failed"),
                Arguments.of("NPOINTS larger than the data", Jdx.xydata(1, 6, 6, "1 10 20 30 40 50"), 7, "##NPOINTS",
                        "holds 5 points"),
                Arguments.of("NPOINTS smaller than the data", Jdx.xydata(1, 4, 4, "1 10 20 30 40 50"), 9,
                        "##NPOINTS", "more than 4"),
                Arguments.of("unknown YUNITS", Jdx.text(PAIRS_HEADER_X, "##YUNITS= FURLONGS", "##XYPOINTS= (XY..XY)",
                        "1 2", "3 4"), 4, "##YUNITS", "FURLONGS"),
                Arguments.of("file cut inside the data", truncated, 10, "##END", "truncated"),
                Arguments.of("file cut inside a pair", Jdx.text(PAIRS_HEADER_X, PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)",
                        "1, 2", "3,"), 7, "##XYPOINTS", "incomplete"),
                Arguments.of("garbage character in ASDF", Jdx.xydata(1, 3, 3, "1 A0J1#2"), 9, "##XYDATA", "'#'"),
                Arguments.of("question mark for a value", Jdx.xydata(1, 3, 3, "1 10 20 ?"), 9, "##XYDATA", "'?'"),
                Arguments.of("control character in ASDF", Jdx.xydata(1, 3, 3, "1 10\u000120 30"), 9, "##XYDATA",
                        "U+0001"),
                Arguments.of("FIRSTX far from the first line X", Jdx.xydata(3, 7, 5, "1 10 20 30 40 50"), 5,
                        "##FIRSTX", "starts at X 1"),
                Arguments.of("LASTX far from the grid of the last line", Jdx.xydata(1, 9, 5, "1 10 20 30", "4 40 50"),
                        10, "##LASTX", "X-check"),
                Arguments.of("middle line X off the grid", Jdx.xydata(1, 5, 5, "1 10 20", "7 30", "4 40 50"), 10,
                        "##XYDATA", "X-check"),
                Arguments.of("XFACTOR not a number", Jdx.text("##XFACTOR= abc", PAIRS_HEADER_X, PAIRS_HEADER_Y,
                        "##XYPOINTS= (XY..XY)", "1 2", "3 4"), 3, "##XFACTOR", "abc"),
                Arguments.of("NaN in a header number", Jdx.text("##YFACTOR= NaN", PAIRS_HEADER_X, PAIRS_HEADER_Y,
                        "##XYPOINTS= (XY..XY)", "1 2", "3 4"), 3, "##YFACTOR", "NaN"),
                Arguments.of("number beyond double range", Jdx.xydata(1, 2, 2, "1 1E+999 5"), 9, "##XYDATA",
                        "out of range"),
                Arguments.of("difference with nothing before it", Jdx.xydata(1, 2, 2, "1 J1J2"), 9, "##XYDATA",
                        "no ordinate before it"),
                Arguments.of("repeat count at a line start", Jdx.xydata(1, 2, 2, "1 T"), 9, "##XYDATA",
                        "nothing before it"),
                Arguments.of("label with no data lines", Jdx.xydata(1, 2, 2), 8, "##XYDATA", "no data"),
                Arguments.of("x not monotonic", Jdx.text(PAIRS_HEADER_X, PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)",
                        "300 1", "310 2", "305 3"), 8, "##XYPOINTS", "line 7"),
                Arguments.of("zero wavenumber", Jdx.text("##XUNITS= 1/CM", PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)",
                        "0 1", "310 2"), 6, "##XYPOINTS", "not a positive wavelength"),
                Arguments.of("unknown XUNITS", Jdx.text("##XUNITS= HZ", PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)",
                        "1 2", "3 4"), 3, "##XUNITS", "HZ"),
                Arguments.of("missing XUNITS", Jdx.text(PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)", "1 2", "3 4"), 1,
                        "##XUNITS", "missing"),
                Arguments.of("unsupported variable list", Jdx.text(PAIRS_HEADER_X, PAIRS_HEADER_Y,
                        "##XYDATA= (R..R)", "1 2"), 5, "##XYDATA", "(R..R)"),
                Arguments.of("below-detection index outside the data", Jdx.text(PAIRS_HEADER_X, PAIRS_HEADER_Y,
                        "##$SIEVE BELOW DETECTION= 5", "##XYPOINTS= (XY..XY)", "1 2", "3 4"), 5,
                        "##$SIEVE BELOW DETECTION", "outside"),
                Arguments.of("NPOINTS not a count", Jdx.xydata(1, 2, 2, "1 10 20").replace("NPOINTS= 2", "NPOINTS= 2.5"),
                        7, "##NPOINTS", "2.5"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("brokenFiles")
    void brokenFileIsRefusedNamingFileLineAndLabel(String what, String text, int line, String field, String quote) {
        ImportException e = catchThrowableOfType(ImportException.class, () -> Jdx.read(text));

        assertThat(e).as(what).isNotNull();
        assertThat(e.sourceName()).isEqualTo(Jdx.SOURCE);
        assertThat(e.line()).as(e.getMessage()).isEqualTo(line);
        assertThat(e.field()).as(e.getMessage()).isEqualTo(field);
        assertThat(e.getMessage()).contains(Jdx.SOURCE, "line " + line, field, quote);
    }

    @Test
    void textWithoutAnyLabelIsNotAJcampFile() {
        ImportException e = catchThrowableOfType(ImportException.class, () -> Jdx.read("just some words\n1 2\n"));

        assertThat(e.getMessage()).contains(Jdx.SOURCE, "no ## labels");
    }

    @Test
    void aSinglePointIsNotACurve() {
        ImportException e = catchThrowableOfType(ImportException.class, () -> Jdx.read(Jdx.text(PAIRS_HEADER_X,
                PAIRS_HEADER_Y, "##XYPOINTS= (XY..XY)", "300 1")));

        assertThat(e.line()).isEqualTo(6);
        assertThat(e.getMessage()).contains("at least 2");
    }
}
