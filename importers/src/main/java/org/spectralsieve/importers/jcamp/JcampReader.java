package org.spectralsieve.importers.jcamp;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.ReadOptions;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.importers.SpectrumValuesOptions;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;

/**
 * Reads JCAMP-DX 4.24 and 5.01 spectra: {@code ##XYDATA=(X++(Y..Y))} in AFFN or ASDF (SQZ, DIF, DUP,
 * PAC), {@code ##XYPOINTS=(XY..XY)} and {@code ##PEAK TABLE=(XY..XY)}; LINK files with several blocks.
 *
 * <p>XUNITS NANOMETERS, MICROMETERS, ANGSTROMS or 1/CM (λ = 10⁷/ν̃, no points invented); YUNITS
 * TRANSMITTANCE, ABSORBANCE or a percent-transmittance form, otherwise an error unless the options
 * force a y kind. When x runs downwards after conversion the arrays are reversed. Every label of the
 * chosen block except the data table becomes metadata under its name as written (lower-cased), plus
 * {@code jcamp block} = the block's index. Values that disagree with the data without spoiling it
 * (MINY, MAXY, FIRSTY, DELTAX; percent-looking values under a fraction unit; 1/CM over a range that
 * looks like nanometres) become warnings.
 *
 * <p>Every refusal is an {@link ImportException} naming the file, line and label. Instances hold no
 * state and may be shared.
 */
public final class JcampReader {

    /** Above this a value declared as a transmittance fraction is surely percent (noise gives 1.05, not 1.5). */
    static final double PERCENT_LOOKING = 1.5;

    public ParsedSpectrum read(Path file) throws ImportException {
        return read(file, JcampOptions.defaults());
    }

    public ParsedSpectrum read(Path file, JcampOptions options) throws ImportException {
        String name = String.valueOf(file.getFileName());
        try (Reader in = open(name, file)) {
            return read(name, in, options);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot close: " + e.getMessage());
        }
    }

    public ParsedSpectrum read(String sourceName, Reader in) throws ImportException {
        return read(sourceName, in, JcampOptions.defaults());
    }

    public ParsedSpectrum read(String sourceName, Reader in, JcampOptions options) throws ImportException {
        return read(sourceName, blocks(sourceName, in), options);
    }

    /**
     * Reads the block the options choose from blocks already decoded by {@link #blocks}, with the warning
     * that lists the blocks left out; lets a caller that also lists or reads the other blocks decode once.
     */
    public ParsedSpectrum read(String sourceName, List<JcampBlock> blocks, JcampOptions options)
            throws ImportException {
        JcampBlock chosen = pick(sourceName, blocks, options);
        return new SpectrumBuilder(sourceName, chosen, options.read(), leftOut(blocks, chosen)).build();
    }

    /**
     * Reads one block of a file whose every block is imported on its own: as {@link #read}, without the
     * warning about blocks left out (none is). The block's own warnings are kept.
     */
    public ParsedSpectrum readOne(String sourceName, JcampBlock block, JcampOptions options) throws ImportException {
        if (!block.hasData()) {
            throw new ImportException(sourceName, block.startLine(), null, "block " + block.index() + " ('"
                    + block.title() + "') holds no ##XYDATA, ##XYPOINTS or ##PEAK TABLE");
        }
        return new SpectrumBuilder(sourceName, block, options.read(), List.of()).build();
    }

    /**
     * One warning when the file holds more spectra than the one read, listing each block with data (its
     * index as the block option takes it, title, points and x range in the file's units), so that a
     * time series or a compound file is never cut to its first spectrum without a word.
     */
    static List<String> leftOut(List<JcampBlock> blocks, JcampBlock chosen) {
        List<JcampBlock> withData = blocks.stream().filter(JcampBlock::hasData).toList();
        if (withData.size() < 2) {
            return List.of();
        }
        StringBuilder w = new StringBuilder("the file holds " + withData.size() + " spectra: ");
        for (int i = 0; i < withData.size(); i++) {
            JcampBlock b = withData.get(i);
            double[] x = b.x();
            w.append(i == 0 ? "" : "; ").append("block ").append(b.index()).append(" '").append(b.title())
                    .append("' (").append(x.length).append(" points, x ")
                    .append(x.length == 0 ? "none" : x[0] + "–" + x[x.length - 1])
                    .append(b.label(Labels.XUNITS).map(u -> " " + u).orElse("")).append(')');
        }
        w.append(". Imported block ").append(chosen.index()).append(" only; the other ").append(withData.size() - 1)
                .append(withData.size() == 2 ? " was" : " were").append(" left out (choose another with the block"
                        + " option; a curve import can also store each block as its own sample with eachBlock)");
        return List.of(w.toString());
    }

