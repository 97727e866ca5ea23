package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Reads the requirement language: plain-words clauses joined by "and" or commas, for example
 * {@code passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm, class plastic sheet}.
 *
 * <pre>
 * requirement = item { ( "," [ "and" ] | "and" ) item }
 * item        = transmittance | cutoff | preset | critical                (SpectralClauseParser, FigureClauseParser)
 *             | thickness | class | geometry | layer
 * thickness   = "thickness" [ "at" ] ( "as" "measured" | mm [ "mm" ] ( "to" | "-" ) mm "mm" | mm "mm" )
 *             | "at" mm "mm"
 * class       = [ "material" ] "class" label        (label: the words up to the next "," or "and")
 * geometry    = "geometry" ( "regular" | "total" | "any" )
 * layer       = ( "behind" | "on" ) mm "mm" material   (material: the words up to the next "," or "and")
 * </pre>
 *
 * Keywords are case-insensitive. At least one spectral clause is required; thickness, class, geometry and
 * a fixed layer may each be given once. Emitter and response names are read against a
 * {@link SpectrumLookup}; a layer's material words are kept as written and resolved against the library
 * by the caller. Every problem is a {@link RequirementSyntaxException}.
 */
public final class RequirementParser {

    private static final String EXAMPLE = "'passes over 80% at 365 nm'";
    private static final Expected ITEM = Expected.keywords("passes", "blocks", "mean", "OD", "cutoff", "over",
            "under", "erythemal", "uv hazard", "luminous", "critical wavelength", "thickness", "at", "class", "geometry", "behind",
            "on").because("to start a clause");

    private final TokenCursor in;
    private final SpectralClauseParser spectral;
    private final FigureClauseParser figures;
    private final List<Clause> clauses = new ArrayList<>();
    private ThicknessSpec thickness = ThicknessSpec.AS_MEASURED;
    private String thicknessText;
    private String materialClass;
    private String classText;
    private String geometry;
    private String geometryText;
    private FixedLayer layer;

    private RequirementParser(String text, SpectrumLookup spectra) {
        this.in = new TokenCursor(text);
        this.spectral = new SpectralClauseParser(in, new SpectrumNames(in, spectra));
        this.figures = new FigureClauseParser(in, spectral, spectra);
    }

    /**
     * Reads a text naming only built-in emitters and responses; where imported spectra exist, use
     * {@link #parse(String, SpectrumLookup)} with the application's lookup.
     *
     * @throws RequirementSyntaxException for any text that is not a valid requirement, null included
     */
    public static Requirement parse(String text) {
        return parse(text, SpectrumLookup.builtIn());
    }

    /**
     * @param spectra where emitter and response names resolve
     * @throws RequirementSyntaxException for any text that is not a valid requirement, null included
     */
    public static Requirement parse(String text, SpectrumLookup spectra) {
        if (text == null) {
            throw new RequirementSyntaxException(0, "a requirement such as " + EXAMPLE, "nothing", null);
        }
        return new RequirementParser(text, java.util.Objects.requireNonNull(spectra, "spectra")).requirement();
    }

    /** The canonical text of a requirement; {@code parse(render(r))} equals r apart from the text fields. */
    public static String render(Requirement requirement) {
        return RequirementRenderer.render(requirement);
    }

    private Requirement requirement() {
        if (in.at(Kind.END)) {
            throw in.error(Expected.described("a requirement such as " + EXAMPLE));
        }
        do {
            item();
        } while (separator());
        if (!in.at(Kind.END)) {
            throw in.error(Expected.keywords(",", "and").or("end of text").because("after a clause"));
        }
        if (clauses.isEmpty()) {
            throw new RequirementSyntaxException(0, "a spectral clause such as " + EXAMPLE,
                    "only '" + in.slice(0, in.text().length()) + "'", null);
        }
        String text = in.slice(0, in.text().length());
        return TokenCursor.build(in.peek(), () -> new Requirement(clauses, thickness,
                Optional.ofNullable(materialClass), Optional.ofNullable(geometry), Optional.ofNullable(layer), text));
    }

