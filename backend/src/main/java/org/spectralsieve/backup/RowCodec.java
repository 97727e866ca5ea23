package org.spectralsieve.backup;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.OffsetDateTime;
import java.util.Base64;
import java.util.List;
import org.jooq.Field;
import org.jooq.Record;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * One table row as one line of JSON, keyed by lower-case column name, chosen by the column's Java type so
 * that every value reads back equal:
 * <ul>
 *   <li>binary columns (packed curves, original files) as base64 of the stored bytes, bit for bit;</li>
 *   <li>floating-point numbers as JSON numbers written with the shortest representation that reads back to
 *       the same double; the non-finite ones, which JSON cannot write, as the strings NaN, Infinity, -Infinity;</li>
 *   <li>whole numbers and booleans as JSON numbers and booleans;</li>
 *   <li>decimals, dates and times as their ISO text (timestamps keep their offset and fraction);</li>
 *   <li>text as text; SQL NULL as JSON null.</li>
 * </ul>
 */
final class RowCodec {

    static final JsonMapper JSON = JsonMapper.builder().build();

    private final List<Field<?>> fields;

    RowCodec(List<Field<?>> fields) {
        this.fields = List.copyOf(fields);
    }

    List<Field<?>> fields() {
        return fields;
    }

    String encode(Record row) {
        ObjectNode line = JSON.createObjectNode();
        for (Field<?> field : fields) {
            put(line, LibraryTables.name(field), row.get(field));
        }
        return JSON.writeValueAsString(line);
    }

    private static void put(ObjectNode line, String name, Object value) {
        if (value == null) {
            line.putNull(name);
        } else if (value instanceof byte[] bytes) {
            line.put(name, Base64.getEncoder().encodeToString(bytes));
        } else if (value instanceof Double d) {
            if (d.isNaN() || d.isInfinite()) {
                line.put(name, d.toString());
            } else {
                line.put(name, d.doubleValue());
            }
        } else if (value instanceof Float f) {
            if (f.isNaN() || f.isInfinite()) {
                line.put(name, f.toString());
            } else {
                line.put(name, f.floatValue());
            }
        } else if (value instanceof Long || value instanceof Integer || value instanceof Short || value instanceof Byte) {
            line.put(name, ((Number) value).longValue());
        } else if (value instanceof Boolean b) {
            line.put(name, b.booleanValue());
        } else {
            line.put(name, value.toString());
        }
    }

    /**
     * The row's values in this codec's column order, typed as the target's columns are.
     *
     * @throws IllegalArgumentException naming the column whose value does not fit
     */
    Object[] decode(JsonNode line) {
        if (line == null || !line.isObject()) {
            throw new IllegalArgumentException("a row must be a JSON object");
        }
        if (line.size() != fields.size()) {
            throw new IllegalArgumentException("the row has " + line.size() + " columns, the table " + fields.size());
        }
        Object[] values = new Object[fields.size()];
        for (int i = 0; i < values.length; i++) {
            Field<?> field = fields.get(i);
            String name = LibraryTables.name(field);
            if (!line.has(name)) {
                throw new IllegalArgumentException("column " + name + " is missing");
            }
            try {
                values[i] = value(field, line.get(name));
            } catch (RuntimeException e) {
                throw new IllegalArgumentException("column " + name + ": " + e.getMessage(), e);
            }
            if (values[i] == null && !field.getDataType().nullable()) {
                throw new IllegalArgumentException("column " + name + " may not be null");
            }
        }
        return values;
    }

    private static Object value(Field<?> field, JsonNode node) {
        if (node.isNull()) {
            return null;
        }
        Class<?> type = field.getType();
        if (type == byte[].class) {
            return Base64.getDecoder().decode(text(node));
        }
        if (type == Double.class || type == Float.class) {
            double d = node.isString() ? nonFinite(node.asString()) : number(node).doubleValue();
            return type == Double.class ? (Object) d : (Object) (float) d;
        }
        if (type == Long.class) {
            return whole(node).longValueExact();
        }
        if (type == Integer.class) {
            return whole(node).intValueExact();
        }
        if (type == Short.class) {
            return whole(node).shortValueExact();
        }
        if (type == Byte.class) {
            return whole(node).byteValueExact();
        }
        if (type == Boolean.class) {
            if (!node.isBoolean()) {
                throw new IllegalArgumentException("expected true or false");
            }
            return node.booleanValue();
        }
        String text = text(node);
        if (type == String.class) {
            return text;
        }
        if (type == BigDecimal.class) {
            return new BigDecimal(text);
        }
        if (type == OffsetDateTime.class) {
            return OffsetDateTime.parse(text);
        }
        if (type == LocalDate.class) {
            return LocalDate.parse(text);
        }
        if (type == LocalDateTime.class) {
            return LocalDateTime.parse(text);
        }
        if (type == LocalTime.class) {
            return LocalTime.parse(text);
        }
        if (type == Instant.class) {
            return Instant.parse(text);
        }
        // a type no migration uses yet: jOOQ's own conversion from the text it was written as
        return field.getDataType().convert(text);
    }

    private static String text(JsonNode node) {
        if (!node.isString()) {
            throw new IllegalArgumentException("expected text");
        }
        return node.asString();
    }

    private static Number number(JsonNode node) {
        if (!node.isNumber()) {
            throw new IllegalArgumentException("expected a number");
        }
        return node.numberValue();
    }

    private static BigDecimal whole(JsonNode node) {
        if (!node.isIntegralNumber()) {
            throw new IllegalArgumentException("expected a whole number");
        }
        return node.decimalValue();
    }

    private static double nonFinite(String text) {
        return switch (text) {
            case "NaN" -> Double.NaN;
            case "Infinity" -> Double.POSITIVE_INFINITY;
            case "-Infinity" -> Double.NEGATIVE_INFINITY;
            default -> throw new IllegalArgumentException("expected a number, got '" + text + "'");
        };
    }
}