    /**
     * Reads one block as relative values (a source's power, a response's weights) instead of a
     * transmittance: x units as for {@link #read}, {@code ##YUNITS=} recorded but not interpreted, values
     * kept as written (no percent guess, absorbance not converted). A missing {@code ##XUNITS=} is allowed
     * when the options give the x unit. Points flagged below detection are refused: a bound is no weight.
     */
    public SpectrumValues readValues(String sourceName, Reader in, SpectrumValuesOptions options)
            throws ImportException {
        List<JcampBlock> blocks = blocks(sourceName, in);
        JcampOptions choice = options.jcampBlock().isPresent()
                ? JcampOptions.defaults().withBlock(options.jcampBlock().getAsInt()) : JcampOptions.defaults();
        JcampBlock chosen = pick(sourceName, blocks, choice);
        return new SpectrumBuilder(sourceName, chosen, choice.read(), leftOut(blocks, chosen)).buildValues(options);
    }

    /** Every block of the file in order (for LINK files), each decoded and checked against its header. */
    public List<JcampBlock> blocks(Path file) throws ImportException {
        String name = String.valueOf(file.getFileName());
        try (Reader in = open(name, file)) {
            return blocks(name, in);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot close: " + e.getMessage());
        }
    }

    /** Reads {@code in} to its end; does not close it (the caller opened it). */
    public List<JcampBlock> blocks(String sourceName, Reader in) throws ImportException {
        TextLines text;
        try {
            text = TextLines.read(in);
        } catch (IOException e) {
            throw new ImportException(sourceName, 0, null, "cannot read: " + e.getMessage(), e);
        }
        try {
            return List.copyOf(new BlockScanner(sourceName, text).scan());
        } catch (RuntimeException e) {
            // a guard, not a path: any slip in the decoder must still reach the user as an import error
            throw new ImportException(sourceName, 0, null, "cannot decode: " + e, e);
        }
    }