    private boolean separator() {
        if (in.at(Kind.COMMA)) {
            in.next();
            in.acceptWord("and");
            return true;
        }
        return in.acceptWord("and");
    }

    private void item() {
        Token first = in.peek();
        String word = first.kind() == Kind.WORD ? first.lower() : "";
        switch (word) {
            case "passes", "pass", "blocks", "block" -> clauses.add(spectral.transmittance(first, in.next()));
            case "mean", "od", "over", "above", "under", "below", "more", "less" ->
                    clauses.add(spectral.transmittance(first, null));
            case "cutoff", "cut-off" -> clauses.add(spectral.cutoff(first));
            case "erythemal" -> clauses.add(figures.erythemal(first));
            case "uv", "uv-hazard" -> clauses.add(figures.uvHazard(first));
            case "luminous" -> clauses.add(figures.luminous(first));
            case "critical" -> clauses.add(figures.criticalWavelength(first));
            case "behind", "on" -> layer(first);
            case "thickness" -> thickness(first);
            case "class", "material" -> materialClass(first);
            case "geometry" -> geometry(first);
            case "at" -> atItem(first);
            default -> otherItem(first);
        }
    }

    /** "at least 80% …" continues a clause; "at 3 mm" is a thickness; "at 365 nm" lacks its level. */
    private void atItem(Token first) {
        Token second = in.peek(1);
        if (second.kind() != Kind.NUMBER) {
            clauses.add(spectral.transmittance(first, null));
        } else if (SpectralClauseParser.isWavelengthUnit(in.peek(2))) {
            throw new RequirementSyntaxException(first.start(), "a level such as 'passes over 80%' before the wavelength",
                    "'" + in.slice(first.start(), in.peek(2).end()) + "'", null);
        } else {
            in.next();
            setThickness(first, fixedThickness());
        }
    }

    private void otherItem(Token first) {
        boolean levelFirst = first.kind() == Kind.NUMBER;
        if (levelFirst && (isCutoffWord(in.peek(1)) || in.peek(1).kind() == Kind.PERCENT && isCutoffWord(in.peek(2)))) {
            clauses.add(spectral.cutoff(first));
        } else if (levelFirst || first.kind() == Kind.AT_LEAST || first.kind() == Kind.AT_MOST) {
            clauses.add(spectral.transmittance(first, null));
        } else {
            throw in.error(ITEM);
        }
    }

    private static boolean isCutoffWord(Token t) {
        return t.isWord("cutoff") || t.isWord("cut-off");
    }

    private void thickness(Token first) {
        in.next();
        in.acceptWord("at");
        if (in.acceptWord("as")) {
            in.expectWord(Expected.keywords("measured").after("as"), "measured");
            setThickness(first, ThicknessSpec.AS_MEASURED);
            return;
        }
        Token minToken = in.peek();
        double min = millimetres(minToken, in.expectNumber(
                Expected.keywords("as measured").or("a thickness in mm").after(first.text())));
        boolean unit = in.acceptWord("mm");
        boolean range = in.acceptWord("to") || in.at(Kind.DASH) && in.next() != null;
        if (!range) {
            if (!unit) {
                in.expectWord(Expected.keywords("mm", "to", "-").after(minToken.text()), "mm");
            }
            setThickness(first, ThicknessSpec.at(min));
            return;
        }
        Token maxToken = in.peek();
        double max = millimetres(maxToken, in.expectNumber(Expected.described("a thickness in mm").after("to")));
        in.expectWord(Expected.keywords("mm").after(maxToken.text()), "mm");
        if (max < min) {
            throw TokenCursor.outOfRange(maxToken, "a thickness not below " + SpectralClauseParser.plain(min)
                    + " mm (a range runs from thin to thick)", maxToken.quoted());
        }
        setThickness(first, ThicknessSpec.range(min, max));
    }

    private ThicknessSpec fixedThickness() {
        Token number = in.peek();
        double mm = millimetres(number, in.expectNumber(Expected.described("a thickness in mm").after("at")));
        in.expectWord(Expected.keywords("mm").after(number.text()), "mm");
        return ThicknessSpec.at(mm);
    }

