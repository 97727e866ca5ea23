package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;

/**
 * Thickness, instrument and date lines a file carries become the sample's fields where the user gave none;
 * a value the user gives wins, with a warning when the file says otherwise. Generated files in the invented
 * Fernhollow workshop scenario (illustrative values); 1 mm = 1000 µm = 0.1 cm is the SI definition.
 */
class FileMetadataFieldsTest {

    private static final String CURVE = "wavelength_nm,T\n300,0.2\n400,0.6\n500,0.9\n";

    private ImportService imports;

    @BeforeEach
    void freshLibrary() {
        imports = new ImportService(new JooqLibraryRepository(MigratedDatabase.freshH2()), () -> { },
                ImportProperties.defaults());
    }

    private ImportResult store(String file, SampleFields fields) throws ImportException {
        return imports.store("bench.csv", file.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults(),
                new ImportTarget.NewMaterial("Fernhollow test sheet " + UUID.randomUUID(), MaterialClass.of("plastic sheet"),
                        Scaling.BULK, null, ""), fields);
    }

    private static SampleFields none() {
        return new SampleFields(null, null, null, null, null, null, null);
    }

    @Test
    void aThicknessLineWithItsUnitBecomesTheSampleThickness() throws ImportException {
        SampleInfo s = store("# thickness: 3.0 mm\n" + CURVE, none()).sample();

        assertThat(s.thicknessMm()).isEqualTo(3.0);
    }

    @Test
    void aThicknessInMicrometresIsConvertedToMillimetres() throws ImportException {
        SampleInfo s = store("# thickness: 125 µm\n" + CURVE, none()).sample();

        assertThat(s.thicknessMm()).isEqualTo(0.125);
    }

    @Test
    void theGivenThicknessWinsAndTheDisagreementIsWarned() throws ImportException {
        ImportResult r = store("# thickness: 3.0 mm\n" + CURVE, SampleFields.thickness(6));

        assertThat(r.sample().thicknessMm()).isEqualTo(6.0);
        assertThat(r.warnings()).anyMatch(w -> w.contains("thickness 6.0 mm as given is stored")
                && w.contains("thickness: 3.0 mm"));
    }

    @Test
    void anAgreeingThicknessWarnsOfNothing() throws ImportException {
        ImportResult r = store("# thickness_mm: 3\n" + CURVE, SampleFields.thickness(3.0));

        assertThat(r.warnings()).noneMatch(w -> w.contains("as given"));
    }

    @Test
    void aThicknessWithoutUnitIsNotGuessedAndTheRefusalQuotesIt() {
        ImportRequestException e = catchThrowableOfType(ImportRequestException.class,
                () -> store("# thickness: 3.0\n" + CURVE, none()));

        assertThat(e.getMessage()).contains("the file gives its thickness as 'thickness: 3.0'").contains("no unit")
                .doesNotContain("gives no thickness");
    }

    @Test
    void aFileWithoutThicknessIsRefusedSayingSo() {
        ImportRequestException e = catchThrowableOfType(ImportRequestException.class, () -> store(CURVE, none()));

        assertThat(e.getMessage()).contains("the file gives no thickness");
    }

    @Test
    void theInstrumentLineIsStoredWhenNoneIsGiven() throws ImportException {
        SampleInfo s = store("# thickness: 2 mm\n# instrument: Fernhollow bench diode-array unit\n" + CURVE, none()).sample();

        assertThat(s.instrument()).isEqualTo("Fernhollow bench diode-array unit");
    }

    @Test
    void aGivenInstrumentWinsAndTheDisagreementIsWarned() throws ImportException {
        ImportResult r = store("# instrument: bench unit A\n" + CURVE,
                new SampleFields(2.0, null, null, "bench unit B", null, null, null));

        assertThat(r.sample().instrument()).isEqualTo("bench unit B");
        assertThat(r.warnings()).anyMatch(w -> w.contains("'bench unit B' as given") && w.contains("'bench unit A'"));
    }

