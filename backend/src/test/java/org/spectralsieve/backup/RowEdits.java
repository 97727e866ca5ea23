package org.spectralsieve.backup;

import java.util.Base64;
import tools.jackson.databind.node.ObjectNode;

/** Small edits to an entry's rows, for archives that must be refused. */
final class RowEdits {

    private RowEdits() {
    }

    /** The first row's first transmittance byte with its lowest bit flipped: a different double, same length. */
    static String flipFirstTransmittanceByte(String entry) {
        int end = entry.indexOf('\n');
        ObjectNode row = (ObjectNode) RowCodec.JSON.readTree(entry.substring(0, end));
        byte[] t = Base64.getDecoder().decode(row.get("transmittance").asString());
        t[0] ^= 1;
        row.put("transmittance", Base64.getEncoder().encodeToString(t));
        return RowCodec.JSON.writeValueAsString(row) + entry.substring(end);
    }
}