    private static double millimetres(Token number, BigDecimal value) {
        double mm = value.doubleValue();
        if (!RequirementLimits.isThickness(mm)) {
            throw TokenCursor.outOfRange(number, "a thickness above 0 and at most "
                    + SpectralClauseParser.plain(RequirementLimits.MAX_THICKNESS_MM) + " mm", "'" + number.text() + " mm'");
        }
        return mm;
    }

    private void setThickness(Token first, ThicknessSpec spec) {
        String text = in.slice(first.start(), in.previous().end());
        if (thicknessText != null) {
            throw duplicate(first, "thickness statement", thicknessText);
        }
        thickness = spec;
        thicknessText = text;
    }

    private void materialClass(Token first) {
        if (classText != null) {
            throw duplicate(first, "class filter", classText);
        }
        in.next();
        if (first.isWord("material")) {
            in.expectWord(Expected.keywords("class").after("material"), "class");
        }
        Token labelStart = in.peek();
        while (!in.at(Kind.END) && !in.at(Kind.COMMA) && !in.atWord("and")) {
            in.next();
        }
        if (in.previous().end() <= labelStart.start()) {
            throw in.error(Expected.described("a class label such as 'plastic sheet'").after("class"));
        }
        String label = in.slice(labelStart.start(), in.previous().end())
                .toLowerCase(Locale.ROOT).replaceAll("\\s+", " ");
        if (!RequirementLimits.isClassLabel(label)) {
            throw TokenCursor.outOfRange(labelStart, "a class label of 2 to 40 lower-case letters, digits, spaces"
                    + " or hyphens", "'" + label + "'");
        }
        materialClass = label;
        classText = in.slice(first.start(), in.previous().end());
    }

    private void geometry(Token first) {
        if (geometryText != null) {
            throw duplicate(first, "geometry filter", geometryText);
        }
        in.next();
        geometry = in.expectWord(Expected.keywords("regular", "total", Requirement.ANY_GEOMETRY).after("geometry"),
                "regular", "total", Requirement.ANY_GEOMETRY).lower();
        geometryText = in.slice(first.start(), in.previous().end());
    }

    /** "behind 4 mm float glass": the material is the words up to the next separator, as with a class label. */
    private void layer(Token first) {
        if (layer != null) {
            throw duplicate(first, "fixed layer", layer.text());
        }
        in.next();
        Token number = in.peek();
        double mm = millimetres(number, in.expectNumber(Expected.described("the layer's thickness in mm, as in 'behind 4 mm"
                + " clear float glass'").after(first.text())));
        in.expectWord(Expected.keywords("mm").after(number.text()), "mm");
        Token phraseStart = in.peek();
        while (!in.at(Kind.END) && !in.at(Kind.COMMA) && !in.atWord("and")) {
            Token t = in.peek();
            if (t.kind() != Kind.WORD && t.kind() != Kind.NUMBER && t.kind() != Kind.DASH) {
                throw TokenCursor.outOfRange(t, "a library material: its slug or words of its name", t.quoted());
            }
            in.next();
        }
        if (in.previous().end() <= phraseStart.start()) {
            throw in.error(Expected.described("a library material, its slug or words of its name, such as"
                    + " 'clear-float-glass'").after("mm"));
        }
        String words = in.slice(phraseStart.start(), in.previous().end()).toLowerCase(Locale.ROOT)
                .replace('–', '-').replaceAll("\\s+", " ");
        if (!RequirementLimits.isMaterialWords(words)) {
            throw TokenCursor.outOfRange(phraseStart, "a library material of at most "
                    + RequirementLimits.MAX_MATERIAL_WORDS_LENGTH + " characters of letters, digits, spaces, points or"
                    + " hyphens", "'" + words + "'");
        }
        FixedLayer.Placement placement = first.isWord("behind") ? FixedLayer.Placement.BEHIND : FixedLayer.Placement.ON;
        String text = in.slice(first.start(), in.previous().end());
        layer = TokenCursor.build(first, () -> new FixedLayer(placement, mm, words, text));
    }

    private static RequirementSyntaxException duplicate(Token at, String what, String earlier) {
        return new RequirementSyntaxException(at.start(), "at most one " + what,
                "a second one after '" + earlier + "'", null);
    }
}
