package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Reads the requirement language: plain-words clauses joined by "and" or commas, for example
 * {@code passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm, class plastic sheet}.
 *
 * <pre>
 * requirement = item { ( "," [ "and" ] | "and" ) item }
 * (a spectral item may end with "with" number "%" "confidence", see {@link ConfidenceDemandParser})
 * item        = transmittance | rating | cutoff | preset | critical        (SpectralClauseParser, FigureClauseParser)
 *             | thickness | class | geometry | layer
 * thickness   = "thickness" [ "at" ] ( "as" "measured" | amount | ( "between" mm [ "mm" ] "and" | "from" mm [ "mm" ] ( "to" | "-" ) ) mm "mm" )
 *             | "at" mm "mm"
 *             | amount "thick"                                          ("3 to 6 mm thick", "6 mm thick")
 * amount      = mm [ "mm" ] ( "to" | "-" ) mm "mm" | mm "mm"
 * class       = [ "material" ] "class" label        (label: the words up to the next "," or "and")
 * geometry    = "geometry" ( "regular" | "total" | "any" )
 * layer       = ( "behind" | "on" ) mm "mm" material   (material: the words up to the next "," or "and")
 * </pre>
 *
 * Keywords are case-insensitive. At least one spectral clause is required; thickness, class, geometry and
 * a fixed layer may each be given once. Emitter and response names are read against a
 * {@link SpectrumLookup}; a class label, when the caller passes the library's classes, must be one of them;
 * a layer's material words are kept as written and resolved against the library by the caller. Every
 * problem is a {@link RequirementSyntaxException}. docs/requirement-language.md describes the language
 * and the readings of the trade's phrasing ("blocks 99%", "UV400").
 */
public final class RequirementParser {

    private static final String EXAMPLE = "'passes over 80% at 365 nm'";
    private static final Expected ITEM = Expected.keywords("passes", "blocks", "transmits", "T", "mean", "OD",
            "cutoff", "over", "under", "UV400", "erythemal", "uv hazard", "luminous", "visible", "critical wavelength",
            "thickness", "at", "from", "after", "printed", "base", "class", "geometry", "behind", "on")
            .because("to start a clause");
    /** How many class labels an error lists before "…". */
    private static final int LISTED_CLASSES = 12;

    private final TokenCursor in;
    private final SpectralClauseParser spectral;
    private final FigureClauseParser figures;
    private final StateClauseParser states;
    private final LightParser lights;
    private Illumination light = Illumination.NORMAL;
    private String lightText;
    /** The class labels a class filter may name, or null when the caller has no library to check against. */
    private final List<String> knownClasses;
    private final List<Clause> clauses = new ArrayList<>();
    private ThicknessSpec thickness = ThicknessSpec.AS_MEASURED;
    private String thicknessText;
    private String materialClass;
    private String classText;
    private String geometry;
    private String geometryText;
    private FixedLayer layer;

    private RequirementParser(String text, SpectrumLookup spectra, List<String> knownClasses) {
        this.knownClasses = knownClasses;
        this.in = new TokenCursor(text);
        this.spectral = new SpectralClauseParser(in, new SpectrumNames(in, spectra));
        this.figures = new FigureClauseParser(in, spectral, spectra);
        this.states = new StateClauseParser(in, spectral);
        this.lights = new LightParser(in);
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
        return read(text, spectra, null);
    }

    /**
     * Reads a text for a search of a library: a class filter must name one of {@code materialClasses}
     * (the classes the library's materials are filed under), else the error lists them and suggests the
     * close ones, rather than the search quietly finding nothing.
     *
     * @param spectra         where emitter and response names resolve
     * @param materialClasses the class labels a filter may name, as stored ("plastic sheet")
     * @throws RequirementSyntaxException for any text that is not a valid requirement, null included
     */
    public static Requirement parse(String text, SpectrumLookup spectra, Collection<String> materialClasses) {
        return read(text, spectra, List.copyOf(Objects.requireNonNull(materialClasses, "materialClasses")));
    }

