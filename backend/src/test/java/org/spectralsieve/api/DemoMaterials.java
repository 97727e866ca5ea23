package org.spectralsieve.api;

import tools.jackson.databind.JsonNode;

/** Finds a stock of the illustrative demo library, and its sample at a thickness, in {@code GET /api/materials}. */
final class DemoMaterials {

    private DemoMaterials() {
    }

    /** The material with this slug among {@code materials} (the answer of {@code GET /api/materials}). */
    static JsonNode bySlug(JsonNode materials, String slug) {
        for (JsonNode m : materials) {
            if (m.path("slug").asString().equals(slug)) {
                return m;
            }
        }
        throw new AssertionError("the demo library has no " + slug);
    }

    /** The id of the material's sample measured at {@code mm}. */
    static long sampleAt(JsonNode material, double mm) {
        for (JsonNode s : material.path("samples")) {
            if (s.path("thicknessMm").asDouble() == mm) {
                return s.path("id").asLong();
            }
        }
        throw new AssertionError(material.path("slug").asString() + " has no sample at " + mm + " mm");
    }
}
