package org.spectralsieve.api;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.Comparison;
import org.spectralsieve.requirement.CriticalWavelengthClause;
import org.spectralsieve.requirement.CutoffClause;
import org.spectralsieve.requirement.RelativeClause;
import org.spectralsieve.requirement.StateAsked;
import org.spectralsieve.requirement.StateClause;
import org.spectralsieve.states.StateKind;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.MaterialClassNames;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementLimits;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;
import tools.jackson.databind.JsonNode;

/**
 * The structured JSON form of a requirement, for clients that build requirements from form fields
 * rather than text. It accepts exactly what the text language can say (same limits), so every JSON
 * requirement can also be shown as canonical text. Errors name the JSON path of the bad field.
 *
 * <pre>
 * {"text": "...", "thickness": {"kind": "asMeasured"} | {"kind": "fixed", "mm": 3} | {"kind": "range", "minMm": 1, "maxMm": 6},
 *  "materialClass": "plastic sheet" | null, "geometry": "regular" | "total" | null,
 *  "layer": {"placement": "behind" | "on", "thicknessMm": 4, "material": "clear float glass", "text": "..."} | null,
 *  "clauses": [{"type": "transmittance", "direction": "pass" | "block", "aggregate": "everyPoint" | "mean",
 *               "fromNm": 365, "toNm": 365, "thresholdT": 0.8, "unit": "percent" | "fraction" | "opticalDensity",
 *               "confidencePercent": 95 | null, "text": "..."},
 *              {"type": "cutoff", "levelT": 0.5, "fromNm": 380, "toNm": 395, "text": "..."},
 *              {"type": "weighted", "preset": "emitter" | "erythemal" | "uvHazard" | "luminous", "emitter": "led-365",
 *               "response": "erythema" | null, "direction": "pass" | "block", "thresholdT": 0.85, "unit": "percent",
 *               "rangeNm": [329, 401], "safetyFigure": false, "text": "..."},
 *              {"type": "criticalWavelength", "comparison": "atLeast" | "atMost", "nm": 370, "text": "..."},
 *              {"type": "relative", "direction": "block" | "pass", "fromNm": 380, "toNm": 380, "share": 0.01,
 *               "referenceNm": 550 | null, "state": STATE, "referenceState": STATE, "text": "..."},
 *              {"type": "inState", "state": STATE, "clause": {a transmittance, cutoff, weighted or critical clause}}]}
 * STATE = {"kind": "asSupplied" | "printed" | "aged", "hours": 1000 | null, "doseJPerCm2": null, "doseNm": null} | null
 * </pre>
 *
 * On reading, a transmittance or weighted clause may give its threshold as {@code thresholdPercent} or
 * {@code thresholdOd} instead of {@code thresholdT}; the unit then defaults to the one used. A weighted
 * clause's {@code emitter} and {@code response} are names resolved through the {@link SpectrumLookup}
 * (a null response: flat over the emitter's range); the presets need neither (luminous writes both as null). {@code rangeNm} and
 * {@code safetyFigure} are written for the reader and ignored on reading.
 */
public final class RequirementJson {

    private RequirementJson() {
    }

