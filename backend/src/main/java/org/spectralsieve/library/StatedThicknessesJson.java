package org.spectralsieve.library;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import tools.jackson.databind.JsonNode;

/**
 * The one JSON shape of a material's stated thicknesses, used by the demo catalogue and the HTTP API:
 * {@code {"unit": "um", "stock": [25, 50, 125], "range": [25, 125]}} — films are written in µm ("um"),
 * sheets in mm ("mm"); either list may be left out. Stored and judged in mm.
 */
public final class StatedThicknessesJson {

    private StatedThicknessesJson() {
    }

    /** Thicknesses under 1 mm are written in µm (films), others in mm (sheets). */
    public static Map<String, Object> toJson(StatedThicknesses t) {
        Map<String, Object> json = new LinkedHashMap<>();
        double thickest = Math.max(t.rangeStated() ? t.maxMm() : 0,
                t.stockMm().stream().mapToDouble(Double::doubleValue).max().orElse(0));
        boolean micrometres = thickest > 0 && thickest < 1;
        double scale = micrometres ? 1000 : 1;
        json.put("unit", micrometres ? "um" : "mm");
        json.put("stock", t.stockMm().stream().map(mm -> round(mm * scale)).toList());
        json.put("range", t.rangeStated() ? List.of(round(t.minMm() * scale), round(t.maxMm() * scale)) : null);
        return json;
    }

    /** Absent or null: nothing stated. */
    public static StatedThicknesses fromJson(JsonNode node) {
        if (node == null || node.isNull() || node.isMissingNode()) {
            return StatedThicknesses.NONE;
        }
        if (!node.isObject()) {
            throw new IllegalArgumentException("madeThicknesses must be an object {\"unit\", \"stock\", \"range\"}");
        }
        String unit = node.path("unit").asString("mm");
        double perMm = switch (unit) {
            case "mm" -> 1;
            case "um", "µm" -> 1000; // divided, so 25 µm reads as exactly the double nearest 0.025 mm
            default -> throw new IllegalArgumentException("madeThicknesses.unit must be mm or um, was '" + unit + "'");
        };
        List<Double> stock = new ArrayList<>();
        for (JsonNode s : node.path("stock")) {
            stock.add(number(s, "madeThicknesses.stock") / perMm);
        }
        JsonNode range = node.path("range");
        if (range.isMissingNode() || range.isNull()) {
            return new StatedThicknesses(stock, Double.NaN, Double.NaN);
        }
        if (!range.isArray() || range.size() != 2) {
            throw new IllegalArgumentException("madeThicknesses.range must be [thinnest, thickest]");
        }
        return new StatedThicknesses(stock, number(range.get(0), "madeThicknesses.range") / perMm,
                number(range.get(1), "madeThicknesses.range") / perMm);
    }

    private static double number(JsonNode n, String field) {
        if (n == null || !n.isNumber()) {
            throw new IllegalArgumentException(field + " must hold numbers, found " + n);
        }
        return n.asDouble();
    }

    /** µm and mm values as written by people: rounding away the binary noise of the unit change. */
    private static double round(double x) {
        return new java.math.BigDecimal(x).round(new java.math.MathContext(9)).doubleValue();
    }
}
