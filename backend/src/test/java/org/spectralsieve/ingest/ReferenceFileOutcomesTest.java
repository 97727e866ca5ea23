package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.UUID;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectra.ImportedSpectrum;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.spectra.SpectrumImportOptions;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * What the import does with every file of ../shared/reference-data (real files by other people, never copied
 * into the repository; skipped with a message where the folder is absent): one row per file, through the
 * path the CLI's batch import and the HTTP API take ({@link ImportService#store} on a freshly migrated H2
 * database), and for light-source and response tables through the spectrum import
 * ({@link SpectrumImportService}, CLI {@code import-spectrum}).
 *
 * <p>Each row states the outcome class and, where the file decodes, the check values of
 * reference-data/SOURCES.md (points, range, values at named wavelengths; tolerance half a unit of the last
 * digit SOURCES.md gives). The warnings are listed completely, each by a fragment: a new, lost or changed
 * warning fails its row, and the failure prints the row as it now reads, so a deliberate change is
 * one pasted line. Rows marked "values: …" have their decoded values checked in depth by the test named
 * there and state only their outcome here. {@link #everyReferenceFileHasARow} fails when a file is added to
 * the folder without one.
 */
@ReadsSharedFolder
class ReferenceFileOutcomesTest {

    /** What an import of the file as a transmittance curve does. */
    enum Outcome {
        /** stored with no warning */
        IMPORTS,
        /** stored, with exactly the listed warnings */
        IMPORTS_WITH_WARNINGS,
        /** refused, the message holding the fragment */
        REFUSED,
        /** refused as a curve (saying so) and stored by the spectrum import as an emitter or response */
        IS_A_REFERENCE_SPECTRUM
    }

    /** A value the stored curve or spectrum must have at a wavelength, written as SOURCES.md gives it. */
    record Check(String what, double nm, String expected) {
    }

    /** The spectrum import of a light-source or response table: kind, value column (null: the only one). */
    record AsSpectrum(SpectrumKind kind, String valueColumn) {
    }

    /**
     * One reference file and what its import gives.
     *
     * @param messages the warnings (IMPORTS_WITH_WARNINGS), or the refusal fragment (REFUSED, and for
     *                 IS_A_REFERENCE_SPECTRUM the curve refusal fragment followed by the spectrum's warnings)
     */
    record Row(String file, String given, ImportOptions options, Outcome outcome, List<String> messages,
               Integer points, Double fromNm, Double toNm, List<Check> checks, AsSpectrum spectrum, String values) {

        static Row of(String file, Outcome outcome, String... messages) {
            return new Row(file, "", ImportOptions.defaults(), outcome, List.of(messages), null, null, null, List.of(),
                    null, "");
        }

        Row named(String fileName) {
            return new Row(fileName, given, options, outcome, messages, points, fromNm, toNm, checks, spectrum, values);
        }

        Row given(String note, ImportOptions o) {
            return new Row(file, note, o, outcome, messages, points, fromNm, toNm, checks, spectrum, values);
        }

        Row points(int n, double from, double to) {
            return new Row(file, given, options, outcome, messages, n, from, to, checks, spectrum, values);
        }

        private Row check(String what, double nm, String expected) {
            List<Check> more = new ArrayList<>(checks);
            more.add(new Check(what, nm, expected));
            return new Row(file, given, options, outcome, messages, points, fromNm, toNm, more, spectrum, values);
        }

        /** T as a fraction at the point nearest {@code nm}. */
        Row t(double nm, String fraction) {
            return check("T", nm, fraction);
        }

        /** T in percent at the point nearest {@code nm}. */
        Row percent(double nm, String percent) {
            return check("%T", nm, percent);
        }

        /** Absorbance −log10 T at the point nearest {@code nm} (IUPAC Gold Book A00028). */
        Row absorbance(double nm, String a) {
            return check("A", nm, a);
        }

        /** The sample's detection limit, as a fraction. */
        Row detectionLimit(String fraction) {
            return check("limit", Double.NaN, fraction);
        }

        /** A spectrum's value at the point nearest {@code nm}. */
        Row value(double nm, String v) {
            return check("value", nm, v);
        }

        /** A spectrum's values summed on its 1 nm grid (Σ v · 1 nm). */
        Row sum(String total) {
            return check("sum", Double.NaN, total);
        }

        /** The wavelength of a spectrum's largest value. */
        Row peakAt(String nm) {
            return check("peak", Double.NaN, nm);
        }

        Row asSpectrum(SpectrumKind kind, String valueColumn) {
            return new Row(file, given, options, outcome, messages, points, fromNm, toNm, checks,
                    new AsSpectrum(kind, valueColumn), values);
        }

        /** Decoded values checked in depth by that test; this row states the outcome only. */
        Row values(String where) {
            return new Row(file, given, options, outcome, messages, points, fromNm, toNm, checks, spectrum, where);
        }

        @Override
        public String toString() {
            return file + (given.isEmpty() ? "" : " (" + given + ")");
        }
    }

    private static Row imports(String file) {
        return Row.of(file, Outcome.IMPORTS);
    }

    private static Row warns(String file, String... warnings) {
        return Row.of(file, Outcome.IMPORTS_WITH_WARNINGS, warnings);
    }

    private static Row refused(String file, String fragment) {
        return Row.of(file, Outcome.REFUSED, fragment);
    }

    /** The curve refusal fragment, then the spectrum import's warnings. */
    private static Row spectrum(String file, String curveRefusal, String... spectrumWarnings) {
        List<String> m = new ArrayList<>(List.of(curveRefusal));
        m.addAll(List.of(spectrumWarnings));
        return Row.of(file, Outcome.IS_A_REFERENCE_SPECTRUM, m.toArray(String[]::new));
    }

    /** A wavenumber in cm⁻¹ as a wavelength in nm: λ = 10⁷ / ν̃ (definition of the wavenumber). */
    private static double cm(double wavenumber) {
        return 1e7 / wavenumber;
    }

    private static final ImportOptions PERCENT = new ImportOptions(null, Optional.of(YKind.TRANSMITTANCE_PERCENT), null,
            null, false, null, null, null);

    private static final String NOT_PERCENT_OR_FRACTION = "does not say percent or fraction";
    /** The measured sheets' standard-deviation column is read; where σ_T exceeds T/2 the absorbance σ is left unknown. */
    private static String sdTooWide(int points, String range) {
        return points + " points between " + range + " nm have a standard deviation above 50 % of their transmittance";
    }
    private static final String Y_BAR = "values read from column 'column 3'; columns not read: [column 2, column 4]";
    private static final String NOT_A_CURVE_ABOVE_100 = "far above any transmittance (1, or 100 %T)";

    /**
     * The table. SOURCES.md sections: §1 JCAMP-DX test set, §2 parser test files, §3 compound and ASDF
     * examples, §4 FTIR file, §5 refractive-index tables, §6 solar spectrum, §7 CIE tables (the cie-1nm copies
     * are the same CIE tables at 360–830 nm), §8 measured transmittance (T300 / T400 / T550 in %T), §9 capture
     * exports.
     */
    static Stream<Row> rows() {
        return Stream.of(
                refused("SOURCES.md", "no data rows"),

                // §6: three irradiance columns (W m⁻² nm⁻¹); integrals checked in ReferenceSpectrumApiTest
                spectrum("ASTMG173.csv", "no value column in header [wavelength, extraterrestrial, global, direct]",
                        "line 1 before the table read as preamble", "values read from column 'global'",
                        "an emitter counts only within 100.0–1100.0 nm")
                        .asSpectrum(SpectrumKind.EMITTER, "global").points(2002, 280, 4000)
                        .values("ReferenceSpectrumApiTest, SolarReferenceReadTest"),

                // §7: CIE illuminants are normalised to S(560) = 100 (CIE 15 definition, stated in SOURCES.md §7)
                spectrum("a.csv", NOT_A_CURVE_ABOVE_100)
                        .asSpectrum(SpectrumKind.EMITTER, null).points(471, 360, 830).value(560, "100"),
                spectrum("d65.csv", NOT_A_CURVE_ABOVE_100)
                        .asSpectrum(SpectrumKind.EMITTER, null).points(471, 360, 830).value(560, "100"),
                spectrum("CIE_std_illum_A_1nm.csv", NOT_A_CURVE_ABOVE_100)
                        .asSpectrum(SpectrumKind.EMITTER, null).points(531, 300, 830).value(560, "100"),
                spectrum("CIE_std_illum_D65.csv", NOT_A_CURVE_ABOVE_100)
                        .asSpectrum(SpectrumKind.EMITTER, null).points(531, 300, 830).value(560, "100"),
                // §7: ȳ (column 3 of wavelength, x̄, ȳ, z̄) and V(λ) are one table; Σȳ · 1 nm = 106.8569
                spectrum("cmf1931.csv", "looks like a table of colour-matching functions", Y_BAR)
                        .asSpectrum(SpectrumKind.RESPONSE, "3").points(471, 360, 830).sum("106.8569").value(555, "1"),
                spectrum("CIE_xyz_1931_2deg.csv", "looks like a table of colour-matching functions", Y_BAR)
                        .asSpectrum(SpectrumKind.RESPONSE, "3").points(471, 360, 830).sum("106.8569"),
                spectrum("CIE_sle_photopic.csv", "no value column in header [Wavelength, V]")
                        .asSpectrum(SpectrumKind.RESPONSE, null).points(471, 360, 830).sum("106.8569"),

                // §9: a lamp capture (sample and dark columns, no reference): a light source, not a transmittance
                spectrum("Spectrum-20260313--130715.csv", "no exposure time for column 'Measured'",
                        "values read from column 'Measured'; columns not read: [Pixel, Dark]")
                        .asSpectrum(SpectrumKind.EMITTER, "Measured").points(1280, 268.942329, 903.38).peakAt("523.35"),
                // §9: the wavelength axis of a bad calibration fit turns back and forth
                refused("Spectrum-20260309--010902.csv", "goes up again from 351.612659 nm to 351.614689 nm at line 27"),

                // §2: one NMR snippet in four encodings, no units: not a spectrum in wavelength
                refused("jcamp-difdup.dx", "the block has no ##XUNITS="),
                refused("jcamp-fix.dx", "the block has no ##XUNITS="),
                refused("jcamp-packed.dx", "the block has no ##XUNITS="),
                refused("jcamp-squeezed.dx", "the block has no ##XUNITS="),
                // §2: absorbance; below 220 nm the diode array reads negative A (T up to 5.37): that noise region is left out
                warns("uv-link.jdx", "the file holds 2 spectra",
                        "noise region at the short-wavelength end, 190–255 nm (66 points), left out",
                        "20 readings above 100 %T (highest 104.7 %T) between 975 and 1100 nm",
                        "1 readings above 105 %T (highest 106.6 %T) at 1090 nm")
                        .points(845, 256, 1100).absorbance(1100, "-0.0042925"),
                // §2: reflectance in percent, not transmittance; ReferenceFilePreviewTest reads it with a y kind chosen
                refused("uv.jdx", "unknown y unit 'Reflectance'"),
                // §2: nanometre data labelled 1/CM and ARBITRARY UNITS
                refused("uv_ACD.jdx", "unknown y unit 'ARBITRARY UNITS'"),

                // §1
                warns("blckpac1.jdx", "the file holds 5 spectra", "##MINY=.19", "##MAXY=-.006136", "##FIRSTY=.19",
                        "6 readings above 100 %T")
                        .points(176, 350, 700).absorbance(700, "-0.006136").absorbance(350, "0.193442"),
                warns("dupinc1.jdx", "##MINY=0.0604")
                        .points(440, 250.0, 469.5).absorbance(250, "1.1663").absorbance(469.5, "0.1626")
                        .absorbance(445.0, "3.3747"),
                // §1: absorbance clipped at 3.000 is the instrument's floor T = 0.001
                warns("fixinc2.jdx", "instrument floor: 10 points at 0.1000 %T (12987–13927.6 nm)")
                        .points(3601, 2500, 25000).detectionLimit("0.001"),
                warns("jtpolys.jdx", "369 readings above 100 %T (highest 102.3 %T)")
                        .points(1844, cm(4002.28), cm(447.48)).t(cm(447.48), "0.981633").t(cm(4002.28), "0.986610"),
                warns("jtpolysd.jdx", "##MAXY=1.022816066", "##FIRSTY=9.81633484363556E-0001",
                        "459 readings above 100 %T (highest 102.5 %T)")
                        .points(1844, cm(4002.28), cm(447.48)).t(cm(447.48), "0.983376"),
                // §1: percent values under a TRANSMITTANCE header: read as fractions every point is beyond the
                // drift limit and stored at the 1.5 ceiling; the warning says to choose percent, the next row does
                warns("pacdec1.jdx", "looks like percent; force TRANSMITTANCE_PERCENT", "3301 readings above 105 %T")
                        .points(3301, 2500, cm(700)).t(cm(4000), "1.5"),
                warns("pacdec1.jdx", "YUNITS=TRANSMITTANCE overridden: read as TRANSMITTANCE_PERCENT",
                        "2483 readings above 100 %T (highest 101.9 %T)")
                        .given("y kind %T", PERCENT)
                        .points(3301, 2500, cm(700)).percent(cm(4000), "101.60").percent(cm(700), "101.24"),
                warns("sqzdupd1.jdx", "looks like percent", "6089 readings above 100 %T", "271 readings above 105 %T")
                        .points(18669, cm(5000.03), cm(499.96)).t(cm(5000.03), "0.98287").t(cm(499.96), "1.26502"),
                warns("xyinc1.jdx", "9 readings below 0 %T (lowest -0.23 %T)")
                        .values("ReferenceFilePreviewTest, JcampReferenceFilesTest"),

                // §3
                warns("example_compound_file.jdx", "the file holds 2 spectra")
                        .points(2074, cm(11995.21), cm(3999.691)).absorbance(cm(11995.21), "0.032112")
                        .absorbance(cm(3999.691), "0.52175"),
                warns("isopropanol_ASDF.jdx", "##FIRSTY=0", "1329 readings above 100 %T", "4 readings above 105 %T")
                        .points(9541, cm(5000.04), cm(400.20)).absorbance(cm(400.20), "0.03005")
                        .absorbance(cm(5000.04), "0.001875"),
                // §4: 399.21 cm⁻¹ is 25049 nm, just beyond the 25,000 nm a curve may reach
                refused("SBO.jdx", "wavelength must be from 100 to 25000 nm, the curve holds 25049"),

                // §5: the four refractive-index tables (named by glob: their names are their authors')
                refused("*.yml", "looks like a refractive-index table"),

                // §8: percent without a percent header; the instrument's clamp at 0.01 %T is its floor
                warns("polycarbonate-sheet-3mm.csv", sdTooWide(24, "282.0 and 356.0"), NOT_PERCENT_OR_FRACTION,
                        "instrument floor: 127 points at 0.01000 %T (190–357 nm)")
                        .points(911, 190, 1100).percent(300, "0.01").percent(400, "53.09").percent(550, "87.24")
                        .detectionLimit("0.0001"),
                warns("acrylic-clear-3mm.csv", sdTooWide(8, "195.0 and 219.0"), NOT_PERCENT_OR_FRACTION,
                        "instrument floor: 34 points at 0.01000 %T (190–239 nm)")
                        .values("ReferenceFilePreviewTest"),
                warns("acrylic-uv-absorbing-3mm.csv", sdTooWide(27, "254.0 and 347.0"), NOT_PERCENT_OR_FRACTION,
                        "instrument floor: 91 points at 0.01000 %T (190–335 nm)")
                        .values("MeasuredFloorTest"),
                warns("glass-dish-cover.csv", sdTooWide(5, "197.0 and 223.0"), "instrument floor: 35 points at 0.01000 %T (198–264 nm)")
                        .points(911, 190, 1100).percent(300, "9.01").percent(400, "90.44").percent(550, "91.25"),
                warns("longpass-filter-glass-295nm-2mm.csv", sdTooWide(4, "225.0 and 233.0"),
                        "instrument floor: 17 points at 0.01000 %T (200–238 nm)")
                        .points(911, 190, 1100).percent(300, "62.95").percent(400, "91.57").percent(550, "91.84"),
                // §8: the empty beam, about 100 %T: reference drift of a few tenths of a percent
                warns("instrument-blank.csv", "869 readings above 100 %T (highest 100.4 %T)")
                        .points(911, 190, 1100).percent(300, "100.03").percent(400, "100.02"),
                // §8: the blocked beam sits on the floor nearly everywhere
                warns("instrument-dark.csv", sdTooWide(276, "194.0 and 1100.0"), "instrument floor: 609 points at 0.01000 %T")
                        .points(911, 190, 1100).percent(300, "0.01").detectionLimit("0.0001"),
                // §8: two replicate column pairs; the first is read (ReferenceFilesTest reads both)
                warns("ldpe-film-50um.txt", "2 value columns found; only the first", NOT_PERCENT_OR_FRACTION)
                        .points(611, 190, 800).percent(300, "85.6").percent(400, "89.4").percent(550, "90.3"),
                warns("acetate-film-115um.txt", NOT_PERCENT_OR_FRACTION)
                        .points(911, 190, 1100).percent(300, "61.71").percent(400, "88.42").percent(550, "90.83"),
                warns("acetate-film-480um.txt", NOT_PERCENT_OR_FRACTION)
                        .points(911, 190, 1100).percent(300, "19.38").percent(400, "76.53").percent(550, "84.84"),
                // §8: written to 0.1 %T; the far UV reads 0.3 %T at many points, which is its floor
                warns("pet-film-125um.txt", NOT_PERCENT_OR_FRACTION, "instrument floor: 19 points at 0.3000 %T (255–302 nm)")
                        .points(611, 190, 800).percent(300, "0.3").percent(400, "91.3").percent(550, "92.1"));
    }

    private static ImportService imports;
    private static SpectrumImportService spectra;

    @BeforeAll
    static void freshLibrary() {
        DSLContext db = MigratedDatabase.freshH2();
        imports = new ImportService(new JooqLibraryRepository(db), () -> { }, ImportProperties.defaults());
        ReferenceSpectrumRepository repository = new ReferenceSpectrumRepository(db);
        spectra = new SpectrumImportService(repository, new ImportedSpectrumLookup(repository, SpectrumLookup.builtIn()),
                ImportProperties.defaults());
    }

    @Test
    void everyReferenceFileHasARow() {
        List<Path> inFolder = SharedFolder.referenceFiles();
        List<PathMatcher> rows = rows().map(r -> FileSystems.getDefault().getPathMatcher("glob:" + r.file())).toList();

        Set<String> withoutRow = inFolder.stream().filter(p -> rows.stream().noneMatch(m -> m.matches(p.getFileName())))
                .map(p -> p.getFileName().toString()).collect(Collectors.toCollection(TreeSet::new));
        Set<String> withoutFile = rows().filter(r -> inFolder.stream().noneMatch(p -> FileSystems.getDefault()
                .getPathMatcher("glob:" + r.file()).matches(p.getFileName()))).map(Row::file)
                .collect(Collectors.toCollection(TreeSet::new));

        assertThat(withoutRow).as("files of reference-data without a row in this table").isEmpty();
        assertThat(withoutFile).as("rows for files the folder does not hold").isEmpty();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void importGivesTheStatedOutcome(Row row) throws Exception {
        for (Path file : SharedFolder.referenceFilesNamed(row.file())) {
            // a row naming files by glob is checked on each, and its messages name the file checked
            importGivesTheStatedOutcome(row.named(file.getFileName().toString()), file);
        }
    }

    private static void importGivesTheStatedOutcome(Row row, Path file) throws Exception {
        byte[] bytes = Files.readAllBytes(file);

        ImportResult result = null;
        Exception refusal = null;
        try {
            result = store(row, bytes);
        } catch (ImportException | IngestException | ImportLimitException e) {
            refusal = e; // a user's file refused, naming file, line and field; anything else fails the test
        }
        boolean refusedRow = row.outcome() == Outcome.REFUSED || row.outcome() == Outcome.IS_A_REFERENCE_SPECTRUM;
        if (refusedRow && result != null) {
            fail("%s was stored, not refused%n  now: warns(\"%s\", %s)", row, row.file(), quoted(result.warnings()));
        }
        if (!refusedRow && refusal != null) {
            fail("%s was refused, not stored%n  now: refused(\"%s\", \"%s\")", row, row.file(), refusal.getMessage());
        }
        if (refusedRow) {
            assertThat(refusal.getMessage()).as("%s: the refusal%n  now: refused(\"%s\", \"%s\")", row, row.file(),
                    refusal.getMessage()).contains(row.messages().get(0));
        } else {
            assertStored(row, result);
        }
        if (row.outcome() == Outcome.IS_A_REFERENCE_SPECTRUM) {
            assertSpectrum(row, bytes);
        }
    }

    /** Stores under a material of its own (fixed, 1 mm, n 1.5: nothing about the specimen can warn). */
    private static ImportResult store(Row row, byte[] bytes) throws ImportException {
        ImportTarget target = new ImportTarget.NewMaterial("Reference check " + UUID.randomUUID(),
                MaterialClass.of("plastic sheet"), Scaling.FIXED, new ConstantIndex(1.5), "");
        return imports.store(row.file(), bytes, row.options(), target, SampleFields.thickness(1));
    }

    private static void assertStored(Row row, ImportResult result) {
        assertWarnings(row, result.warnings(), row.outcome() == Outcome.IMPORTS ? List.of() : row.messages());
        Curve c = result.preview().curve();
        assertPoints(row, c.size(), c.minWavelengthNm(), c.maxWavelengthNm());
        for (Check check : row.checks()) {
            double actual = switch (check.what()) {
                case "T" -> c.transmittance(nearest(c.wavelengthsNm(), check.nm()));
                case "%T" -> 100 * c.transmittance(nearest(c.wavelengthsNm(), check.nm()));
                case "A" -> -Math.log10(c.transmittance(nearest(c.wavelengthsNm(), check.nm())));
                case "limit" -> result.preview().detectionLimit();
                default -> throw new IllegalArgumentException("not a curve check: " + check);
            };
            assertClose(row, check, actual);
        }
    }

    private static String quoted(List<String> warnings) {
        return warnings.stream().map(w -> "\"" + w.replace("\"", "\\\"") + "\"").collect(Collectors.joining(", "));
    }

    private static void assertSpectrum(Row row, byte[] bytes) throws ImportException {
        AsSpectrum as = row.spectrum();
        String name = "reference-check-" + Math.abs(row.file().hashCode());
        ImportedSpectrum imported = spectra.importSpectrum(as.kind(), name, null, null, row.file(), bytes,
                SpectrumImportOptions.parse(null, null, null, as.valueColumn(), null, null));
        assertWarnings(row, imported.warnings(), row.messages().subList(1, row.messages().size()));
        var s = imported.spectrum();
        assertPoints(row, s.pointCount(), s.minNm(), s.maxNm());
        double[] nm = s.wavelengthsNm();
        double[] v = s.values();
        for (Check check : row.checks()) {
            double actual = switch (check.what()) {
                case "value" -> v[nearest(nm, check.nm())];
                case "sum" -> Arrays.stream(v).sum();
                case "peak" -> nm[peak(v)];
                default -> throw new IllegalArgumentException("not a spectrum check: " + check);
            };
            assertClose(row, check, actual);
        }
    }

    /** Every warning matches one fragment, in any order, and there are no others. */
    private static void assertWarnings(Row row, List<String> actual, List<String> fragments) {
        List<String> unmatched = new ArrayList<>(actual);
        List<String> missing = new ArrayList<>();
        for (String fragment : fragments) {
            Optional<String> hit = unmatched.stream().filter(w -> w.contains(fragment)).findFirst();
            hit.ifPresentOrElse(unmatched::remove, () -> missing.add(fragment));
        }
        if (!missing.isEmpty() || !unmatched.isEmpty()) {
            fail("%s: warnings differ from the row%n  expected fragments not found: %s%n  warnings the row does not"
                    + " list: %s%n  all warnings now:%n    %s", row, missing, unmatched, String.join("\n    ", actual));
        }
    }

    private static void assertPoints(Row row, int n, double min, double max) {
        if (row.points() != null) {
            assertThat(n).as("%s: points", row).isEqualTo(row.points());
            // within 0.01 nm, or 0.05 % where a wavenumber grid is converted from rounded SOURCES.md values
            assertThat(min).as("%s: shortest wavelength", row).isCloseTo(row.fromNm(), within(Math.max(0.01, 5e-4 * min)));
            assertThat(max).as("%s: longest wavelength", row).isCloseTo(row.toNm(), within(Math.max(0.01, 5e-4 * max)));
        }
    }

    private static void assertClose(Row row, Check check, double actual) {
        BigDecimal written = new BigDecimal(check.expected());
        double tolerance = 0.5 * Math.pow(10, -Math.max(written.scale(), 0)) + 1e-12;
        assertThat(actual).as("%s: %s at %s nm (SOURCES.md gives %s)", row, check.what(), check.nm(), check.expected())
                .isCloseTo(written.doubleValue(), within(tolerance));
    }

    /** The point nearest {@code nm}, which must be within 0.05 % of it (wavenumber grids convert inexactly). */
    private static int nearest(double[] nm, double wanted) {
        int best = 0;
        for (int i = 1; i < nm.length; i++) {
            if (Math.abs(nm[i] - wanted) < Math.abs(nm[best] - wanted)) {
                best = i;
            }
        }
        assertThat(nm[best]).as("a point at %s nm", wanted).isCloseTo(wanted, within(5e-4 * wanted));
        return best;
    }

    private static int peak(double[] v) {
        int best = 0;
        for (int i = 1; i < v.length; i++) {
            if (v[i] > v[best]) {
                best = i;
            }
        }
        return best;
    }
}