    public static Map<String, Object> toJson(Requirement requirement) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("text", requirement.text());
        json.put("thickness", thickness(requirement.thickness()));
        json.put("materialClass", requirement.materialClass().orElse(null));
        json.put("geometry", requirement.geometry().orElse(null));
        json.put("layer", requirement.layer().map(RequirementJson::layer).orElse(null));
        json.put("light", light(requirement.light()));
        json.put("clauses", requirement.clauses().stream().map(RequirementJson::clause).toList());
        return json;
    }

    private static Map<String, Object> layer(FixedLayer layer) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("placement", layer.placement() == FixedLayer.Placement.BEHIND ? "behind" : "on");
        json.put("thicknessMm", layer.thicknessMm());
        json.put("material", layer.material());
        json.put("text", layer.text());
        return json;
    }

    private static Map<String, Object> thickness(ThicknessSpec spec) {
        Map<String, Object> json = new LinkedHashMap<>();
        switch (spec.kind()) {
            case AS_MEASURED -> json.put("kind", "asMeasured");
            case FIXED -> {
                json.put("kind", "fixed");
                json.put("mm", spec.minMm());
            }
            case RANGE -> {
                json.put("kind", "range");
                json.put("minMm", spec.minMm());
                json.put("maxMm", spec.maxMm());
            }
        }
        return json;
    }

    private static Map<String, Object> clause(Clause clause) {
        Map<String, Object> json = new LinkedHashMap<>();
        if (clause instanceof TransmittanceClause t) {
            json.put("type", "transmittance");
            json.put("direction", t.direction() == Direction.PASS ? "pass" : "block");
            json.put("aggregate", t.aggregate() == Aggregate.MEAN ? "mean" : "everyPoint");
            json.put("fromNm", t.band().fromNm());
            json.put("toNm", t.band().toNm());
            json.put("thresholdT", t.thresholdT());
            json.put("unit", UNITS.get(t.unit()));
            // "… with 95% confidence": the demand in percent, null when none
            json.put("confidencePercent", t.confidenceDemand().isPresent()
                    ? java.math.BigDecimal.valueOf(t.confidenceDemand().getAsDouble()).movePointRight(2).doubleValue() : null);
        } else if (clause instanceof WeightedClause w) {
            json.put("type", "weighted");
            if (w.weighting() instanceof Weighting.Spectral weighting) {
                json.put("preset", PRESETS.get(weighting.preset()));
                json.put("emitter", weighting.emitter().name());
                json.put("response", weighting.response().map(Response::name).orElse(null));
            } else {
                json.put("preset", "luminous");
                json.put("emitter", null);
                json.put("response", null);
            }
            json.put("direction", w.direction() == Direction.PASS ? "pass" : "block");
            json.put("thresholdT", w.thresholdT());
            json.put("unit", UNITS.get(w.unit()));
            double[] range = w.weighting().rangeNm();
            json.put("rangeNm", List.of(range[0], range[1]));
            json.put("safetyFigure", w.weighting().safetyFigure());
        } else if (clause instanceof CriticalWavelengthClause c) {
            json.put("type", "criticalWavelength");
            json.put("comparison", c.comparison() == Comparison.AT_LEAST ? "atLeast" : "atMost");
            json.put("nm", c.nm());
        } else if (clause instanceof RelativeClause r) {
            json.put("type", "relative");
            json.put("direction", r.direction() == Direction.PASS ? "pass" : "block");
            json.put("fromNm", r.band().fromNm());
            json.put("toNm", r.band().toNm());
            json.put("share", r.fraction());
            json.put("referenceNm", r.ownWavelength() ? r.referenceNm() : null);
            json.put("state", state(r.state()));
            json.put("referenceState", state(r.referenceState()));
        } else if (clause instanceof StateClause s) {
            json.put("type", "inState");
            json.put("state", state(s.state()));
            json.put("clause", clause(s.inner()));
        } else {
            CutoffClause c = (CutoffClause) clause;
            json.put("type", "cutoff");
            json.put("levelT", c.levelT());
            json.put("fromNm", c.window().fromNm());
            json.put("toNm", c.window().toNm());
        }
        json.put("text", clause.text());
        return json;
    }

    /** {"kind": "asSupplied" | "printed" | "aged", "hours": 1000 | null, "doseJPerCm2": null, "doseNm": null}. */
    private static Map<String, Object> state(StateAsked s) {
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("kind", switch (s.kind()) {
            case AS_SUPPLIED -> "asSupplied";
            case PRINTED -> "printed";
            case AGED -> "aged";
        });
        boolean aged = s.kind() == StateKind.AGED;
        json.put("hours", aged && s.inHours() ? s.amount() : null);
        json.put("doseJPerCm2", aged && !s.inHours() ? s.amount() : null);
        json.put("doseNm", aged && !s.inHours() ? s.doseNm() : null);
        return json;
    }

    private static StateAsked state(JsonNode node, String path) {
        if (node == null || node.isNull()) {
            return StateAsked.AS_SUPPLIED;
        }
        if (!node.isObject()) {
            throw bad(path, "must be an object with 'kind' ('asSupplied', 'printed' or 'aged'), or null");
        }
        return switch (requiredString(node, "kind", path)) {
            case "asSupplied" -> StateAsked.AS_SUPPLIED;
            case "printed" -> StateAsked.PRINTED;
            case "aged" -> {
                boolean hours = node.hasNonNull("hours");
                if (hours == node.hasNonNull("doseJPerCm2")) {
                    throw bad(path + ".hours", "an aged state gives 'hours', or 'doseJPerCm2' with 'doseNm': exactly one");
                }
                try {
                    yield hours ? StateAsked.afterHours(number(node, "hours", path))
                            : StateAsked.afterDose(number(node, "doseJPerCm2", path), number(node, "doseNm", path));
                } catch (IllegalArgumentException e) {
                    throw bad(path + (hours ? ".hours" : ".doseJPerCm2"), e.getMessage());
                }
            }
            default -> throw bad(path + ".kind", "must be 'asSupplied', 'printed' or 'aged'");
        };
    }

    private static RelativeClause relative(JsonNode node, String path, String text) {
        Direction direction = direction(node, path);
        Band band = band(node, path, false);
        double share = number(node, "share", path);
        check(share, share > 0 && share <= 1, path + ".share", "must be a fraction above 0 and at most 1");
        StateAsked state = state(node.get("state"), path + ".state");
        double referenceNm = node.hasNonNull("referenceNm") ? number(node, "referenceNm", path) : Double.NaN;
        if (!Double.isNaN(referenceNm)) {
            check(referenceNm, RequirementLimits.isWavelength(referenceNm), path + ".referenceNm",
                    "must be a wavelength from " + RequirementLimits.MIN_WAVELENGTH_NM + " to "
                            + RequirementLimits.MAX_WAVELENGTH_NM + " nm");
        }
        StateAsked reference = Double.isNaN(referenceNm) ? state(node.get("referenceState"), path + ".referenceState")
                : state;
        try {
            return new RelativeClause(direction, band, share, referenceNm, state, reference, text);
        } catch (IllegalArgumentException e) {
            throw bad(path, e.getMessage() + " (give 'referenceNm', or a 'referenceState' other than 'state')");
        }
    }

    private static StateClause inState(JsonNode node, String path, String text, SpectrumLookup spectra) {
        StateAsked state = state(node.get("state"), path + ".state");
        if (state.kind() == StateKind.AS_SUPPLIED) {
            throw bad(path + ".state", "an 'inState' clause names 'printed' or 'aged'; the as-supplied state is the"
                    + " clause itself");
        }
        Clause inner = clause(node.get("clause"), path + ".clause", spectra);
        if (inner instanceof StateClause || inner instanceof RelativeClause) {
            throw bad(path + ".clause", "must be a transmittance, cutoff, weighted or criticalWavelength clause");
        }
        return new StateClause(state, inner, text);
    }

    private static final Map<ThresholdUnit, String> UNITS = Map.of(ThresholdUnit.PERCENT, "percent",
            ThresholdUnit.FRACTION, "fraction", ThresholdUnit.OPTICAL_DENSITY, "opticalDensity");
    private static final Map<Weighting.Preset, String> PRESETS = Map.of(Weighting.Preset.EMITTER, "emitter",
            Weighting.Preset.ERYTHEMAL, "erythemal", Weighting.Preset.UV_HAZARD, "uvHazard");

    /** Reads a requirement naming only built-in emitters and responses. */
    public static Requirement fromJson(JsonNode node) {
        return fromJson(node, SpectrumLookup.builtIn());
    }

    /**
     * @param spectra where emitter and response names resolve
     * @throws IllegalArgumentException naming the JSON path of the first bad field
     */
    public static Requirement fromJson(JsonNode node, SpectrumLookup spectra) {
        return read(node, spectra, null);
    }

    /**
     * Reads a requirement for a search of a library, whose {@code materialClass} must be one of
     * {@code classes} (as the text language's class filter).
     *
     * @throws IllegalArgumentException naming the JSON path of the first bad field
     */
    public static Requirement fromJson(JsonNode node, SpectrumLookup spectra, List<String> classes) {
        return read(node, spectra, List.copyOf(classes));
    }

    private static Requirement read(JsonNode node, SpectrumLookup spectra, List<String> classes) {
        if (node == null || !node.isObject()) {
            throw bad("(root)", "must be an object with 'clauses'");
        }
        JsonNode clausesNode = node.get("clauses");
        if (clausesNode == null || !clausesNode.isArray() || clausesNode.isEmpty()) {
            throw bad("clauses", "must be a non-empty list of clauses");
        }
        RequirementLimits.checkClauseCount(clausesNode.size());
        List<Clause> clauses = new ArrayList<>();
        for (int i = 0; i < clausesNode.size(); i++) {
            clauses.add(clause(clausesNode.get(i), "clauses[" + i + "]", spectra));
        }
        ThicknessSpec thickness = thickness(node.get("thickness"));
        Optional<String> materialClass = optionalString(node, "materialClass", "(root)")
                .map(label -> check(label, RequirementLimits.isClassLabel(label), "materialClass",
                        "must be 2-40 lower-case letters, digits, spaces or hyphens, without the word 'and'"));
        materialClass.ifPresent(label -> knownClass(label, classes));
        Optional<String> geometry = optionalString(node, "geometry", "(root)")
                .map(g -> check(g, RequirementLimits.GEOMETRIES.contains(g), "geometry",
                        "must be one of " + RequirementLimits.GEOMETRIES + " or null"));
        String text = optionalString(node, "text", "(root)").orElse("");
        Optional<FixedLayer> layer = layer(node.get("layer"));
        return new Requirement(clauses, thickness, materialClass, geometry, layer, text, light(node.get("light")));
    }

    /**
     * {"kind": "normal"} | {"kind": "incidence", "angleDeg": 30} | {"kind": "beam", "fullAngleDeg": 60} |
     * {"kind": "led", "beamAngleDeg": 120} | {"kind": "lambertian"}, with {@code description} and
     * {@code integration} written for the reader (ignored on reading).
     */
    static Map<String, Object> light(Illumination light) {
        Map<String, Object> json = new LinkedHashMap<>();
        switch (light.kind()) {
            case NORMAL -> json.put("kind", "normal");
            case INCIDENCE -> {
                json.put("kind", "incidence");
                json.put("angleDeg", light.angleDeg());
            }
            case CONE -> {
                json.put("kind", "beam");
                json.put("fullAngleDeg", 2 * light.angleDeg());
            }
            case LED -> {
                json.put("kind", "led");
                json.put("beamAngleDeg", 2 * light.angleDeg());
            }
            case LAMBERTIAN -> json.put("kind", "lambertian");
        }
        json.put("description", light.describe());
        json.put("integration", light.integration().isEmpty() ? null : light.integration());
        return json;
    }

    private static Illumination light(JsonNode node) {
        if (node == null || node.isNull()) {
            return Illumination.NORMAL;
        }
        if (!node.isObject()) {
            throw bad("light", "must be an object with a 'kind', or null for normal incidence");
        }
        String kind = requiredString(node, "kind", "light");
        String field = switch (kind) {
            case "normal", "lambertian" -> null;
            case "incidence" -> "angleDeg";
            case "beam" -> "fullAngleDeg";
            case "led" -> "beamAngleDeg";
            default -> throw bad("light.kind", "must be 'normal', 'incidence', 'beam', 'led' or 'lambertian', got " + kind);
        };
        double deg = field == null ? Double.NaN : number(node, field, "light");
        try {
            return switch (kind) {
                case "incidence" -> Illumination.atIncidence(deg);
                case "beam" -> Illumination.beam(deg);
                case "led" -> Illumination.led(deg);
                case "lambertian" -> Illumination.lambertian();
                default -> Illumination.NORMAL;
            };
        } catch (IllegalArgumentException e) {
            throw bad("light." + field, e.getMessage());
        }
    }

    /** A class the library files no material under would search nothing: name the library's, and the close ones. */
    private static void knownClass(String label, List<String> classes) {
        if (classes == null || classes.contains(label)) {
            return;
        }
        List<String> near = MaterialClassNames.near(label, classes);
        throw bad("materialClass", "'" + label + "' is not a class of the library; its classes: "
                + MaterialClassNames.listing(classes, classes.size())
                + (near.isEmpty() ? "" : "; did you mean '" + String.join("' or '", near) + "'?"));
    }

    private static Optional<FixedLayer> layer(JsonNode node) {
        if (node == null || node.isNull()) {
            return Optional.empty();
        }
        if (!node.isObject()) {
            throw bad("layer", "must be an object with 'placement', 'thicknessMm' and 'material', or null");
        }
        FixedLayer.Placement placement = switch (optionalString(node, "placement", "layer").orElse("behind")) {
            case "behind" -> FixedLayer.Placement.BEHIND;
            case "on" -> FixedLayer.Placement.ON;
            default -> throw bad("layer.placement", "must be 'behind' or 'on'");
        };
        double mm = number(node, "thicknessMm", "layer");
        check(mm, RequirementLimits.isThickness(mm), "layer.thicknessMm",
                "must be a thickness above 0 and at most " + RequirementLimits.MAX_THICKNESS_MM + " mm");
        String material = requiredString(node, "material", "layer").strip().toLowerCase(java.util.Locale.ROOT)
                .replaceAll("\\s+", " ");
        check(material, RequirementLimits.isMaterialWords(material), "layer.material",
                "must be a slug or words of a material's name: letters, digits, spaces, points or hyphens, at most "
                        + RequirementLimits.MAX_MATERIAL_WORDS_LENGTH + " characters, without the word 'and'");
        String text = optionalString(node, "text", "layer").orElse("");
        return Optional.of(new FixedLayer(placement, mm, material, text));
    }

    private static Clause clause(JsonNode node, String path, SpectrumLookup spectra) {
        if (node == null || !node.isObject()) {
            throw bad(path, "must be an object with a 'type'");
        }
        String type = requiredString(node, "type", path);
        String text = optionalString(node, "text", path).orElse("");
        return switch (type) {
            case "transmittance" -> transmittance(node, path, text);
            case "cutoff" -> {
                double level = node.has("levelT") ? number(node, "levelT", path) : 0.5;
                check(level, RequirementLimits.isCutoffLevel(level), path + ".levelT",
                        "must be a number above 0 and below 1");
                Band window = band(node, path, true);
                yield new CutoffClause(level, window, text);
            }
            case "weighted" -> weighted(node, path, text, spectra);
            case "criticalWavelength" -> {
                Comparison comparison = switch (requiredString(node, "comparison", path)) {
                    case "atLeast" -> Comparison.AT_LEAST;
                    case "atMost" -> Comparison.AT_MOST;
                    default -> throw bad(path + ".comparison", "must be 'atLeast' or 'atMost'");
                };
                double nm = number(node, "nm", path);
                check(nm, nm >= CriticalWavelengthClause.FROM_NM && nm <= CriticalWavelengthClause.TO_NM, path + ".nm",
                        "must be a wavelength from 290 to 400 nm (a critical wavelength always lies there)");
                yield new CriticalWavelengthClause(comparison, nm, text);
            }
            case "relative" -> relative(node, path, text);
            case "inState" -> inState(node, path, text, spectra);
            default -> throw bad(path + ".type", "'" + type + "' is not one of [transmittance, cutoff, weighted,"
                    + " criticalWavelength, relative, inState]");
        };
    }

    private static WeightedClause weighted(JsonNode node, String path, String text, SpectrumLookup spectra) {
        Direction direction = direction(node, path);
        Weighting weighting = switch (optionalString(node, "preset", path).orElse("emitter")) {
            case "erythemal" -> Weighting.erythemal(spectra);
            case "uvHazard" -> Weighting.uvHazard(spectra);
            case "luminous" -> Weighting.luminous();
            case "emitter" -> {
                String emitterName = requiredString(node, "emitter", path);
                Emitter emitter = spectra.emitter(emitterName).orElseThrow(() -> bad(path + ".emitter",
                        "'" + emitterName + "' is not a known emitter; known: "
                                + String.join(", ", spectra.emitters().stream().map(Emitter::name).toList())));
                Optional<Response> response = optionalString(node, "response", path).map(name -> spectra.response(name)
                        .orElseThrow(() -> bad(path + ".response", "'" + name + "' is not a known response; known: "
                                + String.join(", ", spectra.responses().stream().map(Response::name).toList()))));
                yield Weighting.of(emitter, response);
            }
            default -> throw bad(path + ".preset", "must be 'emitter', 'erythemal', 'uvHazard' or 'luminous'");
        };
        Threshold threshold = threshold(node, path);
        return new WeightedClause(direction, threshold.t(), threshold.unit(), weighting, text);
    }

    private static Direction direction(JsonNode node, String path) {
        return switch (requiredString(node, "direction", path)) {
            case "pass" -> Direction.PASS;
            case "block" -> Direction.BLOCK;
            default -> throw bad(path + ".direction", "must be 'pass' or 'block'");
        };
    }

    private record Threshold(double t, ThresholdUnit unit) {
    }

    private static TransmittanceClause transmittance(JsonNode node, String path, String text) {
        Direction direction = direction(node, path);
        Aggregate aggregate = switch (optionalString(node, "aggregate", path).orElse("everyPoint")) {
            case "everyPoint" -> Aggregate.EVERY_POINT;
            case "mean" -> Aggregate.MEAN;
            default -> throw bad(path + ".aggregate", "must be 'everyPoint' or 'mean'");
        };
        Band band = band(node, path, aggregate == Aggregate.MEAN);
        Threshold threshold = threshold(node, path);
        TransmittanceClause clause = new TransmittanceClause(direction, aggregate, band, threshold.t(), threshold.unit(), text);
        if (!node.hasNonNull("confidencePercent")) {
            return clause;
        }
        double percent = number(node, "confidencePercent", path);
        double fraction = java.math.BigDecimal.valueOf(percent).movePointLeft(2).doubleValue();
        check(percent, TransmittanceClause.allowedDemand(fraction), path + ".confidencePercent",
                "must be a number from 50 to 99.9 (under 50 a reading that misses could satisfy it; over 99.9 rests on"
                        + " the far tail of the error model)");
        return clause.withConfidenceDemand(fraction, text);
    }

    /** thresholdT, thresholdPercent or thresholdOd (exactly one), and the unit, defaulting to the one used. */
    private static Threshold threshold(JsonNode node, String path) {
        List<String> given = List.of("thresholdT", "thresholdPercent", "thresholdOd").stream()
                .filter(node::has).toList();
        if (given.size() != 1) {
            throw bad(path + ".thresholdT", "must be given (or thresholdPercent or thresholdOd), exactly one of them");
        }
        String field = given.get(0);
        double value = number(node, field, path);
        double thresholdT = switch (field) {
            case "thresholdPercent" -> check(value, value > 0 && value <= 100, path + ".thresholdPercent",
                    "must be a number above 0 and at most 100") / 100;
            case "thresholdOd" -> Math.pow(10, -check(value, RequirementLimits.isOpticalDensity(value),
                    path + ".thresholdOd", "must be a number above 0 and at most " + RequirementLimits.MAX_OPTICAL_DENSITY));
            default -> check(value, RequirementLimits.isThreshold(value), path + ".thresholdT",
                    "must be a number above 0 and at most 1");
        };
        String defaultUnit = field.equals("thresholdPercent") ? "percent"
                : field.equals("thresholdOd") ? "opticalDensity" : "fraction";
        String unitName = optionalString(node, "unit", path).orElse(defaultUnit);
        ThresholdUnit unit = UNITS.entrySet().stream().filter(e -> e.getValue().equals(unitName))
                .map(Map.Entry::getKey).findFirst()
                .orElseThrow(() -> bad(path + ".unit", "must be 'percent', 'fraction' or 'opticalDensity'"));
        if (unit == ThresholdUnit.OPTICAL_DENSITY) {
            check(thresholdT, RequirementLimits.isOpticalDensity(RequirementLimits.densityForTransmittance(thresholdT)),
                    path + "." + field, "must be an optical density above 0 and at most " + RequirementLimits.MAX_OPTICAL_DENSITY);
        }
        return new Threshold(thresholdT, unit);
    }

    private static Band band(JsonNode node, String path, boolean needRange) {
        double from = wavelength(node, "fromNm", path);
        double to = wavelength(node, "toNm", path);
        if (needRange ? !(to > from) : !(to >= from)) {
            throw bad(path + ".toNm", (needRange ? "must be above fromNm" : "must not be below fromNm")
                    + " (" + from + "), got " + to);
        }
        return new Band(from, to);
    }

    private static double wavelength(JsonNode node, String field, String path) {
        double nm = number(node, field, path);
        return check(nm, RequirementLimits.isWavelength(nm), path + "." + field, "must be a wavelength from "
                + RequirementLimits.MIN_WAVELENGTH_NM + " to " + RequirementLimits.MAX_WAVELENGTH_NM + " nm");
    }

    private static ThicknessSpec thickness(JsonNode node) {
        if (node == null || node.isNull()) {
            return ThicknessSpec.AS_MEASURED;
        }
        if (!node.isObject()) {
            throw bad("thickness", "must be an object with a 'kind'");
        }
        return switch (requiredString(node, "kind", "thickness")) {
            case "asMeasured" -> ThicknessSpec.AS_MEASURED;
            case "fixed" -> ThicknessSpec.at(millimetres(node, "mm"));
            case "range" -> {
                double min = millimetres(node, "minMm");
                double max = millimetres(node, "maxMm");
                check(max, max >= min, "thickness.maxMm", "must not be below minMm (" + min + ")");
                yield ThicknessSpec.range(min, max);
            }
            default -> throw bad("thickness.kind", "must be 'asMeasured', 'fixed' or 'range'");
        };
    }

    private static double millimetres(JsonNode node, String field) {
        double mm = number(node, field, "thickness");
        return check(mm, RequirementLimits.isThickness(mm), "thickness." + field,
                "must be a thickness above 0 and at most " + RequirementLimits.MAX_THICKNESS_MM + " mm");
    }

    private static double number(JsonNode node, String field, String path) {
        JsonNode value = node.get(field);
        if (value == null || !value.isNumber() || !Double.isFinite(value.doubleValue())) {
            throw bad(path(path, field), "must be a number");
        }
        return value.doubleValue();
    }

    private static String requiredString(JsonNode node, String field, String path) {
        return optionalString(node, field, path).orElseThrow(() -> bad(path(path, field), "must be given as a string"));
    }

    private static Optional<String> optionalString(JsonNode node, String field, String path) {
        JsonNode value = node.get(field);
        if (value == null || value.isNull()) {
            return Optional.empty();
        }
        if (!value.isString()) {
            throw bad(path(path, field), "must be a string");
        }
        return Optional.of(value.asString());
    }

    private static String path(String parent, String field) {
        return "(root)".equals(parent) ? field : parent + "." + field;
    }

    private static <T> T check(T value, boolean ok, String path, String rule) {
        if (!ok) {
            throw bad(path, rule + ", got " + value);
        }
        return value;
    }

    private static IllegalArgumentException bad(String path, String problem) {
        return new IllegalArgumentException(path + " " + problem);
    }
}
