package org.spectralsieve.library;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.TabulatedIndex;
import org.spectralsieve.optics.UnusableIndex;
import tools.jackson.databind.JsonNode;

/**
 * The one JSON shape of a refractive-index model, used by the demo catalogue and the HTTP API alike:
 * {@code {"kind": "constant", "n": 1.49}}, {@code {"kind": "sellmeier", "b": [...], "c": [...],
 * "validFromNm": 210, "validToNm": 3710}} or {@code {"kind": "table", "wavelengthsNm": [...], "n": [...]}}.
 */
public final class RefractiveIndexJson {

    private RefractiveIndexJson() {
    }

    public static Map<String, Object> toJson(RefractiveIndex index) {
        Map<String, Object> json = new LinkedHashMap<>();
        if (index instanceof ConstantIndex c) {
            json.put("kind", "constant");
            json.put("n", c.n());
        } else if (index instanceof SellmeierIndex s) {
            json.put("kind", "sellmeier");
            json.put("b", s.b());
            json.put("c", s.cMicronsSquared());
            json.put("validFromNm", s.validFromNm());
            json.put("validToNm", s.validToNm());
        } else if (index instanceof TabulatedIndex t) {
            json.put("kind", "table");
            json.put("wavelengthsNm", t.wavelengthsNm());
            json.put("n", t.n());
        } else if (index instanceof UnusableIndex u) {
            // a stored model today's checks refuse: shown as stored, with the reason, never used (docs/validation.md)
            json.put("kind", "unusable");
            json.put("stored", u.stored());
            json.put("reason", u.reason());
        }
        return json;
    }

    /** @throws IllegalArgumentException naming the field that is missing or malformed */
    public static RefractiveIndex fromJson(JsonNode node) {
        if (node == null || !node.isObject()) {
            throw new IllegalArgumentException("refractiveIndex must be an object with a 'kind'");
        }
        String kind = node.path("kind").asString("");
        return switch (kind) {
            case "constant" -> new ConstantIndex(number(node, "n"));
            case "sellmeier" -> new SellmeierIndex(numbers(node, "b"), numbers(node, "c"),
                    number(node, "validFromNm"), number(node, "validToNm"));
            case "table" -> new TabulatedIndex(numbers(node, "wavelengthsNm"), numbers(node, "n"));
            default -> throw new IllegalArgumentException(
                    "refractiveIndex.kind '" + kind + "' is not one of [constant, sellmeier, table]");
        };
    }

    private static double number(JsonNode node, String field) {
        JsonNode value = node.get(field);
        if (value == null || !value.isNumber()) {
            throw new IllegalArgumentException("refractiveIndex." + field + " must be a number");
        }
        return value.doubleValue();
    }

    private static List<Double> numbers(JsonNode node, String field) {
        JsonNode value = node.get(field);
        if (value == null || !value.isArray() || value.isEmpty()) {
            throw new IllegalArgumentException("refractiveIndex." + field + " must be a non-empty list of numbers");
        }
        List<Double> list = new ArrayList<>();
        for (JsonNode item : value) {
            if (!item.isNumber()) {
                throw new IllegalArgumentException("refractiveIndex." + field + " holds '" + item + "', not a number");
            }
            list.add(item.doubleValue());
        }
        return list;
    }
}