    private static Requirement read(String text, SpectrumLookup spectra, List<String> knownClasses) {
        if (text == null) {
            throw new RequirementSyntaxException(0, "a requirement such as " + EXAMPLE, "nothing", null);
        }
        // before any tokenising: an oversized text is refused in constant time
        RequirementLimits.checkTextLength(text);
        return new RequirementParser(text, Objects.requireNonNull(spectra, "spectra"), knownClasses).requirement();
    }

    /**
     * Reads a statement of how the light arrives on its own, for a request parameter: "normal" (or blank),
     * "at 30° incidence", "over a 60° beam", "under an LED with 120° beam angle", "under a Lambertian source".
     *
     * @throws RequirementSyntaxException naming what fits where the text goes wrong
     */
    public static Illumination parseLight(String text) {
        if (text == null || text.isBlank() || text.strip().equalsIgnoreCase("normal")) {
            return Illumination.NORMAL;
        }
        RequirementLimits.checkTextLength(text);
        TokenCursor in = new TokenCursor(text);
        LightParser lights = new LightParser(in);
        if (!lights.atLight()) {
            throw in.error(Expected.described("'normal', " + LightParser.examples()));
        }
        Illumination light = lights.light();
        if (!in.at(Kind.END)) {
            throw in.error(Expected.described("end of text").because("after the light"));
        }
        return light;
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
                Optional.ofNullable(materialClass), Optional.ofNullable(geometry), Optional.ofNullable(layer), text,
                light));
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
        int before = clauses.size();
        spectralOrFilter(first);
        if (clauses.size() > before) {
            // "… with 95% confidence" closes a spectral clause
            clauses.set(before, ConfidenceDemandParser.attach(in, clauses.get(before), first));
        }
    }

    private void spectralOrFilter(Token first) {
        if (lights.atLight()) {
            Illumination read = lights.light();
            if (lightText != null) {
                throw duplicate(first, "statement of how the light arrives", lightText);
            }
            light = read;
            lightText = in.slice(first.start(), in.previous().end());
            return;
        }
        if (states.atState()) {
            StateAsked state = states.state();
            Token clauseStart = in.peek();
            int before = clauses.size();
            if (states.atRelative()) {
                clauses.add(states.relative(clauseStart, state));
            } else {
                spectralOrFilter(clauseStart);
            }
            if (clauses.size() != before + 1) {
                throw new RequirementSyntaxException(clauseStart.start(), "a spectral clause after '"
                        + in.slice(first.start(), clauseStart.start()).strip() + "'", "'"
                        + in.slice(clauseStart.start(), in.previous().end()) + "'", null);
            }
            clauses.set(before, states.stated(first, state, clauses.get(before)));
            return;
        }
        if ((first.isWord("at") || first.isWord("from") || first.isWord("between")) && states.atRelative()) {
            clauses.add(states.relative(first));
            return;
        }
        String word = first.kind() == Kind.WORD ? first.lower() : "";
        switch (word) {
            case "passes", "pass", "blocks", "block", "transmits", "transmit", "transmittance", "t" ->
                    clauses.add(spectral.transmittance(first, in.next()));
            case "mean", "od", "over", "above", "under", "below", "more", "less" ->
                    clauses.add(spectral.transmittance(first, null));
            case "cutoff", "cut-off" -> clauses.add(spectral.cutoff(first));
            case "erythemal" -> clauses.add(figures.erythemal(first));
            case "uv", "uv-hazard" -> clauses.add(first.isWord("uv") && in.peek(1).kind() == Kind.NUMBER
                    ? spectral.uvRating(first) : figures.uvHazard(first));
            case "luminous", "visible", "vlt" -> clauses.add(figures.luminous(first));
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
        if (levelFirst && thicknessAhead()) {
            trailingThickness(first);
        } else if (levelFirst && (isCutoffWord(in.peek(1)) || in.peek(1).kind() == Kind.PERCENT && isCutoffWord(in.peek(2)))) {
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
        if (in.atWord("between") || in.atWord("from")) {
            setThickness(first, bounded(in.next()));
            return;
        }
        setThickness(first, amount(Expected.keywords("as measured", "between", "from").or("a thickness in mm")
                .after(first.text())));
    }

    /** "3 mm", "3 to 6 mm", "3-6 mm", "3 mm to 6 mm"; {@code expected} says what fits if no number stands first. */
    private ThicknessSpec amount(Expected expected) {
        Token minToken = in.peek();
        double min = millimetres(minToken, in.expectNumber(expected));
        boolean unit = in.acceptWord("mm");
        boolean range = in.acceptWord("to") || in.at(Kind.DASH) && in.next() != null;
        if (!range) {
            if (!unit) {
                in.expectWord(Expected.keywords("mm", "to", "-").after(minToken.text()), "mm");
            }
            return ThicknessSpec.at(min);
        }
        return upTo(min, "to");
    }

    /** "between 3 and 6 mm", "from 3 to 6 mm"; {@code word} ("between" or "from") is consumed. */
    private ThicknessSpec bounded(Token word) {
        boolean between = word.isWord("between");
        Token minToken = in.peek();
        double min = millimetres(minToken, in.expectNumber(Expected.described("a thickness in mm").after(word.text())));
        in.acceptWord("mm");
        if (between) {
            in.expectWord(Expected.keywords("and").after("between " + minToken.text()), "and");
        } else if (!in.acceptWord("to")) {
            in.expect(Kind.DASH, Expected.keywords("to", "-").after("from " + minToken.text()));
        }
        return upTo(min, between ? "and" : "to");
    }

    /** The upper end of a thickness range, after "to", "-" or "and". */
    private ThicknessSpec upTo(double min, String after) {
        Token maxToken = in.peek();
        double max = millimetres(maxToken, in.expectNumber(Expected.described("a thickness in mm").after(after)));
        in.expectWord(Expected.keywords("mm").after(maxToken.text()), "mm");
        if (max < min) {
            throw TokenCursor.outOfRange(maxToken, "a thickness not below " + SpectralClauseParser.plain(min)
                    + " mm (a range runs from thin to thick)", maxToken.quoted());
        }
        return ThicknessSpec.range(min, max);
    }

    /**
     * Whether the number ahead is a thickness written before its word ("6 mm thick", "3 to 6 mm thick"):
     * a number followed by "mm", or two numbers joined by "to" or "-" and then "mm". No level has a unit
     * in mm, so the shape alone decides, and a missing "thick" can be asked for by name.
     */
    private boolean thicknessAhead() {
        if (in.peek(1).isWord("mm")) {
            return true;
        }
        return (in.peek(1).isWord("to") || in.peek(1).kind() == Kind.DASH) && in.peek(2).kind() == Kind.NUMBER
                && in.peek(3).isWord("mm");
    }

    /** "6 mm thick", "3 to 6 mm thick", "3-6 mm thick": the thickness statement with its word last. */
    private void trailingThickness(Token first) {
        ThicknessSpec spec = amount(Expected.described("a thickness in mm"));
        in.expectWord(Expected.keywords("thick").because("after a thickness (or put the word first: 'thickness "
                + in.slice(first.start(), in.previous().end()) + "')"), "thick");
        setThickness(first, spec);
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
        if (knownClasses != null && !knownClasses.contains(label)) {
            throw unknownClass(labelStart, label);
        }
        materialClass = label;
        classText = in.slice(first.start(), in.previous().end());
    }

    /** A class no material of the library is filed under: the library's classes, and the close ones. */
    private RequirementSyntaxException unknownClass(Token labelStart, String label) {
        int length = in.previous().end() - labelStart.start();
        String expected = knownClasses.isEmpty() ? "no class filter (the library holds no materials yet)"
                : "a material class of the library (" + MaterialClassNames.listing(knownClasses, LISTED_CLASSES) + ")";
        return new RequirementSyntaxException(labelStart.start(), length, expected, "'" + label + "'",
                MaterialClassNames.near(label, knownClasses), false);
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