    @Test
    void theDateLineBecomesTheDateOfMeasurement() throws ImportException {
        SampleInfo s = store("# thickness: 2 mm\n# date: 2026-03-09\n" + CURVE, none()).sample();

        assertThat(s.measuredOn()).isEqualTo(LocalDate.of(2026, 3, 9));
    }

    @Test
    void aGivenDateWinsAndTheDisagreementIsWarned() throws ImportException {
        ImportResult r = store("# date: 2026-03-09 13:07:15\n" + CURVE,
                new SampleFields(2.0, null, null, null, LocalDate.of(2026, 3, 10), null, null));

        assertThat(r.sample().measuredOn()).isEqualTo(LocalDate.of(2026, 3, 10));
        assertThat(r.warnings()).anyMatch(w -> w.contains("2026-03-10 as given") && w.contains("2026-03-09"));
    }

    @Test
    void aFileDateInTheFutureIsNotUsedButTheCurveIsStored() throws ImportException {
        ImportResult r = store("# thickness: 2 mm\n# date: 2999-01-01\n" + CURVE, none());

        assertThat(r.sample().measuredOn()).isNull();
        assertThat(r.warnings()).anyMatch(w -> w.contains("2999-01-01 is not used"));
    }

    @Test
    void anAmbiguousDateIsLeftOutWithAWarningInThePreview() throws ImportException {
        FilePreview p = imports.preview("bench.csv", ("# date: 03/04/2026\n" + CURVE).getBytes(StandardCharsets.UTF_8),
                ImportOptions.defaults());

        assertThat(p.warnings()).anyMatch(w -> w.contains("date: 03/04/2026") && w.contains("cannot be told apart"));
    }

    @Test
    void jcampPathLengthSpectrometerAndLongDateFillTheSample() throws ImportException {
        // JCAMP-DX labels: PATH LENGTH in cm (JCAMP-DX IR specification, from memory), SPECTROMETER/DATA SYSTEM, LONGDATE
        String jdx = """
                ##TITLE=Fernhollow film (illustrative)
                ##JCAMP-DX=4.24
                ##DATA TYPE=UV/VIS SPECTRUM
                ##PATH LENGTH=0.05
                ##SPECTROMETER/DATA SYSTEM=bench double-beam unit
                ##LONGDATE=2026/03/09 10:21:02
                ##XUNITS=NANOMETERS
                ##YUNITS=TRANSMITTANCE
                ##XYPOINTS=(XY..XY)
                300,0.2
                400,0.6
                ##END=
                """;
        ImportResult r = imports.store("film.jdx", jdx.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults(),
                new ImportTarget.NewMaterial("Fernhollow test film", MaterialClass.of("plastic film"), Scaling.BULK,
                        null, ""), none());

        assertThat(r.sample().thicknessMm()).isEqualTo(0.5);
        assertThat(r.sample().instrument()).isEqualTo("bench double-beam unit");
        assertThat(r.sample().measuredOn()).isEqualTo(LocalDate.of(2026, 3, 9));
    }

    @Test
    void fileThicknessOutsideOneMicrometreToOneMetreIsTheFilesFault() {
        ImportException e = catchThrowableOfType(ImportException.class, () -> store("# thickness: 5 m\n" + CURVE, none()));

        assertThat(e.field()).isEqualTo("thickness");
        assertThat(e.problem()).contains("5 m").contains("give thicknessMm");
    }

    @Test
    void unusableThicknessIsNotedInThePreview() throws ImportException {
        List<String> warnings = new ArrayList<>(imports.preview("bench.csv",
                ("# thickness: thick\n" + CURVE).getBytes(StandardCharsets.UTF_8), ImportOptions.defaults()).warnings());

        assertThat(warnings).anyMatch(w -> w.contains("thickness: thick") && w.contains("not used"));
    }
}