    /**
     * JCAMP-DX is ASCII by the standard, but real files carry °, µ or Å in comments and titles, some as
     * UTF-8 (what {@link JcampWriter}'s text becomes when saved by this project), older ones as
     * Latin-1. Strict UTF-8 first; bytes that are not UTF-8 are read as ISO-8859-1, which accepts any
     * byte and leaves ASCII unchanged.
     */
    private static Reader open(String name, Path file) throws ImportException {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
        }
        try {
            return new StringReader(StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString());
        } catch (CharacterCodingException notUtf8) {
            return new StringReader(new String(bytes, StandardCharsets.ISO_8859_1));
        }
    }

    private static JcampBlock pick(String source, List<JcampBlock> blocks, JcampOptions options)
            throws ImportException {
        if (options.block().isPresent()) {
            int i = options.block().getAsInt();
            if (i >= blocks.size()) {
                throw ImportException.ofSource(source, "block " + i + " asked for, the file has " + blocks.size()
                        + " blocks (0…" + (blocks.size() - 1) + ")");
            }
            JcampBlock b = blocks.get(i);
            if (!b.hasData()) {
                throw new ImportException(source, b.startLine(), null, "block " + i + " ('" + b.title()
                        + "') holds no ##XYDATA, ##XYPOINTS or ##PEAK TABLE");
            }
            return b;
        }
        for (JcampBlock b : blocks) {
            if (b.hasData()) {
                return b;
            }
        }
        throw ImportException.ofSource(source, "no ##XYDATA, ##XYPOINTS or ##PEAK TABLE in any block"
                + (blocks.isEmpty() ? " (no ## labels at all: not a JCAMP-DX file?)" : ""));
    }

    /** Interprets one decoded block: units, order, metadata. */
    private static final class SpectrumBuilder {
        private final String source;
        private final JcampBlock block;
        private final ReadOptions options;
        private final List<String> warnings = new ArrayList<>();

        SpectrumBuilder(String source, JcampBlock block, ReadOptions options, List<String> fileWarnings) {
            this.source = source;
            this.block = block;
            this.options = options;
            this.warnings.addAll(fileWarnings);
        }

        ParsedSpectrum build() throws ImportException {
            warnings.addAll(block.warnings());
            overridesThatDoNotApply();
            XUnit xUnit = xUnit();
            Optional<String> xContradiction = xContradiction(xUnit, block.x());
            YKind yKind = yKind(xContradiction);
            xContradiction.ifPresent(warnings::add);
            double[] x = nanometres(xUnit);
            double[] y = block.y();
            boolean[] bounds = block.upperBounds();
            int[] lines = new int[x.length];
            for (int i = 0; i < lines.length; i++) {
                lines[i] = block.pointLine(i);
            }
            boolean reversed = checkMonotonic(x) < 0;
            if (reversed) {
                reverse(x);
                reverse(y);
                reverse(bounds);
                reverse(lines);
            }
            warnAboutRanges(xUnit, yKind, block.x(), y);
            try {
                return AbsorbanceSd.attach(source, block,
                        ParsedSpectrum.of(source, x, y, bounds, yKind, xUnit, metadata(), warnings).withLines(lines),
                        reversed);
            } catch (IllegalArgumentException e) {
                throw new ImportException(source, block.startLine(), block.dataLabel(), e.getMessage(), e);
            }
        }

        SpectrumValues buildValues(SpectrumValuesOptions options) throws ImportException {
            warnings.addAll(block.warnings());
            XUnit xUnit = valuesXUnit(options);
            double[] x = nanometres(xUnit);
            double[] y = block.y();
            int[] lines = new int[x.length];
            for (int i = 0; i < lines.length; i++) {
                lines[i] = block.pointLine(i);
            }
            boolean[] bounds = block.upperBounds();
            for (int i = 0; i < bounds.length; i++) {
                if (bounds[i]) {
                    throw new ImportException(source, lines[i], Labels.field(Labels.BELOW_DETECTION_AS_WRITTEN),
                            "point " + i + " is marked below detection (an upper bound of a transmittance); a"
                                    + " relative power or weight must be a plain value");
                }
            }
            if (checkMonotonic(x) < 0) {
                reverse(x);
                reverse(y);
                reverse(lines);
            }
            Optional<Ldr> yUnits = block.ldr(Labels.YUNITS);
            yUnits.filter(u -> JcampUnits.yKind(u.value()).isPresent()).ifPresent(u -> warnings.add("YUNITS="
                    + u.value() + ": the ordinates are read as relative values exactly as written; absorbance is"
                    + " not converted to transmittance, percent is not divided by 100"));
            if (options.valueColumn().isPresent()) {
                warnings.add("value column '" + options.valueColumn().get() + "' ignored: a JCAMP-DX block has one"
                        + " ordinate");
            }
            String field = block.dataLabel();
            return SpectrumValues.of(source, x, y, lines, xUnit, field, metadata(), warnings);
        }

        /** The forced unit wins (with a note when XUNITS says otherwise); without either, refused. */
        private XUnit valuesXUnit(SpectrumValuesOptions options) throws ImportException {
            Optional<Ldr> l = block.ldr(Labels.XUNITS);
            if (options.xUnit().isEmpty() || l.isEmpty()) {
                return options.xUnit().isPresent() ? options.xUnit().get() : xUnit();
            }
            Optional<XUnit> declared = JcampUnits.xUnit(l.get().value());
            if (declared.isEmpty() || declared.get() != options.xUnit().get()) {
                warnings.add("XUNITS=" + l.get().value() + " overridden: x read in " + options.xUnit().get());
            }
            return options.xUnit().get();
        }

        /** x converted to nm; at least two points, each a positive wavelength. */
        private double[] nanometres(XUnit xUnit) throws ImportException {
            double[] x = block.x();
            for (int i = 0; i < x.length; i++) {
                double nm = xUnit.toNanometres(x[i]);
                if (!(Double.isFinite(nm) && nm > 0)) {
                    throw new ImportException(source, block.pointLine(i), block.dataLabel(), "x " + x[i]
                            + " (point " + i + ") is not a positive wavelength in " + xUnit);
                }
                x[i] = nm;
            }
            if (x.length < ParsedSpectrum.MIN_POINTS) {
                throw new ImportException(source, block.pointLine(0), block.dataLabel(), "only " + x.length
                        + " point; a curve needs at least " + ParsedSpectrum.MIN_POINTS);
            }
            return x;
        }

        /** The x unit the read options force wins over XUNITS, with a note when they differ. */
        private XUnit xUnit() throws ImportException {
            Optional<Ldr> l = block.ldr(Labels.XUNITS);
            if (options.xUnit().isPresent()) {
                XUnit forced = options.xUnit().get();
                Optional<XUnit> declared = l.flatMap(u -> JcampUnits.xUnit(u.value()));
                if (l.isPresent() && (declared.isEmpty() || declared.get() != forced)) {
                    warnings.add("XUNITS=" + l.get().value() + " overridden: x read in " + forced
                            + " as the x unit option says");
                }
                return forced;
            }
            if (l.isEmpty()) {
                throw new ImportException(source, block.startLine(), Labels.field(Labels.XUNITS),
                        "missing: the block has no ##XUNITS=, so its x cannot be read as wavelengths; set the x"
                                + " unit (xUnit: nm, um, angstrom or cm-1) when importing");
            }
            return JcampUnits.xUnit(l.get().value()).orElseThrow(() -> new ImportException(source, l.get().line(),
                    Labels.field(l.get().name()), "unknown x unit '" + l.get().value()
                            + "' (known: NANOMETERS, MICROMETERS, ANGSTROMS, 1/CM); set the x unit (xUnit: nm, um,"
                            + " angstrom or cm-1) when importing"));
        }

        /**
         * XUNITS=1/CM over x values that all lie within 150–1100, the span of UV to near-infrared wavelengths in
         * nm: as wavenumbers they would be far-infrared wavelengths of 9–67 µm, which a UV-visible file does not
         * hold. Said as a warning (a far-infrared file is possible), naming the option that reads them as nm.
         */
        private Optional<String> xContradiction(XUnit xUnit, double[] fileX) {
            if (xUnit != XUnit.WAVENUMBER_PER_CM || options.xUnit().isPresent()) {
                return Optional.empty();
            }
            double lo = Math.min(fileX[0], fileX[fileX.length - 1]);
            double hi = Math.max(fileX[0], fileX[fileX.length - 1]);
            if (!(lo >= 150 && hi <= 1100)) {
                return Optional.empty();
            }
            String xunits = block.ldr(Labels.XUNITS).map(Ldr::value).orElse("1/CM");
            return Optional.of("XUNITS=" + xunits + " contradicts the x values: they run " + plain(lo) + "–"
                    + plain(hi) + ", a range of UV to near-infrared wavelengths in nm, but read as wavenumbers they"
                    + " are " + plain(Math.round(XUnit.WAVENUMBER_PER_CM.toNanometres(hi))) + "–"
                    + plain(Math.round(XUnit.WAVENUMBER_PER_CM.toNanometres(lo)))
                    + " nm (far infrared); if they are nanometres, set the x unit to nm (xUnit=nm)"
                    + block.ldr(Labels.DATA_TYPE).map(t -> " (the file's DATA TYPE says " + t.value().strip() + ")")
                            .orElse(""));
        }

        private static String plain(double v) {
            return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
        }

        /** Columns and a decimal comma apply to delimited text; a JCAMP-DX block has one x and one y. */
        private void overridesThatDoNotApply() {
            if (options.columnsChosen()) {
                warnings.add("xColumn/yColumn ignored: a JCAMP-DX block has one abscissa and one ordinate");
            }
            if (options.decimalMark().filter(m -> m != org.spectralsieve.importers.DecimalMark.POINT).isPresent()) {
                warnings.add("decimal mark option ignored: JCAMP-DX numbers are written with a decimal point");
            }
        }

        private YKind yKind(Optional<String> xContradiction) throws ImportException {
            String also = xContradiction.map(c -> ". Also: " + c).orElse("");
            Optional<Ldr> l = block.ldr(Labels.YUNITS);
            Optional<YKind> declared = l.flatMap(u -> JcampUnits.yKind(u.value()));
            if (options.yKind().isPresent()) {
                YKind forced = options.yKind().get();
                if (declared.isPresent() && declared.get() != forced) {
                    warnings.add("YUNITS=" + l.get().value() + " overridden: read as " + forced);
                }
                return forced;
            }
            if (l.isEmpty()) {
                throw new ImportException(source, block.startLine(), Labels.field(Labels.YUNITS),
                        "missing: the block has no ##YUNITS=; set the y kind (yKind: absorbance, percent or"
                                + " fraction) when importing" + also);
            }
            return declared.orElseThrow(() -> new ImportException(source, l.get().line(),
                    Labels.field(l.get().name()), "unknown y unit '" + l.get().value() + "' (known: TRANSMITTANCE,"
                            + " ABSORBANCE, %T / PERCENT TRANSMITTANCE): the values cannot be read as transmittance"
                            + " without knowing; set the y kind (yKind: absorbance, percent or fraction) when"
                            + " importing" + also));
        }

        /** Returns +1 for increasing, −1 for decreasing; refuses a reversal, naming both lines. */
        private int checkMonotonic(double[] x) throws ImportException {
            int direction = x[1] > x[0] ? 1 : -1;
            for (int i = 1; i < x.length; i++) {
                double d = x[i] - x[i - 1];
                if (!(direction > 0 ? d > 0 : d < 0)) {
                    throw new ImportException(source, block.pointLine(i), block.dataLabel(), "x is not monotonic: "
                            + "point " + i + " (line " + block.pointLine(i) + ") at " + x[i] + " nm follows point "
                            + (i - 1) + " (line " + block.pointLine(i - 1) + ") at " + x[i - 1] + " nm, but the"
                            + " data ran " + (direction > 0 ? "upwards" : "downwards") + " before");
                }
            }
            return direction;
        }

        private void warnAboutRanges(XUnit xUnit, YKind yKind, double[] fileX, double[] y) {
            if (yKind == YKind.TRANSMITTANCE_FRACTION) {
                double max = Double.NEGATIVE_INFINITY;
                for (double v : y) {
                    max = Math.max(max, v);
                }
                if (max > PERCENT_LOOKING) {
                    warnings.add("YUNITS say transmittance as a fraction but values reach " + max
                            + ": looks like percent; force TRANSMITTANCE_PERCENT if so");
                }
            }
        }

        private Map<String, String> metadata() {
            Map<String, String> m = new LinkedHashMap<>();
            for (Ldr l : block.ldrs()) {
                if (!Labels.isDataTable(l.canonical()) && !l.canonical().equals(Labels.BELOW_DETECTION)
                        && !l.canonical().equals(Labels.ABSORBANCE_SD)) {
                    m.putIfAbsent(l.name(), l.value());
                }
            }
            m.putIfAbsent("jcamp block", Integer.toString(block.index()));
            return m;
        }

        private static void reverse(double[] a) {
            for (int i = 0, j = a.length - 1; i < j; i++, j--) {
                double t = a[i];
                a[i] = a[j];
                a[j] = t;
            }
        }

        private static void reverse(int[] a) {
            for (int i = 0, j = a.length - 1; i < j; i++, j--) {
                int t = a[i];
                a[i] = a[j];
                a[j] = t;
            }
        }

        private static void reverse(boolean[] a) {
            for (int i = 0, j = a.length - 1; i < j; i++, j--) {
                boolean t = a[i];
                a[i] = a[j];
                a[j] = t;
            }
        }
    }
}
